package main

import (
	"encoding/json"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// influenceJSON is the part of the influence command's JSON the tests read.
type influenceJSON struct {
	Line struct {
		Samples []struct {
			S     float64  `json:"s"`
			Exact float64  `json:"exact"`
			FE    *float64 `json:"finite_elements"`
			FEAt  *float64 `json:"finite_elements_load_at"`
		} `json:"samples"`
		Largest struct{ S, Value float64 } `json:"largest"`
	} `json:"influence_line"`
	Trains []struct {
		Train string `json:"train"`
		Error string `json:"error"`
		Worst []struct {
			Quantity string `json:"quantity"`
			Largest  struct {
				Value float64  `json:"value"`
				FE    *float64 `json:"finite_elements"`
			} `json:"largest"`
			Smallest struct {
				Value float64  `json:"value"`
				FE    *float64 `json:"finite_elements"`
			} `json:"smallest"`
		} `json:"worst"`
		Envelope *struct {
			Stations   []float64 `json:"stations"`
			Quantities []struct {
				Max []float64 `json:"max"`
			} `json:"quantities"`
		} `json:"envelope"`
	} `json:"trains"`
}

func influenceRun(t *testing.T, args ...string) influenceJSON {
	t.Helper()
	code, out, stderr := runStave(t, append([]string{"influence", "--json"}, args...)...)
	if code != 0 {
		t.Fatalf("exit %d, stderr %s", code, stderr)
	}
	var got influenceJSON
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatalf("output is not JSON: %v\n%s", err, out)
	}
	return got
}

// The midspan moment of a simply supported beam of span L: a triangle with
// its peak L/4 at midspan, per newton of a load acting down (statics; e.g.
// Hibbeler, Structural Analysis, ch. 6, from memory), from the closed form
// and from one finite element solve per load position.
func TestInfluenceCommandMidspanMoment(t *testing.T) {
	const L = 4.0
	got := influenceRun(t, "../../testdata/simply_supported_uniform.json", "--quantity", "M", "--at", "2", "--points", "8")
	if len(got.Line.Samples) != 9 {
		t.Fatalf("%d samples, want 9", len(got.Line.Samples))
	}
	for _, s := range got.Line.Samples {
		want := math.Min(s.S, L-s.S) / 2
		near(t, "exact line", s.Exact, want, 1e-12)
		if s.FE == nil {
			t.Fatalf("no finite element value at s = %g", s.S)
		}
		if math.Abs(*s.FE-want) > 1e-12*L {
			t.Errorf("finite element line at s = %g: %.15g, want %g", s.S, *s.FE, want)
		}
	}
	near(t, "peak", got.Line.Largest.Value, L/4, 1e-12)
	near(t, "peak position", got.Line.Largest.S, L/2, 1e-9)
}

// The runway demo's trains: the envelope at every station in the JSON, and
// each extreme solved again by finite elements at its governing position.
func TestInfluenceCommandTrains(t *testing.T) {
	got := influenceRun(t, "../../testdata/moving/runway.json", "--quantity", "reaction", "--support", "2", "--envelope")
	if len(got.Trains) != 2 {
		t.Fatalf("%d trains, want the file's 2", len(got.Trains))
	}
	for _, tr := range got.Trains {
		if tr.Error != "" || tr.Envelope == nil || len(tr.Worst) == 0 {
			t.Fatalf("%s: error %q, envelope %v, %d extremes", tr.Train, tr.Error, tr.Envelope != nil, len(tr.Worst))
		}
		for _, q := range tr.Envelope.Quantities {
			if len(q.Max) != len(tr.Envelope.Stations) {
				t.Errorf("%s: %d values for %d stations", tr.Train, len(q.Max), len(tr.Envelope.Stations))
			}
		}
		for _, w := range tr.Worst {
			for _, e := range []struct {
				v  float64
				fe *float64
			}{{w.Largest.Value, w.Largest.FE}, {w.Smallest.Value, w.Smallest.FE}} {
				// Loads on nodes: the Hermite elements hold the exact fields;
				// the uniform load of the cart bends inside elements, where
				// the finite element moment is linear: a looser tolerance.
				if e.fe == nil || math.Abs(*e.fe-e.v) > 1e-3*math.Abs(e.v) {
					t.Errorf("%s, %s: envelope %.10g, finite elements at its position %v", tr.Train, w.Quantity, e.v, e.fe)
				}
			}
		}
	}
}

// Two equal axles P a apart crossing a simply supported span L: the
// largest moment anywhere is (2P/L)·(L/2 − a/4)², under an axle when the
// span's middle lies halfway between that axle and the resultant (the
// rule for two moving loads; e.g. Hibbeler, Structural Analysis, ch. 6,
// from memory): 15.3125 kN·m for P = 10 kN, a = 1 m, L = 4 m. The worst
// smallest moment stands with an axle on an end support, where the train
// can be moved by a hair one way only to read the finite element value.
func TestInfluenceCommandTwoAxlesAbsoluteMaximum(t *testing.T) {
	const P, a, L = 10e3, 1.0, 4.0
	path := variant(t, t.TempDir(), "axles", func(m map[string]any) {
		delete(m, "loads")
		m["trains"] = []any{map[string]any{"name": "two axles", "step": 0.01,
			"axles": []any{map[string]any{"load": P}, map[string]any{"load": P, "spacing": a}}}}
	})
	got := influenceRun(t, path, "--quantity", "M", "--at", "2", "--envelope")
	if len(got.Trains) != 1 || got.Trains[0].Error != "" {
		t.Fatalf("trains %+v, want the one train without error", got.Trains)
	}
	want := 2 * P / L * (L/2 - a/4) * (L/2 - a/4)
	for _, w := range got.Trains[0].Worst {
		if w.Smallest.FE == nil || w.Largest.FE == nil {
			t.Errorf("%s: no finite element reading at a governing position", w.Quantity)
		}
		if w.Quantity == "bending_moment" {
			near(t, "largest moment", w.Largest.Value, want, 1e-9)
			near(t, "its finite element reading", *w.Largest.FE, want, 1e-6)
		}
	}
}

// stave solve --json carries each train's worst positions and envelope,
// the same as stave influence --envelope finds for them.
func TestSolveJSONCarriesTrains(t *testing.T) {
	const file = "../../testdata/moving/runway.json"
	code, out, stderr := runStave(t, "solve", "--json", file)
	if code != 0 || stderr != "" {
		t.Fatalf("exit %d, stderr %q", code, stderr)
	}
	var solved influenceJSON
	if err := json.Unmarshal([]byte(out), &solved); err != nil {
		t.Fatal(err)
	}
	inf := influenceRun(t, file, "--quantity", "M", "--at", "2", "--envelope")
	if len(solved.Trains) != len(inf.Trains) || len(solved.Trains) != 2 {
		t.Fatalf("solve gives %d trains, influence %d; the file has 2", len(solved.Trains), len(inf.Trains))
	}
	for i, tr := range solved.Trains {
		if tr.Envelope == nil || len(tr.Worst) == 0 || len(tr.Worst) != len(inf.Trains[i].Worst) {
			t.Fatalf("%s: envelope %v, %d extremes; influence gives %d", tr.Train, tr.Envelope != nil, len(tr.Worst), len(inf.Trains[i].Worst))
		}
		for j, w := range tr.Worst {
			v := inf.Trains[i].Worst[j]
			if w.Quantity != v.Quantity || w.Largest.Value != v.Largest.Value || w.Smallest.Value != v.Smallest.Value {
				t.Errorf("%s: solve has %s %g..%g, influence %s %g..%g", tr.Train, w.Quantity, w.Smallest.Value, w.Largest.Value, v.Quantity, v.Smallest.Value, v.Largest.Value)
			}
		}
	}
}

// A member with no loads of its own and the mesh left to Stave: the
// automatic mesh would be one element a stretch, and the finite element
// line would read every load at an end. The influence line takes at least
// 100 elements, so each sample's load stands within L/100 of it, and the
// finite element value there is the exact one: the midspan moment's triangle, peak L/4 (statics; e.g. Hibbeler,
// Structural Analysis, ch. 6, from memory).
func TestInfluenceWithoutLoadsOfItsOwn(t *testing.T) {
	const L = 4.0
	path := variant(t, t.TempDir(), "bare", func(m map[string]any) {
		delete(m, "loads")
		m["mesh"] = map[string]any{"elements": 0}
	})
	got := influenceRun(t, path, "--quantity", "M", "--at", "2", "--points", "8")
	for _, s := range got.Line.Samples {
		at := s.S
		if s.FEAt != nil {
			at = *s.FEAt // the load on the nearest node
		}
		want := math.Min(at, L-at) / 2
		if s.FE == nil || math.Abs(*s.FE-want) > 1e-9*L || math.Abs(at-s.S) > L/100 {
			t.Errorf("finite element line at s = %g: %v with the load at %g, want %g within L/100 of s", s.S, s.FE, at, want)
		}
	}
}

// Where the shear force's line jumps, at the point read, the load there
// stands on the side of the section away from the one read, in the exact
// line as in the finite element one. The runway is two equal spans of
// 6 m: a load P at the middle of the first leaves R1 = 13P/32 at the end
// support (continuous beam of two equal spans, load at the centre of one
// span: AISC Manual, beam diagrams, from memory), so just left of it
// V = 13/32 and just right 13/32 − 1 = −19/32 per newton acting down. A
// load on the middle support goes into it: V just right of it is 0. The
// exact line read the load as past the section on the right: 13/32 and 1.
func TestInfluenceCommandValueAtTheJump(t *testing.T) {
	for _, c := range []struct {
		at, side string
		s, want  float64
	}{
		{"3", "left", 3, 13.0 / 32},
		{"3", "right", 3, -19.0 / 32},
		{"6", "right", 6, 0},
	} {
		got := influenceRun(t, "../../testdata/moving/runway.json", "--quantity", "V", "--at", c.at, "--side", c.side, "--points", "4")
		found := false
		for _, sm := range got.Line.Samples {
			if sm.S != c.s {
				continue
			}
			found = true
			if math.Abs(sm.Exact-c.want) > 1e-12 || sm.FE == nil || math.Abs(*sm.FE-c.want) > 1e-9 {
				t.Errorf("V at %s m, %s side, load at %g m: exact %.15g, FE %v; want %.15g", c.at, c.side, c.s, sm.Exact, sm.FE, c.want)
			}
		}
		if !found {
			t.Errorf("V at %s m: no sample with the load at %g m", c.at, c.s)
		}
	}
}

// Flags the model cannot answer are misuse of the command line (exit 2,
// README "Exit status": 1 is a model refused, and the model is sound): a
// point off the member, a support or train the file does not have, a
// motion the support does not hold, a quantity with no influence line.
// They exited 1, as if the model were refused; flags the target does not
// read (--support for a moment, --at for a reaction) were ignored. A line
// the member's closed form leaves out (an elastic foundation) is no
// misuse: no flag answers it, and the model is refused (exit 1).
func TestInfluenceCommandMisuse(t *testing.T) {
	for _, c := range []struct {
		args []string
		code int
		says string
	}{
		{[]string{"../../testdata/demo.json"}, 2, "needs --quantity"},
		{[]string{"../../testdata/demo.json", "--quantity", "M"}, 2, "needs --at"},
		{[]string{"../../testdata/demo.json", "--quantity", "torque", "--at", "1"}, 2, "not a quantity"},
		{[]string{"../../testdata/demo.json", "--quantity", "V", "--at", "1", "--side", "up"}, 2, "use left or right"},
		{[]string{"../../testdata/demo.json", "--quantity", "reaction"}, 2, "needs --support"},
		{[]string{"../../testdata/demo.json", "--quantity", "M", "--at", "9"}, 2, "not on the member"},
		// Just past the end, every digit: it said "x = 5.5 m is not on the member (0 to 5.5 m)".
		{[]string{"../../testdata/demo.json", "--quantity", "M", "--at", "5.5000000001"}, 2, "x = 5.5000000001 m is not on the member (0 to 5.5 m)"},
		// Trains count from 1: --train 0 was "there is no train 0: the file has 2", exit 1.
		{[]string{"../../testdata/moving/runway.json", "--quantity", "M", "--at", "1", "--train", "0", "--out", "x.png"}, 2, "--train 0: count the trains from 1"},
		{[]string{"../../testdata/demo.json", "--quantity", "sigma_combined", "--at", "1"}, 2, "not linear"},
		{[]string{"../../testdata/demo.json", "--quantity", "reaction", "--support", "2", "--motion", "rotation"}, 2, "does not hold the rotation"},
		// In the units asked for: it said "x = 30.48 m is not on the member (0 to
		// 4 m)" for --at 100 under US (100 ft = 30.48 m, 4 m = 13.12335958 ft;
		// 1 ft = 0.3048 m exactly, NIST SP 811 Appendix B).
		{[]string{"../../testdata/simply_supported_uniform.json", "--units", "US", "--quantity", "M", "--at", "100"}, 2, "x = 100 ft is not on the member (0 to 13.12335958 ft)"},
		{[]string{"../../testdata/simply_supported_uniform.json", "--units", "US", "--quantity", "M", "--at", "-2 in"}, 2, "x = -2 in is not on the member (0 to 13.12335958 ft)"},
		// Feet and inches: 13' 2" = 158 in = 4.0132 m, past the 4 m span (1 in =
		// 0.0254 m exactly, NIST SP 811 Appendix B).
		{[]string{"../../testdata/simply_supported_uniform.json", "--units", "US", "--quantity", "M", "--at", `13' 2"`}, 2, `x = 13' 2" is not on the member (0 to 13.12335958 ft)`},
		{[]string{"../../testdata/simply_supported_uniform.json", "--quantity", "M", "--at", "2 kips"}, 2, "--at: '2 kips' is a force, but position is expected here"},
		{[]string{"../../testdata/simply_supported_uniform.json", "--units", "US", "--quantity", "reaction", "--support", "2", "--motion", "rotation"}, 2, "support 2 (roller at x = 13.12 ft) does not hold the rotation"},
		{[]string{"../../testdata/demo.json", "--quantity", "reaction", "--support", "9"}, 2, "--support 9: the member has"},
		// One support is "1 support", not "1 supports".
		{[]string{"../../testdata/cantilever_tip_load.json", "--quantity", "reaction", "--support", "2"}, 2, "--support 2: the member has 1 support;"},
		{[]string{"../../testdata/moving/runway.json", "--quantity", "M", "--at", "1", "--train", "3", "--sheet", "x.pdf"}, 2, "--train 3: ../../testdata/moving/runway.json has 2 trains"},
		// A line the closed-form solution does not give for this member is the
		// model's limit, not misuse: no flag would answer it (exit 1, README).
		{[]string{"../../testdata/ground_beam_foundation.json", "--quantity", "M", "--at", "6"}, 1, "not available for a member with an elastic foundation across it"},
		// --train picks the train --out and --sheet show: without them it did nothing, without a word.
		{[]string{"../../testdata/moving/runway.json", "--quantity", "M", "--at", "1", "--train", "2"}, 2, "--train is for --out and --sheet"},
		{[]string{"../../testdata/simply_supported_uniform.json", "--quantity", "M", "--at", "1", "--sheet", "x.pdf"}, 2, "has no train to put on a sheet"},
		{[]string{"../../testdata/demo.json", "--quantity", "M", "--at", "1", "--support", "2"}, 2, "--support is for a reaction"},
		{[]string{"../../testdata/demo.json", "--quantity", "M", "--at", "1", "--motion", "axial"}, 2, "--motion is for a reaction"},
		{[]string{"../../testdata/demo.json", "--quantity", "reaction", "--support", "1", "--at", "1"}, 2, "--at is for a quantity read along the member"},
		{[]string{"../../testdata/demo.json", "--quantity", "reaction", "--support", "1", "--side", "left"}, 2, "--side is for a quantity read along the member"},
	} {
		code, _, stderr := runStave(t, append([]string{"influence"}, c.args...)...)
		if code != c.code || !strings.Contains(stderr, c.says) {
			t.Errorf("influence %v: exit %d, stderr %q; want exit %d saying %q", c.args, code, stderr, c.code, c.says)
		}
	}
}

// --out draws the picture and --sheet writes the one-page sheet.
func TestInfluenceCommandPictureAndSheet(t *testing.T) {
	dir := t.TempDir()
	pic, sheet := filepath.Join(dir, "line.png"), filepath.Join(dir, "sheet.pdf")
	code, _, stderr := runStave(t, "influence", "../../testdata/moving/runway.json", "--quantity", "M", "--at", "2.4", "--train", "2", "--out", pic, "--sheet", sheet)
	if code != 0 {
		t.Fatalf("exit %d, stderr %s", code, stderr)
	}
	f, err := os.Open(pic)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	if _, err := png.Decode(f); err != nil {
		t.Errorf("the picture is not a PNG: %v", err)
	}
	data, err := os.ReadFile(sheet)
	if err != nil || !strings.HasPrefix(string(data), "%PDF") {
		t.Errorf("the sheet is not a PDF (%v)", err)
	}
	code, _, stderr = runStave(t, "influence", "../../testdata/moving/runway.json", "--quantity", "M", "--at", "2.4", "--train", "3", "--out", pic)
	if code != 2 || !strings.Contains(stderr, "--train 3: ../../testdata/moving/runway.json has 2 trains") {
		t.Errorf("a third train of two: exit %d, stderr %q", code, stderr)
	}
}

// The shear force of the simply supported beam of span L = 4 m at x = 0,
// 1 m and L, read on either side of x, per newton of a load acting down at
// s: −s/L while the load stands left of the cut, 1 − s/L while it stands
// right of it (statics; e.g. Hibbeler, Structural Analysis, ch. 6, from
// memory). With the load at x itself the cut just right of x has it on its
// left and the cut just left of x on its right: the exact sample there is
// the same load as the finite element one, on the node at x (at a support
// the load goes straight into it: 0). At an end the side off the member is
// read on the member: nothing lies left of x = 0 or right of x = L.
func TestInfluenceCommandShearAtItsOwnPoint(t *testing.T) {
	const L = 4.0
	for _, c := range []struct {
		at, side, read string
		x              float64
	}{
		{"1", "right", "right", 1}, {"1", "left", "left", 1}, {"0", "right", "right", 0}, {"4", "left", "left", L},
		{"0", "left", "right", 0}, {"4", "right", "left", L},
	} {
		t.Run(c.at+" "+c.side, func(t *testing.T) {
			got := influenceRun(t, "../../testdata/simply_supported_uniform.json", "--quantity", "V", "--at", c.at, "--side", c.side, "--points", "8")
			for _, s := range got.Line.Samples {
				loadsLeft := s.S < c.x || (s.S == c.x && c.read == "right")
				want := 1 - s.S/L
				if loadsLeft {
					want = -s.S / L
				}
				if math.Abs(s.Exact-want) > 1e-12 {
					t.Errorf("exact line at s = %g: %.15g, want %g", s.S, s.Exact, want)
				}
				if s.FE == nil || *s.FEAt != s.S || math.Abs(*s.FE-want) > 1e-12 {
					t.Errorf("finite element line at s = %g: %v with the load at %v, want %g at %g", s.S, s.FE, s.FEAt, want, s.S)
				}
			}
		})
	}
}

// The axial force and stress jump under an axial load at their own point
// as the shear force does under a transverse one: on a bar fixed at both
// ends a load P along +x at s pulls the part behind it, N = P·(L − s)/L,
// and pushes the part ahead, N = −P·s/L (statically indeterminate bar,
// e.g. Gere & Goodno, Mechanics of Materials, ch. 2, from memory); on a bar
// fixed at x = 0 alone only the part behind the load carries it, N = P.
// A load on the point itself stands on the far side of the cut from the
// side read, as the finite element load on the node there does; the axial
// stress is N over the area on the side read (the stepped bar's 0.002 m²
// left of its step at 2 m, 0.001 m² right of it).
func TestInfluenceCommandAxialForceAtItsOwnPoint(t *testing.T) {
	for _, c := range []struct {
		file, quantity, at, side string
		x, area                  float64
		fixedFar                 bool // fixed at both ends, else at x = 0 alone
	}{
		{"fixed_fixed_thermal", "N", "1", "right", 1, 1, true},
		{"fixed_fixed_thermal", "N", "1", "left", 1, 1, true},
		{"fixed_fixed_thermal", "N", "0", "left", 0, 1, true},
		{"fixed_fixed_thermal", "N", "4", "right", 4, 1, true},
		{"fixed_fixed_thermal", "sigma_axial", "1", "right", 1, 0.004, true},
		{"stepped_bar", "N", "2", "right", 2, 1, false},
		{"stepped_bar", "sigma_axial", "2", "left", 2, 0.002, false},
		{"stepped_bar", "sigma_axial", "2", "right", 2, 0.001, false},
		{"stepped_bar", "sigma_axial", "4", "right", 4, 0.001, false},
	} {
		t.Run(c.file+" "+c.quantity+" "+c.at+" "+c.side, func(t *testing.T) {
			const L = 4.0
			got := influenceRun(t, "../../testdata/"+c.file+".json", "--quantity", c.quantity, "--at", c.at, "--side", c.side, "--points", "8")
			read := c.side
			if c.x == 0 {
				read = "right"
			} else if c.x == L {
				read = "left"
			}
			want := func(s float64) float64 {
				loadsLeft := s < c.x || (s == c.x && read == "right")
				switch {
				case c.fixedFar && loadsLeft:
					return -s / L / c.area
				case c.fixedFar:
					return (1 - s/L) / c.area
				case !loadsLeft:
					return 1 / c.area
				}
				return 0
			}
			for _, s := range got.Line.Samples {
				if w := want(s.S); math.Abs(s.Exact-w) > 1e-9*math.Max(1, math.Abs(w)) {
					t.Errorf("exact line at s = %g: %.15g, want %g", s.S, s.Exact, w)
				}
				if s.FE == nil {
					t.Fatalf("no finite element line at s = %g", s.S)
				}
				if w := want(*s.FEAt); math.Abs(*s.FE-w) > 1e-9*math.Max(1, math.Abs(w)) {
					t.Errorf("finite element line with the load at %g: %.15g, want %g", *s.FEAt, *s.FE, w)
				}
			}
		})
	}
}

// The unit load is named in the units the ordinates are printed per: a
// moment line read in kip·ft per kip is for a unit force of 1 kip, not of
// 1 N (the ordinate per N would be 4448.22 times smaller, NIST SP 811
// Appendix B: 1 kip = 4448.2216152605 N). In the text and in the picture.
func TestInfluenceUnitLoadInDisplayUnits(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		units, quantity, want, per string
	}{
		{"SI", "M", "for a unit force of 1 kN acting down", "kN·m per kN"},
		{"US", "M", "for a unit force of 1 kip acting down", "kip·ft per kip"},
		{"SI", "N", "for a unit force of 1 kN along +x", "kN per kN"},
		{"US", "N", "for a unit force of 1 kip along +x", "kip per kip"},
	} {
		pic := filepath.Join(dir, "line.svg")
		code, out, stderr := runStave(t, "influence", "../../testdata/simply_supported_uniform.json", "--quantity", c.quantity, "--at", "1", "--points", "2", "--units", c.units, "--out", pic)
		if code != 0 {
			t.Fatalf("%s %s: exit %d, stderr %s", c.units, c.quantity, code, stderr)
		}
		if !strings.Contains(out, c.want) || !strings.Contains(out, c.per) {
			t.Errorf("%s %s: the text does not say %q with ordinates in %q:\n%s", c.units, c.quantity, c.want, c.per, out)
		}
		svg, err := os.ReadFile(pic)
		if err != nil {
			t.Fatal(err)
		}
		if c.quantity == "M" && !strings.Contains(string(svg), c.want) {
			t.Errorf("%s %s: the picture does not say %q", c.units, c.quantity, c.want)
		}
	}
}
