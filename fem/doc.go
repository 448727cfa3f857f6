// Package fem analyses one straight structural member by finite elements.
//
// # What it solves
//
// The member runs along x from 0 to L. Two independent one-dimensional
// problems are solved on it:
//
//	bar:  −(EA (u' − αΔT))' = p      axial displacement u(x), axial load p per length
//	beam:  (EI w'')''       = q      deflection w(x), transverse load q per length
//
// with N = EA(u' − αΔT) (tension positive), M = EI·w” (sagging positive),
// V = dM/dx and dV/dx = q. Point forces and moments, support settlements,
// elastic springs, a uniform change of temperature and self-weight
// (ρ·A·g per length, from Model.Gravity) are the loads. A temperature
// difference ΔT through the depth h of a segment adds the free curvature
// α·ΔT/h to the beam; a segment may deform in shear (Timoshenko:
// V = κGA(w' − θ)); internal hinges release the moment, or hold it by a
// rotational spring; elastic (Winkler) foundations add k·w and k_a·u to the
// left-hand sides over their stretch. Load cases are solved on one
// factorization and combined by superposition into envelopes.
//
// # Sign conventions
//
// x runs along the member, y points up. Axial displacement u and axial loads
// are positive along +x; deflection w and transverse loads are positive up, so
// gravity loads are negative; rotations θ = dw/dx and moments are positive
// counter-clockwise. A simply supported beam under a downward uniform load
// therefore sags (M > 0) and has V > 0 at its left end. Bending stress is
// reported as M·c/I, positive for tension in the bottom fibre under sagging.
//
// # Units
//
// Everything inside fem is SI: m, N, Pa, kg/m³, K, rad. Conversion to other
// units happens only at the edges of the program (input fields, files,
// display); a quantity's unit is stated beside its declaration. Messages
// for the user quote values in SI base units, as a file holds them, or in
// the display units a caller passes (ValidateIn, PrepareIn: package
// fem/units formats them).
//
// # How the pieces fit
//
//	Model ─Prepare→ Member: validated once, KeyPoints, GatherLoads → Loads
//	  Member.Mesh (or MeshOn) → Mesh
//	  Member.Structure(mesh) → Structure: the key-point systems of the bar
//	      and the beam assembled (band.Symmetric) and factorized (band.LDL)
//	      once, with the supports applied
//	  Structure.Solve(loads) → hierarchical refinement of every stretch →
//	      displacements → reactions (statics), equilibrium, strain energy
//	      → Solution.At / Solution.Sample (fields)
//	  Member.Exact() → Exact: the closed-form solution of the same model
//	  Solution.Elements / Compare → one walk over the elements (walk.go:
//	      ElementView, the FE and exact polynomials of an element), with
//	      extremes, the largest gap and the error norms in closed form
//
// Solve, SolveOnMesh, BuildMesh, MeshFromNodes and SolveExact are the same
// steps for one call each. A Structure answers any number of load sets
// (load cases, unit loads) from one factorization. What a kind of element
// contributes (its unknowns, stiffness, consistent loads, how each quantity
// varies inside it, whether the hierarchical path applies) is its
// Formulation, one file per kind (bar.go, beam.go); the result quantities
// every output lists are the one table of quantity.go.
//
// Validate reports every problem of a model at once (*ValidationError).
// BuildMesh places nodes at every key point (ends, segment breaks, supports,
// point loads, load break points) and divides the stretches between them
// uniformly; MeshFromNodes takes caller-chosen nodes, for adaptive
// refinement. Bars use 2-node linear or 3-node quadratic elements, beams
// 2-node Hermite cubics; consistent nodal loads are integrated exactly by
// Gauss–Legendre quadrature.
//
// The finite element answer is the Galerkin solution on the whole mesh, but
// it is not found by factorizing the assembled fine-mesh stiffness: that
// matrix has a condition number growing like n⁴ for beams, and round-off
// would ruin a 10,000-element beam. Instead the mesh is written in a
// hierarchical basis (hierarchy.go). Within a stretch between key points EA
// and EI are constant and the loads are linear, and the functions added when
// an interval is split are energy-orthogonal to every coarser function, so
// the system falls apart into the small key-point system — assembled in
// banded symmetric storage and factorized by package band (fem/band:
// band.Symmetric, band.LDL) — and one 1×1
// (bar) or 2×2 (beam) block per inner node. The cost is linear in the number
// of elements and round-off does not grow with it; meshes of 4,096 elements
// or more are refined on two goroutines, with the same answer to the bit on
// any number of cores. Before factorizing, the
// supports are checked for rigid-body motions (*MechanismError); the
// condition number of the key-point systems is estimated in linear time, and
// Solution.Condition bounds the growth of round-off (relative error about
// Condition·ε), with a warning attached when results may be unreliable.
// Over an elastic foundation every node enters the key-point system, and
// its solution is refined iteratively with an accurate residual
// (groundrefine.go), so Condition there is what is left after refinement.
//
// Results are an aid for checking: a qualified engineer must review them, and
// local codes and licensed practice govern any design decision.
package fem
