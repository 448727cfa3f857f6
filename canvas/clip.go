package canvas

// The PNG rasterizer works in 26.6 fixed point: a coordinate beyond about
// 3·10⁷ pixels wraps, and a path that reaches that far (a deflection
// magnified 10¹⁰ times, say) takes it forever. Raster drawings therefore
// cut lines and areas at a box far outside the picture; what lies inside
// the picture is unchanged.

// clipMargin is how far outside the scene, in scene units, the box lies.
const clipMargin = 10000

// clipItems are items with every polyline and polygon that leaves the box
// [lo, hi] cut at it: a polyline into the runs inside it, a polygon into
// the part of it inside; circles and texts wholly outside it are left out.
// Items inside the box, and those drawable leaves out, are kept as they
// are.
func clipItems(items []Item, lo, hi Point) []Item {
	inside := func(p Point) bool { return p.X >= lo.X && p.X <= hi.X && p.Y >= lo.Y && p.Y <= hi.Y }
	out := make([]Item, 0, len(items))
	for _, it := range items {
		all := true
		for _, p := range it.Points {
			if !inside(p) {
				all = false
				break
			}
		}
		switch {
		case it.Kind == Circle && !touches(it.Center, it.Radius, lo, hi), it.Kind == Text && !inside(it.At):
			// wholly outside the box, far from the picture: left out
		case all || !drawable(it) || (it.Kind != Polyline && it.Kind != Polygon):
			out = append(out, it)
		case it.Kind == Polygon:
			if pts := clipPolygon(it.Points, lo, hi); len(pts) >= 3 {
				it.Points = pts
				out = append(out, it)
			}
		default:
			for _, run := range clipPolyline(it.Points, lo, hi) {
				piece := it
				piece.Points = run
				out = append(out, piece)
			}
		}
	}
	return out
}

// touches says the circle about c of radius r reaches into [lo, hi].
func touches(c Point, r float32, lo, hi Point) bool {
	return c.X+r >= lo.X && c.X-r <= hi.X && c.Y+r >= lo.Y && c.Y-r <= hi.Y
}

// clipSegment is the part of the segment a–b inside [lo, hi]
// (Liang–Barsky), and whether there is one.
func clipSegment(a, b, lo, hi Point) (Point, Point, bool) {
	t0, t1 := 0.0, 1.0
	// In float64 throughout: float32 differences of far points lose the
	// near ones' place.
	ax, ay := float64(a.X), float64(a.Y)
	dx, dy := float64(b.X)-ax, float64(b.Y)-ay
	for _, e := range [4][2]float64{
		{-dx, ax - float64(lo.X)}, {dx, float64(hi.X) - ax},
		{-dy, ay - float64(lo.Y)}, {dy, float64(hi.Y) - ay},
	} {
		p, q := e[0], e[1]
		if p == 0 {
			if q < 0 {
				return a, b, false
			}
			continue
		}
		r := q / p
		if p < 0 {
			t0 = max(t0, r)
		} else {
			t1 = min(t1, r)
		}
		if t0 > t1 {
			return a, b, false
		}
	}
	at := func(t float64) Point {
		return Point{float32(ax + t*dx), float32(ay + t*dy)}
	}
	if t0 > 0 {
		a = at(t0)
	}
	if t1 < 1 {
		b = at(t1)
	}
	return a, b, true
}

// clipPolyline is the runs of pts inside [lo, hi].
func clipPolyline(pts []Point, lo, hi Point) [][]Point {
	var runs [][]Point
	var run []Point
	for i := 1; i < len(pts); i++ {
		a, b, ok := clipSegment(pts[i-1], pts[i], lo, hi)
		if !ok {
			continue
		}
		if len(run) == 0 || run[len(run)-1] != a {
			if len(run) >= 2 {
				runs = append(runs, run)
			}
			run = []Point{a}
		}
		run = append(run, b)
	}
	if len(run) >= 2 {
		runs = append(runs, run)
	}
	return runs
}

// clipPolygon is the part of the closed polygon pts inside [lo, hi]
// (Sutherland–Hodgman, one side of the box at a time).
func clipPolygon(pts []Point, lo, hi Point) []Point {
	sides := []struct {
		in  func(Point) bool
		cut func(a, b Point) Point
	}{
		{func(p Point) bool { return p.X >= lo.X }, func(a, b Point) Point { return atX(a, b, lo.X) }},
		{func(p Point) bool { return p.X <= hi.X }, func(a, b Point) Point { return atX(a, b, hi.X) }},
		{func(p Point) bool { return p.Y >= lo.Y }, func(a, b Point) Point { return atY(a, b, lo.Y) }},
		{func(p Point) bool { return p.Y <= hi.Y }, func(a, b Point) Point { return atY(a, b, hi.Y) }},
	}
	for _, s := range sides {
		if len(pts) == 0 {
			return nil
		}
		var next []Point
		prev := pts[len(pts)-1]
		for _, p := range pts {
			switch {
			case s.in(p) && !s.in(prev):
				next = append(next, s.cut(prev, p), p)
			case s.in(p):
				next = append(next, p)
			case s.in(prev):
				next = append(next, s.cut(prev, p))
			}
			prev = p
		}
		pts = next
	}
	return pts
}

// atX is where the segment a–b crosses x; atY where it crosses y.
func atX(a, b Point, x float32) Point {
	t := (float64(x) - float64(a.X)) / (float64(b.X) - float64(a.X))
	return Point{x, float32(float64(a.Y) + t*(float64(b.Y)-float64(a.Y)))}
}

func atY(a, b Point, y float32) Point {
	t := (float64(y) - float64(a.Y)) / (float64(b.Y) - float64(a.Y))
	return Point{float32(float64(a.X) + t*(float64(b.X)-float64(a.X))), y}
}
