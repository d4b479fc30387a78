package main

import (
	"fmt"
	"io"
	"math"
	"path/filepath"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Invented double-body test: the underwater hulls and their mirror images
// towed deeply submerged in the same tank (wetted surface 2 × 1.62 m²),
// viscous resistance at four speeds.
var (
	dbSpeeds      = []float64{0.8, 1.2, 1.6, 2.0}         // m/s
	dbResistances = []float64{5.170, 10.63, 17.94, 26.77} // N
)

// Invented self-propulsion test at the resistance runs' speeds (ship
// self-propulsion point): Taylor wake from thrust identity, thrust
// deduction and relative rotative efficiency; the catamaran has one
// propeller per hull, on open shafts.
var (
	spWake = []float64{0.085, 0.083, 0.082, 0.080, 0.078, 0.077, 0.075, 0.074}
	spT    = []float64{0.072, 0.071, 0.070, 0.070, 0.069, 0.068, 0.067, 0.066}
	spEtaR = []float64{0.985, 0.985, 0.984, 0.983, 0.982, 0.981, 0.980, 0.980}
)

// Invented open-water curve of the model propeller (K_T, K_Q with n in
// rev/s) and the ship propeller's geometry.
var (
	openWater = []similarity.OpenWaterPoint{
		{J: 0.2, KT: 0.352, KQ: 0.0520}, {J: 0.4, KT: 0.285, KQ: 0.0455}, {J: 0.6, KT: 0.212, KQ: 0.0380},
		{J: 0.8, KT: 0.135, KQ: 0.0295}, {J: 1.0, KT: 0.052, KQ: 0.0195},
	}
	propeller = similarity.PropellerGeometry{
		Diameter: q.New(1.35, q.Length), Blades: 4, PitchRatio: 0.90,
		Chord: q.New(0.37, q.Length), ThicknessRatio: 0.04, ModelReynolds: 2.0e5,
	}
	transverseArea = 48.0 // m², the ship's projected area above water
)

// Powering holds the second half of the job, for the test.
type Powering struct {
	DoubleBody similarity.DoubleBodyResult
	Wave       []float64 // C_W of the resistance runs with the double-body 1 + k
	Points     []similarity.PoweringResult
	PNG, SVG   string
}

// powering finds the form factor from the double-body test, compares it
// with Prohaska's, and predicts delivered power and revolutions at every
// speed by the ITTC-1978 method with it.
func powering(w io.Writer, test similarity.HullTest, form similarity.ProhaskaResult, dir string) (*Powering, error) {
	tank := test.Tank
	nu, rho := tank.KinematicViscosity.Value(), tank.Density.Value()
	var re, cv []float64
	for i, v := range dbSpeeds {
		re = append(re, v*modelLength/nu)
		cv = append(cv, dbResistances[i]/(0.5*rho*v*v*2*modelArea))
	}
	out := &Powering{}
	var err error
	if out.DoubleBody, err = similarity.FormFactorDoubleBody(re, cv, similarity.LineITTC1957); err != nil {
		return nil, err
	}
	db := out.DoubleBody
	fmt.Fprintf(w, "\nform factor two ways: double body 1 + k = %.3f ± %.3f (spread %.3f, %d runs); Prohaska 1 + k = %.3f ± %.3f; Prohaska − double body = %+.3f\n",
		db.FormFactor, db.StdErr, db.Spread, len(db.PerRun), form.FormFactor, form.FormFactorStdErr, form.FormFactor-db.FormFactor)
	var rem, ctm []float64
	for i, v := range speeds {
		rem = append(rem, v*modelLength/nu)
		ctm = append(ctm, resistances[i]/(0.5*rho*v*v*modelArea))
	}
	if out.Wave, err = similarity.WaveResistance(rem, ctm, db.FormFactor, similarity.LineITTC1957); err != nil {
		return nil, err
	}
	for i := range speeds {
		in := similarity.PoweringInput{
			Scale: test.Scale, ModelLength: test.ModelLength, ModelWettedArea: test.ModelWettedArea,
			ModelSpeed: test.Speeds[i], ModelResistance: test.Resistances[i],
			Tank: test.Tank, Sea: test.Sea, FormFactor: db.FormFactor,
			TransverseArea: q.New(transverseArea, q.Area),
			ModelWake:      spWake[i], ThrustDeduction: spT[i], RelativeRotative: spEtaR[i],
			Propeller: propeller, OpenWater: openWater, Propellers: 2,
		}
		p, err := similarity.ITTC1978(in)
		if err != nil {
			return nil, fmt.Errorf("speed %d: %w", i+1, err)
		}
		out.Points = append(out.Points, p)
	}
	top := out.Points[len(out.Points)-1]
	fmt.Fprintf(w, "\nDelivered power by the ITTC-1978 method, double-body form factor, two propellers (invented self-propulsion and open-water tests):\n")
	fmt.Fprintf(w, "roughness allowance ΔC_F from k_S = 150 µm (%.3f×10⁻³ at the top speed), air C_AAS = %.3f×10⁻³ (A_VS = %g m², C_DA = 0.8), C_A = 0 (the basin's correlation not applied);\n",
		top.RoughnessAllowance*1e3, top.AirResistance*1e3, transverseArea)
	fmt.Fprintf(w, "propeller D = %g m, Z = %d, P/D = %g; scale correction ΔK_T = %.4f, ΔK_Q = %.5f\n",
		propeller.Diameter.Value(), propeller.Blades, propeller.PitchRatio, top.DeltaKT, top.DeltaKQ)
	fmt.Fprint(w, similarity.PoweringTable(out.Points, false))
	if out.PNG, out.SVG, err = plotCoefficients(dir, test, db.FormFactor, out.Points); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "plots: %s, %s\n", out.PNG, out.SVG)
	return out, nil
}

// plotCoefficients draws the model's and the ship's total resistance
// coefficients against the Reynolds number with the friction lines and
// the form-factor line, log scale in Re.
func plotCoefficients(dir string, test similarity.HullTest, k1 float64, pts []similarity.PoweringResult) (string, string, error) {
	pl := plot.New()
	pl.Title.Text = "Catamaran (invented data): resistance coefficients and friction lines"
	pl.X.Label.Text = "Re = VL/ν (log scale)"
	pl.Y.Label.Text = "C × 10³"
	pl.X.Scale = plot.LogScale{}
	pl.X.Tick.Marker = plot.LogTicks{Prec: -1}
	pl.Legend.Top = true
	var model, ship plotter.XYs
	for i, p := range pts {
		model = append(model, plotter.XY{X: p.ModelReynolds, Y: p.ModelCT * 1e3})
		ship = append(ship, plotter.XY{X: p.ShipReynolds, Y: pts[i].ShipCT * 1e3})
	}
	lo, hi := 5e5, 1e9
	lines := []struct {
		name string
		line similarity.FrictionLine
		f    float64
	}{
		{"ITTC-1957", similarity.LineITTC1957, 1}, {fmt.Sprintf("(1 + k)·ITTC-1957, 1 + k = %.3f", k1), similarity.LineITTC1957, k1},
		{"Schoenherr", similarity.LineSchoenherr, 1}, {"Hughes", similarity.LineHughes, 1},
	}
	for k, l := range lines {
		var xy plotter.XYs
		for i := 0; i <= 60; i++ {
			re := lo * math.Pow(hi/lo, float64(i)/60)
			cf, err := l.line.CF(re)
			if err != nil {
				return "", "", err
			}
			xy = append(xy, plotter.XY{X: re, Y: l.f * cf * 1e3})
		}
		ln, err := plotter.NewLine(xy)
		if err != nil {
			return "", "", err
		}
		ln.Dashes = [][]vg.Length{nil, {vg.Points(5), vg.Points(3)}, {vg.Points(1), vg.Points(2)}, {vg.Points(6), vg.Points(2), vg.Points(1), vg.Points(2)}}[k]
		pl.Add(ln)
		pl.Legend.Add(l.name, ln)
	}
	for _, s := range []struct {
		name string
		xy   plotter.XYs
		r    vg.Length
	}{{"model C_TM", model, 3}, {"ship C_TS", ship, 4}} {
		sc, err := plotter.NewScatter(s.xy)
		if err != nil {
			return "", "", err
		}
		sc.GlyphStyle.Radius = vg.Points(float64(s.r))
		pl.Add(sc)
		pl.Legend.Add(s.name, sc)
	}
	png := filepath.Join(dir, "towingtank-coefficients.png")
	svg := filepath.Join(dir, "towingtank-coefficients.svg")
	for _, f := range []string{png, svg} {
		if err := pl.Save(7*vg.Inch, 4.5*vg.Inch, f); err != nil {
			return "", "", err
		}
	}
	return png, svg, nil
}
