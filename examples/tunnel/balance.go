package main

// The balance reduction of an invented polar run on the 1:12 model in
// the ordinary tunnel's closed 2.0 × 1.5 m section: readings → loads by
// the calibration → weight tare → moment reference point → wind axes →
// coefficients on q_u → wall corrections → the fitted polar and its
// plots.

import (
	"cmp"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"slices"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/examples/internal/plotstyle"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// calibrationFile is the invented six-component balance's calibration,
// in the tunnel package's text format.
const calibrationFile = `similis-balance 1
name      SB-6, six-component internal balance, 4 kN (invented)
form      readings-from-loads
readings  mV/V
# component, load unit, calibrated range
component NF N    -4000 4000
component AF N    -400  400
component PM N*m  -300  300
component SF N    -1500 1500
component YM N*m  -150  150
component RM N*m  -150  150
# first-order terms, mV/V per unit load; columns NF AF PM SF YM RM
linear NF  2.5e-4   1.2e-5  -8.0e-6  0       0        2.0e-6
linear AF  -3.0e-6  2.5e-3   4.0e-6  0       0        0
linear PM  1.5e-6   0        3.3e-3  0       1.0e-5   0
linear SF  0        0        0       6.7e-4  -9.0e-6  1.2e-5
linear YM  0        0        2.0e-6  4.0e-6  6.7e-3   0
linear RM  1.0e-6   0        0       5.0e-6  0        6.7e-3
# second-order terms, pairs (NF,NF) (NF,AF) (NF,PM) … (RM,RM)
quadratic NF 1.2e-11 0 2.0e-10 0 0 0  0 0 0 0 0  0 0 0 0  0 0 0  0 0  0
quadratic AF 3.0e-10 0 0 0 0 0  0 0 0 0 0  0 0 0 0  0 0 0  0 0  0
quadratic PM -5.0e-12 0 8.0e-10 0 0 0  0 0 0 0 0  1.0e-9 0 0 0  0 0 0  0 0  0
`

// reading is one invented data point: the model's pitch (degrees, roll
// 0) and the six readings in mV/V in the calibration's order (NF, AF,
// PM, SF, YM, RM), from the balance's unloaded zero.
type reading struct {
	pitch float64
	r     [6]float64
}

// windOff are the invented wind-off readings at six attitudes.
var windOff = []reading{
	{-4, [6]float64{-0.01125, -0.00772, -0.00456, 0.00002, 0, -0.00004}},
	{0, [6]float64{-0.01124, 0.00013, -0.00452, -0.00003, 0, -0.00005}},
	{4, [6]float64{-0.01117, 0.00798, -0.00446, 0.00001, 0, -0.00004}},
	{8, [6]float64{-0.01105, 0.01579, -0.00438, 0.00003, 0, -0.00004}},
	{12, [6]float64{-0.01088, 0.02352, -0.00427, -0.00001, 0, -0.00004}},
	{16, [6]float64{-0.01066, 0.03113, -0.00414, -0.00003, 0, -0.00004}},
}

// windOn are the invented wind-on readings of the polar run, all at
// q_u = 2750 Pa and Ma 0.20.
var windOn = []reading{
	{-4, [6]float64{-0.04848, 0.01152, -0.04229, -0.00020, -0.00013, -0.00013}},
	{-2, [6]float64{-0.01775, 0.03604, -0.02956, 0.00004, -0.00023, 0.00023}},
	{0, [6]float64{0.01403, 0.04322, -0.01546, 0.00018, 0.00013, -0.00008}},
	{2, [6]float64{0.04555, 0.03331, 0.00020, -0.00008, 0.00003, -0.00009}},
	{4, [6]float64{0.07624, 0.00796, 0.01387, -0.00016, -0.00015, 0.00047}},
	{6, [6]float64{0.10704, -0.03570, 0.02734, 0.00010, 0.00028, 0.00046}},
	{8, [6]float64{0.13821, -0.09534, 0.04320, 0.00002, -0.00005, 0.00035}},
	{10, [6]float64{0.16844, -0.17242, 0.05587, -0.00012, 0.00014, 0.00101}},
	{12, [6]float64{0.18500, -0.21419, 0.06419, 0.00020, -0.00020, 0.00065}},
	{14, [6]float64{0.19204, -0.25436, 0.06625, -0.00006, 0.00012, 0.00091}},
	{16, [6]float64{0.18301, -0.27032, 0.06335, 0.00008, -0.00002, 0.00044}},
}

// The run's invented conditions and the model's geometry (the 1:12
// model: wing 38 m²/144, mean chord 2.4 m/12, span 18.6 m/12).
const (
	runQ       = 2750.0 // Pa, uncorrected dynamic pressure
	runMach    = 0.20
	modelChord = 0.2        // m
	modelSpan  = 1.55       // m
	mrcAhead   = 0.04       // m: the quarter point of the mean chord ahead of the balance centre
	modelArea  = 38.0 / 144 // m², the 1:12 model's wing
	// assumedSlope, dC_L/dα per degree, starts the curvature correction's
	// iteration (invented); the fitted slope replaces it.
	assumedSlope = 0.080
)

// Run is the reduced polar run, for the test.
type Run struct {
	Calibration *tunnel.Calibration
	Tare        tunnel.WeightTare
	Points      []tunnel.Reduced
	Polar       tunnel.Polar
	// MaxShare is the largest load of the run as a fraction of its
	// component's calibrated range, and MaxComponent that component.
	MaxShare     float64
	MaxComponent tunnel.Component
	// Slope is the lift slope, per degree, the curvature correction used:
	// the one fitted to a first reduction with assumedSlope.
	Slope    float64
	PNG, SVG [2]string // the lift curve's and the polar's files
}

// reduceRun reduces the invented run, prints its tables and the fitted
// polar, and writes the plots into dir.
func reduceRun(w io.Writer, dir string, alo, ahi, width, height, dpi float64) (*Run, error) {
	cal, err := tunnel.ParseCalibration(strings.NewReader(calibrationFile))
	if err != nil {
		return nil, err
	}
	run := &Run{Calibration: cal}
	comps := cal.Components()
	var measured []tunnel.Component
	for _, c := range comps {
		measured = append(measured, c.Component)
	}
	fmt.Fprintln(w, "\nBalance reduction of a polar run on the 1:12 model of the 2.4 m-chord design, whatever -chord and -scale say (the readings, the balance and its calibration are invented):")
	fmt.Fprintf(w, "  balance: %v\n", cal)
	fmt.Fprintln(w, "  the calibration gives readings from loads with first- and second-order terms; the loads are recovered by iteration")
	fmt.Fprintln(w, "  body axes: x forward, y to starboard, z down; NF positive up, AF positive aft, PM positive nose up; readings from the unloaded zero")

	var pts []tunnel.TarePoint
	for _, r := range windOff {
		l, err := cal.Loads(r.r[:])
		if err != nil {
			return nil, err
		}
		pts = append(pts, tunnel.TarePoint{Attitude: tunnel.Attitude{PitchDeg: r.pitch}, Loads: l})
	}
	if run.Tare, err = tunnel.FitWeightTare(pts, measured); err != nil {
		return nil, err
	}
	t := run.Tare
	fmt.Fprintf(w, "  weight tare from %d wind-off attitudes (pitch %g° … %g°): W = %.2f N, CG from the balance centre x = %.1f mm, y = %.1f mm, z = %.1f mm (body axes)",
		t.Points, windOff[0].pitch, windOff[len(windOff)-1].pitch, t.Weight, 1e3*t.CG[0], 1e3*t.CG[1], 1e3*t.CG[2])
	if len(t.Unresolved) > 0 {
		fmt.Fprintf(w, " (%s not resolved by these attitudes, taken as 0)", strings.Join(t.Unresolved, ", "))
	}
	fmt.Fprintf(w, "; rms residual %.3f N, %.4f N·m\n", t.ForceRMS, t.MomentRMS)

	// The streamline-curvature correction needs the lift slope: the run is
	// reduced once with an assumed slope, the polar fitted, and the run
	// reduced again with the fitted slope, which is the one printed and
	// used.
	var table strings.Builder
	slope := assumedSlope
	for pass := range 2 {
		table.Reset()
		run.Points, run.MaxShare = nil, 0
		if run.Polar, err = reducePoints(&table, run, cal, comps, slope, alo, ahi); err != nil {
			return nil, err
		}
		// A range whose fitted slope is not positive lies past the stall:
		// no linear range, and no slope the curvature correction can use.
		if a := run.Polar.LiftSlopePerDeg.Value; !(a > 0) {
			return nil, pastStall(run.Points, alo, ahi, a)
		}
		if pass == 0 {
			slope = run.Polar.LiftSlopePerDeg.Value
		}
	}
	run.Slope = slope
	fmt.Fprintf(w, "  moments to the quarter point of the mean chord, %.0f mm ahead of the balance centre; S = %.4f m², c̄ = %.2f m, b = %.2f m\n",
		1e3*mrcAhead, modelArea, modelChord, modelSpan)
	fmt.Fprintf(w, "  run at q_u = %.0f Pa, Ma %.2f; walls: closed 2.0 × 1.5 m (C = 3.00 m²), K·τ₁ = 0.86, δ = 0.12, τ₂ = 0.12, τ₂,t = 0.55;\n",
		runQ, runMach)
	fmt.Fprintf(w, "  the curvature correction's lift slope a = %.4f/° is the fitted one below (the run reduced first with a = %.3f/° assumed, then again with the fitted slope)\n",
		slope, assumedSlope)
	fmt.Fprint(w, table.String())
	p := run.Polar
	aspect := modelSpan * modelSpan / modelArea
	fmt.Fprintf(w, "\nPolar fitted to the %d corrected points with %g° ≤ α ≤ %g° (the linear range; 95 %% intervals):\n", p.N, alo, ahi)
	fmt.Fprintf(w, "  lift slope dC_L/dα = %.4f /° (%.4f … %.4f), zero-lift angle α₀ = %.2f° (%.2f … %.2f)\n",
		p.LiftSlopePerDeg.Value, p.LiftSlopePerDeg.Interval[0], p.LiftSlopePerDeg.Interval[1], p.ZeroLiftAlphaDeg.Value, p.ZeroLiftAlphaDeg.Interval[0], p.ZeroLiftAlphaDeg.Interval[1])
	fmt.Fprintf(w, "  parabolic polar C_D = C_D0 + K·C_L²: C_D0 = %.5f (%.5f … %.5f), K = %.4f (%.4f … %.4f); Oswald factor e = 1/(π·A·K) = %.2f at A = b²/S = %.2f\n",
		p.CD0.Value, p.CD0.Interval[0], p.CD0.Interval[1], p.K.Value, p.K.Interval[0], p.K.Interval[1], 1/(math.Pi*aspect*p.K.Value), aspect)
	if d := p.LiftSlopePerDeg.Value - slope; math.Abs(d) > 0.01*slope {
		fmt.Fprintf(w, "  the curvature correction used a = %.4f/°; the refitted slope differs by %.1f %%: the correction has not settled\n", slope, 100*d/slope)
	}
	if run.PNG, run.SVG, err = plotPolar(dir, run, width, height, dpi); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  plots (C_L against α, and C_D against C_L; filled circles fitted, open triangles outside the linear range; lines the fits):\n    %s, %s\n    %s, %s\n",
		run.PNG[0], run.SVG[0], run.PNG[1], run.SVG[1])
	return run, nil
}

// reducePoints reduces the wind-on points with the curvature correction's
// lift slope, writes their table to w and fits the polar.
func reducePoints(w io.Writer, run *Run, cal *tunnel.Calibration, comps []tunnel.ComponentRange, slope, alo, ahi float64) (tunnel.Polar, error) {
	red := tunnel.Reduction{
		Calibration: cal, Tare: run.Tare,
		Offset:    tunnel.Offset{X: q.New(mrcAhead, q.Length)},
		Reference: tunnel.Reference{Area: q.New(modelArea, q.Area), Span: q.New(modelSpan, q.Length), Chord: q.New(modelChord, q.Length)},
		Walls: tunnel.Model3D{TunnelArea: q.New(3.0, q.Area), ModelVolume: q.New(0.010, q.Volume), ShapeFactor: 0.86, Delta: 0.12,
			CurvatureFactor: 0.12, LiftSlopePerDeg: slope, TailCurvatureFactor: 0.55, TailMomentSlopePerDeg: -0.025},
	}
	fmt.Fprintln(w, "\n  pitch     NF       AF       PM   |        uncorrected, q_u         |   corrected for the walls, q")
	fmt.Fprintln(w, "   (°)     (N)      (N)    (N·m)  |   α (°)    C_L     C_D      C_m  |   α (°)    C_L     C_D     C_m¼")
	var al, cl, cd []float64
	for _, r := range windOn {
		p, err := red.Reduce(tunnel.Point{Readings: r.r[:], Attitude: tunnel.Attitude{PitchDeg: r.pitch}, DynamicPressure: q.New(runQ, q.Pressure), Mach: runMach})
		if err != nil {
			return tunnel.Polar{}, &pointError{pitch: r.pitch, err: err}
		}
		run.Points = append(run.Points, p)
		for _, c := range comps {
			span := math.Max(-c.Min, c.Max)
			if s := math.Abs(p.Balance[c.Component]) / span; s > run.MaxShare {
				run.MaxShare, run.MaxComponent = s, c.Component
			}
		}
		u, c := p.Uncorrected, p.Corrected
		fmt.Fprintf(w, "  %5.1f %8.2f %8.2f %8.3f  | %6.2f %8.4f %7.4f %8.4f | %6.3f %8.4f %7.4f %8.4f\n",
			r.pitch, p.Balance[tunnel.NormalForce], p.Balance[tunnel.AxialForce], p.Balance[tunnel.PitchingMoment],
			p.AlphaDeg, u.CL, u.CD, u.Cm, c.AlphaDeg, c.CL, c.CD, c.CM)
		al, cl, cd = append(al, c.AlphaDeg), append(cl, c.CL), append(cd, c.CD)
	}
	fmt.Fprintln(w, "  (NF, AF, PM: balance loads at its centre, weight included; α from the pitch, β = 0; C_m about the quarter chord)")
	fmt.Fprintf(w, "  largest load of the run: %v at %.0f %% of its calibrated range — the balance's rated loads and the facility's rules govern every run\n",
		run.MaxComponent, 100*run.MaxShare)
	if err := rangeHolds(al, alo, ahi); err != nil {
		return tunnel.Polar{}, err
	}
	return tunnel.FitPolar(al, cl, cd, alo, ahi, 0.95)
}

// rangeHolds returns a usage error naming -amin and -amax unless at
// least three corrected angles lie in alo … ahi (the polar's fit needs
// three), with the bounds that would take in three: -amax raised to the
// third angle from -amin up, or -amin lowered to the third from -amax
// down, rounded outward to the table's three decimals.
func rangeHolds(alpha []float64, alo, ahi float64) error {
	var in []string
	var above, below []float64
	for _, a := range alpha {
		switch {
		case a >= alo && a <= ahi:
			in = append(in, fmt.Sprintf("%.3f°", a))
		case a > ahi:
			above = append(above, a)
		default:
			below = append(below, a)
		}
	}
	if len(in) >= 3 {
		return nil
	}
	slices.Sort(above)
	slices.Sort(below)
	need := 3 - len(in)
	var fixes []string
	if len(above) >= need {
		fixes = append(fixes, fmt.Sprintf("raise -amax to at least %.3f", math.Ceil(above[need-1]*1000)/1000))
	}
	if len(below) >= need {
		fixes = append(fixes, fmt.Sprintf("lower -amin to at most %.3f", math.Floor(below[len(below)-need]*1000)/1000))
	}
	if len(fixes) == 0 {
		fixes = append(fixes, "widen the range")
	}
	got := "none lies in it"
	if len(in) > 0 {
		got = fmt.Sprintf("%d lie in it (%s)", len(in), strings.Join(in, ", "))
	}
	sorted := slices.Sorted(slices.Values(alpha))
	return &cli.Error{Msg: fmt.Sprintf("-amin %g -amax %g: the polar fit needs at least 3 corrected angles in the linear range, and %s: %s "+
		"(the run's corrected α run from %.3f° to %.3f°)", alo, ahi, got, strings.Join(fixes, ", or "), sorted[0], sorted[len(sorted)-1])}
}

// pointError is a wind-on point the reduction refused: the point's
// pitch and the library's error, printed without the package's name
// (the command's name already stands before it).
type pointError struct {
	pitch float64
	err   error
}

func (e *pointError) Error() string { return fmt.Sprintf("point at %g°: %s", e.pitch, libText(e.err)) }
func (e *pointError) Unwrap() error { return e.err }

// pastStall returns the usage error of an -amin … -amax range whose
// fitted lift slope a is not positive: the range lies past the stall. It
// names a range that is linear by the run's own points: the longest run
// of neighbouring corrected points (in α order) between which the slope
// ΔC_L/Δα stays at or above ¾ of the median of all neighbour slopes,
// its ends rounded outward to whole degrees unless that would take in
// the next point.
func pastStall(pts []tunnel.Reduced, alo, ahi, a float64) error {
	msg := fmt.Sprintf("-amin %g -amax %g is past stall (fitted lift slope %s per degree, not positive)", alo, ahi, cli.Sig(a, 3))
	if lo, hi, med, ok := linearRange(pts); ok {
		msg += fmt.Sprintf("; choose the linear range, e.g. -amin %s -amax %s (corrected α %.3f° … %.3f°, where the slope between neighbouring points stays ≥ ¾ of its median, %s/°)",
			lo.flag, hi.flag, lo.alpha, hi.alpha, cli.Sig(med, 3))
	} else {
		msg += "; the run has no 3 neighbouring points whose lift rises steadily: check the readings"
	}
	return &cli.Error{Msg: msg}
}

// rangeEnd is one end of a suggested linear range: the corrected α of
// its last point and the flag value that takes it in.
type rangeEnd struct {
	alpha float64
	flag  string
}

// linearRange finds the linear stretch of the run's corrected lift curve
// (see pastStall): its two ends and the median neighbour slope (per
// degree), ok false when no stretch of at least 3 points has a positive
// median slope.
func linearRange(pts []tunnel.Reduced) (lo, hi rangeEnd, median float64, ok bool) {
	type pt struct{ a, cl float64 }
	var p []pt
	for _, r := range pts {
		p = append(p, pt{r.Corrected.AlphaDeg, r.Corrected.CL})
	}
	slices.SortFunc(p, func(x, y pt) int { return cmp.Compare(x.a, y.a) })
	var s []float64
	for i := 1; i < len(p); i++ {
		if d := p[i].a - p[i-1].a; d > 0 {
			s = append(s, (p[i].cl-p[i-1].cl)/d)
		} else {
			s = append(s, math.NaN()) // two points at one angle: no slope
		}
	}
	sorted := slices.Sorted(slices.Values(slices.DeleteFunc(slices.Clone(s), math.IsNaN)))
	if len(sorted) < 2 {
		return lo, hi, 0, false
	}
	n := len(sorted)
	median = 0.5 * (sorted[(n-1)/2] + sorted[n/2])
	if !(median > 0) {
		return lo, hi, median, false
	}
	// The longest run of segments i … j-1 with every slope ≥ ¾·median;
	// segment i joins points i and i+1.
	bi, bj := 0, 0
	for i := 0; i < len(s); {
		if !(s[i] >= 0.75*median) {
			i++
			continue
		}
		j := i
		for j < len(s) && s[j] >= 0.75*median {
			j++
		}
		if j-i > bj-bi {
			bi, bj = i, j
		}
		i = j
	}
	if bj-bi < 2 { // fewer than 3 points
		return lo, hi, median, false
	}
	first, last := bi, bj // point indices
	lo.alpha, hi.alpha = p[first].a, p[last].a
	lf := math.Floor(lo.alpha)
	if first > 0 && lf <= p[first-1].a || lf < -30 {
		lf = math.Floor(lo.alpha*1000) / 1000
	}
	hf := math.Ceil(hi.alpha)
	if last < len(p)-1 && hf >= p[last+1].a || hf > 30 {
		hf = math.Ceil(hi.alpha*1000) / 1000
	}
	lo.flag, hi.flag = strconv.FormatFloat(lf, 'f', -1, 64), strconv.FormatFloat(hf, 'f', -1, 64)
	return lo, hi, median, true
}

// plotPolar writes the lift curve and the drag polar as PNG and SVG.
func plotPolar(dir string, r *Run, width, height, dpi float64) (png, svg [2]string, err error) {
	p := r.Polar
	var in, out [2]plotter.XYs
	for _, pt := range r.Points {
		c := pt.Corrected
		xy := [2]plotter.XY{{X: c.AlphaDeg, Y: c.CL}, {X: c.CL, Y: c.CD}}
		for k := range 2 {
			if c.AlphaDeg >= p.AlphaRangeDeg[0] && c.AlphaDeg <= p.AlphaRangeDeg[1] {
				in[k] = append(in[k], xy[k])
			} else {
				out[k] = append(out[k], xy[k])
			}
		}
	}
	// The fitted lines over the fitted range.
	var line [2]plotter.XYs
	lo, hi := p.Lift.XMin, p.Lift.XMax
	for i := 0; i <= 40; i++ {
		a := lo + (hi-lo)*float64(i)/40
		line[0] = append(line[0], plotter.XY{X: a, Y: p.Lift.Eval(a)})
	}
	clmax := math.Sqrt(p.Drag.XMax)
	for i := 0; i <= 40; i++ {
		l := -clmax + 2*clmax*float64(i)/40
		line[1] = append(line[1], plotter.XY{X: l, Y: p.CD0.Value + p.K.Value*l*l})
	}
	titles := [2]string{"Lift curve, 1:12 model (invented run), corrected", "Drag polar, 1:12 model (invented run), corrected"}
	xl := [2]string{"α (degrees, corrected)", "C_L"}
	yl := [2]string{"C_L", "C_D"}
	fits := [2]string{fmt.Sprintf("fit: dC_L/dα = %.4f /°", p.LiftSlopePerDeg.Value), fmt.Sprintf("fit: C_{D0} = %.4f, K = %.4f", p.CD0.Value, p.K.Value)}
	names := [2]string{"tunnel-lift", "tunnel-polar"}
	for k := range 2 {
		pl := plot.New()
		pl.Title.Text = titles[k]
		pl.X.Label.Text, pl.Y.Label.Text = xl[k], yl[k]
		pl.Legend.Top, pl.Legend.Left = true, true
		var xs, ys []float64
		for j, set := range []plotter.XYs{in[k], out[k]} {
			if len(set) == 0 {
				continue
			}
			sc, err := plotter.NewScatter(set)
			if err != nil {
				return png, svg, err
			}
			sc.GlyphStyle = plotstyle.Marker([]int{0, 2}[j]) // a filled circle, an open triangle
			pl.Add(sc)
			pl.Legend.Add([]string{"in the linear range", "outside it (not fitted)"}[j], sc)
			for _, p := range set {
				xs, ys = append(xs, p.X), append(ys, p.Y)
			}
		}
		ln, err := plotter.NewLine(line[k])
		if err != nil {
			return png, svg, err
		}
		ln.Color = plotstyle.SeriesColor(1)
		ln.Dashes = []vg.Length{vg.Points(4), vg.Points(2)}
		pl.Add(ln)
		pl.Legend.Add(fits[k], ln)
		if k == 0 {
			for _, p := range line[k] {
				xs, ys = append(xs, p.X), append(ys, p.Y)
			}
		}
		plotstyle.StyleLinear(pl, xs, ys)
		// Room above the data for the legend.
		pl.Y.Max += 0.3 * (pl.Y.Max - pl.Y.Min)
		png[k] = filepath.Join(dir, names[k]+".png")
		svg[k] = filepath.Join(dir, names[k]+".svg")
		if err := plotstyle.Save(pl, png[k], width, height, dpi); err != nil {
			return png, svg, err
		}
		if err := plotstyle.Save(pl, svg[k], width, height, dpi); err != nil {
			return png, svg, err
		}
	}
	return png, svg, nil
}
