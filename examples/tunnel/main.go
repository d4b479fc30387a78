// Command tunnel plans wind-tunnel tests of an invented high-altitude
// survey aircraft cruising at 18 km in the ISO 2533 standard atmosphere:
// the Mach number held with the Reynolds number left to float in an
// ordinary tunnel drawing atmospheric air (total conditions 288.15 K and
// 101 325 Pa, the test section's static state from the isentropic
// relations), then the total temperature and pressure a pressurised or a
// cooled tunnel would need to hold both, the model's dynamic pressure and
// lift in each against the balance limit, the cryogenic test section's
// margin to nitrogen condensation, and the wall corrections of a
// two-dimensional section test and of the complete model (blockage,
// downwash, and the wing's and tail's streamline curvature).
//
// The aircraft and the tunnels are invented for the demonstration.
//
// Usage:
//
//	go run ./examples/tunnel [-alt 18000] [-mach 0.62] [-chord 2.4] [-scale 12]
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

func main() {
	if err := run(os.Stdout, os.Args[1:]); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return // -h: the usage is printed
		}
		fmt.Fprintln(os.Stderr, "tunnel:", err)
		os.Exit(2)
	}
}

// Result collects the key numbers, for the test.
type Result struct {
	Flight                 fluids.State
	Speed, Chord           float64
	ReFlight, ReOrdinary   float64
	OrdinarySpeed          float64
	Ordinary               fluids.State // the ordinary tunnel's static test-section state
	Pressurised, Cryogenic similarity.TunnelCondition
	Compromise             *similarity.Compromise
	Loads                  []Load
	Margin                 q.Quantity // the cryogenic test section's margin to nitrogen condensation
	Section                similarity.Corrected2D
	Model                  similarity.Corrected3D
}

// Load is a model's dynamic pressure and lift in one tunnel.
type Load struct {
	Name    string
	Q, Lift float64 // Pa, N
}

// Invented model data: the aircraft's wing area, the cruise lift
// coefficient and the balance's normal-force limit.
const (
	wingArea     = 38.0   // m², full scale
	cruiseCL     = 0.6    // lift coefficient C_L = L/(q·S)
	balanceLimit = 4000.0 // N
)

func run(w io.Writer, args []string) error { _, err := evaluate(w, args); return err }

func evaluate(w io.Writer, args []string) (*Result, error) {
	fs := flag.NewFlagSet("tunnel", flag.ContinueOnError)
	fs.SetOutput(w)
	alt := fs.Float64("alt", 18000, "cruise altitude, m (geometric)")
	mach := fs.Float64("mach", 0.62, "cruise Mach number")
	chord := fs.Float64("chord", 2.4, "mean aerodynamic chord, m")
	scale := fs.Float64("scale", 12, "aircraft size over model size")
	if err := fs.Parse(args); err != nil {
		return nil, err
	}
	if !(*scale > 1) || !(*mach > 0 && *mach < 1) || !(*chord > 0) {
		return nil, fmt.Errorf("want -scale > 1, 0 < -mach < 1 and -chord > 0")
	}
	flight, err := fluids.StandardAtmosphere(q.New(*alt, q.Length), fluids.Geometric)
	if err != nil {
		return nil, err
	}
	gp, _ := fluids.Geopotential(q.New(*alt, q.Length))
	r := &Result{Flight: flight, Chord: *chord}
	r.Speed = *mach * flight.SpeedOfSound.Value()
	r.ReFlight = flight.Density.Value() * r.Speed * *chord / flight.DynamicViscosity.Value()

	fmt.Fprintln(w, "Wind-tunnel plan for an invented high-altitude survey aircraft")
	fmt.Fprintf(w, "cruise: %.0f m (geopotential %.0f m), ISO 2533: T = %.2f K, p = %.0f Pa, ρ = %.5f kg/m³, a = %.2f m/s\n",
		*alt, gp.Value(), flight.Temperature.Value(), flight.Pressure.Value(), flight.Density.Value(), flight.SpeedOfSound.Value())
	fmt.Fprintf(w, "Ma = %.2f, V = %.1f m/s, chord %.2f m: Re = %.3e\n\n", *mach, r.Speed, *chord, r.ReFlight)

	// The plan: V, a, c, ρ, μ with the Mach number first, the Reynolds
	// number second; an ordinary tunnel at sea-level air fixes a, ρ, μ.
	p := pigroups.MustProblem(
		pigroups.Dep("F", q.Force).WithKind("force"),
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("a", q.Velocity, "speed of sound"),
		pigroups.VarKind("c", q.Length, "length"), pigroups.VarKind("rho", q.Density, "density"),
		pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"))
	set, err := p.PiSet("V", "c", "rho")
	if err != nil {
		return nil, err
	}
	var ma, re pigroups.Group
	for _, g := range set.Groups() {
		switch {
		case len(g.Matches) > 0 && g.Matches[0].Symbol == "Ma":
			ma = g
		case len(g.Matches) > 0 && g.Matches[0].Symbol == "Re":
			re = g
		}
	}
	// The ordinary tunnel draws atmospheric air: that is its total
	// condition; the test section runs at the static state the held Mach
	// number gives.
	intake := fluids.Total{Temperature: q.New(288.15, q.Temperature), Pressure: q.New(101325, q.Pressure)}
	ground, err := fluids.Air().StaticAt(intake, *mach)
	if err != nil {
		return nil, err
	}
	r.Ordinary = ground
	fmt.Fprintf(w, "ordinary tunnel: total %s; test section at Ma %.2f: static T = %.2f K, p = %.0f Pa, ρ = %.4f kg/m³ (isentropic relations)\n\n",
		intake, *mach, ground.Temperature.Value(), ground.Pressure.Value(), ground.Density.Value())
	plan := similarity.NewPlan(p).Fix("c", 1 / *scale).
		Fix("a", ground.SpeedOfSound.Value()/flight.SpeedOfSound.Value()).
		Fix("rho", ground.Density.Value()/flight.Density.Value()).
		Fix("mu", ground.DynamicViscosity.Value()/flight.DynamicViscosity.Value()).Basis("V", "c", "rho")
	proto := map[string]q.Quantity{"V": q.New(r.Speed, q.Velocity), "a": flight.SpeedOfSound, "c": q.New(*chord, q.Length),
		"rho": flight.Density, "mu": flight.DynamicViscosity}
	c, err := plan.Compromise(proto, similarity.Priority{Group: ma}, similarity.Priority{Group: re, MinModel: 1e6})
	if err != nil {
		return nil, err
	}
	r.Compromise = c
	vr, _ := c.Solution.Ratio("V")
	r.OrdinarySpeed = r.Speed * vr.Value
	r.ReOrdinary = c.Floating[0].Model
	rep, err := similarity.NewReport(c.Solution, similarity.ReportOptions{
		Title: fmt.Sprintf("1:%g model in an ordinary tunnel (atmospheric intake, static state at the held Mach number)", *scale), Prototype: proto,
		Units: map[string]string{"V": "m/s", "mu": "uPa*s"}, Groups: set.Groups(), Compromise: c,
	})
	if err != nil {
		return nil, err
	}
	fmt.Fprint(w, rep.Text())

	V := q.New(r.Speed, q.Velocity)
	L := q.New(*chord, q.Length)
	pressurised := similarity.TunnelLimits{MinTemperature: q.New(280, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(4e5, q.Pressure)}
	cryo := similarity.TunnelLimits{MinTemperature: q.New(110, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e5, q.Pressure), MaxPressure: q.New(4.5e5, q.Pressure)}
	if r.Pressurised, err = similarity.FindTunnelCondition(fluids.Air(), flight, V, L, 1 / *scale, pressurised); err != nil {
		return nil, err
	}
	if r.Cryogenic, err = similarity.FindTunnelCondition(fluids.Air(), flight, V, L, 1 / *scale, cryo); err != nil {
		return nil, err
	}
	fmt.Fprintln(w, "\nHolding both Mach and Reynolds numbers:")
	for _, t := range []struct {
		name string
		c    similarity.TunnelCondition
	}{{"pressurised tunnel (total 280–320 K, ≤ 4 bar)", r.Pressurised}, {"cryogenic tunnel (total ≥ 110 K, 1–4.5 bar)", r.Cryogenic}} {
		fmt.Fprintf(w, "  %s:\n    total T₀ = %.1f K, p₀ = %.3f bar; static T = %.1f K, p = %.3f bar; V = %.1f m/s; Re_m/Re = %.3f — %s\n", t.name,
			t.c.Total.Temperature.Value(), t.c.Total.Pressure.Value()/1e5,
			t.c.Temperature.Value(), t.c.Pressure.Value()/1e5, t.c.Velocity.Value(), t.c.ReynoldsRatio, t.c.Note)
	}
	fmt.Fprintln(w, "  (limits are total conditions; static = total by the isentropic relations of a perfect gas, γ = 1.4)")
	if r.Margin, err = fluids.CondensationMargin(r.Cryogenic.Temperature, r.Cryogenic.Pressure); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  condensation: a cryogenic tunnel runs in nitrogen; at the static %.1f K and %.3f bar it stays %.0f K above saturation (Span et al.)\n",
		r.Cryogenic.Temperature.Value(), r.Cryogenic.Pressure.Value()/1e5, r.Margin.Value())

	// Loads on the model: q = (γ/2)·p·Ma² at each test section's static
	// pressure, times C_L and the model's wing area.
	area := wingArea / (*scale * *scale)
	fmt.Fprintf(w, "\nModel loads at C_L = %.1f (wing %.0f m² full scale, %.4f m² model; balance normal-force limit %.1f kN, invented):\n",
		cruiseCL, wingArea, area, balanceLimit/1e3)
	r.Loads = nil
	for _, t := range []struct {
		name string
		p    q.Quantity
	}{{"ordinary tunnel", ground.Pressure}, {"pressurised tunnel", r.Pressurised.Pressure}, {"cryogenic tunnel", r.Cryogenic.Pressure}} {
		dq, err := fluids.Air().DynamicPressure(t.p, *mach)
		if err != nil {
			return nil, err
		}
		lift := cruiseCL * dq.Value() * area
		verdict := "within the balance limit"
		if lift > balanceLimit {
			verdict = fmt.Sprintf("EXCEEDS the balance limit by %.0f %%", 100*(lift/balanceLimit-1))
		}
		r.Loads = append(r.Loads, Load{Name: t.name, Q: dq.Value(), Lift: lift})
		fmt.Fprintf(w, "  %-20s q = %6.2f kPa, lift = %5.2f kN — %s\n", t.name+":", dq.Value()/1e3, lift/1e3, verdict)
	}
	// A two-dimensional test of the wing's section (invented readings).
	sec := similarity.Section2D{Chord: q.New(0.30, q.Length), Height: q.New(0.90, q.Length), ShapeFactor: 0.25,
		Alpha: 6, CL: 0.82, CD: 0.0125, CM: -0.080}
	if r.Section, err = similarity.CorrectWalls2D(sec); err != nil {
		return nil, err
	}
	cs := r.Section
	fmt.Fprintf(w, "\nSection test, chord 0.30 m wall to wall in a 0.90 m high closed test section (invented readings), wall corrections:\n")
	fmt.Fprintf(w, "  σ = %.5f, ε_sb = %.5f (Λ = %.2f), ε_wb = %.5f; q = %.4f·q_u, V and Re = %.4f × uncorrected\n",
		cs.Sigma, cs.SolidBlock, sec.ShapeFactor, cs.WakeBlock, cs.DynamicPressureFactor, cs.VelocityFactor)
	fmt.Fprintf(w, "  α %.2f° → %.3f°, C_l %.4f → %.4f, C_d %.5f → %.5f, C_m¼ %.4f → %.4f\n",
		sec.Alpha, cs.Alpha, sec.CL, cs.CL, sec.CD, cs.CD, sec.CM, cs.CM)
	// The complete model in the ordinary tunnel's closed 2.0 × 1.5 m
	// section (invented readings and chart factors).
	m3 := similarity.Model3D{WingArea: q.New(area, q.Area), TunnelArea: q.New(3.0, q.Area), ModelVolume: q.New(0.010, q.Volume),
		ShapeFactor: 0.86, Delta: 0.12, Alpha: 3.0, CL: cruiseCL, CD: 0.035, CM: -0.030,
		CurvatureFactor: 0.12, LiftSlope: 0.085, TailCurvatureFactor: 0.55, TailMomentSlope: -0.025}
	if r.Model, err = similarity.CorrectWalls3D(m3); err != nil {
		return nil, err
	}
	c3 := r.Model
	fmt.Fprintf(w, "\nComplete model in a closed 2.0 × 1.5 m section (invented readings; K·τ₁ = %.2f, δ = %.2f from the charts):\n", m3.ShapeFactor, m3.Delta)
	fmt.Fprintf(w, "  ε_sb = %.5f, ε_wb = %.5f; q = %.4f·q_u; α %.2f° → %.3f°, C_L %.4f → %.4f, C_D %.5f → %.5f (ΔC_D,i = %.5f)\n",
		c3.SolidBlock, c3.WakeBlock, c3.DynamicPressureFactor, m3.Alpha, c3.Alpha, m3.CL, c3.CL, m3.CD, c3.CD, c3.DeltaCD)
	fmt.Fprintf(w, "  of which streamline curvature (τ₂ = %.2f, a = %.3f/°): Δα_sc = %.4f°, ΔC_L = %.5f, ΔC_m¼ = %.5f;\n",
		m3.CurvatureFactor, m3.LiftSlope, c3.DeltaAlphaCurvature, c3.DeltaCLCurvature, c3.DeltaCMCurvature)
	fmt.Fprintf(w, "  tail (τ₂,t = %.2f, ∂C_m/∂α_t = %.3f/°): %.4f° more angle than free air, ΔC_m = %.5f; C_m¼ %.4f → %.4f\n",
		m3.TailCurvatureFactor, m3.TailMomentSlope, c3.TailAngle, c3.DeltaCMTail, m3.CM, c3.CM)
	fmt.Fprintln(w, "\nCAUTION:", similarity.TunnelCaution)
	return r, nil
}
