// Command tunnel plans wind-tunnel tests of an invented high-altitude
// survey aircraft cruising at 18 km in the ISO 2533 standard atmosphere:
// the Mach number held with the Reynolds number left to float in an
// ordinary tunnel drawing atmospheric air (total conditions 288.15 K and
// 101 325 Pa, the test section's static state from the isentropic
// relations), then the total temperature and pressure a pressurised air
// tunnel or a cryogenic nitrogen tunnel would need to hold both, the
// model's dynamic pressure and lift in each against the balance's rated
// load, the cryogenic test section's margin to nitrogen condensation,
// the wall corrections of a two-dimensional section test and of the
// complete model at the test Mach number (blockage with its
// compressibility factors, downwash, and the wing's and tail's
// streamline curvature), the reduction of an invented polar run from a
// six-component balance's readings to corrected coefficients and the
// fitted polar (with plots), and the safety cautions of each tunnel.
//
// The aircraft, the tunnels, the balance and the readings are invented for the
// demonstration. Running a pressurised or cryogenic tunnel is governed by
// the facility's safety rules and its responsible engineer; nothing
// printed here replaces them.
//
// Usage:
//
//	go run ./examples/tunnel [-alt 18000] [-mach 0.62] [-chord 2.4] [-scale 12]
//	    [-amin -5] [-amax 11] [-out DIR] [-width IN] [-height IN] [-dpi N]
package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"slices"
	"strconv"
	"strings"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

func main() { cli.Main("tunnel", run) }

// Result collects the key numbers, for the test.
type Result struct {
	Flight       fluids.State
	Speed, Chord float64
	// WingArea (m²) and Span (m) are the full-scale aircraft's, sized by
	// the chord at the fixed aspect ratio; ModelArea (m²) is the
	// model's wing area at the scale.
	WingArea, Span, ModelArea float64
	ReFlight, ReOrdinary      float64
	OrdinarySpeed             float64
	Ordinary                  fluids.State // the ordinary tunnel's static test-section state
	Pressurised, Cryogenic    tunnel.Condition
	Compromise                *similarity.Compromise
	Loads                     []Load
	Margin                    q.Quantity // the cryogenic test section's margin to nitrogen condensation
	Section                   tunnel.Corrected2D
	Model                     tunnel.Corrected3D
	// ModelSlope is the lift slope, per degree, of the complete model's
	// curvature correction: the run's fitted slope at the test Mach number.
	ModelSlope float64
	// SectionErr and ModelErr are the corrections' refusals (above
	// Ma 0.8, or a model too large for the section), printed instead.
	SectionErr, ModelErr error
	// Run is the reduced polar run.
	Run *Run
}

// Load is a model's dynamic pressure and lift in one tunnel.
type Load struct {
	Name    string
	Q, Lift float64 // Pa, N
}

// Invented model data: the aircraft's wing area and span at its design
// mean chord, the cruise lift coefficient and the balance's rated normal
// force. -chord sizes the whole aircraft: the wing area scales with the
// square of the chord and the span with the chord, so the aspect ratio
// b²/S stays 18.6²/38 = 9.10.
const (
	designChord  = 2.4    // m, the mean aerodynamic chord of the design
	wingArea     = 38.0   // m², full scale at designChord
	wingSpan     = 18.6   // m, full scale at designChord
	cruiseCL     = 0.6    // lift coefficient C_L = L/(q·S)
	balanceLimit = 4000.0 // N
)

const about = `Usage: tunnel [flags]

tunnel plans wind-tunnel tests of an invented high-altitude survey aircraft.

For the cruise condition (ISO 2533 atmosphere at the altitude -alt, Mach
number -mach, mean aerodynamic chord -chord) and a model -scale times
smaller it prints:
  - the flight state and full-scale Reynolds number Re = ρVc/μ;
  - an ordinary tunnel at atmospheric intake with the Mach number held:
    its static test-section state and the model Reynolds number it reaches;
  - the total temperature T₀ and pressure p₀ a pressurised air tunnel and a
    cryogenic nitrogen tunnel need to hold both Mach and Reynolds numbers
    (limits are total conditions; static = total by the isentropic
    relations), Re_m/Re (1 when both hold), and the gas each is computed for;
    each tunnel's header gives the limits of total temperature and total
    pressure (absolute) the search keeps to;
  - the nitrogen test section's margin above condensation (kelvin);
  - the model's dynamic pressure q = (γ/2)·p·Ma² (kPa) and lift C_L·q·S_m
    (N) in each tunnel against the balance's rated load;
  - wall corrections of a section test and of the complete model at the
    test Mach number (ε = blockage; q/q_u and the corrected coefficients),
    or why they are refused (above Ma 0.8 they are not applied); the
    complete model's streamline-curvature correction takes the polar
    run's fitted lift slope, raised to the test Mach number by the
    Prandtl–Glauert factor, and the run's own takes its fitted slope
    (reduced once with an assumed slope, then again with the fitted);
    pressures are absolute throughout;
  - the reduction of a polar run on the 1:12 model at q_u = 2750 Pa from a
    six-component internal balance: the calibration (readings from loads,
    first- and second-order terms, inverted by iteration), the weight tare
    from wind-off attitudes (W and CG), the moments moved to the quarter
    chord, the loads in wind axes (body axes x forward, z down; NF up, AF
    aft), the coefficients on q_u and corrected for the walls on q, and the
    largest load against the balance's calibrated range;
  - the polar fitted over the linear range -amin … -amax (corrected α, in
    degrees): lift slope dC_L/dα and zero-lift angle α₀, C_D0 and K of
    C_D = C_D0 + K·C_L², each with its 95 % interval; plots of C_L against
    α and of C_D against C_L written to -out as PNG and SVG;
  - the safety cautions of each tunnel, the ordinary one's load included
    (an OVERLOAD line says what would lower it). The aircraft, tunnels, balance and
    readings are invented; the facility's safety rules, the balance's rated
    loads and the responsible engineer govern any real run.

-chord sizes the whole aircraft: its wing area and span scale with the
chord at the fixed aspect ratio b²/S = 9.10 (38 m² and 18.6 m at the
design's 2.4 m), the model's volume with its cube. The invented polar run
stays on the 1:12 model of the 2.4 m design whatever -chord and -scale
say (its lift slope, a property of the shape, carries over).

Exit status 2 for a bad flag, an -out that is not a writable directory,
or an -amin … -amax range that holds fewer than 3 of the run's corrected
angles (the message names the bounds that would do) or lies past the
stall (its fitted lift slope is not positive; the message names a linear
range found from the run's points); 1 when the plan cannot be made.

Flags:
`

func run(w io.Writer, args []string) error { _, err := evaluate(w, args); return err }

func evaluate(w io.Writer, args []string) (*Result, error) {
	fs := cli.NewFlagSet("tunnel", about)
	alt := cli.FloatVar(fs, "alt", 18000, 0, 32000, "m", "cruise altitude, geometric")
	mach := cli.FloatVar(fs, "mach", 0.62, 0.1, 0.95, "", "cruise Mach number (wall corrections are refused above 0.8)")
	chord := cli.FloatVar(fs, "chord", 2.4, 0.1, 20, "m", "mean aerodynamic chord; sizes the aircraft (wing area ∝ c², span ∝ c, aspect ratio fixed)")
	scale := cli.FloatVar(fs, "scale", 12, 2, 200, "", "aircraft size over model size")
	alo := cli.FloatVar(fs, "amin", -5, -30, 30, "°", "lowest corrected α of the polar's linear range")
	ahi := cli.FloatVar(fs, "amax", 11, -30, 30, "°", "highest corrected α of the polar's linear range")
	out := fs.String("out", os.TempDir(), "directory for tunnel-lift and tunnel-polar .png and .svg")
	width := cli.FloatVar(fs, "width", 6, 2, 40, "in", "plot width")
	height := cli.FloatVar(fs, "height", 4, 2, 40, "in", "plot height")
	dpi := cli.FloatVar(fs, "dpi", 150, 36, 1200, "dots per inch", "PNG resolution")
	if err := cli.ParseFlags(fs, w, args); err != nil {
		return nil, err
	}
	if err := cli.Dir("out", *out); err != nil {
		return nil, err
	}
	if !(*alo < *ahi) {
		return nil, &cli.Error{Msg: fmt.Sprintf("-amin %g must be below -amax %g", *alo, *ahi)}
	}
	// The polar run is reduced before anything is printed, so that a
	// linear range the run cannot fill is refused as a usage error; its
	// text is printed below, after the complete model's corrections.
	var runText strings.Builder
	r := &Result{Chord: *chord}
	var err error
	if r.Run, err = reduceRun(&runText, *out, *alo, *ahi, *width, *height, *dpi); err != nil {
		return nil, err
	}
	flight, err := fluids.StandardAtmosphere(q.New(*alt, q.Length), fluids.Geometric)
	if err != nil {
		return nil, err
	}
	gp, _ := fluids.Geopotential(q.New(*alt, q.Length))
	r.Flight = flight
	r.Speed = *mach * flight.SpeedOfSound.Value()
	r.ReFlight = flight.Density.Value() * r.Speed * *chord / flight.DynamicViscosity.Value()

	fmt.Fprintln(w, "Wind-tunnel plan for an invented high-altitude survey aircraft")
	fmt.Fprintf(w, "cruise: %.0f m (geopotential %.0f m), ISO 2533: T = %.2f K, p = %.0f Pa, ρ = %.5f kg/m³, a = %.2f m/s\n",
		*alt, gp.Value(), flight.Temperature.Value(), flight.Pressure.Value(), flight.Density.Value(), flight.SpeedOfSound.Value())
	size := *chord / designChord // the aircraft's size against the design's
	r.WingArea, r.Span = wingArea*size*size, wingSpan*size
	fmt.Fprintf(w, "Ma = %.2f, V = %.1f m/s, chord %.2f m: Re = %.3e\n", *mach, r.Speed, *chord, r.ReFlight)
	fmt.Fprintf(w, "aircraft sized by the chord at a fixed aspect ratio b²/S = %.2f: wing area S = %s m², span b = %s m (design: 38 m², 18.6 m at c = 2.4 m)\n\n",
		r.Span*r.Span/r.WingArea, cli.Sig(r.WingArea, 4), cli.Sig(r.Span, 4))

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
	fmt.Fprintf(w, "ordinary tunnel: total T₀ = %.2f K, p₀ = %.5f bar (absolute); test section at Ma %.2f: static T = %.2f K, p = %.5f bar (absolute), ρ = %.4f kg/m³ (isentropic relations)\n\n",
		intake.Temperature.Value(), intake.Pressure.Value()/1e5, *mach, ground.Temperature.Value(), ground.Pressure.Value()/1e5, ground.Density.Value())
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
	// The model's load path: the balance's rated normal force against
	// C_L·S_m·q at each found condition.
	area := r.WingArea / (*scale * *scale)
	r.ModelArea = area
	rated, loadArea := q.New(balanceLimit, q.Force), q.New(cruiseCL*area, q.Area)
	pressurised := tunnel.Limits{MinTemperature: q.New(280, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(4e5, q.Pressure), RatedLoad: rated, LoadArea: loadArea}
	cryo := tunnel.Limits{MinTemperature: q.New(110, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e5, q.Pressure), MaxPressure: q.New(4.5e5, q.Pressure), RatedLoad: rated, LoadArea: loadArea}
	air, n2 := fluids.Air(), fluids.Nitrogen()
	if r.Pressurised, err = tunnel.FindCondition(air, flight, V, L, 1 / *scale, pressurised); err != nil {
		return nil, err
	}
	if r.Cryogenic, err = tunnel.FindCondition(n2, flight, V, L, 1 / *scale, cryo); err != nil {
		return nil, err
	}
	fmt.Fprintln(w, "\nHolding both Mach and Reynolds numbers:")
	tunnels := []struct {
		name string
		gas  fluids.IdealGas
		c    tunnel.Condition
	}{{"pressurised tunnel (" + limitsText(pressurised) + ")", air, r.Pressurised}, {"cryogenic tunnel (" + limitsText(cryo) + ")", n2, r.Cryogenic}}
	for _, t := range tunnels {
		fmt.Fprintf(w, "  %s, gas: %s (ideal gas, R = %.2f J/(kg·K), γ = %.1f, Sutherland viscosity):\n", t.name, t.c.Gas, t.gas.R.Value(), t.gas.Gamma)
		fmt.Fprintf(w, "    total T₀ = %.1f K, p₀ = %.3f bar (absolute); static T = %.1f K, p = %.3f bar (absolute); V = %.1f m/s; Re_m/Re = %.3f — %s (set by: %s)\n",
			t.c.Total.Temperature.Value(), t.c.Total.Pressure.Value()/1e5,
			t.c.Temperature.Value(), t.c.Pressure.Value()/1e5, t.c.Velocity.Value(), t.c.ReynoldsRatio, t.c.Note, strings.Join(t.c.Binding, ", "))
	}
	fmt.Fprintln(w, "  (limits are total conditions, pressures absolute throughout; static = total by the isentropic relations of a perfect gas, γ = 1.4)")
	if r.Margin, err = fluids.CondensationMargin(r.Cryogenic.Temperature, r.Cryogenic.Pressure); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "  condensation: the cryogenic tunnel runs in nitrogen; at the free-stream static %.1f K and %.3f bar (absolute) it stays %.0f K above saturation (Span et al.);\n",
		r.Cryogenic.Temperature.Value(), r.Cryogenic.Pressure.Value()/1e5, r.Margin.Value())
	fmt.Fprintln(w, "    that margin is the free stream's only: local supersonic expansion over the model lowers the static temperature and reduces it")

	// Loads on the model: q = (γ/2)·p·Ma² at each test section's static
	// pressure, times C_L and the model's wing area.
	fmt.Fprintf(w, "\nModel loads at C_L = %.1f (wing %s m² full scale, %s m² model; balance rated normal force %s N, invented):\n",
		cruiseCL, cli.Sig(r.WingArea, 4), cli.Sig(area, 4), cli.Sig(balanceLimit, 4))
	r.Loads = nil
	for _, t := range []struct {
		name string
		gas  fluids.IdealGas
		p    q.Quantity
	}{{"ordinary tunnel", air, ground.Pressure}, {"pressurised tunnel", air, r.Pressurised.Pressure}, {"cryogenic tunnel", n2, r.Cryogenic.Pressure}} {
		dq, err := t.gas.DynamicPressure(t.p, *mach)
		if err != nil {
			return nil, err
		}
		lift := cruiseCL * dq.Value() * area
		verdict := fmt.Sprintf("%s %% of the balance's rating", cli.Sig(100*lift/balanceLimit, 2))
		if lift > balanceLimit {
			verdict = fmt.Sprintf("EXCEEDS the balance's rating by %s %%: do not run (see SAFETY)", cli.Sig(100*(lift/balanceLimit-1), 2))
		}
		r.Loads = append(r.Loads, Load{Name: t.name, Q: dq.Value(), Lift: lift})
		fmt.Fprintf(w, "  %-20s q = %6s kPa, lift = %6s N — %s\n", t.name+":", cli.Sig(dq.Value()/1e3, 4), cli.Sig(lift, 4), verdict)
	}
	// A two-dimensional test of the wing's section at the test Mach
	// number (invented readings).
	sec := tunnel.Section2D{Chord: q.New(0.30, q.Length), Height: q.New(0.90, q.Length), ShapeFactor: 0.25,
		AlphaDeg: 6, CL: 0.82, CD: 0.0125, CM: -0.080, Mach: *mach}
	fmt.Fprintf(w, "\nSection test at Ma %.2f, chord 0.30 m wall to wall in a 0.90 m high closed test section (invented readings), wall corrections:\n", *mach)
	if r.Section, r.SectionErr = tunnel.CorrectWalls2D(sec); r.SectionErr != nil {
		fmt.Fprintf(w, "  not applied: %s\n", libText(r.SectionErr))
	} else {
		cs := r.Section
		fmt.Fprintf(w, "  σ = %s, β = √(1 − Ma²) = %.4f; ε_sb = Λσ/β³ = %s (Λ = %.2f), ε_wb = %s (×(1 + 0.4Ma²)/β²)\n",
			cli.Sig(cs.Sigma, 4), cs.Beta, fig(cs.SolidBlock), sec.ShapeFactor, fig(cs.WakeBlock))
		fmt.Fprintf(w, "  q = %.4f·q_u (1 + (2 − Ma²)ε), V = %.4f·V_u, Ma = %.4f·Ma_u, Re = %.4f·Re_u\n",
			cs.DynamicPressureFactor, cs.VelocityFactor, cs.MachFactor, cs.ReynoldsFactor)
		fmt.Fprintf(w, "  α %.2f° → %.3f°, C_l %.4f → %.4f, C_d %.5f → %.5f, C_m¼ %.4f → %.4f\n",
			sec.AlphaDeg, cs.AlphaDeg, sec.CL, cs.CL, sec.CD, cs.CD, sec.CM, cs.CM)
	}
	// The complete model in the ordinary tunnel's closed 2.0 × 1.5 m
	// section (invented readings and chart factors); its volume is
	// 0.010 m³ at 1:12 and scales with the cube of the model's size.
	// The polar run is reduced first (its text printed below) so that the
	// complete model's curvature correction can use its fitted lift slope.
	// The lift slope at the test Mach number: the run's fitted slope (at
	// Ma 0.20) raised by the Prandtl–Glauert factor β(0.20)/β(Ma).
	bRun, bTest := math.Sqrt(1-runMach*runMach), math.Sqrt(1-*mach**mach)
	r.ModelSlope = r.Run.Polar.LiftSlopePerDeg.Value * bRun / bTest
	span := r.Span / *scale
	k := 12 * size / *scale // against the run's 1:12 model of the design
	vol := 0.010 * k * k * k
	m3 := tunnel.Model3D{WingArea: q.New(area, q.Area), TunnelArea: q.New(3.0, q.Area), ModelVolume: q.New(vol, q.Volume),
		ShapeFactor: 0.86, Delta: 0.12, AlphaDeg: 3.0, CL: cruiseCL, CD: 0.035, CM: -0.030,
		CurvatureFactor: 0.12, LiftSlopePerDeg: r.ModelSlope, TailCurvatureFactor: 0.55, TailMomentSlopePerDeg: -0.025, Mach: *mach}
	fmt.Fprintf(w, "\nComplete model at Ma %.2f in a closed 2.0 × 1.5 m section (invented readings; K·τ₁ = %.2f, δ = %.2f, τ₂ read from the charts):\n",
		*mach, m3.ShapeFactor, m3.Delta)
	fmt.Fprintf(w, "  used: test-section cross-section C = %.2f m²; the 1:%g model's reference (wing) area S = %s m², span b = %s m, volume %s m³\n",
		m3.TunnelArea.Value(), *scale, cli.Sig(area, 4), cli.Sig(span, 4), cli.Sig(vol, 3))
	if r.Model, r.ModelErr = tunnel.CorrectWalls3D(m3); r.ModelErr != nil {
		fmt.Fprintf(w, "  not applied: %s\n", libText(r.ModelErr))
	} else {
		c3 := r.Model
		fmt.Fprintf(w, "  ε_sb = %s, ε_wb = %s (β = %.4f); q = %.4f·q_u; α %.2f° → %.3f°, C_L %.4f → %.4f, C_D %.5f → %.5f (ΔC_D,i = %s)\n",
			fig(c3.SolidBlock), fig(c3.WakeBlock), c3.Beta, c3.DynamicPressureFactor, m3.AlphaDeg, c3.AlphaDeg, m3.CL, c3.CL, m3.CD, c3.CD, fig(c3.DeltaCD))
		fmt.Fprintf(w, "  of which streamline curvature (τ₂ = %.2f, a = %.4f/°: the run's fitted %.4f/° at Ma %.2f × β(%.2f)/β(%.2f), Prandtl–Glauert, an estimate):\n",
			m3.CurvatureFactor, m3.LiftSlopePerDeg, r.Run.Polar.LiftSlopePerDeg.Value, runMach, runMach, *mach)
		fmt.Fprintf(w, "    Δα_sc = %s°, ΔC_L = %s, ΔC_m¼ = %s;\n", fig(c3.DeltaAlphaCurvatureDeg), fig(c3.DeltaCLCurvature), fig(c3.DeltaCMCurvature))
		fmt.Fprintf(w, "  tail (τ₂,t = %.2f, ∂C_m/∂α_t = %.3f/°): %s° more angle than free air, ΔC_m = %s; C_m¼ %.4f → %.4f\n",
			m3.TailCurvatureFactor, m3.TailMomentSlopePerDeg, fig(c3.TailAngleDeg), fig(c3.DeltaCMTail), m3.CM, c3.CM)
	}
	fmt.Fprint(w, runText.String())
	fmt.Fprintln(w, "\nSAFETY (each tunnel's cautions; the facility's safety rules and its responsible engineer govern every run):")
	// The ordinary tunnel runs at atmospheric total pressure: its q is
	// set by the Mach number alone, and only the model's size, the test
	// lift coefficient or the balance can change the load.
	o := r.Loads[0]
	fmt.Fprintln(w, "  ordinary tunnel (atmospheric intake, total 288.15 K and 101.325 kPa absolute):")
	if o.Lift > balanceLimit {
		fmt.Fprintf(w, "    - OVERLOAD: the load C·S·q = %s N at q = %s kPa exceeds the rated %s N of the balance, sting or model by %s %%; "+
			"do not run this condition: the intake is at atmospheric pressure, so q is set by the Mach number; use a smaller model (a larger -scale), "+
			"test at a lower lift coefficient, or use a stronger balance, as the responsible engineer decides.\n",
			cli.Sig(o.Lift, 4), cli.Sig(o.Q/1e3, 4), cli.Sig(balanceLimit, 4), cli.Sig(100*(o.Lift/balanceLimit-1), 2))
	} else {
		fmt.Fprintf(w, "    - load: C·S·q = %s N at q = %s kPa is %s %% of the rated %s N; gusts, starting loads and stall buffet add to it.\n",
			cli.Sig(o.Lift, 4), cli.Sig(o.Q/1e3, 4), cli.Sig(100*o.Lift/balanceLimit, 2), cli.Sig(balanceLimit, 4))
	}
	var seen []string
	for _, t := range tunnels {
		fmt.Fprintf(w, "  %s:\n", t.name)
		for _, c := range t.c.Cautions {
			if slices.Contains(seen, c) {
				fmt.Fprintln(w, "    - (as above)", firstWords(c))
				continue
			}
			seen = append(seen, c)
			fmt.Fprintln(w, "    -", c)
		}
	}
	return r, nil
}

// libText is a library error as the report prints it: what was refused
// and why, without the package's name, which means nothing to the reader.
func libText(err error) string {
	var te *tunnel.Error
	if errors.As(err, &te) {
		return te.Op + ": " + te.Message()
	}
	return err.Error()
}

// fig formats a small correction to 3 significant figures, below 0.001
// in powers of ten (7.40e-07), so that none rounds to nothing and the
// figures of one line read alike.
func fig(x float64) string {
	if x != 0 && math.Abs(x) < 1e-3 {
		return strconv.FormatFloat(x, 'e', 2, 64)
	}
	return cli.Sig(x, 3)
}

// limitsText states a tunnel's limits as the finder uses them: total
// temperature and total pressure (absolute), minimum to maximum.
func limitsText(l tunnel.Limits) string {
	return fmt.Sprintf("total %.4g–%.4g K, %.4g–%.4g bar absolute", l.MinTemperature.Value(), l.MaxTemperature.Value(),
		l.MinPressure.Value()/1e5, l.MaxPressure.Value()/1e5)
}

// firstWords returns the start of a caution already printed in full.
func firstWords(s string) string {
	r := []rune(s)
	if len(r) > 60 {
		return string(r[:60]) + "…"
	}
	return s
}
