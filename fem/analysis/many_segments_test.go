package analysis

import (
	"context"
	"fmt"
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/check"
)

// split cuts every segment of m into n equal ones of the same section and
// material: the same member, with n times the stretches to check.
func split(m fem.Model, n int) fem.Model {
	var segs []fem.Segment
	for _, s := range m.Segments {
		for i := range n {
			part := s
			part.Start = s.Start + (s.End-s.Start)*float64(i)/float64(n)
			part.End = s.Start + (s.End-s.Start)*float64(i+1)/float64(n)
			segs = append(segs, part)
		}
	}
	m.Segments = segs
	return m
}

// The three-span beam of TestEnvelopeChecksTakePatternLoading cut into 60
// segments: each segment's stress check finds its worst arrangement, and
// the one over the middle support (256 MPa, strength with imposed on
// spans 1 and 2 or 2 and 3) is the same as on one segment. The segments'
// checks share the solves of the arrangements they have in common.
func TestPatternLoadingOnManySegments(t *testing.T) {
	m := load(t, "three_span_pattern.json")
	m.Segments[0].Material.Allowable = 240e6
	m.Segments[0].Section.SecondMoment = 1.6e-5
	m = split(m, 60)
	a, err := Run(context.Background(), Request{Model: m, Checks: check.DefaultOptions(), Show: Show{Kind: ShowEnvelope}})
	if err != nil || a.Err != nil {
		t.Fatalf("%v, %v", err, a.Err)
	}
	worst := check.Result{}
	for _, r := range a.Checks {
		if r.Code == check.CodeStress && r.Value > worst.Value {
			worst = r
		}
	}
	if math.Abs(worst.Value-256e6) > 1e-9*256e6 || worst.Status != check.Fail || !strings.Contains(worst.Name, "imposed on spans 1, 2") && !strings.Contains(worst.Name, "imposed on spans 2, 3") {
		t.Errorf("worst stress check %s: %s, %.9g Pa; want a failure at 256 MPa with imposed on spans 1, 2 (or 2, 3)", worst.Name, worst.Status, worst.Value)
	}
}

// BenchmarkPatternLoadingManySegments: the three-span beam placed by span
// cut into n segments. Solving each check's arrangement anew made it
// quadratic in the segments: 0.62 s at 50 and 6.4 s at 200 here, over
// 120 s at 2,000 (stave solve); with each arrangement solved once per
// combination 0.24 s, 0.69 s and 22 s (5 December, a loaded machine).
func BenchmarkPatternLoadingManySegments(b *testing.B) {
	m := load(b, "three_span_pattern.json")
	for _, n := range []int{50, 200} {
		many := split(m, n)
		b.Run(fmt.Sprint(n), func(b *testing.B) {
			for b.Loop() {
				if _, err := Run(context.Background(), Request{Model: many, Checks: check.DefaultOptions(), Show: Show{Kind: ShowEnvelope}}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
