package moving

import (
	"syscall"
	"testing"
	"time"

	"stave/fem"
)

// cpuTime is the processor time the process has used, user and system:
// on a machine others share, wall time measures them too.
func cpuTime(b *testing.B) time.Duration {
	var u syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &u); err != nil {
		b.Fatal(err)
	}
	return time.Duration(u.Utime.Nano() + u.Stime.Nano())
}

// twoSpans is the benchmarks' member: two continuous spans of 15 m on
// 10,000 elements (invented).
func twoSpans() *fem.Model {
	m := beam(30, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 15, Kind: fem.Roller}, fem.Support{X: 30, Kind: fem.Roller})
	m.Mesh = fem.MeshSettings{Elements: 10000}
	return m
}

// benchmarkTrain is the case the speed target names: a four-axle train
// over 2,000 positions on a beam of 10,000 elements, the envelope taken at
// every node. The beam is two continuous spans of 15 m (invented), the
// train an invented four-axle vehicle 6.6 m long.
func benchmarkTrain(b *testing.B, d Direction, positions int) {
	m := twoSpans()
	in, mesh := influenceOn(b, m)
	tr := &Train{Axles: []Axle{{Load: 60e3}, {Load: 60e3, Spacing: 1.2}, {Load: 90e3, Spacing: 4.2}, {Load: 90e3, Spacing: 1.2}}, Direction: d}
	tr.Step = (30 - tr.Length()) / float64(positions-1)
	stations := Stations(mesh)
	if len(stations) != 10001 {
		b.Fatalf("%d stations, want the 10,001 nodes", len(stations))
	}
	b.ResetTimer()
	start := cpuTime(b)
	defer func() { b.ReportMetric(float64(cpuTime(b)-start)/1e6/float64(b.N), "cpu-ms/op") }()
	for range b.N {
		e, err := in.Envelope(tr, mesh, stations)
		if err != nil {
			b.Fatal(err)
		}
		if e.Positions != positions {
			b.Fatalf("%d positions, want %d", e.Positions, positions)
		}
	}
}

func BenchmarkEnvelopeFourAxles2000Positions10000Elements(b *testing.B) {
	benchmarkTrain(b, Forward, 2000)
}

// Both ways: 4,000 positions.
func BenchmarkEnvelopeFourAxlesBothWays(b *testing.B) {
	benchmarkTrain(b, BothWays, 2000)
}

// Ten times the positions: the cost does not grow with them.
func BenchmarkEnvelopeFourAxles20000Positions(b *testing.B) {
	benchmarkTrain(b, Forward, 20000)
}

// The finite element influence line on the same beam: one solve per load
// position on one factorization, reported per position.
func BenchmarkFELinePerPosition10000Elements(b *testing.B) {
	m := twoSpans()
	p, err := fem.Prepare(m)
	if err != nil {
		b.Fatal(err)
	}
	mesh := p.Mesh()
	positions := make([]float64, 20)
	for i := range positions {
		positions[i] = 30 * float64(i) / 19
	}
	b.ResetTimer()
	for range b.N {
		if _, _, err := FELine(p, mesh, Target{Quantity: fem.QBendingMoment, X: 7.5}, positions); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Microseconds())/float64(b.N*len(positions)), "µs/position")
}

// Setting up the influence lines of the same member: the two sweeps.
func BenchmarkNewInfluence(b *testing.B) {
	m := twoSpans()
	for range b.N {
		p, err := fem.Prepare(m)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := New(p); err != nil {
			b.Fatal(err)
		}
	}
}

// One step of a drag in the window: the train solved in closed form where
// it stands and read at every station, and the influence line under the
// mouse with the train's worst positions for it; on two spans of 6 m with
// 120 elements (the runway demo's member) and a two-axle train.
func BenchmarkDragStep(b *testing.B) {
	m := beam(12, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 6, Kind: fem.Roller}, fem.Support{X: 12, Kind: fem.Roller})
	m.Mesh = fem.MeshSettings{Elements: 120}
	in, mesh := influenceOn(b, m)
	tr := &Train{Axles: []Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}, Step: 0.05}
	stations := Stations(mesh)
	b.ResetTimer()
	for i := range b.N {
		tm := tr.Model(m, Placement{Direction: Forward, Front: 5 + float64(i%100)*0.05})
		e, err := fem.SolveExact(&tm)
		if err != nil {
			b.Fatal(err)
		}
		for _, x := range stations {
			f := e.At(x, fem.Right)
			_ = f.BendingMoment
		}
		if _, _, err := in.Worst(tr, mesh, Target{Quantity: fem.QBendingMoment, X: 2.5 + float64(i%50)*0.1}); err != nil {
			b.Fatal(err)
		}
	}
}

// A long train: 100 axles of 20 kN at 0.25 m with a uniform load along
// them (an invented platoon), over the benchmarks' two spans on 2,000
// elements: the envelope sums the axles afresh only every resumEvery
// stretches of positions, and this measures that path.
func BenchmarkEnvelopeHundredAxles(b *testing.B) {
	m := twoSpans()
	m.Mesh = fem.MeshSettings{Elements: 2000}
	in, mesh := influenceOn(b, m)
	tr := &Train{Axles: []Axle{{Load: 20e3}}, Uniform: UniformLoad{Load: 5e3, Length: 24.75}, Direction: BothWays}
	for range 99 {
		tr.Axles = append(tr.Axles, Axle{Load: 20e3, Spacing: 0.25})
	}
	stations := Stations(mesh)
	b.ResetTimer()
	start := cpuTime(b)
	defer func() { b.ReportMetric(float64(cpuTime(b)-start)/1e6/float64(b.N), "cpu-ms/op") }()
	for range b.N {
		if _, err := in.Envelope(tr, mesh, stations); err != nil {
			b.Fatal(err)
		}
	}
}

// influenceOn is m's influence lines and mesh, for a benchmark.
func influenceOn(b *testing.B, m *fem.Model) (*Influence, fem.Mesh) {
	b.Helper()
	p, err := fem.Prepare(m)
	if err != nil {
		b.Fatal(err)
	}
	in, err := New(p)
	if err != nil {
		b.Fatal(err)
	}
	return in, p.Mesh()
}
