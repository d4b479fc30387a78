package ship_test

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// Synthetic open-water curve of the model propeller of poweringInput
// (D = 6.2 m/24): K_T and K_Q known quadratics in J, n in rev/s.
var (
	synKT = [3]float64{0.33, -0.25, -0.10}
	synKQ = [3]float64{0.038, -0.018, -0.012}
)

const synD = 6.2 / 24 // m, model propeller

func quadratic(c [3]float64, x float64) float64 { return c[0] + c[1]*x + c[2]*x*x }

var synWater = fluids.State{Density: quantity.New(999.1, quantity.Density), KinematicViscosity: quantity.New(1.1386e-6, quantity.KinematicViscosity)}

// synOpenWater returns an open-water test at n = 20 rev/s over
// J = 0.1 … 0.9 with the synthetic curve plus noise·(a fixed pattern).
func synOpenWater(noise float64) ship.OpenWaterTest {
	pattern := []float64{0.8, -1.1, 0.3, 1.4, -0.6, -1.3, 0.9, 0.2, -0.4}
	n, d, rho := 20.0, synD, 999.1
	t := ship.OpenWaterTest{Diameter: quantity.New(d, quantity.Length), Chord: quantity.New(1.5/24, quantity.Length), Water: synWater, Order: 2}
	for i := range 9 {
		j := 0.1 + 0.1*float64(i)
		kt := quadratic(synKT, j) + noise*pattern[i]
		kq := quadratic(synKQ, j) + 0.1*noise*pattern[(i+4)%9]
		t.Runs = append(t.Runs, ship.OpenWaterRun{
			Speed: quantity.New(j*n*d, quantity.Velocity), RevsPerSecond: n,
			Thrust: quantity.New(kt*rho*n*n*math.Pow(d, 4), quantity.Force), Torque: quantity.New(kq*rho*n*n*math.Pow(d, 5), quantity.Torque),
		})
	}
	return t
}

// TestOpenWaterRunByHand reduces one run by hand: V_A = 1.5 m/s,
// n = 15 rev/s, D = 0.2 m, ρ = 1000 kg/m³, T = 90 N, Q = 2.88 N·m,
// c_0.7 = 0.06 m, ν = 1.14×10⁻⁶ m²/s:
//
//	J    = 1.5/(15·0.2)                  = 0.5
//	K_T  = 90/(1000·15²·0.2⁴) = 90/360   = 0.25
//	K_Q  = 2.88/(1000·15²·0.2⁵) = 2.88/72 = 0.04
//	η₀   = 0.5·0.25/(2π·0.04)            = 0.497 359
//	Re_0.7 = 0.06·√(1.5² + (0.7π·15·0.2)²)/1.14×10⁻⁶
//	       = 0.06·√(2.25 + 43.5244)/1.14×10⁻⁶ = 0.06·6.76568/1.14×10⁻⁶ ≈ 356 088
func TestOpenWaterRunByHand(t *testing.T) {
	water := fluids.State{Density: quantity.New(1000, quantity.Density), KinematicViscosity: quantity.New(1.14e-6, quantity.KinematicViscosity)}
	test := ship.OpenWaterTest{Diameter: quantity.New(0.2, quantity.Length), Chord: quantity.New(0.06, quantity.Length), Water: water, Order: 1}
	for i, va := range []float64{0.3, 0.9, 1.5, 2.1, 2.7} {
		th, qq := 90.0, 2.88
		if i != 2 { // the others on straight lines through the hand point
			j := va / 3
			th = 360 * (0.25 - 0.3*(j-0.5))
			qq = 72 * (0.04 - 0.03*(j-0.5))
		}
		test.Runs = append(test.Runs, ship.OpenWaterRun{Speed: quantity.New(va, quantity.Velocity), RevsPerSecond: 15,
			Thrust: quantity.New(th, quantity.Force), Torque: quantity.New(qq, quantity.Torque)})
	}
	f, err := ship.ReduceOpenWater(test)
	if err != nil {
		t.Fatal(err)
	}
	p := f.Points[2]
	want := []float64{0.5, 0.25, 0.04, 0.5 * 0.25 / (2 * math.Pi * 0.04), 356088}
	got := []float64{p.J, p.KT, p.KQ, p.Eta0, p.Reynolds}
	tol := []float64{1e-12, 1e-12, 1e-12, 1e-12, 1e-5}
	for i := range got {
		if math.Abs(got[i]/want[i]-1) > tol[i] {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
	if math.Abs(0.497359/p.Eta0-1) > 1e-6 {
		t.Errorf("η₀ = %v, by hand 0.497359", p.Eta0)
	}
	if f.Warning != "" {
		t.Errorf("unexpected warning: %s", f.Warning)
	}
}

// TestOpenWaterRoundTrip: exact data from known quadratics are recovered
// to rounding, and with noise the true coefficients lie within the fits'
// 95 % intervals.
func TestOpenWaterRoundTrip(t *testing.T) {
	for _, noise := range []float64{0, 0.002} {
		f, err := ship.ReduceOpenWater(synOpenWater(noise))
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			name string
			p    *fit.Poly
			want [3]float64
		}{{"K_T", f.KT, synKT}, {"K_Q", f.KQ, synKQ}} {
			a, se, err := c.p.Power()
			if err != nil {
				t.Fatal(err)
			}
			for k := range 3 {
				if noise == 0 && math.Abs(a[k]-c.want[k]) > 1e-12 {
					t.Errorf("exact %s: a%d = %v, want %v", c.name, k, a[k], c.want[k])
				}
				if noise > 0 && !(math.Abs(a[k]-c.want[k]) <= 2.5*se[k]) {
					t.Errorf("noisy %s: a%d = %v ± %v, true %v outside the interval", c.name, k, a[k], se[k], c.want[k])
				}
			}
		}
		j, err := f.JForKT(quadratic(synKT, 0.55))
		if err != nil || (noise == 0 && math.Abs(j-0.55) > 1e-9) {
			t.Errorf("JForKT: %v, %v, want 0.55", j, err)
		}
	}
}

// TestOpenWaterRefusals: a low Reynolds number is warned of; a run in
// rad/s read as rev/s (n 2π too high) gives K_T 4π² too small and K_T
// rising with J is refused; bad runs are refused with their class.
func TestOpenWaterRefusals(t *testing.T) {
	low := synOpenWater(0)
	low.Chord = quantity.New(0.01, quantity.Length)
	f, err := ship.ReduceOpenWater(low)
	if err != nil || f.Warning == "" {
		t.Errorf("low Re: %v, warning %q", err, f.Warning)
	}
	for _, c := range []struct {
		name  string
		edit  func(*ship.OpenWaterTest)
		class error
	}{
		{"n zero", func(o *ship.OpenWaterTest) { o.Runs[2].RevsPerSecond = 0 }, quantity.ErrInvalid},
		{"NaN thrust", func(o *ship.OpenWaterTest) { o.Runs[2].Thrust = quantity.New(math.NaN(), quantity.Force) }, quantity.ErrInvalid},
		{"torque as force", func(o *ship.OpenWaterTest) { o.Runs[2].Torque = quantity.New(1, quantity.Force) }, quantity.ErrDimension},
		{"few runs", func(o *ship.OpenWaterTest) { o.Runs = o.Runs[:4] }, quantity.ErrInvalid},
		{"K_T rising", func(o *ship.OpenWaterTest) {
			for i := range o.Runs {
				o.Runs[i].Thrust = quantity.New(float64(i+1), quantity.Force)
			}
		}, quantity.ErrInvalid},
	} {
		o := synOpenWater(0)
		o.Runs = append([]ship.OpenWaterRun(nil), o.Runs...)
		c.edit(&o)
		_, err := ship.ReduceOpenWater(o)
		if !errors.Is(err, c.class) {
			t.Errorf("%s: %v, want class %v", c.name, err, c.class)
		}
	}
	f, _ = ship.ReduceOpenWater(synOpenWater(0))
	if _, err := f.At(1.2); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("At(1.2): %v, want ErrRange", err)
	}
	if _, err := f.JForKT(0.5); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("JForKT(0.5): %v, want ErrRange", err)
	}
}

// synResistance is a resistance test of poweringInput's model with
// C_TM = 4.2×10⁻³ − 0.4×10⁻³·V + 0.1×10⁻³·V² exactly.
func synResistance() ship.HullTest {
	in := poweringInput()
	h := ship.HullTest{Scale: in.Scale, ModelLength: in.ModelLength, ModelWettedArea: in.ModelWettedArea, Tank: in.Tank, Sea: in.Sea, FormFactor: in.FormFactor}
	for i := range 7 {
		v := 1.0 + 0.2*float64(i)
		ct := 4.2e-3 - 0.4e-3*v + 0.1e-3*v*v
		h.Speeds = append(h.Speeds, quantity.New(v, quantity.Velocity))
		h.Resistances = append(h.Resistances, quantity.New(ct*0.5*999.1*v*v*8.1, quantity.Force))
	}
	return h
}

func TestResistanceFairingRoundTrip(t *testing.T) {
	r, err := ship.FairResistance(synResistance(), 0)
	if err != nil {
		t.Fatal(err)
	}
	// C_TM(1.75) = 4.2e-3 − 0.7e-3 + 0.30625e-3 = 3.80625e-3;
	// R = 3.80625e-3·½·999.1·1.75²·8.1 = 47.1704… N.
	got, pr, err := r.At(quantity.New(1.75, quantity.Velocity))
	if err != nil {
		t.Fatal(err)
	}
	want := 3.80625e-3 * 0.5 * 999.1 * 1.75 * 1.75 * 8.1
	if math.Abs(got.Value()/want-1) > 1e-9 || math.Abs(pr.Y-3.80625e-3) > 1e-12 {
		t.Errorf("R(1.75) = %v (C_TM %v), by hand %v", got, pr.Y, want)
	}
	if _, _, err := r.At(quantity.New(2.5, quantity.Velocity)); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("outside the runs: %v", err)
	}
}

// TestSkinFrictionByHand works F_D out for poweringInput at 1.75 m/s:
// Re_M = 1.75·7/1.1386e-6, Re_S = 1.75·√24·168/1.1892e-6; C_F by the
// ITTC-1957 line; ΔC_F = 0.044[(150e-6/168)^(1/3) − 10·Re_S^(−1/3)] +
// 0.000125; C_A = 0.0001 (given); F_D = ½·999.1·1.75²·8.1·[1.18(C_FM −
// C_FS) − ΔC_F − C_A].
func TestSkinFrictionByHand(t *testing.T) {
	in := poweringInput()
	s, err := ship.SkinFrictionCorrection(in)
	if err != nil {
		t.Fatal(err)
	}
	cf := func(re float64) float64 { d := math.Log10(re) - 2; return 0.075 / (d * d) }
	rem := 1.75 * 7 / 1.1386e-6
	res := 1.75 * math.Sqrt(24) * 168 / 1.1892e-6
	dcf := 0.044*(math.Cbrt(150e-6/168)-10*math.Pow(res, -1.0/3)) + 0.000125
	fd := 0.5 * 999.1 * 1.75 * 1.75 * 8.1 * (1.18*(cf(rem)-cf(res)) - dcf - 0.0001)
	if math.Abs(s.Force.Value()/fd-1) > 1e-12 {
		t.Errorf("F_D = %v, by hand %v", s.Force, fd)
	}
	// About 18.5 N: C_FM ≈ 2.96×10⁻³, C_FS ≈ 1.50×10⁻³ at these Re.
	if !(s.Force.Value() > 15 && s.Force.Value() < 25) {
		t.Errorf("F_D = %v N, want about 20 N", s.Force.Value())
	}
	// The result agrees with ITTC1978's own ΔC_F and C_A.
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	if s.RoughnessAllowance != r.RoughnessAllowance || s.CorrelationAllowance != r.CorrelationAllowance || s.ShipCF != r.ShipCF {
		t.Errorf("skin friction %+v and ITTC1978 %+v differ", s, r)
	}
}

// Synthetic self-propulsion factors, recovered by the analysis.
const synW, synT, synEtaR, synFD = 0.30, 0.18, 1.01, 20.0

// synSelfPropulsion builds self-propulsion runs at the model speeds from
// the known factors: at each speed n is found so that the thrust
// T = K_T(J)ρn²D⁴, J = (1 − w)V/(nD), satisfies T(1 − t) + F_D = R_TM,
// and Q = K_Q(J)ρn²D⁵/η_R.
func synSelfPropulsion(t *testing.T, ow *ship.OpenWaterFit, res *ship.ResistanceFit) ship.SelfPropulsionTest {
	sp := ship.SelfPropulsionTest{Diameter: quantity.New(synD, quantity.Length), Water: synWater, OpenWater: ow, Resistance: res}
	rho, d := 999.1, synD
	for _, v := range []float64{1.4, 1.55, 1.7, 1.85, 2.0} {
		rq, _, err := res.At(quantity.New(v, quantity.Velocity))
		if err != nil {
			t.Fatal(err)
		}
		need := (rq.Value() - synFD) / (1 - synT)
		thrust := func(n float64) float64 {
			j := (1 - synW) * v / (n * d)
			return quadratic(synKT, j) * rho * n * n * math.Pow(d, 4)
		}
		lo, hi := (1-synW)*v/(0.85*d), (1-synW)*v/(0.15*d)
		for range 200 {
			m := (lo + hi) / 2
			if thrust(m) < need {
				lo = m
			} else {
				hi = m
			}
		}
		n := (lo + hi) / 2
		j := (1 - synW) * v / (n * d)
		sp.Runs = append(sp.Runs, ship.SelfPropulsionRun{ModelSpeed: quantity.New(v, quantity.Velocity), RevsPerSecond: n,
			Thrust:      quantity.New(thrust(n), quantity.Force),
			Torque:      quantity.New(quadratic(synKQ, j)*rho*n*n*math.Pow(d, 5)/synEtaR, quantity.Torque),
			TowingForce: quantity.New(synFD, quantity.Force)})
	}
	return sp
}

func TestSelfPropulsionRoundTrip(t *testing.T) {
	ow, err := ship.ReduceOpenWater(synOpenWater(0))
	if err != nil {
		t.Fatal(err)
	}
	res, err := ship.FairResistance(synResistance(), 2)
	if err != nil {
		t.Fatal(err)
	}
	pts, err := ship.AnalyseSelfPropulsion(synSelfPropulsion(t, ow, res))
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range pts {
		eta0 := p.J * p.KT / (2 * math.Pi * quadratic(synKQ, p.J))
		got := []float64{p.Wake, p.ThrustDeduction, p.RelativeRotative, p.EtaH, p.Eta0, p.EtaD}
		want := []float64{synW, synT, synEtaR, (1 - synT) / (1 - synW), eta0, (1 - synT) / (1 - synW) * eta0 * synEtaR}
		for i := range got {
			if math.Abs(got[i]-want[i]) > 1e-9 {
				t.Errorf("V = %v: factor %d = %v, want %v", p.ModelSpeed, i, got[i], want[i])
			}
		}
	}
}

// TestSelfPropulsionByHand analyses one run by hand on a linear
// open-water curve K_T = 0.4 − 0.4J, K_Q = 0.05 − 0.04J (D = 0.2 m,
// ρ = 1000 kg/m³): V = 1.2 m/s, n = 10 rev/s, T = 32 N, Q = 0.96 N·m,
// F_D = 4 N, R_TM = 30 N:
//
//	K_TM = 32/(1000·100·0.0016)    = 0.2   → J_TM = (0.4 − 0.2)/0.4 = 0.5
//	w_TM = 1 − 0.5·10·0.2/1.2      = 1/6 ≈ 0.166 667
//	t    = (32 + 4 − 30)/32        = 0.1875
//	K_QM = 0.96/(1000·100·0.00032) = 0.03; K_Q0 = 0.05 − 0.02 = 0.03 → η_R = 1
//	η_O  = 0.5·0.2/(2π·0.03)       = 0.530 516
//	η_H  = 0.8125/(5/6)            = 0.975
func TestSelfPropulsionByHand(t *testing.T) {
	water := fluids.State{Density: quantity.New(1000, quantity.Density), KinematicViscosity: quantity.New(1.14e-6, quantity.KinematicViscosity)}
	ot := ship.OpenWaterTest{Diameter: quantity.New(0.2, quantity.Length), Chord: quantity.New(0.06, quantity.Length), Water: water, Order: 1}
	for _, j := range []float64{0.1, 0.3, 0.5, 0.7, 0.9} {
		ot.Runs = append(ot.Runs, ship.OpenWaterRun{Speed: quantity.New(j*3, quantity.Velocity), RevsPerSecond: 15,
			Thrust: quantity.New((0.4-0.4*j)*360, quantity.Force), Torque: quantity.New((0.05-0.04*j)*72, quantity.Torque)})
	}
	ow, err := ship.ReduceOpenWater(ot)
	if err != nil {
		t.Fatal(err)
	}
	pts, err := ship.AnalyseSelfPropulsion(ship.SelfPropulsionTest{Diameter: quantity.New(0.2, quantity.Length), Water: water, OpenWater: ow,
		Runs: []ship.SelfPropulsionRun{{ModelSpeed: quantity.New(1.2, quantity.Velocity), RevsPerSecond: 10, Thrust: quantity.New(32, quantity.Force),
			Torque: quantity.New(0.96, quantity.Torque), TowingForce: quantity.New(4, quantity.Force), Resistance: quantity.New(30, quantity.Force)}}})
	if err != nil {
		t.Fatal(err)
	}
	p := pts[0]
	got := []float64{p.KT, p.J, p.Wake, p.ThrustDeduction, p.KQ, p.RelativeRotative, p.Eta0, p.EtaH, p.EtaD}
	want := []float64{0.2, 0.5, 1.0 / 6, 0.1875, 0.03, 1, 0.530516, 0.975, 0.975 * 0.530516}
	for i := range got {
		if math.Abs(got[i]-want[i]) > 1e-6 {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
}

// speedPowerInput is the synthetic chain of poweringInput's ship.
func speedPowerInput(t *testing.T, noise float64) ship.SpeedPowerInput {
	ow, err := ship.ReduceOpenWater(synOpenWater(noise))
	if err != nil {
		t.Fatal(err)
	}
	res, err := ship.FairResistance(synResistance(), 2)
	if err != nil {
		t.Fatal(err)
	}
	exact, err := ship.ReduceOpenWater(synOpenWater(0))
	if err != nil {
		t.Fatal(err)
	}
	sp := synSelfPropulsion(t, exact, res)
	sp.OpenWater = ow
	base := poweringInput()
	base.ModelSpeed, base.ModelResistance = quantity.Quantity{}, quantity.Quantity{}
	base.ModelWake, base.ThrustDeduction, base.RelativeRotative, base.OpenWater = 0, 0, 0, nil
	var vs []quantity.Quantity
	for _, vm := range []float64{1.5, 1.75, 1.95} {
		vs = append(vs, quantity.New(vm/math.Sqrt(base.Scale), quantity.Velocity))
	}
	return ship.SpeedPowerInput{Base: base, SelfPropulsion: sp, ShipSpeeds: vs}
}

// TestSpeedPowerMatchesITTC1978: on exact data the chain gives what
// ITTC1978 gives with the known factors, the faired curve and the
// resistance by hand, with a band of zero width; with noise in the
// open-water test the band is positive and grows in proportion to it.
func TestSpeedPowerMatchesITTC1978(t *testing.T) {
	spIn := speedPowerInput(t, 0)
	sp, err := ship.PredictSpeedPower(spIn)
	if err != nil {
		t.Fatal(err)
	}
	in := poweringInput()
	in.OpenWater = nil
	in.Faired = spIn.SelfPropulsion.OpenWater
	for i, vm := range []float64{1.5, 1.75, 1.95} {
		in.ModelSpeed = quantity.New(vm, quantity.Velocity)
		ct := 4.2e-3 - 0.4e-3*vm + 0.1e-3*vm*vm
		in.ModelResistance = quantity.New(ct*0.5*999.1*vm*vm*8.1, quantity.Force)
		in.ModelWake, in.ThrustDeduction, in.RelativeRotative = synW, synT, synEtaR
		want, err := ship.ITTC1978(in)
		if err != nil {
			t.Fatal(err)
		}
		got := sp.Points[i]
		if math.Abs(got.DeliveredPower.Value()/want.DeliveredPower.Value()-1) > 1e-8 || math.Abs(got.RPM/want.RPM-1) > 1e-8 {
			t.Errorf("V_M = %v: P_D %v, n %v rpm; ITTC1978 %v, %v rpm", vm, got.DeliveredPower, got.RPM, want.DeliveredPower, want.RPM)
		}
		if got.PowerU > 1e-6*got.DeliveredPower.Value() {
			t.Errorf("exact data: u(P_D) = %v", got.PowerU)
		}
	}
	a, err := ship.PredictSpeedPower(speedPowerInput(t, 0.001))
	if err != nil {
		t.Fatal(err)
	}
	b, err := ship.PredictSpeedPower(speedPowerInput(t, 0.002))
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.Points {
		pa, pb := a.Points[i], b.Points[i]
		if !(pa.PowerU > 0) || !(pa.Power[0] < pa.DeliveredPower.Value() && pa.DeliveredPower.Value() < pa.Power[1]) {
			t.Errorf("noisy point %d: u = %v, band %v about %v", i, pa.PowerU, pa.Power, pa.DeliveredPower)
		}
		if r := pb.PowerU / pa.PowerU; math.Abs(r-2) > 0.1 {
			t.Errorf("point %d: doubling the noise scales u(P_D) by %v, want 2", i, r)
		}
	}
}

func TestSpeedPowerRefusals(t *testing.T) {
	in := speedPowerInput(t, 0)
	in.ShipSpeeds = []quantity.Quantity{quantity.New(3.0/math.Sqrt(in.Base.Scale), quantity.Velocity)}
	if _, err := ship.PredictSpeedPower(in); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("speed beyond the tests: %v, want ErrRange", err)
	}
	in = speedPowerInput(t, 0)
	in.Base.ModelWake = 0.2
	if _, err := ship.PredictSpeedPower(in); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("base with a wake: %v, want ErrInvalid", err)
	}
	p := poweringInput()
	p.Faired, _ = ship.ReduceOpenWater(synOpenWater(0))
	if _, err := ship.ITTC1978(p); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("table and faired curve both: %v, want ErrInvalid", err)
	}
}

// TestITTC1978FairedCurve: with a faired curve the operating point lies
// on the polynomials, not on a straight line between table points.
func TestITTC1978FairedCurve(t *testing.T) {
	ow, err := ship.ReduceOpenWater(synOpenWater(0))
	if err != nil {
		t.Fatal(err)
	}
	in := poweringInput()
	in.OpenWater, in.Faired = nil, ow
	r, err := ship.ITTC1978(in)
	if err != nil {
		t.Fatal(err)
	}
	if kt := quadratic(synKT, r.J) - r.DeltaKT; math.Abs(r.KT-kt) > 1e-12 || math.Abs(r.KT-r.Load*r.J*r.J) > 1e-9 {
		t.Errorf("K_T = %v at J = %v; the faired curve gives %v and the load %v", r.KT, r.J, kt, r.Load*r.J*r.J)
	}
}

// The open-water test of a model propeller, reduced and faired.
// Invented runs on a known curve.
func ExampleReduceOpenWater() {
	f, err := ship.ReduceOpenWater(synOpenWater(0.002))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("K_T: order %d, S = %.2g; K_Q: order %d, S = %.2g (%d runs)\n", f.KT.Order, f.KT.S, f.KQ.Order, f.KQ.S, f.KT.N)
	for _, j := range []float64{0.2, 0.5, 0.8} {
		p, _ := f.At(j)
		e, _ := f.Eta0(j)
		pr, _ := f.KT.Predict(j)
		fmt.Printf("J = %.1f: K_T = %.4f (95 %% mean %.4f … %.4f), 10K_Q = %.4f, η₀ = %.3f\n", j, p.KT, pr.Mean[0], pr.Mean[1], 10*p.KQ, e)
	}
	fmt.Printf("Re_0.7 = %.3g … %.3g\n", f.MinReynolds, f.MaxReynolds)
	// Output:
	// K_T: order 2, S = 0.0021; K_Q: order 2, S = 0.00019 (9 runs)
	// J = 0.2: K_T = 0.2763 (95 % mean 0.2736 … 0.2791), 10K_Q = 0.3383, η₀ = 0.260
	// J = 0.5: K_T = 0.1800 (95 % mean 0.1773 … 0.1826), 10K_Q = 0.2599, η₀ = 0.551
	// J = 0.8: K_T = 0.0658 (95 % mean 0.0631 … 0.0686), 10K_Q = 0.1602, η₀ = 0.523
	// Re_0.7 = 6.24e+05 … 6.74e+05
}

// TestSpeedPowerBandCoverage repeats the whole job 300 times with fresh
// random noise (standard deviation 0.002 on K_T, 0.0002 on K_Q, normal,
// fixed seed) in the open-water runs: the scatter of the predicted P_D
// over the repetitions is what the band's standard uncertainty claims,
// within 20 %, and the 95 % band holds the noise-free P_D in about 95 %
// of the repetitions.
func TestSpeedPowerBandCoverage(t *testing.T) {
	if testing.Short() {
		t.Skip("300 repetitions of the job")
	}
	exact, err := ship.PredictSpeedPower(speedPowerInput(t, 0))
	if err != nil {
		t.Fatal(err)
	}
	truth := exact.Points[1].DeliveredPower.Value()
	rng := rand.New(rand.NewPCG(1, 2))
	const trials = 300
	var sum, sum2, usum float64
	inside := 0
	base := speedPowerInput(t, 0)
	for range trials {
		ot := synOpenWater(0)
		for i := range ot.Runs {
			r := &ot.Runs[i]
			j := r.Speed.Value() / (r.RevsPerSecond * synD)
			n2 := 999.1 * r.RevsPerSecond * r.RevsPerSecond
			r.Thrust = quantity.New((quadratic(synKT, j)+0.002*rng.NormFloat64())*n2*math.Pow(synD, 4), quantity.Force)
			r.Torque = quantity.New((quadratic(synKQ, j)+0.0002*rng.NormFloat64())*n2*math.Pow(synD, 5), quantity.Torque)
		}
		ow, err := ship.ReduceOpenWater(ot)
		if err != nil {
			t.Fatal(err)
		}
		in := base
		in.SelfPropulsion.OpenWater = ow
		r, err := ship.PredictSpeedPower(in)
		if err != nil {
			t.Fatal(err)
		}
		p := r.Points[1]
		pd := p.DeliveredPower.Value()
		sum += pd
		sum2 += pd * pd
		usum += p.PowerU
		if truth >= p.Power[0] && truth <= p.Power[1] {
			inside++
		}
	}
	mean := sum / trials
	sd := math.Sqrt((sum2 - trials*mean*mean) / (trials - 1))
	u := usum / trials
	if r := u / sd; r < 0.8 || r > 1.2 {
		t.Errorf("claimed u(P_D) %.4g W, scatter over the repetitions %.4g W (ratio %.3f)", u, sd, r)
	}
	if c := float64(inside) / trials; c < 0.9 || c > 0.99 {
		t.Errorf("the 95 %% band held the noise-free P_D in %.1f %% of the repetitions", 100*c)
	}
	t.Logf("u %.4g W, scatter %.4g W, coverage %d/%d", u, sd, inside, trials)
}

// One self-propulsion run analysed by thrust identity, on an invented
// open-water curve K_T = 0.4 − 0.4J, K_Q = 0.05 − 0.04J (model propeller
// D = 0.2 m, runs at n = 15 rev/s in water of ρ = 1000 kg/m³).
func ExampleAnalyseSelfPropulsion() {
	water := fluids.State{Density: quantity.New(1000, quantity.Density), KinematicViscosity: quantity.New(1.14e-6, quantity.KinematicViscosity)}
	d := quantity.New(0.2, quantity.Length)
	ot := ship.OpenWaterTest{Diameter: d, Chord: quantity.New(0.06, quantity.Length), Water: water, Order: 1}
	for _, j := range []float64{0.1, 0.3, 0.5, 0.7, 0.9} {
		ot.Runs = append(ot.Runs, ship.OpenWaterRun{Speed: quantity.New(3*j, quantity.Velocity), RevsPerSecond: 15,
			Thrust: quantity.New(360*(0.4-0.4*j), quantity.Force), Torque: quantity.New(72*(0.05-0.04*j), quantity.Torque)})
	}
	ow, err := ship.ReduceOpenWater(ot)
	if err != nil {
		fmt.Println(err)
		return
	}
	pts, err := ship.AnalyseSelfPropulsion(ship.SelfPropulsionTest{Diameter: d, Water: water, OpenWater: ow,
		Runs: []ship.SelfPropulsionRun{{ModelSpeed: quantity.New(1.2, quantity.Velocity), RevsPerSecond: 10,
			Thrust: quantity.New(32, quantity.Force), Torque: quantity.New(0.96, quantity.Torque),
			TowingForce: quantity.New(4, quantity.Force), Resistance: quantity.New(30, quantity.Force)}}})
	if err != nil {
		fmt.Println(err)
		return
	}
	p := pts[0]
	fmt.Printf("K_TM = %.3f → J_TM = %.3f; w_TM = %.4f, t = %.4f, η_R = %.3f\n", p.KT, p.J, p.Wake, p.ThrustDeduction, p.RelativeRotative)
	fmt.Printf("η_H = %.3f, η_O = %.4f, η_D = %.4f\n", p.EtaH, p.Eta0, p.EtaD)
	// Output:
	// K_TM = 0.200 → J_TM = 0.500; w_TM = 0.1667, t = 0.1875, η_R = 1.000
	// η_H = 0.975, η_O = 0.5305, η_D = 0.5173
}

// The towing force of a self-propulsion test at the ship's
// self-propulsion point, for an invented 7 m model of a 168 m ship.
func ExampleSkinFrictionCorrection() {
	tank := fluids.State{Density: quantity.New(999.1, quantity.Density), KinematicViscosity: quantity.New(1.1386e-6, quantity.KinematicViscosity)}
	sea := fluids.State{Density: quantity.New(1026.0, quantity.Density), KinematicViscosity: quantity.New(1.1892e-6, quantity.KinematicViscosity)}
	s, err := ship.SkinFrictionCorrection(ship.PoweringInput{Scale: 1.0 / 24,
		ModelLength: quantity.New(7.0, quantity.Length), ModelWettedArea: quantity.New(8.1, quantity.Area),
		ModelSpeed: quantity.New(1.75, quantity.Velocity), Tank: tank, Sea: sea, FormFactor: 1.18, CorrelationAllowance: 0.0001})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("C_FM = %.3f×10⁻³, C_FS = %.3f×10⁻³, ΔC_F = %.3f×10⁻³, C_A = %.3f×10⁻³: F_D = %.2f N\n",
		1e3*s.ModelCF, 1e3*s.ShipCF, 1e3*s.RoughnessAllowance, 1e3*s.CorrelationAllowance, s.Force.Value())
	// Output:
	// C_FM = 2.962×10⁻³, C_FS = 1.495×10⁻³, ΔC_F = 0.136×10⁻³, C_A = 0.100×10⁻³: F_D = 18.53 N
}

// TestResistanceFairingNoisy: with noise on C_TM the true coefficients of
// the quadratic lie within 2.5 standard errors of the fitted ones, and
// the 95 % interval of the mean holds the true C_TM at 1.75 m/s.
func TestResistanceFairingNoisy(t *testing.T) {
	h := synResistance()
	pattern := []float64{0.7, -1.2, 0.4, 1.0, -0.3, -0.9, 0.5}
	for i := range h.Resistances {
		v := h.Speeds[i].Value()
		h.Resistances[i] = quantity.New(h.Resistances[i].Value()+0.02e-3*pattern[i]*0.5*999.1*v*v*8.1, quantity.Force)
	}
	r, err := ship.FairResistance(h, 2)
	if err != nil {
		t.Fatal(err)
	}
	a, se, err := r.CT.Power()
	if err != nil {
		t.Fatal(err)
	}
	for k, want := range []float64{4.2e-3, -0.4e-3, 0.1e-3} {
		if !(math.Abs(a[k]-want) <= 2.5*se[k]) {
			t.Errorf("a%d = %v ± %v, true %v", k, a[k], se[k], want)
		}
	}
	_, pr, err := r.At(quantity.New(1.75, quantity.Velocity))
	if err != nil || !(pr.Mean[0] < 3.80625e-3 && 3.80625e-3 < pr.Mean[1]) {
		t.Errorf("C_TM(1.75): %+v, %v; true 3.80625e-3", pr, err)
	}
}

// TestWarningsCarried: the open-water curve's warning reaches every
// ITTC-1978 result made from it.
func TestWarningsCarried(t *testing.T) {
	low := synOpenWater(0)
	low.Chord = quantity.New(0.01, quantity.Length)
	ow, err := ship.ReduceOpenWater(low)
	if err != nil {
		t.Fatal(err)
	}
	in := poweringInput()
	in.OpenWater, in.Faired = nil, ow
	r, err := ship.ITTC1978(in)
	if err != nil || !strings.Contains(r.Warning, "open-water curve: the test's Reynolds number Re_0.7 falls to") {
		t.Errorf("warning %q, %v", r.Warning, err)
	}
}
