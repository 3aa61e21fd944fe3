#!/usr/bin/env bash
# Builds the installable Halfrail packages from target/halfrail.jar with the JDK's jpackage:
#   target/package/halfrail/          self-contained app image (bin/halfrail, lib/runtime, lib/app)
#   target/package/halfrail_*.deb      Debian package: the app image under /opt/halfrail, a desktop
#                                      entry, the icon, the design-file MIME type, /usr/bin/halfrail
# Usage: packaging/build.sh [VERSION] [app-image|deb|all]   (default: the pom's version, all)
# Called by `mvn -Ppackage-app package`; needs jpackage (JDK 17+), and for the .deb dpkg-deb
# and fakeroot (Debian: dpkg-dev, fakeroot). No display is needed.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(dirname "$here")"
cd "$root"

version="${1:-$(sed -n 's:^  <version>\(.*\)</version>$:\1:p' pom.xml | head -n 1)}"
what="${2:-all}"
# jpackage wants one to three dot-separated numbers: 0.1.0-SNAPSHOT is packaged as 0.1.0.
app_version="${version%%-*}"
jar=target/halfrail.jar
out=target/package
stage=target/package-input
name=halfrail

[[ -f "$jar" ]] || { echo "build.sh: $jar is missing; run mvn -DskipTests package first" >&2; exit 2; }
modules="$(grep -v '^\s*#' "$here/runtime-modules" | grep -v '^\s*$' | paste -sd, -)"

build_app_image() {
  rm -rf "$stage" "$out/$name"
  mkdir -p "$stage" "$out"
  cp "$jar" "$stage/"
  jpackage --type app-image \
    --name "$name" \
    --app-version "$app_version" \
    --description "Checks op-amp stages that run from one supply rail" \
    --vendor "Halfrail developers" \
    --copyright "Halfrail developers, Apache License 2.0" \
    --input "$stage" \
    --main-jar halfrail.jar \
    --main-class halfrail.Main \
    --add-modules "$modules" \
    --icon "$here/icons/halfrail-256.png" \
    --dest "$out"
  # Desktop integration files the .deb's postinst installs; in the app image so that a copy
  # placed by hand carries them too.
  mkdir -p "$out/$name/lib/icons"
  cp "$here"/icons/halfrail-*.png "$out/$name/lib/icons/"
  cp "$here/linux/halfrail-design.xml" "$out/$name/lib/"
}

# JavaFX's native libraries sit inside the jar and are unpacked at run time, so jpackage's
# look-up of the runtime's libraries does not see them: GTK 3 for its windows (libglassgtk3),
# OpenGL and the XFree86-VidMode extension for hardware rendering (libprism_es2; without them
# JavaFX draws in software). Found with ldd on the .so files in target/halfrail.jar.
fx_deps="libgtk-3-0, libgl1, libxxf86vm1"

build_deb() {
  [[ -d "$out/$name" ]] || build_app_image
  rm -f "$out/${name}_"*.deb
  # The .deb is made from the app image above, so the runtime is linked once.
  # packaging/linux holds the desktop entry and the maintainer scripts that replace
  # jpackage's defaults (same names as jpackage's resources). The design-file MIME type is
  # not made with --file-associations: jpackage would claim every *.json for it by name
  # alone; packaging/linux/halfrail-design.xml tells a design by its content.
  jpackage --type deb \
    --app-image "$out/$name" \
    --name "$name" \
    --app-version "$app_version" \
    --description "Checks op-amp stages that run from one supply rail" \
    --vendor "Halfrail developers" \
    --copyright "Halfrail developers, Apache License 2.0" \
    --license-file LICENSE \
    --resource-dir "$here/linux" \
    --icon "$here/icons/halfrail-256.png" \
    --linux-package-name "$name" \
    --linux-deb-maintainer "halfrail-packaging@example.org" \
    --linux-package-deps "$fx_deps" \
    --linux-app-category electronics \
    --linux-menu-group "Development;Electronics;Engineering;" \
    --linux-shortcut \
    --dest "$out" \
    ${JPACKAGE_VERBOSE:+--verbose}
}

case "$what" in
  app-image) build_app_image ;;
  deb) build_deb ;;
  all) build_app_image; build_deb ;;
  *) echo "build.sh: unknown target '$what' (app-image, deb or all)" >&2; exit 2 ;;
esac
