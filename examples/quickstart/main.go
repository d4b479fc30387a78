// Command quickstart is similis's main demo. It shows the whole job in
// one run, on invented data: a unit-safe formula with a unit mistake
// caught; a ship-resistance problem's variables turned into a Pi set; a
// test plan whose requirements conflict; the compromise that holds the
// Froude number; measured model data carried to full scale; and the
// ITTC-1957 extrapolation that corrects for the Reynolds number that
// could not be held.
//
// Every vessel, pipe and reading is invented for the demonstration.
//
// Usage:
//
//	go run ./examples/quickstart [-v 2.5] [-d 0.08] [-l 40] [-scale 16]
//
// Exit status 2 for a usage error (a flag named with what was wrong), 1
// for a failure of the demonstration itself.
package main

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"similis.dev/similis/examples/internal/cli"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
)

// The whole-job part is in job.go.

func main() { cli.Main("quickstart", run) }

// pipe holds the inputs of one pressure-drop evaluation.
type pipe struct {
	rho, v, d, mu, eps, l q.Quantity
}

// Flow regimes of a pipe by Reynolds number (common practice): laminar
// below 2000, turbulent above 4000, transitional between, where neither
// friction law can be trusted.
const (
	laminarBelow   = 2000
	turbulentAbove = 4000
)

// pressureDrop evaluates Darcy–Weisbach, Δp = f·(L/D)·ρV²/2, with the
// friction factor of the flow's regime: 64/Re for laminar flow
// (Hagen–Poiseuille), the Swamee–Jain (1976) explicit formula
// f = 0.25 / [log₁₀(ε/(3.7 D) + 5.74/Re^0.9)]² for turbulent flow (fitted
// for 5000 ≤ Re ≤ 10⁸ and 10⁻⁶ ≤ ε/D ≤ 10⁻², so a result between 4000
// and 5000 is marked as an extrapolation). Transitional flow is refused.
func pressureDrop(p pipe) (re, f, dp q.Quantity, regime string, err error) {
	re = p.rho.Mul(p.v).Mul(p.d).Div(p.mu)
	rel := p.eps.Div(p.d)
	if err := re.CheckNamed("Reynolds number ρVD/μ", q.Dimensionless); err != nil {
		return re, f, dp, "", err
	}
	switch r := re.Value(); {
	case r < laminarBelow:
		f = re.Inv().Scale(64)
		regime = "laminar, f = 64/Re"
	case r <= turbulentAbove:
		return re, f, dp, "", fmt.Errorf("the Reynolds number %.4g is in the transition range %d–%d, where neither the laminar nor the turbulent friction law holds", r, laminarBelow, turbulentAbove)
	default:
		lg := q.Log10(rel.Scale(1 / 3.7).Add(q.Powf(re, 0.9).Inv().Scale(5.74)))
		f = lg.Mul(lg).Inv().Scale(0.25)
		regime = "turbulent, Swamee–Jain"
		if out := swameeJainOutside(r, rel.Value()); out != "" {
			regime += " (EXTRAPOLATED: " + out + "; the formula was fitted for 5000 ≤ Re ≤ 1e8 and 1e-6 ≤ ε/D ≤ 1e-2)"
		}
	}
	dp = f.Mul(p.l.Div(p.d)).Mul(p.rho).Mul(p.v).Mul(p.v).Scale(0.5)
	return re, f, dp, regime, nil
}

// swameeJainOutside names each bound of the Swamee–Jain formula's range
// that the Reynolds number re or the relative roughness rel fails, with
// its value ("ε/D = 0.045 above 1e-2"), or returns "" inside it.
func swameeJainOutside(re, rel float64) string {
	var out []string
	switch {
	case re < 5000:
		out = append(out, fmt.Sprintf("Re = %s below 5000", cli.Sig(re, 3)))
	case re > 1e8:
		out = append(out, fmt.Sprintf("Re = %.3g above 1e8", re))
	}
	switch {
	case rel < 1e-6:
		out = append(out, fmt.Sprintf("ε/D = %.2g below 1e-6", rel))
	case rel > 1e-2:
		out = append(out, fmt.Sprintf("ε/D = %s above 1e-2", cli.Sig(rel, 2)))
	}
	return strings.Join(out, ", ")
}

// siSig writes v in unit with an SI prefix chosen by its magnitude (the
// number, rounded to n significant figures, in [1, 1000) where a prefix
// from milli to giga allows) and n significant figures, trailing zeros
// kept: 30042 Pa to three figures is 30.0 kPa, 0.32062 Pa is 0.321 Pa
// (no prefix below 1 for a value under a unit: milli only below 0.001).
func siSig(v float64, unit string, n int) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return cli.Sig(v, n) + " " + unit
	}
	r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'e', n-1, 64), 64)
	e := int(math.Floor(math.Log10(math.Abs(r))/3)) * 3
	if e < 0 && math.Abs(r) >= 1e-3 {
		e = 0
	}
	e = max(-3, min(e, 9))
	prefix := map[int]string{-3: "m", 0: "", 3: "k", 6: "M", 9: "G"}[e]
	return cli.Sig(v/math.Pow(10, float64(e)), n) + " " + prefix + unit
}

const usageText = `Usage: quickstart [flags]

similis's main demonstration on invented data. It prints, in order:
 1. a pipe pressure drop by Darcy–Weisbach (Re, the friction factor and
    its regime, Δp) and the dimension error caught when a kinematic
    viscosity is given where a dynamic one belongs;
 2. the variables of ship resistance and the Pi set found from them;
 3. a plan holding both the Froude and the Reynolds numbers for a
    1:scale model of a 32 m catamaran, and why it conflicts;
 4. the compromise that holds the Froude number, as a model plan;
 5. an invented model resistance at the Froude-scaled speed, carried
    to full scale by Froude scaling alone. The reading is made for the
    model that -scale gives: the same vessel's invented towing-tank
    test (examples/towingtank, a 2 m model in 15 °C fresh water) fixes
    the residuary coefficient C_R = C_TM − C_FM at this Froude number,
    and by Froude's hypothesis C_R is the same for a model of any size,
    so the model reads C_TM = C_FM(Re_m) + C_R with its own ITTC-1957
    C_FM. A smaller model has the larger C_FM, and Froude scaling alone
    then predicts a heavier ship;
 6. the same reading extrapolated by the ITTC-1957 line, with its
    coefficients (×10³), the ship's length, wetted surface, speed and
    water, the ship resistance and effective power, and a
    warning where the model's Reynolds number suggests laminar flow.
    Since the reading holds C_R, the extrapolated ship figures are the
    same at every -scale: the line removes what the model's size adds.
Full-scale figures are estimates for illustration, not a design:
hull powering is for the responsible naval architect.

Flags:
`

func run(w io.Writer, args []string) error {
	fs := cli.NewFlagSet("quickstart", usageText)
	v := cli.FloatVar(fs, "v", 2.5, 1e-3, 50, "m/s", "mean water velocity in the rig's pipe")
	d := cli.FloatVar(fs, "d", 0.08, 1e-3, 5, "m", "pipe bore")
	l := cli.FloatVar(fs, "l", 40, 0.01, 1e4, "m", "pipe length")
	scale := cli.FloatVar(fs, "scale", 16, 2, 100, "", "ship length over model length (λ⁻¹) for the 32 m catamaran of parts 3–6")
	if err := cli.ParseFlags(fs, w, args); err != nil {
		return err
	}
	// Invented data: a water line in a test rig, commercial steel pipe,
	// fresh water at 20 °C.
	water, err := fluids.FreshWater().AtCelsius(20)
	if err != nil {
		return err
	}
	p := pipe{
		rho: water.Density,
		v:   q.New(*v, q.Velocity),
		d:   q.New(*d, q.Length),
		mu:  water.DynamicViscosity,
		eps: q.New(4.5e-5, q.Length),
		l:   q.New(*l, q.Length),
	}
	fmt.Fprintln(w, "similis quickstart — all data below are invented for the demonstration")
	fmt.Fprintln(w, "\n1. A unit-safe formula: pipe pressure drop on a test rig")
	// The inputs echoed as given (shortest digits that read back
	// exactly), ρ and μ to six significant digits, so that the printed
	// Re can be checked from the printed values.
	pr := units.Printer{}
	fmt.Fprintf(w, "  ρ = %.6g kg/m³, V = %s, D = %s, μ = %.6g mPa·s, ε = %s, L = %s (fresh water at 20 °C)\n",
		p.rho.Value(), pr.Format(p.v), pr.Format(p.d), 1e3*p.mu.Value(), pr.Format(p.eps), pr.Format(p.l))
	re, f, dp, regime, err := pressureDrop(p)
	if err != nil {
		fmt.Fprintln(w, "  refused:", err)
	} else {
		fmt.Fprintf(w, "  Re = %.5g (%s)   f = %s   Δp = %s\n", re.Value(), regime, cli.Sig(f.Value(), 3), siSig(dp.Value(), "Pa", 3))
	}

	// The classic slip: the data sheet gives ν (m²/s) and it goes in where μ
	// belongs. The formula refuses it at the first dimensionless-only step.
	bad := p
	bad.mu = q.New(1.0034e-6, q.KinematicViscosity)
	_, _, _, _, err = pressureDrop(bad)
	fmt.Fprintln(w, "  with a kinematic viscosity in place of μ:")
	fmt.Fprintln(w, "   ", err)
	if err == nil {
		return fmt.Errorf("the mismatch was not caught")
	}
	_, err = wholeJob(w, *scale)
	return err
}
