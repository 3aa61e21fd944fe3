#!/usr/bin/env bash
# Start-up to the first analysed window, timed from outside: runs the app jar RUNS times (default 5)
# with -Dhalfrail.exitAfterFirstAnalysis=true, which quits once the first analysis is on screen, and
# prints each run's wall time from the process start to the first analysed frame (the figure to compare
# with the 3 s target; the line the app prints is stamped as it arrives) and to the exit, its
# processor time (user + system, which depends less on the machine's load) and the app's own figure
# (from JavaFX calling start() to the first analysed frame). The load average is printed before and
# after; JAR=… times another build. Build first: mvn -q -DskipTests package. Without a display (no
# $DISPLAY) the app runs on JavaFX's headless Monocle platform, taken from the local Maven repository (the test
# dependency org.testfx:openjfx-monocle), with the software renderer.
set -euo pipefail
cd "$(dirname "$0")/.."
RUNS=${RUNS:-5}
JAR=${JAR:-target/halfrail.jar}
[ -f "$JAR" ] || { echo "no $JAR: run mvn -q -DskipTests package first" >&2; exit 2; }
if [ -n "${DISPLAY:-}" ]; then
    CMD=(java -Dhalfrail.exitAfterFirstAnalysis=true -jar "$JAR")
else
    MONOCLE=$(ls ~/.m2/repository/org/testfx/openjfx-monocle/17.0.10/openjfx-monocle-17.0.10.jar)
    CMD=(java -Dhalfrail.exitAfterFirstAnalysis=true -Dglass.platform=Monocle -Dmonocle.platform=Headless
         -Dprism.order=sw -cp "$JAR:$MONOCLE" halfrail.Main)
fi
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg)"
for i in $(seq 1 "$RUNS"); do
    start=$(date +%s%N)
    # the app's line is stamped as it arrives: process start to the first analysed frame, exit not included
    out=$(/usr/bin/time -f 'cpu %U s user + %S s system' "${CMD[@]}" 2>&1 | while IFS= read -r line; do
        case "$line" in
            "first analysis shown"*) echo "shown $(( ($(date +%s%N) - start) / 1000000 )) ms after the process started ($line)" ;;
            cpu\ *) echo "$line" ;;
        esac
    done | tr '\n' ';' || true)
    end=$(date +%s%N)
    echo "run $i: $(( (end - start) / 1000000 )) ms wall to exit; ${out:-no analysed window reported}"
done
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
