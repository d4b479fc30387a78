package main

import (
	"bytes"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"
)

// noPlot runs the program without drawing the rating plot.
var noPlot = []string{"-out", ""}

// TestRatingByHand repeats the rating's key numbers by hand.
//
// Point 0 (h = 0.030 m, Q = 7.38 L/s, b = 0.76 m):
// C_d = 0.00738/((2/3)·√(2·9.80665)·0.76·0.03^1.5)
// = 0.00738/(2.952462·0.76·0.0051962) = 0.63296; q = Q/b = 0.0097105
// m²/s, V = (9.80665·q)^(1/3) = 0.45667 m/s. Points 0–2 (3, 4.5, 6 cm)
// are below the 7 cm of WeirLimits and excluded.
//
// The fit is the straight line through (ln h, ln Q) of points 3–10, by
// the closed form slope = Sxy/Sxx, intercept = ȳ − slope·x̄; at 1:30
// λ_Q = 30^(−5/2) = 1/4929.503, so Q_p(h_p) = e^a·(h_p/30)^n·4929.503 and
// C_p = e^a·30^(5/2−n).
func TestRatingByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	rt := r.Rating
	p0 := rt.Points[0]
	if math.Abs(p0.WeirCoefficient-0.63296) > 5e-5 || math.Abs(p0.Velocity-0.45667) > 5e-5 {
		t.Errorf("point 0: C_d %v, V %v; by hand 0.63296, 0.45667", p0.WeirCoefficient, p0.Velocity)
	}
	for i, p := range rt.Points {
		if p.Excluded != (i < 3) {
			t.Errorf("point %d (h = %v m) excluded: %v", i, p.Head, p.Excluded)
		}
	}
	heads := []float64{0.075, 0.090, 0.105, 0.120, 0.135, 0.150, 0.165, 0.180}
	flows := []float64{34.67, 45.59, 57.74, 72.06, 85.53, 101.80, 118.90, 134.67}
	var mx, my float64
	for i := range heads {
		mx += math.Log(heads[i]) / 8
		my += math.Log(flows[i]/1000) / 8
	}
	var sxx, sxy float64
	for i := range heads {
		dx := math.Log(heads[i]) - mx
		sxx += dx * dx
		sxy += dx * (math.Log(flows[i]/1000) - my)
	}
	n := sxy / sxx
	a := my - n*mx
	if math.Abs(rt.N-n) > 1e-12 || math.Abs(math.Log(rt.C)-a) > 1e-11 {
		t.Errorf("n = %v, ln C = %v; by hand %v, %v", rt.N, math.Log(rt.C), n, a)
	}
	if lq := math.Pow(30, 2.5); math.Abs(lq-4929.503) > 1e-3 || math.Abs(rt.DischargeRatio*lq-1) > 1e-12 {
		t.Errorf("λ_Q = %v", rt.DischargeRatio)
	}
	if cp := math.Exp(a) * math.Pow(30, 2.5-n); math.Abs(rt.ProtoC/cp-1) > 1e-10 {
		t.Errorf("C_p = %v, by hand %v", rt.ProtoC, cp)
	}
	for i, v := range r.Table {
		h := v.Head.Value()
		want := math.Exp(a) * math.Pow(h/30, n) * math.Pow(30, 2.5)
		if math.Abs(v.Discharge.Value()/want-1) > 1e-10 {
			t.Errorf("row %d: Q_p(%v m) = %v, by hand %v", i, h, v.Discharge, want)
		}
		if v.Extrapolated != (h < 0.075*30*(1-1e-12) || h > 0.18*30*(1+1e-12)) {
			t.Errorf("row %d: h_p = %v m extrapolated: %v", i, h, v.Extrapolated)
		}
		if !(v.Band[0].Value() < v.Discharge.Value() && v.Discharge.Value() < v.Band[1].Value()) {
			t.Errorf("row %d: band %v around %v", i, v.Band, v.Discharge)
		}
	}
	if !r.Table[0].Extrapolated || !r.Table[len(r.Table)-1].Extrapolated {
		t.Error("the table shows no extrapolation")
	}
	for _, want := range []string{
		"INVENTED measurements",
		"EXCLUDED: We = ρV²h/σ, head h below the limit",
		"exclusion rule: a point whose head, Reynolds or Weber number fails its limit is excluded",
		"0    0.030      7.38  0.6330   0.457",
		"Q_p = Q_m/λ_Q with λ_Q = λ_L^(5/2) = 1:4929.5",
		"scale effects, the measurement's own systematic errors and any change of the structure are not in it",
		"EXTRAPOLATED: outside 2.25 … 5.40 m",
		"range of validity: model heads 0.075 … 0.180 m, prototype 2.25 … 5.40 m",
		"plot: not drawn (-out is empty)",
		"local codes", "licensed engineers",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestRatingPlot: the rating plot is written as PNG and SVG in -out at
// the size and resolution asked for: 4 × 3 in at 100 dpi is 400 × 300
// pixels.
func TestRatingPlot(t *testing.T) {
	dir := t.TempDir()
	var out bytes.Buffer
	r, err := evaluate(&out, []string{"-out", dir, "-width", "4", "-height", "3", "-dpi", "100"})
	if err != nil {
		t.Fatal(err)
	}
	if r.PNG != filepath.Join(dir, "spillway-rating.png") || r.SVG != filepath.Join(dir, "spillway-rating.svg") {
		t.Fatalf("files %q %q", r.PNG, r.SVG)
	}
	b, err := os.ReadFile(r.PNG)
	if err != nil || len(b) < 24 || string(b[1:4]) != "PNG" {
		t.Fatalf("PNG: %v", err)
	}
	w := int(b[16])<<24 | int(b[17])<<16 | int(b[18])<<8 | int(b[19])
	h := int(b[20])<<24 | int(b[21])<<16 | int(b[22])<<8 | int(b[23])
	if w != 400 || h != 300 {
		t.Errorf("PNG %d × %d, want 400 × 300", w, h)
	}
	s, err := os.ReadFile(r.SVG)
	if err != nil || !strings.Contains(string(s), "<svg") {
		t.Errorf("SVG: %v", err)
	}
	if !strings.Contains(out.String(), r.PNG) {
		t.Error("the report does not name the plot")
	}
}

// TestRatingFlagsRefuse: the plot flags refuse what they cannot use,
// naming the flag (exit 2).
func TestRatingFlagsRefuse(t *testing.T) {
	for _, c := range []struct {
		args []string
		flag string
	}{
		{[]string{"-out", filepath.Join(t.TempDir(), "missing")}, "-out"},
		{[]string{"-width", "NaN"}, "-width"},
		{[]string{"-height", "1e9"}, "-height"},
		{[]string{"-dpi", "0"}, "-dpi"},
		{[]string{"-out", "", "extra"}, "unexpected argument"},
	} {
		err := run(&bytes.Buffer{}, c.args)
		var ce *cli.Error
		if !errors.As(err, &ce) || !strings.Contains(err.Error(), c.flag) {
			t.Errorf("%v: %v (%T), want a usage error naming %s", c.args, err, err, c.flag)
		}
	}
}
