package ship_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/similarity/ship"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
)

// slowShortInput is an invented twin-screw case where the roughness
// formula fails: a 2 m model of a 32 m catamaran (λ = 1/16) at 0.5 m/s.
func slowShortInput() ship.PoweringInput {
	in := poweringInput()
	in.Scale = 1.0 / 16
	in.ModelLength, in.ModelWettedArea = quantity.New(2, quantity.Length), quantity.New(1.62, quantity.Area)
	in.ModelSpeed, in.ModelResistance = quantity.New(0.5, quantity.Velocity), quantity.New(1.105, quantity.Force)
	in.FormFactor = 1.141
	in.CorrelationAllowance = 0
	in.TransverseArea = quantity.New(48, quantity.Area)
	in.ModelWake, in.ThrustDeduction, in.RelativeRotative = 0.085, 0.072, 0.985
	in.Propellers = 2
	in.Propeller = ship.PropellerGeometry{Diameter: quantity.New(1.35, quantity.Length), Blades: 4, PitchRatio: 0.9,
		Chord: quantity.New(0.37, quantity.Length), ThicknessRatio: 0.04, ModelReynolds: 2e5}
	in.OpenWater = []ship.OpenWaterPoint{
		{J: 0.2, KT: 0.352, KQ: 0.0520}, {J: 0.4, KT: 0.285, KQ: 0.0455}, {J: 0.6, KT: 0.212, KQ: 0.0380},
		{J: 0.8, KT: 0.135, KQ: 0.0295}, {J: 1.0, KT: 0.052, KQ: 0.0195},
	}
	return in
}

// TestITTC1978NegativeRoughnessAllowanceWarned: by hand, L_S = 32 m,
// V_S = 0.5·4 = 2 m/s, Re_S = 2·32/1.1892e-6 = 5.3818e7, and
// ΔC_F = 0.044·[(150e-6/32)^(1/3) − 10·Re_S^(−1/3)] + 0.000125
// = 0.044·(0.016736 − 0.026490) + 0.000125 = −0.304×10⁻³: it must be
// returned, printed in the table and warned about.
func TestITTC1978NegativeRoughnessAllowanceWarned(t *testing.T) {
	r, err := ship.ITTC1978(slowShortInput())
	if err != nil {
		t.Fatal(err)
	}
	res := 2 * 32 / 1.1892e-6
	want := 0.044*(math.Cbrt(150e-6/32)-10*math.Pow(res, -1.0/3)) + 0.000125
	if math.Abs(r.RoughnessAllowance-want) > 1e-12 || math.Abs(want+0.304e-3) > 0.001e-3 {
		t.Errorf("ΔC_F = %v, by hand %v (≈ −0.304e-3)", r.RoughnessAllowance, want)
	}
	if !strings.Contains(r.Warning, "ΔC_F = -0.304×10⁻³ is negative") {
		t.Errorf("no warning on the negative ΔC_F: %q", r.Warning)
	}
	tab := ship.PoweringTable([]ship.PoweringResult{r}, false)
	for _, s := range []string{"ΔC_F×10³", "C_R×10³", "C_A×10³", "-0.304", "WARNING (3.89 kn)", "all shafts"} {
		if !strings.Contains(tab, s) {
			t.Errorf("table lacks %q:\n%s", s, tab)
		}
	}
}

// TestITTC1978NegativeCorrelationAllowanceWarned: a 200 m ship (1:100)
// at V_S = 2.4·10 = 24 m/s has, by hand, Re_S = 24·200/1.1892e-6 =
// 4.036×10⁹ and C_A = (5.68 − 0.6·log₁₀4.036e9)·10⁻³ = (5.68 − 5.7636)
// ·10⁻³ = −0.084×10⁻³, above the sign change at 10^(5.68/0.6) =
// 2.93×10⁹: the formula's C_A goes in with a warning naming Re_S, as a
// negative ΔC_F does; a basin's own negative C_A is its choice and is
// not warned about.
func TestITTC1978NegativeCorrelationAllowanceWarned(t *testing.T) {
	in := slowShortInput()
	in.Scale = 1.0 / 100
	in.ModelSpeed, in.ModelResistance = quantity.New(2.4, quantity.Velocity), quantity.New(38.1, quantity.Force)
	in.TransverseArea = quantity.New(48*(100.0/16)*(100.0/16), quantity.Area)
	in.Propeller.Diameter, in.Propeller.Chord = quantity.New(8.4375, quantity.Length), quantity.New(2.3125, quantity.Length)
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	want := (5.68 - 0.6*math.Log10(r.ShipReynolds)) * 1e-3
	if !r.CorrelationFromFormula || math.Abs(r.CorrelationAllowance-want) > 1e-15 || math.Abs(r.ShipReynolds/4.036e9-1) > 0.002 || math.Abs(want*1e3+0.084) > 0.001 {
		t.Errorf("C_A = %v at Re_S = %v, by hand %v (≈ −0.084e-3 at 4.036e9)", r.CorrelationAllowance, r.ShipReynolds, want)
	}
	for _, s := range []string{"the correlation allowance C_A = -0.084×10⁻³ from the procedure's formula", "is negative and lowers C_TS by",
		"Re_S = 4.04e+09 is above 2.93e+09", "used beyond its range (L = 200 m)"} {
		if !strings.Contains(r.Warning, s) {
			t.Errorf("warning lacks %q: %q", s, r.Warning)
		}
	}
	// The 200 m ship's figures take the prefix their size calls for:
	// R_TS = C_TS·½ρV²S in MN, not tens of thousands of kN.
	if tab := ship.PoweringTable([]ship.PoweringResult{r}, false); !strings.Contains(tab, "WARNING (46.65 kn): ") || !strings.Contains(tab, "C_A = -0.084×10⁻³") ||
		!strings.Contains(tab, "R_TS MN") || !strings.Contains(tab, "P_D MW") || !strings.Contains(tab, fmt.Sprintf(" %.4g ", r.ShipResistance.Value()/1e6)) {
		t.Errorf("table:\n%s", tab)
	}
	in.CorrelationAllowance = -0.0001
	if r, err := ship.ITTC1978(in); err != nil || strings.Contains(r.Warning, "correlation allowance") {
		t.Errorf("the basin's own C_A: %v, %q", err, r.Warning)
	}
}

// TestITTC1978NegativeResidualWarned: a model resistance below
// (1 + k)·C_FM gives a negative C_R, which goes in with a warning.
func TestITTC1978NegativeResidualWarned(t *testing.T) {
	in := poweringInput()
	in.ModelResistance = quantity.New(30, quantity.Force) // C_TM = 2.418e-3 < 1.18·C_FM = 3.56e-3
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	if !(r.Residual < 0) || !strings.Contains(r.Warning, "C_R = ") {
		t.Errorf("C_R = %v, warning %q", r.Residual, r.Warning)
	}
}

// TestITTC1978BladeReynoldsRefused: C_DM = 2(1 + 2t/c)[0.044/Re^(1/6) −
// 5/Re^(2/3)] is negative below Re_co = (5/0.044)² = 12 913.2; such a
// Re_co is refused with a *ship.Error naming it, one just above is accepted
// with a warning, and C_DM, C_DS come back equal to the hand values.
func TestITTC1978BladeReynoldsRefused(t *testing.T) {
	if math.Abs(ship.MinBladeReynolds-12913.223) > 1e-3 {
		t.Errorf("MinBladeReynolds = %v", ship.MinBladeReynolds)
	}
	in := poweringInput()
	in.Propeller.ModelReynolds = 1.2e4
	_, err := ship.ITTC1978(in)
	var pe *ship.Error
	if !errors.As(err, &pe) || pe.Input != "model propeller Reynolds number Re_co" || !errors.Is(err, quantity.ErrInvalid) {
		t.Fatalf("Re_co = 1.2e4: %v", err)
	}
	in.Propeller.ModelReynolds = 1.5e4
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	cdm := 2 * (1 + 2*0.035) * (0.044/math.Pow(1.5e4, 1.0/6) - 5/math.Pow(1.5e4, 2.0/3))
	cds := 2 * (1 + 2*0.035) * math.Pow(1.89+1.62*math.Log10(1.55/30e-6), -2.5)
	if math.Abs(r.ModelBladeDrag-cdm) > 1e-15 || math.Abs(r.ShipBladeDrag-cds) > 1e-15 || !(cdm > 0) {
		t.Errorf("C_DM %v C_DS %v, by hand %v %v", r.ModelBladeDrag, r.ShipBladeDrag, cdm, cds)
	}
	if !strings.Contains(r.Warning, "Re_co = 1.5e+04") {
		t.Errorf("no warning on a low Re_co: %q", r.Warning)
	}
}

// TestITTC1978CorrelationAllowanceFormula: with no C_A from the basin the
// procedure's C_A = (5.68 − 0.6·log₁₀Re_S)·10⁻³ is applied and said; a
// basin's explicit zero applies none.
func TestITTC1978CorrelationAllowanceFormula(t *testing.T) {
	in := poweringInput()
	in.CorrelationAllowance = 0
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	res := 1.75 * math.Sqrt(24) * 7 * 24 / 1.1892e-6 // 1.2111e9
	ca := (5.68 - 0.6*math.Log10(res)) * 1e-3        // 0.2301e-3
	if !r.CorrelationFromFormula || math.Abs(r.CorrelationAllowance-ca) > 1e-15 || math.Abs(ca-0.2301e-3) > 0.0001e-3 {
		t.Errorf("C_A = %v (formula %v), by hand %v", r.CorrelationAllowance, r.CorrelationFromFormula, ca)
	}
	if !strings.Contains(ship.PoweringTable([]ship.PoweringResult{r}, false), "procedure's formula") {
		t.Error("the table does not say C_A is from the formula")
	}
	in.ZeroCorrelationAllowance = true
	z, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	if z.CorrelationFromFormula || z.CorrelationAllowance != 0 || math.Abs(r.ShipCT-z.ShipCT-ca) > 1e-15 {
		t.Errorf("zero C_A: %v %v, C_TS %v vs %v", z.CorrelationAllowance, z.CorrelationFromFormula, z.ShipCT, r.ShipCT)
	}
	in.CorrelationAllowance = 0.0002
	if _, err := ship.ITTC1978(in); err == nil {
		t.Error("ZeroCorrelationAllowance with a non-zero C_A accepted")
	}
}

// TestITTC1978NonFiniteRefused: a NaN open-water value (a channel
// file's missing value) or correlation factor is refused with a
// *ship.Error naming it (and the open-water point).
func TestITTC1978NonFiniteRefused(t *testing.T) {
	for _, c := range []struct {
		name  string
		mod   func(*ship.PoweringInput)
		field string
		point int
	}{
		{"NaN K_T at point 2", func(in *ship.PoweringInput) { in.OpenWater[2].KT = math.NaN() }, "K_T", 2},
		{"NaN J at point 0", func(in *ship.PoweringInput) { in.OpenWater[0].J = math.NaN() }, "J", 0},
		{"Inf K_Q at point 4", func(in *ship.PoweringInput) { in.OpenWater[4].KQ = math.Inf(1) }, "K_Q", 4},
		{"NaN C_P", func(in *ship.PoweringInput) { in.CP = math.NaN() }, "power correlation factor C_P", -1},
		{"NaN C_N", func(in *ship.PoweringInput) { in.CN = math.NaN() }, "revolutions correlation factor C_N", -1},
		{"NaN air drag", func(in *ship.PoweringInput) { in.AirDrag = math.NaN() }, "air drag coefficient C_DA", -1},
		{"NaN C_A", func(in *ship.PoweringInput) { in.CorrelationAllowance = math.NaN() }, "correlation allowance C_A", -1},
	} {
		in := poweringInput()
		c.mod(&in)
		r, err := ship.ITTC1978(in)
		want := c.field
		if c.point >= 0 {
			want = fmt.Sprintf("open-water point %d: %s", c.point, c.field)
		}
		var pe *ship.Error
		if !errors.As(err, &pe) || pe.Input != want || !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("%s: %+v, %v", c.name, r.DeliveredPower, err)
		}
	}
}

// TestTankBlockageExtremeFinite: extreme finite inputs give an error or
// a finite correction, never NaN or Inf with a nil error.
func TestTankBlockageExtremeFinite(t *testing.T) {
	M := math.MaxFloat64
	for _, c := range [][5]float64{ // width, depth, A_x, V, g
		{1e300, 2.2, 0.03, 1, 9.8}, {4.5, 1e300, 0.03, 1, 9.8}, {4.5, 2.2, 0.03, 1, M}, {4.5, 2.2, 0.03, 1e300, 9.8},
		{M, M, 0.03, 1, 9.8}, {4.5, M, 1e-300, 1, M}, {4.5, 2.2, 0.03, 1, 1e300}, {1e-300, 1e-300, 1e-300, 1e-300, 1e-300},
	} {
		r, err := ship.TankBlockage(ship.TankSection{Width: quantity.New(c[0], quantity.Length), Depth: quantity.New(c[1], quantity.Length)},
			quantity.New(c[2], quantity.Area), quantity.New(c[3], quantity.Velocity), quantity.New(c[4], quantity.Acceleration))
		if err != nil {
			continue
		}
		for _, x := range []float64{r.Blockage, r.DepthFroude, r.LinearCorrection, r.SpeedCorrection, r.Speed.Value(), r.SurfaceDrop.Value(), r.CTFactor, r.ChokingSpeed.Value()} {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Errorf("%v: %+v with a nil error", c, r)
				break
			}
		}
	}
}

// laminarTest is a 0.5333 m model (1:60 of a 32 m hull) at 0.9963 m/s
// (15 kn Froude-scaled): Re_m = 0.9963·0.5333/1.1386e-6 = 4.67×10⁵.
func laminarTest() ship.HullTest {
	tank := fluids.State{Density: quantity.New(999.1, quantity.Density), KinematicViscosity: quantity.New(1.1386e-6, quantity.KinematicViscosity)}
	sea := fluids.State{Density: quantity.New(1026.0, quantity.Density), KinematicViscosity: quantity.New(1.1892e-6, quantity.KinematicViscosity)}
	return ship.HullTest{Scale: 1.0 / 60, ModelLength: quantity.New(32.0/60, quantity.Length), ModelWettedArea: quantity.New(414.7/3600, quantity.Area),
		Speeds: []quantity.Quantity{quantity.New(0.9963, quantity.Velocity)}, Resistances: []quantity.Quantity{quantity.New(0.6, quantity.Force)},
		Tank: tank, Sea: sea}
}

// TestHullLaminarWarnedInEveryPath: a model Reynolds number of 4.7×10⁵
// (below LaminarReynolds = 10⁶) is warned about by ExtrapolateHull,
// ExtrapolateHullRun and ITTC1978.
func TestHullLaminarWarnedInEveryPath(t *testing.T) {
	h := laminarTest()
	r, err := ship.ExtrapolateHull(h)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(r.Points[0].Warning, "laminar") || !strings.Contains(r.Table(false), "laminar") {
		t.Errorf("ExtrapolateHull: %q", r.Points[0].Warning)
	}
	run := ship.HullRun{Scale: h.Scale,
		ModelLength: uncertain.Exact(h.ModelLength), ModelWettedArea: uncertain.Exact(h.ModelWettedArea),
		ModelSpeed: uncertain.Exact(h.Speeds[0]), ModelResistance: uncertain.Exact(h.Resistances[0]),
		TankTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)), SeaTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)),
		Tank: fluids.FreshWater(), Sea: fluids.SeaWater()}
	rr, err := ship.ExtrapolateHullRun(run)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(rr.Warning, "laminar") {
		t.Errorf("ExtrapolateHullRun: %q", rr.Warning)
	}
	in := slowShortInput()
	in.ModelSpeed = quantity.New(0.2, quantity.Velocity) // Re_m = 0.2·2/1.1386e-6 = 3.5×10⁵
	in.ModelResistance = quantity.New(0.2, quantity.Force)
	p, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(p.Warning, "laminar") {
		t.Errorf("ITTC1978: %q", p.Warning)
	}
}

// TestHullImplausibleCTFlagged: a 1:60 model given the 1:16 model's
// 30.9 N reading has C_TM = 30.9/(½·999.1·0.9963²·0.1152) = 0.54, far
// above MaxPlausibleCT.
func TestHullImplausibleCTFlagged(t *testing.T) {
	h := laminarTest()
	h.Resistances[0] = quantity.New(30.9, quantity.Force)
	r, err := ship.ExtrapolateHull(h)
	if err != nil {
		t.Fatal(err)
	}
	if ct := r.Points[0].ModelCT; math.Abs(ct-30.9/(0.5*999.1*0.9963*0.9963*414.7/3600)) > 1e-12 || !strings.Contains(r.Points[0].Warning, "beyond any towed hull") {
		t.Errorf("C_TM %v, warning %q", ct, r.Points[0].Warning)
	}
}

// TestHullZeroFormFactorAlike: HullTest and HullRun both read a zero
// form factor as 1 + k = 1, so the two paths give the same ship
// resistance.
func TestHullZeroFormFactorAlike(t *testing.T) {
	tank, _ := fluids.FreshWater().AtCelsius(15)
	sea, _ := fluids.SeaWater().AtCelsius(15)
	h := ship.HullTest{Scale: 1.0 / 16, ModelLength: quantity.New(2, quantity.Length), ModelWettedArea: quantity.New(1.62, quantity.Area),
		Speeds: []quantity.Quantity{quantity.New(2, quantity.Velocity)}, Resistances: []quantity.Quantity{quantity.New(22.3, quantity.Force)},
		Tank: tank, Sea: sea}
	a, err := ship.ExtrapolateHull(h)
	if err != nil {
		t.Fatal(err)
	}
	run := ship.HullRun{Scale: h.Scale,
		ModelLength: uncertain.Exact(h.ModelLength), ModelWettedArea: uncertain.Exact(h.ModelWettedArea),
		ModelSpeed: uncertain.Exact(h.Speeds[0]), ModelResistance: uncertain.Exact(h.Resistances[0]),
		TankTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)), SeaTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)),
		Tank: fluids.FreshWater(), Sea: fluids.SeaWater()}
	b, err := ship.ExtrapolateHullRun(run)
	if err != nil {
		t.Fatalf("HullRun with a zero form factor: %v", err)
	}
	if a.FormFactor != 1 || b.FormFactor.Value() != 1 || math.Abs(b.ShipResistance.Value()/a.Points[0].ShipResistance.Value()-1) > 1e-12 {
		t.Errorf("1 + k: %v vs %v; R_S %v vs %v", a.FormFactor, b.FormFactor.Value(), a.Points[0].ShipResistance, b.ShipResistance.Value())
	}
}

// TestHullTableStatesWhatCTSIncludes: the extrapolation table prints
// C_FS and C_TS per run and says that C_TS includes C_A, with both
// wetted surfaces (1.62 m² and 1.62·256 = 414.72 m²).
func TestHullTableStatesWhatCTSIncludes(t *testing.T) {
	h := laminarTest()
	h.Scale, h.ModelLength, h.ModelWettedArea = 1.0/16, quantity.New(2, quantity.Length), quantity.New(1.62, quantity.Area)
	h.Speeds[0], h.Resistances[0], h.Allowance = quantity.New(2, quantity.Velocity), quantity.New(22.3, quantity.Force), 0.0004
	r, err := ship.ExtrapolateHull(h)
	if err != nil {
		t.Fatal(err)
	}
	tab := r.Table(false)
	for _, want := range []string{"C_TS = (1 + k)·C_FS + C_R + C_A", "model 1.62 m², ship 414.7 m²", "C_FS×10³", "C_TS×10³",
		fmt.Sprintf("%.3f", r.Points[0].ShipCT*1e3)} {
		if !strings.Contains(tab, want) {
			t.Errorf("table lacks %q:\n%s", want, tab)
		}
	}
}
