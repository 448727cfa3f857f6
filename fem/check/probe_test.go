package check

import (
	"math"
	"path/filepath"
	"testing"

	"stave/fem"
)

// The probes' peaks, taken in closed form (each solution's fields are
// polynomials on every element and stretch), are those of a dense sampling
// of each solution and never below them: a sampling can only miss a peak
// between its points (the extreme value theorem). Checked per segment for
// the stress, per span for the deflection from the chord and per column for
// the compression, for the finite element and the exact solution, on every
// testdata model and two meshes.
func TestProbePeaksAgainstDenseSampling(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "..", "testdata", "*.json"))
	if err != nil || len(files) < 8 {
		t.Fatalf("testdata models: %v, %v", files, err)
	}
	for _, file := range files {
		for _, mesh := range []fem.MeshSettings{{Elements: 9}, {Elements: 25, BarOrder: fem.QuadraticBar}} {
			m := loadModel(t, filepath.Base(file))
			m.Mesh = mesh
			s, e := solveBoth(t, m)
			p := NewProbe(m, s, e)
			fem.Walk(s, e, p)
			p.foldExact()
			for source, got := range []*peaks{&p.fe, &p.ex} {
				dense := sampledProbe(m, s, e, source)
				check := func(what string, got, want, scale float64) {
					t.Helper()
					floor := 1e-9 * scale
					// Samples h/400 apart depart from a smooth peak by a
					// little of its size.
					if got < want-floor || got > want+1e-4*scale+floor {
						t.Errorf("%s, %+v, %s of %s: closed form %.12g, dense sampling %.12g",
							filepath.Base(file), mesh, what, []string{"FE", "exact"}[source], got, want)
					}
				}
				for i := range got.stress {
					check("stress", math.Abs(got.stress[i].value), dense.stress[i], dense.scale[0])
				}
				for k := range got.deflection {
					check("deflection", got.deflection[k].value, dense.deflection[k], dense.scale[1])
				}
				for k := range got.compression {
					check("compression", got.compression[k].value, dense.compression[k], dense.scale[2])
				}
			}
		}
	}
}

// sampledPeaks are the probes' peaks from a dense sampling, with the sizes
// of stress, deflection and axial force they are judged against.
type sampledPeaks struct {
	stress, deflection, compression []float64
	scale                           [3]float64
}

// sampledProbe samples the finite element solution s (source 0) or the
// exact solution e (source 1), with the sizes of both.
func sampledProbe(m *fem.Model, s *fem.Solution, e *fem.Exact, source int) sampledPeaks {
	parts, cols := stretches(m, true), columns(m)
	tilts := settlementTilts(s, m, parts)
	out := sampledPeaks{stress: make([]float64, len(m.Segments)), deflection: make([]float64, len(parts)), compression: make([]float64, len(cols))}
	for i, el := range s.Mesh.Elements {
		for j := 0; j <= 400; j++ {
			x, side := el.Start+(el.End-el.Start)*float64(j)/400, fem.Right
			if j == 400 {
				x, side = el.End, fem.Left
			}
			for k, f := range []fem.Fields{s.InElement(i, x), e.At(x, side)} {
				out.scale[0] = math.Max(out.scale[0], math.Abs(f.CombinedStress))
				out.scale[1] = math.Max(out.scale[1], math.Abs(f.Deflection))
				out.scale[2] = math.Max(out.scale[2], math.Abs(f.AxialForce))
				if k != source {
					continue
				}
				out.stress[el.Segment] = math.Max(out.stress[el.Segment], math.Abs(f.CombinedStress))
				for p, st := range parts {
					if x >= st.a && x <= st.b && el.End > st.a && el.Start < st.b {
						c := newChord([]fem.Field{s, e}[k], st, tilts[p])
						out.deflection[p] = math.Max(out.deflection[p], math.Abs(f.Deflection-c.at(x)))
					}
				}
				for p, c := range cols {
					if x >= c.a && x <= c.b && el.End > c.a && el.Start < c.b {
						out.compression[p] = math.Max(out.compression[p], -f.AxialForce)
					}
				}
			}
		}
	}
	return out
}
