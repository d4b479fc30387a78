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
package main

import (
	"flag"
	"fmt"
	"io"
	"math"
	"os"

	q "similis.dev/similis/quantity"
)

// The whole-job part is in job.go.

func main() {
	if err := run(os.Stdout, os.Args[1:]); err != nil {
		fmt.Fprintln(os.Stderr, "quickstart:", err)
		os.Exit(2)
	}
}

// pipe holds the inputs of one pressure-drop evaluation.
type pipe struct {
	rho, v, d, mu, eps, l q.Quantity
}

// pressureDrop evaluates Darcy–Weisbach with the Swamee–Jain (1976)
// explicit friction factor, f = 0.25 / [log₁₀(ε/(3.7 D) + 5.74/Re^0.9)]².
func pressureDrop(p pipe) (re, f, dp q.Quantity) {
	re = p.rho.Mul(p.v).Mul(p.d).Div(p.mu)
	lg := q.Log10(p.eps.Div(p.d).Scale(1 / 3.7).Add(q.Powf(re, 0.9).Inv().Scale(5.74)))
	f = lg.Mul(lg).Inv().Scale(0.25)
	dp = f.Mul(p.l.Div(p.d)).Mul(p.rho).Mul(p.v).Mul(p.v).Scale(0.5)
	return re, f, dp
}

func run(w io.Writer, args []string) error {
	fs := flag.NewFlagSet("quickstart", flag.ContinueOnError)
	fs.SetOutput(w)
	v := fs.Float64("v", 2.5, "mean velocity, m/s")
	d := fs.Float64("d", 0.08, "pipe bore, m")
	l := fs.Float64("l", 40, "pipe length, m")
	scale := fs.Float64("scale", 16, "ship length over model length, for the whole-job part")
	if err := fs.Parse(args); err != nil {
		return err
	}
	if !(*scale > 1) {
		return fmt.Errorf("-scale %v: want a ship larger than its model", *scale)
	}
	if *v <= 0 || *d <= 0 || *l <= 0 || math.IsInf(*v+*d+*l, 0) {
		return fmt.Errorf("velocity, bore and length must be positive and finite")
	}
	// Invented data: a water line in a test rig, commercial steel pipe.
	p := pipe{
		rho: q.New(998.2, q.Density),
		v:   q.New(*v, q.Velocity),
		d:   q.New(*d, q.Length),
		mu:  q.New(1.0016e-3, q.DynamicViscosity),
		eps: q.New(4.5e-5, q.Length),
		l:   q.New(*l, q.Length),
	}
	fmt.Fprintln(w, "similis quickstart — all data below are invented for the demonstration")
	fmt.Fprintln(w, "\n1. A unit-safe formula: pipe pressure drop on a test rig")
	fmt.Fprintf(w, "  ρ = %v, V = %v, D = %v, μ = %v, ε = %v, L = %v\n", p.rho, p.v, p.d, p.mu, p.eps, p.l)
	re, f, dp := pressureDrop(p)
	fmt.Fprintf(w, "  Re = %.5g   f = %.4f   Δp = %.4g\n", re.Value(), f.Value(), dp)

	// The classic slip: the data sheet gives ν (m²/s) and it goes in where μ
	// belongs. The formula refuses it at the first dimensionless-only step.
	bad := p
	bad.mu = q.New(1.0034e-6, q.KinematicViscosity)
	_, err := q.Eval(func() q.Quantity { _, _, dp := pressureDrop(bad); return dp })
	fmt.Fprintln(w, "  with a kinematic viscosity in place of μ:")
	fmt.Fprintln(w, "   ", err)
	if err == nil {
		return fmt.Errorf("the mismatch was not caught")
	}
	_, err = wholeJob(w, *scale)
	return err
}
