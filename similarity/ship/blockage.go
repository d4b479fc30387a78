package ship

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// TankSection is the rectangular cross-section of a towing tank: its
// width b and its water depth h.
type TankSection struct {
	Width, Depth quantity.Quantity
}

// BlockageCorrection is the mean-flow blockage correction of one towed
// run: how much faster the water passes the model than the carriage
// moves, because the model narrows the tank's section and the free
// surface falls beside it.
type BlockageCorrection struct {
	// Blockage is m = A_x/(b·h), the model's largest underwater section
	// over the tank's section.
	Blockage float64
	// DepthFroude is Fh = V/√(g·h) at the measured speed.
	DepthFroude float64
	// LinearCorrection is the linearised speed correction
	// ΔV/V = m/(1 − m − Fh²).
	LinearCorrection float64
	// SpeedCorrection is the speed correction ΔV/V (ITTC's "speed
	// correction due to blockage") from the full one-dimensional
	// equations (see TankBlockage); the correction applied.
	SpeedCorrection float64
	// Speed is the corrected speed V·(1 + ΔV/V): the speed in unbounded
	// water at which the model would meet the measured resistance.
	Speed quantity.Quantity
	// SurfaceDrop is Δh, the mean fall of the free surface beside the
	// model.
	SurfaceDrop quantity.Quantity
	// CTFactor is (V/(V + ΔV))², the factor that refers a resistance
	// coefficient on the measured speed to the corrected speed.
	CTFactor float64
	// ChokingSpeed is the carriage speed at which the one-dimensional
	// flow past the model becomes critical and no steady solution exists
	// (the limiting speed of a body in a channel).
	ChokingSpeed quantity.Quantity
}

// TankBlockage returns the mean-flow (one-dimensional) blockage
// correction of a model of largest underwater cross-section ax towed at
// speed v in a tank of the given section, g being the acceleration of
// gravity (g_n if zero).
//
// The water passing the model is taken as uniform over the reduced
// section: continuity, V·b·h = (V + ΔV)·(b·(h − Δh) − A_x), and Bernoulli
// along the free surface, g·Δh = V·ΔV + ΔV²/2, give with s = 1 + ΔV/V the
// cubic (Fh²/2)·s³ − (1 − m + Fh²/2)·s + 1 = 0, whose smallest root above
// 1 is the subcritical solution; its linearisation is
// ΔV/V = m/(1 − m − Fh²). This is the one-dimensional theory of a body in
// a channel (as in Schijf's canal theory; from memory), and the same
// mean-flow term leads the trade's published tank-blockage methods
// (Schuster's, from memory), which add wave and shape terms that this
// function does not. The ITTC Recommended Procedure 7.5-02-02-01
// (Resistance Test, §3.6.3) treats the blockage and finite-depth
// corrections and defines m = A_x/A as here.
// The correction is refused (an *Error) when the speed is
// at or above the choking speed, where the model would ride a critical
// flow and no correction holds, or when m exceeds 0.1.
//
// The correction is applied by giving the measured resistance to the
// corrected speed; HullTest.WithBlockage does so for every run.
func TankBlockage(tank TankSection, ax, v, g quantity.Quantity) (BlockageCorrection, error) {
	const method = "tank blockage correction"
	g, bad := similarity.GravityOr(g)
	if bad != nil {
		return BlockageCorrection{}, fail(method, bad)
	}
	if err := fail(method, similarity.CheckInputs(true,
		similarity.Input{Name: "tank width", Value: tank.Width, Dim: quantity.Length},
		similarity.Input{Name: "tank depth", Value: tank.Depth, Dim: quantity.Length},
		similarity.Input{Name: "model section", Value: ax, Dim: quantity.Area},
		similarity.Input{Name: "speed", Value: v, Dim: quantity.Velocity})); err != nil {
		return BlockageCorrection{}, err
	}
	h := tank.Depth.Value()
	m := ax.Value() / (tank.Width.Value() * h)
	if !(m <= 0.1) {
		return BlockageCorrection{}, &Error{Op: method, Fault: similarity.Invalid("", fmt.Sprintf("blockage m = A_x/(b·h) = %.4g: above 0.1 a mean-flow correction is not meaningful; use a larger tank or a smaller model", m))}
	}
	// √g·√h rather than √(g·h), and Fh before its square, so that
	// extreme finite inputs do not overflow an intermediate product.
	celerity := math.Sqrt(g.Value()) * math.Sqrt(h)
	fh := v.Value() / celerity
	fh2 := fh * fh
	var r BlockageCorrection
	r.Blockage, r.DepthFroude = m, fh
	fhc := chokingFroude(m)
	r.ChokingSpeed = quantity.New(fhc*celerity, quantity.Velocity)
	if !(r.DepthFroude < fhc) {
		return r, &Error{Op: method, Fault: similarity.Invalid("", fmt.Sprintf("depth Froude number %.4g at or above the choking value %.4g (m = %.4g): no steady mean flow past the model", r.DepthFroude, fhc, m))}
	}
	r.LinearCorrection = m / (1 - m - fh2)
	s, err := meanFlowRoot(m, fh2)
	if err != nil {
		return r, &Error{Op: method, Fault: similarity.Caused("blockage m", "no mean-flow speed", err)}
	}
	r.SpeedCorrection = s - 1
	r.Speed = quantity.New(v.Value()*s, quantity.Velocity)
	du := v.Value() * r.SpeedCorrection
	r.SurfaceDrop = quantity.New((v.Value()*du+du*du/2)/g.Value(), quantity.Length)
	r.CTFactor = 1 / (s * s)
	if !allFinite(r.Blockage, r.DepthFroude, r.LinearCorrection, r.SpeedCorrection, r.Speed.Value(), r.SurfaceDrop.Value(),
		r.CTFactor, r.ChokingSpeed.Value()) || !(celerity > 0) {
		return BlockageCorrection{}, &Error{Op: method, Fault: similarity.Invalid("", fmt.Sprintf("the correction is not finite for tank %v × %v, section %v, speed %v, g = %v (inputs beyond any tank)",
			tank.Width, tank.Depth, ax, v, g))}
	}
	return r, nil
}

// meanFlowCubic is (Fh²/2)·s³ − (1 − m + Fh²/2)·s + 1, zero at the
// one-dimensional solution s = 1 + ΔV/V.
func meanFlowCubic(s, m, fh2 float64) float64 {
	return fh2/2*s*s*s - (1-m+fh2/2)*s + 1
}

// meanFlowRoot returns the subcritical root s of the mean-flow cubic
// f(s). f is convex for s > 0, is (Fh²/2)·(s₀³ − s₀) ≥ 0 at
// s₀ = 1/(1 − m) (the root without a free surface), and falls to its
// minimum at s* = √((2(1 − m) + Fh²)/(3·Fh²)), negative below the
// choking Froude number; Newton's method from s₀ therefore climbs to the root from the
// left without overshooting.
func meanFlowRoot(m, fh2 float64) (float64, error) {
	s := 1 / (1 - m)
	for range 100 {
		f := meanFlowCubic(s, m, fh2)
		df := 1.5*fh2*s*s - (1 - m + fh2/2)
		if !(df < 0) {
			return 0, fmt.Errorf("mean-flow equation has no subcritical root (Fh² = %.4g, m = %.4g)", fh2, m)
		}
		next := s - f/df
		if next <= s {
			return s, nil
		}
		s = next
	}
	return s, nil
}

// chokingFroude returns the depth Froude number at which the mean-flow
// cubic's minimum touches zero: the flow past a body of blockage m
// becomes critical. Eliminating s* gives 1 − m + Fh²/2 = (3/2)·Fh^(2/3),
// the one-dimensional limiting speed; with x = Fh^(2/3) it is the cubic
// x³ − 3x + 2(1 − m) = 0, whose root in (0, 1) is, by the trigonometric
// solution, x = 2·cos((arccos(m − 1) − 2π)/3).
func chokingFroude(m float64) float64 {
	x := 2 * math.Cos((math.Acos(m-1)-2*math.Pi)/3)
	return x * math.Sqrt(x)
}

// WithBlockage returns a copy of the test whose run speeds are corrected
// for the tank's blockage by TankBlockage (the measured resistances are
// given to the corrected speeds), and the correction of every run. The
// model's largest underwater cross-section is ax; the test's Gravity is
// used. Every coefficient, Froude and Reynolds number of the returned
// test's extrapolation is then on the corrected speed.
func (t HullTest) WithBlockage(tank TankSection, ax quantity.Quantity) (HullTest, []BlockageCorrection, error) {
	out := t
	out.Speeds = make([]quantity.Quantity, len(t.Speeds))
	corr := make([]BlockageCorrection, len(t.Speeds))
	for i, v := range t.Speeds {
		c, err := TankBlockage(tank, ax, v, t.Gravity)
		if err != nil {
			return HullTest{}, nil, fmt.Errorf("run %d: %w", i+1, err)
		}
		corr[i] = c
		out.Speeds[i] = c.Speed
	}
	return out, corr, nil
}
