// Command pumpscale carries an invented model-pump test curve to a
// prototype at another speed and impeller diameter by the affinity laws,
// with the efficiency stepped up by Moody's formula at the best-efficiency
// point and that gain added along the curve (common practice), and prints
// the curve in US customary units (gpm, ft, hp) and in SI.
//
// The pump family and the test curve are invented.
//
// Usage:
//
//	go run ./examples/pumpscale [-nm 1750] [-dm 10] [-np 1180] [-dp 24] [-moody 0.2]
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/units"
)

func main() {
	if err := run(os.Stdout, os.Args[1:]); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return // -h: the usage is printed
		}
		fmt.Fprintln(os.Stderr, "pumpscale:", err)
		os.Exit(2)
	}
}

// point is one invented model test point, as the rig's sheet gives it.
type point struct{ flow, head, eff string }

// Invented model curve: 10 in impeller at 1750 rpm, cold water.
var curve = []point{
	{"200 gpm", "118 ft", "52 %"}, {"400 gpm", "114 ft", "71 %"}, {"600 gpm", "107 ft", "80 %"},
	{"800 gpm", "96 ft", "83.5 %"}, {"1000 gpm", "81 ft", "81 %"}, {"1200 gpm", "61 ft", "72 %"},
}

const caution = "Scaled pump curves are estimates; guaranteed performance comes from the manufacturer's acceptance test " +
	"to the applicable standard, and system design remains with the responsible engineer."

// Row is one carried point, in SI, for the test.
type Row struct {
	ModelQ, ModelH, ModelP, ModelEta q.Quantity
	ProtoQ, ProtoH, ProtoP           q.Quantity
	ProtoEta                         float64
}

func run(w io.Writer, args []string) error { _, err := evaluate(w, args); return err }

func evaluate(w io.Writer, args []string) ([]Row, error) {
	fs := flag.NewFlagSet("pumpscale", flag.ContinueOnError)
	fs.SetOutput(w)
	nm := fs.Float64("nm", 1750, "model speed, rpm")
	dm := fs.Float64("dm", 10, "model impeller diameter, in")
	np := fs.Float64("np", 1180, "prototype speed, rpm")
	dp := fs.Float64("dp", 24, "prototype impeller diameter, in")
	moody := fs.Float64("moody", 0.2, "Moody exponent")
	if err := fs.Parse(args); err != nil {
		return nil, err
	}
	if !(*nm > 0 && *dm > 0 && *np > 0 && *dp > 0) {
		return nil, fmt.Errorf("speeds and diameters must be positive")
	}
	// Ratios prototype/model: the affinity laws run either way.
	// Ratios are model/prototype, as everywhere in similis.
	aff, err := similarity.AffinityLaws(similarity.Scales{Speed: *nm / *np, Diameter: *dm / *dp, Density: 1})
	if err != nil {
		return nil, err
	}
	in := units.MustParse("in")
	dModel, dProto := in.Of(*dm), in.Of(*dp)
	water := q.New(998.2, q.Density) // cold water, 20 °C (ITTC 7.5-02-01-03, from memory)
	g := units.StandardGravity()
	gpm, ft, hp := units.MustParse("gpm"), units.MustParse("ft"), units.MustParse("hp")
	ls, m, kw := units.MustParse("L/s"), units.MustParse("m"), units.MustParse("kW")
	fmt.Fprintln(w, "Pump-family scale-up by the affinity laws (invented model curve)")
	fmt.Fprintf(w, "model %g in impeller at %g rpm → prototype %g in at %g rpm\n", *dm, *nm, *dp, *np)
	fmt.Fprintf(w, "ratios model/prototype: flow %.4g (N·D³), head %.4g (N²·D²), power %.4g (ρ·N³·D⁵); the prototype is the model divided by them\n", aff.Flow, aff.Head, aff.Power)
	// Efficiencies first: the step-up is taken at the best-efficiency
	// point and its gain applied along the curve.
	etas := make([]float64, len(curve))
	for i, c := range curve {
		eta, err := units.ParseQuantity(c.eff)
		if err != nil || !eta.IsDimensionless() {
			return nil, fmt.Errorf("point %d: efficiency %q: %v", i, c.eff, err)
		}
		etas[i] = eta.Value()
	}
	step, err := similarity.MoodyCurve(etas, dModel, dProto, *moody, similarity.StepUpAtBEP)
	if err != nil {
		return nil, err
	}
	var rows []Row
	fmt.Fprintf(w, "\n%-28s | %-40s | %s\n", "model", "prototype (US customary)", "prototype (SI)")
	fmt.Fprintf(w, "%7s %6s %6s %6s | %8s %7s %8s %6s | %8s %7s %8s\n", "gpm", "ft", "hp", "η", "gpm", "ft", "hp", "η", "L/s", "m", "kW")
	for i, c := range curve {
		Q, err := units.ParseQuantity(c.flow)
		if err != nil {
			return nil, fmt.Errorf("point %d: %w", i, err)
		}
		H, err := units.ParseQuantity(c.head)
		if err != nil {
			return nil, fmt.Errorf("point %d: %w", i, err)
		}
		eta, err := units.ParseQuantity(c.eff)
		if err != nil || !eta.IsDimensionless() {
			return nil, fmt.Errorf("point %d: efficiency %q: %v", i, c.eff, err)
		}
		// Shaft power from the hydraulic power and the efficiency.
		P := water.Mul(g).Mul(Q).Mul(H).Div(eta)
		r := Row{ModelQ: Q, ModelH: H, ModelP: P, ModelEta: eta}
		r.ProtoQ = Q.Scale(1 / aff.Flow)
		r.ProtoH = H.Scale(1 / aff.Head)
		r.ProtoEta = step.Efficiency[i]
		r.ProtoP = water.Mul(g).Mul(r.ProtoQ).Mul(r.ProtoH).Scale(1 / r.ProtoEta)
		rows = append(rows, r)
		v := func(u units.Unit, x q.Quantity) float64 { f, _ := u.ValueOf(x); return f }
		fmt.Fprintf(w, "%7.0f %6.1f %6.2f %5.1f%% | %8.0f %7.1f %8.1f %5.1f%% | %8.1f %7.2f %8.1f\n",
			v(gpm, Q), v(ft, H), v(hp, P), 100*eta.Value(),
			v(gpm, r.ProtoQ), v(ft, r.ProtoH), v(hp, r.ProtoP), 100*r.ProtoEta,
			v(ls, r.ProtoQ), v(m, r.ProtoH), v(kw, r.ProtoP))
	}
	fmt.Fprintf(w, "\nefficiency stepped up by Moody's formula, η_p = 1 − (1 − η_m)(D_m/D_p)^%g, at the best-efficiency point\n", *moody)
	fmt.Fprintf(w, "(%.1f %% → %.1f %%), and its gain of %.2f points added at every point (common practice, as IEC 60193 does);\n",
		100*etas[step.BEP], 100*(etas[step.BEP]+step.Gain), 100*step.Gain)
	fmt.Fprintln(w, "power from ρgQH/η_p")
	fmt.Fprintln(w, "\nCAUTION:", caution)
	return rows, nil
}
