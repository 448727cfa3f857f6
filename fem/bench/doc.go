// Package bench measures how fast and how lean fem's solve path is, and
// compares its banded kernel with gonum's solvers on the very same linear
// systems.
//
// # What is measured
//
// For a bar model and a beam model (mixed loads, several supports) at each
// requested number of elements, Run times, as separate parts:
//
//   - mesh: fem.BuildMesh;
//   - solve: fem.SolveOnMesh, the bar and the beam problem (validation, the
//     key-point systems, the hierarchical refinement between key points,
//     reactions, equilibrium, condition estimate);
//   - fields: fem.Summarize (one walk over the elements for the extremes
//     of the fields in closed form, plus the reactions);
//
// and their sum, the end-to-end total. Memory is measured in a separate,
// untimed pass: the bytes allocated and the peak growth of the heap in use,
// both per element.
//
// SolveOnMesh solves fine meshes in a hierarchical basis: it factorizes only
// the small system of the key points with band.LDL and finds the nodes
// between them in O(n) without elimination. The kernel comparison therefore
// runs on a system the benchmark assembles itself (Assemble): the ordinary
// fine-mesh system of linear bar or Hermite beam elements, with the same
// consistent loads on the same mesh and the supports applied as fem applies
// them, which is what any direct banded solve of the model would face. On
// that identical system it times band.LDL (FactorizeSolve), gonum's
// banded Cholesky (lapack64.Pbtrf + Pbtrs), gonum's dense Cholesky up to a
// few thousand unknowns, and one copy of the band array, the memory floor no
// factorization of a band can beat. Pbtrs's solution is compared with ours
// and with the displacements fem.SolveOnMesh returned, in the diagonal
// scaling that Cholesky's error bounds are stated in, against a tolerance
// that grows with the estimated condition number. The fine beam system
// becomes singular to working precision from about 1e5 elements; the report
// says so rather than compare noise, and times the kernels there on a
// stand-in of the same size and band, the matrix with its diagonal doubled.
//
// A pitfall row times mat.BandCholesky.Factorize, whose built-in condition
// estimate grows quadratically with the number of unknowns, against Pbtrf.
// Finally a request far beyond the machine's memory is sent to fem.Solve to
// show that it is refused with an estimate instead of attempted.
//
// The pipeline table times what `stave solve --json` waits for on the same
// two models, stage by stage: reading the model file (storage.Unmarshal),
// the mesh, the solve, the exact solution, the one walk over the elements
// that feeds the extremes, the comparison with the exact solution and the
// checks' probes, with the checks, as analysis.Finish makes it, and the
// summary as JSON; each stage's share of the whole, and everything after
// the solve over the solve (post_over_solve). The walk's three parts are
// also timed each in a walk of its own, to show where its time goes.
// The key-point table times analysis.Solve and analysis.Finish on a beam of
// 10,000 elements carrying 10 to 10,000 point loads (KeyPointModel), and
// fits the growth of the time with their number (keypoint_exponent).
//
// Every timing is the median of several repetitions; operations shorter than
// Config.MinBatch are repeated in a batch and the batch time divided. Times
// are wall-clock seconds on whatever else the machine is doing, so a report
// states the number of cores and the Go version beside its numbers.
//
// Targets (ratios, the scaling exponent, bytes per element, the 1e6-element
// beam end to end) are reported as PASS or FAIL; nothing here asserts them.
package bench
