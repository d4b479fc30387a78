package ship_test

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// poweringInput is an invented single-screw case: a 7.0 m model of a
// 168 m ship (λ = 1/24) at 1.75 m/s, with its self-propulsion factors and
// an open-water curve.
func poweringInput() ship.PoweringInput {
	tank := fluids.State{Density: quantity.New(999.1, quantity.Density), KinematicViscosity: quantity.New(1.1386e-6, quantity.KinematicViscosity)}
	sea := fluids.State{Density: quantity.New(1026.0, quantity.Density), KinematicViscosity: quantity.New(1.1892e-6, quantity.KinematicViscosity)}
	return ship.PoweringInput{
		Scale:       1.0 / 24,
		ModelLength: quantity.New(7.0, quantity.Length), ModelWettedArea: quantity.New(8.1, quantity.Area),
		ModelSpeed: quantity.New(1.75, quantity.Velocity), ModelResistance: quantity.New(45.0, quantity.Force),
		Tank: tank, Sea: sea,
		FormFactor:           1.18,
		CorrelationAllowance: 0.0001,
		TransverseArea:       quantity.New(420, quantity.Area),
		ModelWake:            0.32, ThrustDeduction: 0.20, RelativeRotative: 1.01,
		Propeller: ship.PropellerGeometry{
			Diameter: quantity.New(6.2, quantity.Length), Blades: 4, PitchRatio: 0.75,
			Chord: quantity.New(1.55, quantity.Length), ThicknessRatio: 0.035, ModelReynolds: 4.0e5,
		},
		OpenWater: []ship.OpenWaterPoint{
			{J: 0.1, KT: 0.300, KQ: 0.0350}, {J: 0.3, KT: 0.235, KQ: 0.0295}, {J: 0.5, KT: 0.160, KQ: 0.0225},
			{J: 0.7, KT: 0.080, KQ: 0.0145}, {J: 0.8, KT: 0.035, KQ: 0.0100},
		},
	}
}

// TestITTC1978ByHand works the prediction out step by step with plain
// numbers, as a basin's sheet would, and compares every coefficient.
func TestITTC1978ByHand(t *testing.T) {
	in := poweringInput()
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	cf := func(re float64) float64 { d := math.Log10(re) - 2; return 0.075 / (d * d) }
	const lam = 24.0
	vm, lm, sm := 1.75, 7.0, 8.1
	vs, ls, ss := vm*math.Sqrt(lam), lm*lam, sm*lam*lam
	rem, res := vm*lm/1.1386e-6, vs*ls/1.1892e-6
	ctm := 45.0 / (0.5 * 999.1 * vm * vm * sm)
	cfm, cfs := cf(rem), cf(res)
	cr := ctm - 1.18*cfm
	dcf := 0.044*(math.Cbrt(150e-6/ls)-10*math.Pow(res, -1.0/3)) + 0.000125
	caas := 0.8 * 1.225 * 420 / (1026 * ss)
	cts := 1.18*cfs + dcf + 0.0001 + cr + caas
	rts := cts * 0.5 * 1026 * vs * vs * ss
	wts := (0.20 + 0.04) + (0.32-0.20-0.04)*(1.18*cfs+dcf)/(1.18*cfm)
	cdm := 2 * (1 + 2*0.035) * (0.044/math.Pow(4e5, 1.0/6) - 5/math.Pow(4e5, 2.0/3))
	cds := 2 * (1 + 2*0.035) * math.Pow(1.89+1.62*math.Log10(1.55/30e-6), -2.5)
	dcd := cdm - cds
	dkt := -dcd * 0.3 * 0.75 * (1.55 * 4 / 6.2)
	dkq := dcd * 0.25 * (1.55 * 4 / 6.2)
	load := ss * cts / (2 * 6.2 * 6.2 * (1 - 0.20) * (1 - wts) * (1 - wts))
	// J on the corrected curve: between J = 0.5 and 0.7 here, where
	// K_T = 0.160 − 0.4(J − 0.5) − ΔK_T; solve 0.360 − 0.4J − ΔK_T = load·J².
	a, b, c := load, 0.4, -(0.360 - dkt)
	j := (-b + math.Sqrt(b*b-4*a*c)) / (2 * a)
	kt := 0.360 - 0.4*j - dkt
	kq := 0.0225 + (j-0.5)/0.2*(0.0145-0.0225) - dkq
	n := (1 - wts) * vs / (j * 6.2)
	pd := 2 * math.Pi * 1026 * n * n * n * math.Pow(6.2, 5) * kq / 1.01
	eta0 := j * kt / (2 * math.Pi * kq)
	etaD := eta0 * (1 - 0.20) / (1 - wts) * 1.01
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"C_TM", r.ModelCT, ctm}, {"C_FM", r.ModelCF, cfm}, {"C_R", r.Residual, cr},
		{"C_FS", r.ShipCF, cfs}, {"ΔC_F", r.RoughnessAllowance, dcf}, {"C_AAS", r.AirResistance, caas},
		{"C_TS", r.ShipCT, cts}, {"R_TS", r.ShipResistance.Value(), rts}, {"P_E", r.EffectivePower.Value(), rts * vs},
		{"w_TS", r.ShipWake, wts}, {"ΔC_D", r.DeltaCD, dcd}, {"ΔK_T", r.DeltaKT, dkt}, {"ΔK_Q", r.DeltaKQ, dkq},
		{"K_T/J²", r.Load, load}, {"J", r.J, j}, {"K_T", r.KT, kt}, {"K_Q", r.KQ, kq},
		{"n", r.RevsPerSecond, n}, {"P_D", r.DeliveredPower.Value(), pd}, {"η_0", r.Eta0, eta0}, {"η_D", r.EtaD, etaD},
	} {
		if math.Abs(c.got-c.want) > 1e-9*math.Abs(c.want) {
			t.Errorf("%s = %.8g, by hand %.8g", c.name, c.got, c.want)
		}
	}
	// The propulsive efficiency ties the two powers: P_D = P_E/η_D.
	if d := r.DeliveredPower.Value() - r.EffectivePower.Value()/r.EtaD; math.Abs(d) > 1e-9*r.DeliveredPower.Value() {
		t.Errorf("P_D = %v, P_E/η_D = %v", r.DeliveredPower, r.EffectivePower.Value()/r.EtaD)
	}
	if !(j > 0.5 && j < 0.7) {
		t.Fatalf("J = %v: the hand calculation assumed 0.5 … 0.7", j)
	}
}

// TestITTC1978Variants: twin screws halve the load per propeller and keep
// the model wake; the correlation factors scale P_D and n; a load beyond
// the measured curve is refused.
func TestITTC1978Variants(t *testing.T) {
	in := poweringInput()
	one, _ := ship.ITTC1978(in)
	in.Propellers = 2
	two, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	if two.ShipWake != 0.32 || math.Abs(two.Load-one.Load*(1-one.ShipWake)*(1-one.ShipWake)/(2*(1-0.32)*(1-0.32))) > 1e-12 {
		t.Errorf("twin screw: w_TS = %v, load %v (single %v)", two.ShipWake, two.Load, one.Load)
	}
	in = poweringInput()
	in.CP, in.CN = 1.05, 1.02
	cor, _ := ship.ITTC1978(in)
	if math.Abs(cor.DeliveredPower.Value()/one.DeliveredPower.Value()-1.05) > 1e-12 || math.Abs(cor.RPM/one.RPM-1.02) > 1e-12 {
		t.Errorf("C_P, C_N: %v, %v", cor.DeliveredPower, cor.RPM)
	}
	in = poweringInput()
	in.ModelResistance = quantity.New(4000, quantity.Force)
	if _, err := ship.ITTC1978(in); err == nil {
		t.Errorf("a load beyond the open-water curve accepted")
	}
	in = poweringInput()
	in.OpenWater[1].J = 0.9
	if _, err := ship.ITTC1978(in); err == nil {
		t.Errorf("an unsorted open-water curve accepted")
	}
}

// A single-screw ship at one speed (invented tests): the full-scale
// resistance, wake, operating point, revolutions and delivered power.
func ExampleITTC1978() {
	r, err := ship.ITTC1978(poweringInput())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("V_S = %.2f kn, C_TS = %.3f×10⁻³, R_TS = %.0f kN, P_E = %.0f kW\n",
		r.ShipSpeed.Value()*3600/1852, r.ShipCT*1e3, r.ShipResistance.Value()/1e3, r.EffectivePower.Value()/1e3)
	fmt.Printf("w_TS = %.3f, J = %.3f, K_T = %.4f, K_Q = %.5f, η_0 = %.3f, η_H = %.3f, η_D = %.3f\n",
		r.ShipWake, r.J, r.KT, r.KQ, r.Eta0, r.EtaH, r.EtaD)
	fmt.Printf("n = %.1f rpm, P_D = %.0f kW\n", r.RPM, r.DeliveredPower.Value()/1e3)
	// Output:
	// V_S = 16.66 kn, C_TS = 2.222×10⁻³, R_TS = 391 kN, P_E = 3351 kW
	// w_TS = 0.283, J = 0.603, K_T = 0.1192, K_Q = 0.01805, η_0 = 0.633, η_H = 1.117, η_D = 0.714
	// n = 98.6 rpm, P_D = 4691 kW
}

// TestPoweringTable: the table carries the figures of the result and the
// caution, as text and as Markdown.
func TestPoweringTable(t *testing.T) {
	r, err := ship.ITTC1978(poweringInput())
	if err != nil {
		t.Fatal(err)
	}
	txt := ship.PoweringTable([]ship.PoweringResult{r}, false)
	md := ship.PoweringTable([]ship.PoweringResult{r}, true)
	for _, want := range []string{"16.66", "390.9", "3351", "0.283", "0.603", "98.6", "4691", "R_TS kN", "P_E kW", "P_D kW", "CAUTION:", "n in rev/s"} {
		if !strings.Contains(txt, want) || !strings.Contains(md, want) {
			t.Errorf("table lacks %q:\n%s\n%s", want, txt, md)
		}
	}
	if !strings.Contains(md, "| V_S kn | Fn |") {
		t.Errorf("Markdown header:\n%s", md)
	}
}
