#!/usr/bin/env bash
# Installs what Propflight needs on Debian/Ubuntu and is missing: the C headers
# Fyne's cgo build needs (X11, GL), pkg-config, Xvfb for trying the window
# without a screen, and the Khronos glTF validator (npm) that the export tests
# run, poppler-utils (pdfinfo, pdftotext) that the timing-sheet tests read
# PDFs with, assimp-utils (an independent glTF converter the export tests run)
# and desktop-file-utils and appstream (the package checks validate the menu
# entry and the metainfo with them). Idempotent: it installs nothing when all are present.
# PROPFLIGHT_NO_NPM=1 skips the validator.
set -eu
cd "$(dirname "$0")/.."

install_apt() { # packages...
	echo "propflight: installing system packages:$*"
	if ! command -v apt-get >/dev/null 2>&1; then
		echo "propflight: apt-get not found; install these with your system's package manager:$*" >&2
		exit 1
	fi
	local sudo=""
	if [ "$(id -u)" != 0 ]; then
		if command -v sudo >/dev/null 2>&1; then sudo=sudo; else
			echo "propflight: run as root or install sudo to install:$*" >&2
			exit 1
		fi
	fi
	$sudo apt-get update -qq
	DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq "$@" >/dev/null
	echo "propflight: system packages ready"
}

pkgs="gcc libgl1-mesa-dev libx11-dev libxcursor-dev libxrandr-dev libxinerama-dev libxi-dev libxxf86vm-dev pkg-config xvfb poppler-utils assimp-utils desktop-file-utils appstream"
missing=""
for p in $pkgs; do
	dpkg -s "$p" >/dev/null 2>&1 || missing="$missing $p"
done
if [ -n "$missing" ]; then
	# shellcheck disable=SC2086
	install_apt $missing
fi

if [ "${PROPFLIGHT_NO_NPM:-}" != 1 ] && [ ! -d tools/gltf-validator/node_modules/gltf-validator ]; then
	if ! command -v npm >/dev/null 2>&1; then
		install_apt nodejs npm
	fi
	echo "propflight: installing the Khronos glTF validator (npm) for the export tests"
	(cd tools/gltf-validator && npm ci --no-audit --no-fund --loglevel=error >/dev/null)
fi
