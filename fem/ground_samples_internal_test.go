package fem

import "testing"

// TestNetLoadSamplesOfAStretchAreBounded: the automatic mesh reads the
// exact solution netLoadSamples times on each of a foundation stretch's
// pieces, sixteen per unit of β·ℓ. The pieces are capped at
// maxGroundPieces, so on a bed stiff enough that β·L runs past the cap each
// piece is many 1/β long; with at most 10⁴ units per piece a simply
// supported 10 m beam on a bed of 1e60 N/m² (β·L about 2e14) read it
// 4096 × 160,008 times per load set and `stave solve` ran for minutes.
// However stiff the bed, a stretch's pieces together read it about a
// million times at most (a few tenths of a second).
func TestNetLoadSamplesOfAStretchAreBounded(t *testing.T) {
	const bound = 1_100_000
	for _, tc := range []struct {
		name    string
		modulus float64 // N/m²
	}{
		{"soft bed", 1e6},
		{"beta L past the cap of pieces", 1e20},
		{"1e30", 1e30},
		{"1e60", 1e60},
		{"at the solvers' limit", 1e150},
	} {
		t.Run(tc.name, func(t *testing.T) {
			d := elementData{start: 0, length: 10, sectionData: sectionData{flexuralRigidity: 2e7, axialRigidity: 2e9}, modulus: tc.modulus}
			pieces := d.groundPieces()
			total := 0
			for i := range pieces {
				p := d.piece(i, pieces)
				total += netLoadSamples(&p) + 1
			}
			if total > bound {
				t.Errorf("%d pieces read the exact solution %d times in all, more than %d", pieces, total, bound)
			}
		})
	}
}
