package main

import (
	"bytes"
	"errors"
	"flag"
	"math"
	"os"
	"strings"
	"testing"
)

func TestRunsAndPlots(t *testing.T) {
	dir := t.TempDir()
	var out bytes.Buffer
	r, err := evaluate(&out, []string{"-out", dir})
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range []string{r.PNG, r.SVG} {
		st, err := os.Stat(f)
		if err != nil || st.Size() < 1000 {
			t.Errorf("plot %s: %v", f, err)
		}
	}
	for _, want := range []string{"invented data", "Π₁ = dp/(rho·V²)", "Π₂ = rho·V·d/mu", "95 % interval", "valid only over the range"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-out", dir, "-repeat", "rho,d,L"}); err == nil {
		t.Error("a dependent repeating set was accepted")
	}
}

// TestByHand checks the groups of the first row: Q = 2 L/min through a
// 6 mm bore gives V = (2e-3/60)/(π·0.006²/4) = 1.17893 m/s; Eu = Δp/(ρV²)
// = 3280/(1050·V²); Re = ρVd/μ = 1050·V·0.006/2.2e-3; L/d = 2.
func TestByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	v := (2e-3 / 60) / (math.Pi * 0.006 * 0.006 / 4)
	want := []float64{3280 / (1050 * v * v), 1050 * v * 0.006 / 2.2e-3, 2}
	for k, w := range want {
		if math.Abs(r.Groups[0][k]/w-1) > 1e-12 {
			t.Errorf("group %d = %v, by hand %v", k, r.Groups[0][k], w)
		}
	}
	// The invented readings follow roughly Eu ∝ Re^-0.15·(L/d)^0.25; the
	// fit should find exponents of that sign and size.
	if a := r.Fit.Exponents; !(a[0] < 0 && a[0] > -0.5 && a[1] > 0.1 && a[1] < 0.4) {
		t.Errorf("exponents %v", a)
	}
}

// TestHelp: -h prints the usage and is not an error for main.
func TestHelp(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-h"})
	if !errors.Is(err, flag.ErrHelp) || !strings.Contains(out.String(), "restrictor reduces an invented bench test") {
		t.Errorf("-h: %v, %q", err, out.String())
	}
}

// TestRowBudgetByHand checks the row budget: u(Δp) with the shared
// tester is √((0.0005·26.6 kPa)² + 2·(50 Pa)² + 2·(30 Pa)²) = 83.53 Pa, and
// with two standards √((0.0005·226.6 kPa)² + (0.0005·200 kPa)² + 6800 Pa²)
// = 172.2 Pa; Eu = Δp/(ρV²) with V = 4Q/(πd²) has the relative
// uncertainty √((83.53/26600)² + 0.002² + 4·(0.005² + (2·0.01/6)²)) =
// 1.258 % (GUM eq. 12, exponents exact); and the deviation from the fit
// is the difference of two correlated values, not a root-sum-square.
func TestRowBudgetByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	b := r.Budget
	for _, c := range []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"u(Δp), one tester", b.DP.U().Value(), math.Sqrt(math.Pow(0.0005*26600, 2) + 2*50*50 + 2*30*30), 1e-9},
		{"u(Δp), two standards", b.DPIndependent.U().Value(), math.Sqrt(math.Pow(0.0005*226600, 2) + math.Pow(0.0005*200000, 2) + 6800), 1e-9},
		{"u_rel(Eu)", b.Eu.Rel(), math.Sqrt(math.Pow(math.Sqrt(math.Pow(0.0005*26600, 2)+6800)/26600, 2) + 0.002*0.002 + 4*(0.005*0.005+math.Pow(2*0.01/6, 2))), 1e-12},
		{"Eu", b.Eu.Value(), 26600 / (1050 * math.Pow(6.0e-3/60/(math.Pi/4*36e-6), 2)), 1e-12},
	} {
		if math.Abs(c.got-c.want) > c.tol*math.Abs(c.want) {
			t.Errorf("%s = %.6g, by hand %.6g", c.name, c.got, c.want)
		}
	}
	indep := math.Hypot(b.Eu.U().Value(), b.EuFit.U().Value())
	if !(b.Deviation.U().Value() < indep) {
		t.Errorf("u(Eu − Eu_fit) = %v, not below the independent %v: the shared sources should cancel in part", b.Deviation.U().Value(), indep)
	}
	for _, want := range []string{"flow meter", "dead-weight tester (both)", "invented instrument figures", "the shared error cancels"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestFluidStatePrinted: Eu and Re depend on the coolant's ρ and μ, so
// the report states the fluid's state once, before the rows: ρ = 1050
// kg/m³, μ = 2.2 mPa·s, ν = 2.2e-3/1050 = 2.095e-6 m²/s = 2.10 mm²/s;
// with them row 0 (2.0 L/min through 6 mm: V = 3.333e-5/2.827e-5 =
// 1.179 m/s) has Re = 1050·1.179·0.006/0.0022 = 3376, as printed.
func TestFluidStatePrinted(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, []string{"-out", t.TempDir()}); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	want := "fluid state (every row): 50/50 glycol–water coolant at 40 °C, ρ = 1050 kg/m³, μ = 2.20 mPa·s (ν = μ/ρ = 2.10 mm²/s; invented round figures); bore d = 6.00 mm"
	i := strings.Index(s, want)
	if i < 0 || i > strings.Index(s, "fit over") || !strings.Contains(s, "   3376 ") {
		t.Errorf("report lacks %q before the fit", want)
	}
}
