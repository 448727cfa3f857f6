//go:build unix

package batch

import (
	"context"
	"fmt"
	"runtime"
	"runtime/metrics"
	"syscall"
	"testing"
	"time"
)

// BenchmarkRun checks an invented schedule of small members from files,
// end to end (read, validate, finite elements, exact solution, checks, one
// line each, in order) on one worker per core, and reports members/s and
// the largest live heap seen during the batch: at 1,000 and 10,000 members
// the latter should be about the same, since a line waits for its
// predecessors in a window of a few lines per worker. It also reports the
// processor time per member (user and system, all threads): on a machine
// shared with other work, members/s falls with the share of the cores the
// batch gets, while the processor time per member hardly moves.
func BenchmarkRun(b *testing.B) {
	for _, n := range []int{1000, 10000} {
		b.Run(fmt.Sprintf("members=%d", n), func(b *testing.B) {
			paths := writeSchedule(b, b.TempDir(), n)
			sample := []metrics.Sample{{Name: "/memory/classes/heap/objects:bytes"}}
			var peak uint64
			cpu := cpuTime(b)
			for b.Loop() {
				runtime.GC()
				metrics.Read(sample)
				base := sample[0].Value.Uint64()
				count := 0
				sum, err := Run(context.Background(), paths, Options{}, func(Member) error {
					if count++; count%100 == 0 {
						metrics.Read(sample)
						if v := sample[0].Value.Uint64(); v > base {
							peak = max(peak, v-base)
						}
					}
					return nil
				})
				if err != nil || sum.Members != n || sum.Refused != 0 {
					b.Fatalf("batch of %d: %d members, %d refused, error %v", n, sum.Members, sum.Refused, err)
				}
			}
			b.ReportMetric(float64(n)*float64(b.N)/b.Elapsed().Seconds(), "members/s")
			b.ReportMetric(float64(peak)/(1<<20), "peak-heap-MiB")
			b.ReportMetric(float64((cpuTime(b)-cpu).Microseconds())/float64(n*b.N), "cpu-µs/member")
		})
	}
}

// cpuTime is the processor time the process has used so far, user and system.
func cpuTime(b *testing.B) time.Duration {
	var u syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &u); err != nil {
		b.Fatal(err)
	}
	return time.Duration(u.Utime.Nano() + u.Stime.Nano())
}
