package main

// The spillway's rating: invented model measurements of head and
// discharge, checked for scale effects, fitted, and carried to the
// prototype with the fit's band; the rating curve drawn as PNG and SVG.

import (
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/examples/internal/plotstyle"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// Invented model rating measurements: heads over the crest (m) and
// discharges (L/s) in the model, on a crest of ratingCrest (m) across
// the flow, in water at modelWaterC.
var (
	ratingHeads = []float64{0.030, 0.045, 0.060, 0.075, 0.090, 0.105, 0.120, 0.135, 0.150, 0.165, 0.180}
	ratingFlows = []float64{7.38, 14.38, 22.62, 34.67, 45.59, 57.74, 72.06, 85.53, 101.80, 118.90, 134.67}
)

const ratingCrest = 0.76 // m, the model crest length b_m

// fitWeir fits the model rating to the invented measurements, each
// point checked for scale effects in the model water (nu, rho, sigma).
func fitWeir(scale float64, nu, rho, sigma q.Quantity) (*hydraulic.Rating, error) {
	flows := make([]float64, len(ratingFlows))
	for i, v := range ratingFlows {
		flows[i] = v / 1000
	}
	return hydraulic.FitRating(hydraulic.RatingInput{
		Head: q.NewSeries(ratingHeads, q.Length), Discharge: q.NewSeries(flows, q.VolumeFlowRate),
		CrestLength: q.New(ratingCrest, q.Length), LengthRatio: 1 / scale,
		KinematicViscosity: nu, Density: rho, SurfaceTension: sigma, Limits: hydraulic.WeirLimits(),
	})
}

// crestHead returns the model head h at the model discharge qm (m³/s)
// from the model's own measurements, and says where it comes from:
// the fitted rating Q = C·h^n inverted where that head lies in its range
// of validity; else, inside the measured discharges, interpolated
// log–log between the two neighbouring measured points (points the
// rating excludes still measure the model's head); beyond every
// measurement, the fitted rating extrapolated, said so.
func crestHead(r *hydraulic.Rating, qm float64) (float64, string) {
	h := math.Pow(qm/r.C, 1/r.N)
	if h >= r.HeadMin*(1-1e-12) && h <= r.HeadMax*(1+1e-12) {
		return h, fmt.Sprintf("the fitted model rating inverted, h = (Q/C)^(1/n), within its range %.3f … %.3f m", r.HeadMin, r.HeadMax)
	}
	for i := 1; i < len(r.Points); i++ {
		a, b := r.Points[i-1], r.Points[i]
		if qm >= a.Discharge && qm <= b.Discharge {
			f := math.Log(qm/a.Discharge) / math.Log(b.Discharge/a.Discharge)
			h = a.Head * math.Pow(b.Head/a.Head, f)
			return h, fmt.Sprintf("interpolated log–log between the measured points %d (h = %.3f m, Q = %.2f L/s) and %d (h = %.3f m, Q = %.2f L/s), below the fitted rating's range (the rating excludes them for scale effects; they still measure the model's head)",
				i-1, a.Head, a.Discharge*1000, i, b.Head, b.Discharge*1000)
		}
	}
	return h, fmt.Sprintf("EXTRAPOLATED: the fitted model rating inverted beyond every measurement (range %.3f … %.3f m)", r.HeadMin, r.HeadMax)
}

// criticalVelocity is V = (g·q)^(1/3) for the unit discharge q = Q/b
// over the model crest: the velocity at critical depth y_c = V²/g, the
// one definition of the crest velocity in both the crest checks and the
// rating table (as hydraulic.RatingPoint.Velocity).
func criticalVelocity(qm float64) float64 {
	return math.Cbrt(9.80665 * qm / ratingCrest)
}

// rateWeir prints the fitted model rating with the scale-effect check
// of every point, carries it to the prototype, prints the table with its
// band, and draws the curve into dir (no plot when dir is empty).
func rateWeir(w io.Writer, res *Result, r *hydraulic.Rating, scale float64, dir string, width, height, dpi float64) error {
	res.Rating = r
	fmt.Fprintf(w, "\nweir rating from the model: INVENTED measurements, crest length b_m = %g m (prototype %.4g m), model water %g °C\n",
		ratingCrest, ratingCrest*scale, modelWaterC)
	fmt.Fprintln(w, "  h is the head over the crest; C_d = Q/((2/3)·√(2g)·b·h^(3/2)) at each point; V, Re and We are defined as at the crest")
	fmt.Fprintln(w, "  above (V = (g·q)^(1/3) with the measured q = Q/b), with the same limits")
	fmt.Fprintf(w, "  exclusion rule: %s\n", hydraulic.ExclusionRule)
	fmt.Fprintf(w, "  %3s %8s %9s %7s %7s %9s %7s   %s\n", "#", "h_m m", "Q_m L/s", "C_d", "V m/s", "Re", "We", "scale-effect check, fit")
	for i, p := range r.Points {
		verdict := "passes"
		if p.Excluded {
			verdict = "EXCLUDED: " + strings.Join(p.Failed, ", ") + " below the limit"
		} else {
			verdict += fmt.Sprintf("; residual %+.2f %%, t = %+.2f", 100*p.Residual, p.Studentized)
			if p.Outlier {
				verdict += " OUTLIER (kept)"
			}
			if p.Influential {
				verdict += " influential"
			}
		}
		fmt.Fprintf(w, "  %3d %8.3f %9.2f %7.4f %7.3f %9s %7s   %s\n", i, p.Head, p.Discharge*1000, p.WeirCoefficient, p.Velocity,
			sig3(p.Checks[0].Value), sig3(p.Checks[1].Value), verdict)
	}
	pct := r.Level * 100
	fmt.Fprintln(w, "  fit: ln Q = ln C + n·ln h by linear least squares on the included points (log–log: a discharge meter's scatter is a")
	fmt.Fprintln(w, "  fraction of the reading, and the model is linear in ln C and n, so its intervals are exact, not linearised)")
	fmt.Fprintf(w, "  model rating: Q_m = %.5g·h_m^%.4f (Q in m³/s, h in m); n in [%.4f, %.4f], C in [%.5g, %.5g] (%g %%)\n",
		r.C, r.N, r.NInterval[0], r.NInterval[1], r.CInterval[0], r.CInterval[1], pct)
	fmt.Fprintf(w, "  scatter S = %.2f %% of Q (in ln Q), %d points, %d degrees of freedom\n", 100*r.S, r.Used, r.DoF)
	fmt.Fprintf(w, "  weir coefficient with n held at 3/2: C_d = %.4f in [%.4f, %.4f] (%g %%); Froude similarity keeps it at full scale\n",
		r.WeirCoefficient, r.WeirCoefficientInterval[0], r.WeirCoefficientInterval[1], pct)
	var out, infl []string
	for i, p := range r.Points {
		if p.Outlier {
			out = append(out, fmt.Sprint(i))
		}
		if p.Influential {
			infl = append(infl, fmt.Sprint(i))
		}
	}
	fmt.Fprintf(w, "  outliers (|t| > 3, flagged, never dropped): %s; influential (Cook's D > 4/N): %s\n", orNone(out), orNone(infl))
	for _, n := range r.Notes {
		fmt.Fprintf(w, "  note: %s\n", n)
	}
	lo, hi := r.ProtoHeadRange()
	fmt.Fprintf(w, "  range of validity: model heads %.3f … %.3f m, prototype %s … %s m\n", r.HeadMin, r.HeadMax, cli.Sig(lo, 3), cli.Sig(hi, 3))

	fmt.Fprintf(w, "\nprototype rating by Froude similarity, 1:%g: h_p = %g·h_m, Q_p = Q_m/λ_Q with λ_Q = λ_L^(5/2) = 1:%.5g\n", scale, scale, 1/r.DischargeRatio)
	fmt.Fprintf(w, "  Q_p = %.5g·h_p^%.4f (Q in m³/s, h in m)\n", r.ProtoC, r.N)
	fmt.Fprintf(w, "  %s\n", hydraulic.BandNote)
	fmt.Fprintf(w, "  u_rel is the standard uncertainty (k = 1) of the curve as a fraction of Q_p; the band is Q_p·exp(±t·u_rel), t = %.3f (Student, %d degrees of freedom, %g %%)\n",
		r.T, r.DoF, pct)
	fmt.Fprintf(w, "  %8s %10s %23s %14s\n", "h_p m", "Q_p m³/s", fmt.Sprintf("%g %% band m³/s", pct), "u_rel (k = 1)")
	for _, h := range tableHeads(lo, hi) {
		v, err := r.Extrapolate(q.New(h, q.Length))
		if err != nil {
			return err
		}
		res.Table = append(res.Table, v)
		mark := ""
		if v.Extrapolated {
			mark = fmt.Sprintf("  EXTRAPOLATED: outside %s … %s m, no measurement supports it", cli.Sig(lo, 3), cli.Sig(hi, 3))
		}
		// Heads to three significant figures, discharges to four: a small
		// prototype's table does not round to nothing.
		fmt.Fprintf(w, "  %8s %10s %11s … %-9s %13.2f %%%s\n", cli.Sig(h, 3), cli.Sig(v.Discharge.Value(), 4), cli.Sig(v.Band[0].Value(), 4), cli.Sig(v.Band[1].Value(), 4), 100*v.RelU, mark)
	}
	if dir == "" {
		fmt.Fprintln(w, "  plot: not drawn (-out is empty)")
		return nil
	}
	png, svg, err := plotRating(dir, r, res.Table, scale, width, height, dpi)
	if err != nil {
		return err
	}
	res.PNG, res.SVG = png, svg
	fmt.Fprintf(w, "  plot (prototype rating, log–log, above; below, each point and the band as a deviation from the fitted curve in %%): %s, %s\n", png, svg)
	return nil
}

func orNone(s []string) string {
	if len(s) == 0 {
		return "none"
	}
	return strings.Join(s, ", ")
}

// tableHeads returns the prototype heads of the table: six across the
// range of validity, and one beyond each end to show extrapolation.
func tableHeads(lo, hi float64) []float64 {
	hs := []float64{0.6 * lo}
	for k := range 6 {
		hs = append(hs, lo+(hi-lo)*float64(k)/5)
	}
	return append(hs, 1.25*hi)
}

// plotRating draws the prototype rating curve with its band and the
// measured points carried to full scale (circles used, crosses
// excluded), as spillway-rating.png (at dpi) and .svg in dir.
func plotRating(dir string, r *hydraulic.Rating, table []hydraulic.RatingValue, scale, width, height, dpi float64) (string, string, error) {
	pl := plot.New()
	pl.Title.Text = fmt.Sprintf("Spillway rating at full scale from a 1:%g model (invented data)", scale)
	pl.X.Label.Text = "h_p, head over the crest (m, log scale)"
	pl.Y.Label.Text = "Q_p, discharge (m³/s, log scale)"
	pl.Legend.Top, pl.Legend.Left = true, true
	var used, excl plotter.XYs
	var xs, ys []float64
	for _, p := range r.Points {
		pt := plotter.XY{X: p.Head * scale, Y: p.Discharge / r.DischargeRatio}
		if p.Excluded {
			excl = append(excl, pt)
		} else {
			used = append(used, pt)
		}
		xs, ys = append(xs, pt.X), append(ys, pt.Y)
	}
	lo, hi := r.ProtoHeadRange()
	curve := func(a, b float64) (mid, lower, upper plotter.XYs, err error) {
		for i := 0; i <= 24; i++ {
			h := a * math.Pow(b/a, float64(i)/24)
			v, err := r.Extrapolate(q.New(h, q.Length))
			if err != nil {
				return nil, nil, nil, err
			}
			mid = append(mid, plotter.XY{X: h, Y: v.Discharge.Value()})
			lower = append(lower, plotter.XY{X: h, Y: v.Band[0].Value()})
			upper = append(upper, plotter.XY{X: h, Y: v.Band[1].Value()})
			xs, ys = append(xs, h), append(ys, v.Band[0].Value(), v.Band[1].Value())
		}
		return mid, lower, upper, nil
	}
	mid, lower, upper, err := curve(lo, hi)
	if err != nil {
		return "", "", err
	}
	t0, t1 := table[0].Head.Value(), table[len(table)-1].Head.Value()
	below, _, _, err := curve(t0, lo)
	if err != nil {
		return "", "", err
	}
	above, _, _, err := curve(hi, t1)
	if err != nil {
		return "", "", err
	}
	fitLine, err := plotter.NewLine(mid)
	if err != nil {
		return "", "", err
	}
	fitLine.Color = plotstyle.SeriesColor(1)
	fitLine.Width = vg.Points(1.5)
	pl.Add(fitLine)
	pl.Legend.Add("fitted rating (range of validity)", fitLine)
	for _, pair := range []struct {
		lines  [2]plotter.XYs
		color  int
		dashes []vg.Length
		label  string
	}{
		{[2]plotter.XYs{lower, upper}, 1, []vg.Length{vg.Points(4), vg.Points(2)}, fmt.Sprintf("%g %% band of the fit (no scale effects)", r.Level*100)},
		{[2]plotter.XYs{below, above}, 2, []vg.Length{vg.Points(1), vg.Points(2)}, "extrapolated"},
	} {
		for k, xy := range pair.lines {
			ln, err := plotter.NewLine(xy)
			if err != nil {
				return "", "", err
			}
			ln.Color, ln.Dashes = plotstyle.SeriesColor(pair.color), pair.dashes
			pl.Add(ln)
			if k == 0 {
				pl.Legend.Add(pair.label, ln)
			}
		}
	}
	for k, set := range []struct {
		pts   plotter.XYs
		label string
		style int
	}{{used, "model points used", 0}, {excl, "model points excluded (scale effects)", 6}} {
		if len(set.pts) == 0 {
			continue
		}
		sc, err := plotter.NewScatter(set.pts)
		if err != nil {
			return "", "", err
		}
		sc.GlyphStyle = plotstyle.Marker(set.style)
		if k == 1 {
			sc.GlyphStyle.Color = plotstyle.SeriesColor(2)
			sc.GlyphStyle.Shape = draw.CrossGlyph{}
		}
		pl.Add(sc)
		pl.Legend.Add(set.label, sc)
	}
	plotstyle.StyleLog(pl, xs, ys)
	pl.Y.Max *= math.Pow(pl.Y.Max/pl.Y.Min, 0.35) // room for the legend above the curve
	dev, err := deviationPlot(r, scale, t0, t1)
	if err != nil {
		return "", "", err
	}
	dev.X.Min, dev.X.Max = pl.X.Min, pl.X.Max
	png := filepath.Join(dir, "spillway-rating.png")
	svg := filepath.Join(dir, "spillway-rating.svg")
	for _, path := range []string{png, svg} {
		if err := plotstyle.SaveStacked([]*plot.Plot{pl, dev}, path, width, height, dpi); err != nil {
			return "", "", err
		}
	}
	return png, svg, nil
}

// deviationPlot is the lower panel: each model point's discharge and the
// band as a deviation from the fitted rating, in per cent, against the
// prototype head, so that the band, a fraction of a per cent, can be
// seen, and the excluded points' departure from the curve with it.
func deviationPlot(r *hydraulic.Rating, scale, t0, t1 float64) (*plot.Plot, error) {
	pl := plot.New()
	pl.X.Label.Text = "h_p (m, log scale)"
	pl.Y.Label.Text = "Q/Q_fit − 1 (%)"
	h := plotstyle.New()
	pl.X.Label.TextStyle.Handler, pl.Y.Label.TextStyle.Handler = h, h
	pl.X.Tick.Label.Handler, pl.Y.Tick.Label.Handler = h, h
	pl.X.Scale, pl.X.Tick.Marker = plot.LogScale{}, plotstyle.LogTicks{}
	pl.Y.Tick.Marker = plotstyle.LinearTicks{}
	lo, hi := r.ProtoHeadRange()
	var ys []float64
	band := func(a, b float64, dashes []vg.Length, c int) error {
		var lower, upper plotter.XYs
		for i := 0; i <= 24; i++ {
			x := a * math.Pow(b/a, float64(i)/24)
			v, err := r.Extrapolate(q.New(x, q.Length))
			if err != nil {
				return err
			}
			l, u := 100*(v.Band[0].Value()/v.Discharge.Value()-1), 100*(v.Band[1].Value()/v.Discharge.Value()-1)
			lower, upper = append(lower, plotter.XY{X: x, Y: l}), append(upper, plotter.XY{X: x, Y: u})
			ys = append(ys, l, u)
		}
		for _, pts := range []plotter.XYs{lower, upper} {
			ln, err := plotter.NewLine(pts)
			if err != nil {
				return err
			}
			ln.Color, ln.Dashes = plotstyle.SeriesColor(c), dashes
			pl.Add(ln)
		}
		return nil
	}
	zero, err := plotter.NewLine(plotter.XYs{{X: t0, Y: 0}, {X: t1, Y: 0}})
	if err != nil {
		return nil, err
	}
	zero.Color = plotstyle.SeriesColor(1)
	pl.Add(zero)
	dotted := []vg.Length{vg.Points(1), vg.Points(2)}
	for _, seg := range []struct {
		a, b   float64
		dashes []vg.Length
		c      int
	}{{t0, lo, dotted, 2}, {lo, hi, []vg.Length{vg.Points(4), vg.Points(2)}, 1}, {hi, t1, dotted, 2}} {
		if err := band(seg.a, seg.b, seg.dashes, seg.c); err != nil {
			return nil, err
		}
	}
	var used, excl plotter.XYs
	for _, p := range r.Points {
		v, err := r.Extrapolate(q.New(p.Head*scale, q.Length))
		if err != nil {
			return nil, err
		}
		pt := plotter.XY{X: p.Head * scale, Y: 100 * (p.Discharge/r.DischargeRatio/v.Discharge.Value() - 1)}
		ys = append(ys, pt.Y)
		if p.Excluded {
			excl = append(excl, pt)
		} else {
			used = append(used, pt)
		}
	}
	for k, pts := range []plotter.XYs{used, excl} {
		if len(pts) == 0 {
			continue
		}
		sc, err := plotter.NewScatter(pts)
		if err != nil {
			return nil, err
		}
		sc.GlyphStyle = plotstyle.Marker(0)
		if k == 1 {
			sc.GlyphStyle.Color, sc.GlyphStyle.Shape = plotstyle.SeriesColor(2), draw.CrossGlyph{}
		}
		pl.Add(sc)
	}
	ylo, yhi := 0.0, 0.0
	for _, y := range ys {
		ylo, yhi = min(ylo, y), max(yhi, y)
	}
	pad := 0.08 * (yhi - ylo)
	pl.Y.Min, pl.Y.Max = ylo-pad, yhi+pad
	return pl, nil
}

// sig3 writes x to three significant figures, trailing zeros kept: plain
// from 0.001 up to 10⁴, with an exponent outside it, as the scale-effect
// checks print their values, so that the table's Re and We columns read
// as the checks above them.
func sig3(x float64) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'g', 3, 64)
	}
	e := int(math.Floor(math.Log10(math.Abs(x))))
	p := math.Pow(10, float64(e-2))
	r := math.Round(x/p) * p
	if math.Abs(r) >= 1000*p {
		e++
	}
	if e < -3 || e >= 4 {
		return strconv.FormatFloat(x, 'e', 2, 64)
	}
	return strconv.FormatFloat(r, 'f', max(0, 2-e), 64)
}
