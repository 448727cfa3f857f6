package app

import (
	"strings"
	"testing"
)

// dialogTexts are the texts of the labels of the dialog on top of w.
func dialogTexts(t *testing.T, w *Window) []string {
	t.Helper()
	top := w.win.Canvas().Overlays().Top()
	if top == nil {
		t.Fatal("no dialog showing")
	}
	return labelTexts(top)
}

// The section calculator writes a second moment and a section modulus in
// SI with the multiplication sign before their power of ten: the
// rectangle it starts with, 100 × 300 mm, has I = bh³/12 = 225.0 × 10⁶ mm⁴
// and S = bh²/6 = 1500 × 10³ mm³ (rectangle, closed form; from memory),
// which read "225.0 10⁶ mm⁴", like 225.0106, without it.
func TestSectionCalculatorShowsPowersOfTen(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.showSectionCalculator()
	all := strings.Join(dialogTexts(t, w), "\n")
	for _, want := range []string{"I = 225.0 × 10⁶ mm⁴", "S = I/c = 1500 × 10³ mm³"} {
		if !strings.Contains(all, want) {
			t.Errorf("the section calculator shows\n%s\nwant %q in it", all, want)
		}
	}
	found := false
	for _, line := range strings.Split(all, "\n") {
		if !strings.HasPrefix(line, "Segment now") {
			continue
		}
		found = true
		if !strings.Contains(line, "× 10⁶ mm⁴") {
			t.Errorf("the segment's own section reads %q, want its I with × before 10⁶", line)
		}
	}
	if !found {
		t.Error("the section calculator does not show the segment's own section")
	}
}
