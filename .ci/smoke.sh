#!/usr/bin/env bash
# Smoke test of the real binary: build cmd/stave, open testdata/demo.json in
# a virtual X display, take a screenshot after a few seconds and fail unless
# the picture shows a drawn window (enough contrast and colours).
#
#   .ci/smoke.sh            (from the repository root; needs xvfb-run, ImageMagick)
#   STAVE_BINARY=path .ci/smoke.sh   tries an already built binary instead
set -euo pipefail
cd "$(dirname "$0")/.."
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
bin=${STAVE_BINARY:-$work/stave}
[ -n "${STAVE_BINARY:-}" ] || go build -o "$bin" ./cmd/stave

# The screenshot is taken from inside the virtual display while stave runs.
cat >"$work/shot.sh" <<'INNER'
#!/usr/bin/env bash
set -u
"$1" "$2" >"$3/stave.log" 2>&1 &
pid=$!
sleep 6
if ! kill -0 "$pid" 2>/dev/null; then
  echo "smoke: stave exited early:" >&2
  cat "$3/stave.log" >&2
  exit 1
fi
import -window root "$3/shot.png"
kill "$pid"
wait "$pid" 2>/dev/null || true
INNER
chmod +x "$work/shot.sh"
LANG=C.UTF-8 LANGUAGE=en xvfb-run -a -s "-screen 0 1280x800x24" "$work/shot.sh" "$bin" testdata/demo.json "$work"

# A blank or single-colour screen has a standard deviation near 0 and a
# handful of colours; the window with its drawing has thousands.
sd=$(convert "$work/shot.png" -colorspace Gray -format '%[fx:standard_deviation]' info:)
colours=$(convert "$work/shot.png" -format '%k' info:)
echo "smoke: screenshot standard deviation $sd, $colours distinct colours"
if awk -v sd="$sd" -v n="$colours" 'BEGIN { exit !(sd > 0.05 && n > 200) }'; then
  echo "smoke: ok"
else
  echo "smoke: the window looks blank" >&2
  cp "$work/shot.png" /tmp/stave-smoke-failed.png && echo "smoke: screenshot kept at /tmp/stave-smoke-failed.png" >&2
  exit 1
fi
