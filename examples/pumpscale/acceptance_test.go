package main

import (
	"bytes"
	"errors"
	"math"
	"os"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/similarity/turbo"
)

// TestAcceptanceByHand checks the acceptance section's key numbers.
//
// Reduction of the fifth reading (99.9 L/s, 39.12 m, 48.08 kW at
// 1479 rpm) to 1480 rpm, r = 1480/1479 = 1.000676:
//
//	Q = 99.9·r = 99.96755 L/s, H = 39.12·r² = 39.17292 m,
//	P = 48.08·r³ = 48.17759 kW, η = 998.2·9.80665·Q·H/P = 0.795679.
//
// The fitted curves are all of order 2; numpy.polyfit of order 2 on the
// nine reduced points (Debian python3-numpy 1.24.2, computed once) gives
// H = 47.222027 − 0.38971025·Q − 798.22468·Q² and H(Q_G) = 39.200809 m; the line H = 400 s/m²·Q meets it at
// Q_X = 0.098570047 m³/s (H_X = 39.428019 m), where η = 0.7935936 and
// P = 47937.74 W; H = H_G = 40 m at Q = 0.094875137 m³/s.
//
// Grade 1B by hand: vertical bar 40·(1 ∓ 0.03) = 38.80 … 41.20 m holds
// 39.20 m; horizontal bar 100·(1 ∓ 0.05) = 95 … 105 L/s misses 94.88 L/s;
// η ≥ 0.80·0.97 = 0.776 holds 0.7936; P ≤ 49·1.04 = 50.96 kW holds
// 47.94 kW: met. 1E and 1U need η ≥ 0.80: not met. 2B's horizontal bar
// 92 … 108 L/s and 3B's 91 … 109 L/s hold 94.88 L/s. 2U's bars (40 …
// 44 m at Q_G, 100 … 116 L/s at H_G) are both missed by a falling curve
// 39.2 m high at Q_G.
//
// NPSH3: the reference is (39.23 + 39.18 + 39.21)/3 = 39.206667 m (NPSHA
// 12, 10, 8 m), 97 % of it 38.030467 m, between the readings 37.86 m at
// 4.5 m and 38.31 m at 4.75 m: straight-line interpolation gives
// 4.5 + 0.25·(38.030467 − 37.86)/0.45 = 4.594704 m, and the fairing's
// cubic on that interval lies within 1 cm of it. The slope is the
// secant 0.45/0.25 = 1.8; u_H is the reference points' standard deviation
// √((0.023333² + 0.026667² + 0.003333²)/2) = 0.025166 m; from the head
// √(u_H² + 0.97²·u_H²/3)/1.8 = 0.025166·1.146138/1.8 = 0.016024 m; with
// u_NPSHA = 0.03 m, u = √(0.03² + 0.016024²) = 0.034012 m.
func TestAcceptanceByHand(t *testing.T) {
	var out bytes.Buffer
	rep, err := evaluateReport(&out, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	a := rep.Acceptance
	near := func(name string, got, want, rel float64) {
		t.Helper()
		if math.Abs(got-want) > rel*math.Abs(want) {
			t.Errorf("%s = %v, by hand %v", name, got, want)
		}
	}
	p := a.Reduced[4]
	near("Q", p.Flow.Value(), 0.09996755, 1e-7)
	near("H", p.Head.Value(), 39.17292, 1e-6)
	near("P", p.Power.Value(), 48177.59, 1e-6)
	near("η", p.Efficiency, 0.795679, 1e-6)
	for _, c := range []struct {
		name  string
		order int
	}{{"Q–H", a.Curves.Head.Order}, {"Q–P", a.Curves.Power.Order}, {"Q–η", a.Curves.Efficiency.Order}} {
		if c.order != 2 {
			t.Errorf("%s order %d, want 2", c.name, c.order)
		}
	}
	v := a.Agreed
	if v.Grade != turbo.Grade1B || !v.Met {
		t.Errorf("agreed grade %v met %v, want 1B met", v.Grade, v.Met)
	}
	near("H(Q_G)", v.HeadAtGuaranteeFlow.Y, 39.200809, 1e-8)
	near("Q_X", v.Intersection[0], 0.098570047, 1e-8)
	near("H_X", v.Intersection[1], 39.428019, 1e-8)
	near("η(Q_X)", v.EfficiencyAt.Y, 0.7935936, 1e-7)
	near("P(Q_X)", v.PowerAt.Y, 47937.74, 1e-7)
	near("bar low", v.HeadBar[0], 38.80, 1e-12)
	near("bar high", v.HeadBar[1], 41.20, 1e-12)
	near("η min", v.EfficiencyMin, 0.776, 1e-12)
	near("P max", v.PowerMax, 50960, 1e-12)
	wantMet := map[turbo.Grade]bool{turbo.Grade1U: false, turbo.Grade1E: false, turbo.Grade1B: true, turbo.Grade2B: true, turbo.Grade2U: false, turbo.Grade3B: true}
	for _, g := range a.Verdicts {
		if g.Met != wantMet[g.Grade] {
			t.Errorf("grade %v met %v, by hand %v", g.Grade, g.Met, wantMet[g.Grade])
		}
		if g.MeetsHorizontal {
			near("Q at H_G", g.FlowAtGuaranteeHead, 0.094875137, 1e-8)
		}
	}
	n := a.NPSH3
	near("reference", n.ReferenceHead.Value(), 39.206667, 1e-7)
	near("97 %", n.DropHead.Value(), 38.030467, 1e-7)
	if x := n.NPSH3.Value(); math.Abs(x-4.594704) > 0.01 || x < 4.5 || x > 4.75 {
		t.Errorf("NPSH3 %v, by hand near 4.594704 within 4.5 … 4.75", x)
	}
	near("slope", n.Slope, 1.8, 1e-9)
	near("u_H", n.HeadU.Value(), 0.025166, 1e-4)
	near("u from head", n.UFromHead.Value(), 0.016024, 1e-4)
	near("u", n.U.Value(), 0.034012, 1e-4)
	for _, want := range []string{
		"invented shop-test readings",
		"verdict for the agreed grade 1B: MET, PROVISIONAL",
		"PROVISIONAL: the verdicts rest on tolerance factors and a test-speed band quoted from memory; check them against ISO 9906:2012\n  Table 8 (and the contract",
		"before a pump is accepted",
		"check the band against ISO 9906:2012 and the contract",
		"grades met: 1B, 2B, 3B",
		"  1B    | ±5 %     | ±3 %     | +4 %  | −3 %  | 39.20 in 38.80…41.20 m yes  | 94.88 L/s, outside 95.0…105.0 ",
		"  2B    | ±8 %     | ±5 %     | +8 %  | −5 %  | 39.20 in 38.00…42.00 m yes  | 94.88 in 92.0…108.0 L/s yes",
		"NPSH3 = 4.59 m, standard uncertainty 0.034 m",
		"with u_H = 0.0252 m",
		"the head's standard uncertainty 0.0252 m",
		"Q–H: order 2 through 9 points",
		// Each coefficient rounded to the second digit of its standard
		// error (GUM 7.2.6): 47.222 ± 0.23 → 47.22, −0.38971 ± 4.8 → −0.4,
		// −798.22 ± 24 → −798.
		"H = 47.22(±0.23) − 0.4(±4.8)·Q − 798(±24)·Q²",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	// The verdict's own PROVISIONAL note is printed once, in the
	// paragraph above the notes, not again among them.
	if c := strings.Count(out.String(), "PROVISIONAL:"); c != 1 {
		t.Errorf("PROVISIONAL: printed %d times, want once", c)
	}
	for _, f := range []string{a.PNG, a.SVG} {
		if st, err := os.Stat(f); err != nil || st.Size() == 0 {
			t.Errorf("plot %s: %v", f, err)
		}
	}
}

// TestAcceptanceFlags: -grade chooses the verdict printed and refuses a
// grade that is not ISO 9906's; -out must be a directory; an empty -out
// draws nothing.
func TestAcceptanceFlags(t *testing.T) {
	var out bytes.Buffer
	rep, err := evaluateReport(&out, []string{"-grade", "1e", "-out", ""})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Acceptance.Agreed.Grade != turbo.Grade1E || rep.Acceptance.Agreed.Met || rep.Acceptance.PNG != "" {
		t.Errorf("-grade 1e: %v met %v, plot %q", rep.Acceptance.Agreed.Grade, rep.Acceptance.Agreed.Met, rep.Acceptance.PNG)
	}
	if !strings.Contains(out.String(), "verdict for the agreed grade 1E: NOT MET") {
		t.Error("1E verdict not printed")
	}
	for _, args := range [][]string{{"-grade", "4A"}, {"-out", "/nonexistent/dir"}, {"-dpi", "NaN"}, {"extra"}} {
		err := run(&bytes.Buffer{}, args)
		var ce *cli.Error
		if !errors.As(err, &ce) {
			t.Errorf("%q: %v, want a usage error", args, err)
		}
	}
}

// TestRoundToUncertainty: the uncertainty to two significant digits and
// the value to the same decimal place (GUM 7.2.6), by hand.
func TestRoundToUncertainty(t *testing.T) {
	for _, c := range []struct {
		v, u         float64
		wantV, wantU string
	}{
		{47.222, 0.2312, "47.22", "0.23"},
		{-0.38971, 4.81, "-0.4", "4.8"},
		{-798.22, 24.3, "-798", "24"},
		{1103.47, 13.2, "1103", "13"},
		{12345.6, 240, "12350", "240"},
		{0.0123456, 0.000996, "0.0123", "0.0010"},
		{-0.00004, 0.0023, "0.0000", "0.0023"},
		{5, 0, "5", "0"},
	} {
		gv, gu := cli.RoundToUncertainty(c.v, c.u, 5)
		if gv != c.wantV || gu != c.wantU {
			t.Errorf("cli.RoundToUncertainty(%v, %v, 5) = %s, %s; want %s, %s", c.v, c.u, gv, gu, c.wantV, c.wantU)
		}
	}
}

// TestEfficiencyLegendClear: the efficiency panel's legend sits at its
// top left, in the band above the data, so it cannot cover the Q–η curve
// (it sat at the bottom right and covered it): with the default run's
// data, 67.40 … 80.08 %, the axis runs 66 … 85 % and the fitted curve's
// highest point (80.08 %) stays below the top 20 % of the panel (81.2 %).
func TestEfficiencyLegendClear(t *testing.T) {
	a, err := acceptance(&bytes.Buffer{}, turbo.Grade1B, "", 6, 7, 150)
	if err != nil {
		t.Fatal(err)
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, r := range a.Reduced {
		lo, hi = min(lo, 100*r.Efficiency), max(hi, 100*r.Efficiency)
	}
	c := a.Curves.Efficiency
	for i := 0; i <= 100; i++ {
		x := c.XMin + (c.XMax-c.XMin)*float64(i)/100
		hi = max(hi, 100*c.Eval(x))
	}
	ymin, ymax := efficiencyAxis(lo, hi)
	if ymin != 66 || ymax != 85 {
		t.Errorf("axis %v … %v %%, by hand 66 … 85 (data %.2f … %.2f)", ymin, ymax, lo, hi)
	}
	if hi > ymax-0.2*(ymax-ymin) {
		t.Errorf("the curve reaches %.2f %%, into the legend's band above %.2f %%", hi, ymax-0.2*(ymax-ymin))
	}
}
