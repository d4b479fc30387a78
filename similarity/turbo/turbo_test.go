package turbo_test

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/turbo"
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
	eta, gain, err := turbo.IECStepUp(0.92, turbo.ReynoldsNumbers{Model: 5e6, Prototype: 8e7})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(gain-want) > 1e-15 || math.Abs(eta-0.92-want) > 1e-14 || math.Abs(want-0.0203846) > 5e-8 {
		t.Errorf("Δη = %v (η_P %v), by hand %v", gain, eta, want)
	}
	// Equal Reynolds numbers: no step-up.
	if _, g, _ := turbo.IECStepUp(0.9, turbo.ReynoldsNumbers{Model: 6e6, Prototype: 6e6}); g != 0 {
		t.Errorf("equal Re: gain %v", g)
	}
	curve, err := turbo.IECCurve([]float64{0.80, 0.88, 0.92, 0.90}, turbo.ReynoldsNumbers{Model: 5e6, Prototype: 8e7})
	if err != nil {
		t.Fatal(err)
	}
	if curve.BEP != 2 || math.Abs(curve.Efficiency[0]-0.80-want) > 1e-15 {
		t.Errorf("curve %+v", curve)
	}
	for _, c := range [][3]float64{{1.1, 5e6, 8e7}, {0.9, 5e6, 1e6}, {0.9, 1e4, 1e6}} {
		if _, _, err := turbo.IECStepUp(c[0], turbo.ReynoldsNumbers{Model: c[1], Prototype: c[2]}); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("IECStepUp%v: %v", c, err)
		}
	}
	// Ackeret by hand: 1 − η_P = 0.15·(0.5 + 0.5·0.01^0.2) = 0.104858.
	a, err := turbo.AckeretStepUp(0.85, turbo.ReynoldsNumbers{Model: 1e6, Prototype: 1e8})
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
	in := turbo.NPSHInput{Pressure: quantity.New(150e3, quantity.Pressure), VapourPressure: pv20, Density: rho, Velocity: quantity.New(3, quantity.Velocity)}
	n, err := turbo.NPSH(in)
	if err != nil {
		t.Fatal(err)
	}
	want := (150e3-pv20.Value())/(998.2*9.80665) + 9/(2*9.80665)
	if math.Abs(n.Value()-want) > 1e-12 || math.Abs(want-15.5432) > 5e-5 || n.Dim() != quantity.Length {
		t.Errorf("NPSH = %v, by hand %v", n, want)
	}
	sigma, err := turbo.Thoma(turbo.Heads{NPSH: n, Head: quantity.New(40, quantity.Length)})
	if err != nil {
		t.Fatal(err)
	}
	pv30, _ := fluids.VapourPressure(quantity.New(303.15, quantity.Temperature))
	hp := quantity.New(120, quantity.Length)
	p, err := turbo.SuctionPressureFor(sigma, hp, pv30, quantity.New(995.6, quantity.Density), quantity.New(4, quantity.Velocity), quantity.Quantity{})
	if err != nil {
		t.Fatal(err)
	}
	np, _ := turbo.NPSH(turbo.NPSHInput{Pressure: p, VapourPressure: pv30, Density: quantity.New(995.6, quantity.Density), Velocity: quantity.New(4, quantity.Velocity)})
	if math.Abs(np.Value()-sigma*120) > 1e-9 {
		t.Errorf("prototype NPSH %v, σ·H_P = %v", np, sigma*120)
	}
	in.Pressure = quantity.New(-5e3, quantity.Pressure) // a gauge reading used as absolute
	if _, err := turbo.NPSH(in); err == nil {
		t.Errorf("a negative absolute pressure accepted")
	}
}

// TestSpecificSpeed: n_q of a pump at 1450 rpm, 0.1 m³/s and 30 m by hand,
// 1450·√0.1/30^0.75 = 35.77; the US form is 51.65 times it (common
// practice quotes 51.6), the dimensionless form n_q/52.92 (2π/60/g_n^¾);
// conversions round-trip.
func TestSpecificSpeed(t *testing.T) {
	rpm := units.MustParse("rpm")
	s, err := turbo.SpecificSpeedOf(rpm.Of(1450), quantity.New(0.1, quantity.VolumeFlowRate), quantity.New(30, quantity.Length))
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
	us, errUS := turbo.SpecificSpeedUS(s.US)
	dl, errDL := turbo.SpecificSpeedDimensionless(s.Dimensionless)
	if errUS != nil || errDL != nil {
		t.Fatalf("round trip: %v, %v", errUS, errDL)
	}
	for _, back := range []turbo.SpecificSpeeds{us, dl} {
		if math.Abs(back.Metric-s.Metric) > 1e-12*s.Metric {
			t.Errorf("round trip %+v, want %+v", back, s)
		}
	}
}

// Stepping a model turbine's efficiency up to the prototype by IEC
// 60193 and by Ackeret, at the same Reynolds numbers.
func ExampleIECStepUp() {
	eta, gain, err := turbo.IECStepUp(0.925, turbo.ReynoldsNumbers{Model: 6.5e6, Prototype: 9.0e7})
	if err != nil {
		fmt.Println(err)
		return
	}
	ack, _ := turbo.AckeretStepUp(0.925, turbo.ReynoldsNumbers{Model: 6.5e6, Prototype: 9.0e7})
	fmt.Printf("IEC 60193: η_P = %.4f (Δη = %.4f); Ackeret: η_P = %.4f\n", eta, gain, ack)
	// Output:
	// IEC 60193: η_P = 0.9431 (Δη = 0.0181); Ackeret: η_P = 0.9403
}

// TestFanLawsWithDensity: a fan model at 2900 rpm and 0.4 m in air of
// 1.20 kg/m³ for a prototype at 960 rpm and 1.6 m in air of 0.95 kg/m³
// (a hot duct): the pressure ratio is λ_ρ·λ_N²·λ_D² by the fan laws
// (ψ_p held), the flow ratio λ_N·λ_D³, the power ratio λ_ρ·λ_N³·λ_D⁵ and
// the power is the pressure times the flow.
func TestFanLawsWithDensity(t *testing.T) {
	ln, ld, lr := 2900.0/960, 0.4/1.6, 1.20/0.95
	a, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: ln, Diameter: ld, Density: lr})
	if err != nil {
		t.Fatal(err)
	}
	want := lr * ln * ln * ld * ld
	if math.Abs(a.Pressure-want) > 1e-12*want || math.Abs(a.Flow-ln*ld*ld*ld) > 1e-12 || math.Abs(a.Power-a.Pressure*a.Flow) > 1e-12*a.Power {
		t.Errorf("%+v; pressure by hand %v", a, want)
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
		eta, d, err := turbo.FanStepUp(c.eta, turbo.ReynoldsNumbers{Model: c.reM, Prototype: c.reP})
		if err != nil || math.Abs(eta-c.want) > 5e-8 || math.Abs(d-c.wantDiff) > 5e-8 {
			t.Errorf("%s: η = %.7f, Δ = %.7f, %v; want %.7f, %.7f", c.name, eta, d, err, c.want, c.wantDiff)
		}
	}
	// The increase is half of AckeretStepUp's.
	ack, _ := turbo.AckeretStepUp(0.80, turbo.ReynoldsNumbers{Model: 1e6, Prototype: 1e7})
	if _, d, _ := turbo.FanStepUp(0.80, turbo.ReynoldsNumbers{Model: 1e6, Prototype: 1e7}); math.Abs(d-(ack-0.80)/2) > 1e-15 {
		t.Errorf("half of Ackeret: %v, want %v", d, (ack-0.80)/2)
	}
	// 0.5·(1e6)^0.2 = 7.92: the loss would take η below zero.
	for _, bad := range [][3]float64{{1, 1e6, 1e7}, {0.8, 0, 1e7}, {0.8, 1e6, math.Inf(1)}, {math.NaN(), 1e6, 1e7}, {0.8, 1e9, 1e3}} {
		if _, _, err := turbo.FanStepUp(bad[0], turbo.ReynoldsNumbers{Model: bad[1], Prototype: bad[2]}); !errors.As(err, new(*turbo.Error)) {
			t.Errorf("FanStepUp%v: %v", bad, err)
		}
	}
	// Up then down never gains: the rule is conservative both ways.
	rapid.Check(t, func(rt *rapid.T) {
		eta := rapid.Float64Range(0.6, 0.95).Draw(rt, "η")
		re := rapid.Float64Range(1e5, 1e7).Draw(rt, "Re")
		k := rapid.Float64Range(1, 30).Draw(rt, "ratio")
		up, _, err := turbo.FanStepUp(eta, turbo.ReynoldsNumbers{Model: re, Prototype: re * k})
		if err != nil {
			rt.Fatal(err)
		}
		back, _, err := turbo.FanStepUp(up, turbo.ReynoldsNumbers{Model: re * k, Prototype: re})
		if err != nil {
			rt.Fatal(err)
		}
		if back > eta+1e-15 {
			rt.Errorf("η %v → %v → %v: the round trip gained", eta, up, back)
		}
	})
	c, err := turbo.FanCurve([]float64{0.70, 0.80, 0.76}, turbo.ReynoldsNumbers{Model: 1e6, Prototype: 1e7})
	if err != nil || c.BEP != 1 || math.Abs(c.Efficiency[0]-(0.70+0.0184521)) > 5e-8 || math.Abs(c.Gain-0.0184521) > 5e-8 {
		t.Errorf("FanCurve: %+v, %v", c, err)
	}
}

// A fan tested at a tip Reynolds number of 1.2×10⁶ converted to the
// site fan at 8×10⁶ (half Ackeret's gain) and to a smaller fan of the
// range at 5×10⁵ (the full loss).
func ExampleFanStepUp() {
	up, gain, _ := turbo.FanStepUp(0.82, turbo.ReynoldsNumbers{Model: 1.2e6, Prototype: 8e6})
	down, loss, _ := turbo.FanStepUp(0.82, turbo.ReynoldsNumbers{Model: 1.2e6, Prototype: 5e5})
	fmt.Printf("larger: η = %.4f (%+.4f); smaller: η = %.4f (%+.4f)\n", up, gain, down, loss)
	// Output:
	// larger: η = 0.8342 (+0.0142); smaller: η = 0.8028 (-0.0172)
}

// TestRefusalsReadable: a refused step-up names the bound it fails with
// the figures to a few significant digits, never a float's 17 (it printed
// "Reynolds numbers 13461.831767260132 (model) and 16874.42626183415
// (prototype)").
func TestRefusalsReadable(t *testing.T) {
	_, _, iecLow := turbo.IECStepUp(0.835, turbo.ReynoldsNumbers{Model: 13461.831767260132, Prototype: 16874.42626183415})
	_, _, iecDown := turbo.IECStepUp(0.835, turbo.ReynoldsNumbers{Model: 2.345678912e6, Prototype: 1.23456789e6})
	_, ackeret := turbo.AckeretStepUp(0.835, turbo.ReynoldsNumbers{Model: 2.345678912e6, Prototype: 1.23456789e6})
	_, _, fan := turbo.FanStepUp(0.123456789, turbo.ReynoldsNumbers{Model: -1.23456789, Prototype: 3})
	_, moody := turbo.MoodyStepUp(1.000000001, turbo.Diameters{Model: quantity.New(1, quantity.Length), Prototype: quantity.New(2, quantity.Length)}, turbo.MoodyStepUpOptions{})
	_, thoma := turbo.Thoma(turbo.Heads{NPSH: quantity.New(3.14159265358979, quantity.Length), Head: quantity.New(-2.718281828459045, quantity.Length)})
	for _, c := range []struct {
		err  error
		want string
	}{
		{iecLow, "model Reynolds number Re_M = 1.35e+04 is below 10⁵"},
		{iecDown, "prototype Reynolds number Re_P = 1.23e+06 is below the model's Re_M = 2.35e+06"},
		{ackeret, "Reynolds numbers 2.35e+06 (model) and 1.23e+06 (prototype)"},
		{fan, "Reynolds numbers -1.23 and 3: want positive and finite"},
		{moody, "model efficiency 1 is not between 0 and 1"},
		{thoma, "NPSH 3.142 m and head -2.718 m"},
	} {
		if c.err == nil || !strings.Contains(c.err.Error(), c.want) || regexp.MustCompile(`\d{7,}`).MatchString(c.err.Error()) {
			t.Errorf("%v, want %q and no long float", c.err, c.want)
		}
	}
}
