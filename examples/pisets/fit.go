package main

import (
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"

	"similis.dev/similis/examples/internal/plotstyle"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// maxFitRows bounds the rows a -fit keeps in memory (two float64 per
// group per row).
const maxFitRows = 1_000_000

// fitRows collects the rows a fit can use: every group finite and
// positive. The others are counted, never silently dropped.
type fitRows struct {
	y        []float64
	x        [][]float64
	excluded int
}

func (f *fitRows) add(g [][]float64, n int) error {
	if f.x == nil {
		f.x = make([][]float64, len(g)-1)
	}
rows:
	for i := range n {
		for k := range g {
			if v := g[k][i]; !(v > 0) || math.IsInf(v, 0) {
				f.excluded++
				continue rows
			}
		}
		if len(f.y) == maxFitRows {
			return &usageError{fmt.Sprintf("-fit keeps at most %d rows in memory; reduce the file in parts or fit a sample", maxFitRows)}
		}
		f.y = append(f.y, g[0][i])
		for k := range f.x {
			f.x[k] = append(f.x[k], g[k+1][i])
		}
	}
	return nil
}

// reportFit fits the first group (the dependent one) as a power law of
// the others and writes the law with its intervals to log. Logged rows
// are treated as correlated: the intervals use the effective number of
// rows from the residuals' lag-1 autocorrelation.
func reportFit(f *fitRows, groups []pigroups.Group, log io.Writer) (*pigroups.PowerLaw, error) {
	names := make([]string, len(groups))
	for g, gr := range groups {
		names[g] = gr.Name
	}
	law, err := pigroups.FitPowerLaw(f.y, f.x, &pigroups.FitOptions{Names: names, Correlated: true, Groups: groups})
	if err != nil {
		return nil, &dataError{fmt.Errorf("-fit: %w", err)}
	}
	var sb strings.Builder
	fmt.Fprintf(&sb, "%s = %.6g", names[0], law.C)
	for k, a := range law.Exponents {
		fmt.Fprintf(&sb, "·%s^%.4g", names[k+1], a)
	}
	fmt.Fprintf(log, "pisets: fit (least squares on logarithms, %d rows, %d excluded as not positive or missing): %s\n", law.N, f.excluded, sb.String())
	fmt.Fprintf(log, "pisets: fit: rows taken as correlated: residual lag-1 autocorrelation r₁ = %.3f, effective rows n_eff = n(1 − r₁)/(1 + r₁) = %.1f of %d (n when r₁ ≤ 0)\n", law.R1, law.NEff, law.N)
	fmt.Fprintf(log, "pisets: fit: C in [%.6g, %.6g] at %g %%", law.CInterval[0], law.CInterval[1], 100*law.Level)
	for k, iv := range law.Intervals {
		fmt.Fprintf(log, "; exponent of %s in [%.4g, %.4g]", names[k+1], iv[0], iv[1])
	}
	fmt.Fprintf(log, "; R² (log) %.4f; valid for", law.R2)
	for k, r := range law.Ranges {
		fmt.Fprintf(log, " %.4g ≤ %s ≤ %.4g", r[0], names[k+1], r[1])
	}
	fmt.Fprintln(log)
	fmt.Fprintf(log, "pisets: fit: %s\n", law.Runs)
	for _, w := range law.Warnings {
		fmt.Fprintf(log, "pisets: fit: WARNING: %s\n", w)
	}
	return law, nil
}

// plotSize is the figure's size in inches and a PNG's resolution.
type plotSize struct{ w, h, dpi float64 }

// groupLabel writes a group for an axis: its definition and, when it is
// recognised, what it is ("Π₁ = dp/(n²·D²·rho), ψ_p/(4π²)").
func groupLabel(g pigroups.Group) string {
	s := g.Name + " = " + g.Format(quantity.Unicode)
	if len(g.Matches) > 0 {
		s += ", " + g.Label()
	}
	return s
}

// buildPlot draws the dependent group against the one other group,
// log–log, the reduced rows as markers and the fitted law over the
// fitted range as a line.
func buildPlot(f *fitRows, law *pigroups.PowerLaw, groups []pigroups.Group, data string) (*plot.Plot, error) {
	pl := plot.New()
	pl.Title.Text = "Reduced " + filepath.Base(data) + " and the fitted power law"
	pl.X.Label.Text = groupLabel(groups[1]) + " (log scale)"
	pl.Y.Label.Text = groupLabel(groups[0]) + " (log scale)"
	pl.Legend.Top = true
	pts := make(plotter.XYs, len(f.y))
	for i := range f.y {
		pts[i] = plotter.XY{X: f.x[0][i], Y: f.y[i]}
	}
	sc, err := plotter.NewScatter(pts)
	if err != nil {
		return nil, err
	}
	sc.GlyphStyle = plotstyle.Marker(0)
	lo, hi := law.Ranges[0][0], law.Ranges[0][1]
	var line plotter.XYs
	for i := 0; i <= 40; i++ {
		x := lo * math.Pow(hi/lo, float64(i)/40)
		pr, err := law.Predict(x)
		if err != nil {
			return nil, err
		}
		line = append(line, plotter.XY{X: x, Y: pr.Value})
	}
	ln, err := plotter.NewLine(line)
	if err != nil {
		return nil, err
	}
	ln.Color = plotstyle.SeriesColor(1)
	pl.Add(sc, ln)
	pl.Legend.Add("reduced rows", sc)
	pl.Legend.Add("fit", ln)
	xs, ys := append([]float64(nil), f.x[0]...), append([]float64(nil), f.y...)
	for _, p := range line {
		xs, ys = append(xs, p.X), append(ys, p.Y)
	}
	plotstyle.StyleLog(pl, xs, ys)
	// Room above the data for the legend, so it covers no marker.
	pl.Y.Max *= math.Pow(pl.Y.Max/pl.Y.Min, 0.3)
	return pl, nil
}

// plotFit draws the plot of buildPlot to a .png or .svg file.
func plotFit(path string, f *fitRows, law *pigroups.PowerLaw, groups []pigroups.Group, data string, size plotSize) error {
	pl, err := buildPlot(f, law, groups, data)
	if err != nil {
		return err
	}
	return plotstyle.Save(pl, path, size.w, size.h, size.dpi)
}
