package turbo_test

import (
	"errors"
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity/turbo"
	"similis.dev/similis/units"
)

var rpm = units.MustParse("rpm")

const rhoWater = 998.2 // kg/m³, water at 20 °C (IAPWS-95, from memory)

// TestReducePointsByHand translates one point measured at 1450 rpm to
// 1480 rpm. By hand, r = 1480/1450 = 1.0206897:
//
//	Q = 0.1 m³/s·r        = 0.10206897 m³/s
//	H = 40 m·r²           = 41.672295 m
//	P = 50 kW·r³          = 53.168100 kW
//	η = ρgQH/P = 998.2·9.80665·0.1·40/50000 = 0.7831198 (either speed)
func TestReducePointsByHand(t *testing.T) {
	pts := []turbo.TestPoint{{Flow: q.New(0.1, q.VolumeFlowRate), Head: q.New(40, q.Length), Power: q.New(50e3, q.Power), Speed: rpm.Of(1450)}}
	got, err := turbo.ReducePoints(pts, turbo.TestConditions{SpecifiedSpeed: rpm.Of(1480), Density: q.New(rhoWater, q.Density)})
	if err != nil {
		t.Fatal(err)
	}
	r := 1480.0 / 1450
	want := []float64{0.1 * r, 40 * r * r, 50e3 * r * r * r, 998.2 * 9.80665 * 0.1 * 40 / 50e3, r}
	g := got[0]
	have := []float64{g.Flow.Value(), g.Head.Value(), g.Power.Value(), g.Efficiency, g.SpeedRatio}
	if d := cmp.Diff(want, have, cmp.Comparer(func(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Abs(a) })); d != "" {
		t.Errorf("reduced point (-by hand +got):\n%s", d)
	}
	// The written-out figures above, to their digits.
	for i, w := range []float64{0.10206897, 41.672295, 53168.100, 0.7831198} {
		if math.Abs(have[i]/w-1) > 1e-6 {
			t.Errorf("quantity %d: %v, written out %v", i, have[i], w)
		}
	}
}

// TestReducePointsRefuses: a test speed outside 50 % to 120 % of the
// specified speed, an efficiency above 1, a wrong dimension and a
// non-positive reading are refused, each with one class.
func TestReducePointsRefuses(t *testing.T) {
	good := turbo.TestPoint{Flow: q.New(0.1, q.VolumeFlowRate), Head: q.New(40, q.Length), Power: q.New(50e3, q.Power), Speed: rpm.Of(1480)}
	cond := turbo.TestConditions{SpecifiedSpeed: rpm.Of(1480), Density: q.New(rhoWater, q.Density)}
	for _, c := range []struct {
		name  string
		mod   func(p *turbo.TestPoint)
		class error
	}{
		{"speed 49 %", func(p *turbo.TestPoint) { p.Speed = rpm.Of(0.49 * 1480) }, q.ErrRange},
		{"speed 121 %", func(p *turbo.TestPoint) { p.Speed = rpm.Of(1.21 * 1480) }, q.ErrRange},
		{"efficiency above 1", func(p *turbo.TestPoint) { p.Power = q.New(30e3, q.Power) }, q.ErrInvalid},
		{"head as pressure", func(p *turbo.TestPoint) { p.Head = q.New(4e5, q.Pressure) }, q.ErrDimension},
		{"zero flow", func(p *turbo.TestPoint) { p.Flow = q.New(0, q.VolumeFlowRate) }, q.ErrInvalid},
	} {
		p := good
		c.mod(&p)
		_, err := turbo.ReducePoints([]turbo.TestPoint{good, p}, cond)
		if oneClass(err) != c.class {
			t.Errorf("%s: %v, want class %v", c.name, err, c.class)
		}
	}
	// The band's ends are inside it.
	for _, f := range []float64{0.5, 1.2} {
		p := good
		p.Speed = rpm.Of(f * 1480)
		if _, err := turbo.ReducePoints([]turbo.TestPoint{p}, cond); err != nil {
			t.Errorf("speed %g of the specified: %v", f, err)
		}
	}
}

// Known curves at 1480 rpm for the round trip: H = 48 − 800·Q²,
// η = 0.82 − 68·(Q − 0.11)², P = ρgQH/η.
func trueHead(x float64) float64 { return 48 - 800*x*x }
func trueEta(x float64) float64  { return 0.82 - 68*(x-0.11)*(x-0.11) }
func truePower(x float64) float64 {
	return rhoWater * 9.80665 * x * trueHead(x) / trueEta(x)
}

// TestRoundTrip: test points made from known curves at 1480 rpm, carried
// to scattered test speeds by the inverse affinity laws and given small
// scatter, are reduced and fitted (orders chosen by TopTerm up to 3, the default); the known curves lie within the 95 %
// intervals of the mean at every flow checked, and the orders selected
// are the known ones (2 for H and η).
func TestRoundTrip(t *testing.T) {
	var pts []turbo.TestPoint
	for i := range 13 {
		x := 0.06 + 0.0075*float64(i)                   // 0.06 … 0.15 m³/s at 1480 rpm
		n := 1440 + 80*math.Abs(math.Sin(5*float64(i))) // test speed, rpm
		r := n / 1480
		// Scatter of ±0.1 %, a fixed pattern.
		h := trueHead(x) * (1 + 0.001*math.Sin(2.3*float64(i)+1))
		eta := trueEta(x) * (1 + 0.001*math.Cos(3.7*float64(i)))
		pts = append(pts, turbo.TestPoint{
			Flow: q.New(x*r, q.VolumeFlowRate), Head: q.New(h*r*r, q.Length),
			Power: q.New(rhoWater*9.80665*x*h/eta*r*r*r, q.Power), Speed: rpm.Of(n),
		})
	}
	red, err := turbo.ReducePoints(pts, turbo.TestConditions{SpecifiedSpeed: rpm.Of(1480), Density: q.New(rhoWater, q.Density)})
	if err != nil {
		t.Fatal(err)
	}
	c, err := turbo.FitPumpCurves(red, turbo.CurveOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if c.Head.Order != 2 || c.Efficiency.Order != 2 {
		t.Errorf("orders H %d, η %d: want 2 and 2", c.Head.Order, c.Efficiency.Order)
	}
	for _, x := range []float64{0.07, 0.09, 0.11, 0.13} {
		for _, k := range []struct {
			name string
			p    *fit.Poly
			want float64
		}{{"H", c.Head, trueHead(x)}, {"η", c.Efficiency, trueEta(x)}, {"P", c.Power, truePower(x)}} {
			pr, err := k.p.Predict(x)
			if err != nil {
				t.Fatal(err)
			}
			if k.want < pr.Mean[0] || k.want > pr.Mean[1] {
				t.Errorf("%s at Q = %g: known %v outside the interval %v", k.name, x, k.want, pr.Mean)
			}
		}
	}
}

// handCurves are exact polynomial curves for the acceptance check by
// hand: H = 47.2 − 800·Q² (m), η = 0.80 − 50·(Q − 0.11)², P = 20 kW +
// 300 kW·s/m³·Q, sampled at nine flows from 0.06 to 0.14 m³/s.
func handCurves(t *testing.T) turbo.PumpCurves {
	t.Helper()
	var x, h, e, p []float64
	for i := range 9 {
		v := 0.06 + 0.01*float64(i)
		x, h, e, p = append(x, v), append(h, 47.2-800*v*v), append(e, 0.80-50*(v-0.11)*(v-0.11)), append(p, 20e3+300e3*v)
	}
	var c turbo.PumpCurves
	var err error
	if c.Head, err = fit.FitPoly(x, h, 2, nil); err != nil {
		t.Fatal(err)
	}
	if c.Efficiency, err = fit.FitPoly(x, e, 2, nil); err != nil {
		t.Fatal(err)
	}
	if c.Power, err = fit.FitPoly(x, p, 1, nil); err != nil {
		t.Fatal(err)
	}
	return c
}

// TestCheckGuaranteeByHand judges Q_G = 0.1 m³/s, H_G = 40 m, η_G = 0.80,
// P_G = 50 kW on handCurves. By hand:
//
//	H(Q_G) = 47.2 − 800·0.01 = 39.2 m (−2 %)
//	H = H_G where 800·Q² = 7.2: Q = 0.0948683 m³/s (−5.13 %)
//	line H = 400·Q meets the curve where 800Q² + 400Q − 47.2 = 0:
//	Q_X = (−400 + √(160000 + 151040))/1600 = 0.0985685 m³/s
//	η(Q_X) = 0.80 − 50·(0.0114315)² = 0.793466
//	P(Q_X) = 20000 + 300000·0.0985685 = 49570.6 W
//
// 1B (±5 %, ±3 %, +4 %, −3 %): vertical bar 38.8 … 41.2 holds 39.2, met;
// horizontal bar 0.095 … 0.105 misses 0.09487; η ≥ 0.776, P ≤ 52 kW:
// met. 1E: η ≥ 0.80 fails. 1U (0 … +10 %, 0 … +6 %, η ≥ 0.80): 39.2 < 40
// and the head falls with flow, so neither bar is met, nor the efficiency. 2B: the horizontal bar
// 0.092 … 0.108 holds 0.09487. 2U: vertical 40 … 44, horizontal 0.1 …
// 0.116: neither.
func TestCheckGuaranteeByHand(t *testing.T) {
	c := handCurves(t)
	g := turbo.Guarantee{Flow: q.New(0.1, q.VolumeFlowRate), Head: q.New(40, q.Length), Power: q.New(50e3, q.Power), Efficiency: 0.80}
	qx := (-400 + math.Sqrt(160000+151040)) / 1600
	if math.Abs(qx-0.0985685) > 1e-7 {
		t.Fatalf("hand Q_X %v", qx)
	}
	type row struct {
		Vertical, Horizontal, Eff, Power, Met bool
	}
	want := map[turbo.Grade]row{
		turbo.Grade1U: {false, false, false, true, false},
		turbo.Grade1E: {true, false, false, true, false},
		turbo.Grade1B: {true, false, true, true, true},
		turbo.Grade2B: {true, true, true, true, true},
		turbo.Grade2U: {false, false, true, true, false},
		turbo.Grade3B: {true, true, true, true, true},
	}
	for _, gr := range turbo.Grades() {
		v, err := turbo.CheckGuarantee(c, g, gr)
		if err != nil {
			t.Fatal(gr, err)
		}
		got := row{v.MeetsVertical, v.MeetsHorizontal, v.EfficiencyMet, v.PowerMet, v.Met}
		if d := cmp.Diff(want[gr], got); d != "" {
			t.Errorf("grade %v (-by hand +got):\n%s", gr, d)
		}
		near := func(name string, got, want, tol float64) {
			if math.Abs(got-want) > tol {
				t.Errorf("grade %v: %s = %v, by hand %v", gr, name, got, want)
			}
		}
		near("H(Q_G)", v.HeadAtGuaranteeFlow.Y, 39.2, 1e-9)
		near("Q_X", v.Intersection[0], qx, 1e-9)
		near("H_X", v.Intersection[1], 400*qx, 1e-7)
		near("η(Q_X)", v.EfficiencyAt.Y, 0.80-50*(qx-0.11)*(qx-0.11), 1e-9)
		near("P(Q_X)", v.PowerAt.Y, 20e3+300e3*qx, 1e-6)
		if v.MeetsHorizontal {
			near("Q at H_G", v.FlowAtGuaranteeHead, math.Sqrt(7.2/800), 1e-9)
		}
		// The crossing of H_G exists whatever the bar: 0.09487 for every
		// grade, inside 2B's and 3B's bars, outside the others'.
		if !v.HeadCrossed {
			t.Errorf("grade %v: no crossing of H_G found", gr)
		}
		near("crossing of H_G", v.HeadCrossing, math.Sqrt(7.2/800), 1e-9)
	}
}

// TestGradeTolerances: the factors of each grade, as Tolerance documents
// them (ISO 9906:2012 Table 8, from memory), and an unknown grade refused.
func TestGradeTolerances(t *testing.T) {
	want := map[turbo.Grade]turbo.Tolerance{
		turbo.Grade1U: {0, 0.10, 0, 0.06, 0.10, 0},
		turbo.Grade1E: {0.05, 0.05, 0.03, 0.03, 0.04, 0},
		turbo.Grade1B: {0.05, 0.05, 0.03, 0.03, 0.04, 0.03},
		turbo.Grade2B: {0.08, 0.08, 0.05, 0.05, 0.08, 0.05},
		turbo.Grade2U: {0, 0.16, 0, 0.10, 0.16, 0.05},
		turbo.Grade3B: {0.09, 0.09, 0.07, 0.07, 0.09, 0.07},
	}
	for _, g := range turbo.Grades() {
		got, err := g.Tolerance()
		if err != nil || got != want[g] {
			t.Errorf("%v: %+v, %v; want %+v", g, got, err, want[g])
		}
	}
	if _, err := turbo.Grade(0).Tolerance(); oneClass(err) != q.ErrInvalid {
		t.Errorf("grade 0: %v", err)
	}
	if s := turbo.Grade(9).String(); s != "Grade(9)" {
		t.Errorf("Grade(9).String() = %q", s)
	}
}

// TestCheckGuaranteeRefuses: a guarantee flow outside the tested range,
// a line through the origin that misses the curve within it, and an
// efficiency above 1 are refused with one class each; the curve is not
// extrapolated.
func TestCheckGuaranteeRefuses(t *testing.T) {
	c := handCurves(t)
	for _, k := range []struct {
		name  string
		g     turbo.Guarantee
		class error
	}{
		{"flow outside", turbo.Guarantee{Flow: q.New(0.2, q.VolumeFlowRate), Head: q.New(40, q.Length)}, q.ErrRange},
		{"line misses", turbo.Guarantee{Flow: q.New(0.06, q.VolumeFlowRate), Head: q.New(60, q.Length), Efficiency: 0.8}, q.ErrRange},
		{"efficiency 1.5", turbo.Guarantee{Flow: q.New(0.1, q.VolumeFlowRate), Head: q.New(40, q.Length), Efficiency: 1.5}, q.ErrInvalid},
		{"head in Pa", turbo.Guarantee{Flow: q.New(0.1, q.VolumeFlowRate), Head: q.New(4e5, q.Pressure)}, q.ErrDimension},
	} {
		_, err := turbo.CheckGuarantee(c, k.g, turbo.Grade2B)
		var te *turbo.Error
		if oneClass(err) != k.class {
			t.Errorf("%s: %v, want class %v", k.name, err, k.class)
		} else if k.class != q.ErrDimension && !errors.As(err, &te) {
			t.Errorf("%s: %T, want *turbo.Error", k.name, err)
		}
	}
	// Without an efficiency or power guarantee the line is not needed.
	v, err := turbo.CheckGuarantee(c, turbo.Guarantee{Flow: q.New(0.06, q.VolumeFlowRate), Head: q.New(60, q.Length)}, turbo.Grade2B)
	if err != nil || v.Met || v.EfficiencyJudged || v.PowerJudged {
		t.Errorf("flow and head only: %+v, %v", v, err)
	}
}
