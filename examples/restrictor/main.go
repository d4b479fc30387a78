// Command restrictor reduces an invented bench test of a flow restrictor
// in a coolant loop: the Pi set from its variables with a chosen
// repeating set, the measured rows, the fitted power law with its
// intervals, and a plot of data against fit written as PNG and SVG.
//
// The restrictor, the coolant and every reading are invented.
//
// Usage:
//
//	go run ./examples/restrictor [-out DIR] [-repeat rho,V,d] [-width IN] [-height IN] [-dpi N]
package main

import (
	"cmp"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/examples/internal/plotstyle"
	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units"
)

func main() { cli.Main("restrictor", run) }

const usageText = `restrictor reduces an invented bench test of a flow restrictor (a 6 mm bore,
12, 24 and 48 mm long, in a glycol coolant): it prints the dimensional matrix,
the Pi groups of the chosen repeating set, the coolant's state (temperature,
ρ, μ and ν, the same for every row), the fifteen rows reduced to
Eu = Δp/(ρ·V²) (Euler number, V the mean velocity in the bore), Re = ρ·V·d/μ
(Reynolds number on the bore) and L/d (a table, with the fitted Eu and the
residual of each row), and the power law Eu = C·Re^a·(L/d)^b fitted by least
squares on logarithms, with:
  - 95 % intervals of C and the exponents (and the exponents' standard
    uncertainties, k = 1), the rows taken as a correlated
    sequence (effective rows n_eff = n(1 − r₁)/(1 + r₁) from the residuals'
    lag-1 autocorrelation r₁, common practice);
  - a runs test on the residuals' signs (lack of fit: too few runs), a
    caution when the residuals alternate instead (too many runs, or r₁
    strongly negative), and a warning that Eu and Re share ρ and V
    (spurious correlation inflates R²);
  - a prediction at a mid-range point, its apparent Darcy friction factor
    f_D = 2·Eu/(L/d) (Darcy–Weisbach; the Fanning factor is f_D/4), and an
    extrapolated point marked as such;
  - the uncertainty budget of one row (GUM; u is a standard uncertainty,
    k = 1, U an expanded one), and
  - a log–log plot of Eu against Re, one marker shape per L/d with its fitted
    line, written as restrictor-fit.png and restrictor-fit.svg in -out.
The output ends with the fitted ranges of Re and L/d, outside which the law
is an extrapolation. The repeating set must give Eu, Re and L/d (rho,V,d does); another set is
refused with the sets that do. Exit status: 0 done, 1 failure, 2 usage.

Flags:
`

// reading is one invented bench row, in the units of the rig's sheet.
type reading struct {
	flow, dp, length string // L/min, kPa, mm
}

// Invented readings: three restrictors of 6 mm bore and 12, 24 and 48 mm
// length in a 50/50 glycol coolant at 40 °C (ρ = 1050 kg/m³,
// μ = 2.2 mPa·s, invented round figures).
var readings = []reading{
	{"2.0 L/min", "3.28 kPa", "12 mm"}, {"3.0 L/min", "7.07 kPa", "12 mm"}, {"4.5 L/min", "15.4 kPa", "12 mm"},
	{"6.0 L/min", "26.6 kPa", "12 mm"}, {"8.0 L/min", "45.6 kPa", "12 mm"},
	{"2.0 L/min", "3.97 kPa", "24 mm"}, {"3.0 L/min", "8.30 kPa", "24 mm"}, {"4.5 L/min", "18.6 kPa", "24 mm"},
	{"6.0 L/min", "31.5 kPa", "24 mm"}, {"8.0 L/min", "54.9 kPa", "24 mm"},
	{"2.0 L/min", "4.64 kPa", "48 mm"}, {"3.0 L/min", "10.1 kPa", "48 mm"}, {"4.5 L/min", "21.6 kPa", "48 mm"},
	{"6.0 L/min", "37.9 kPa", "48 mm"}, {"8.0 L/min", "65.0 kPa", "48 mm"},
}

const (
	coolant   = "50/50 glycol–water coolant" // by volume
	coolantC  = 40.0                         // °C, the loop's temperature
	density   = "1050 kg/m^3"
	viscosity = "2.2 mPa*s"
	bore      = "6 mm"
)

// Result holds the fit and the Pi set, for the test.
type Result struct {
	Set      *pigroups.Set
	Fit      *pigroups.PowerLaw
	Groups   [][]float64 // per row: Eu, Re, L/d, whatever the order of the set
	Velocity []float64   // per row: the mean velocity in the bore, m/s
	PNG, SVG string
	Budget   RowBudget
	DarcyMid float64 // the apparent Darcy friction factor at the mid-range point
}

// RowBudget is the uncertainty of one bench row, for the test.
type RowBudget struct {
	DP, DPIndependent uncertain.Measured // Δp with one standard for both transducers, and with two
	Eu, Re, LD        uncertain.Measured
	EuFit, Deviation  uncertain.Measured // the fit at the row, and measured − fitted
	Budget            uncertain.Budget   // of Eu
	ReBudget          uncertain.Budget   // of Re, every source it uses
	LDBudget          uncertain.Budget   // of L/d
}

// rowBudget works out the uncertainty of the row at 6.0 L/min through the
// 12 mm restrictor. Δp is the difference of two absolute transducers,
// P1 = 226.6 kPa and P2 = 200.0 kPa, both calibrated against the same
// dead-weight tester, whose error therefore enters both alike and nearly
// cancels in Δp. Every instrument figure is invented.
func rowBudget(w io.Writer, set *pigroups.Set, fit *pigroups.PowerLaw, idx [3]int) (RowBudget, error) {
	src := uncertain.NewSet()
	add := src.MustAdd
	pa := q.New(1, q.Pressure)
	sys, rnd := uncertain.Systematic, uncertain.Random
	std := add(uncertain.Source{Name: "dead-weight tester (both)", U: q.Scalar(0.0005), Relative: true, Effect: sys})
	res1 := add(uncertain.Source{Name: "P1 calibration residual", U: pa.Scale(50), Effect: sys})
	res2 := add(uncertain.Source{Name: "P2 calibration residual", U: pa.Scale(50), Effect: sys})
	rep1 := add(uncertain.Source{Name: "P1 repeatability", U: pa.Scale(30), Type: uncertain.TypeA, DoF: 9, Effect: rnd})
	rep2 := add(uncertain.Source{Name: "P2 repeatability", U: pa.Scale(30), Type: uncertain.TypeA, DoF: 9, Effect: rnd})
	flow := add(uncertain.Source{Name: "flow meter", U: q.Scalar(0.005), Relative: true, Effect: sys})
	bore := add(uncertain.Source{Name: "bore (gauge pin)", U: q.New(0.01e-3, q.Length), Effect: sys})
	length := add(uncertain.Source{Name: "length (caliper)", U: q.New(0.05e-3, q.Length), Dist: uncertain.Rectangular, Effect: sys})
	dens := add(uncertain.Source{Name: "density (coolant data)", U: q.Scalar(0.002), Relative: true, Effect: sys})
	visc := add(uncertain.Source{Name: "viscosity (coolant data)", U: q.Scalar(0.02), Relative: true, Effect: sys})

	p1 := src.MustMeasure(pa.Scale(226.6e3), std, res1, rep1)
	p2 := src.MustMeasure(pa.Scale(200.0e3), std, res2, rep2)
	var rb RowBudget
	rb.DP = p1.Sub(p2)
	// The same readings had each transducer been calibrated against a
	// standard of its own: the standards' errors no longer cancel.
	alone := uncertain.NewSet()
	s1 := alone.MustAdd(uncertain.Source{Name: "standard 1", U: q.Scalar(0.0005), Relative: true})
	s2 := alone.MustAdd(uncertain.Source{Name: "standard 2", U: q.Scalar(0.0005), Relative: true})
	o := alone.MustAdd(uncertain.Source{Name: "the rest", U: pa.Scale(math.Sqrt(2*50*50 + 2*30*30))})
	rb.DPIndependent = alone.MustMeasure(pa.Scale(226.6e3), s1, o).Sub(alone.MustMeasure(pa.Scale(200.0e3), s2))

	rho := src.MustMeasure(q.New(1050, q.Density), dens)
	mu := src.MustMeasure(q.New(2.2e-3, q.DynamicViscosity), visc)
	d := src.MustMeasure(q.New(6e-3, q.Length), bore)
	l := src.MustMeasure(q.New(12e-3, q.Length), length)
	qv := src.MustMeasure(q.New(6.0e-3/60, q.VolumeFlowRate), flow)
	v := qv.Div(d.Mul(d).Scale(math.Pi / 4))
	g := make([]uncertain.Measured, set.Len())
	if _, err := set.Evaluator().RowMeasured([]uncertain.Measured{rb.DP, rho, v, d, mu, l}, g); err != nil {
		return RowBudget{}, err
	}
	rb.Eu, rb.Re, rb.LD = g[idx[0]], g[idx[1]], g[idx[2]]
	law, err := fit.Measured(src, "restrictor fit")
	if err != nil {
		return RowBudget{}, err
	}
	pr := pigroups.Prediction{}
	if rb.EuFit, pr, err = law.Predict(rb.Re, rb.LD); err != nil {
		return RowBudget{}, err
	}
	rb.Deviation = rb.Eu.Sub(rb.EuFit)
	if rb.Budget, err = rb.Eu.Budget("Eu", 0.95); err != nil {
		return RowBudget{}, err
	}
	dev, err := rb.Deviation.Budget("Eu − Eu_fit", 0.95)
	if err != nil {
		return RowBudget{}, err
	}
	fmt.Fprintf(w, "\nUncertainty of the row at 6.0 L/min, L = 12 mm (invented instrument figures; standard uncertainties, GUM):\n")
	fmt.Fprintf(w, "Δp = P1 − P2 = %.1f kPa, u = %.3f kPa with both transducers calibrated on one dead-weight tester\n",
		rb.DP.Value()/1e3, rb.DP.U().Value()/1e3)
	fmt.Fprintf(w, "  (%.3f kPa had each its own standard of the same quality: the shared error cancels in the difference)\n", rb.DPIndependent.U().Value()/1e3)
	if rb.ReBudget, err = rb.Re.Budget("Re", 0.95); err != nil {
		return RowBudget{}, err
	}
	if rb.LDBudget, err = rb.LD.Budget("L/d", 0.95); err != nil {
		return RowBudget{}, err
	}
	fmt.Fprintf(w, "Re = %s, L/d = %s; u: standard uncertainties, k = 1, each the root sum of squares of its sources'\n", withU(rb.Re.Value(), rb.Re.U().Value()), withU(rb.LD.Value(), rb.LD.U().Value()))
	indep := "these sources are independent"
	if rb.ReBudget.Correlated || rb.LDBudget.Correlated {
		indep = "with the correlations between them"
	}
	fmt.Fprintf(w, "  contributions |c|·u as a share of the value (%s):\n", indep)
	for _, b := range []struct {
		name string
		b    uncertain.Budget
	}{{"Re = ρVd/μ = 4ρQ/(πμd)", rb.ReBudget}, {"L/d", rb.LDBudget}} {
		fmt.Fprintf(w, "  %s: u/value = %.2f %% from %s\n", b.name, 100*b.b.U.Value()/math.Abs(b.b.Value.Value()), sourceShares(b.b))
	}
	fmt.Fprintln(w, "the budget of Eu = Δp/(ρV²) (the viscosity and the caliper do not enter it):")
	fmt.Fprint(w, rb.Budget)
	ev, eu := cli.RoundToUncertainty(rb.EuFit.Value(), rb.EuFit.U().Value(), 4)
	fmt.Fprintf(w, "the fit at this row: Eu = %s (u = %s; standard uncertainty, k = 1, from the fit and the inputs)%s\n", ev, eu, note(pr))
	dv, du := cli.RoundToUncertainty(dev.Value.Value(), dev.Expanded.Value(), 4)
	fmt.Fprintf(w, "measured − fitted = %s, expanded uncertainty U(95 %%, k = %.2f) = %s (the shared ρ, V, d cancel in part)\n", dv, dev.K, du)
	return rb, nil
}

// sourceShares lists a budget's sources with their contributions as
// a share of the value, largest first ("viscosity (coolant data)
// 2.00 %, flow meter 0.50 %"), the sources of zero contribution left out.
func sourceShares(b uncertain.Budget) string {
	var parts []string
	for _, l := range b.Lines {
		if c := l.Contribution.Value(); c > 0 {
			parts = append(parts, fmt.Sprintf("%s %.2f %%", l.Source.Name, 100*c/math.Abs(b.Value.Value())))
		}
	}
	return strings.Join(parts, ", ")
}

// printRows prints the bench rows reduced to the groups, with the fitted
// Eu and the residual, in the order of the readings.
func printRows(w io.Writer, res *Result, fit *pigroups.PowerLaw) {
	fmt.Fprintln(w, "  the rows reduced (Eu = Δp/(ρ·V²), Re = ρ·V·d/μ, V = Q/(π·d²/4)); residual = ln(Eu/Eu_fit), about the fraction off the fit:")
	fmt.Fprintf(w, "  %3s %9s %5s %8s %7s %7s %6s %5s %7s %9s\n", "#", "Q L/min", "L mm", "Δp kPa", "V m/s", "Eu", "Re", "L/d", "Eu_fit", "residual")
	for i, g := range res.Groups {
		r := readings[i]
		pr, err := fit.Predict(g[1], g[2])
		fitted, resid := "–", "–"
		if err == nil {
			fitted, resid = fmt.Sprintf("%.4f", pr.Value), fmt.Sprintf("%+.2f %%", 100*math.Log(g[0]/pr.Value))
		}
		fmt.Fprintf(w, "  %3d %9s %5s %8s %7.3f %7.4f %6.0f %5.3g %7s %9s\n", i, strings.Fields(r.flow)[0], strings.Fields(r.length)[0],
			strings.Fields(r.dp)[0], res.Velocity[i], g[0], g[1], g[2], fitted, resid)
	}
}

// alternation remarks on residuals that alternate in sign: too many runs
// (z ≥ 1.96, the upper tail of a two-sided 5 % test) or a strongly
// negative lag-1 autocorrelation. The runs test as printed looks for too
// few runs only, and n_eff is capped at n when r₁ ≤ 0, so neither shows
// this; it is empty when the residuals do not alternate.
func alternation(f *pigroups.PowerLaw) string {
	if !(f.Runs.Z >= 1.96 || f.R1 <= -0.5) {
		return ""
	}
	return fmt.Sprintf("the residuals alternate in sign: %d runs against %.1f expected (z = %+.2f; two-sided, |z| ≥ 1.96 is significant at 5 %%), "+
		"and r₁ = %.3f; too many runs and a negative autocorrelation are a warning sign too, which neither the one-sided runs test "+
		"nor n_eff (capped at n) shows: look for their cause (an alternating test order or reading, an instrument that overshoots, "+
		"a term the law lacks) before trusting the intervals", f.Runs.Runs, f.Runs.Expected, f.Runs.Z, f.R1)
}

// withU writes a value and its standard uncertainty u rounded together:
// u to two significant figures, the value to the same decimal place
// ("10130 (u = 210)").
func withU(v, u float64) string {
	a, b := cli.RoundToUncertainty(v, u, 4)
	return a + " (u = " + b + ")"
}

func note(p pigroups.Prediction) string {
	if p.Extrapolated {
		return "; " + p.Note()
	}
	return ""
}

func run(w io.Writer, args []string) error { _, err := evaluate(w, args); return err }

// Exponent vectors (dp, rho, V, d, mu, L) of the three groups the report
// names: Eu = Δp/(ρV²), Re = ρVd/μ, L/d.
var (
	euExps = []int64{1, -1, -2, 0, 0, 0}
	reExps = []int64{0, 1, 1, 1, -1, 0}
	ldExps = []int64{0, 0, 0, -1, 0, 1}
)

// named finds the groups Eu, Re and L/d of set by their exponents, and
// their indices in the set; ok is false when the set lacks one.
func named(set *pigroups.Set) (eu, re, ld int, ok bool) {
	eu, re, ld = -1, -1, -1
	for k, g := range set.Groups() {
		e := g.Exponents()
		is := func(want []int64) bool {
			for i, x := range e {
				if x != q.RatInt(want[i]) {
					return false
				}
			}
			return true
		}
		switch {
		case is(euExps):
			eu = k
		case is(reExps):
			re = k
		case is(ldExps):
			ld = k
		}
	}
	return eu, re, ld, eu >= 0 && re >= 0 && ld >= 0
}

// labelledSets lists the repeating sets whose groups the report can
// label.
func labelledSets(p *pigroups.Problem) []string {
	var out []string
	p.EachRepeating(func(set []string) bool {
		if s, err := p.PiSet(set...); err == nil {
			if _, _, _, ok := named(s.WithConventional()); ok {
				out = append(out, strings.Join(set, ","))
			}
		}
		return true
	})
	return out
}

func evaluate(w io.Writer, args []string) (*Result, error) {
	fs := cli.NewFlagSet("restrictor", usageText)
	out := fs.String("out", os.TempDir(), "directory for restrictor-fit.png and restrictor-fit.svg")
	rep := fs.String("repeat", "rho,V,d", "repeating set; it must give Eu, Re and L/d")
	width := cli.FloatVar(fs, "width", 6, 2, 40, "in", "plot width")
	height := cli.FloatVar(fs, "height", 4, 2, 40, "in", "plot height")
	dpi := cli.FloatVar(fs, "dpi", 150, 36, 1200, "dots per inch", "PNG resolution")
	if err := cli.ParseFlags(fs, w, args); err != nil {
		return nil, err
	}
	if err := cli.Dir("out", *out); err != nil {
		return nil, err
	}
	p, err := pigroups.NewProblem(
		pigroups.Dep("dp", q.Pressure).WithKind("pressure difference"),
		pigroups.VarKind("rho", q.Density, "density"), pigroups.VarKind("V", q.Velocity, "velocity"),
		pigroups.VarKind("d", q.Length, "length"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"),
		pigroups.VarKind("L", q.Length, "length"))
	if err != nil {
		return nil, err
	}
	set, err := p.PiSet(strings.Split(*rep, ",")...)
	if err != nil {
		return nil, &cli.Error{Msg: fmt.Sprintf("-repeat %s: %s; sets the report can label: %s", cli.Quote(*rep), cli.Sanitize(err.Error()), strings.Join(labelledSets(p), "; "))}
	}
	set = set.WithConventional()
	iEu, iRe, iLD, ok := named(set)
	if !ok {
		var gs []string
		for _, g := range set.Groups() {
			gs = append(gs, g.Format(q.Unicode))
		}
		return nil, &cli.Error{Msg: fmt.Sprintf("-repeat %s gives %s: the report labels Eu = Δp/(ρ·V²), Re = ρ·V·d/μ and L/d, which this set does not give; sets that do: %s",
			cli.Quote(*rep), strings.Join(gs, ", "), strings.Join(labelledSets(p), "; "))}
	}
	fmt.Fprintln(w, "Bench test of a flow restrictor in a coolant loop (invented data)")
	fmt.Fprint(w, p.MatrixTable())
	fmt.Fprintf(w, "repeating set: %s\n", strings.Join(set.Repeating(), ", "))
	fmt.Fprint(w, set.Format(q.Unicode))

	rho, _ := units.ParseQuantity(density)
	mu, _ := units.ParseQuantity(viscosity)
	d, _ := units.ParseQuantity(bore)
	fmt.Fprintf(w, "fluid state (every row): %s at %g °C, ρ = %s kg/m³, μ = %s mPa·s (ν = μ/ρ = %s mm²/s; invented round figures); bore d = %s mm\n",
		coolant, coolantC, cli.Sig(rho.Value(), 4), cli.Sig(mu.Value()*1e3, 3), cli.Sig(mu.Value()/rho.Value()*1e6, 3), cli.Sig(d.Value()*1e3, 3))
	area := d.Pow(2, 1).Scale(math.Pi / 4)
	ev := set.Evaluator()
	res := &Result{Set: set}
	var y []float64
	xs := make([][]float64, 2)
	row := make([]float64, set.Len())
	for i, r := range readings {
		flow, err := units.ParseQuantity(r.flow)
		if err != nil {
			return nil, fmt.Errorf("row %d: %w", i, err)
		}
		dp, err := units.ParseQuantity(r.dp)
		if err != nil {
			return nil, fmt.Errorf("row %d: %w", i, err)
		}
		length, err := units.ParseQuantity(r.length)
		if err != nil {
			return nil, fmt.Errorf("row %d: %w", i, err)
		}
		v := flow.Div(area) // a volume flow over an area: a velocity, checked below
		vals := []q.Quantity{dp, rho, v, d, mu, length}
		g, err := ev.Row(vals, row)
		if err != nil {
			return nil, fmt.Errorf("row %d: %w", i, err)
		}
		res.Groups = append(res.Groups, []float64{g[iEu], g[iRe], g[iLD]})
		res.Velocity = append(res.Velocity, v.Value())
		y = append(y, g[iEu])
		xs[0] = append(xs[0], g[iRe])
		xs[1] = append(xs[1], g[iLD])
	}
	gs := set.Groups()
	ordered := []pigroups.Group{gs[iEu], gs[iRe], gs[iLD]}
	names := []string{"Eu", "Re", "L/d"}
	fit, err := pigroups.FitPowerLaw(y, xs, &pigroups.FitOptions{Names: names, Correlated: true, Groups: ordered})
	if err != nil {
		return nil, err
	}
	res.Fit = fit
	fmt.Fprintf(w, "\nfit over %d rows: Eu = %.4g · Re^%.4f · (L/d)^%.4f\n", fit.N, fit.C, fit.Exponents[0], fit.Exponents[1])
	printRows(w, res, fit)
	fmt.Fprintf(w, "  rows taken as a correlated sequence: residual lag-1 autocorrelation r₁ = %.3f, n_eff = n(1 − r₁)/(1 + r₁) = %.1f of %d (n when r₁ ≤ 0)\n", fit.R1, fit.NEff, fit.N)
	fmt.Fprintf(w, "  C in [%.4g, %.4g] (95 %%)\n", fit.CInterval[0], fit.CInterval[1])
	for k, a := range fit.Exponents {
		t := (fit.Intervals[k][1] - a) / fit.StdErr[k+1]
		fmt.Fprintf(w, "  exponent of %s: %.4f, standard uncertainty %.4f (k = 1); 95 %% interval [%.4f, %.4f] (±t·u, t = %.2f, %d degrees of freedom)\n",
			names[k+1], a, fit.StdErr[k+1], fit.Intervals[k][0], fit.Intervals[k][1], t, fit.DoF)
	}
	fmt.Fprintf(w, "  R² = %.4f, residual RMS in ln = %.4f\n", fit.R2, fit.RMS)
	fmt.Fprintf(w, "  %s\n", fit.Runs)
	if alt := alternation(fit); alt != "" {
		fmt.Fprintf(w, "  CAUTION: %s\n", alt)
	}
	for _, m := range fit.Warnings {
		fmt.Fprintf(w, "  WARNING: %s\n", m)
	}
	mid := []float64{math.Round(math.Sqrt(fit.Ranges[0][0] * fit.Ranges[0][1])), 4}
	pr, err := fit.Predict(mid...)
	if err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  at Re = %.4g, L/d = 4: Eu = %.4f, mean in [%.4f, %.4f], one new reading in [%.4f, %.4f]\n",
		mid[0], pr.Value, pr.Mean[0], pr.Mean[1], pr.Individual[0], pr.Individual[1])
	res.DarcyMid = 2 * pr.Value / mid[1]
	fmt.Fprintf(w, "  apparent Darcy friction factor there f_D = 2·Eu/(L/d) = %.4f (Darcy–Weisbach Δp = f_D·(L/d)·ρV²/2, entry and exit losses included; the Fanning factor is f_D/4 = %.4f)\n", res.DarcyMid, res.DarcyMid/4)
	if pr.Extrapolated {
		fmt.Fprintln(w, "  ", pr.Note())
	}
	far := []float64{3 * fit.Ranges[0][1], 4}
	if pr, err := fit.Predict(far...); err == nil {
		fmt.Fprintf(w, "  at Re = %.4g, L/d = 4: Eu = %.4f — %s\n", far[0], pr.Value, pr.Note())
	}
	if res.Budget, err = rowBudget(w, set, fit, [3]int{iEu, iRe, iLD}); err != nil {
		return nil, err
	}
	if res.PNG, res.SVG, err = plotFit(*out, res, *width, *height, *dpi); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "\nplots (Eu against Re, log–log, one marker per L/d with its fitted line): %s, %s\n", res.PNG, res.SVG)
	fmt.Fprintf(w, "\nNote: a correlation is valid only over the range of the data it was fitted to: here Re %.0f … %.0f and L/d %.3g … %.3g.\n",
		fit.Ranges[0][0], fit.Ranges[0][1], fit.Ranges[1][0], fit.Ranges[1][1])
	return res, nil
}

// buildPlot draws measured Eu against Re for each L/d with the fitted
// curves, log–log: one marker shape and colour per L/d, its fitted line
// in the same colour.
func buildPlot(r *Result) (*plot.Plot, []*plotter.Scatter, error) {
	pl := plot.New()
	pl.Title.Text = "Flow restrictor (invented data): measured and fitted"
	pl.X.Label.Text = "Re = ρ·V·d/μ (log scale)"
	pl.Y.Label.Text = "Eu = Δp/(ρ·V²) (log scale)"
	pl.Legend.Top = true
	byLD := map[float64]plotter.XYs{}
	var lds []float64
	for _, g := range r.Groups {
		ld := math.Round(g[2]*1000) / 1000
		if _, ok := byLD[ld]; !ok {
			lds = append(lds, ld)
		}
		byLD[ld] = append(byLD[ld], plotter.XY{X: g[1], Y: g[0]})
	}
	var xs, ys []float64
	var scs []*plotter.Scatter
	for k, ld := range lds {
		pts := byLD[ld]
		sc, err := plotter.NewScatter(pts)
		if err != nil {
			return nil, nil, err
		}
		sc.GlyphStyle = plotstyle.Marker(k)
		scs = append(scs, sc)
		lo := slices.MinFunc(pts, func(a, b plotter.XY) int { return cmp.Compare(a.X, b.X) }).X
		hi := slices.MaxFunc(pts, func(a, b plotter.XY) int { return cmp.Compare(a.X, b.X) }).X
		var line plotter.XYs
		for i := 0; i <= 20; i++ {
			re := lo * math.Pow(hi/lo, float64(i)/20)
			pr, err := r.Fit.Predict(re, ld)
			if err != nil {
				return nil, nil, err
			}
			line = append(line, plotter.XY{X: re, Y: pr.Value})
		}
		ln, err := plotter.NewLine(line)
		if err != nil {
			return nil, nil, err
		}
		ln.Color = sc.GlyphStyle.Color
		ln.Dashes = [][]vg.Length{nil, {vg.Points(4), vg.Points(2)}, {vg.Points(1), vg.Points(2)}}[k%3]
		pl.Add(sc, ln)
		pl.Legend.Add(fmt.Sprintf("L/d = %g", ld), sc, ln)
		for _, p := range append(pts, line...) {
			xs, ys = append(xs, p.X), append(ys, p.Y)
		}
	}
	plotstyle.StyleLog(pl, xs, ys)
	// Room above the data for the legend, so it covers no marker.
	pl.Y.Max *= math.Pow(pl.Y.Max/pl.Y.Min, 0.3)
	return pl, scs, nil
}

// plotFit writes the plot as restrictor-fit.png (at dpi) and
// restrictor-fit.svg in dir, w × h inches.
func plotFit(dir string, r *Result, w, h, dpi float64) (string, string, error) {
	pl, _, err := buildPlot(r)
	if err != nil {
		return "", "", err
	}
	png := filepath.Join(dir, "restrictor-fit.png")
	svg := filepath.Join(dir, "restrictor-fit.svg")
	if err := plotstyle.Save(pl, png, w, h, dpi); err != nil {
		return "", "", err
	}
	if err := plotstyle.Save(pl, svg, w, h, dpi); err != nil {
		return "", "", err
	}
	return png, svg, nil
}
