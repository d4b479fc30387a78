package similarity_test

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
)

// TestIECStepUp works the IEC 60193 formula by hand for η_M = 0.92 at
// Re_M = 5×10⁶ and Re_P = 8×10⁷: (7/5)^0.16 = 1.055310,
// (7/80)^0.16 = 0.677220, δ_ref = 0.08/(1.055310 + 0.3/0.7) = 0.053913,
// Δη = δ_ref·(1.055310 − 0.677220) = 0.0203846.
func TestIECStepUp(t *testing.T) {
	rm, rp := math.Pow(1.4, 0.16), math.Pow(7.0/80, 0.16)
	dref := 0.08 / (rm + 0.3/0.7)
	want := dref * (rm - rp)
	eta, gain, err := similarity.IECStepUp(0.92, 5e6, 8e7)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(gain-want) > 1e-15 || math.Abs(eta-0.92-want) > 1e-14 || math.Abs(want-0.0203846) > 5e-8 {
		t.Errorf("Δη = %v (η_P %v), by hand %v", gain, eta, want)
	}
	// Equal Reynolds numbers: no step-up.
	if _, g, _ := similarity.IECStepUp(0.9, 6e6, 6e6); g != 0 {
		t.Errorf("equal Re: gain %v", g)
	}
	curve, err := similarity.IECCurve([]float64{0.80, 0.88, 0.92, 0.90}, 5e6, 8e7)
	if err != nil {
		t.Fatal(err)
	}
	if curve.BEP != 2 || math.Abs(curve.Efficiency[0]-0.80-want) > 1e-15 {
		t.Errorf("curve %+v", curve)
	}
	for _, c := range [][3]float64{{1.1, 5e6, 8e7}, {0.9, 5e6, 1e6}, {0.9, 1e4, 1e6}} {
		if _, _, err := similarity.IECStepUp(c[0], c[1], c[2]); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("IECStepUp%v: %v", c, err)
		}
	}
	// Ackeret by hand: 1 − η_P = 0.15·(0.5 + 0.5·0.01^0.2) = 0.104858.
	a, err := similarity.AckeretStepUp(0.85, 1e6, 1e8)
	if err != nil || math.Abs(a-(1-0.15*(0.5+0.5*math.Pow(0.01, 0.2)))) > 1e-15 || math.Abs(a-0.895142) > 1e-6 {
		t.Errorf("Ackeret: %v, %v", a, err)
	}
}

// TestNPSH: by hand, p = 150 kPa absolute, water at 20 °C (p_v from
// IAPWS-IF97, 2339.21 Pa; ρ = 998.2 kg/m³), V = 3 m/s:
// NPSH = (150000 − 2339.21)/(998.2·9.80665) + 9/(2·9.80665) = 15.5432 m.
// The Thoma number of the model, held at the prototype, gives the
// prototype's suction pressure with its own water temperature, and the
// NPSH there is σ·H_P.
func TestNPSH(t *testing.T) {
	pv20, _ := fluids.VapourPressure(quantity.New(293.15, quantity.Temperature))
	rho := quantity.New(998.2, quantity.Density)
	in := similarity.NPSHInput{Pressure: quantity.New(150e3, quantity.Pressure), VapourPressure: pv20, Density: rho, Velocity: quantity.New(3, quantity.Velocity)}
	n, err := similarity.NPSH(in)
	if err != nil {
		t.Fatal(err)
	}
	want := (150e3-pv20.Value())/(998.2*9.80665) + 9/(2*9.80665)
	if math.Abs(n.Value()-want) > 1e-12 || math.Abs(want-15.5432) > 5e-5 || n.Dim() != quantity.Length {
		t.Errorf("NPSH = %v, by hand %v", n, want)
	}
	sigma, err := similarity.Thoma(n, quantity.New(40, quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	pv30, _ := fluids.VapourPressure(quantity.New(303.15, quantity.Temperature))
	hp := quantity.New(120, quantity.Length)
	p, err := similarity.SuctionPressureFor(sigma, hp, pv30, quantity.New(995.6, quantity.Density), quantity.New(4, quantity.Velocity), quantity.Quantity{})
	if err != nil {
		t.Fatal(err)
	}
	np, _ := similarity.NPSH(similarity.NPSHInput{Pressure: p, VapourPressure: pv30, Density: quantity.New(995.6, quantity.Density), Velocity: quantity.New(4, quantity.Velocity)})
	if math.Abs(np.Value()-sigma*120) > 1e-9 {
		t.Errorf("prototype NPSH %v, σ·H_P = %v", np, sigma*120)
	}
	in.Pressure = quantity.New(-5e3, quantity.Pressure) // a gauge reading used as absolute
	if _, err := similarity.NPSH(in); err == nil {
		t.Errorf("a negative absolute pressure accepted")
	}
}

// TestSpecificSpeed: n_q of a pump at 1450 rpm, 0.1 m³/s and 30 m by hand,
// 1450·√0.1/30^0.75 = 35.77; the US form is 51.65 times it (common
// practice quotes 51.6), the dimensionless form n_q/52.92 (2π/60/g_n^¾);
// conversions round-trip.
func TestSpecificSpeed(t *testing.T) {
	rpm := units.MustParse("rpm")
	s, err := similarity.SpecificSpeedOf(rpm.Of(1450), quantity.New(0.1, quantity.VolumeFlowRate), quantity.New(30, quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	nq := 1450 * math.Sqrt(0.1) / math.Pow(30, 0.75)
	if math.Abs(s.Metric-nq) > 1e-12*nq || math.Abs(s.US/s.Metric-51.6453) > 1e-3 || math.Abs(s.Metric/s.Dimensionless-52.9186) > 1e-3 {
		t.Errorf("%+v; n_q by hand %v", s, nq)
	}
	// The dimensionless form by its definition, ω·Q^½/(gH)^¾.
	if om := 1450 * 2 * math.Pi / 60 * math.Sqrt(0.1) / math.Pow(9.80665*30, 0.75); math.Abs(s.Dimensionless-om) > 1e-12*om {
		t.Errorf("Ω_s = %v, by definition %v", s.Dimensionless, om)
	}
	us, errUS := similarity.SpecificSpeedUS(s.US)
	dl, errDL := similarity.SpecificSpeedDimensionless(s.Dimensionless)
	if errUS != nil || errDL != nil {
		t.Fatalf("round trip: %v, %v", errUS, errDL)
	}
	for _, back := range []similarity.SpecificSpeeds{us, dl} {
		if math.Abs(back.Metric-s.Metric) > 1e-12*s.Metric {
			t.Errorf("round trip %+v, want %+v", back, s)
		}
	}
}

// Stepping a model turbine's efficiency up to the prototype by IEC
// 60193 and by Ackeret, at the same Reynolds numbers.
func ExampleIECStepUp() {
	eta, gain, err := similarity.IECStepUp(0.925, 6.5e6, 9.0e7)
	if err != nil {
		fmt.Println(err)
		return
	}
	ack, _ := similarity.AckeretStepUp(0.925, 6.5e6, 9.0e7)
	fmt.Printf("IEC 60193: η_P = %.4f (Δη = %.4f); Ackeret: η_P = %.4f\n", eta, gain, ack)
	// Output:
	// IEC 60193: η_P = 0.9431 (Δη = 0.0181); Ackeret: η_P = 0.9403
}

// TestTunnelFinderLimits: a balance limit on q caps the static pressure
// at 2q/(γMa²) and is named as binding; a condensation margin in a
// nitrogen tunnel raises the lowest total temperature until the static
// temperature clears saturation by the margin (checked against the
// saturation curve); a margin for air is refused.
func TestTunnelFinderLimits(t *testing.T) {
	proto, _ := fluids.StandardAtmosphere(quantity.New(18000, quantity.Length), fluids.GeopotentialAlt)
	V := quantity.New(0.6*proto.SpeedOfSound.Value(), quantity.Velocity)
	L := quantity.New(2.0, quantity.Length)
	lim := similarity.TunnelLimits{MinTemperature: quantity.New(280, quantity.Temperature), MaxTemperature: quantity.New(320, quantity.Temperature),
		MinPressure: quantity.New(2e4, quantity.Pressure), MaxPressure: quantity.New(5e5, quantity.Pressure),
		MaxDynamicPressure: quantity.New(15e3, quantity.Pressure)}
	c, err := similarity.FindTunnelCondition(fluids.Air(), proto, V, L, 1.0/12, lim)
	if err != nil {
		t.Fatal(err)
	}
	if c.Achieved || math.Abs(c.Q.Value()-15e3) > 1e-6 || math.Abs(c.Pressure.Value()-2*15e3/(1.4*0.36)) > 1e-6 || c.Binding[0] != "maximum dynamic pressure" {
		t.Errorf("q-limited condition %+v", c)
	}
	cryo := similarity.TunnelLimits{MinTemperature: quantity.New(90, quantity.Temperature), MaxTemperature: quantity.New(320, quantity.Temperature),
		MinPressure: quantity.New(1e5, quantity.Pressure), MaxPressure: quantity.New(4.5e5, quantity.Pressure),
		CondensationMargin: quantity.New(20, quantity.Temperature)}
	c, err = similarity.FindTunnelCondition(fluids.Nitrogen(), proto, V, L, 1.0/40, cryo)
	if err != nil {
		t.Fatal(err)
	}
	ts, _ := fluids.NitrogenSaturationTemperature(c.Pressure)
	if m := c.Temperature.Value() - ts.Value(); math.Abs(m-20) > 1e-6 || len(c.Binding) == 0 || c.Binding[0] != "condensation margin" {
		t.Errorf("margin %v K, binding %v, condition %+v", m, c.Binding, c)
	}
	if _, err := similarity.FindTunnelCondition(fluids.Air(), proto, V, L, 1.0/40, cryo); err == nil {
		t.Errorf("a condensation margin for air accepted")
	}
}

// TestCorrectWalls2D works the corrections out by hand for a 0.3 m chord
// in a 0.9 m high section, Λ = 0.25, C_lu = 0.82, C_du = 0.0125,
// C_m¼u = −0.08 at 6°: σ = (π²/48)/9 = 0.022846, ε_sb = 0.0057115,
// ε_wb = 0.3/3.6·0.0125 = 0.0010417, ε = 0.0067532.
func TestCorrectWalls2D(t *testing.T) {
	r, err := similarity.CorrectWalls2D(similarity.Section2D{Chord: quantity.New(0.3, quantity.Length), Height: quantity.New(0.9, quantity.Length),
		ShapeFactor: 0.25, Alpha: 6, CL: 0.82, CD: 0.0125, CM: -0.08})
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
		{"α", r.Alpha, 6 + 57.3*sig/(2*math.Pi)*(0.82-0.32)}, {"C_l", r.CL, cl},
		{"C_m", r.CM, -0.08*(1-2*e) + sig*cl/4}, {"C_d", r.CD, 0.0125 * (1 - 3*esb - 2*ewb)},
	} {
		if math.Abs(c.got-c.want) > 1e-15 {
			t.Errorf("%s = %v, by hand %v", c.name, c.got, c.want)
		}
	}
	if math.Abs(sig-0.022846) > 5e-7 {
		t.Errorf("σ = %v", sig)
	}
	if _, err := similarity.CorrectWalls2D(similarity.Section2D{Chord: quantity.New(0.5, quantity.Length), Height: quantity.New(0.9, quantity.Length)}); err == nil {
		t.Errorf("c/h = 0.56 accepted")
	}
}

// TestFanLawsWithDensity: a fan model at 2900 rpm and 0.4 m in air of
// 1.20 kg/m³ for a prototype at 960 rpm and 1.6 m in air of 0.95 kg/m³
// (a hot duct): the pressure ratio is λ_ρ·λ_N²·λ_D² by the fan laws
// (ψ_p held), the flow ratio λ_N·λ_D³, the power ratio λ_ρ·λ_N³·λ_D⁵ and
// the power is the pressure times the flow.
func TestFanLawsWithDensity(t *testing.T) {
	ln, ld, lr := 2900.0/960, 0.4/1.6, 1.20/0.95
	a, err := similarity.AffinityLaws(similarity.Scales{Speed: ln, Diameter: ld, Density: lr})
	if err != nil {
		t.Fatal(err)
	}
	want := lr * ln * ln * ld * ld
	if math.Abs(a.Pressure-want) > 1e-12*want || math.Abs(a.Flow-ln*ld*ld*ld) > 1e-12 || math.Abs(a.Power-a.Pressure*a.Flow) > 1e-12*a.Power {
		t.Errorf("%+v; pressure by hand %v", a, want)
	}
}

// TestCorrectWalls3D by hand: S = 0.30 m², C = 3.0 m², V = 0.012 m³,
// K·τ₁ = 0.86, δ = 0.125, C_Lu = 0.75, C_Du = 0.040 at 4°:
// ε_sb = 0.86·0.012/3^1.5 = 0.0019861, ε_wb = 0.3/12·0.04 = 0.001,
// q/q_u = (1 + ε)², C_L = 0.75/(1 + ε)², Δα = 57.3·0.125·0.1·C_L,
// C_D = 0.04/(1 + ε)² + 0.125·0.1·C_L².
func TestCorrectWalls3D(t *testing.T) {
	r, err := similarity.CorrectWalls3D(similarity.Model3D{WingArea: quantity.New(0.3, quantity.Area), TunnelArea: quantity.New(3, quantity.Area),
		ModelVolume: quantity.New(0.012, quantity.Volume), ShapeFactor: 0.86, Delta: 0.125, Alpha: 4, CL: 0.75, CD: 0.04})
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
		{"α", r.Alpha, 4 + 57.3*0.125*0.1*cl}, {"C_D", r.CD, 0.04/f + 0.125*0.1*cl*cl},
	} {
		if math.Abs(c.got-c.want) > 1e-15 {
			t.Errorf("%s = %v, by hand %v", c.name, c.got, c.want)
		}
	}
	if math.Abs(esb-0.0019861) > 5e-8 {
		t.Errorf("ε_sb = %v", esb)
	}
	if _, err := similarity.CorrectWalls3D(similarity.Model3D{WingArea: quantity.New(1, quantity.Area), TunnelArea: quantity.New(3, quantity.Area), ModelVolume: quantity.New(0.01, quantity.Volume)}); err == nil {
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
	m := similarity.Model3D{WingArea: quantity.New(0.3, quantity.Area), TunnelArea: quantity.New(3, quantity.Area),
		ModelVolume: quantity.New(0.012, quantity.Volume), ShapeFactor: 0.86, Delta: 0.125, Alpha: 4, CL: 0.75, CD: 0.04, CM: -0.05,
		CurvatureFactor: 0.15, LiftSlope: 0.08, TailCurvatureFactor: 0.6, TailMomentSlope: -0.02}
	r, err := similarity.CorrectWalls3D(m)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"Δα", r.DeltaAlpha, 0.5339936}, {"Δα_sc", r.DeltaAlphaCurvature, 0.0800990}, {"ΔC_L,sc", r.DeltaCLCurvature, -0.0064079},
		{"ΔC_m¼", r.DeltaCMCurvature, 0.0016020}, {"tail angle", r.TailAngle, 0.3203962}, {"ΔC_m,t", r.DeltaCMTail, 0.0064079},
		{"α", r.Alpha, 4.6140927}, {"C_L", r.CL, 0.7391329}, {"C_m", r.CM, -0.0416928},
	} {
		if math.Abs(c.got-c.want) > 5e-8 {
			t.Errorf("%s = %.8f, by hand %.7f", c.name, c.got, c.want)
		}
	}
	// Without the factors the curvature and tail terms vanish and C_m is
	// only referred to the corrected q.
	m.CurvatureFactor, m.TailMomentSlope = 0, 0
	if r, _ = similarity.CorrectWalls3D(m); r.DeltaCLCurvature != 0 || r.DeltaCMTail != 0 || r.CM != -0.05/r.DynamicPressureFactor {
		t.Errorf("without factors: %+v", r)
	}
	for _, bad := range []func(*similarity.Model3D){
		func(m *similarity.Model3D) { m.CurvatureFactor, m.LiftSlope = 0.15, 0 },
		func(m *similarity.Model3D) { m.CurvatureFactor, m.LiftSlope = 0.15, 5.7 }, // per radian given as per degree
		func(m *similarity.Model3D) { m.TailCurvatureFactor = -1 },
		func(m *similarity.Model3D) { m.CM = math.NaN() },
	} {
		b := m
		bad(&b)
		if _, err := similarity.CorrectWalls3D(b); !errors.Is(err, similarity.ErrExtrapolation) {
			t.Errorf("%+v: %v", b, err)
		}
	}
}

// TestFanStepUp checks the fan conversion by hand. η_M = 0.80:
// to a ten times larger Reynolds number Ackeret gives
// 0.2·(0.5 − 0.5·10^−0.2) = 0.2·0.1845213 = 0.0369043, of which half is
// taken: η = 0.8184521; to a ten times smaller one the full decrease,
// 0.2·(0.5 − 0.5·10^0.2) = −0.0584893: η = 0.7415107.
func TestFanStepUp(t *testing.T) {
	for _, c := range []struct {
		name           string
		eta, reM, reP  float64
		want, wantDiff float64
	}{
		{"larger: half the gain", 0.80, 1e6, 1e7, 0.8184521, 0.0184521},
		{"smaller: the full loss", 0.80, 1e7, 1e6, 0.7415107, -0.0584893},
		{"same Reynolds number", 0.80, 1e6, 1e6, 0.80, 0},
	} {
		eta, d, err := similarity.FanStepUp(c.eta, c.reM, c.reP)
		if err != nil || math.Abs(eta-c.want) > 5e-8 || math.Abs(d-c.wantDiff) > 5e-8 {
			t.Errorf("%s: η = %.7f, Δ = %.7f, %v; want %.7f, %.7f", c.name, eta, d, err, c.want, c.wantDiff)
		}
	}
	// The increase is half of AckeretStepUp's.
	ack, _ := similarity.AckeretStepUp(0.80, 1e6, 1e7)
	if _, d, _ := similarity.FanStepUp(0.80, 1e6, 1e7); math.Abs(d-(ack-0.80)/2) > 1e-15 {
		t.Errorf("half of Ackeret: %v, want %v", d, (ack-0.80)/2)
	}
	// 0.5·(1e6)^0.2 = 7.92: the loss would take η below zero.
	for _, bad := range [][3]float64{{1, 1e6, 1e7}, {0.8, 0, 1e7}, {0.8, 1e6, math.Inf(1)}, {math.NaN(), 1e6, 1e7}, {0.8, 1e9, 1e3}} {
		if _, _, err := similarity.FanStepUp(bad[0], bad[1], bad[2]); !errors.Is(err, similarity.ErrExtrapolation) {
			t.Errorf("FanStepUp%v: %v", bad, err)
		}
	}
	// Up then down never gains: the rule is conservative both ways.
	rapid.Check(t, func(rt *rapid.T) {
		eta := rapid.Float64Range(0.6, 0.95).Draw(rt, "η")
		re := rapid.Float64Range(1e5, 1e7).Draw(rt, "Re")
		k := rapid.Float64Range(1, 30).Draw(rt, "ratio")
		up, _, err := similarity.FanStepUp(eta, re, re*k)
		if err != nil {
			rt.Fatal(err)
		}
		back, _, err := similarity.FanStepUp(up, re*k, re)
		if err != nil {
			rt.Fatal(err)
		}
		if back > eta+1e-15 {
			rt.Errorf("η %v → %v → %v: the round trip gained", eta, up, back)
		}
	})
	c, err := similarity.FanCurve([]float64{0.70, 0.80, 0.76}, 1e6, 1e7)
	if err != nil || c.BEP != 1 || math.Abs(c.Efficiency[0]-(0.70+0.0184521)) > 5e-8 || math.Abs(c.Gain-0.0184521) > 5e-8 {
		t.Errorf("FanCurve: %+v, %v", c, err)
	}
}

// A fan tested at a tip Reynolds number of 1.2×10⁶ converted to the
// site fan at 8×10⁶ (half Ackeret's gain) and to a smaller fan of the
// range at 5×10⁵ (the full loss).
func ExampleFanStepUp() {
	up, gain, _ := similarity.FanStepUp(0.82, 1.2e6, 8e6)
	down, loss, _ := similarity.FanStepUp(0.82, 1.2e6, 5e5)
	fmt.Printf("larger: η = %.4f (%+.4f); smaller: η = %.4f (%+.4f)\n", up, gain, down, loss)
	// Output:
	// larger: η = 0.8342 (+0.0142); smaller: η = 0.8028 (-0.0172)
}
