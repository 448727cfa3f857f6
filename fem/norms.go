package fem

// ErrorNorms measure how far a finite element solution is from the exact one.
type ErrorNorms struct {
	MaxDeflection     float64 // max |w_h − w| over the member, m
	MaxAxial          float64 // max |u_h − u|, m
	MaxStress         float64 // max |σ_h − σ| of the combined stress, Pa
	MaxStressRelative float64 // MaxStress / max |σ|
	RelativeL2        float64 // ‖(u_h,w_h) − (u,w)‖₂ / ‖(u,w)‖₂
	RelativeEnergy    float64 // energy norm of the error / energy norm of the exact solution
}

// Compare measures the error of s against e.
func Compare(s *Solution, e *Exact) ErrorNorms { return ErrorNorms{} }
