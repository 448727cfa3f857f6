package bench

import (
	"math"
	"runtime"
	"slices"
	"time"
)

// maxBatch bounds the repetitions within one timed batch.
const maxBatch = 1 << 20

// batchSize is how many calls of an operation that took one to fill minBatch.
func batchSize(one, minBatch time.Duration) int {
	if one >= minBatch {
		return 1
	}
	return min(int(minBatch/max(one, time.Nanosecond))+1, maxBatch)
}

// timeOp returns the median over reps batches of the time of one call of op,
// in seconds. A first, untimed call warms caches and sizes the batch.
func timeOp(reps int, minBatch time.Duration, op func()) float64 {
	start := time.Now()
	op()
	batch := batchSize(time.Since(start), minBatch)
	times := make([]float64, max(reps, 1))
	for r := range times {
		start := time.Now()
		for range batch {
			op()
		}
		times[r] = time.Since(start).Seconds() / float64(batch)
	}
	return median(times)
}

// timeRounds times several operations in turns: each repetition runs a
// batch of each, one after the other, so all of a round meet the machine in
// the same state. It returns, per operation, the time of one call in every
// round, in seconds; compare operations round by round (pairedRatio).
func timeRounds(reps int, minBatch time.Duration, ops ...func()) [][]float64 {
	batches := make([]int, len(ops))
	for i, op := range ops {
		start := time.Now()
		op()
		batches[i] = batchSize(time.Since(start), minBatch)
	}
	times := make([][]float64, len(ops))
	for range max(reps, 1) {
		for i, op := range ops {
			start := time.Now()
			for range batches[i] {
				op()
			}
			times[i] = append(times[i], time.Since(start).Seconds()/float64(batches[i]))
		}
	}
	return times
}

// pairedRatio is the median over rounds of a[r]/b[r].
func pairedRatio(a, b []float64) float64 {
	r := make([]float64, 0, len(a))
	for i := range a {
		if b[i] > 0 {
			r = append(r, a[i]/b[i])
		}
	}
	if len(r) == 0 {
		return 0
	}
	return median(r)
}

// timeStages is timeOp for an operation made of consecutive stages: op
// returns the duration of each. It reports the median of each stage and the
// median of the sum of the first counted (the stages of the operation; any
// after them are timed alongside and count in no total). The collector runs
// before each batch so garbage from one repetition is not charged to the
// next.
func timeStages(reps, counted int, minBatch time.Duration, op func() []time.Duration) (stages []float64, total float64) {
	start := time.Now()
	n := len(op())
	batch := batchSize(time.Since(start), minBatch)
	perStage := make([][]float64, n)
	totals := make([]float64, max(reps, 1))
	for r := range totals {
		runtime.GC()
		sum := make([]time.Duration, n)
		for range batch {
			for i, d := range op() {
				sum[i] += d
			}
		}
		for i, d := range sum {
			s := d.Seconds() / float64(batch)
			perStage[i] = append(perStage[i], s)
			if i < counted {
				totals[r] += s
			}
		}
	}
	stages = make([]float64, n)
	for i := range stages {
		stages[i] = median(perStage[i])
	}
	return stages, median(totals)
}

func median(v []float64) float64 {
	s := slices.Clone(v)
	slices.Sort(s)
	n := len(s)
	if n%2 == 1 {
		return s[n/2]
	}
	return 0.5 * (s[n/2-1] + s[n/2])
}

// memoryUse runs op once and returns the bytes it allocated and the peak
// growth of the heap in use, sampled every memorySample while it runs and
// once at its end (with op's result still held). Sampling stops the world
// briefly, so this pass is never timed.
func memoryUse(op func() any) (allocated, peak uint64) {
	const memorySample = 500 * time.Microsecond
	runtime.GC()
	var before runtime.MemStats
	runtime.ReadMemStats(&before)
	stop, done := make(chan struct{}), make(chan uint64)
	go func() {
		high := before.HeapInuse
		tick := time.NewTicker(memorySample)
		defer tick.Stop()
		var s runtime.MemStats
		for {
			select {
			case <-stop:
				done <- high
				return
			case <-tick.C:
				runtime.ReadMemStats(&s)
				high = max(high, s.HeapInuse)
			}
		}
	}()
	result := op()
	var after runtime.MemStats
	runtime.ReadMemStats(&after)
	close(stop)
	high := max(<-done, after.HeapInuse)
	runtime.KeepAlive(result)
	return after.TotalAlloc - before.TotalAlloc, high - min(high, before.HeapInuse)
}

// slope is the least-squares slope of log y against log x: the exponent p of
// y ∝ xᵖ. It needs two distinct x and positive values.
func slope(x, y []float64) (float64, bool) {
	if len(x) < 2 || len(x) != len(y) {
		return 0, false
	}
	var mx, my float64
	for i := range x {
		if x[i] <= 0 || y[i] <= 0 {
			return 0, false
		}
		mx += math.Log(x[i])
		my += math.Log(y[i])
	}
	mx /= float64(len(x))
	my /= float64(len(x))
	var sxy, sxx float64
	for i := range x {
		dx := math.Log(x[i]) - mx
		sxy += dx * (math.Log(y[i]) - my)
		sxx += dx * dx
	}
	if sxx == 0 {
		return 0, false
	}
	return sxy / sxx, true
}
