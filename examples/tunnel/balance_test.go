package main

import (
	"bytes"
	"errors"
	"image/png"
	"io"
	"math"
	"os"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// TestBalanceReadingsByHand: the loads the iteration recovered at 4°
// pitch give back the recorded readings through the calibration's
// forward form, written out here from the file's terms for the NF, AF
// and PM rows (columns NF AF PM SF YM RM; the SF, YM, RM loads are a
// fraction of a newton and enter through terms of order 1e-5):
//
//	R_NF = 2.5e-4·N + 1.2e-5·A − 8e-6·m + 2e-6·l + 1.2e-11·N² + 2e-10·N·m
//	R_AF = −3e-6·N + 2.5e-3·A + 4e-6·m + 3e-10·N²
//	R_PM = 1.5e-6·N + 3.3e-3·m + 1e-5·n − 5e-12·N² + 8e-10·N·m + 1e-9·m²
//
// to the readings' resolution of 1e-5 mV/V.
func TestBalanceReadingsByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	p := r.Run.Points[4] // pitch 4°
	L := p.Balance
	N, A, m := L[tunnel.NormalForce], L[tunnel.AxialForce], L[tunnel.PitchingMoment]
	l, n := L[tunnel.RollingMoment], L[tunnel.YawingMoment]
	got := []float64{
		2.5e-4*N + 1.2e-5*A - 8e-6*m + 2e-6*l + 1.2e-11*N*N + 2e-10*N*m,
		-3e-6*N + 2.5e-3*A + 4e-6*m + 3e-10*N*N,
		1.5e-6*N + 3.3e-3*m + 1e-5*n - 5e-12*N*N + 8e-10*N*m + 1e-9*m*m,
	}
	for i, want := range windOn[4].r[:3] {
		if math.Abs(got[i]-want) > 5e-6 {
			t.Errorf("reading %d: by hand %.6f from the loads, recorded %.5f", i, got[i], want)
		}
	}
	// The first-order part alone: NF ≈ R_NF/2.5e-4 = 0.07624/2.5e-4 = 304.96 N,
	// within a newton of the iterated 304.91 N.
	if math.Abs(N-304.96) > 1 || math.Abs(N-304.96) < 0.01 {
		t.Errorf("NF = %v: want near 304.96 N but moved by the interactions", N)
	}
}

// TestTareByHand: the wind-off readings were invented for a 45 N model
// with its CG 30 mm ahead of and 5 mm above the balance centre; at 0°
// pitch the NF reading −0.01124 mV/V alone is −0.01124/2.5e-4 = −44.96 N
// to first order. The fit returns the weight and CG to the readings'
// resolution.
func TestTareByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	tr := r.Run.Tare
	if math.Abs(tr.Weight-45) > 0.05 || math.Abs(tr.CG[0]-0.030) > 2e-4 || math.Abs(tr.CG[2]+0.005) > 2e-3 || math.Abs(tr.CG[1]) > 2e-3 {
		t.Errorf("tare %+v: want W 45 N, CG (30, 0, −5) mm", tr)
	}
}

// TestReductionByHand: the point at 4° pitch from its balance loads,
// by hand. Tare (W, x_cg, z_cg as fitted; sin 4°, cos 4°):
// N_t = −W cos 4°, A_t = W sin 4°, m_t = z·(−W sin 4°) − x·W cos 4°.
// Air loads N = NF − N_t, A = AF − A_t, m = PM − m_t; to the quarter
// chord 0.04 m ahead, m' = m − 0.04·N. Wind axes at α = 4°:
// L = N cos α − A sin α, D = A cos α + N sin α; S = 38/144 m²,
// q_u = 2750 Pa: C_L,u = L/(q_u S), C_D,u = D/(q_u S),
// C_m,u = m'/(q_u S·0.2). Walls at Ma 0.2 (β² = 0.96): ε_sb =
// 0.86·0.010/(3^1.5·β³), ε_wb = (S/12)·C_D,u·(1 + 0.4·0.04)/β²,
// q/q_u = (1 + ε)²(1 − 0.04ε); C_L' = C_L,u/(q/q_u), Δα = 57.3·0.12·(S/3)·C_L',
// α = 4 + 1.12·Δα, C_L = C_L' − a·0.12·Δα with a the slope fitted to a
// first reduction with 0.080/° assumed (printed as 0.0803/°), the run
// reduced again with it: the refit gives the same slope to 1e-4/°.
func TestReductionByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	p, tr := r.Run.Points[4], r.Run.Tare
	s4, c4 := math.Sin(4*math.Pi/180), math.Cos(4*math.Pi/180)
	W, x, z := tr.Weight, tr.CG[0], tr.CG[2]
	N := p.Balance[tunnel.NormalForce] + W*c4
	A := p.Balance[tunnel.AxialForce] - W*s4
	m := p.Balance[tunnel.PitchingMoment] - (z*(-W*s4) - x*W*c4) - 0.04*N
	L, D := N*c4-A*s4, A*c4+N*s4
	S := 38.0 / 144
	clu, cdu, cmu := L/(2750*S), D/(2750*S), m/(2750*S*0.2)
	b2 := 0.96
	eps := 0.86*0.010/(math.Pow(3, 1.5)*b2*math.Sqrt(b2)) + S/12*cdu*(1+0.4*0.04)/b2
	f := (1 + eps) * (1 + eps) * (1 - 0.04*eps)
	clq := clu / f
	da := 57.3 * 0.12 * S / 3 * clq
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"C_L,u", p.Uncorrected.CL, clu}, {"C_D,u", p.Uncorrected.CD, cdu}, {"C_m,u", p.Uncorrected.Cm, cmu},
		{"α", p.Corrected.AlphaDeg, 4 + 1.12*da}, {"C_L", p.Corrected.CL, clq - r.Run.Slope*0.12*da},
	} {
		if math.Abs(c.got-c.want) > 1e-12 {
			t.Errorf("%s = %.10g, by hand %.10g", c.name, c.got, c.want)
		}
	}
	if a := r.Run.Slope; a == assumedSlope || math.Abs(a-r.Run.Polar.LiftSlopePerDeg.Value) > 1e-4 || math.Abs(a-0.0803) > 5e-5 {
		t.Errorf("curvature slope %v: want the fitted slope (0.0803/°), not the assumed %v; refit %v", a, assumedSlope, r.Run.Polar.LiftSlopePerDeg.Value)
	}
	if !strings.Contains(out.String(), "the curvature correction's lift slope a = 0.0803/° is the fitted one below") {
		t.Errorf("the curvature slope's line is not printed:\n%s", out.String())
	}
	// The printed row at 4°: NF 304.91 N, C_L,u 0.4808, α 4.324°, C_L 0.4756.
	if !strings.Contains(out.String(), "    4.0   304.91") || !strings.Contains(out.String(), "0.4808") {
		t.Errorf("the 4° row is not printed as expected:\n%s", out.String())
	}
}

// TestPolarByHand: the lift slope is the least-squares slope
// Σ(α − ᾱ)(C_L − C̄_L)/Σ(α − ᾱ)² of the corrected points in the linear
// range, α₀ = ᾱ − C̄_L/slope; K and C_D0 the same with C_L² against C_D.
func TestPolarByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	var a, l, l2, d []float64
	for _, p := range r.Run.Points {
		if c := p.Corrected; c.AlphaDeg >= -5 && c.AlphaDeg <= 11 {
			a, l, l2, d = append(a, c.AlphaDeg), append(l, c.CL), append(l2, c.CL*c.CL), append(d, c.CD)
		}
	}
	line := func(x, y []float64) (slope, icept float64) {
		var mx, my float64
		for i := range x {
			mx, my = mx+x[i], my+y[i]
		}
		mx, my = mx/float64(len(x)), my/float64(len(x))
		var sxy, sxx float64
		for i := range x {
			sxy += (x[i] - mx) * (y[i] - my)
			sxx += (x[i] - mx) * (x[i] - mx)
		}
		return sxy / sxx, my - sxy/sxx*mx
	}
	slope, icept := line(a, l)
	k, cd0 := line(l2, d)
	pol := r.Run.Polar
	if len(a) != 8 || pol.N != 8 || math.Abs(pol.LiftSlopePerDeg.Value-slope) > 1e-12 || math.Abs(pol.ZeroLiftAlphaDeg.Value+icept/slope) > 1e-9 ||
		math.Abs(pol.K.Value-k) > 1e-12 || math.Abs(pol.CD0.Value-cd0) > 1e-12 {
		t.Errorf("polar %+v; by hand slope %v, α₀ %v, K %v, C_D0 %v", pol, slope, -icept/slope, k, cd0)
	}
	for _, e := range []tunnel.Estimate{pol.LiftSlopePerDeg, pol.ZeroLiftAlphaDeg, pol.CD0, pol.K} {
		if !(e.Interval[0] < e.Value && e.Value < e.Interval[1]) {
			t.Errorf("interval %v does not hold %v", e.Interval, e.Value)
		}
	}
	// The largest load: AF at 16° pitch, |−107.34| N of 400 N = 27 %.
	if r.Run.MaxComponent != tunnel.AxialForce || math.Abs(r.Run.MaxShare*400-107.34) > 0.01 || !strings.Contains(out.String(), "AF at 27 % of its calibrated range") {
		t.Errorf("largest load %v at %v", r.Run.MaxComponent, r.Run.MaxShare)
	}
}

// TestPlotsWritten: both plots are written as PNG and SVG, the PNG of
// -width × -height inches at -dpi pixels per inch (4 × 3 in at 100 dpi:
// 400 × 300 pixels).
func TestPlotsWritten(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, outDir(t, "-width", "4", "-height", "3", "-dpi", "100"))
	if err != nil {
		t.Fatal(err)
	}
	for k := range 2 {
		f, err := os.Open(r.Run.PNG[k])
		if err != nil {
			t.Fatal(err)
		}
		cfg, err := png.DecodeConfig(f)
		f.Close()
		if err != nil || cfg.Width != 400 || cfg.Height != 300 {
			t.Errorf("%s: %v, %d × %d", r.Run.PNG[k], err, cfg.Width, cfg.Height)
		}
		svg, err := os.ReadFile(r.Run.SVG[k])
		if err != nil || !bytes.Contains(svg, []byte("<svg")) {
			t.Errorf("%s: %v", r.Run.SVG[k], err)
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-out", "/nonexistent/dir"}); err == nil || cli.ExitCode(&bytes.Buffer{}, "tunnel", err) != 2 {
		t.Errorf("-out to no directory: %v", err)
	}
	if err := run(&bytes.Buffer{}, outDir(t, "-amin", "12", "-amax", "4")); err == nil || cli.ExitCode(&bytes.Buffer{}, "tunnel", err) != 2 {
		t.Errorf("-amin above -amax: %v", err)
	}
}

// TestPastStallRange: -amin 12 -amax 30 takes in only the corrected
// points past the stall (from the default table: α 12.733°, 14.759°,
// 16.725° with C_L 1.0751, 1.1133, 1.0633). By hand, their least-squares
// slope is Σ(α − ᾱ)(C_L − C̄_L)/Σ(α − ᾱ)² with ᾱ = 14.739, C̄_L = 1.0839:
// −0.022671/7.9686 = −0.00285 per degree (table rounding: ±0.00005), not
// positive. The slopes between neighbouring points of the table are
// 0.0789, 0.0815, 0.0810, 0.0792, 0.0800, 0.0813, 0.0797, 0.0435,
// 0.0189, −0.0254 per degree, median (0.0792 + 0.0797)/2 = 0.0795; ¾ of
// it is 0.0596, which every slope up to α = 10.671° passes and the one
// to 12.733° (0.0435) fails: the linear points run from −4.138° to
// 10.671°, whole degrees outward −5 … 11 (11 < 12.733). The range is a
// usage error (exit 2) naming the flags, the slope and that range, in
// full (not cut), without a doubled "tunnel:" or a point's name.
func TestPastStallRange(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, outDir(t, "-amin", "12", "-amax", "30"))
	var stderr bytes.Buffer
	if code := cli.ExitCode(&stderr, "tunnel", err); code != 2 {
		t.Fatalf("exit %d, want 2: %v", code, err)
	}
	if out.Len() != 0 {
		t.Errorf("the report was printed before the refusal:\n%s", out.String())
	}
	msg := stderr.String()
	for _, want := range []string{"-amin 12 -amax 30 is past stall", "choose the linear range, e.g. -amin -5 -amax 11", "-4.138° … 10.671°", "0.0795/°"} {
		if !strings.Contains(msg, want) {
			t.Errorf("message lacks %q:\n%s", want, msg)
		}
	}
	for _, bad := range []string{"tunnel: tunnel", "point at", "bytes)", "0028332"} {
		if strings.Contains(msg, bad) {
			t.Errorf("message has %q:\n%s", bad, msg)
		}
	}
	m := regexp.MustCompile(`fitted lift slope (\S+) per degree`).FindStringSubmatch(msg)
	if m == nil {
		t.Fatalf("no slope in %q", msg)
	}
	a, perr := strconv.ParseFloat(m[1], 64)
	if perr != nil || math.Abs(a-(-0.022671/7.9686)) > 5e-5 {
		t.Errorf("slope %q, by hand -0.00285", m[1])
	}
	// The suggested range runs.
	if err := run(io.Discard, outDir(t, "-amin", "-5", "-amax", "11")); err != nil {
		t.Errorf("the suggested range: %v", err)
	}
}

// TestPointErrorPrefix: a point the reduction refuses is named with the
// library's reason once, after the command's name only: no
// "tunnel: point at 4°: tunnel: …".
func TestPointErrorPrefix(t *testing.T) {
	_, lerr := tunnel.CorrectWalls3D(tunnel.Model3D{WingArea: q.New(0.26, q.Area), TunnelArea: q.New(3, q.Area),
		ModelVolume: q.New(0.01, q.Volume), Mach: 0.95})
	err := &pointError{pitch: 4, err: lerr}
	var stderr bytes.Buffer
	cli.ExitCode(&stderr, "tunnel", err)
	if got := stderr.String(); !strings.HasPrefix(got, "tunnel: point at 4°: 3-D wall correction: ") || strings.Count(got, "tunnel:") != 1 {
		t.Errorf("printed %q", got)
	}
	var te *tunnel.Error
	if !errors.As(err, &te) {
		t.Error("the library's error is not kept")
	}
}
