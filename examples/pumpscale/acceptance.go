package main

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/examples/internal/plotstyle"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity/turbo"
	"similis.dev/similis/units"
)

// The acceptance test is of a pump as built, a separate invented pump
// specified at 1480 rpm: its guarantee point and its shop-test readings
// are invented, the readings taken at speeds a little off the specified.
const (
	specRPM      = 1480.0
	guaranteeQ   = 100.0 // L/s
	guaranteeH   = 40.0  // m
	guaranteeEta = 0.80
	guaranteeP   = 49.0   // kW, pump power input
	testDensity  = 998.2  // kg/m³, water at 20 °C (IAPWS-95, from memory)
	npshU        = 0.03   // m, standard uncertainty of an NPSHA reading (invented)
	suctionRPM   = 1480.0 // the suction series is run at the specified speed
)

// shopTest holds the invented readings: Q in L/s, H in m, P in kW, n in rpm.
var shopTest = [][4]float64{
	{59.8, 44.12, 38.32, 1476}, {70.1, 43.40, 41.33, 1483}, {79.5, 41.59, 42.86, 1471},
	{90.5, 41.20, 46.87, 1488}, {99.9, 39.12, 48.08, 1479}, {110.4, 37.77, 50.97, 1485},
	{119.5, 35.43, 52.21, 1474}, {130.1, 33.69, 54.91, 1481}, {140.6, 31.78, 57.96, 1486},
}

// suctionTest holds the invented suction series at the guarantee flow and
// the specified speed: NPSHA in m, H in m.
var suctionTest = [][2]float64{
	{12, 39.23}, {10, 39.18}, {8, 39.21}, {7, 39.19}, {6, 39.16}, {5.5, 39.02}, {5, 38.62},
	{4.75, 38.31}, {4.5, 37.86}, {4.25, 37.42}, {4, 36.80}, {3.5, 35.33},
}

// Acceptance is the acceptance test's analysis, for the test.
type Acceptance struct {
	Reduced  []turbo.ReducedPoint
	Curves   turbo.PumpCurves
	Verdicts []turbo.Verdict // one per grade, in turbo.Grades() order
	Agreed   turbo.Verdict   // the grade agreed (-grade)
	NPSH3    turbo.NPSH3Result
	PNG, SVG string // the plot's files, empty without -out
}

// parseGrade reads a grade's name, "1B".
func parseGrade(s string) (turbo.Grade, bool) {
	for _, g := range turbo.Grades() {
		if strings.EqualFold(s, g.String()) {
			return g, true
		}
	}
	return 0, false
}

// pct formats a one-sided or two-sided tolerance factor.
func pct(minus, plus float64) string {
	switch {
	case minus == plus:
		return fmt.Sprintf("±%.3g %%", 100*plus)
	case minus == 0:
		return fmt.Sprintf("0…+%.3g %%", 100*plus)
	}
	return fmt.Sprintf("−%.3g…+%.3g %%", 100*minus, 100*plus)
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}

// acceptance reduces the invented shop test, fits the curves, judges the
// guarantee against every grade and the agreed one, finds NPSH3 from the
// suction series and draws the curves.
func acceptance(w io.Writer, agreed turbo.Grade, out string, wIn, hIn, dpi float64) (Acceptance, error) {
	var a Acceptance
	rpm, ls, kw, m := units.MustParse("rpm"), units.MustParse("L/s"), units.MustParse("kW"), units.MustParse("m")
	var pts []turbo.TestPoint
	for _, r := range shopTest {
		pts = append(pts, turbo.TestPoint{Flow: ls.Of(r[0]), Head: m.Of(r[1]), Power: kw.Of(r[2]), Speed: rpm.Of(r[3])})
	}
	var err error
	if a.Reduced, err = turbo.ReducePoints(pts, turbo.TestConditions{SpecifiedSpeed: rpm.Of(specRPM), Density: q.New(testDensity, q.Density)}); err != nil {
		return Acceptance{}, err
	}
	fmt.Fprintf(w, "\nAcceptance test of a pump as built (ISO 9906:2012; an invented pump, separate from the family above, and invented shop-test readings)\n")
	fmt.Fprintf(w, "guarantee at the specified speed %g rpm: Q_G = %g L/s, H_G = %g m, η_G = %g %%, P_G = %g kW (pump power input); water %g kg/m³\n",
		specRPM, guaranteeQ, guaranteeH, 100*guaranteeEta, guaranteeP, testDensity)
	fmt.Fprintf(w, "test points reduced to %g rpm by the affinity laws, Q·(n_sp/n), H·(n_sp/n)², P·(n_sp/n)³, η = ρgQH/P unchanged\n", specRPM)
	fmt.Fprintf(w, "(test speeds accepted within %g %% to %g %% of the specified, ISO 9906, from memory: check the band against ISO 9906:2012 and the contract):\n", 100*turbo.MinTestSpeedFraction, 100*turbo.MaxTestSpeedFraction)
	fmt.Fprintf(w, "  %-30s | %8s | %s\n", "as measured", "", fmt.Sprintf("reduced to %g rpm", specRPM))
	fmt.Fprintf(w, "  %6s %7s %7s %7s | %8s | %7s %7s %7s %6s\n", "n rpm", "Q L/s", "H m", "P kW", "n_sp/n", "Q L/s", "H m", "P kW", "η %")
	for i, r := range a.Reduced {
		s := shopTest[i]
		fmt.Fprintf(w, "  %6.0f %7.1f %7.2f %7.2f | %8.5f | %7.2f %7.2f %7.2f %6.2f\n",
			s[3], s[0], s[1], s[2], r.SpeedRatio, 1e3*r.Flow.Value(), r.Head.Value(), r.Power.Value()/1e3, 100*r.Efficiency)
	}
	if a.Curves, err = turbo.FitPumpCurves(a.Reduced, turbo.CurveOptions{}); err != nil {
		return Acceptance{}, err
	}
	qg := guaranteeQ / 1e3
	fmt.Fprintf(w, "curves fitted by least squares, the order chosen by the top-term t test (5 %%) up to 3; at Q_G with the 95 %% interval of the mean:\n")
	fmt.Fprintln(w, "(each coefficient's standard error in parentheses, the coefficient rounded to the error's second digit, GUM 7.2.6; the checks use the unrounded fit)")
	for _, c := range []struct {
		name, unit string
		scale      float64
		f          *fit.Poly
		sym        string
	}{{"Q–H", "m", 1, a.Curves.Head, "H"}, {"Q–P", "kW", 1e-3, a.Curves.Power, "P"}, {"Q–η", "%", 100, a.Curves.Efficiency, "η"}} {
		p, err := c.f.Predict(qg)
		if err != nil {
			return Acceptance{}, err
		}
		fmt.Fprintf(w, "  %s: order %d through %d points, residual s = %.3g %s; at Q_G %.2f %s (%.2f … %.2f)\n",
			c.name, c.f.Order, c.f.N, c.f.S*c.scale, c.unit, p.Y*c.scale, c.unit, p.Mean[0]*c.scale, p.Mean[1]*c.scale)
		coef, se, err := c.f.Power()
		if err != nil {
			return Acceptance{}, err
		}
		var eq strings.Builder
		for k := range coef {
			v, u := cli.RoundToUncertainty(coef[k]*c.scale, se[k]*c.scale, 5)
			switch {
			case k == 0:
				eq.WriteString(v)
			case strings.HasPrefix(v, "-"):
				eq.WriteString(" − " + v[1:])
			default:
				eq.WriteString(" + " + v)
			}
			fmt.Fprintf(&eq, "(±%s)", u)
			if k > 0 {
				eq.WriteString("·Q" + []string{"", "", "²", "³"}[min(k, 3)])
			}
		}
		fmt.Fprintf(w, "    %s = %s  (%s, Q in m³/s)\n", c.sym, eq.String(), c.unit)
	}
	g := turbo.Guarantee{Flow: ls.Of(guaranteeQ), Head: m.Of(guaranteeH), Efficiency: guaranteeEta, Power: kw.Of(guaranteeP)}
	for _, gr := range turbo.Grades() {
		v, err := turbo.CheckGuarantee(a.Curves, g, gr)
		if err != nil {
			return Acceptance{}, err
		}
		a.Verdicts = append(a.Verdicts, v)
		if gr == agreed {
			a.Agreed = v
		}
	}
	x := a.Verdicts[0].Intersection
	fmt.Fprintf(w, "tolerance check (factors of ISO 9906:2012 Table 8 for pumps above 10 kW, from memory): the fitted Q–H curve must meet the\n")
	fmt.Fprintf(w, "cross through (Q_G, H_G), on its vertical bar H_G(1 − t_H … 1 + t_H) at Q_G or its horizontal bar Q_G(1 − t_Q … 1 + t_Q) at H_G;\n")
	fmt.Fprintf(w, "η and P are read on the fitted curves at Q_X = %.2f L/s (H_X = %.2f m), where the line through the origin and (Q_G, H_G) meets Q–H:\n",
		1e3*x[0], x[1])
	fmt.Fprintf(w, "  %-5s | %-8s | %-8s | %-5s | %-5s | %-27s | %-33s | %-19s | %-20s | %s\n", "grade", "t_Q", "t_H", "t_P", "t_η",
		"H(Q_G) on the vertical bar", "Q at H_G on the horiz. bar", "η(Q_X) ≥ η_G(1−t_η)", "P(Q_X) ≤ P_G(1+t_P)", "verdict")
	for _, v := range a.Verdicts {
		t := v.Tolerance
		vert := fmt.Sprintf("%.2f in %.2f…%.2f m %s", v.HeadAtGuaranteeFlow.Y, v.HeadBar[0], v.HeadBar[1], yesNo(v.MeetsVertical))
		var horiz string
		switch {
		case v.MeetsHorizontal:
			horiz = fmt.Sprintf("%.2f in %.1f…%.1f L/s yes", 1e3*v.FlowAtGuaranteeHead, 1e3*v.FlowBar[0], 1e3*v.FlowBar[1])
		case v.HeadCrossed:
			horiz = fmt.Sprintf("%.2f L/s, outside %.1f…%.1f", 1e3*v.HeadCrossing, 1e3*v.FlowBar[0], 1e3*v.FlowBar[1])
		default:
			horiz = fmt.Sprintf("H_G not reached in tested %.1f…%.1f L/s", 1e3*a.Curves.Head.XMin, 1e3*a.Curves.Head.XMax)
		}
		teta := "0 %"
		if t.EfficiencyMinus > 0 {
			teta = fmt.Sprintf("−%.3g %%", 100*t.EfficiencyMinus)
		}
		verdict := "NOT MET"
		if v.Met {
			verdict = "met"
		}
		fmt.Fprintf(w, "  %-5s | %-8s | %-8s | %-5s | %-5s | %-27s | %-33s | %5.2f ≥ %5.2f %% %-3s | %5.2f ≤ %5.2f kW %-3s | %s\n",
			v.Grade, pct(t.FlowMinus, t.FlowPlus), pct(t.HeadMinus, t.HeadPlus), fmt.Sprintf("+%.3g %%", 100*t.PowerPlus), teta,
			vert, horiz, 100*v.EfficiencyAt.Y, 100*v.EfficiencyMin, yesNo(v.EfficiencyMet), v.PowerAt.Y/1e3, v.PowerMax/1e3, yesNo(v.PowerMet), verdict)
	}
	var met []string
	for _, v := range a.Verdicts {
		if v.Met {
			met = append(met, v.Grade.String())
		}
	}
	ag := a.Agreed
	verdict := "NOT MET"
	if ag.Met {
		verdict = "MET"
	}
	fmt.Fprintf(w, "verdict for the agreed grade %v: %s, PROVISIONAL (flow and head %s; efficiency %.2f %% against at least %.2f %%; power %.2f kW against at most %.2f kW)\n",
		ag.Grade, verdict, map[bool]string{true: "within the cross", false: "outside the cross"}[ag.FlowHeadMet],
		100*ag.EfficiencyAt.Y, 100*ag.EfficiencyMin, ag.PowerAt.Y/1e3, ag.PowerMax/1e3)
	if len(met) == 0 {
		fmt.Fprintln(w, "grades met: none")
	} else {
		fmt.Fprintf(w, "grades met: %s\n", strings.Join(met, ", "))
	}
	fmt.Fprintln(w, "PROVISIONAL: the verdicts rest on tolerance factors and a test-speed band quoted from memory; check them against ISO 9906:2012")
	fmt.Fprintln(w, "  Table 8 (and the contract, which may set its own) before a pump is accepted or rejected on them")
	for _, n := range ag.Notes {
		if n == turbo.ProvisionalNote {
			continue // said above, for every grade
		}
		fmt.Fprintf(w, "  note: %s\n", n)
	}
	fmt.Fprintln(w, "the verdict is read on the fitted curves; the grade's tolerance factors already allow for the measurement uncertainty of a test of that grade")

	// NPSH3 from the suction series.
	var s []turbo.SuctionPoint
	for _, r := range suctionTest {
		s = append(s, turbo.SuctionPoint{NPSHA: m.Of(r[0]), Head: m.Of(r[1])})
	}
	if a.NPSH3, err = turbo.FindNPSH3(s, turbo.NPSH3Options{NPSHU: m.Of(npshU)}); err != nil {
		return Acceptance{}, err
	}
	n3 := a.NPSH3
	fmt.Fprintf(w, "NPSH3 from the invented suction series at Q_G and %g rpm (%d points; NPSHA reading u = %g m, invented):\n", suctionRPM, len(suctionTest), npshU)
	fmt.Fprintf(w, "  reference head %.3f m (mean of the 3 points of highest NPSHA), 3 %% drop at %.3f m; on the monotone fairing of H against NPSHA\n",
		n3.ReferenceHead.Value(), n3.DropHead.Value())
	fmt.Fprintf(w, "  NPSH3 = %.2f m, standard uncertainty %.3f m: from NPSHA %.3f m, from the head %.3f m = √(u_H² + (0.97·u_H)²/3)/slope\n"+
		"  with u_H = %.3g m and the faired slope %.2f m of head per m of NPSHA\n",
		n3.NPSH3.Value(), n3.U.Value(), n3.UFromNPSHA.Value(), n3.UFromHead.Value(), n3.HeadU.Value(), n3.Slope)
	for _, n := range n3.Notes {
		fmt.Fprintf(w, "  note: %s\n", n)
	}
	if len(n3.Pooled) > 0 {
		var ps []string
		for _, p := range n3.Pooled {
			ps = append(ps, fmt.Sprintf("%g", p))
		}
		fmt.Fprintf(w, "  the heads at NPSHA %s m were pooled into their mean, because the head rose as NPSHA fell (monotone fairing)\n", andList(ps))
	}
	if out != "" {
		if a.PNG, a.SVG, err = plotAcceptance(out, a, wIn, hIn, dpi); err != nil {
			return Acceptance{}, err
		}
		fmt.Fprintf(w, "plot of the reduced points, fitted Q–H and Q–η curves, tolerance cross and line through the origin: %s and %s\n", a.PNG, a.SVG)
	}
	return a, nil
}

// andList joins items as "a", "a and b" or "a, b and c".
func andList(items []string) string {
	if len(items) < 2 {
		return strings.Join(items, "")
	}
	return strings.Join(items[:len(items)-1], ", ") + " and " + items[len(items)-1]
}

// plotAcceptance draws the Q–H panel (reduced points, fitted curve, the
// cross of the agreed grade and the line through the origin and the
// guarantee point) above the Q–η panel (reduced points and fitted curve),
// and writes them as pumpscale-acceptance.png (at dpi) and .svg in dir,
// w × h inches.
func plotAcceptance(dir string, a Acceptance, wIn, hIn, dpi float64) (string, string, error) {
	top, bottom := plot.New(), plot.New()
	top.Title.Text = fmt.Sprintf("Acceptance test at %g rpm (invented data): grade %v", specRPM, a.Agreed.Grade)
	top.Y.Label.Text = "head H (m)"
	bottom.X.Label.Text = "flow rate Q (L/s)"
	bottom.Y.Label.Text = "efficiency η (%)"
	top.X.Label.Text = "flow rate Q (L/s)"
	var hq, eq plotter.XYs
	for _, r := range a.Reduced {
		hq = append(hq, plotter.XY{X: 1e3 * r.Flow.Value(), Y: r.Head.Value()})
		eq = append(eq, plotter.XY{X: 1e3 * r.Flow.Value(), Y: 100 * r.Efficiency})
	}
	lo, hi := a.Curves.Head.XMin, a.Curves.Head.XMax
	var hl, el plotter.XYs
	for i := 0; i <= 60; i++ {
		x := lo + (hi-lo)*float64(i)/60
		hl = append(hl, plotter.XY{X: 1e3 * x, Y: a.Curves.Head.Eval(x)})
		el = append(el, plotter.XY{X: 1e3 * x, Y: 100 * a.Curves.Efficiency.Eval(x)})
	}
	add := func(p *plot.Plot, pts, line plotter.XYs, k int, name string) error {
		sc, err := plotter.NewScatter(pts)
		if err != nil {
			return err
		}
		sc.GlyphStyle = glyph(k)
		ln, err := plotter.NewLine(line)
		if err != nil {
			return err
		}
		ln.Color = sc.GlyphStyle.Color
		p.Add(sc, ln)
		p.Legend.Add(name, sc, ln)
		return nil
	}
	if err := add(top, hq, hl, 0, fmt.Sprintf("reduced points, fitted order %d", a.Curves.Head.Order)); err != nil {
		return "", "", err
	}
	if err := add(bottom, eq, el, 1, fmt.Sprintf("reduced points, fitted order %d", a.Curves.Efficiency.Order)); err != nil {
		return "", "", err
	}
	v := a.Agreed
	qg, hg := guaranteeQ, guaranteeH
	cross := []plotter.XYs{
		{{X: qg, Y: v.HeadBar[0]}, {X: qg, Y: v.HeadBar[1]}},
		{{X: 1e3 * v.FlowBar[0], Y: hg}, {X: 1e3 * v.FlowBar[1], Y: hg}},
	}
	for i, c := range cross {
		ln, err := plotter.NewLine(c)
		if err != nil {
			return "", "", err
		}
		ln.Color, ln.Width = color.RGBA{200, 80, 0, 255}, vg.Points(2)
		top.Add(ln)
		if i == 0 {
			top.Legend.Add(fmt.Sprintf("tolerance cross, grade %v", v.Grade), ln)
		}
	}
	// The line through the origin, drawn near the guarantee point only.
	ray, err := plotter.NewLine(plotter.XYs{{X: 0.9 * qg, Y: 0.9 * hg}, {X: 1.2 * qg, Y: 1.2 * hg}})
	if err != nil {
		return "", "", err
	}
	ray.Color, ray.Dashes = color.RGBA{0, 90, 180, 255}, []vg.Length{vg.Points(4), vg.Points(2)}
	top.Add(ray)
	top.Legend.Add("line through the origin and the guarantee point", ray)
	gp, err := plotter.NewScatter(plotter.XYs{{X: qg, Y: hg}})
	if err != nil {
		return "", "", err
	}
	gp.GlyphStyle = glyph(2)
	gp.GlyphStyle.Radius = vg.Points(5)
	top.Add(gp)
	top.Legend.Add("guarantee point", gp)
	ex, err := plotter.NewScatter(plotter.XYs{{X: 1e3 * v.Intersection[0], Y: 100 * v.EfficiencyAt.Y}})
	if err != nil {
		return "", "", err
	}
	ex.GlyphStyle = glyph(3)
	bottom.Add(ex)
	bottom.Legend.Add(fmt.Sprintf("η where that line meets the Q–H curve (at least %.1f %%)", 100*v.EfficiencyMin), ex)
	// Ranges: the fitted flow range with a margin; heads and efficiencies
	// from the data, the cross and the ray within it.
	xlo, xhi := 1e3*lo-0.05*1e3*(hi-lo), 1e3*hi+0.05*1e3*(hi-lo)
	top.X.Min, top.X.Max, bottom.X.Min, bottom.X.Max = xlo, xhi, xlo, xhi
	top.Y.Min, top.Y.Max = 0.75*a.Curves.Head.Eval(hi), 1.15*a.Curves.Head.Eval(lo)
	top.Legend.Top, top.Legend.Left = false, true
	top.Legend.YOffs = 0
	// The efficiency legend goes at the top left, in a band added above
	// the data so that it cannot cover the curve (which rises across the
	// panel and peaks near its middle).
	bottom.Legend.Top, bottom.Legend.Left = true, true
	bottom.Legend.XOffs, bottom.Legend.YOffs = vg.Points(6), -vg.Points(4)
	bottom.Y.Min, bottom.Y.Max = efficiencyAxis(bottom.Y.Min, bottom.Y.Max)
	for _, p := range []*plot.Plot{top, bottom} {
		p.Add(plotter.NewGrid())
		p.X.Tick.Marker, p.Y.Tick.Marker = plotstyle.LinearTicks{}, plotstyle.LinearTicks{}
	}
	png := filepath.Join(dir, "pumpscale-acceptance.png")
	svg := filepath.Join(dir, "pumpscale-acceptance.svg")
	for _, path := range []string{png, svg} {
		if err := plotstyle.SaveStacked([]*plot.Plot{top, bottom}, path, wIn, hIn, dpi); err != nil {
			return "", "", err
		}
	}
	return png, svg, nil
}

// legendBand is the share of the efficiency panel's data range added
// above the data for its legend.
const legendBand = 0.35

// efficiencyAxis returns the efficiency panel's axis range for data from
// lo to hi (%): a margin of 5 % of the range below, the legend's band
// above, rounded out to whole percent.
func efficiencyAxis(lo, hi float64) (float64, float64) {
	r := hi - lo
	return math.Floor(lo - 0.05*r), math.Ceil(hi + legendBand*r)
}

// glyph returns the marker of series k: a distinct shape and colour.
func glyph(k int) draw.GlyphStyle {
	shapes := []draw.GlyphDrawer{draw.CircleGlyph{}, draw.SquareGlyph{}, draw.TriangleGlyph{}, draw.CrossGlyph{}}
	colors := []color.RGBA{{0, 0, 0, 255}, {0, 140, 70, 255}, {200, 80, 0, 255}, {150, 0, 150, 255}}
	return draw.GlyphStyle{Shape: shapes[k%len(shapes)], Color: colors[k%len(colors)], Radius: vg.Points(3)}
}
