#!/usr/bin/env bash
# Build Stave's installable packages into dist/ from the checked-out source.
#
#   .ci/dist.sh [linux] [windows]     (both when none is named; dist/ is emptied first)
#
#   dist/stave-VERSION-linux-ARCH.tar.xz  the fyne tool's Linux bundle: stave/Makefile and
#       stave/usr/local/{bin/stave, share/applications/ID.desktop, share/pixmaps/ID.png};
#       `make -C stave user-install` installs it under ~/.local, `sudo make -C stave install`
#       under /usr/local
#   dist/stave.exe  Windows x86-64, cross-built with cgo and mingw-w64, with the icon, the
#       version information and an application manifest as Windows resources
#   dist/SHA256SUMS  the checksums of both (`sha256sum -c SHA256SUMS` in dist/ checks them)
#
# Name, application id, version, build number and icon come from FyneApp.toml. Needs Go and
# the packages of `make deps`; windows also needs gcc-mingw-w64-x86-64 (`make dist` installs
# what is missing). .ci/dist-check.sh checks the result.
set -euo pipefail
cd "$(dirname "$0")/.."
. .ci/fyneapp.sh

# Both tools are built from the Go module proxy by `go run` and cached by Go.
fyne_tool=fyne.io/tools/cmd/fyne@v1.7.4
winres_tool=github.com/tc-hib/go-winres@v0.3.3

name=$(fyneapp Name)
id=$(fyneapp ID)
version=$(fyneapp Version)
build=$(fyneapp Build)
icon=$(fyneapp Icon)
targets=("$@")
[ ${#targets[@]} -gt 0 ] || targets=(linux windows)

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
rm -rf dist
mkdir -p dist

# Fyne shows the icon of the application metadata on every window (a binary built
# without it has none once installed) and reports its id and version. As `fyne build`
# does, a generated file gives the packaged builds that metadata; go build's -overlay
# adds it and the icon to cmd/stave for the build alone, so the checkout stays as it is.
mkdir -p "$work/metadata"
cat >"$work/metadata/dist_metadata.go" <<GO
package main

import (
	_ "embed"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/app"
)

//go:embed dist_icon.png
var distIcon []byte

func init() {
	app.SetMetadata(fyne.AppMetadata{ID: "$id", Name: "$name", Version: "$version", Build: $build,
		Icon: fyne.NewStaticResource("$(basename "$icon")", distIcon)})
}
GO
printf '{"Replace": {"%s": "%s", "%s": "%s"}}\n' \
	"$PWD/cmd/stave/dist_metadata.go" "$work/metadata/dist_metadata.go" \
	"$PWD/cmd/stave/dist_icon.png" "$PWD/$icon" >"$work/overlay.json"

linux() {
	local stage=$work/linux arch
	arch=$(go env GOARCH)
	mkdir -p "$stage"
	go build -overlay "$work/overlay.json" -ldflags "-s -w" -o "$stage/stave" ./cmd/stave
	# fyne package reads FyneApp.toml and the icon from --src and then writes an incremented
	# build number back into FyneApp.toml; a copy keeps the checkout as it is. Its check for
	# Go code there wants a .go file, though with --executable it builds nothing.
	cp --parents FyneApp.toml "$icon" "$stage/"
	printf 'package main\n' >"$stage/placeholder.go"
	(cd "$stage" && go run "$fyne_tool" package -os linux --executable "$stage/stave" --src "$stage")
	mv "$stage/$name.tar.xz" "dist/stave-$version-linux-$arch.tar.xz"
}

windows() {
	local stage=$work/windows file_version
	file_version=$(windows_version)
	mkdir -p "$stage"
	# go-winres reads the icon relative to its JSON file. GLFW gives its windows the icon
	# named GLFW_ICON (title bar, taskbar); Explorer shows the program's first icon, the same.
	cp --parents "$icon" "$stage/"
	cat >"$stage/winres.json" <<-JSON
	{
	  "RT_GROUP_ICON": { "GLFW_ICON": { "0000": "$icon" } },
	  "RT_MANIFEST": { "#1": { "0409": {
	    "minimum-os": "win10", "dpi-awareness": "per monitor v2", "use-common-controls-v6": true
	  } } },
	  "RT_VERSION": { "#1": { "0000": {
	    "fixed": { "file_version": "$file_version", "product_version": "$file_version" },
	    "info": { "0409": {
	      "ProductName": "$name", "FileDescription": "$name", "ProductVersion": "$version",
	      "FileVersion": "$file_version", "InternalName": "stave", "OriginalFilename": "stave.exe"
	    } }
	  } } }
	}
	JSON
	CGO_ENABLED=1 GOOS=windows GOARCH=amd64 CC=x86_64-w64-mingw32-gcc \
		go build -overlay "$work/overlay.json" -ldflags "-s -w" -o "$stage/stave.exe" ./cmd/stave
	# Writing the resources into the built program (rather than a .syso beside main.go)
	# leaves cmd/stave untouched.
	(cd "$stage" && go run "$winres_tool" patch --in winres.json --no-backup stave.exe)
	chmod 755 "$stage/stave.exe"
	mv "$stage/stave.exe" dist/stave.exe
}

for target in "${targets[@]}"; do
	case "$target" in
	linux | windows) echo "dist: building for $target"; "$target" ;;
	*) echo "dist: unknown target $target: name linux, windows or both" >&2; exit 2 ;;
	esac
done
(cd dist && sha256sum -- * >"$work/SHA256SUMS" && mv "$work/SHA256SUMS" SHA256SUMS)
echo "dist: built"
ls -l dist
