#!/usr/bin/env bash
# Packaging check (run by .ci/run after the tests; no display needed):
#  1. builds the jar, the app image and the .deb through the package-app Maven profile;
#  2. runs the app image's launcher on a sample design, directly and through a symlink (as the
#     .deb's /usr/bin/halfrail is one): exit code 0 and a JSON report that names the file;
#  3. checks that jdeps finds no module missing from packaging/runtime-modules;
#  4. reads the .deb: its control fields, its files (launcher, runtime, jar, desktop entry,
#     icons, MIME type) and its maintainer scripts, then unpacks it and runs the launcher there;
#  5. where shared-mime-info and GIO are on the machine, checks on a private MIME database that
#     a design file is told from another .json file by content.
# Prints how long each step took.
set -euo pipefail
cd "$(dirname "$0")/.."
unset DISPLAY WAYLAND_DISPLAY

sample=samples/usb-line-driver.json
image=target/package/halfrail
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

fail() { echo "packaging check: FAILED: $*" >&2; exit 1; }
step_start=$SECONDS
step() { echo "packaging check: $1 ($((SECONDS - step_start)) s)"; step_start=$SECONDS; }

# jpackage builds the .deb with dpkg-deb under fakeroot (Debian: dpkg-dev, fakeroot).
if ! command -v fakeroot >/dev/null || ! command -v dpkg-deb >/dev/null; then
  if [[ $(id -u) -eq 0 ]]; then
    apt-get update -qq && apt-get install -y -qq fakeroot dpkg-dev >/dev/null
  else
    fail "fakeroot and dpkg-deb are needed (Debian packages fakeroot, dpkg-dev)"
  fi
fi
command -v jpackage >/dev/null || fail "jpackage (JDK 17 or later) is not on the PATH"
step "tools present"

mvn -B -q -DskipTests -Ppackage-app package
deb="$(ls target/package/halfrail_*.deb 2>/dev/null | head -n 1)"
[[ -x "$image/bin/halfrail" ]] || fail "$image/bin/halfrail was not built"
[[ -f "$image/lib/runtime/lib/server/libjvm.so" ]] || fail "the app image has no runtime of its own"
[[ -n "$deb" ]] || fail "no target/package/halfrail_*.deb was built"
step "built jar, app image and .deb"

# The launcher's report: exit code 0, valid JSON naming the sample with a verdict.
expect_report() { # $1 launcher, $2 where the report goes
  local rc=0
  "$1" check "$sample" --format json >"$2" || rc=$?
  [[ $rc -eq 0 ]] || fail "$1 check $sample --format json exited with $rc"
  python3 - "$2" "$sample" <<'EOF' || fail "$1 did not write the expected JSON report"
import json, sys
report = json.load(open(sys.argv[1]))
entry = report["files"][0]
assert entry["file"] == sys.argv[2], entry["file"]
assert entry["verdict"] in ("pass", "warn", "fail"), entry["verdict"]
EOF
}
expect_report "$image/bin/halfrail" "$work/image-report.json"
mkdir -p "$work/bin"
ln -s "$PWD/$image/bin/halfrail" "$work/bin/halfrail"
expect_report "$work/bin/halfrail" "$work/link-report.json"
step "app image ran check on $sample (directly and through a symlink)"

found="$(jdeps -q --print-module-deps --ignore-missing-deps --multi-release 17 target/halfrail.jar)"
listed="$(grep -v '^\s*#' packaging/runtime-modules | grep -v '^\s*$')"
for module in ${found//,/ }; do
  grep -qx "$module" <<<"$listed" || fail "jdeps finds $module, which packaging/runtime-modules lacks"
done
step "runtime modules cover jdeps' list ($found)"

info="$(dpkg-deb -I "$deb")"
field() { sed -n "s/^ $1: //p" <<<"$info"; }
[[ "$(field Package)" == halfrail ]] || fail "Package is '$(field Package)'"
[[ "$(field Version)" =~ ^[0-9]+\.[0-9]+\.[0-9]+-[0-9]+$ ]] || fail "Version is '$(field Version)'"
[[ "$(field Architecture)" == "$(dpkg --print-architecture)" ]] || fail "Architecture is '$(field Architecture)'"
[[ "$(field Section)" == electronics ]] || fail "Section is '$(field Section)'"
[[ -n "$(field Maintainer)" && -n "$(field Description)" ]] || fail "Maintainer or Description is empty"
for dep in xdg-utils libgtk-3-0 libgl1 libc6; do # postinst's tools, JavaFX's and the runtime's libraries
  grep -qE "(^|, )$dep(,|$| )" <<<"$(field Depends)" || fail "Depends lacks $dep"
done

contents="$(dpkg-deb -c "$deb")"
has() { # $1 path in the package, $2 mode prefix
  grep -qE "^$2[^ ]* +root/root +[0-9]+ [0-9-]+ [0-9:]+ \./${1//./\\.}\$" <<<"$contents" \
    || fail "the .deb lacks $1"
}
has opt/halfrail/bin/halfrail -rwx
has opt/halfrail/lib/app/halfrail.jar -rw
has opt/halfrail/lib/app/halfrail.cfg -rw
has opt/halfrail/lib/runtime/lib/server/libjvm.so -rw
has opt/halfrail/lib/halfrail-halfrail.desktop -rw
has opt/halfrail/lib/halfrail-design.xml -rw
has opt/halfrail/lib/halfrail.png -rw
for size in 16 32 48 64 128 256; do
  has "opt/halfrail/lib/icons/halfrail-$size.png" -rw
done

dpkg-deb -e "$deb" "$work/control"
grep -q '^xdg-desktop-menu install /opt/halfrail/lib/halfrail-halfrail.desktop$' "$work/control/postinst" \
  || fail "postinst does not install the desktop entry"
grep -q 'update-alternatives --install /usr/bin/halfrail halfrail /opt/halfrail/bin/halfrail' "$work/control/postinst" \
  || fail "postinst does not put /usr/bin/halfrail on the PATH"
grep -q 'xdg-mime install /opt/halfrail/lib/halfrail-design.xml' "$work/control/postinst" \
  || fail "postinst does not install the design-file MIME type"
grep -q 'update-alternatives --remove halfrail /opt/halfrail/bin/halfrail' "$work/control/prerm" \
  || fail "prerm does not remove /usr/bin/halfrail"
grep -q '^xdg-desktop-menu uninstall /opt/halfrail/lib/halfrail-halfrail.desktop$' "$work/control/prerm" \
  || fail "prerm does not remove the desktop entry"
for script in postinst prerm; do
  sh -n "$work/control/$script" || fail "$script is not valid sh"
  ! grep -qE 'DESKTOP_COMMANDS|UTILITY_SCRIPTS' "$work/control/$script" || fail "$script kept a jpackage placeholder"
done

dpkg-deb -x "$deb" "$work/root"
desktop="$work/root/opt/halfrail/lib/halfrail-halfrail.desktop"
grep -qx 'Exec=/opt/halfrail/bin/halfrail %f' "$desktop" || fail "the desktop entry does not start /opt/halfrail/bin/halfrail with the file"
grep -qx 'Icon=halfrail' "$desktop" || fail "the desktop entry's icon is not 'halfrail'"
grep -qx 'MimeType=application/x-halfrail-design;' "$desktop" || fail "the desktop entry names no design-file type"
grep -q 'type="application/x-halfrail-design"' "$work/root/opt/halfrail/lib/halfrail-design.xml" \
  || fail "the MIME file does not define application/x-halfrail-design"
ln -s "$work/root/opt/halfrail/bin/halfrail" "$work/bin/halfrail-unpacked"
expect_report "$work/bin/halfrail-unpacked" "$work/deb-report.json"
step "the .deb's fields, files and scripts are right, and its unpacked launcher runs"

if command -v update-mime-database >/dev/null && command -v gio >/dev/null \
    && [[ -f /usr/share/mime/packages/freedesktop.org.xml ]]; then
  mkdir -p "$work/xdg/mime/packages"
  cp /usr/share/mime/packages/freedesktop.org.xml packaging/linux/halfrail-design.xml "$work/xdg/mime/packages/"
  update-mime-database "$work/xdg/mime" >/dev/null 2>&1
  cp "$sample" "$work/design.json"
  echo '{"name": "not a design", "values": [1, 2, 3]}' >"$work/other.json"
  type_of() {
    XDG_DATA_DIRS="$work/xdg" XDG_DATA_HOME="$work/none" gio info -a standard::content-type "$1" \
      | sed -n 's/^ *standard::content-type: //p'
  }
  [[ "$(type_of "$work/design.json")" == application/x-halfrail-design ]] \
    || fail "a design file is typed $(type_of "$work/design.json")"
  [[ "$(type_of "$work/other.json")" == application/json ]] \
    || fail "another .json file is typed $(type_of "$work/other.json")"
  step "the MIME database tells a design file from another .json by content"
else
  step "MIME typing not checked here (needs shared-mime-info and GIO)"
fi
echo "packaging check: passed in $SECONDS s"
