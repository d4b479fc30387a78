package main

import (
	"fmt"
	"io"
	"math"
	"strings"

	"similis.dev/similis/examples/internal/cli"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// Invented double-body test: the underwater hulls and their mirror images
// towed deeply submerged in the same tank (wetted surface 2 × 1.62 m²),
// viscous resistance at four speeds.
var (
	dbSpeeds      = []float64{0.8, 1.2, 1.6, 2.0}         // m/s
	dbResistances = []float64{5.170, 10.63, 17.94, 26.77} // N
)

// Invented open-water test of the model propeller (D = 84.375 mm,
// c_0.7 = 28.125 mm, c_0.75 = 28.75 mm; at 1:16 the ship's 1.35 m
// propeller with chords 0.45 m and 0.46 m), run at n = 45 rev/s over a
// range of carriage speeds: V_A in m/s, thrust T in N and torque Q in
// N·m, net of the idle hub values. The model propeller, like the model
// hull, is the physical object: -scale changes the ship and its
// propeller (D_S = D_M/λ), never the model's readings.
var (
	modelPropD = 1.35 / 16 // m
	owRevs     = 45.0      // rev/s
	owRuns     = [][3]float64{
		{0.380, 38.13, 0.4515}, {0.759, 34.74, 0.4295}, {1.139, 31.51, 0.4017}, {1.519, 28.01, 0.3721}, {1.898, 24.06, 0.3427},
		{2.278, 20.00, 0.3085}, {2.658, 15.94, 0.2740}, {3.038, 11.48, 0.2357}, {3.417, 6.86, 0.1972}, {3.797, 2.06, 0.1562},
	}
	modelChord07, modelChord075 = 0.45 / 16, 0.46 / 16 // m
)

// Invented self-propulsion test, two propellers (one per demihull, on
// open shafts), at five model speeds. The hull's invented behaviour is
// given as its factors, each with its own scatter: the Taylor wake
// fraction w_TM, the thrust deduction t and η_R. The readings of the
// test (n, each propeller's T and Q, and the towing force F_D the
// carriage applied) are made from them for the chosen scale by
// spReadings, because the self-propulsion point, through F_D, depends
// on the ship's Reynolds number and so on the scale.
var (
	spSpeeds  = []float64{1.00, 1.30, 1.60, 2.00, 2.40} // V_M, m/s
	spFactors = [][3]float64{                           // w_TM, t, η_R
		{0.0826, 0.0694, 0.9834}, {0.0794, 0.0747, 0.9827}, {0.0771, 0.0677, 0.9827},
		{0.0788, 0.0664, 0.9807}, {0.0760, 0.0689, 0.9820},
	}
)

// spReading is one self-propulsion run as the carriage's instruments
// read it: V_M (m/s), n (rev/s), each propeller's T (N) and Q (N·m), and
// the towing force F_D (N) applied.
type spReading struct{ V, N, T, Q, FD float64 }

// spReadings makes the self-propulsion runs' readings at the ship's
// self-propulsion point for the scale in base: F_D as the procedure
// computes it (rounded to the 0.01 N the carriage sets), each
// propeller's thrust T = (R_TM − F_D)/(2(1 − t)) with R_TM from the
// faired resistance curve, J_TM where the faired open-water K_T(J)
// equals T·J²/(ρV_A²D²) with V_A = (1 − w_TM)V_M, n = V_A/(J_TM·D), and
// Q = K_Q(J_TM)·ρn²D⁵/η_R; n, T and Q rounded to the instruments'
// resolution (0.01 rev/s, 1 mN, 0.01 mN·m).
func spReadings(base ship.PoweringInput, ow *ship.OpenWaterFit, rf *ship.ResistanceFit, rho float64) ([]spReading, []ship.SkinFriction, error) {
	round := func(x, step float64) float64 { return math.Round(x/step) * step }
	d := modelPropD
	var out []spReading
	var fds []ship.SkinFriction
	for i, v := range spSpeeds {
		w, t, er := spFactors[i][0], spFactors[i][1], spFactors[i][2]
		in := base
		in.ModelSpeed = q.New(v, q.Velocity)
		fd, err := ship.SkinFrictionCorrection(in)
		if err != nil {
			return nil, nil, err
		}
		rt, _, err := rf.At(in.ModelSpeed)
		if err != nil {
			return nil, nil, err
		}
		r := spReading{V: v, FD: round(fd.Force.Value(), 0.01)}
		th := (rt.Value() - r.FD) / (2 * (1 - t))
		va := (1 - w) * v
		c := th / (rho * va * va * d * d)
		lo, hi := ow.JMin, ow.JMax
		g := func(j float64) float64 { return ow.KT.Eval(j) - c*j*j }
		if !(g(lo) > 0 && g(hi) < 0) {
			return nil, nil, fmt.Errorf("self-propulsion run %d at scale 1:%.4g: the thrust %.4g N per propeller lies outside the open-water curve", i+1, 1/base.Scale, th)
		}
		for range 100 {
			if m := (lo + hi) / 2; g(m) > 0 {
				lo = m
			} else {
				hi = m
			}
		}
		j := (lo + hi) / 2
		r.N = round(va/(j*d), 0.01)
		r.T = round(th, 0.001)
		r.Q = round(ow.KQ.Eval(j)*rho*r.N*r.N*math.Pow(d, 5)/er, 1e-5)
		out = append(out, r)
		fds = append(fds, fd)
	}
	return out, fds, nil
}

// The ship propeller's geometry (invented; the model propeller's times
// the scale) and the ship's projected area above water, 48 m² at 1:16
// and scaled with the ship's length squared.
var (
	propellerBlades, propellerPitch, propellerThickness = 4, 0.90, 0.04
	transverseArea16                                    = 48.0 // m², at 1:16
)

// shipKnots returns the ship speeds of the speed–power curve: round
// knots inside the self-propulsion test's range of model speeds carried
// to the ship at equal Froude number, at most six, the step the
// smallest of 0.5, 1, 2, 5, 10 kn that keeps to six.
func shipKnots(scale float64) []float64 {
	toKn := math.Sqrt(scale) * 3600 / 1852
	lo, hi := spSpeeds[0]*toKn, spSpeeds[len(spSpeeds)-1]*toKn
	var out []float64
	for _, step := range []float64{0.5, 1, 2, 5, 10} {
		a, b := math.Ceil(lo/step), math.Floor(hi/step)
		if b-a+1 <= 6 {
			for k := a; k <= b; k++ {
				out = append(out, k*step)
			}
			return out
		}
	}
	return out
}

// Powering holds the second half of the job, for the test.
type Powering struct {
	DoubleBody   ship.DoubleBodyResult
	Wave         []float64 // C_W of the resistance runs with the double-body 1 + k
	OpenWater    *ship.OpenWaterFit
	Resistance   *ship.ResistanceFit
	SkinFriction []ship.SkinFriction // F_D at each self-propulsion speed
	Runs         []spReading         // the self-propulsion readings made for the scale
	ShipKnots    []float64           // the speed–power curve's ship speeds, kn
	Propeller    ship.PropellerGeometry
	SpeedPower   *ship.SpeedPower
	Points       []ship.PoweringResult // the speed–power curve's points
	PNG, SVG     string                // resistance coefficients
	OWPNG, OWSVG string                // open-water curves
}

// doubleBody finds the form factor from the double-body test's
// resistances dbR at dbSpeeds.
func doubleBody(test ship.HullTest, dbR []float64) (ship.DoubleBodyResult, error) {
	nu, rho := test.Tank.KinematicViscosity.Value(), test.Tank.Density.Value()
	var re, cv []float64
	for i, v := range dbSpeeds {
		re = append(re, v*modelLength/nu)
		cv = append(cv, dbR[i]/(0.5*rho*v*v*2*modelArea))
	}
	return ship.FormFactorDoubleBody(re, cv, ship.LineITTC1957)
}

// openWaterTest is the invented open-water test in the tank's water,
// with its runs' readings.
func openWaterTest(tank fluids.State, runs [][3]float64) ship.OpenWaterTest {
	t := ship.OpenWaterTest{Diameter: q.New(modelPropD, q.Length), Chord: q.New(modelChord07, q.Length), Water: tank}
	for _, r := range runs {
		t.Runs = append(t.Runs, ship.OpenWaterRun{Speed: q.New(r[0], q.Velocity), RevsPerSecond: owRevs,
			Thrust: q.New(r[1], q.Force), Torque: q.New(r[2], q.Torque)})
	}
	return t
}

// powering reduces the open-water test, fairs the resistance test,
// analyses the self-propulsion test by thrust identity and predicts the
// ship's speed–power curve by the ITTC-1978 method with the double-body
// form factor, and plots the coefficients and the open-water curves.
func powering(w io.Writer, test ship.HullTest, db ship.DoubleBodyResult, rd readings, size plotSize, dir string) (*Powering, error) {
	tank := test.Tank
	nu, rho := tank.KinematicViscosity.Value(), tank.Density.Value()
	out := &Powering{DoubleBody: db}
	var err error
	var rem, ctm []float64
	for i, v := range speeds {
		rem = append(rem, v*modelLength/nu)
		ctm = append(ctm, rd.Resistances[i]/(0.5*rho*v*v*modelArea))
	}
	if out.Wave, err = ship.WaveResistance(rem, ctm, db.FormFactor, ship.LineITTC1957); err != nil {
		return nil, err
	}
	scale := test.Scale
	dm := modelPropD
	propeller := ship.PropellerGeometry{
		Diameter: q.New(dm/scale, q.Length), Blades: propellerBlades, PitchRatio: propellerPitch,
		Chord: q.New(modelChord075/scale, q.Length), ThicknessRatio: propellerThickness,
	}
	transverseArea := transverseArea16 * math.Pow(1/(16*scale), 2)

	// 1. Open-water test.
	owt := openWaterTest(tank, rd.OpenWater)
	if out.OpenWater, err = ship.ReduceOpenWater(owt); err != nil {
		return nil, err
	}
	ow := out.OpenWater
	fmt.Fprintf(w, "\nOpen-water test of the model propeller (invented runs; ITTC 7.5-02-03-02.1): D = %.4g mm, c_0.7 = %.3g mm, n = %g rev/s, fresh water ρ = %.2f kg/m³\n",
		1e3*dm, 1e3*modelChord07, owRevs, rho)
	fmt.Fprintf(w, "J = V_A/(nD), K_T = T/(ρn²D⁴), 10K_Q = 10·Q/(ρn²D⁵), η₀ = J·K_T/(2π·K_Q) with n in rev/s; Re_0.7 = c_0.7·√(V_A² + (0.7πnD)²)/ν\n")
	fmt.Fprintf(w, "%8s %8s %9s | %6s %7s %7s %6s %9s | %8s %8s %6s\n", "V_A m/s", "T N", "Q N·m", "J", "K_T", "10K_Q", "η₀", "Re_0.7", "K_T fair", "10K_Q fr", "η₀ fr")
	for _, p := range ow.Points {
		f, _ := ow.At(p.J)
		e, _ := ow.Eta0(p.J)
		var run [3]float64
		for _, r := range rd.OpenWater {
			if math.Abs(r[0]/(owRevs*dm)-p.J) < 1e-12 {
				run = r
			}
		}
		fmt.Fprintf(w, "%8.3f %8.2f %9.4f | %6.3f %7.4f %7.4f %6.3f %9.3g | %8.4f %8.4f %6.3f\n", run[0], run[1], run[2], p.J, p.KT, 10*p.KQ, p.Eta0, p.Reynolds, f.KT, 10*f.KQ, e)
	}
	for _, c := range []struct {
		name string
		f    *fit.Poly
		k    float64
	}{{"K_T", ow.KT, 1}, {"10K_Q", ow.KQ, 10}} {
		a, se, err := c.f.Power()
		if err != nil {
			return nil, err
		}
		fmt.Fprintf(w, "faired %s = %s; order %d (%s), S = %s, %d runs (± standard errors)\n", c.name, polyText(a, se, c.k), c.f.Order,
			strings.Join(c.f.Notes, "; "), cli.Sig(c.k*c.f.S, 2), c.f.N)
	}
	jop := 0.6
	kt06, _ := ow.KT.Predict(jop)
	kq06, _ := ow.KQ.Predict(jop)
	fmt.Fprintf(w, "at J = %.1f: K_T = %.4f (95 %% confidence of the mean %.4f … %.4f), 10K_Q = %.4f (%.4f … %.4f)\n", jop,
		kt06.Y, kt06.Mean[0], kt06.Mean[1], 10*kq06.Y, 10*kq06.Mean[0], 10*kq06.Mean[1])
	if ow.Warning != "" {
		fmt.Fprintf(w, "WARNING (open water): %s\n", ow.Warning)
	} else {
		fmt.Fprintf(w, "Re_0.7 = %.3g … %.3g, above the usual minimum %.0e (ITTC 7.5-02-03-02.1; from memory)\n", ow.MinReynolds, ow.MaxReynolds, ship.UsualOpenWaterReynolds)
	}
	prop := propeller
	if prop.ModelReynolds, err = ship.PropellerReynolds(q.New(modelChord075, q.Length), q.New(jop*owRevs*dm, q.Velocity), owRevs, q.New(dm, q.Length), 0.75, tank.KinematicViscosity); err != nil {
		return nil, err
	}

	// 2. Resistance curve.
	if out.Resistance, err = ship.FairResistance(test, 0); err != nil {
		return nil, err
	}
	rf := out.Resistance
	fmt.Fprintf(w, "\nResistance test faired: C_TM against V_M by a polynomial of order %d (%s), S = %s×10⁻³ on C_TM\n",
		rf.CT.Order, strings.Join(rf.CT.Notes, "; "), cli.Sig(1e3*rf.CT.S, 2))
	if rf.Warning != "" {
		fmt.Fprintf(w, "WARNING (resistance): %s\n", rf.Warning)
	}

	// 3. Self-propulsion test.
	base := ship.PoweringInput{
		Scale: scale, ModelLength: test.ModelLength, ModelWettedArea: test.ModelWettedArea,
		Tank: test.Tank, Sea: test.Sea, FormFactor: db.FormFactor,
		TransverseArea: q.New(transverseArea, q.Area), Propeller: prop, Propellers: 2,
	}
	spt := ship.SelfPropulsionTest{Diameter: q.New(dm, q.Length), Water: tank, OpenWater: ow, Resistance: rf, Propellers: 2}
	runs, fds, err := spReadings(base, ow, rf, rho)
	if err != nil {
		return nil, err
	}
	out.Runs, out.SkinFriction, out.Propeller = runs, fds, prop
	for _, r := range runs {
		spt.Runs = append(spt.Runs, ship.SelfPropulsionRun{ModelSpeed: q.New(r.V, q.Velocity), RevsPerSecond: r.N,
			Thrust: q.New(r.T, q.Force), Torque: q.New(r.Q, q.Torque), TowingForce: q.New(r.FD, q.Force)})
	}
	var ships []q.Quantity
	out.ShipKnots = shipKnots(1 / scale)
	for _, k := range out.ShipKnots {
		ships = append(ships, q.New(k*1852.0/3600, q.Velocity))
	}
	if out.SpeedPower, err = ship.PredictSpeedPower(ship.SpeedPowerInput{Base: base, SelfPropulsion: spt, ShipSpeeds: ships}); err != nil {
		return nil, err
	}
	sp := out.SpeedPower
	fmt.Fprintf(w, "\nSelf-propulsion test (invented runs), two propellers, analysed by thrust identity (ITTC 7.5-02-03-01.1 and 01.4):\n")
	fmt.Fprintf(w, "K_TM → J_TM on the faired K_T; w_TM = 1 − J_TM·nD/V_M; t = (2T + F_D − R_TM)/(2T); η_R = K_Q0/K_QM; η_H = (1 − t)/(1 − w_TM); η_D = η_H·η₀·η_R\n")
	fmt.Fprintf(w, "F_D = ½ρV_M²S_M[(1 + k)(C_FM − C_FS) − ΔC_F − C_A] with 1 + k = %.3f and C_A from the procedure's formula; R_TM from the faired resistance curve\n", db.FormFactor)
	fmt.Fprintf(w, "readings made for the ship's self-propulsion point at 1:%.4g from the hull's invented w_TM, t and η_R; Re_0.7 = c_0.7·√(V_A² + (0.7πnD)²)/ν, V_A = J_TM·nD\n", 1/scale)
	fmt.Fprintf(w, "%7s %7s %7s %8s %7s %8s %7s | %6s %6s %6s %7s %6s %6s %6s %6s %8s\n", "V_M m/s", "n rev/s", "T N", "Q N·m", "F_D N", "F_D calc", "R_TM N",
		"K_TM", "10K_QM", "J_TM", "w_TM", "t", "η_R", "η_H", "η_D", "Re_0.7")
	for i, p := range sp.Factors {
		r := runs[i]
		fmt.Fprintf(w, "%7.2f %7.2f %7.3f %8.5f %7.2f %8.2f %7.3f | %6.4f %6.4f %6.4f %7.4f %6.4f %6.4f %6.4f %6.4f %8.2e\n", r.V, r.N, r.T, r.Q, r.FD,
			out.SkinFriction[i].Force.Value(), p.Resistance, p.KT, 10*p.KQ, p.J, p.Wake, p.ThrustDeduction, p.RelativeRotative, p.EtaH, p.EtaD, p.Reynolds)
	}
	seen := map[string]bool{}
	for _, p := range sp.Factors {
		if p.Warning != "" {
			line := "WARNING: " + p.Warning
			seen[line] = true
			fmt.Fprintln(w, line)
		}
	}
	for _, c := range []struct {
		name string
		f    *fit.Poly
	}{{"w_TM", sp.Wake}, {"t", sp.Thrust}, {"η_R", sp.EtaR}} {
		fmt.Fprintf(w, "%s faired against V_M: order %d (%s), S = %s\n", c.name, c.f.Order, strings.Join(c.f.Notes, "; "), cli.Sig(c.f.S, 2))
	}

	// 4. Speed–power curve.
	out.Points = nil
	for _, p := range sp.Points {
		out.Points = append(out.Points, p.PoweringResult)
	}
	top := out.Points[len(out.Points)-1]
	fmt.Fprintf(w, "\nDelivered power by the ITTC-1978 method, double-body form factor 1 + k = %.3f, two propellers, from the faired tests:\n", db.FormFactor)
	fmt.Fprintf(w, "the speed–power result uses this 1 + k = %.3f (the double-body test measures the viscous resistance directly; the basin's choice)\n", db.FormFactor)
	fmt.Fprintf(w, "with the ITTC-1978 allowances ΔC_F and C_A below; the ITTC-1957 tables above use Prohaska's 1 + k = %.3f and the -ca allowance,\n", test.FormFactor)
	fmt.Fprintf(w, "which lumps roughness and correlation for that method only; the two form factors' difference is a source in the budget above\n")
	fmt.Fprintf(w, "C_TS = (1 + k)·C_FS + ΔC_F + C_A + C_R + C_AAS on S_ship = %.4g m²: roughness allowance ΔC_F from k_S = 150 µm; the basin has no\n", test.ModelWettedArea.Value()/(test.Scale*test.Scale))
	caNote := ""
	if top.CorrelationAllowance < 0 {
		caNote = ", negative: the formula used beyond its range, see the WARNING below the table"
	}
	fmt.Fprintf(w, "ITTC-1978 correlation allowance of its own, so C_A is the procedure's formula (5.68 − 0.6·log₁₀Re_S)·10⁻³ (%.3f×10⁻³ at the top speed%s);\n",
		top.CorrelationAllowance*1e3, caNote)
	fmt.Fprintf(w, "air C_AAS = %.3f×10⁻³ (A_VS = %.3g m², C_DA = 0.8);\n", top.AirResistance*1e3, transverseArea)
	fmt.Fprintf(w, "wake: one propeller behind each demihull on an open shaft with a strut, so the procedure's twin-screw rule is applied, w_TS = w_TM\n")
	fmt.Fprintf(w, "(ITTC 7.5-02-03-01.4, the wake not scaled; from memory): the screw works clear of the thick stern boundary layer that the\n")
	fmt.Fprintf(w, "single-screw scaling corrects for (the basin may choose otherwise for a catamaran); each propeller carries half the thrust\n")
	fmt.Fprintf(w, "in K_T/J²; n is each propeller's rate, P_D the sum over both shafts;\n")
	fmt.Fprintf(w, "propeller D = %s m, Z = %d, P/D = %g, model Re_co = %.3g (0.75R, the open-water test at J = %.1f); C_DM = %.5f, C_DS = %.5f, scale correction ΔK_T = %.4f, ΔK_Q = %.5f\n",
		cli.Sig(propeller.Diameter.Value(), 4), propeller.Blades, propeller.PitchRatio, prop.ModelReynolds, jop, top.ModelBladeDrag, top.ShipBladeDrag, top.DeltaKT, top.DeltaKQ)
	printOnce(w, seen, ship.PoweringTable(out.Points, false))
	fmt.Fprintln(w)
	printOnce(w, seen, sp.Table(false))
	if size.Skip {
		fmt.Fprintln(w, "plots: not written (-plot=false)")
		return out, nil
	}
	if out.PNG, out.SVG, err = plotCoefficients(dir, db.FormFactor, out.Points, size); err != nil {
		return nil, err
	}
	if out.OWPNG, out.OWSVG, err = plotOpenWater(dir, ow, size); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "plots: %s, %s, %s, %s (%g × %g in, PNG at %d dpi)\n", out.PNG, out.SVG, out.OWPNG, out.OWSVG, size.W, size.H, size.DPI)
	return out, nil
}

// polyText writes the polynomial with coefficients k·a[i] and standard
// errors k·se[i] as a sum the way it is read: the constant first, each
// term with its sign as the operator, J and its powers as superscripts,
// every standard error in parentheses after its coefficient, all to five
// decimals: 0.40041(±0.00100) − 0.28161(±0.00416)·J − 0.09872(±0.00368)·J².
func polyText(a, se []float64, k float64) string {
	var sb strings.Builder
	for i := range a {
		c := k * a[i]
		switch {
		case i == 0 && c < 0:
			sb.WriteString("−")
		case i > 0 && c < 0:
			sb.WriteString(" − ")
		case i > 0:
			sb.WriteString(" + ")
		}
		fmt.Fprintf(&sb, "%.5f(±%.5f)", math.Abs(c), k*se[i])
		switch i {
		case 0:
		case 1:
			sb.WriteString("·J")
		default:
			sb.WriteString("·J" + cli.Superscript(i))
		}
	}
	return sb.String()
}

// plotSize is the plot's size in inches and the PNG's resolution; Skip
// writes no plot.
type plotSize struct {
	W, H float64
	DPI  int
	Skip bool
}

// printOnce writes text line by line, leaving out a WARNING or CAUTION
// line already written (the tables of one report repeat them) and
// remembering the ones it writes.
func printOnce(w io.Writer, seen map[string]bool, text string) {
	for _, line := range strings.SplitAfter(text, "\n") {
		key := strings.TrimSuffix(line, "\n")
		if strings.HasPrefix(key, "WARNING") || strings.HasPrefix(key, "CAUTION") {
			if seen[key] {
				continue
			}
			seen[key] = true
		}
		fmt.Fprint(w, line)
	}
}
