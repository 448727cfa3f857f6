package band

import (
	"slices"
	"testing"
)

// AddRow adds a run of a row as Add would entry by entry, and refuses
// (panics, as Add does) a run with either end outside the band or the
// matrix, before it writes anything.
func TestAddRow(t *testing.T) {
	cases := []struct {
		name   string
		i, j   int
		v      []float64
		panics bool
	}{
		{"whole band of a middle row", 3, 1, []float64{1, 2, 3, 4, 5}, false},
		{"inside the band", 3, 2, []float64{-1, 0.5}, false},
		{"first row from the diagonal", 0, 0, []float64{1, 2, 3}, false},
		{"empty run", 3, 9, nil, false},
		{"starts left of the band", 3, 0, []float64{1, 2}, true},
		{"ends right of the band", 3, 4, []float64{1, 2, 3}, true},
		{"ends past the last column", 6, 6, []float64{1, 2}, true},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			a, want := NewGeneral(7, 2, 2), NewGeneral(7, 2, 2)
			for i := range a.Data {
				a.Data[i], want.Data[i] = float64(i), float64(i)
			}
			defer func() {
				r := recover()
				switch {
				case c.panics && r == nil:
					t.Fatalf("AddRow(%d, %d, %v) accepted a run outside the band", c.i, c.j, c.v)
				case !c.panics && r != nil:
					t.Fatalf("AddRow(%d, %d, %v) panicked: %v", c.i, c.j, c.v, r)
				case c.panics && !slices.Equal(a.Data, want.Data):
					t.Fatalf("a refused run changed the matrix")
				}
			}()
			a.AddRow(c.i, c.j, c.v)
			for k, x := range c.v {
				want.Add(c.i, c.j+k, x)
			}
			if !slices.Equal(a.Data, want.Data) {
				t.Errorf("AddRow gave %v, Add entry by entry %v", a.Data, want.Data)
			}
		})
	}
}
