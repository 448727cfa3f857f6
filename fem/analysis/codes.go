package analysis

// Code names a kind of finding for programs that read Stave's output (the
// warnings of `stave solve --json`, the comment rows of a results table).
// Codes are stable: a new kind of finding gets a new code, and no code
// changes its meaning. Codes is the one table of them; docs/json.md lists
// the same, and a test keeps the two in step.
type Code string

// The codes, in the order of Codes.
const (
	CodeNoResults         Code = "no_results"
	CodeMechanism         Code = "mechanism"
	CodeEquilibrium       Code = "equilibrium"
	CodeCondition         Code = "condition"
	CodeDesignFail        Code = "design_fail"
	CodeDesignCaution     Code = "design_caution"
	CodeNoExact           Code = "no_exact"
	CodeCoarseMesh        Code = "coarse_mesh"
	CodeLargeDisplacement Code = "large_displacement"
	CodeFEError           Code = "fe_error"
	CodeHandbook          Code = "handbook"
	CodeMaterial          Code = "material"
	CodeDesignNotChecked  Code = "design_not_checked"
	CodeNotVerified       Code = "not_verified"
	CodeDesignWithinLimit Code = "design_within_limit"
	CodeVerified          Code = "verified"
	CodePending           Code = "pending"
	CodeTrainNotChecked   Code = "train_not_checked"
	CodeTrainNotPlaced    Code = "train_not_placed"
	CodeSelfWeightUnused  Code = "self_weight_unused"
)

// CodeInfo describes one code: the severity its findings have, whether it
// marks the results as unreliable, and what it means.
type CodeInfo struct {
	Code       Code
	Severity   Severity
	Unreliable bool
	Meaning    string
}

// Codes is every code with its severity and meaning.
var Codes = []CodeInfo{
	{CodeNoResults, Fail, true, "the model cannot be solved as given: there are no results (the message names the item and what to do)"},
	{CodeMechanism, Fail, true, "the supports leave the member free to move (a mechanism): there are no results"},
	{CodeEquilibrium, Fail, true, "the reactions of the finite element or of the exact solution do not balance the loads: the results cannot be trusted"},
	{CodeCondition, Caution, true, "the solver's equations are ill-conditioned: round-off may spoil the results"},
	{CodeDesignFail, Fail, false, "a design check (stress, deflection, buckling) is beyond its limit: the member is too weak for the limits given"},
	{CodeDesignCaution, Caution, false, "a design check asks to be looked at"},
	{CodeNoExact, Caution, false, "there is no exact solution of the model: the headline values are the finite element ones, and a peak between nodes may be missed"},
	{CodeCoarseMesh, Caution, false, "a finite element extreme is further from the exact one than the default mesh's accuracy (0.5 % of the field's largest magnitude): the headline values are exact, the finite element ones are the mesh's approximation"},
	{CodeLargeDisplacement, Caution, false, "the largest displacement exceeds a tenth of the member's length, or the largest rotation 0.1 rad: the small-displacement (linear) theory the results rest on does not hold there; check the model's units and magnitudes"},
	{CodeFEError, Caution, false, "the finite element stresses differ from the exact ones by more than the error limit somewhere along the member"},
	{CodeHandbook, Caution, false, "a value differs from the handbook's for the standard case the model matches"},
	{CodeMaterial, Caution, false, "a material property is far from typical values: check its units"},
	{CodeDesignNotChecked, Note, false, "a design check could not be made (no allowable stress given, a buckling length that is not a standard case...)"},
	{CodeNotVerified, Note, false, "a verification of the answer could not be made"},
	{CodeDesignWithinLimit, OK, false, "a design check is within its limit (a finding about the member, not an approval)"},
	{CodeVerified, OK, false, "a verification of the answer (equilibrium, error against the exact solution, handbook) agrees"},
	{CodePending, Pending, false, "the exact solution and the checks follow (the window, while the drawing moves)"},
	{CodeTrainNotChecked, Caution, false, "a moving load train is left out of the design checks and the drawn results: a combination takes it (the checks and the drawn envelope take the combination's cases alone), or no combination does (they take the member's own loads and cases alone); the train's part is in the trains' results"},
	{CodeSelfWeightUnused, Caution, false, "the model gives gravity for self-weight, but no load case takes it: the member's own weight acts in none"},
	{CodeTrainNotPlaced, Caution, false, "a moving load train could not be placed on the member (the message says why: it does not fit, say): the trains' results leave it out"},
}

// Finding is a finding of code c, with the severity and reliability the
// code has, for findings made outside the analysis (the moving load
// trains').
func (c Code) Finding(name, message string) Finding { return finding(c, name, message) }

// info is the entry of Codes for c.
func (c Code) info() CodeInfo {
	for _, i := range Codes {
		if i.Code == c {
			return i
		}
	}
	return CodeInfo{Code: c}
}
