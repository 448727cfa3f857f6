#!/usr/bin/env bash
# Compare what the shipped models give through the command line at two
# versions of Stave: every model under BASE's testdata/ through `solve` (text, JSON,
# US units), `converge --json` and every export (CSV, SVG, PNG drawing, PNG
# calculation sheet). Text may differ only by round-off (.ci/roundoff.py:
# numbers within one part in 1e8, 1e-6 for fitted convergence rates and
# 1e-4 for SVG coordinates printed to 5 digits (a curve path may differ by
# up to two pixels), round-off residuals as zero;
# each such file is listed); PNG pictures only by rounding (each channel
# within 2 % on at most 0.1 % of the pixels).
#
#   .ci/outputs.sh BASE [HEAD]     e.g. .ci/outputs.sh b4ebc42
#
# BASE and HEAD are commits (HEAD defaults to the work tree as it is). A
# restructuring that must not change behaviour is checked this way; a change
# that means to change an output shows here as the list of files that differ.
# Needs Go, the system packages of `make deps` and ImageMagick.
set -euo pipefail
cd "$(dirname "$0")/.."
[ $# -ge 1 ] || { echo "usage: $0 BASE [HEAD]" >&2; exit 2; }
base=$1 head=${2:-}
work=$(mktemp -d)
trap 'git worktree remove --force "$work/base-src" >/dev/null 2>&1 || true; git worktree remove --force "$work/head-src" >/dev/null 2>&1 || true; rm -rf "$work"' EXIT

build() { # build REV DIR: the binary of commit REV (or of the work tree when REV is empty) at DIR/stave
	local rev=$1 dir=$2 src=.
	mkdir -p "$dir"
	if [ -n "$rev" ]; then
		src="$work/$(basename "$dir")-src"
		git worktree add --detach "$src" "$rev" >/dev/null 2>&1
	fi
	(cd "$src" && go build -o "$dir/stave" ./cmd/stave)
}

run() { # run DIR: every output of every model into DIR
	local dir=$1 m name
	for m in "$models"/*.json; do
		name=$(basename "$m" .json)
		(
			cd "$dir"
			export LANG=C.UTF-8 LANGUAGE=en
			./stave solve "$m" >"$name.solve.txt" 2>&1 || echo "exit $?" >>"$name.solve.txt"
			./stave solve --json "$m" >"$name.solve.json" 2>&1 || echo "exit $?" >>"$name.solve.json"
			./stave solve --units US "$m" >"$name.solve-us.txt" 2>&1 || echo "exit $?" >>"$name.solve-us.txt"
			./stave converge --json --max 64 "$m" >"$name.converge.json" 2>&1 || echo "exit $?" >>"$name.converge.json"
			for out in csv svg png; do
				./stave export "$m" --out "$name.$out" >/dev/null 2>&1 || echo "exit $?" >"$name.$out.failed"
			done
			./stave export "$m" --sheet --out "$name.sheet.png" >/dev/null 2>&1 || echo "exit $?" >"$name.sheet.png.failed"
		)
	done
}

build "$base" "$work/base"
build "$head" "$work/head"
# Both versions read the models as BASE ships them (a newer format still
# reads the older files), copied to one place so the paths they print agree.
mkdir -p "$work/models"
cp "$work/base-src"/testdata/*.json "$work/models/"
models="$work/models"
run "$work/base"
run "$work/head"

# tolerance NAME: the relative round-off allowed in a file's numbers. SVG
# prints coordinates to 5 digits, where round-off can flip the last one; the
# rates of a convergence study are fitted to errors near round-off.
tolerance() {
	case "$1" in
	*.svg) echo 1e-4 ;;
	*.converge.json) echo 1e-6 ;;
	*) echo 1e-8 ;;
	esac
}

differ=0
for f in "$work/base"/*; do
	name=$(basename "$f")
	[ "$name" = stave ] && continue
	g="$work/head/$name"
	if [ ! -e "$g" ]; then
		echo "missing at head: $name"; differ=1; continue
	fi
	case "$name" in
	*.png)
		# AE counts pixels differing by more than the fuzz.
		ae=$(compare -metric AE -fuzz 2% "$f" "$g" null: 2>&1 || true)
		total=$(identify -format '%[fx:w*h]' "$f")
		if ! awk -v ae="${ae%% *}" -v t="$total" 'BEGIN { exit !(ae+0 <= 0.001*t) }'; then
			echo "differs: $name ($ae of $total pixels)"; differ=1
		fi
		;;
	*)
		if cmp -s "$f" "$g"; then
			:
		elif .ci/roundoff.py "$f" "$g" "$(tolerance "$name")" >/dev/null; then
			echo "round-off only: $name"
		else
			echo "differs: $name"; { .ci/roundoff.py "$f" "$g" "$(tolerance "$name")" || true; } | head -20; differ=1
		fi
		;;
	esac
done
for g in "$work/head"/*; do
	[ -e "$work/base/$(basename "$g")" ] || { echo "new at head: $(basename "$g")"; }
done
if [ $differ -eq 0 ]; then echo "outputs: every output of every shipped model is unchanged (up to round-off in the files listed)"; fi
exit $differ
