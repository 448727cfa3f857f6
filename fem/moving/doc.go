// Package moving finds influence lines of a member and the effects of load
// trains moving along it: the worst position of a train for a quantity, and
// the envelope of every field over all positions with the position that
// governs at each x.
//
// # Influence lines
//
// The influence line of a quantity (a support reaction, or the deflection,
// rotation, shear force, bending moment or stress at a point x) is its value
// as a function of where a unit load stands. Bending quantities are for a
// unit force of 1 N acting down (a weight), axial ones (axial displacement,
// axial force and stress, the axial reaction) for 1 N along +x. Stave's sign
// conventions hold otherwise (package fem): sagging moments and upward
// reactions are positive, so the midspan moment of a simply supported beam
// has a positive triangle with its peak L/4 at midspan.
//
// Influence lines come from the exact solution of the same member that
// package fem solves (supports, springs, hinges, semi-rigid joints and
// changes of section where the model has them), in closed form, by one
// construction for every quantity: the Green's function of the member.
// Between key points (ends, supports, hinges, segment breaks) the unloaded
// beam's state (w, θ, M, V) is carried along by a cubic transfer matrix, and
// the bar's (u, N) by a linear one. One sweep from the left end keeps the
// two-dimensional space of states that satisfy every condition met so far
// (one for the bar), a second sweep does the same from the right, and a unit
// load at s joins a state of each across the jump it makes: one 4 × 4 system
// per stretch, factorized once, whose right-hand side is cubic in s. So the
// influence line of any quantity at any point is piecewise cubic in the load
// position, known exactly, with its pieces' coefficients found in time
// proportional to the number of key points: no solve per load position and
// no mesh. This is the reciprocal (Maxwell–Betti, Müller-Breslau)
// construction done once for all quantities: the influence line of the
// deflection at x is the deflected shape under a unit load at x, that of a
// reaction the shape under a unit settlement of the support, that of a
// moment the shape under a unit relative rotation at x.
//
// The finite element influence line (FELine) is the other way round: one
// solve per unit-load position on one factorization (fem.Member.Structure,
// fem.Structure.Solve), the load at the fine mesh node nearest to each
// position as Stave places point loads. Between loads at nodes the Hermite
// beam elements hold the exact solution, so the two agree at nodes to
// round-off; the tests check one against the other and both against the
// handbook closed forms and against fem's exact solver (Maxwell–Betti and
// Müller-Breslau through ordinary solves).
//
// # Load trains
//
// A Train is a set of axle loads with spacings and an optional uniform load
// of given length, moving along a stated stretch of the member in one
// direction or both. Every position keeps the whole train on the stretch,
// unless it may drive off the member's ends. Its step only spaces the
// positions the window shows and steps through: the extremes take every
// position.
//
// The effect of a train at a station x is F(s) = Σ P_a·IL_x(s + e_a) plus
// q·∫IL_x over the uniform load, s the position of the front axle and e_a
// each axle's offset from it. Since IL_x is piecewise cubic in the load
// position, F is piecewise cubic in s (quartic with a uniform load) between
// the positions where an axle or an end of the uniform load passes a key
// point or x itself. Envelope takes the largest and smallest of F on each
// such piece at its ends and at the roots of F′, evaluated exactly, a
// handful of evaluations per piece, so its cost grows with the stations,
// the axles and the key points but not with the step. Over many supports
// a station's lines die away within some tens of spans, so each station
// is filled and scanned only over the stretch where its lines matter
// (a window), the positions left out bounded: the cost then grows with
// the stations, not with the stations times the supports, and the
// extremes are those of every position (window.go).
//
// The worst value along the member lies between stations. For the moment
// (and the bending stress and the shear force beside an axle) it stands
// under an axle, and the moment under axle a, Σ P_b·G(s + e_a, s + e_b),
// is again a polynomial in s between the positions where a load passes a
// key point (of degree 4, 5 with a uniform load: G is linear in the point
// read within a stretch and cubic in the load's place), which axlePeaks
// fits through samples and maximizes exactly; Envelope.Peak climbs and
// closes in on the rest.
//
// Results are an aid for checking: a qualified engineer must review them,
// and local codes and licensed practice govern any design decision.
package moving
