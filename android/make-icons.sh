#!/usr/bin/env bash
# Rasterise android/icon.svg to the launcher mipmap densities (Debian's librsvg2-bin).
set -euo pipefail
cd "$(dirname "$0")"
if ! command -v rsvg-convert >/dev/null 2>&1; then
    echo "rsvg-convert is missing: apt-get install librsvg2-bin" >&2
    exit 1
fi
for pair in mdpi:48 hdpi:72 xhdpi:96 xxhdpi:144 xxxhdpi:192; do
    density="${pair%%:*}"
    size="${pair##*:}"
    mkdir -p "res/mipmap-$density"
    rsvg-convert -w "$size" -h "$size" icon.svg -o "res/mipmap-$density/ic_launcher.png"
    echo "res/mipmap-$density/ic_launcher.png (${size}×${size})"
done
