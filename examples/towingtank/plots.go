package main

import (
	"fmt"
	"math"
	"path/filepath"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"similis.dev/similis/examples/internal/plotstyle"
	"similis.dev/similis/similarity/ship"
)

// plotOpenWater draws the open-water curves: the measured K_T, 10K_Q and
// η₀ of every run as markers, each with its own shape and colour, and
// the faired curves as lines over the measured J range only (the fit is
// not extrapolated). The title carries the caution: the curves feed a
// hull's powering prediction, an estimate.
func plotOpenWater(dir string, ow *ship.OpenWaterFit, size plotSize) (string, string, error) {
	pl := plot.New()
	sub := plotstyle.Subscripts{Plain: text.Plain{Fonts: font.DefaultCache}, BracedOnly: true}
	pl.Legend.TextStyle.Handler = sub
	pl.X.Label.TextStyle.Handler = sub
	pl.Title.Text = "Model propeller open-water curves, faired by polynomials in J (invented data)\nCAUTION: powering from these is an estimate for the responsible naval architect"
	pl.X.Label.Text = "advance ratio J = V_{A}/(nD), n in rev/s"
	pl.Y.Label.TextStyle.Handler = sub
	pl.Y.Label.Text = "K_{T}, 10 K_{Q}, η_{0}"
	pl.Legend.Top = true
	pl.Legend.Left = false
	pl.X.Tick.Marker, pl.Y.Tick.Marker = plotstyle.LinearTicks{}, plotstyle.LinearTicks{}
	glyphs := []draw.GlyphDrawer{draw.CircleGlyph{}, draw.TriangleGlyph{}, draw.SquareGlyph{}}
	dashes := [][]vg.Length{nil, {vg.Points(5), vg.Points(3)}, {vg.Points(1), vg.Points(2)}}
	series := []struct {
		name string
		pt   func(ship.OpenWaterReduced) float64
		fair func(j float64) float64
	}{
		{"K_{T}", func(p ship.OpenWaterReduced) float64 { return p.KT }, ow.KT.Eval},
		{"10 K_{Q}", func(p ship.OpenWaterReduced) float64 { return 10 * p.KQ }, func(j float64) float64 { return 10 * ow.KQ.Eval(j) }},
		{"η_{0}", func(p ship.OpenWaterReduced) float64 { return p.Eta0 }, func(j float64) float64 { e, _ := ow.Eta0(j); return e }},
	}
	for k, s := range series {
		var meas, fair plotter.XYs
		for _, p := range ow.Points {
			meas = append(meas, plotter.XY{X: p.J, Y: s.pt(p)})
		}
		for i := 0; i <= 80; i++ {
			j := ow.JMin + (ow.JMax-ow.JMin)*float64(i)/80
			fair = append(fair, plotter.XY{X: j, Y: s.fair(j)})
		}
		ln, err := plotter.NewLine(fair)
		if err != nil {
			return "", "", err
		}
		ln.Color = plotutil.Color(k)
		ln.Dashes = dashes[k]
		sc, err := plotter.NewScatter(meas)
		if err != nil {
			return "", "", err
		}
		sc.GlyphStyle = draw.GlyphStyle{Shape: glyphs[k], Color: ln.Color, Radius: vg.Points(3)}
		pl.Add(ln, sc)
		pl.Legend.Add(s.name+" measured, faired", ln, sc)
	}
	pl.X.Min, pl.X.Max = 0, 1.1
	pl.Y.Min, pl.Y.Max = 0, 1.0
	png := filepath.Join(dir, "towingtank-openwater.png")
	svg := filepath.Join(dir, "towingtank-openwater.svg")
	for _, path := range []string{png, svg} {
		if err := plotstyle.Save(pl, path, size.W, size.H, float64(size.DPI)); err != nil {
			return "", "", err
		}
	}
	return png, svg, nil
}

// plotCoefficients draws the model's and the ship's total resistance
// coefficients against the Reynolds number with three friction lines and
// the form-factor line, log scale in Re; every series has its own marker
// and colour, the axes are padded so no point is clipped, and subscripts
// are set as subscripts.
func plotCoefficients(dir string, k1 float64, pts []ship.PoweringResult, size plotSize) (string, string, error) {
	pl := plot.New()
	// The legend sets "_{…}" as a subscript (C_TM, C_TS).
	pl.Legend.TextStyle.Handler = plotstyle.Subscripts{Plain: text.Plain{Fonts: font.DefaultCache}, BracedOnly: true}
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
	for _, path := range []string{png, svg} {
		if err := plotstyle.Save(pl, path, size.W, size.H, float64(size.DPI)); err != nil {
			return "", "", err
		}
	}
	return png, svg, nil
}
