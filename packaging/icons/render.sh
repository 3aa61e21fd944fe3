#!/usr/bin/env bash
# Renders halfrail.svg into the PNG sizes the packages use. Needs rsvg-convert (Debian: librsvg2-bin).
# The PNGs are committed; run this only after changing the SVG.
set -euo pipefail
cd "$(dirname "$0")"
for size in 16 32 48 64 128 256; do
  rsvg-convert --width "$size" --height "$size" --output "halfrail-$size.png" halfrail.svg
done
