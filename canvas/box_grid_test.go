package canvas

import (
	"math"
	"math/rand/v2"
	"testing"
)

// free answers as a look at every occupied box would: for boxes of every
// size, far off the scene, inverted or with corners that are not numbers,
// and for rects anywhere.
func TestFreeAsEveryBox(t *testing.T) {
	r := rand.New(rand.NewPCG(17, 5))
	coordinate := func() float32 {
		switch r.IntN(40) {
		case 0:
			return float32(math.NaN())
		case 1:
			return float32(r.NormFloat64() * 1e9)
		}
		return float32(r.Float64()*1400 - 100)
	}
	size := func() float32 {
		switch r.IntN(10) {
		case 0:
			return float32(r.Float64() * 3000) // wider than gridSpan cells
		case 1:
			return -5 // inverted
		}
		return float32(r.Float64() * 40)
	}
	b := builder{s: &Scene{Width: 1200, Height: 1200}}
	for range 2000 {
		x, y := coordinate(), coordinate()
		b.occupy(rect{x, y, x + size(), y + size()}, symbolBox)
	}
	if len(b.boxGrid.large) == 0 || len(b.boxGrid.entries) == 0 {
		t.Fatal("the boxes do not test both the grid and the list of large boxes")
	}
	disagree, taken := 0, 0
	for range 20000 {
		x, y := coordinate(), coordinate()
		q := rect{x, y, x + size(), y + size()}
		want := true
		for _, o := range b.boxes {
			if q.grown(3, 1).overlaps(o.rect) {
				want = false
				break
			}
		}
		if !want {
			taken++
		}
		if b.free(q) != want {
			disagree++
		}
	}
	if disagree > 0 {
		t.Errorf("free disagrees with a look at every box for %d rects of 20000", disagree)
	}
	if taken == 0 || taken == 20000 {
		t.Errorf("%d of 20000 rects overlap a box: the test tells nothing", taken)
	}
}
