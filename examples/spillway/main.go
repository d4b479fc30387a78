// Command spillway plans a 1:30 Froude model of an invented river-intake
// spillway: the model discharge, velocity, time and force scales, a
// measured model time series of pressure on the chute floor carried to
// prototype as a Series, a distorted-scale variant for the river reach
// upstream with the grain size a movable bed would need, and the
// scale-effect checks at the crest (its radius, and the Reynolds and
// Weber numbers and the head at the design discharge and at a low flow,
// the head from the model's own rating measurements),
// each limit printed with the publication or practice it rests on. It
// flags a model Manning n smoother than model materials reach and a
// movable-bed grain whose particle Reynolds number falls into the viscous
// range. Last it rates the weir: invented model measurements of head and
// discharge, each checked for scale effects (a failing point excluded by
// a stated rule), the rating Q = C·h^n and the weir coefficient fitted
// with their intervals, and the prototype rating by Froude similarity
// with the fit's band, drawn as a rating-curve plot.
//
// The structure, the flows and the measurements are invented.
//
// Usage:
//
//	go run ./examples/spillway [-scale 30] [-q 0] [-hscale 120] [-vscale 30] [-n 0.014] [-d50 1] [-out DIR] [-width IN] [-height IN] [-dpi N]
//
// A bad flag value exits with status 2, naming the flag.
package main

import (
	"fmt"
	"io"
	"math"
	"os"
	"strconv"

	"similis.dev/similis/examples/internal/cli"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/hydraulic"
	"similis.dev/similis/units"
)

func main() { cli.Main("spillway", run) }

// about is the head of the -h text: what the program does and what its
// output means.
const about = `Usage: spillway [flags]

Plans a Froude-scale model of an invented river-intake spillway. The
model is fixed: its crest radius (0.03 m), crest length (0.76 m), design
discharge (91.29 L/s) and measured rating are the model's whatever -scale
says, and the prototype is the model × -scale (lengths × x, discharges
× x^(5/2)); -q gives another prototype design discharge. It prints, in
order: the model/prototype scale ratios (1:x means the model's
value is the prototype's divided by x); the model discharge for the
design discharge; an invented model record of chute-floor gauge pressure
carried to the prototype; the Manning n the model needs, checked against
the smoothest model materials; a distorted variant of the approach reach
(the prototype river's reach, 5 m deep at a slope of 2×10⁻⁴, which
-scale does not change) with its exaggeration checked against common
practice (at most 10 for river models) and the movable-bed grain that
keeps Shields similarity, named by its size class (ISO 14688-1: sand,
gravel, cobbles, boulders) and its particle Reynolds number checked
against the viscous range; and the scale-effect
checks at the crest (crest radius, Reynolds and Weber numbers, head),
each with its limit, the limit's basis and a verdict, at the design
discharge and at a tenth of it. There h, the head over the crest, is
the model's measured head at that discharge (the fitted rating inverted
within its range, else interpolated between measured points, as
printed); the crest velocity V = (g·q)^(1/3) is the
critical velocity for the unit discharge q = Q/b over the model crest
(critical depth y_c = V²/g); Re and We are both formed with V and h, here and in
the rating table. The pressure peak is that of a short record, not a
design extreme. Then the weir's rating: the invented model
measurements of head h and discharge Q, each point's weir coefficient
C_d = Q/((2/3)·√(2g)·b·h^(3/2)) and scale-effect check (a point failing a
limit is EXCLUDED from the rating, by the rule printed with it); the
model rating Q = C·h^n fitted in logarithms with its confidence
intervals, outliers flagged, and its range of validity; and the
prototype rating (h_p = x·h_m, Q_p = x^(5/2)·Q_m) as a table of
discharges with the band of the fit's uncertainty (scale effects are
not in the band) and u_rel, the curve's standard (k = 1) uncertainty;
heads outside the range are marked EXTRAPOLATED. The rating curve is drawn as spillway-rating.png and spillway-rating.svg in
-out (log–log, with a lower panel of each point and the band as a
deviation from the fitted curve in per cent; no plot when -out is
empty). All data are invented; the output ends with the caution that
governs any use of such a model.

Flags:
`

// Result holds the key numbers, for the test.
type Result struct {
	ModelDischarge, VelocityRatio, TimeRatio, ForceRatio float64
	ProtoTimes, ProtoPressure                            q.Series
	Distorted                                            hydraulic.Distorted
	Manning                                              float64
	ManningCheck                                         hydraulic.ScaleCheck     // the model n against the smoothest materials
	Checks                                               [][]hydraulic.ScaleCheck // design and low flow
	CrestHeads                                           []float64                // m, model heads of Checks, from the model rating
	CrestVelocities                                      []float64                // m/s, V = (g·q)^(1/3) of Checks
	CrestRadius                                          hydraulic.ScaleCheck
	Sediment                                             hydraulic.SedimentScales
	ProtoShearVelocity, ProtoReStar, ModelGrain          float64              // m/s, 1, m
	ReStarCheck                                          hydraulic.ScaleCheck // the model grain's Re*
	ModelGrainClass                                      string               // the model grain's ISO 14688-1 size class
	DistortionCheck                                      hydraulic.ScaleCheck // the exaggeration against common practice
	Rating                                               *hydraulic.Rating
	Table                                                []hydraulic.RatingValue // the prototype rating table
	PNG, SVG                                             string                  // the plot's files, empty when not drawn
}

// The crest checks are made at the design discharge and at a low flow of
// a tenth of it, with the model head taken from the model's own rating
// measurements (crestHead).
const (
	lowFlowShare = 0.1
	modelWaterC  = 15.0 // °C, the model's water, and the river's (so λ_ν = 1)
	// modelCrestRadius is the model's radius of curvature at the crest
	// (0.9 m at the prototype of the default 1:30).
	modelCrestRadius = 0.03 // m
	// modelDesignQ is the model's design discharge (m³/s): 450 m³/s at
	// the prototype of the default 1:30, 91.29 L/s.
	modelDesignQ = 450 / 4929.503017546495 // 30^(5/2)
	// minProtoQ is the smallest prototype design discharge -q accepts
	// (m³/s): below it the model's flow is too small to measure, and its
	// Weber and Reynolds numbers leave every check's range.
	minProtoQ = 0.01
	// The approach reach of the river (invented): flow depth and bed slope
	// at the design discharge, for the bed shear velocity u* = √(g·h·S)
	// (wide channel, hydraulic radius ≈ depth).
	reachDepth = 5.0  // m
	reachSlope = 2e-4 // 1
)

// Invented model record: pressure on the chute floor (kPa gauge) sampled
// at 20 Hz in the model.
var record = []float64{3.10, 3.42, 2.95, 3.88, 4.20, 3.61, 3.05, 3.77, 4.41, 3.98}

func run(w io.Writer, args []string) error { _, err := evaluate(w, args); return err }

func evaluate(w io.Writer, args []string) (*Result, error) {
	fs := cli.NewFlagSet("spillway", about)
	scale := cli.FloatVar(fs, "scale", 30, 2, 500, "", "length scale x of the 1:x Froude model (prototype length over model length); the model is fixed, the prototype is the model × x")
	qp := cli.FloatVar(fs, "q", 0, 0, 1e5, "m³/s", "prototype design discharge, at least 0.01; 0: the model's design discharge of 91.29 L/s carried at -scale (450 m³/s at 1:30)")
	hs := cli.FloatVar(fs, "hscale", 120, 2, 5000, "", "distorted variant of the approach reach: horizontal scale x of 1:x")
	vs := cli.FloatVar(fs, "vscale", 30, 2, 500, "", "distorted variant: vertical scale x of 1:x, at most -hscale")
	protoN := cli.FloatVar(fs, "n", 0.014, 0.008, 0.2, "s·m^(−1/3)", "prototype Manning n of the chute (0.014: concrete cast in forms, common practice)")
	d50 := cli.FloatVar(fs, "d50", 1, 0.063, 100, "mm", "median grain size of the approach reach's bed (sand to gravel; finer grains are silt, which can be cohesive)")
	out := fs.String("out", os.TempDir(), "directory for spillway-rating.png and spillway-rating.svg; empty: no plot")
	width := cli.FloatVar(fs, "width", 6, 2, 40, "in", "plot width")
	height := cli.FloatVar(fs, "height", 7, 2, 40, "in", "plot height (two panels)")
	dpi := cli.FloatVar(fs, "dpi", 150, 36, 1200, "dots per inch", "PNG resolution")
	if err := cli.ParseFlags(fs, w, args); err != nil {
		return nil, err
	}
	if *out != "" {
		if err := cli.Dir("out", *out); err != nil {
			return nil, err
		}
	}
	if *vs > *hs {
		return nil, &cli.Error{Program: "spillway", Msg: fmt.Sprintf("-vscale %g exceeds -hscale %g: a distorted model exaggerates the vertical, so its vertical scale must not be the larger", *vs, *hs)}
	}
	if *qp != 0 && *qp < minProtoQ {
		return nil, &cli.Error{Program: "spillway", Msg: fmt.Sprintf("-q %g: a prototype design discharge below %g m³/s is not a spillway's (its model flow would be too small to measure or to scale); give at least %g, or 0 for the model's design discharge carried at -scale", *qp, minProtoQ, minProtoQ)}
	}
	qText := fmt.Sprintf("%g", *qp)
	if *qp == 0 {
		*qp = modelDesignQ * math.Pow(*scale, 2.5)
		r4, _ := strconv.ParseFloat(strconv.FormatFloat(*qp, 'e', 3, 64), 64) // four figures
		qText = strconv.FormatFloat(r4, 'f', -1, 64)
	}
	s, err := similarity.Froude(similarity.Scales{Length: 1 / *scale, Density: 1})
	if err != nil {
		return nil, err
	}
	r := &Result{}
	ratio := func(d q.Dim) (similarity.Ratio, float64) {
		x, _ := s.DerivedRatio(d)
		return x, x.Value
	}
	fmt.Fprintf(w, "1:%g Froude model of an invented river-intake spillway\n", *scale)
	fmt.Fprintf(w, "the model is fixed (crest radius %g m, crest length %g m, its measured rating below); the prototype is the model × %g\n\n",
		modelCrestRadius, ratingCrest, *scale)
	fmt.Fprintln(w, "scale ratios, model/prototype:")
	for _, c := range []struct {
		name string
		d    q.Dim
	}{{"length", q.Length}, {"velocity", q.Velocity}, {"time", q.Time}, {"discharge", q.VolumeFlowRate},
		{"force", q.Force}, {"pressure", q.Pressure}, {"power", q.Power}} {
		x, _ := ratio(c.d)
		fmt.Fprintf(w, "  %-10s %-12s 1:%.5g\n", c.name, x.Law, 1/x.Value)
	}
	_, qr := ratio(q.VolumeFlowRate)
	_, r.VelocityRatio = ratio(q.Velocity)
	_, r.TimeRatio = ratio(q.Time)
	_, r.ForceRatio = ratio(q.Force)
	r.ModelDischarge = *qp * qr
	ls := units.MustParse("L/s")
	qm, _ := ls.ValueOf(q.New(r.ModelDischarge, q.VolumeFlowRate))
	fmt.Fprintf(w, "\ndesign discharge %s m³/s → model %s L/s\n", qText, cli.Sig(qm, 4))

	// The measured record: times and pressures carried to prototype.
	dt := 1.0 / 20
	times := make([]float64, len(record))
	pa := make([]float64, len(record))
	for i, v := range record {
		times[i] = float64(i) * dt
		pa[i] = v * 1000
	}
	if err := s.SeriesToPrototype(&r.ProtoTimes, q.NewSeries(times, q.Time)); err != nil {
		return nil, err
	}
	if err := s.SeriesToPrototype(&r.ProtoPressure, q.NewSeries(pa, q.Pressure)); err != nil {
		return nil, err
	}
	fmt.Fprintln(w, "\nchute-floor pressure record (invented), gauge pressures (relative to the local atmosphere), model → prototype:")
	fmt.Fprintf(w, "  %8s %10s   %8s %10s\n", "t_m s", "p_m kPa(g)", "t_p s", "p_p kPa(g)")
	for i := range record {
		fmt.Fprintf(w, "  %8.3f %10.2f   %8.3f %10.2f\n", times[i], record[i], r.ProtoTimes.At(i).Value(), r.ProtoPressure.At(i).Value()/1000)
	}
	n := r.ProtoTimes.Len()
	span := r.ProtoTimes.At(n-1).Value() - r.ProtoTimes.At(0).Value()
	fmt.Fprintf(w, "  prototype mean %.1f kPa(g), peak %.1f kPa(g): the highest of %d samples over %.1f s at prototype scale, NOT a design extreme:\n",
		r.ProtoPressure.Mean().Value()/1000, r.ProtoPressure.Max().Value()/1000, n, span)
	fmt.Fprintf(w, "  the record is far too short for an extreme, and the peak depends on the sampling rate (%g Hz in the model, %.3g Hz at\n", 1/dt, r.TimeRatio/dt)
	fmt.Fprintln(w, "  prototype scale) and on the transducer's response (bandwidth, tubing), which were not scaled")
	fmt.Fprintln(w, "  (gauge pressures scale by λ_L; the atmosphere does not, so absolute pressures, and cavitation margins, must not be scaled this way)")

	if r.Manning, err = hydraulic.ManningRatio(1 / *scale); err != nil {
		return nil, err
	}
	if r.ManningCheck, err = hydraulic.ModelManningCheck(q.New(*protoN, hydraulic.ManningDim), r.Manning); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "\nroughness: Manning n ratio λ_L^(1/6) = %.4f (a prototype n of %g s·m^(−1/3) needs a model n of %.3g)\n", r.Manning, *protoN, r.ManningCheck.Value)
	fmt.Fprintf(w, "  %v\n", r.ManningCheck)

	if r.Distorted, err = hydraulic.DistortedFroude(hydraulic.DistortedScales{Horizontal: 1 / *hs, Vertical: 1 / *vs}); err != nil {
		return nil, err
	}
	d := r.Distorted
	fmt.Fprintf(w, "\ndistorted variant for the approach reach: horizontal 1:%g, vertical 1:%g (exaggeration %.3g)\n", *hs, *vs, d.Distortion)
	if r.DistortionCheck, err = hydraulic.DistortionCheck(d); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  %v\n", r.DistortionCheck)
	fmt.Fprintf(w, "  velocity 1:%.5g, time 1:%.5g, discharge 1:%.5g, slope ×%.3g, Manning n ×%.3f\n",
		1/d.Velocity, 1/d.Time, 1/d.Discharge, d.Slope, d.Manning)
	fmt.Fprintf(w, "  design discharge in the distorted model: %s L/s\n", cli.Sig(*qp*d.Discharge*1000, 4))
	if math.IsNaN(d.Velocity) {
		return nil, fmt.Errorf("distorted ratios undefined")
	}
	if r.Sediment, err = hydraulic.SedimentFor(hydraulic.SedimentRatios{Horizontal: 1 / *hs, Vertical: 1 / *vs, RelativeDensity: 1, Viscosity: 1}); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  movable bed (Shields similarity, the same water): bed shear u*² ratio %.4g; with the prototype's bed material the grains\n", r.Sediment.Shear)
	fmt.Fprintf(w, "  must be %.3g times the prototype's size (a lighter material allows larger ones), and Re* is %.3g times the prototype's\n",
		r.Sediment.Grain, r.Sediment.ReStar)
	river, err := fluids.FreshWater().AtCelsius(modelWaterC)
	if err != nil {
		return nil, err
	}
	r.ProtoShearVelocity = math.Sqrt(9.80665 * reachDepth * reachSlope)
	r.ProtoReStar = r.ProtoShearVelocity * *d50 / 1000 / river.KinematicViscosity.Value()
	r.ModelGrain = *d50 / 1000 * r.Sediment.Grain
	if r.ReStarCheck, err = hydraulic.ParticleReynoldsCheck(r.ProtoReStar * r.Sediment.ReStar); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  prototype (invented reach: depth %g m, slope %g): u* = √(g·h·S) = %.4f m/s, d50 = %g mm (%s), Re* = u*·d/ν = %.3g\n",
		reachDepth, reachSlope, r.ProtoShearVelocity, *d50, hydraulic.GrainClass(*d50/1000), r.ProtoReStar)
	r.ModelGrainClass = hydraulic.GrainClass(r.ModelGrain)
	fmt.Fprintf(w, "  model grain size d50 = %s mm (%s, by the size classes of ISO 14688-1, from memory: sand 0.063–2 mm, gravel 2–63 mm,\n"+
		"  cobbles 63–200 mm, boulders above 200 mm)\n    %v\n", cli.Sig(r.ModelGrain*1000, 3), r.ModelGrainClass, r.ReStarCheck)
	if r.ModelGrainClass == "silt" || r.ModelGrainClass == "clay" {
		fmt.Fprintf(w, "    WARNING: a %s-sized grain can be cohesive, and Shields similarity does not hold for a cohesive bed (common practice: a coarser, lighter material)\n", r.ModelGrainClass)
	}

	// Scale effects at the crest: critical depth 2/3 of the head and the
	// critical velocity √(g·y_c), in the model's water.
	wat, err := fluids.FreshWater().AtCelsius(modelWaterC)
	if err != nil {
		return nil, err
	}
	sigma, err := fluids.SurfaceTension(wat.Temperature)
	if err != nil {
		return nil, err
	}
	rating, err := fitWeir(*scale, wat.KinematicViscosity, wat.Density, sigma)
	if err != nil {
		return nil, err
	}
	lim := hydraulic.WeirLimits()
	fmt.Fprintf(w, "\nscale-effect checks at the crest, model water %g °C (each limit with its basis):\n", modelWaterC)
	fmt.Fprintln(w, "  h is the head over the crest (upstream water level above crest level), taken from the model's measured rating below;")
	fmt.Fprintf(w, "  V = (g·q)^(1/3) is the critical velocity for the unit discharge q = Q/b over the model crest (b = %g m), at the critical\n", ratingCrest)
	fmt.Fprintln(w, "  depth y_c = V²/g; Re = V·h/ν and We = ρV²h/σ are both formed with this V and the length h")
	rc, err := hydraulic.CrestRadiusCheck(q.New(modelCrestRadius, q.Length), lim)
	if err != nil {
		return nil, err
	}
	r.CrestRadius = rc
	fmt.Fprintf(w, "  crest: model radius %g m, the prototype's %s m at 1:%g\n    %v\n", modelCrestRadius, cli.Sig(modelCrestRadius**scale, 3), *scale, rc)
	for _, c := range []struct {
		name  string
		share float64
	}{{"design discharge", 1}, {"low flow, a tenth of it", lowFlowShare}} {
		qm := r.ModelDischarge * c.share
		h, src := crestHead(rating, qm)
		v := criticalVelocity(qm)
		cs, err := hydraulic.FreeSurfaceChecks(q.New(v, q.Velocity), q.New(h, q.Length), wat.KinematicViscosity, wat.Density, sigma, lim)
		if err != nil {
			return nil, err
		}
		r.Checks = append(r.Checks, cs)
		r.CrestHeads, r.CrestVelocities = append(r.CrestHeads, h), append(r.CrestVelocities, v)
		fmt.Fprintf(w, "  %s: model Q = %s L/s, q = %s m²/s, critical velocity V = %s m/s, y_c = %s m\n", c.name, cli.Sig(qm*1000, 4), sig3(qm/ratingCrest), cli.Sig(v, 4), sig3(v*v/9.80665))
		fmt.Fprintf(w, "    model head h = %s m: %s\n", sig3(h), src)
		for _, ck := range cs {
			fmt.Fprintf(w, "    %v\n", ck)
		}
	}
	if err := rateWeir(w, r, rating, *scale, *out, *width, *height, *dpi); err != nil {
		return nil, err
	}
	fmt.Fprintln(w, "\nCAUTION:", hydraulic.StructureCaution)
	return r, nil
}
