package fem

import (
	"errors"
	"sync"

	"stave/fem/units"
)

// Member is a model made ready for solving: validated once, its key points
// found and its loads gathered once. Every solve of a model starts from one,
// so the finite element solve, the exact solution and the meshes built for
// them share that work: Prepare, then Mesh, Solve and Exact.
type Member struct {
	model Model // a copy: later edits of the caller's model leave it alone
	keys  []float64
	loads Loads
	// loadSets are the load sets (cases) gathered on keys; loads is the
	// first of them.
	loadSets []Loads
	// mechanism is why the supports cannot hold the member, or nil.
	mechanism error
	// bending says the beam problem is solved (Bending).
	bending bool
	// units are the units the solver's messages quote values in
	// (PrepareIn).
	units units.System
	// The exact solution's structure and the exact solution under the
	// member's loads, found once on first use.
	exactOnce      sync.Once
	exactStructure *ExactStructure
	exact          *Exact
	exactErr       error
	// exactPanic is what working the exact solution out panicked with,
	// raised again by every later call (solveExact).
	exactPanic any
}

// Prepare validates m and gathers what every solve of it needs. A model
// whose supports leave it free to move is prepared (it can still be meshed
// and drawn); its Solve and Exact return the *MechanismError. Its messages
// quote values in SI base units (m, N, Pa...), as a file holds them.
func Prepare(m *Model) (*Member, error) { return PrepareIn(m, units.Base) }

// PrepareIn is Prepare with the messages of the validation (ValidateIn)
// and of the solves of the member (a mechanism, a singular system)
// quoting values in the display units of u; units of no name (the zero
// System) are SI base units, as Prepare's.
func PrepareIn(m *Model, u units.System) (*Member, error) {
	u = messageUnits(u)
	if err := m.ValidateIn(u); err != nil {
		return nil, err
	}
	p := &Member{model: m.Clone(), units: u}
	p.keys = KeyPoints(&p.model)
	p.loadSets = gatherLoadSets(&p.model, p.keys)
	p.loads = p.loadSets[0]
	bends := false
	for i := range p.loadSets {
		bends = bends || p.loadSets[i].bendsMember()
	}
	p.bending = !m.AxialOnly && (bends || holdsAcross(m))
	p.mechanism = checkMechanism(m, p.bending, u)
	var me *MechanismError
	if p.bending && !bends && errors.As(p.mechanism, &me) && me.Motion != "axial" {
		// Nothing loads the member across: it may be meant as a tie or strut.
		me.Message += ", or, for a tie or strut that nothing loads across, declare the member axial-only"
	}
	return p, nil
}

// Bending reports whether the member's bending is solved: it is not
// declared axial-only, and something loads it transversely or a support
// holds it across or in rotation, or a foundation holds it across.
// Otherwise it is solved as a bar alone:
// the deflection, rotation, shear force and bending moment are zero and not
// reported, and the supports need not hold it sideways (a tie on two axial
// supports is no mechanism).
func (p *Member) Bending() bool { return p.bending }

// slidesFree reports whether the member lies on a foundation across it,
// nothing holds it along its axis (no support, no foundation's axial
// modulus) and nothing pushes it along (no axial point or line load, no
// self-weight along it, in the model or any case): a ground beam on its bed
// under loads across it. Its axial rigid slide is then free and unloaded,
// so the axial displacement is measured from x = 0 (u(0) = 0, a datum that
// carries no force) rather than the member refused as a mechanism. A
// member on supports alone still needs one that holds it along.
func (m *Model) slidesFree() bool {
	bed := false
	for _, f := range m.Foundations {
		bed = bed || f.Modulus > 0
	}
	if !bed {
		return false
	}
	for _, s := range m.Supports {
		if s.Holds(Axial) {
			return false
		}
	}
	for _, f := range m.Foundations {
		if f.AxialModulus > 0 {
			return false
		}
	}
	pushes := func(points []PointLoad, lines []DistributedLoad) bool {
		for _, p := range points {
			if p.Axial != 0 {
				return true
			}
		}
		for _, d := range lines {
			if d.Direction != Axial {
				continue
			}
			for _, v := range d.Points {
				if v.Intensity != 0 {
					return true
				}
			}
		}
		return false
	}
	if pushes(m.PointLoads, m.DistributedLoad) {
		return false
	}
	for _, c := range m.Cases {
		if pushes(c.PointLoads, c.DistributedLoad) {
			return false
		}
	}
	if m.Gravity[Axial] != 0 {
		for _, s := range m.Segments {
			if s.Material.Density != 0 {
				return false
			}
		}
	}
	return true
}

// holdsAcross reports whether any support holds the member across it or in
// rotation, rigidly or by a spring, or a foundation holds it across.
func holdsAcross(m *Model) bool {
	for _, s := range m.Supports {
		if s.Holds(Transverse) || s.Holds(Rotation) {
			return true
		}
	}
	for _, f := range m.Foundations {
		if f.Modulus > 0 {
			return true
		}
	}
	return false
}

// Model is the prepared model. It is shared, not copied: do not change it.
func (p *Member) Model() *Model { return &p.model }

// Loads are the model's loads gathered on its key points: its own loads, or
// its first case's (LoadSets has them all). They are shared, not copied: do
// not change them.
func (p *Member) Loads() *Loads { return &p.loads }

// Structure assembles and factorizes the key-point systems on mesh, which
// must come from this member's Mesh or MeshOn (see NewStructure).
func (p *Member) Structure(mesh Mesh) (*Structure, error) {
	if p.mechanism != nil {
		return nil, p.mechanism
	}
	return newStructure(p, mesh)
}

// Solve solves the member under its own loads on mesh.
func (p *Member) Solve(mesh Mesh) (*Solution, error) {
	st, err := p.Structure(mesh)
	if err != nil {
		return nil, err
	}
	return st.Solve(&p.loads)
}

// Exact integrates the governing equations of the member in closed form
// (see SolveExact), once: later calls return the same solution.
func (p *Member) Exact() (*Exact, error) {
	p.solveExact()
	return p.exact, p.exactErr
}

// ExactStructure is the member's exact solution's equations, factorized
// (once) for any load set on its key points.
func (p *Member) ExactStructure() (*ExactStructure, error) {
	p.solveExact()
	if p.exactStructure == nil {
		return nil, p.exactErr
	}
	return p.exactStructure, nil
}

// solveExact finds the exact structure and the exact solution under the
// member's own loads, the first time it is called. Should that panic, the
// panic is kept and raised again by this and every later call, in the
// caller's goroutine: a sync.Once counts a panicking call as done, and the
// exact solution would read as nil without an error (the first call may be
// on a goroutine of its own, see package fem/analysis).
func (p *Member) solveExact() {
	p.exactOnce.Do(func() {
		defer func() { p.exactPanic = recover() }()
		if p.mechanism != nil {
			p.exactErr = p.mechanism
			return
		}
		p.exactStructure, p.exact, p.exactErr = newExactStructure(p)
	})
	if p.exactPanic != nil {
		panic(p.exactPanic)
	}
}
