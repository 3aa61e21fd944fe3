#!/bin/sh
# Times the command line checking 200 design files in one run, whole process from outside
# (JVM start included), with /usr/bin/time. The files are copies of the bundled samples/*.json
# in a temporary folder. Needs target/halfrail.jar: mvn -q -DskipTests package
# Usage: bench/cli-200.sh [COUNT]        (COUNT defaults to 200)
set -eu
cd "$(dirname "$0")/.."
count=${1:-200}
jar=target/halfrail.jar
[ -f "$jar" ] || { echo "no $jar: run mvn -q -DskipTests package first" >&2; exit 2; }
dir=$(mktemp -d "${TMPDIR:-/tmp}/halfrail-cli-200.XXXXXX")
trap 'rm -rf "$dir"' EXIT
i=0
while [ "$i" -lt "$count" ]; do
  for f in samples/*.json; do
    [ "$i" -lt "$count" ] || break
    cp "$f" "$dir/$(printf '%03d' "$i")-$(basename "$f")"
    i=$((i + 1))
  done
done
echo "checking $(ls "$dir" | wc -l) design files; load before: $(uptime)"
# The exit code is 1 when a design has a failing finding (the review samples do); only the time matters here.
/usr/bin/time -o "$dir.time" -f "wall %e s, user %U s, system %S s, max resident %M KB, exit %x" \
  java -jar "$jar" check "$dir" > "$dir.out" 2>&1 || true
cat "$dir.time"
echo "report lines: $(wc -l < "$dir.out"); load after: $(uptime)"
rm -f "$dir.out" "$dir.time"
