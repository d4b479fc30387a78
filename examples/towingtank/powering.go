package main

import (
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/ship"
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
	openWater = []ship.OpenWaterPoint{
		{J: 0.2, KT: 0.352, KQ: 0.0520}, {J: 0.4, KT: 0.285, KQ: 0.0455}, {J: 0.6, KT: 0.212, KQ: 0.0380},
		{J: 0.8, KT: 0.135, KQ: 0.0295}, {J: 1.0, KT: 0.052, KQ: 0.0195},
	}
	propeller = ship.PropellerGeometry{
		Diameter: q.New(1.35, q.Length), Blades: 4, PitchRatio: 0.90,
		Chord: q.New(0.37, q.Length), ThicknessRatio: 0.04, ModelReynolds: 2.0e5,
	}
	transverseArea = 48.0 // m², the ship's projected area above water
)

// Powering holds the second half of the job, for the test.
type Powering struct {
	DoubleBody ship.DoubleBodyResult
	Wave       []float64 // C_W of the resistance runs with the double-body 1 + k
	Points     []ship.PoweringResult
	PNG, SVG   string
}

// doubleBody finds the form factor from the double-body test.
func doubleBody(test ship.HullTest) (ship.DoubleBodyResult, error) {
	nu, rho := test.Tank.KinematicViscosity.Value(), test.Tank.Density.Value()
	var re, cv []float64
	for i, v := range dbSpeeds {
		re = append(re, v*modelLength/nu)
		cv = append(cv, dbResistances[i]/(0.5*rho*v*v*2*modelArea))
	}
	return ship.FormFactorDoubleBody(re, cv, ship.LineITTC1957)
}

// powering predicts delivered power and revolutions at every speed by
// the ITTC-1978 method with the double-body form factor, and plots the
// coefficients.
func powering(w io.Writer, test ship.HullTest, db ship.DoubleBodyResult, size plotSize, dir string) (*Powering, error) {
	tank := test.Tank
	nu, rho := tank.KinematicViscosity.Value(), tank.Density.Value()
	out := &Powering{DoubleBody: db}
	var err error
	var rem, ctm []float64
	for i, v := range speeds {
		rem = append(rem, v*modelLength/nu)
		ctm = append(ctm, resistances[i]/(0.5*rho*v*v*modelArea))
	}
	if out.Wave, err = ship.WaveResistance(rem, ctm, db.FormFactor, ship.LineITTC1957); err != nil {
		return nil, err
	}
	for i := range speeds {
		in := ship.PoweringInput{
			Scale: test.Scale, ModelLength: test.ModelLength, ModelWettedArea: test.ModelWettedArea,
			ModelSpeed: test.Speeds[i], ModelResistance: test.Resistances[i],
			Tank: test.Tank, Sea: test.Sea, FormFactor: db.FormFactor,
			TransverseArea: q.New(transverseArea, q.Area),
			ModelWake:      spWake[i], ThrustDeduction: spT[i], RelativeRotative: spEtaR[i],
			Propeller: propeller, OpenWater: openWater, Propellers: 2,
		}
		p, err := ship.ITTC1978(in)
		if err != nil {
			return nil, fmt.Errorf("speed %d: %w", i+1, err)
		}
		out.Points = append(out.Points, p)
	}
	top := out.Points[len(out.Points)-1]
	fmt.Fprintf(w, "\nDelivered power by the ITTC-1978 method, double-body form factor 1 + k = %.3f, two propellers (invented self-propulsion and open-water tests):\n", db.FormFactor)
	fmt.Fprintf(w, "C_TS = (1 + k)·C_FS + ΔC_F + C_A + C_R + C_AAS on S_ship = %.4g m²: roughness allowance ΔC_F from k_S = 150 µm; C_A from the procedure's\n", test.ModelWettedArea.Value()/(test.Scale*test.Scale))
	fmt.Fprintf(w, "formula (5.68 − 0.6·log₁₀Re_S)·10⁻³, the basin giving none (%.3f×10⁻³ at the top speed); air C_AAS = %.3f×10⁻³ (A_VS = %g m², C_DA = 0.8);\n",
		top.CorrelationAllowance*1e3, top.AirResistance*1e3, transverseArea)
	fmt.Fprintf(w, "twin screws on open shafts: the wake is not scaled, w_TS = w_TM (ITTC-1978); each carries half the thrust in K_T/J²; n is each propeller's rate, P_D the sum over both shafts;\n")
	fmt.Fprintf(w, "propeller D = %g m, Z = %d, P/D = %g, model Re_co = %.3g; C_DM = %.5f, C_DS = %.5f, scale correction ΔK_T = %.4f, ΔK_Q = %.5f\n",
		propeller.Diameter.Value(), propeller.Blades, propeller.PitchRatio, propeller.ModelReynolds, top.ModelBladeDrag, top.ShipBladeDrag, top.DeltaKT, top.DeltaKQ)
	fmt.Fprint(w, ship.PoweringTable(out.Points, false))
	if size.Skip {
		fmt.Fprintln(w, "plots: not written (-plot=false)")
		return out, nil
	}
	if out.PNG, out.SVG, err = plotCoefficients(dir, db.FormFactor, out.Points, size); err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "plots: %s, %s (%g × %g in, PNG at %d dpi)\n", out.PNG, out.SVG, size.W, size.H, size.DPI)
	return out, nil
}

// plotSize is the plot's size in inches and the PNG's resolution; Skip
// writes no plot.
type plotSize struct {
	W, H float64
	DPI  int
	Skip bool
}

// plotCoefficients draws the model's and the ship's total resistance
// coefficients against the Reynolds number with three friction lines and
// the form-factor line, log scale in Re; every series has its own marker
// and colour, the axes are padded so no point is clipped, and subscripts
// are set as subscripts.
func plotCoefficients(dir string, k1 float64, pts []ship.PoweringResult, size plotSize) (string, string, error) {
	pl := plot.New()
	// The legend sets "_{…}" as a subscript (C_TM, C_TS).
	pl.Legend.TextStyle.Handler = subText{text.Plain{Fonts: font.DefaultCache}}
	pl.Title.Text = "Catamaran (invented data): resistance coefficients and friction lines"
	pl.X.Label.Text = "Reynolds number Re = VL/ν (log scale)"
	pl.Y.Label.Text = "C × 10³"
	pl.X.Scale = plot.LogScale{}
	pl.X.Tick.Marker = plot.LogTicks{Prec: -1}
	pl.Legend.Top = true
	var model, full plotter.XYs
	for _, p := range pts {
		model = append(model, plotter.XY{X: p.ModelReynolds, Y: p.ModelCT * 1e3})
		full = append(full, plotter.XY{X: p.ShipReynolds, Y: p.ShipCT * 1e3})
	}
	lo, hi := 5e5, 1e9
	ymax := 0.0
	lines := []struct {
		name string
		line ship.FrictionLine
		f    float64
	}{
		{"ITTC-1957", ship.LineITTC1957, 1}, {fmt.Sprintf("(1 + k)·ITTC-1957, 1 + k = %.3f", k1), ship.LineITTC1957, k1},
		{"Schoenherr", ship.LineSchoenherr, 1}, {"Hughes", ship.LineHughes, 1},
	}
	glyphs := []draw.GlyphDrawer{draw.BoxGlyph{}, draw.CrossGlyph{}, draw.PlusGlyph{}, draw.SquareGlyph{}, draw.RingGlyph{}, draw.PyramidGlyph{}}
	for k, l := range lines {
		var xy, marks plotter.XYs
		for i := 0; i <= 60; i++ {
			re := lo * math.Pow(hi/lo, float64(i)/60)
			cf, err := l.line.CF(re)
			if err != nil {
				return "", "", err
			}
			xy = append(xy, plotter.XY{X: re, Y: l.f * cf * 1e3})
			ymax = math.Max(ymax, l.f*cf*1e3)
			if i%10 == 5 {
				marks = append(marks, xy[len(xy)-1])
			}
		}
		ln, err := plotter.NewLine(xy)
		if err != nil {
			return "", "", err
		}
		ln.Color = plotutil.Color(k)
		ln.Dashes = [][]vg.Length{nil, {vg.Points(5), vg.Points(3)}, {vg.Points(1), vg.Points(2)}, {vg.Points(6), vg.Points(2), vg.Points(1), vg.Points(2)}}[k]
		sc, err := plotter.NewScatter(marks)
		if err != nil {
			return "", "", err
		}
		sc.GlyphStyle = draw.GlyphStyle{Shape: glyphs[k], Color: ln.Color, Radius: vg.Points(2.5)}
		pl.Add(ln, sc)
		pl.Legend.Add(l.name, ln, sc)
	}
	for k, s := range []struct {
		name string
		xy   plotter.XYs
	}{{"model C_{TM} (measured)", model}, {"ship C_{TS} (ITTC-1978)", full}} {
		sc, err := plotter.NewScatter(s.xy)
		if err != nil {
			return "", "", err
		}
		sc.GlyphStyle = draw.GlyphStyle{Shape: glyphs[4+k], Color: plotutil.Color(4 + k), Radius: vg.Points(3.5)}
		for _, p := range s.xy {
			ymax = math.Max(ymax, p.Y)
		}
		pl.Add(sc)
		pl.Legend.Add(s.name, sc)
	}
	// Room for every marker and for the legend above the data: the
	// x range spans the lines and every point with a margin, the y range
	// starts at zero and leaves the top third for the legend.
	xmin, xmax := lo, hi
	for _, p := range append(append(plotter.XYs{}, model...), full...) {
		xmin, xmax = math.Min(xmin, p.X), math.Max(xmax, p.X)
	}
	pl.X.Min, pl.X.Max = xmin/1.5, xmax*1.5
	pl.Y.Min, pl.Y.Max = 0, ymax*1.6
	png := filepath.Join(dir, "towingtank-coefficients.png")
	svg := filepath.Join(dir, "towingtank-coefficients.svg")
	w, h := vg.Length(size.W)*vg.Inch, vg.Length(size.H)*vg.Inch
	c := vgimg.NewWith(vgimg.UseWH(w, h), vgimg.UseDPI(size.DPI))
	pl.Draw(draw.New(c))
	if err := writeTo(png, vgimg.PngCanvas{Canvas: c}); err != nil {
		return "", "", err
	}
	if err := pl.Save(w, h, svg); err != nil {
		return "", "", err
	}
	return png, svg, nil
}

// writeTo writes the canvas to the named file.
func writeTo(name string, c io.WriterTo) error {
	f, err := os.Create(name)
	if err != nil {
		return err
	}
	if _, err := c.WriteTo(f); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}
