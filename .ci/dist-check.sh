#!/usr/bin/env bash
# Check the packages .ci/dist.sh left in dist/ against FyneApp.toml:
#
#   Linux bundle  it holds exactly the Makefile, the binary, the icon and the desktop entry;
#                 the binary prints the version; the icon is Icon.png and the program's window
#                 shows it (under Xvfb); the desktop entry passes
#                 desktop-file-validate and names the program, its icon and its window class;
#                 the bundle's Makefile installs (user-install, install) and uninstalls cleanly
#   stave.exe     (when built) a Windows x86-64 console program whose resources hold the icon,
#                 the manifest and the version; under wine, when installed, it prints the
#                 version and solves the demo model exactly as the Linux binary does
#   SHA256SUMS    matches every file
#
#   .ci/dist-check.sh        (from the repository root, after .ci/dist.sh)
set -euo pipefail
cd "$(dirname "$0")/.."
. .ci/fyneapp.sh
export LANG=C.UTF-8 LANGUAGE=en

name=$(fyneapp Name)
id=$(fyneapp ID)
version=$(fyneapp Version)
icon=$(fyneapp Icon)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
failures=0 checks=0

check() { # check DESCRIPTION COMMAND...: run COMMAND, count it, report a failure
	checks=$((checks + 1))
	if "${@:2}"; then
		echo "ok    $1"
	else
		echo "FAIL  $1" >&2
		failures=$((failures + 1))
	fi
}
same() { [ "$1" = "$2" ] || { echo "      got \"$1\", want \"$2\"" >&2; return 1; }; }
run_to() { local out=$1; shift; "$@" >"$out" 2>&1; } # run_to FILE COMMAND...: COMMAND's output into FILE
desktop_key() { # desktop_key FILE KEY: the value of KEY in the [Desktop Entry] group
	awk -v key="$2" '/^\[/ { entry = ($0 == "[Desktop Entry]"); next }
		entry && index($0, key "=") == 1 { print substr($0, length(key) + 2); exit }' "$1"
}

tarball=dist/stave-$version-linux-$(go env GOARCH).tar.xz
check "the Linux bundle $tarball exists" test -f "$tarball"
[ -f "$tarball" ] || { echo "dist-check: run .ci/dist.sh first" >&2; exit 1; }

# The fyne tool puts everything under usr/local, or under usr where the building
# machine has no /usr/local.
listing=$(tar -tJf "$tarball" | grep -v '/$' | sort)
prefix=$(sed -n 's|^stave/\(usr\(/local\)\{0,1\}\)/bin/stave$|\1|p' <<<"$listing")
check "the bundle holds the binary at stave/usr[/local]/bin/stave" test -n "$prefix"
prefix=${prefix:-usr/local}
want=$(printf '%s\n' stave/Makefile "stave/$prefix/bin/stave" \
	"stave/$prefix/share/applications/$id.desktop" "stave/$prefix/share/pixmaps/$id.png" | sort)
check "the bundle holds the Makefile, binary, icon and desktop entry and nothing else" \
	same "$(tr '\n' ' ' <<<"$listing")" "$(tr '\n' ' ' <<<"$want")"

tar -xJf "$tarball" -C "$work"
bundle=$work/stave
bin=$bundle/$prefix/bin/stave
desktop=$bundle/$prefix/share/applications/$id.desktop
check "the binary is executable" test -x "$bin"
check "the binary prints the version of FyneApp.toml" same "$("$bin" version 2>&1)" "stave $version"
check "the binary solves the demo model" run_to "$work/linux-solve.txt" "$bin" solve testdata/demo.json
check "the icon is FyneApp.toml's $icon" cmp -s "$icon" "$bundle/$prefix/share/pixmaps/$id.png"

# The packaged program gives its window the icon. It runs from a folder without FyneApp.toml:
# from the repository, Fyne would read the icon from there by itself.
cat >"$work/window.sh" <<'INNER'
"$1" "$2" >/dev/null 2>&1 &
pid=$!
for _ in $(seq 40); do sleep 0.5; [ "$(xdotool search --pid "$pid" 2>/dev/null | wc -l)" -ge 2 ] && break; done
sleep 1
for window in $(xdotool search --pid "$pid" 2>/dev/null); do
	xprop -id "$window" -notype -len 16 -f _NET_WM_ICON 32c _NET_WM_ICON
done
kill "$pid"
INNER
icon_size=$(cd "$work" && xvfb-run -a -s "-screen 0 1280x800x24" bash "$work/window.sh" "$bin" "$OLDPWD/testdata/demo.json" |
	sed -n 's/^_NET_WM_ICON = \([0-9]*\), \([0-9]*\).*/\1x\2/p' | head -1)
check "the packaged program's window carries the icon" test -n "$icon_size"
check "the desktop entry passes desktop-file-validate" desktop-file-validate "$desktop"
check "the desktop entry's Type is Application" same "$(desktop_key "$desktop" Type)" Application
check "the desktop entry's Name is $name" same "$(desktop_key "$desktop" Name)" "$name"
check "the desktop entry's Exec runs stave" same "$(desktop_key "$desktop" Exec)" "stave %f"
check "the desktop entry's Icon is the bundled icon" same "$(desktop_key "$desktop" Icon)" "$id"
# GLFW takes a window's X11 class from the title the window has when it is made; a desktop ties
# the window to this entry when that class is StartupWMClass.
check "the desktop entry's StartupWMClass is $name" same "$(desktop_key "$desktop" StartupWMClass)" "$name"
# Version in a desktop entry is the version of the desktop entry specification, never the program's.
entry_version=$(desktop_key "$desktop" Version)
check "the desktop entry's Version, if any, is a specification version" \
	test -z "$entry_version" -o "$entry_version" = 1.0 -o "$entry_version" = 1.1 -o "$entry_version" = 1.5

# The documented install commands, into a scratch home and a scratch root.
home=$work/home
mkdir -p "$home" "$work/root/usr/local"
HOME=$home make -s -C "$bundle" user-install >/dev/null
check "user-install puts the binary in ~/.local/bin" same "$("$home/.local/bin/stave" version 2>&1)" "stave $version"
check "user-install puts the icon in ~/.local/share/icons" test -f "$home/.local/share/icons/$id.png"
check "user-install's desktop entry runs ~/.local/bin/stave" \
	same "$(desktop_key "$home/.local/share/applications/$id.desktop" Exec)" "$home/.local/bin/stave %f"
HOME=$home make -s -C "$bundle" user-uninstall >/dev/null
check "user-uninstall removes what user-install put there" \
	same "$(find "$home" -type f | wc -l)" 0
make -s -C "$bundle" install DESTDIR="$work/root" >/dev/null
check "install puts binary, desktop entry and icon under /usr/local" same \
	"$(cd "$work/root" && find . -type f | sort | tr '\n' ' ')" \
	"./usr/local/bin/stave ./usr/local/share/applications/$id.desktop ./usr/local/share/pixmaps/$id.png "
make -s -C "$bundle" uninstall DESTDIR="$work/root" >/dev/null
check "uninstall removes what install put there" same "$(find "$work/root" -type f | wc -l)" 0

if [ -f dist/stave.exe ]; then
	exe=dist/stave.exe
	headers=$(x86_64-w64-mingw32-objdump -p "$exe")
	check "stave.exe is a Windows x86-64 program" grep -q 'file format pei-x86-64' <<<"$headers"
	# A console program: cmd.exe and PowerShell wait for it and show its output and exit status.
	check "stave.exe is a console program" grep -q 'Subsystem.*(Windows CUI)' <<<"$headers"
	resources=$(sed -n '/The .rsrc Resource Directory section/,$p' <<<"$headers")
	check "stave.exe has icon images" grep -q '^[0-9a-f]\{3\}   Entry: ID: 0x000003,' <<<"$resources"
	check "stave.exe has the icon group GLFW_ICON" grep -q 'Entry: name: .*: GLFW_ICON,' <<<"$resources"
	check "stave.exe has version information" grep -q '^[0-9a-f]\{3\}   Entry: ID: 0x000010,' <<<"$resources"
	check "stave.exe has a manifest" grep -q '^[0-9a-f]\{3\}   Entry: ID: 0x000018,' <<<"$resources"
	info=$(strings -el "$exe")
	info_value() { grep -A1 -x "$1" <<<"$info" | sed -n 2p; }
	check "stave.exe's ProductName is $name" same "$(info_value ProductName)" "$name"
	check "stave.exe's ProductVersion is $version" same "$(info_value ProductVersion)" "$version"
	check "stave.exe's FileVersion is $(windows_version)" same "$(info_value FileVersion)" "$(windows_version)"
	check "stave.exe's OriginalFilename is stave.exe" same "$(info_value OriginalFilename)" stave.exe
	if [ -x /usr/lib/wine/wine64 ]; then
		# Go's Windows runtime takes random numbers from bcryptprimitives.dll, which Debian 12's
		# wine 8.0 lacks; Windows 10 and later have it. A stand-in built from .ci/wine goes
		# into the scratch wine's system folder, the only place Go loads it from.
		export WINEPREFIX=$work/wine WINEDEBUG=-all WINEDLLOVERRIDES="mscoree,mshtml=;bcryptprimitives=n"
		/usr/lib/wine/wine64 wineboot --init >/dev/null 2>&1 || true
		x86_64-w64-mingw32-gcc -O2 -shared -o "$WINEPREFIX/drive_c/windows/system32/bcryptprimitives.dll" \
			.ci/wine/bcryptprimitives.c -ladvapi32
		check "stave.exe prints the version under wine" \
			same "$(/usr/lib/wine/wine64 "$exe" version 2>&1 | tr -d '\r')" "stave $version"
		check "stave.exe solves the demo model under wine" \
			run_to "$work/windows-solve.txt" /usr/lib/wine/wine64 "$exe" solve testdata/demo.json
		check "stave.exe's solution is the Linux binary's, byte for byte but line ends" \
			cmp <(tr -d '\r' <"$work/windows-solve.txt") "$work/linux-solve.txt"
		/usr/lib/wine/wineserver64 -k 2>/dev/null || true
	else
		echo "skip  stave.exe under wine: wine64 is not installed"
	fi
else
	echo "skip  stave.exe: not built (.ci/dist.sh windows builds it)"
fi

check "SHA256SUMS matches every file in dist" bash -c 'cd dist && sha256sum --quiet -c SHA256SUMS &&
	[ "$(ls | grep -cvx SHA256SUMS)" = "$(wc -l <SHA256SUMS)" ]'

echo "dist-check: $((checks - failures)) passed, $failures failed"
[ "$failures" -eq 0 ]
