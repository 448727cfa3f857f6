package main

import (
	"encoding/json"
	"math"
	"strings"
	"testing"
)

// Two opposite couples M0 over the supports of a beam with overhangs
// balance each other: the supports carry nothing, the span between them
// bends uniformly under M = −M0 and the overhangs turn with it. Uniform
// bending gives the span's midspan rise M0·l²/(8EI) and end slopes
// M0·l/(2EI), so the overhang of length a dips by M0·l·a/(2EI) (Gere &
// Goodno, Mechanics of Materials, beam deflections by integration, from
// memory). The solve succeeds (exit 0) with every equilibrium check passed,
// in the document and in the text in US units: before, the moment balance
// failed on a residual of round-off against loads that add up to nothing,
// and the command exited 3.
func TestSolveBalancedCouples(t *testing.T) {
	const M0, l, EI = 2e3, 2.5, 200e9 * 8e-6
	dir := t.TempDir()
	file := variant(t, dir, "couples", func(m map[string]any) {
		m["supports"] = []any{map[string]any{"x": 0.5, "kind": "pinned"}, map[string]any{"x": 3, "kind": "roller"}}
		m["loads"] = []any{map[string]any{"kind": "point", "x": 0.5, "moment": M0}, map[string]any{"kind": "point", "x": 3, "moment": -M0}}
		delete(m, "mesh")
	})
	code, out, stderr := runStave(t, "solve", "--json", file)
	if code != 0 || stderr != "" {
		t.Fatalf("exit %d, stderr %q; want 0 and nothing on stderr\n%s", code, stderr, out)
	}
	var got struct {
		Reactions []struct {
			Transverse *struct{ Value float64 }
		} `json:"reactions"`
		Extremes []struct {
			Quantity string
			Max, Min struct{ Value, X float64 }
		} `json:"extremes"`
		Checks []struct{ Check, Name, Status string } `json:"checks"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatal(err)
	}
	for _, r := range got.Reactions {
		if r.Transverse == nil || !(math.Abs(r.Transverse.Value) < 1e-9*M0) {
			t.Errorf("reaction %+v: the couples balance, the supports carry nothing", r.Transverse)
		}
	}
	for _, e := range got.Extremes {
		switch e.Quantity {
		case "bending_moment":
			near(t, "uniform moment of the span", e.Min.Value, -M0, 1e-9)
		case "deflection":
			near(t, "rise at midspan", e.Max.Value, M0*l*l/(8*EI), 1e-9)
			near(t, "its place", e.Max.X, 0.5+l/2, 1e-9)
			near(t, "dip at the end of the longer overhang", e.Min.Value, -M0*l*1/(2*EI), 1e-9)
			near(t, "its place, the end of the member", e.Min.X, 4, 1e-12)
		}
	}
	n := 0
	for _, c := range got.Checks {
		if c.Check == "equilibrium" {
			n++
			if c.Status != "pass" {
				t.Errorf("%s: %s, want pass", c.Name, c.Status)
			}
		}
	}
	if n != 3 {
		t.Errorf("%d equilibrium checks, want 3", n)
	}
	code, text, _ := runStave(t, "solve", "--units", "US", file)
	if code != 0 || !strings.Contains(text, "pass          Equilibrium, moments about x = 0") || strings.Contains(text, "FAIL") {
		t.Errorf("exit %d; the text in US units must pass the moment balance:\n%s", code, text)
	}
}
