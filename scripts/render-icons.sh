#!/usr/bin/env bash
# Renders the icon's PNGs at the freedesktop hicolor sizes from its SVG
# source (assets/icon/propflight.svg) with rsvg-convert (Debian librsvg2-bin).
# The PNGs are committed; run this after editing the SVG. The same
# rsvg-convert gives the same bytes, so a re-run changes nothing.
set -eu
cd "$(dirname "$0")/.."
command -v rsvg-convert >/dev/null || { echo "render-icons: install librsvg2-bin (rsvg-convert)" >&2; exit 1; }
for s in 16 22 24 32 48 64 128 256 512; do
	rsvg-convert -w "$s" -h "$s" assets/icon/propflight.svg -o "assets/icon/png/$s.png.tmp"
	mv "assets/icon/png/$s.png.tmp" "assets/icon/png/$s.png"
done
echo "render-icons: assets/icon/png/{16..512}.png"
