// Command pumpscale carries an invented model-pump test curve to a
// larger prototype at another speed by the affinity laws, with the
// efficiency stepped up by Moody's efficiency step-up formula (1925:
// η_p = 1 − (1 − η_m)(D_m/D_p)^n; not his friction diagram) at the
// best-efficiency point and that gain added along the curve (common
// practice), and prints the curve in US customary units (gpm, ft, shaft
// hp) and in SI; then it compares the step-up with IEC 60193's and
// Ackeret's, gives the specific speed in its three conventions, and
// carries the model's NPSH3 to the prototype at its own water
// temperature through the Thoma number, with the uncertainty budget of
// the NPSH3 found from the suction readings.
//
// The pump family and the test curve are invented.
//
// Usage:
//
//	go run ./examples/pumpscale [-nm 1750] [-dm 10] [-np 1180] [-dp 24] [-flange 0] [-moody 0.2]
//
// A bad flag value exits with status 2, naming the flag.
package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"

	"similis.dev/similis/examples/internal/cli"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/turbo"
	"similis.dev/similis/units"
)

func main() { cli.Main("pumpscale", run) }

// about is the head of the -h text: what the program does and what its
// output means.
const about = `Usage: pumpscale [flags]

Carries an invented model-pump test curve to a geometrically similar,
larger prototype at another speed by the affinity laws. The invented test
was taken on one model, a 10 in impeller at 1750 rpm (the tested model,
the defaults of -dm and -nm). Another -dm or -nm describes a model of the
same family that was not tested: its curve is the test carried to it by
the affinity laws (Q ∝ n·D³, H ∝ n²·D², P ∝ n³·D⁵ at equal efficiency)
and its efficiency the tested one carried by Moody's efficiency formula
from 10 in to -dm (a step-down for a smaller model; a change of speed
alone leaves it unchanged), an estimate printed as such. The prototype's
curve, its specific speed and its NPSH3 come from the test and so do not
depend on -dm and -nm; the model's columns and its Reynolds number (for
the step-up comparison) do.

It prints: the model/prototype ratios of flow (N·D³) and head (N²·D²); a
table of each test point, model and prototype, in US customary units
(gpm, ft, shaft horsepower of 550 ft·lbf/s) and in SI (L/s, m, kW), every
column to 4 significant figures, where power is shaft power ρgQH/η with
each machine's own efficiency, the prototype's stepped up by Moody's
efficiency formula (1925, the diameter step-up, not the friction diagram)
at the best-efficiency point with that gain added at every point; that
step-up compared with IEC 60193's and Ackeret's (a refusal printed as
a note); the specific speed in its three conventions; the prototype's
NPSH3 from the tested model's through the Thoma number, and the absolute pressure at its suction flange for it, with the
flange velocity Q/(π·d²/4) at the best-efficiency flow (the bore d from
-flange, by default geometrically similar to the tested model's 6 in
suction pipe, 6 in × -dp/10 in); and the NPSH3 uncertainty budget, from the
tested model's suction readings.

The prototype must be at least the model's size (-dp ≥ -dm) with n·D² at
least the model's (-np·-dp² ≥ -nm·-dm²): the efficiency step-ups hold
from a model to a larger machine at a higher Reynolds number. A flag
outside that, an impeller tip speed above 150 m/s, or a -flange bore so
small that no positive pressure at the flange gives the NPSH3, exits with
status 2.

Then it analyses the acceptance test of a pump as built (a separate
invented pump specified at 1480 rpm, with invented shop-test readings) to
ISO 9906:2012: each test point reduced to the specified speed by the
affinity laws; the Q–H, Q–P and Q–η curves fitted by least squares with
their order and 95 % intervals; for every acceptance grade (1U, 1E, 1B,
2B, 2U, 3B) its tolerance factors t_Q, t_H, t_P, t_η (Table 8, from
memory) and whether the fitted Q–H curve meets the tolerance cross through
the guarantee point and the efficiency and power, read where the line
through the origin and the guarantee point meets the Q–H curve, are
within tolerance; the verdict for the grade agreed (-grade), provisional
until the factors are checked against ISO 9906:2012 Table 8 and the
contract; NPSH3 from a
suction series by the 3 % head drop on a monotone fairing, with its
standard uncertainty; and a plot of the Q–H and Q–η curves
(pumpscale-acceptance.png and .svg in -out).

All data are invented; the output ends with the caution that governs any
use of it.

Flags:
`

// maxTipSpeed bounds the impeller peripheral speed πDn of model and
// prototype, m/s: a pair of flags beyond it describes no pump.
const maxTipSpeed = 150.0

// point is one invented model test point, as the rig's sheet gives it.
type point struct{ flow, head, eff string }

// The tested model: the invented curve and suction test were taken on a
// 10 in impeller at 1750 rpm in water at 20 °C.
const (
	testDiaIn = 10.0   // in
	testRPM   = 1750.0 // rpm
)

// Invented model curve of the tested model (testDiaIn at testRPM).
var curve = []point{
	{"200 gpm", "118 ft", "52 %"}, {"400 gpm", "114 ft", "71 %"}, {"600 gpm", "107 ft", "80 %"},
	{"800 gpm", "96 ft", "83.5 %"}, {"1000 gpm", "81 ft", "81 %"}, {"1200 gpm", "61 ft", "72 %"},
}

// Row is one carried point, in SI, for the test.
type Row struct {
	ModelQ, ModelH, ModelP, ModelEta q.Quantity
	ProtoQ, ProtoH, ProtoP           q.Quantity
	ProtoEta                         float64
}

func run(w io.Writer, args []string) error { _, err := evaluate(w, args); return err }

func evaluate(w io.Writer, args []string) ([]Row, error) {
	rows, _, err := evaluateAll(w, args)
	return rows, err
}

// evaluateAll carries the curve and the suction performance.
func evaluateAll(w io.Writer, args []string) ([]Row, Suction, error) {
	r, err := evaluateReport(w, args)
	return r.Rows, r.Suction, err
}

// Report is everything the program computes, for the tests.
type Report struct {
	Rows       []Row
	Suction    Suction
	Acceptance Acceptance
}

// evaluateReport carries the curve and the suction performance and
// analyses the acceptance test.
func evaluateReport(w io.Writer, args []string) (Report, error) {
	fs := cli.NewFlagSet("pumpscale", about)
	nm := cli.FloatVar(fs, "nm", testRPM, 100, 10000, "rpm", "model speed; the test was taken at 1750 rpm, another speed carries it by the affinity laws")
	dm := cli.FloatVar(fs, "dm", testDiaIn, 2, 60, "in", "model impeller diameter; the test was taken on a 10 in impeller, another size carries it by the affinity laws and Moody's efficiency formula")
	np := cli.FloatVar(fs, "np", 1180, 50, 10000, "rpm", "prototype speed")
	dp := cli.FloatVar(fs, "dp", 24, 2, 240, "in", "prototype impeller diameter; at least -dm, with -np·-dp² at least -nm·-dm² (the efficiency is stepped up from model to prototype)")
	flange := cli.FloatVar(fs, "flange", 0, 0, 400, "in", "prototype suction-flange bore, for the flange velocity V = Q/(π·d²/4) at the BEP; 0: geometrically similar to the tested model's 6 in suction pipe, 6·-dp/10")
	moody := cli.FloatVar(fs, "moody", 0.2, 0.1, 0.3, "", "exponent n of Moody's efficiency step-up, η_p = 1 − (1 − η_m)(D_m/D_p)^n (1/5 or 1/4 in use, common practice)")
	grade := fs.String("grade", "1B", "acceptance grade agreed for the pump as built: 1U, 1E, 1B, 2B, 2U or 3B")
	out := fs.String("out", os.TempDir(), "directory for pumpscale-acceptance.png and .svg; empty for no plot")
	width := cli.FloatVar(fs, "width", 6, 2, 40, "in", "plot width")
	height := cli.FloatVar(fs, "height", 7, 2, 40, "in", "plot height")
	dpi := cli.FloatVar(fs, "dpi", 150, 36, 1200, "dots per inch", "PNG resolution")
	if err := cli.ParseFlags(fs, w, args); err != nil {
		return Report{}, err
	}
	agreed, ok := parseGrade(*grade)
	if !ok {
		return Report{}, &cli.Error{Program: "pumpscale", Msg: fmt.Sprintf("-grade %s: want one of ISO 9906's grades 1U, 1E, 1B, 2B, 2U, 3B", cli.Quote(*grade))}
	}
	if *out != "" {
		if err := cli.Dir("out", *out); err != nil {
			return Report{}, err
		}
	}
	// The efficiency step-ups hold from a model to a larger machine at a
	// higher Reynolds number: n·D² at least the model's (the prototype's
	// warmer water only raises its Re further).
	if *dp < *dm || *np**dp**dp < *nm**dm**dm {
		return Report{}, &cli.Error{Program: "pumpscale", Msg: fmt.Sprintf(
			"-dp %g in at -np %g rpm against -dm %g in at -nm %g rpm: the prototype must be at least the model's size and its n·D² at least the model's, since the efficiency is stepped up from model to prototype",
			*dp, *np, *dm, *nm)}
	}
	for _, m := range []struct {
		d, n   float64
		df, nf string
	}{{*dm, *nm, "-dm", "-nm"}, {*dp, *np, "-dp", "-np"}} {
		if u := math.Pi * m.d * 0.0254 * m.n / 60; u > maxTipSpeed {
			return Report{}, &cli.Error{Program: "pumpscale", Msg: fmt.Sprintf(
				"%s %g in at %s %g rpm: an impeller tip speed of %.0f m/s, above the %g m/s this program accepts (centrifugal pump impellers run well below it; from memory)",
				m.df, m.d, m.nf, m.n, u, maxTipSpeed)}
		}
	}
	// Each machine's power at its own water's density: the model loop's
	// at 20 °C, the prototype's service water at 30 °C (the same states
	// its Reynolds number and suction pressure use).
	mw, err := fluids.FreshWater().AtCelsius(modelWaterC)
	if err != nil {
		return Report{}, err
	}
	pw, err := fluids.FreshWater().AtCelsius(protoWaterC)
	if err != nil {
		return Report{}, err
	}
	// Ratios are model/prototype, as everywhere in similis; the density
	// ratio is the two waters'.
	aff, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: *nm / *np, Diameter: *dm / *dp, Density: mw.Density.Value() / pw.Density.Value()})
	if err != nil {
		return Report{}, err
	}
	in := units.MustParse("in")
	dTest, dModel, dProto := in.Of(testDiaIn), in.Of(*dm), in.Of(*dp)
	g := units.StandardGravity()
	gpm, ft, hp := units.MustParse("gpm"), units.MustParse("ft"), units.MustParse("hp")
	ls, m, kw := units.MustParse("L/s"), units.MustParse("m"), units.MustParse("kW")
	// The tested model's readings.
	tq, th := make([]q.Quantity, len(curve)), make([]q.Quantity, len(curve))
	etaTest := make([]float64, len(curve))
	for i, c := range curve {
		Q, err := units.ParseQuantity(c.flow)
		if err != nil {
			return Report{}, fmt.Errorf("point %d: %w", i, err)
		}
		H, err := units.ParseQuantity(c.head)
		if err != nil {
			return Report{}, fmt.Errorf("point %d: %w", i, err)
		}
		eta, err := units.ParseQuantity(c.eff)
		if err != nil || !eta.IsDimensionless() {
			return Report{}, fmt.Errorf("point %d: efficiency %q: %v", i, c.eff, err)
		}
		tq[i], th[i], etaTest[i] = Q, H, eta.Value()
	}
	// The model -dm and -nm describe: the test carried to it by the
	// affinity laws (ratios tested/model, the same water), its efficiency
	// by Moody's efficiency formula from the tested size with the gain at the
	// best-efficiency point added along the curve (a step-down for a
	// smaller model). Moody's efficiency formula carried on to the prototype then
	// gives the prototype what it would from the tested model itself:
	// (1 − η)(D_t/D_m)^n(D_m/D_p)^n = (1 − η)(D_t/D_p)^n.
	toModel, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: testRPM / *nm, Diameter: testDiaIn / *dm, Density: 1})
	if err != nil {
		return Report{}, err
	}
	etas := etaTest
	var down turbo.StepUp
	if *dm != testDiaIn {
		if down, err = turbo.MoodyCurve(etaTest, turbo.Diameters{Model: dTest, Prototype: dModel}, turbo.MoodyStepUpOptions{Exponent: *moody}, turbo.StepUpAtBEP); err != nil {
			return Report{}, err
		}
		etas = down.Efficiency
	}
	// Efficiencies first: the step-up is taken at the best-efficiency
	// point and its gain applied along the curve.
	step, err := turbo.MoodyCurve(etas, turbo.Diameters{Model: dModel, Prototype: dProto}, turbo.MoodyStepUpOptions{Exponent: *moody}, turbo.StepUpAtBEP)
	if err != nil {
		return Report{}, err
	}
	flangeIn := *flange
	if flangeIn == 0 {
		flangeIn = suctionPipeD / 0.0254 * *dp / testDiaIn
	}
	if err := flangeHolds(curve[step.BEP].flow, toModel.Flow*aff.Flow, toModel.Head*aff.Head, flangeIn); err != nil {
		return Report{}, err
	}
	carried := *dm != testDiaIn || *nm != testRPM
	fmt.Fprintln(w, "Pump-family scale-up by the affinity laws (invented model curve)")
	if carried {
		fmt.Fprintf(w, "the invented test was taken on a %g in impeller at %g rpm (the tested model); the model here, %g in at %g rpm, was not tested:\n", testDiaIn, testRPM, *dm, *nm)
		fmt.Fprintf(w, "  its curve is the test carried by the affinity laws (flow × %.4g = (n_m/n_t)·(D_m/D_t)³, head × %.4g = (n_m/n_t)²·(D_m/D_t)²)\n", 1/toModel.Flow, 1/toModel.Head)
		if *dm != testDiaIn {
			fmt.Fprintf(w, "  and its efficiency the test's carried by Moody's efficiency formula from %g in to %g in (%+.2f points at every point, an estimate);\n", testDiaIn, *dm, 100*down.Gain)
		} else {
			fmt.Fprintln(w, "  and its efficiency the test's (Moody's efficiency formula depends on size only);")
		}
		fmt.Fprintln(w, "  the prototype's curve, specific speed and NPSH3 come from the test and are those the tested model gives")
		switch {
		case *dp < testDiaIn:
			fmt.Fprintf(w, "  NOTE: the prototype (%g in) is smaller than the tested model: its efficiency is the test's stepped down,\n"+
				"  outside what the step-up formulas rest on (a larger machine at a higher Reynolds number)\n", *dp)
		case *np**dp**dp < testRPM*testDiaIn*testDiaIn:
			fmt.Fprintf(w, "  NOTE: the prototype (%g in at %g rpm) runs at a lower n·D² than the tested model, so at a lower Reynolds number:\n"+
				"  Moody's efficiency formula, by diameter alone, still steps it up, outside what the step-ups rest on\n", *dp, *np)
		}
	} else {
		fmt.Fprintf(w, "the invented test was taken on this model (%g in at %g rpm); another -dm or -nm carries it by the affinity laws\n", testDiaIn, testRPM)
	}
	fmt.Fprintf(w, "model %g in impeller at %g rpm → prototype %g in at %g rpm\n", *dm, *nm, *dp, *np)
	fmt.Fprintf(w, "ratios model/prototype: flow %.4g (N·D³), head %.4g (N²·D²); the prototype's flow and head are the model's divided by them\n", aff.Flow, aff.Head)
	fmt.Fprintf(w, "power columns: shaft power ρgQH/η, each machine at its own efficiency, the prototype's stepped up (hp = 550 ft·lbf/s),\n")
	fmt.Fprintf(w, "  and in its own water: model ρ = %.2f kg/m³ (%g °C), prototype ρ = %.2f kg/m³ (%g °C);\n", mw.Density.Value(), modelWaterC, pw.Density.Value(), protoWaterC)
	fmt.Fprintf(w, "  the affinity power ratio %.4g (ρ·N³·D⁵) holds only at equal efficiencies, so the prototype's power is not the model's divided by it\n", aff.Power)
	fmt.Fprintln(w, "  (every column to 4 significant figures, whole numbers unrounded)")
	var rows []Row
	fmt.Fprintf(w, "\n%-34s | %-35s | %s\n", "model (US customary)", "prototype (US customary)", "prototype (SI)")
	fmt.Fprintf(w, "%8s %8s %9s %6s | %9s %8s %9s %6s | %9s %8s %9s\n", "Q gpm", "H ft", "P hp", "η", "Q gpm", "H ft", "P hp", "η", "Q L/s", "H m", "P kW")
	for i := range curve {
		Q := tq[i].Scale(1 / toModel.Flow)
		H := th[i].Scale(1 / toModel.Head)
		eta := q.Scalar(etas[i])
		// Shaft power from the hydraulic power and the efficiency.
		P := mw.Density.Mul(g).Mul(Q).Mul(H).Div(eta)
		r := Row{ModelQ: Q, ModelH: H, ModelP: P, ModelEta: eta}
		r.ProtoQ = Q.Scale(1 / aff.Flow)
		r.ProtoH = H.Scale(1 / aff.Head)
		r.ProtoEta = step.Efficiency[i]
		r.ProtoP = pw.Density.Mul(g).Mul(r.ProtoQ).Mul(r.ProtoH).Scale(1 / r.ProtoEta)
		rows = append(rows, r)
		v := func(u units.Unit, x q.Quantity) string { f, _ := u.ValueOf(x); return cli.Sig(f, 4) }
		fmt.Fprintf(w, "%8s %8s %9s %5.1f%% | %9s %8s %9s %5.1f%% | %9s %8s %9s\n",
			v(gpm, Q), v(ft, H), v(hp, P), 100*eta.Value(),
			v(gpm, r.ProtoQ), v(ft, r.ProtoH), v(hp, r.ProtoP), 100*r.ProtoEta,
			v(ls, r.ProtoQ), v(m, r.ProtoH), v(kw, r.ProtoP))
	}
	fmt.Fprintf(w, "\nefficiency stepped up by Moody's efficiency formula (1925), η_p = 1 − (1 − η_m)(D_m/D_p)^%g, at the best-efficiency point\n", *moody)
	fmt.Fprintf(w, "(%.1f %% → %.1f %%), and its gain of %.2f points added at every point (common practice, as IEC 60193 does);\n",
		100*etas[step.BEP], 100*(etas[step.BEP]+step.Gain), 100*step.Gain)
	fmt.Fprintln(w, "power from ρgQH/η_p")
	suc, err := suction(w, step, etas, rows, tq[step.BEP], th[step.BEP], *nm, *np, *moody, dModel, dProto, flangeIn, *flange == 0)
	if err != nil {
		return Report{}, err
	}
	acc, err := acceptance(w, agreed, *out, *width, *height, *dpi)
	if err != nil {
		return Report{}, err
	}
	fmt.Fprintln(w, "\nCAUTION:", turbo.PumpCaution)
	return Report{Rows: rows, Suction: suc, Acceptance: acc}, nil
}

// Invented suction test of the tested model at its best-efficiency point: the
// NPSH at 3 % head drop, and the water temperatures of the model loop and
// of the prototype's service.
const (
	modelNPSH3  = 12.0 // ft
	modelWaterC = 20.0 // °C
	protoWaterC = 30.0 // °C
)

// flangeHolds returns a usage error naming -flange when the prototype's
// flange velocity V = Q/(π·d²/4) at the best-efficiency flow leaves no
// positive absolute pressure at the flange for NPSH3: V²/(2g) must stay
// below NPSH3 = σ·H_p (p_v only adds to it), with the smallest bore that
// keeps it so. flowRatio and headRatio are the tested model's over the
// prototype's.
func flangeHolds(bepFlow string, flowRatio, headRatio, flangeIn float64) error {
	qm, err := units.ParseQuantity(bepFlow)
	if err != nil {
		return err
	}
	qp := qm.Value() / flowRatio
	npsh := modelNPSH3 * 0.3048 / headRatio // σ·H_p = NPSH3_t·H_p/H_t
	d := flangeIn * 0.0254
	v := qp / (math.Pi / 4 * d * d)
	vmax := math.Sqrt(2 * 9.80665 * npsh)
	if v < vmax {
		return nil
	}
	dmin := math.Sqrt(4*qp/(math.Pi*vmax)) / 0.0254
	return &cli.Error{Program: "pumpscale", Msg: fmt.Sprintf(
		"-flange %g in: V = Q/(π·d²/4) = %s m/s at the BEP flow %s L/s leaves no positive flange pressure (V²/2g must stay below NPSH3 = %s m): give -flange above %.1f in (0: similar to the model's)",
		flangeIn, cli.Sig(v, 3), cli.Sig(qp*1e3, 4), cli.Sig(npsh, 3), math.Ceil(dmin*10)/10)}
}

// Suction is the cavitation scaling, for the test.
type Suction struct {
	Sigma        float64
	ProtoNPSH3   q.Quantity
	ProtoSuction q.Quantity // absolute pressure needed at the flange
	// FlangeBore is the prototype's suction-flange bore (m) and
	// FlangeVelocity the mean velocity Q/(π·d²/4) there at the BEP (m/s).
	FlangeBore, FlangeVelocity float64
	ReModel, ReProto           float64
	IEC, IECGain, Ackeret      float64
	// IECRefused and AckeretRefused say why a comparison was not made
	// (a Reynolds number outside the formula's range); empty when it was.
	IECRefused, AckeretRefused string
	SpecificSpeed              turbo.SpecificSpeeds
	NPSH                       NPSHBudget
}

// suction compares the step-up methods at the best-efficiency point and
// carries the tested model's NPSH3 (at its best-efficiency flow testQ and
// head testH) to the prototype at its own water temperature through the
// Thoma number.
func suction(w io.Writer, step turbo.StepUp, etas []float64, rows []Row, testQ, testH q.Quantity, nm, np, moody float64, dModel, dProto q.Quantity, flangeIn float64, similar bool) (Suction, error) {
	var s Suction
	bep := rows[step.BEP]
	rpm := units.MustParse("rpm")
	var err error
	if s.SpecificSpeed, err = turbo.SpecificSpeedOf(rpm.Of(nm), bep.ModelQ, bep.ModelH); err != nil {
		return Suction{}, err
	}
	// Machine Reynolds numbers Re = D·u/ν, u = πDn the peripheral speed
	// at the impeller's outlet diameter.
	mw, err := fluids.FreshWater().AtCelsius(modelWaterC)
	if err != nil {
		return Suction{}, err
	}
	pw, err := fluids.FreshWater().AtCelsius(protoWaterC)
	if err != nil {
		return Suction{}, err
	}
	re := func(d q.Quantity, n float64, st fluids.State) float64 {
		u := math.Pi * d.Value() * n / 60
		return d.Value() * u / st.KinematicViscosity.Value()
	}
	s.ReModel, s.ReProto = re(dModel, nm, mw), re(dProto, np, pw)
	// A comparison the formulas refuse (a model Reynolds number below
	// their range) is reported, not fatal: Moody's step-up stands alone.
	if s.IEC, s.IECGain, err = turbo.IECStepUp(etas[step.BEP], turbo.ReynoldsNumbers{Model: s.ReModel, Prototype: s.ReProto}); err != nil {
		s.IECRefused = refusal("IEC 60193", s.ReModel, s.ReProto, turbo.IECMinReynolds, err)
	}
	if s.Ackeret, err = turbo.AckeretStepUp(etas[step.BEP], turbo.ReynoldsNumbers{Model: s.ReModel, Prototype: s.ReProto}); err != nil {
		s.AckeretRefused = refusal("Ackeret's", s.ReModel, s.ReProto, 0, err)
	}
	ft := units.MustParse("ft")
	if s.Sigma, err = turbo.Thoma(turbo.Heads{NPSH: ft.Of(modelNPSH3), Head: testH}); err != nil {
		return Suction{}, err
	}
	s.ProtoNPSH3 = bep.ProtoH.Scale(s.Sigma)
	pv, err := fluids.VapourPressure(q.New(protoWaterC+273.15, q.Temperature))
	if err != nil {
		return Suction{}, err
	}
	s.FlangeBore = flangeIn * 0.0254
	s.FlangeVelocity = bep.ProtoQ.Value() / (math.Pi / 4 * s.FlangeBore * s.FlangeBore)
	if s.ProtoSuction, err = turbo.SuctionPressureFor(s.Sigma, bep.ProtoH, pv, pw.Density, q.New(s.FlangeVelocity, q.Velocity), q.Quantity{}); err != nil {
		return Suction{}, err
	}
	fmt.Fprintf(w, "\nAt the best-efficiency point: specific speed N_s = %.0f (rpm, gpm, ft) = n_q %.1f (rpm, m³/s, m);\n"+
		"  dimensionless specific speed Ω_s = ωQ^½/(gH)^¾ = %.3f with ω in rad/s\n",
		s.SpecificSpeed.US, s.SpecificSpeed.Metric, s.SpecificSpeed.Dimensionless)
	fmt.Fprintf(w, "step-up compared, Re = D·u/ν with u = πDn (n in rev/s): model %s (%g °C), prototype %s (%g °C):\n", times10(s.ReModel), modelWaterC, times10(s.ReProto), protoWaterC)
	iec := fmt.Sprintf("IEC 60193 scalable losses %.1f %% (Δη %.2f points, an indication: see below)", 100*s.IEC, 100*s.IECGain)
	if s.IECRefused != "" {
		iec = "IEC 60193 not applied"
	}
	ack := fmt.Sprintf("Ackeret %.1f %%", 100*s.Ackeret)
	if s.AckeretRefused != "" {
		ack = "Ackeret not applied"
	}
	fmt.Fprintf(w, "  Moody's step-up (D^%g) %.1f %%; %s; %s\n", moody, 100*(etas[step.BEP]+step.Gain), iec, ack)
	if s.IECRefused == "" {
		fmt.Fprintf(w, "  IEC 60193's scalable-loss formula with Re_ref = %g×10⁶ and V_ref = %.2f (the scalable share of the losses at Re_ref, from memory),\n", turbo.IECReferenceReynolds/1e6, turbo.IECScalableLoss)
		fmt.Fprintln(w, "  taking the hydraulic efficiency η_h equal to this pump's overall η: the formula's scope is the hydraulic efficiency of turbines,")
		fmt.Fprintln(w, "  storage pumps and pump-turbines (from memory), so for this pump it is an indication only")
	}
	for _, r := range []string{s.IECRefused, s.AckeretRefused} {
		if r != "" {
			fmt.Fprintf(w, "  %s\n", r)
		}
	}
	fmt.Fprintf(w, "cavitation (invented NPSH3 of the tested model = %.1f ft at its BEP, H = %s ft): Thoma σ = NPSH3/H = %.4f held at the prototype:\n",
		modelNPSH3, cli.Sig(testH.Value()/0.3048, 3), s.Sigma)
	bore := "-flange"
	if similar {
		bore = fmt.Sprintf("geometrically similar to the tested model's 6 in suction pipe: 6 in × D_p/%g in; -flange gives another", testDiaIn)
	}
	fmt.Fprintf(w, "  prototype NPSH3 = σ·H_p = %s ft (%s m); at %g °C (p_v = %.0f Pa, IAPWS-IF97) and V = Q/(π·d²/4) = %s m/s at the flange\n"+
		"  (Q = %s L/s at the BEP, suction-flange bore d = %s in, %s)\n",
		cli.Sig(s.ProtoNPSH3.Value()/0.3048, 3), cli.Sig(s.ProtoNPSH3.Value(), 3), protoWaterC, pv.Value(), cli.Sig(s.FlangeVelocity, 3),
		cli.Sig(bep.ProtoQ.Value()*1e3, 4), cli.Sig(flangeIn, 3), bore)
	fmt.Fprintf(w, "  at %s kPa absolute at the flange the prototype runs at NPSH3 (3 %% head drop); the available NPSH must exceed it\n",
		cli.Sig(s.ProtoSuction.Value()/1e3, 3))
	fmt.Fprintln(w, "  by the margin the applicable standard or the purchaser requires")
	if s.NPSH, err = npshBudget(w, testQ, testH.Value()/bep.ProtoH.Value()); err != nil {
		return Suction{}, err
	}
	return s, nil
}

// refusal is the note printed when a step-up formula refuses the
// Reynolds numbers reM (model) and reP (prototype): the bound it fails,
// in plain words, with the figures to three significant digits. min is
// the formula's lower bound on Re_M (0 for none).
func refusal(formula string, reM, reP, min float64, err error) string {
	switch {
	case reM < min:
		return fmt.Sprintf("(%s step-up not applied: Re_M = %s, below %s)", formula, times10(reM), times10(min))
	case reP < reM:
		return fmt.Sprintf("(%s step-up not applied: Re_P = %s, below Re_M = %s; the formula steps up only)", formula, times10(reP), times10(reM))
	}
	var te *turbo.Error
	if errors.As(err, &te) {
		return fmt.Sprintf("(%s step-up not applied: %s)", formula, te.Message())
	}
	return fmt.Sprintf("(%s step-up not applied: %v)", formula, err)
}

// times10 writes x to three significant digits as a decimal times a
// power of ten, 1.35×10⁴ (10⁵ for a power of ten itself).
func times10(x float64) string {
	if x <= 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return cli.Sig(x, 3)
	}
	e := int(math.Floor(math.Log10(x)))
	m := x / math.Pow10(e)
	if m >= 9.995 { // rounds to 10.0
		m, e = m/10, e+1
	}
	exp := cli.Superscript(e)
	if math.Abs(m-1) < 5e-4 {
		return "10" + exp
	}
	return fmt.Sprintf("%.3g×10%s", m, exp)
}
