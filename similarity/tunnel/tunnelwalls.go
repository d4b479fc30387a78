package tunnel

import (
	"fmt"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// MaxWallCorrectionMach is the highest test-section Mach number at which
// CorrectWalls2D and CorrectWalls3D apply their compressible
// (Prandtl–Glauert-type) corrections. The corrections are linear
// (subsonic small-perturbation) theory: as Ma nears 1 the factors
// 1/(1 − Ma²)^(3/2) grow without bound and the flow over a model turns
// locally supersonic, where no linear correction holds. 0.8 is the bound
// commonly used for them (common practice); at it the solid blockage is
// already 4.6 times its incompressible value. Above it, a
// *Error of class quantity.ErrRange: use ventilated walls and a wall-pressure
// (measured-boundary) method.
const MaxWallCorrectionMach = 0.8

// MaxBlockage is the largest total blockage ε (after the compressibility
// factors) the first-order corrections accept: at ε = 0.1 the neglected
// second-order terms are about ε² = 1 % of the dynamic pressure, as
// large as the effects being corrected are small.
const MaxBlockage = 0.1

// Bounds on the measured values the corrections take: no force or
// moment coefficient of a model in a closed test section reaches 10, and
// an angle of attack beyond ±90° is not one.
const (
	maxCoefficient = 10.0
	maxAlphaDeg    = 90.0
	maxSlope       = 1.0 // per degree, for ∂C_m/∂α_t
)

// checkCoefficients refuses a measured value outside its bound (and
// NaN), naming it.
func checkCoefficients(method string, vals ...bound) error {
	for _, c := range vals {
		if !(c.v >= c.lo && c.v <= c.hi) {
			return rangeError(method, c.name, c.v, c.lo, c.hi, "")
		}
	}
	return nil
}

// bound is a named value and its closed range.
type bound struct {
	name      string
	v, lo, hi float64
}

// compressibility returns β = √(1 − Ma²) for a test-section Mach number
// in 0 … MaxWallCorrectionMach.
func compressibility(method string, ma float64) (float64, error) {
	if !(ma >= 0 && ma <= MaxWallCorrectionMach) {
		return 0, rangeError(method, "test-section Mach number", ma, 0, MaxWallCorrectionMach, "the linear compressible corrections do not hold there; use ventilated walls and a wall-pressure method")
	}
	return math.Sqrt(1 - ma*ma), nil
}

// Section2D is a two-dimensional (wall-to-wall) airfoil test in a closed
// test section: the measured, uncorrected coefficients and the geometry.
type Section2D struct {
	Chord, Height quantity.Quantity // model chord c, test-section height h
	// ShapeFactor is the body-shape factor Λ of the section for solid
	// blockage (from the section's thickness distribution; about 0.2 to
	// 0.3 for common 12 % sections).
	ShapeFactor float64
	// AlphaDeg is the geometric angle of attack (degrees).
	AlphaDeg float64
	// CL, CD and CM (about the quarter chord) are the measured
	// coefficients on the uncorrected dynamic pressure.
	CL, CD, CM float64
	// Mach is the test section's uncorrected Mach number, 0 …
	// MaxWallCorrectionMach; 0 gives the incompressible corrections.
	Mach float64
}

// Corrected2D is a two-dimensional test corrected for the tunnel walls,
// with every term.
type Corrected2D struct {
	Sigma      float64 // streamline curvature σ = (π²/48)(c/h)²
	Beta       float64 // β = √(1 − Ma²), 1 in incompressible flow
	SolidBlock float64 // ε_sb = Λσ/β³
	WakeBlock  float64 // ε_wb = (c/4h)·C_du·(1 + 0.4Ma²)/β²
	Blockage   float64 // ε = ε_sb + ε_wb
	// VelocityFactor is V/V_u = 1 + ε; MachFactor Ma/Ma_u = 1 + (1 + 0.2Ma²)ε,
	// ReynoldsFactor Re/Re_u = 1 + (1 − 0.7Ma²)ε (both γ = 1.4; all three
	// equal 1 + ε at Ma = 0).
	VelocityFactor, MachFactor, ReynoldsFactor float64
	DynamicPressureFactor                      float64 // q/q_u = 1 + (2 − Ma²)ε
	AlphaDeg                                   float64 // α = α_u + (57.3σ/(2πβ))(C_lu + 4C_m¼u) (degrees)
	CL, CD, CM                                 float64 // corrected coefficients
	DeltaAlphaDeg                              float64 // α − α_u (degrees)
	ChordToHeight                              float64 // c/h
}

// CorrectWalls2D applies the classical closed-test-section corrections
// for a two-dimensional airfoil test (solid and wake blockage,
// streamline curvature), as the standard compendium of low-speed tunnel
// testing gives them (Barlow, Rae and Pope, Low-Speed Wind Tunnel Testing,
// 3rd ed., ch. 9; formulas quoted from memory), with β = √(1 − Ma²) at
// the test section's Mach number:
//
//	ε_sb = Λσ/β³,  ε_wb = (c/4h)·C_du·(1 + 0.4Ma²)/β²,  ε = ε_sb + ε_wb,
//	q = q_u[1 + (2 − Ma²)ε],
//	C_l = C_lu[1 − σ/β² − (2 − Ma²)ε],  C_m¼ = C_m¼u[1 − (2 − Ma²)ε] + σC_l/(4β²),
//	C_d = C_du[1 − (3 − Ma²)ε_sb − (2 − Ma²)ε_wb],  α = α_u + (57.3σ/(2πβ))(C_lu + 4C_m¼u).
//
// The blockage factors 1/β³ and (1 + 0.4Ma²)/β² and the curvature
// factors are the Prandtl–Glauert-type results of linear compressible
// theory that the compendium quotes (from memory). The dynamic-pressure,
// Mach and Reynolds factors follow to first order in ε from the
// isentropic relations (dρ/ρ = −Ma²·dV/V, dT/T = −0.4Ma²·dV/V for
// γ = 1.4, μ ∝ T^0.75), q = ρV²/2 giving 1 + (2 − Ma²)ε; the drag keeps
// the incompressible horizontal-buoyancy term ε_sb·C_du. At Ma = 0 all
// reduce to the incompressible corrections.
//
// The corrections are small-perturbation results: a chord above 0.4 of
// the height, a Mach number above MaxWallCorrectionMach, a blockage above
// MaxBlockage, a coefficient beyond ±10 or an angle beyond ±90° are
// refused.
func CorrectWalls2D(s Section2D) (Corrected2D, error) {
	const method = "2-D wall correction"
	m := func(r string) error {
		return &Error{Op: method, Fault: similarity.Invalid("", r)}
	}
	if err := fail(method, similarity.CheckInputs(true,
		similarity.Input{Name: "chord", Value: s.Chord, Dim: quantity.Length},
		similarity.Input{Name: "test-section height", Value: s.Height, Dim: quantity.Length})); err != nil {
		return Corrected2D{}, err
	}
	c, h := s.Chord.Value(), s.Height.Value()
	ch := c / h
	if ch > 0.4 {
		return Corrected2D{}, m(fmt.Sprintf("c/h = %.3g: above 0.4 the classical corrections do not hold; use a smaller model or a wall-pressure method", ch))
	}
	if !(ch > 0) {
		return Corrected2D{}, m(fmt.Sprintf("c/h = %.3g: a chord that small against the height is no model", ch))
	}
	if !(s.ShapeFactor >= 0 && s.ShapeFactor < 2) {
		return Corrected2D{}, m("the shape factor must lie in 0 … 2 and the coefficients be finite")
	}
	// The Mach number first: above MaxWallCorrectionMach no correction
	// holds, whatever the other inputs say.
	beta, err := compressibility(method, s.Mach)
	if err != nil {
		return Corrected2D{}, err
	}
	if err := checkCoefficients(method, bound{"angle of attack (°)", s.AlphaDeg, -maxAlphaDeg, maxAlphaDeg},
		bound{"C_l", s.CL, -maxCoefficient, maxCoefficient}, bound{"C_d", s.CD, -maxCoefficient, maxCoefficient},
		bound{"C_m¼", s.CM, -maxCoefficient, maxCoefficient}); err != nil {
		return Corrected2D{}, err
	}
	m2, b2 := s.Mach*s.Mach, beta*beta
	var r Corrected2D
	r.ChordToHeight = ch
	r.Beta = beta
	r.Sigma = math.Pi * math.Pi / 48 * ch * ch
	r.SolidBlock = s.ShapeFactor * r.Sigma / (b2 * beta)
	r.WakeBlock = c / (4 * h) * s.CD * (1 + 0.4*m2) / b2
	r.Blockage = r.SolidBlock + r.WakeBlock
	if !(math.Abs(r.Blockage) <= MaxBlockage) {
		return Corrected2D{}, rangeError(method, "blockage ε", r.Blockage, -MaxBlockage, MaxBlockage, "beyond first-order corrections; use a smaller model or a wall-pressure method")
	}
	r.VelocityFactor = 1 + r.Blockage
	r.MachFactor = 1 + (1+0.2*m2)*r.Blockage
	r.ReynoldsFactor = 1 + (1-0.7*m2)*r.Blockage
	r.DynamicPressureFactor = 1 + (2-m2)*r.Blockage
	r.DeltaAlphaDeg = 57.3 * r.Sigma / (2 * math.Pi * beta) * (s.CL + 4*s.CM)
	r.AlphaDeg = s.AlphaDeg + r.DeltaAlphaDeg
	r.CL = s.CL * (1 - r.Sigma/b2 - (2-m2)*r.Blockage)
	r.CM = s.CM*(1-(2-m2)*r.Blockage) + r.Sigma*r.CL/(4*b2)
	r.CD = s.CD * (1 - (3-m2)*r.SolidBlock - (2-m2)*r.WakeBlock)
	return r, nil
}

// Model3D is a three-dimensional (complete or half) model on a balance in
// a closed test section: the uncorrected coefficients on the uncorrected
// dynamic pressure and the factors the corrections need, read by the
// engineer from the compendium's charts for this tunnel and model.
type Model3D struct {
	WingArea    quantity.Quantity // S, the reference area of the coefficients
	TunnelArea  quantity.Quantity // C, the test section's cross-section
	ModelVolume quantity.Quantity // the model's volume, for solid blockage
	// ShapeFactor is K·τ₁ of the solid-blockage formula (body-shape factor
	// times tunnel-shape factor; about 0.8 … 0.9 for a wing-body in a
	// rectangular section).
	ShapeFactor float64
	// Delta is the boundary-correction factor δ of the downwash correction
	// (0.125 for a small wing in a closed circular section; from the
	// charts for the section's shape and the span ratio).
	Delta float64
	// AlphaDeg (degrees), CL, CD and CM are the measured, uncorrected
	// values, CM about the quarter point of the mean aerodynamic chord:
	// the curvature correction's moment term is about that point, so a
	// balance moment about another reference is transferred there first.
	AlphaDeg, CL, CD, CM float64
	// CurvatureFactor is τ₂ of the wing's streamline-curvature
	// correction, read from the compendium's chart at a distance of a
	// quarter of the mean chord behind the quarter-chord point; zero
	// leaves the curvature correction out. LiftSlopePerDeg is the wing's
	// dC_L/dα (per degree), which the lift correction needs.
	CurvatureFactor, LiftSlopePerDeg float64
	// TailCurvatureFactor is τ₂ at the tail's distance behind the wing
	// and TailMomentSlopePerDeg the pitching-moment slope ∂C_m/∂α_t (per
	// degree of tail angle, from tail-on and tail-off runs); zero
	// TailMomentSlopePerDeg leaves the tail correction out.
	TailCurvatureFactor, TailMomentSlopePerDeg float64
	// Mach is the test section's uncorrected Mach number, 0 …
	// MaxWallCorrectionMach; 0 gives the incompressible corrections. In
	// compressible flow τ₂ and τ₂,t are read from the charts at the
	// streamwise distances divided by β = √(1 − Ma²); they are used as
	// given.
	Mach float64
}

// Corrected3D is a three-dimensional test corrected for the tunnel walls,
// with every term.
type Corrected3D struct {
	Beta                  float64 // β = √(1 − Ma²), 1 in incompressible flow
	SolidBlock            float64 // ε_sb = K·τ₁·V/(C^(3/2)·β³)
	WakeBlock             float64 // ε_wb = (S/4C)·C_Du·(1 + 0.4Ma²)/β²
	Blockage              float64 // ε = ε_sb + ε_wb
	DynamicPressureFactor float64 // q/q_u = (1 + ε)²(1 − Ma²ε)
	DeltaAlphaDeg         float64 // 57.3·δ·(S/C)·C_L (degrees; upwash-free angle)
	DeltaCD               float64 // δ·(S/C)·C_L², the induced-drag correction
	// DeltaAlphaCurvatureDeg is the wing's streamline-curvature angle
	// correction τ₂·δ·(S/C)·C_L·57.3 (degrees), DeltaCLCurvature the lift
	// correction −Δα_sc·a and DeltaCMCurvature the quarter-chord moment
	// correction −0.25·ΔC_L,sc.
	DeltaAlphaCurvatureDeg, DeltaCLCurvature, DeltaCMCurvature float64
	// TailAngleDeg is the extra angle the tail meets in the tunnel,
	// τ₂,t·δ·(S/C)·C_L·57.3 (degrees), and DeltaCMTail the moment
	// correction −(∂C_m/∂α_t)·TailAngleDeg.
	TailAngleDeg, DeltaCMTail float64
	AlphaDeg                  float64 // α = α_u + Δα + Δα_sc (degrees)
	CL, CD, CM                float64 // on the corrected dynamic pressure, with the curvature, drag and tail terms; CM about the quarter chord
}

// CorrectWalls3D applies the classical closed-test-section corrections to
// a three-dimensional model: solid blockage (a Thom-type
// ε_sb = K·τ₁·V/C^(3/2)), wake blockage ε_wb = (S/4C)·C_Du, the
// coefficients referred to the corrected dynamic pressure
// q = q_u(1 + ε)², and Glauert's boundary (downwash) correction of angle
// and drag with the factor δ: Δα = 57.3·δ·(S/C)·C_L,
// ΔC_D = δ·(S/C)·C_L² (Barlow, Rae and Pope, Low-Speed Wind Tunnel
// Testing, 3rd ed., ch. 10; formulas quoted from memory).
//
// At a test-section Mach number Ma the blockages take the linear
// compressible factors of the same compendium (from memory): ε_sb is
// divided by β³ and ε_wb multiplied by (1 + 0.4Ma²)/β², β = √(1 − Ma²);
// the dynamic pressure is q = q_u(1 + ε)²(1 − Ma²ε), the density falling
// by Ma²ε as the velocity rises by ε (isentropic flow), which is the
// first-order q_u[1 + (2 − Ma²)ε] and exactly the incompressible
// (1 + ε)² at Ma = 0. The downwash factor δ is taken as independent of
// the Mach number (the wall upwash at the wing is set by the trailing
// vortices far downstream, which the Prandtl–Glauert stretch along the
// stream leaves alone; from memory); the curvature factors are read at
// stretched distances (see Model3D.Mach).
//
// With the factors given, it adds the streamline-curvature corrections
// of the same compendium (quoted from memory): the walls' upwash grows
// along the chord, so the wing meets a curved stream, which adds an angle
// Δα_sc = τ₂·δ·(S/C)·C_L·57.3 and a camber-like lift −ΔC_L,sc
// (ΔC_L,sc = −Δα_sc·a) acting at mid-chord (ΔC_m¼ = −0.25·ΔC_L,sc); and
// behind the wing the upwash has grown further, so the tail meets an
// angle τ₂,t·δ·(S/C)·C_L·57.3 larger than the corrected α implies and
// its moment is corrected by −(∂C_m/∂α_t) times that angle. The factors
// δ, τ₂ and τ₂,t are read from the compendium's charts for the section
// and the model; the results are only as good as those readings. A model
// whose reference area exceeds a fifth of the test section's, a Mach
// number above MaxWallCorrectionMach, a blockage above MaxBlockage, a
// coefficient beyond ±10 or an angle beyond ±90° is refused.
func CorrectWalls3D(m Model3D) (Corrected3D, error) {
	const method = "3-D wall correction"
	e := func(r string) error {
		return &Error{Op: method, Fault: similarity.Invalid("", r)}
	}
	for _, c := range []struct {
		name string
		q    quantity.Quantity
		d    quantity.Dim
	}{{"wing area", m.WingArea, quantity.Area}, {"tunnel area", m.TunnelArea, quantity.Area}, {"model volume", m.ModelVolume, quantity.Volume}} {
		if err := c.q.CheckNamed(c.name, c.d); err != nil {
			return Corrected3D{}, err
		}
		if !(c.q.Value() >= 0) || math.IsInf(c.q.Value(), 0) {
			return Corrected3D{}, e(c.name + " must be finite and not negative")
		}
	}
	s, c, v := m.WingArea.Value(), m.TunnelArea.Value(), m.ModelVolume.Value()
	if !(s > 0 && c > 0) {
		return Corrected3D{}, e("the wing and tunnel areas must be positive")
	}
	sc := s / c
	if sc > 0.2 {
		return Corrected3D{}, e(fmt.Sprintf("S/C = %.3g: above 0.2 the classical corrections do not hold; use a smaller model", sc))
	}
	if !(sc > 0) {
		return Corrected3D{}, e(fmt.Sprintf("S/C = %.3g: a wing that small against the section is no model", sc))
	}
	if !(m.ShapeFactor >= 0 && m.ShapeFactor < 2) || !(m.Delta >= 0 && m.Delta < 1) || !(m.CurvatureFactor >= 0 && m.CurvatureFactor < 2) ||
		!(m.TailCurvatureFactor >= 0 && m.TailCurvatureFactor < 2) {
		return Corrected3D{}, e("the factors must lie in their ranges (K·τ₁ 0 … 2, δ 0 … 1, τ₂ 0 … 2)")
	}
	// The Mach number first: above MaxWallCorrectionMach no correction
	// holds, and a lift slope raised to such a Mach number by the
	// Prandtl–Glauert factor is no reason to give instead.
	beta, err := compressibility(method, m.Mach)
	if err != nil {
		return Corrected3D{}, err
	}
	if err := checkCoefficients(method, bound{"angle of attack (°)", m.AlphaDeg, -maxAlphaDeg, maxAlphaDeg},
		bound{"C_L", m.CL, -maxCoefficient, maxCoefficient}, bound{"C_D", m.CD, -maxCoefficient, maxCoefficient},
		bound{"C_m¼", m.CM, -maxCoefficient, maxCoefficient}, bound{"tail moment slope ∂C_m/∂α_t (per degree)", m.TailMomentSlopePerDeg, -maxSlope, maxSlope},
		bound{"lift slope dC_L/dα (per degree)", m.LiftSlopePerDeg, -maxSlope, maxSlope}); err != nil {
		return Corrected3D{}, err
	}
	if m.CurvatureFactor > 0 && !(m.LiftSlopePerDeg > 0 && m.LiftSlopePerDeg < 0.2) {
		return Corrected3D{}, slopeError(method, m.LiftSlopePerDeg)
	}
	m2, b2 := m.Mach*m.Mach, beta*beta
	var r Corrected3D
	r.Beta = beta
	r.SolidBlock = m.ShapeFactor * v / math.Pow(c, 1.5) / (b2 * beta)
	r.WakeBlock = s / (4 * c) * m.CD * (1 + 0.4*m2) / b2
	r.Blockage = r.SolidBlock + r.WakeBlock
	if !(math.Abs(r.Blockage) <= MaxBlockage) {
		return Corrected3D{}, rangeError(method, "blockage ε", r.Blockage, -MaxBlockage, MaxBlockage, "beyond first-order corrections; use a smaller model or a wall-pressure method")
	}
	r.DynamicPressureFactor = (1 + r.Blockage) * (1 + r.Blockage) * (1 - m2*r.Blockage)
	clq := m.CL / r.DynamicPressureFactor // on the corrected q
	r.DeltaAlphaDeg = 57.3 * m.Delta * s / c * clq
	r.DeltaCD = m.Delta * s / c * clq * clq
	r.DeltaAlphaCurvatureDeg = m.CurvatureFactor * r.DeltaAlphaDeg
	r.DeltaCLCurvature = -r.DeltaAlphaCurvatureDeg * m.LiftSlopePerDeg
	r.DeltaCMCurvature = -0.25 * r.DeltaCLCurvature
	r.TailAngleDeg = m.TailCurvatureFactor * r.DeltaAlphaDeg
	r.DeltaCMTail = -m.TailMomentSlopePerDeg * r.TailAngleDeg
	r.AlphaDeg = m.AlphaDeg + r.DeltaAlphaDeg + r.DeltaAlphaCurvatureDeg
	r.CL = clq + r.DeltaCLCurvature
	r.CD = m.CD/r.DynamicPressureFactor + r.DeltaCD
	r.CM = m.CM/r.DynamicPressureFactor + r.DeltaCMCurvature + r.DeltaCMTail
	return r, nil
}

// rangeError reports an input of a wall correction outside the range in
// which the correction holds (a Mach number above MaxWallCorrectionMach,
// a blockage above MaxBlockage, a coefficient no model shows), with what
// to do instead if anything: an *Error of class quantity.ErrRange.
func rangeError(method, what string, v, lo, hi float64, instead string) *Error {
	s := fmt.Sprintf("%s %s outside %s … %s", what, sigOutside(v, lo, hi), sig(lo, 6), sig(hi, 6))
	if instead != "" {
		s += ": " + instead
	}
	return &Error{Op: method, Fault: similarity.OutOfRange(what, s)}
}

// slopeError reports a lift slope the streamline-curvature correction
// cannot use: the wing's dC_L/dα in the linear range of its lift curve,
// above 0 and below 0.2 per degree (a thin wing's 2π per radian is
// 0.11 per degree). A slope at or below zero is a lift curve past the
// stall. It is an *Error of class quantity.ErrRange naming
// LiftSlopePerDeg.
func slopeError(method string, slope float64) *Error {
	why := "the curvature correction needs the wing's dC_L/dα in the linear range of its lift curve, above 0 and below 0.2 per degree"
	if slope <= 0 {
		why += "; a slope at or below zero is a lift curve past the stall"
	}
	return &Error{Op: method, Fault: similarity.OutOfRange("LiftSlopePerDeg",
		fmt.Sprintf("lift slope %s per degree: %s", sigOutside(slope, 0, 0.2), why))}
}

// sig formats x to n significant figures ('g' form): sig(0.25202992727, 4)
// is 0.252.
func sig(x float64, n int) string { return strconv.FormatFloat(x, 'g', n, 64) }

// sigOutside formats a value v that lies outside lo … hi (or is NaN)
// with the fewest significant figures, from 3 up to 17, at which the
// printed value still lies outside: 0.95 as 0.95, 0.80001 as 0.80001,
// not 0.8. A value inside the range is printed to 3 figures.
func sigOutside(v, lo, hi float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) || (v >= lo && v <= hi) {
		return sig(v, 3)
	}
	for n := 3; n < 17; n++ {
		s := sig(v, n)
		if r, err := strconv.ParseFloat(s, 64); err == nil && (r < lo || r > hi) {
			return s
		}
	}
	return sig(v, 17)
}
