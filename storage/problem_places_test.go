package storage

import (
	"encoding/json"
	"fmt"
	"os"
	"testing"
)

// A problem found as the file was read hides a later one at the same
// place, inside it or around it, and no other: "loads[1]" holds
// "loads[1].x" but not "loads[10]".
func TestProblemPlacesOverlap(t *testing.T) {
	found := newProblemPlaces([]Problem{{Path: "loads[1].value"}, {Path: "member.segments[0]"}})
	for _, c := range []struct {
		path string
		want bool
	}{
		{"loads[1].value", true}, // the same place
		{"loads[1]", true},       // around it
		{"loads", true},          // further around it
		{"", true},               // the whole file
		{"member.segments[0].section.area", true},  // inside it
		{"member.segments[0].material", true},      // inside it
		{"loads[10]", false},                       // a longer index, not inside
		{"loads[1].valueless", false},              // a longer key, not inside
		{"loads[2]", false},                        // beside it
		{"member.segments[1].section.area", false}, // another segment
		{"member.segments", true},                  // around the segment
		{"supports[0].x", false},                   // elsewhere
	} {
		if got := found.overlaps(c.path); got != c.want {
			t.Errorf("overlaps(%q) = %v, want %v", c.path, got, c.want)
		}
	}
	if newProblemPlaces(nil).overlaps("") {
		t.Error("no problems found: nothing overlaps")
	}
	if !newProblemPlaces([]Problem{{Path: ""}}).overlaps("loads[3].x") {
		t.Error("a problem with the whole file overlaps every place")
	}
}

// BenchmarkUnmarshalManyProblems reads a file of load cases with n loads
// outside them, each with an unknown key: 2n problems, each load's second
// hidden by its first. Comparing every later problem with every earlier
// one took 0.7 s at n = 8,000 and over a minute at 50,000 (a 3.2 MB file,
// under the size limit).
func BenchmarkUnmarshalManyProblems(b *testing.B) {
	data, err := os.ReadFile("../testdata/two_span_cases.json")
	if err != nil {
		b.Fatal(err)
	}
	var doc map[string]any
	if err := json.Unmarshal(data, &doc); err != nil {
		b.Fatal(err)
	}
	for _, n := range []int{1000, 8000} {
		loads := make([]any, n)
		for i := range loads {
			loads[i] = map[string]any{"kind": "point", "x": 8 * float64(i) / float64(n), "value": -1}
		}
		doc["loads"] = loads
		file, err := json.Marshal(doc)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(fmt.Sprint(n), func(b *testing.B) {
			for b.Loop() {
				if _, err := Unmarshal(file); err == nil {
					b.Fatal("a file of unknown keys opened")
				}
			}
		})
	}
}
