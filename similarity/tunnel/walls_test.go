package tunnel_test

import (
	"errors"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// TestTunnelFinderLimits: a balance limit on q caps the static pressure
// at 2q/(γMa²) and is named as binding; a condensation margin in a
// nitrogen tunnel raises the lowest total temperature until the static
// temperature clears saturation by the margin (checked against the
// saturation curve); a margin for air is refused.
func TestTunnelFinderLimits(t *testing.T) {
	proto, _ := fluids.StandardAtmosphere(quantity.New(18000, quantity.Length), fluids.GeopotentialAlt)
	V := quantity.New(0.6*proto.SpeedOfSound.Value(), quantity.Velocity)
	L := quantity.New(2.0, quantity.Length)
	lim := tunnel.Limits{MinTemperature: quantity.New(280, quantity.Temperature), MaxTemperature: quantity.New(320, quantity.Temperature),
		MinPressure: quantity.New(2e4, quantity.Pressure), MaxPressure: quantity.New(5e5, quantity.Pressure),
		MaxDynamicPressure: quantity.New(15e3, quantity.Pressure)}
	c, err := tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/12, lim)
	if err != nil {
		t.Fatal(err)
	}
	if c.Achieved || math.Abs(c.Q.Value()-15e3) > 1e-6 || math.Abs(c.Pressure.Value()-2*15e3/(1.4*0.36)) > 1e-6 || c.Binding[0] != "maximum dynamic pressure" {
		t.Errorf("q-limited condition %+v", c)
	}
	cryo := tunnel.Limits{MinTemperature: quantity.New(90, quantity.Temperature), MaxTemperature: quantity.New(320, quantity.Temperature),
		MinPressure: quantity.New(1e5, quantity.Pressure), MaxPressure: quantity.New(4.5e5, quantity.Pressure),
		CondensationMargin: quantity.New(20, quantity.Temperature)}
	c, err = tunnel.FindCondition(fluids.Nitrogen(), proto, V, L, 1.0/40, cryo)
	if err != nil {
		t.Fatal(err)
	}
	ts, _ := fluids.NitrogenSaturationTemperature(c.Pressure)
	if m := c.Temperature.Value() - ts.Value(); math.Abs(m-20) > 1e-6 || len(c.Binding) == 0 || c.Binding[0] != "condensation margin" {
		t.Errorf("margin %v K, binding %v, condition %+v", m, c.Binding, c)
	}
	if _, err := tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/40, cryo); err == nil {
		t.Errorf("a condensation margin for air accepted")
	}
}

// TestCorrectWalls2D works the corrections out by hand for a 0.3 m chord
// in a 0.9 m high section, Λ = 0.25, C_lu = 0.82, C_du = 0.0125,
// C_m¼u = −0.08 at 6°: σ = (π²/48)/9 = 0.022846, ε_sb = 0.0057115,
// ε_wb = 0.3/3.6·0.0125 = 0.0010417, ε = 0.0067532.
func TestCorrectWalls2D(t *testing.T) {
	r, err := tunnel.CorrectWalls2D(tunnel.Section2D{Chord: quantity.New(0.3, quantity.Length), Height: quantity.New(0.9, quantity.Length),
		ShapeFactor: 0.25, AlphaDeg: 6, CL: 0.82, CD: 0.0125, CM: -0.08})
	if err != nil {
		t.Fatal(err)
	}
	sig := math.Pi * math.Pi / 48 / 9
	esb, ewb := 0.25*sig, 0.3/3.6*0.0125
	e := esb + ewb
	cl := 0.82 * (1 - sig - 2*e)
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"σ", r.Sigma, sig}, {"ε_sb", r.SolidBlock, esb}, {"ε_wb", r.WakeBlock, ewb}, {"q/q_u", r.DynamicPressureFactor, 1 + 2*e},
		{"α", r.AlphaDeg, 6 + 57.3*sig/(2*math.Pi)*(0.82-0.32)}, {"C_l", r.CL, cl},
		{"C_m", r.CM, -0.08*(1-2*e) + sig*cl/4}, {"C_d", r.CD, 0.0125 * (1 - 3*esb - 2*ewb)},
	} {
		if math.Abs(c.got-c.want) > 1e-15 {
			t.Errorf("%s = %v, by hand %v", c.name, c.got, c.want)
		}
	}
	if math.Abs(sig-0.022846) > 5e-7 {
		t.Errorf("σ = %v", sig)
	}
	if _, err := tunnel.CorrectWalls2D(tunnel.Section2D{Chord: quantity.New(0.5, quantity.Length), Height: quantity.New(0.9, quantity.Length)}); err == nil {
		t.Errorf("c/h = 0.56 accepted")
	}
}

// TestCorrectWalls3D by hand: S = 0.30 m², C = 3.0 m², V = 0.012 m³,
// K·τ₁ = 0.86, δ = 0.125, C_Lu = 0.75, C_Du = 0.040 at 4°:
// ε_sb = 0.86·0.012/3^1.5 = 0.0019861, ε_wb = 0.3/12·0.04 = 0.001,
// q/q_u = (1 + ε)², C_L = 0.75/(1 + ε)², Δα = 57.3·0.125·0.1·C_L,
// C_D = 0.04/(1 + ε)² + 0.125·0.1·C_L².
func TestCorrectWalls3D(t *testing.T) {
	r, err := tunnel.CorrectWalls3D(tunnel.Model3D{WingArea: quantity.New(0.3, quantity.Area), TunnelArea: quantity.New(3, quantity.Area),
		ModelVolume: quantity.New(0.012, quantity.Volume), ShapeFactor: 0.86, Delta: 0.125, AlphaDeg: 4, CL: 0.75, CD: 0.04})
	if err != nil {
		t.Fatal(err)
	}
	esb := 0.86 * 0.012 / math.Pow(3, 1.5)
	eps := esb + 0.001
	f := (1 + eps) * (1 + eps)
	cl := 0.75 / f
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"ε_sb", r.SolidBlock, esb}, {"q/q_u", r.DynamicPressureFactor, f}, {"C_L", r.CL, cl},
		{"α", r.AlphaDeg, 4 + 57.3*0.125*0.1*cl}, {"C_D", r.CD, 0.04/f + 0.125*0.1*cl*cl},
	} {
		if math.Abs(c.got-c.want) > 1e-15 {
			t.Errorf("%s = %v, by hand %v", c.name, c.got, c.want)
		}
	}
	if math.Abs(esb-0.0019861) > 5e-8 {
		t.Errorf("ε_sb = %v", esb)
	}
	if _, err := tunnel.CorrectWalls3D(tunnel.Model3D{WingArea: quantity.New(1, quantity.Area), TunnelArea: quantity.New(3, quantity.Area), ModelVolume: quantity.New(0.01, quantity.Volume)}); err == nil {
		t.Errorf("S/C = 0.33 accepted")
	}
}

// TestCorrectWalls3DCurvature: the same model with the curvature factors
// τ₂ = 0.15 (wing), τ₂,t = 0.6 (tail), a = 0.08 per degree,
// ∂C_m/∂α_t = −0.02 per degree and C_mu = −0.05, by hand (a Python
// one-liner of the same formulas): Δα = 0.5339936°, Δα_sc = 0.15·Δα
// = 0.0800990°, ΔC_L,sc = −0.08·Δα_sc = −0.0064079, ΔC_m¼ = 0.0016020,
// tail angle 0.6·Δα = 0.3203962°, ΔC_m,t = 0.02·0.3203962 = 0.0064079;
// α = 4.6140927°, C_L = 0.7391329, C_m = −0.05/1.0059811 + 0.0016020
// + 0.0064079 = −0.0416928.
func TestCorrectWalls3DCurvature(t *testing.T) {
	m := tunnel.Model3D{WingArea: quantity.New(0.3, quantity.Area), TunnelArea: quantity.New(3, quantity.Area),
		ModelVolume: quantity.New(0.012, quantity.Volume), ShapeFactor: 0.86, Delta: 0.125, AlphaDeg: 4, CL: 0.75, CD: 0.04, CM: -0.05,
		CurvatureFactor: 0.15, LiftSlopePerDeg: 0.08, TailCurvatureFactor: 0.6, TailMomentSlopePerDeg: -0.02}
	r, err := tunnel.CorrectWalls3D(m)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"Δα", r.DeltaAlphaDeg, 0.5339936}, {"Δα_sc", r.DeltaAlphaCurvatureDeg, 0.0800990}, {"ΔC_L,sc", r.DeltaCLCurvature, -0.0064079},
		{"ΔC_m¼", r.DeltaCMCurvature, 0.0016020}, {"tail angle", r.TailAngleDeg, 0.3203962}, {"ΔC_m,t", r.DeltaCMTail, 0.0064079},
		{"α", r.AlphaDeg, 4.6140927}, {"C_L", r.CL, 0.7391329}, {"C_m", r.CM, -0.0416928},
	} {
		if math.Abs(c.got-c.want) > 5e-8 {
			t.Errorf("%s = %.8f, by hand %.7f", c.name, c.got, c.want)
		}
	}
	// Without the factors the curvature and tail terms vanish and C_m is
	// only referred to the corrected q.
	m.CurvatureFactor, m.TailMomentSlopePerDeg = 0, 0
	if r, _ = tunnel.CorrectWalls3D(m); r.DeltaCLCurvature != 0 || r.DeltaCMTail != 0 || r.CM != -0.05/r.DynamicPressureFactor {
		t.Errorf("without factors: %+v", r)
	}
	for _, bad := range []func(*tunnel.Model3D){
		func(m *tunnel.Model3D) { m.CurvatureFactor, m.LiftSlopePerDeg = 0.15, 0 },
		func(m *tunnel.Model3D) { m.CurvatureFactor, m.LiftSlopePerDeg = 0.15, 5.7 }, // per radian given as per degree
		func(m *tunnel.Model3D) { m.TailCurvatureFactor = -1 },
		func(m *tunnel.Model3D) { m.CM = math.NaN() },
	} {
		b := m
		bad(&b)
		if _, err := tunnel.CorrectWalls3D(b); !errors.As(err, new(*tunnel.Error)) {
			t.Errorf("%+v: %v", b, err)
		}
	}
}
