package similarity

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
)

// Section2D is a two-dimensional (wall-to-wall) airfoil test in a closed
// test section: the measured, uncorrected coefficients and the geometry.
type Section2D struct {
	Chord, Height quantity.Quantity // model chord c, test-section height h
	// ShapeFactor is the body-shape factor Λ of the section for solid
	// blockage (from the section's thickness distribution; about 0.2 to
	// 0.3 for common 12 % sections).
	ShapeFactor float64
	// Alpha is the geometric angle of attack in degrees; CL, CD and CM
	// (about the quarter chord) the measured coefficients on the
	// uncorrected dynamic pressure.
	Alpha, CL, CD, CM float64
}

// Corrected2D is a two-dimensional test corrected for the tunnel walls,
// with every term.
type Corrected2D struct {
	Sigma                 float64 // streamline curvature σ = (π²/48)(c/h)²
	SolidBlock            float64 // ε_sb = Λσ
	WakeBlock             float64 // ε_wb = (c/4h)·C_du
	Blockage              float64 // ε = ε_sb + ε_wb
	VelocityFactor        float64 // V/V_u = 1 + ε (Re/Re_u the same)
	DynamicPressureFactor float64 // q/q_u = 1 + 2ε
	Alpha                 float64 // α = α_u + (57.3σ/2π)(C_lu + 4C_m¼u), degrees
	CL, CD, CM            float64 // corrected coefficients
	DeltaAlpha            float64 // α − α_u, degrees
	ChordToHeight         float64 // c/h
}

// CorrectWalls2D applies the classical closed-test-section corrections
// for a two-dimensional airfoil test (solid and wake blockage,
// streamline curvature), as the standard compendium of low-speed tunnel
// testing gives them (Barlow, Rae and Pope, Low-Speed Wind Tunnel Testing,
// 3rd ed., ch. 9; formulas quoted from memory):
//
//	C_l = C_lu(1 − σ − 2ε),  C_m¼ = C_m¼u(1 − 2ε) + σC_l/4,
//	C_d = C_du(1 − 3ε_sb − 2ε_wb),  α = α_u + (57.3σ/2π)(C_lu + 4C_m¼u).
//
// The corrections are small-perturbation results: a chord above about
// 0.4 of the height is refused, since they no longer hold.
func CorrectWalls2D(s Section2D) (Corrected2D, error) {
	m := func(r string) error { return &ExtrapolationError{Method: "2-D wall correction", Reason: r} }
	if err := s.Chord.CheckNamed("chord", quantity.Length); err != nil {
		return Corrected2D{}, err
	}
	if err := s.Height.CheckNamed("test-section height", quantity.Length); err != nil {
		return Corrected2D{}, err
	}
	c, h := s.Chord.Value(), s.Height.Value()
	if !(c > 0 && h > 0) || math.IsInf(c+h, 0) {
		return Corrected2D{}, m("chord and height must be positive and finite")
	}
	if c/h > 0.4 {
		return Corrected2D{}, m(fmt.Sprintf("c/h = %.3g: above 0.4 the classical corrections do not hold; use a smaller model or a wall-pressure method", c/h))
	}
	if !(s.ShapeFactor >= 0 && s.ShapeFactor < 2) || math.IsNaN(s.Alpha+s.CL+s.CD+s.CM) || math.IsInf(s.Alpha+s.CL+s.CD+s.CM, 0) {
		return Corrected2D{}, m("the shape factor must lie in 0 … 2 and the coefficients be finite")
	}
	var r Corrected2D
	r.ChordToHeight = c / h
	r.Sigma = math.Pi * math.Pi / 48 * (c / h) * (c / h)
	r.SolidBlock = s.ShapeFactor * r.Sigma
	r.WakeBlock = c / (4 * h) * s.CD
	r.Blockage = r.SolidBlock + r.WakeBlock
	r.VelocityFactor = 1 + r.Blockage
	r.DynamicPressureFactor = 1 + 2*r.Blockage
	r.DeltaAlpha = 57.3 * r.Sigma / (2 * math.Pi) * (s.CL + 4*s.CM)
	r.Alpha = s.Alpha + r.DeltaAlpha
	r.CL = s.CL * (1 - r.Sigma - 2*r.Blockage)
	r.CM = s.CM*(1-2*r.Blockage) + r.Sigma*r.CL/4
	r.CD = s.CD * (1 - 3*r.SolidBlock - 2*r.WakeBlock)
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
	// Alpha (degrees), CL, CD and CM are the measured, uncorrected
	// values, CM about the quarter point of the mean aerodynamic chord:
	// the curvature correction's moment term is about that point, so a
	// balance moment about another reference is transferred there first.
	Alpha, CL, CD, CM float64
	// CurvatureFactor is τ₂ of the wing's streamline-curvature
	// correction, read from the compendium's chart at a distance of a
	// quarter of the mean chord behind the quarter-chord point; zero
	// leaves the curvature correction out. LiftSlope is the wing's
	// dC_L/dα per degree, which the lift correction needs.
	CurvatureFactor, LiftSlope float64
	// TailCurvatureFactor is τ₂ at the tail's distance behind the wing
	// and TailMomentSlope the pitching-moment slope per degree of tail
	// angle, ∂C_m/∂α_t (from tail-on and tail-off runs); zero
	// TailMomentSlope leaves the tail correction out.
	TailCurvatureFactor, TailMomentSlope float64
}

// Corrected3D is a three-dimensional test corrected for the tunnel walls,
// with every term.
type Corrected3D struct {
	SolidBlock            float64 // ε_sb = K·τ₁·V/C^(3/2)
	WakeBlock             float64 // ε_wb = (S/4C)·C_Du
	Blockage              float64 // ε = ε_sb + ε_wb
	DynamicPressureFactor float64 // q/q_u = (1 + ε)²
	DeltaAlpha            float64 // 57.3·δ·(S/C)·C_L, degrees (upwash-free angle)
	DeltaCD               float64 // δ·(S/C)·C_L², the induced-drag correction
	// DeltaAlphaCurvature is the wing's streamline-curvature angle
	// correction τ₂·δ·(S/C)·C_L·57.3 (degrees), DeltaCLCurvature the lift
	// correction −Δα_sc·a and DeltaCMCurvature the quarter-chord moment
	// correction −0.25·ΔC_L,sc.
	DeltaAlphaCurvature, DeltaCLCurvature, DeltaCMCurvature float64
	// TailAngle is the extra angle the tail meets in the tunnel,
	// τ₂,t·δ·(S/C)·C_L·57.3 (degrees), and DeltaCMTail the moment
	// correction −(∂C_m/∂α_t)·TailAngle.
	TailAngle, DeltaCMTail float64
	Alpha                  float64 // α = α_u + Δα + Δα_sc
	CL, CD, CM             float64 // on the corrected dynamic pressure, with the curvature, drag and tail terms; CM about the quarter chord
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
// whose reference area exceeds a fifth of the test section's is refused.
func CorrectWalls3D(m Model3D) (Corrected3D, error) {
	e := func(r string) error { return &ExtrapolationError{Method: "3-D wall correction", Reason: r} }
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
	if s/c > 0.2 {
		return Corrected3D{}, e(fmt.Sprintf("S/C = %.3g: above 0.2 the classical corrections do not hold", s/c))
	}
	if !(m.ShapeFactor >= 0 && m.ShapeFactor < 2) || !(m.Delta >= 0 && m.Delta < 1) || !(m.CurvatureFactor >= 0 && m.CurvatureFactor < 2) ||
		!(m.TailCurvatureFactor >= 0 && m.TailCurvatureFactor < 2) {
		return Corrected3D{}, e("the factors must lie in their ranges (K·τ₁ 0 … 2, δ 0 … 1, τ₂ 0 … 2)")
	}
	if sum := m.Alpha + m.CL + m.CD + m.CM + m.LiftSlope + m.TailMomentSlope; math.IsNaN(sum) || math.IsInf(sum, 0) {
		return Corrected3D{}, e("the coefficients and slopes must be finite")
	}
	if m.CurvatureFactor > 0 && !(m.LiftSlope > 0 && m.LiftSlope < 0.2) {
		return Corrected3D{}, e(fmt.Sprintf("lift slope %v per degree: the curvature correction needs the wing's dC_L/dα, between 0 and 0.2 per degree", m.LiftSlope))
	}
	var r Corrected3D
	r.SolidBlock = m.ShapeFactor * v / math.Pow(c, 1.5)
	r.WakeBlock = s / (4 * c) * m.CD
	r.Blockage = r.SolidBlock + r.WakeBlock
	r.DynamicPressureFactor = (1 + r.Blockage) * (1 + r.Blockage)
	clq := m.CL / r.DynamicPressureFactor // on the corrected q
	r.DeltaAlpha = 57.3 * m.Delta * s / c * clq
	r.DeltaCD = m.Delta * s / c * clq * clq
	r.DeltaAlphaCurvature = m.CurvatureFactor * r.DeltaAlpha
	r.DeltaCLCurvature = -r.DeltaAlphaCurvature * m.LiftSlope
	r.DeltaCMCurvature = -0.25 * r.DeltaCLCurvature
	r.TailAngle = m.TailCurvatureFactor * r.DeltaAlpha
	r.DeltaCMTail = -m.TailMomentSlope * r.TailAngle
	r.Alpha = m.Alpha + r.DeltaAlpha + r.DeltaAlphaCurvature
	r.CL = clq + r.DeltaCLCurvature
	r.CD = m.CD/r.DynamicPressureFactor + r.DeltaCD
	r.CM = m.CM/r.DynamicPressureFactor + r.DeltaCMCurvature + r.DeltaCMTail
	return r, nil
}
