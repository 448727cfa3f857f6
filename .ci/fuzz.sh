#!/usr/bin/env bash
# Short runs of every fuzz target in the repository; a failing input is
# written under the package's testdata/fuzz and fails the run.
#
#   .ci/fuzz.sh [FUZZ_TIME]      e.g. .ci/fuzz.sh 10s
#
# Go's fuzzing coordinator can end a run that found nothing with "context
# deadline exceeded" when -fuzztime runs out while a worker is busy, on a
# loaded machine (golang/go#75804, fixed in Go 1.27). Such a run writes no
# failing input; it is said so and run once more. Any other failure, or a
# second one, fails.
set -uo pipefail
cd "$(dirname "$0")/.."
fuzz_time=${1:-10s}
go=${GO:-go}
for pkg in $(grep -rl --include='*_test.go' '^func Fuzz' . | xargs -n1 dirname | sort -u); do
	for target in $(grep -h '^func Fuzz' "$pkg"/*_test.go | sed 's/^func \(Fuzz[A-Za-z0-9_]*\).*/\1/'); do
		corpus="$pkg/testdata/fuzz/$target"
		before=$(ls "$corpus" 2>/dev/null)
		for attempt in 1 2; do
			echo "fuzz $pkg $target for $fuzz_time"
			out=$("$go" test -run '^$' -fuzz "^$target\$" -fuzztime "$fuzz_time" "$pkg" 2>&1)
			rc=$?
			grep -v '^fuzz: elapsed' <<<"$out"
			[ "$rc" -eq 0 ] && break
			if [ "$attempt" -eq 1 ] && [ "$(ls "$corpus" 2>/dev/null)" = "$before" ] && grep -q 'context deadline exceeded' <<<"$out"; then
				echo "fuzz $pkg $target: ended by the coordinator's deadline with no failing input written (golang/go#75804); once more"
				continue
			fi
			exit 1
		done
	done
done
