// Command towingtank does a towing tank's whole job for a 1:16 model of a
// coastal research catamaran: it carries the resistance test to full
// scale by the ITTC-1957 method, without and with a form factor found by
// Prohaska's method, with the uncertainty budget of the top speed; shows
// the tank's mean-flow blockage correction of every run; finds the form
// factor again from a double-body test and compares the two;
// reduces the open-water test of the model propeller and fairs K_T and
// K_Q; fairs the resistance curve; analyses the self-propulsion test by
// thrust identity; and predicts the ship's speed–power curve by the
// ITTC-1978 method with the band the fits put about it, with plots of the
// resistance coefficients against the friction lines and of the
// open-water curves.
//
// The vessel and every measurement are invented for the demonstration.
// The model and its propeller are fixed; -scale changes the ship, and
// the self-propulsion readings are made for its self-propulsion point.
// The readings were recorded at 15 °C; -tank re-makes them for another
// tank temperature, each run keeping its wave-making part (readingsAt).
//
// Usage:
//
//	go run ./examples/towingtank [-scale 16] [-tank 15] [-sea 15] [-ca 0.0004] [-maxfn 0.2] [-width 4.5] [-depth 2.2]
//	    [-out DIR] [-plotw 7] [-ploth 4.5] [-dpi 96]
//
// Exit status 2 for a usage error (a flag named with what was wrong), 1
// for a failure of the job itself.
package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"similis.dev/similis/examples/internal/cli"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
	"similis.dev/similis/units"
)

func main() { cli.Main("towingtank", run) }

// Invented model data: a 2.0 m catamaran model (both demi-hulls), wetted
// surface 1.62 m², towed at eight speeds.
var (
	modelLength = 2.0                                                               // m, waterline
	modelArea   = 1.62                                                              // m², wetted, both hulls
	speeds      = []float64{0.50, 0.65, 0.80, 1.00, 1.30, 1.60, 2.00, 2.40}         // m/s
	resistances = []float64{1.105, 1.778, 2.600, 4.055, 7.270, 12.14, 22.30, 38.10} // N
	// modelSection is the largest underwater cross-section of the two
	// demi-hulls together, for the tank's blockage.
	modelSection = 0.030 // m²
)

// Outcome holds the two extrapolations and the top-speed budget, for the
// test.
type Outcome struct {
	Plain, WithForm *ship.HullResult
	Form            ship.ProhaskaResult
	Budget          Budgets
	Powering        *Powering
	// Blockage is the tank's mean-flow correction of every run, and
	// Blocked the extrapolation with the form factor on the corrected
	// speeds.
	Blockage []ship.BlockageCorrection
	Blocked  *ship.HullResult
	// Choked marks the runs at or above the choking speed, which have no
	// correction (their Blockage holds Fh and the choking speed only) and
	// no row in Blocked, which holds the other runs in order.
	Choked []bool
	// DoubleBody is the double-body form factor; MethodDiff its
	// difference from Prohaska's when that is flagged (else zero).
	DoubleBody ship.DoubleBodyResult
	MethodDiff float64
	// Readings are the invented tests' readings made for the tank
	// temperature (readingsAt).
	Readings readings
}

// Budgets are the uncertainty budgets of the top-speed run at full scale.
type Budgets struct {
	Run               ship.HullRun
	Result            ship.HullRunResult
	Resistance, Power uncertain.Budget
}

// topBudget carries the top-speed run to full scale with the invented
// uncertainties of its measurements.
// methodDiff, when not zero, is the difference between the double-body
// and the Prohaska form factors, added as a source: rectangular, with
// half-width |Δ| about the Prohaska value, so that the other method's
// value lies at its edge.
func topBudget(scale, tankT, seaT, ca float64, form ship.ProhaskaResult, methodDiff float64, rd readings) (Budgets, error) {
	set := uncertain.NewSet()
	src := func(s uncertain.Source) uncertain.ID { return set.MustAdd(s) }
	sys, rnd := uncertain.Systematic, uncertain.Random
	speed := src(uncertain.Source{Name: "carriage speed", U: q.Scalar(0.001), Relative: true, Dist: uncertain.Rectangular, Effect: sys})
	dyn := src(uncertain.Source{Name: "dynamometer calibration", U: q.New(0.05, q.Force), Effect: sys})
	rep := src(uncertain.Source{Name: "resistance repeatability", U: q.New(0.06, q.Force), Type: uncertain.TypeA, DoF: 4, Effect: rnd})
	therm := src(uncertain.Source{Name: "tank thermometer", U: q.New(0.2, q.Temperature), Effect: sys})
	area := src(uncertain.Source{Name: "wetted area", U: q.Scalar(0.005), Relative: true, Effect: sys})
	length := src(uncertain.Source{Name: "model length", U: q.New(0.001, q.Length), Effect: sys})
	k := src(uncertain.Source{Name: "form factor (Prohaska fit)", U: q.Scalar(form.FormFactorStdErr), Type: uncertain.TypeA, DoF: float64(form.Points - 2), Effect: sys})
	kIDs := []uncertain.ID{k}
	if methodDiff != 0 {
		kIDs = append(kIDs, src(uncertain.Source{Name: "form factor method (double body vs Prohaska)", U: q.Scalar(math.Abs(methodDiff) / math.Sqrt(3)), Dist: uncertain.Rectangular, Effect: sys}))
	}
	last := len(speeds) - 1
	run := ship.HullRun{
		Scale:           1 / scale,
		ModelLength:     set.MustMeasure(q.New(modelLength, q.Length), length),
		ModelWettedArea: set.MustMeasure(q.New(modelArea, q.Area), area),
		ModelSpeed:      set.MustMeasure(q.New(speeds[last], q.Velocity), speed),
		ModelResistance: set.MustMeasure(q.New(rd.Resistances[last], q.Force), dyn, rep),
		TankTemperature: set.MustMeasure(q.New(tankT+273.15, q.Temperature), therm),
		SeaTemperature:  uncertain.Exact(q.New(seaT+273.15, q.Temperature)),
		Tank:            fluids.FreshWater(), Sea: fluids.SeaWater(),
		FormFactor: set.MustMeasure(q.Scalar(form.FormFactor), kIDs...),
		Allowance:  uncertain.Exact(q.Scalar(ca)),
	}
	res, err := ship.ExtrapolateHullRun(run)
	if err != nil {
		return Budgets{}, err
	}
	b := Budgets{Run: run, Result: res}
	if b.Resistance, err = res.ShipResistance.Budget("R_s", 0.95); err != nil {
		return Budgets{}, err
	}
	if b.Power, err = res.EffectivePower.Budget("P_E", 0.95); err != nil {
		return Budgets{}, err
	}
	return b, nil
}

func run(w io.Writer, args []string) error {
	_, err := evaluate(w, args)
	return err
}

func evaluate(w io.Writer, args []string) (*Outcome, error) {
	fs := cli.NewFlagSet("towingtank", usageText)
	scale := cli.FloatVar(fs, "scale", 16, 2, 100, "", "ship length over model length (the model is 2 m)")
	tankT := cli.FloatVar(fs, "tank", 15, 1, 35, "°C", "tank (fresh) water temperature; the invented readings are made for it")
	seaT := cli.FloatVar(fs, "sea", 15, 0, 35, "°C", "sea water temperature")
	ca := cli.FloatVar(fs, "ca", 0.0004, -0.001, 0.002, "", "roughness and correlation allowance C_A of the ITTC-1957 extrapolation")
	maxFn := cli.FloatVar(fs, "maxfn", 0.2, 0.1, 0.3, "", fmt.Sprintf("highest Froude number used for Prohaska's form factor; at least 3 runs must be at or below it (%.3f or more with these runs)", lowestMaxFn()))
	dir := fs.String("out", os.TempDir(), "directory for the plots towingtank-coefficients.png/.svg and towingtank-openwater.png/.svg")
	width := cli.FloatVar(fs, "width", 4.5, 1, 30, "m", "towing tank width")
	depth := cli.FloatVar(fs, "depth", 2.2, 0.5, 15, "m", "towing tank water depth")
	plotW := cli.FloatVar(fs, "plotw", 7, 3, 30, "in", "plot width")
	plotH := cli.FloatVar(fs, "ploth", 4.5, 2, 30, "in", "plot height")
	dpi := cli.FloatVar(fs, "dpi", 96, 50, 600, "dots per inch", "PNG resolution")
	drawPlot := fs.Bool("plot", true, "write the PNG and SVG plots to -out")
	if err := cli.ParseFlags(fs, w, args); err != nil {
		return nil, err
	}
	size := plotSize{W: *plotW, H: *plotH, DPI: int(*dpi), Skip: !*drawPlot}
	if *drawPlot {
		if err := cli.Dir("out", *dir); err != nil {
			return nil, err
		}
	}
	if err := maxFroudeHolds(*maxFn); err != nil {
		return nil, err
	}
	tank, err := fluids.FreshWater().AtCelsius(*tankT)
	if err != nil {
		return nil, err
	}
	sea, err := fluids.SeaWater().AtCelsius(*seaT)
	if err != nil {
		return nil, err
	}
	rd, err := readingsAt(tank)
	if err != nil {
		return nil, doing("making the readings for the tank temperature", err)
	}
	test := ship.HullTest{
		Scale: 1 / *scale, ModelLength: q.New(modelLength, q.Length), ModelWettedArea: q.New(modelArea, q.Area),
		Tank:      tank,
		Sea:       sea,
		Allowance: *ca,
	}
	for i := range speeds {
		test.Speeds = append(test.Speeds, q.New(speeds[i], q.Velocity))
		test.Resistances = append(test.Resistances, q.New(rd.Resistances[i], q.Force))
	}
	out := &Outcome{Readings: rd}
	if out.Plain, err = ship.ExtrapolateHull(test); err != nil {
		return nil, doing("extrapolating the resistance test", err)
	}
	if out.Form, err = ship.ProhaskaFromTest(test, *maxFn); err != nil {
		return nil, doing("finding the form factor by Prohaska's method", err)
	}
	test.FormFactor = out.Form.FormFactor
	if out.WithForm, err = ship.ExtrapolateHull(test); err != nil {
		return nil, doing("extrapolating the resistance test with the form factor", err)
	}
	if out.DoubleBody, err = doubleBody(test, rd.DoubleBody); err != nil {
		return nil, doing("analysing the double-body test", err)
	}
	kn := units.MustParse("kn")
	fmt.Fprintf(w, "Towing-tank extrapolation, 1:%g model of a coastal research catamaran (invented data)\n", *scale)
	fmt.Fprintf(w, "model L = %.3g m, S = %.3g m² (wetted, both hulls); ship L = %.4g m, S = %.4g m²\n", modelLength, modelArea,
		out.Plain.ShipLength.Value(), out.Plain.ShipWettedArea.Value())
	fmt.Fprintf(w, "tank: fresh water %g °C, ρ = %.2f kg/m³, ν = %.4e m²/s; sea: %g °C, ρ = %.2f kg/m³, ν = %.4e m²/s\n",
		*tankT, tank.Density.Value(), tank.KinematicViscosity.Value(), *seaT, sea.Density.Value(), sea.KinematicViscosity.Value())
	if *tankT == recordTemperature {
		fmt.Fprintf(w, "readings: the invented record, taken in the tank at %g °C\n", recordTemperature)
	} else {
		fmt.Fprintf(w, "readings: re-made for %g °C from the invented record taken at %g °C, each resistance run holding its C_W = C_Tm − %g·C_Fm\n"+
			"  (the invented hull's 1 + k), each double-body run its C_V/C_F, each open-water run its K_T and K_Q (see -h)\n",
			*tankT, recordTemperature, hullFormFactor)
	}
	fp, db := out.Form, out.DoubleBody
	fmt.Fprintf(w, "form factor by Prohaska (%d runs at Fn ≤ %g): 1 + k = %.3f, u = %.2g (standard uncertainty of the intercept, Type A, ν = %d), R² = %.3f\n",
		fp.Points, fp.MaxFroude, fp.FormFactor, fp.FormFactorStdErr, fp.Points-2, fp.R2)
	if fp.Warning != "" {
		fmt.Fprintf(w, "WARNING (form factor): %s\n", fp.Warning)
	}
	fmt.Fprintf(w, "form factor by the double-body test (%d runs): 1 + k = %.3f, u = %.2g (standard uncertainty of the mean, Type A, ν = %d), spread %.3f\n",
		len(db.PerRun), db.FormFactor, db.StdErr, len(db.PerRun)-1, db.Spread)
	diff := db.FormFactor - fp.FormFactor
	uc := math.Hypot(db.StdErr, fp.FormFactorStdErr)
	out.MethodDiff = 0
	if math.Abs(diff) > 2*uc {
		out.MethodDiff = diff
		fmt.Fprintf(w, "WARNING (form factor): double body − Prohaska = %+.3f, %.1f times their combined standard uncertainty %.2g (flagged above 2):\n"+
			"  the methods disagree beyond their scatter; the difference enters the budget below as a source (rectangular, half-width %.3f, u = %.4f)\n",
			diff, math.Abs(diff)/uc, uc, math.Abs(diff), math.Abs(diff)/math.Sqrt(3))
	} else {
		fmt.Fprintf(w, "double body − Prohaska = %+.3f, within twice their combined standard uncertainty %.2g\n", diff, uc)
	}
	fmt.Fprintln(w)
	fmt.Fprintf(w, "ship figures: C_Ts = (1 + k)·C_Fs + C_R + C_A with C_A = %g (the basin's allowance for roughness and correlation), on S_ship = %.4g m²\n",
		*ca, out.Plain.ShipWettedArea.Value())
	var rAll, pAll []float64
	for _, res := range []*ship.HullResult{out.Plain, out.WithForm} {
		for _, a := range res.Points {
			rAll, pAll = append(rAll, a.ShipResistance.Value()), append(pAll, a.EffectivePower.Value())
		}
	}
	rc, pc := siColumn(rAll, "N"), siColumn(pAll, "W")
	fmt.Fprintf(w, "%6s %6s %8s %9s %9s %8s | %7s %9s %9s %9s | %9s %9s %9s\n", "Vm m/s", "Fn", "Rm N", "C_Tm×10³", "C_Fm×10³", "C_R×10³",
		"Vs kn", "C_Ts×10³", "R_s "+rc.unit, "P_E "+pc.unit, "C_Ts×10³", "R_s "+rc.unit, "P_E "+pc.unit)
	fmt.Fprintf(w, "%62s %29s   %29s\n", "", "ITTC-1957, 1 + k = 1", fmt.Sprintf("with 1 + k = %.3f (Prohaska)", fp.FormFactor))
	for i, a := range out.Plain.Points {
		b := out.WithForm.Points[i]
		vs, _ := kn.ValueOf(a.ShipSpeed)
		fmt.Fprintf(w, "%6.2f %6.3f %8.3f %9.3f %9.3f %8.3f | %7.2f %9.3f %9s %9s | %9.3f %9s %9s\n",
			speeds[i], a.Froude, rd.Resistances[i], a.ModelCT*1e3, a.ModelCF*1e3, a.Residual*1e3,
			vs, a.ShipCT*1e3, rc.cell(a.ShipResistance.Value()), pc.cell(a.EffectivePower.Value()),
			b.ShipCT*1e3, rc.cell(b.ShipResistance.Value()), pc.cell(b.EffectivePower.Value()))
	}
	fmt.Fprintf(w, "(C_R is the ITTC-1957 one, C_Tm − C_Fm; with the form factor C_R = C_Tm − (1 + k)·C_Fm)\n")
	// A run's warning is printed once, naming both extrapolations when
	// they give the same one.
	for i, a := range out.Plain.Points {
		b := out.WithForm.Points[i]
		switch {
		case a.Warning != "" && a.Warning == b.Warning:
			fmt.Fprintf(w, "WARNING (1 + k = %.3f and %.3f): %s\n", out.Plain.FormFactor, out.WithForm.FormFactor, a.Warning)
		default:
			for _, r := range []struct {
				k    float64
				warn string
			}{{out.Plain.FormFactor, a.Warning}, {out.WithForm.FormFactor, b.Warning}} {
				if r.warn != "" {
					fmt.Fprintf(w, "WARNING (1 + k = %.3f): %s\n", r.k, r.warn)
				}
			}
		}
	}
	top := out.WithForm.Points[len(out.WithForm.Points)-1]
	fmt.Fprintf(w, "\nat the top speed, with the form factor: R = %s, P_E = %s\n",
		siSig(top.ShipResistance.Value(), "N", 4), siSig(top.EffectivePower.Value(), "W", 4))
	if err := blockage(w, out, test, *width, *depth); err != nil {
		return nil, doing("the tank blockage correction", err)
	}
	if out.Budget, err = topBudget(*scale, *tankT, *seaT, *ca, out.Form, out.MethodDiff, rd); err != nil {
		return nil, doing("the top speed's uncertainty budget", err)
	}
	fmt.Fprintf(w, "\nUncertainty at the top speed (invented instrument figures; standard uncertainties, first order, GUM):\n")
	fmt.Fprintf(w, "speed u = 0.1 %% (rectangular, half-width %.2f %%), dynamometer 0.05 N, repeatability 0.06 N (the standard deviation s of a single run,\n", 0.1*math.Sqrt(3))
	fmt.Fprintf(w, "from 5 repeat runs, ν = 4: the top speed's figure is one run), tank thermometer 0.2 K, wetted area 0.5 %%, length 1 mm,\n")
	fmt.Fprintf(w, "u(1 + k) = %.2g (Prohaska fit, ν = %d)", out.Form.FormFactorStdErr, out.Form.Points-2)
	if out.MethodDiff != 0 {
		fmt.Fprintf(w, ", the form-factor methods' difference (rectangular, half-width %.3f, u = %.4f)", math.Abs(out.MethodDiff), math.Abs(out.MethodDiff)/math.Sqrt(3))
	}
	fmt.Fprintf(w, "; C_A and the sea temperature taken as exact\n\n")
	bc := siColumn([]float64{out.Budget.Result.ShipResistance.Value()}, "N")
	fmt.Fprint(w, wholeDoF(out.Budget.Resistance.In(bc.unit, bc.scale).String()))
	fmt.Fprintln(w)
	bc = siColumn([]float64{out.Budget.Result.EffectivePower.Value()}, "W")
	fmt.Fprint(w, wholeDoF(out.Budget.Power.In(bc.unit, bc.scale).String()))
	if out.Powering, err = powering(w, test, db, rd, size, *dir); err != nil {
		return nil, doing("the powering prediction", err)
	}
	fmt.Fprintln(w, "\nCAUTION:", ship.HullCaution)
	return out, nil
}

const usageText = `Usage: towingtank [flags]

A towing tank's whole job on invented data for a 2 m model of a 32 m
(at 1:16) coastal research catamaran. The model (hull and propeller,
D = 84.4 mm) is fixed. -scale changes the ship: its length, its
propeller (D_S = D_M·λ) and its speeds, and the self-propulsion runs'
readings, which are made for the ship's self-propulsion point at that
scale from the hull's invented w_TM, t and η_R; the resistance,
double-body and open-water readings stay as recorded. It prints:
  - the resistance test carried to full scale by the ITTC-1957 method,
    without and with a form factor 1 + k from Prohaska's method: per run
    the model's Fn, resistance and coefficients C_Tm, C_Fm, C_R (×10³),
    and the ship's speed, C_Ts (including the allowance C_A), resistance
    R_s and effective power P_E;
  - the form factor again from a double-body test, each with its standard
    uncertainty and degrees of freedom, and a warning when the two differ
    by more than twice their combined standard uncertainty;
  - the tank's one-dimensional blockage correction of every run (a run
    at or above the tank's choking speed is marked "choked" and has none);
  - the uncertainty budget of the top speed's R_s and P_E (GUM, first
    order; invented instrument figures);
  - the open-water test of the model propeller reduced per run (J,
    K_T, 10K_Q, η₀ with n in rev/s, and the blade Reynolds number
    Re_0.7), and K_T and 10K_Q faired by polynomials in J with their
    standard errors;
  - the resistance curve faired (C_TM against the model speed);
  - the self-propulsion test analysed by thrust identity: per speed
    K_TM, J_TM, the wake fraction w_TM, the thrust deduction t, η_R, η_H
    and η_D, with the skin-friction correction F_D applied and computed;
  - delivered power P_D (all shafts) and propeller revolutions by the
    ITTC-1978 method from the faired tests, with every allowance (ΔC_F,
    C_A, C_AAS) on every row, and the speed–power table with its 95 %
    band from the fits (first order);
  - PNG and SVG plots of the model's and ship's C_T against the
    Reynolds number with the friction lines, and of the open-water
    curves, in -out.
The invented readings were recorded in the tank at 15 °C. -tank makes
them for another tank temperature, consistently: each resistance run
keeps its wave-making part C_W = C_Tm − (1 + k)·C_Fm, with the invented
hull's 1 + k = 1.13 and the ITTC-1957 C_Fm, and reads C_Tm = (1 + k)·C_Fm
+ C_W at the new viscosity; each double-body run keeps its C_V/C_F; each
open-water run keeps its K_T and K_Q (the propeller's small Reynolds-
number effect neglected), so thrust and torque go with the density. So
both form factors come out nearly the same at every -tank (Prohaska's
within its fit's scatter), and so do the ship figures with the form
factor at one -sea. -sea changes only the ship's water.
Forces and powers are printed to four significant figures, each table
column in the unit (N, kN or MN; W, kW or MW) that leaves its largest
value between 10 and 9999, named in the column's header.
The figures are estimates for illustration: hull powering and machinery
selection are for the responsible naval architect and the basin's own
correlation.

Exit status 2 for a bad flag, an -out that is not a writable directory
(with plots on), or a -maxfn that leaves fewer than 3 runs (the message
names the lowest that would do); 1 for a failure of the job itself.

Flags:
`

// blockage prints the tank's mean-flow blockage correction of every run
// and what it does to the ship's resistance with the form factor. The
// tables above are on the measured speeds; the basin decides whether to
// apply the correction, and says so in its report. A run at or above the
// choking speed has no correction: its row says so, the fix is named
// once, and the other runs are corrected.
func blockage(w io.Writer, out *Outcome, test ship.HullTest, width, depth float64) error {
	sec := ship.TankSection{Width: q.New(width, q.Length), Depth: q.New(depth, q.Length)}
	ax := q.New(modelSection, q.Area)
	out.Blockage = make([]ship.BlockageCorrection, len(test.Speeds))
	out.Choked = make([]bool, len(test.Speeds))
	blocked := test
	blocked.Speeds, blocked.Resistances = nil, nil
	var kept []int
	for i, v := range test.Speeds {
		c, err := ship.TankBlockage(sec, ax, v, test.Gravity)
		out.Blockage[i] = c
		if err != nil {
			if c.ChokingSpeed.Value() > 0 && c.DepthFroude > 0 && v.Value() >= c.ChokingSpeed.Value() {
				out.Choked[i] = true
				continue
			}
			return fmt.Errorf("run %d: %w", i+1, err)
		}
		kept = append(kept, i)
		blocked.Speeds = append(blocked.Speeds, c.Speed)
		blocked.Resistances = append(blocked.Resistances, test.Resistances[i])
	}
	out.Blocked = nil
	if len(kept) > 0 {
		var err error
		if out.Blocked, err = ship.ExtrapolateHull(blocked); err != nil {
			return err
		}
	}
	c0 := out.Blockage[0]
	fmt.Fprintf(w, "\nTank blockage, one-dimensional mean flow (tank %g m × %g m, model A_x = %g m², m = %.4g; choking at %s m/s);\n",
		width, depth, modelSection, c0.Blockage, cli.Sig(c0.ChokingSpeed.Value(), 3))
	fmt.Fprintf(w, "not applied in the tables above; with it, each resistance belongs to the corrected speed V' = V·(1 + ΔV/V) (ship figures with 1 + k):\n")
	var rAll, pAll []float64
	if out.Blocked != nil {
		for _, b := range out.Blocked.Points {
			rAll, pAll = append(rAll, b.ShipResistance.Value()), append(pAll, b.EffectivePower.Value())
		}
	}
	rc, pc := siColumn(rAll, "N"), siColumn(pAll, "W")
	fmt.Fprintf(w, "%6s %6s %9s %9s %8s %8s | %7s %9s %9s\n", "Vm m/s", "Fh", "ΔV/V %", "linear %", "V' m/s", "Δh mm", "Vs kn", "R_s "+rc.unit, "P_E "+pc.unit)
	legend := fmt.Sprintf("columns: Vm the carriage speed; Fh = Vm/√(g·h) the depth Froude number; ΔV/V the speed correction from the full\n" +
		"one-dimensional equations (the one applied); linear its linearisation m/(1 − m − Fh²); V' = Vm·(1 + ΔV/V); Δh the mean fall\n" +
		"of the free surface beside the model; Vs, R_s, P_E the ship's speed, resistance and effective power at V' with 1 + k and C_A\n")
	kn := units.MustParse("kn")
	choked := 0
	for i, c := range out.Blockage {
		if out.Choked[i] {
			choked++
			fmt.Fprintf(w, "%6.2f %6.3f   choked: Fh at or above the choking value %.4g (%s m/s); no steady mean flow past the model, no correction\n",
				speeds[i], c.DepthFroude, c.DepthFroude*c.ChokingSpeed.Value()/speeds[i], cli.Sig(c.ChokingSpeed.Value(), 3))
			continue
		}
		b := out.Blocked.Points[slices.Index(kept, i)]
		vs, _ := kn.ValueOf(b.ShipSpeed)
		fmt.Fprintf(w, "%6.2f %6.3f %9.3f %9.3f %8.4f %8s | %7.2f %9s %9s\n", speeds[i], c.DepthFroude, 100*c.SpeedCorrection, 100*c.LinearCorrection,
			c.Speed.Value(), cli.Sig(1e3*c.SurfaceDrop.Value(), 3), vs, rc.cell(b.ShipResistance.Value()), pc.cell(b.EffectivePower.Value()))
	}
	if choked > 0 {
		fmt.Fprintf(w, "%d of the %d runs are at or above the choking speed %s m/s of this tank: a wider or deeper tank (-width, -depth) raises it\n",
			choked, len(out.Blockage), cli.Sig(c0.ChokingSpeed.Value(), 3))
	}
	fmt.Fprintf(w, "(the ship speed follows V' at equal Froude number; published methods (ITTC 7.5-02-02-01 §3.6.3) add wave terms to this mean-flow term)\n")
	fmt.Fprint(w, legend)
	return nil
}

// runFroude returns the runs' Fn = V/√(g_n·L), lowest first.
func runFroude() []float64 {
	var fns []float64
	for _, v := range speeds {
		fns = append(fns, v/math.Sqrt(gn*modelLength))
	}
	slices.Sort(fns)
	return fns
}

// lowestMaxFn is the lowest -maxfn that takes in three runs: the
// third-lowest run's Fn rounded up to three decimals.
func lowestMaxFn() float64 { return math.Ceil(runFroude()[2]*1000) / 1000 }

// maxFroudeHolds returns a usage error naming -maxfn unless at least
// three runs have Fn at or below it, as Prohaska's method needs, with
// the lowest -maxfn that would do.
func maxFroudeHolds(maxFn float64) error {
	fns := runFroude()
	n := 0
	for _, fn := range fns {
		if fn <= maxFn {
			n++
		}
	}
	if n >= 3 {
		return nil
	}
	return &cli.Error{Msg: fmt.Sprintf("-maxfn %g: Prohaska's form factor needs at least 3 runs at Fn ≤ -maxfn, and %d are (the runs' Fn from %.3f up): raise -maxfn to at least %.3f (the third-lowest run's Fn)",
		maxFn, n, fns[0], lowestMaxFn())}
}

// gn is the standard acceleration of gravity, m/s² (the tests' gravity).
const gn = 9.80665

// jobError is a failure of the job: what the command was doing, then the
// library's reason without the package's name, which means nothing to
// the reader; the library's error stays its cause.
type jobError struct {
	doing string
	err   error
}

func (e *jobError) Error() string {
	return e.doing + ": " + strings.TrimPrefix(e.err.Error(), "ship: ")
}

func (e *jobError) Unwrap() error { return e.err }

// doing wraps err, if any, with what the command was doing; a usage
// error is returned as it is.
func doing(what string, err error) error {
	var ce *cli.Error
	if err == nil || errors.As(err, &ce) {
		return err
	}
	return &jobError{doing: what, err: err}
}

// column is a table column of a force or a power in one unit: the base
// unit with the SI prefix its largest value calls for.
type column struct {
	unit  string  // the prefixed unit, for the header
	scale float64 // the prefix's factor
}

// siColumn chooses the SI prefix of a column of forces or powers from
// its largest magnitude, rounded to four significant figures: the prefix
// that leaves that value between 10 and 9999 in the prefixed unit, so
// that four significant figures never pad a whole number with zeros
// (milli for a column below 1, and at most mega, the ship trade's range).
// Every value of the column is printed in that unit, so that the header
// names it once and truthfully: a column up to 29 076 kN is in MN
// (29.08), one up to 1618 W stays in W (124.1 … 1618), one up to
// 1297 kW stays in kW.
func siColumn(vals []float64, base string) column {
	big := 0.0
	for _, v := range vals {
		if r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'e', 3, 64), 64); err == nil && !math.IsInf(r, 0) {
			big = max(big, math.Abs(r))
		}
	}
	e := 0
	switch {
	case big > 0 && big < 1:
		e = -3
	case big >= 1:
		e = max(0, min(6, 3*int(math.Floor(math.Log10(big/10)/3))))
	}
	return column{unit: siPrefixes[e] + base, scale: math.Pow(10, float64(e))}
}

// siPrefixes are the SI prefixes the reports use, by exponent.
var siPrefixes = map[int]string{-3: "m", 0: "", 3: "k", 6: "M"}

// cell writes v in the column's unit to four significant figures.
func (c column) cell(v float64) string { return cli.Sig(v/c.scale, 4) }

// siSig writes v in unit base with the SI prefix its magnitude calls for
// and n significant figures: 2.908e7 N to four figures is 29.08 MN.
func siSig(v float64, base string, n int) string {
	c := siColumn([]float64{v}, base)
	return cli.Sig(v/c.scale, n) + " " + c.unit
}

// effDoF matches the effective degrees of freedom a budget prints.
var effDoF = regexp.MustCompile(`ν_eff = ([0-9]+)\.[0-9]+`)

// wholeDoF prints a budget's effective degrees of freedom as the whole
// number below it (GUM G.4.1 truncates ν_eff to the next lower integer),
// next to uncertainties of two significant digits.
func wholeDoF(s string) string { return effDoF.ReplaceAllString(s, "ν_eff = $1") }
