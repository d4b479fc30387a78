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
	// Alpha (degrees), CL and CD are the measured, uncorrected values.
	Alpha, CL, CD float64
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
	Alpha                 float64 // α = α_u + Δα
	CL, CD                float64 // on the corrected dynamic pressure, C_D with ΔC_D
}

// CorrectWalls3D applies the classical closed-test-section corrections to
// a three-dimensional model: solid blockage (a Thom-type
// ε_sb = K·τ₁·V/C^(3/2)), wake blockage ε_wb = (S/4C)·C_Du, the
// coefficients referred to the corrected dynamic pressure
// q = q_u(1 + ε)², and Glauert's boundary (downwash) correction of angle
// and drag with the factor δ: Δα = 57.3·δ·(S/C)·C_L,
// ΔC_D = δ·(S/C)·C_L² (Barlow, Rae and Pope, Low-Speed Wind Tunnel
// Testing, 3rd ed., ch. 10; formulas quoted from memory). The tail's
// streamline-curvature correction, which needs the tail's geometry, is
// not included. A model whose reference area exceeds a fifth of the
// test section's is refused.
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
	if !(m.ShapeFactor >= 0 && m.ShapeFactor < 2) || !(m.Delta >= 0 && m.Delta < 1) || math.IsNaN(m.Alpha+m.CL+m.CD) || math.IsInf(m.Alpha+m.CL+m.CD, 0) {
		return Corrected3D{}, e("the factors must lie in their ranges (K·τ₁ 0 … 2, δ 0 … 1) and the coefficients be finite")
	}
	var r Corrected3D
	r.SolidBlock = m.ShapeFactor * v / math.Pow(c, 1.5)
	r.WakeBlock = s / (4 * c) * m.CD
	r.Blockage = r.SolidBlock + r.WakeBlock
	r.DynamicPressureFactor = (1 + r.Blockage) * (1 + r.Blockage)
	clq := m.CL / r.DynamicPressureFactor // on the corrected q
	r.DeltaAlpha = 57.3 * m.Delta * s / c * clq
	r.DeltaCD = m.Delta * s / c * clq * clq
	r.Alpha = m.Alpha + r.DeltaAlpha
	r.CL = clq
	r.CD = m.CD/r.DynamicPressureFactor + r.DeltaCD
	return r, nil
}
