package pigroups_test

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestFitNearlyCollinear: one model towed at five speeds, L, ρ and g held
// and ν nearly so (15.0 to 15.1 °C): Π₂ = ν/(V·L) and Π₃ = L·g/V² both
// follow V alone, Π₃ ∝ Π₂². The values are the groups of the invented
// tank log examples/pisets/testdata/tankrun.csv as pisets reduces it.
// The unscaled design's condition number is only 4.5e5, under MaxCond,
// and the old fit returned ErrFitShape for a coefficient that overflowed;
// the centred, scaled logarithms have condition number 1.29e3 (by hand:
// their correlation r = 0.9999988 gives √((1 + r)/(1 − r)) ≈ 1.3e3), above
// 100, so the fit refuses with ErrCollinear, the two groups named and the
// variables that would separate them.
func TestFitNearlyCollinear(t *testing.T) {
	y := []float64{0.0007569312381143029, 0.0007312136478386103, 0.0007491117005304774, 0.0008027224502051847, 0.000914017059798263}
	x := [][]float64{
		{2.8488739619870534e-07, 1.899249307991369e-07, 1.4206842717444663e-07, 1.1365474173955731e-07, 9.471228478296443e-08},
		{39.2266, 17.434044444444442, 9.80665, 6.276256, 4.358511111111111},
	}
	p := pigroups.MustProblem(pigroups.Dep("R_T", q.Force), pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length),
		pigroups.Var("rho", q.Density), pigroups.Var("nu", q.KinematicViscosity), pigroups.Var("g", q.Acceleration))
	s, err := p.PiSet("V", "L", "rho")
	if err != nil {
		t.Fatal(err)
	}
	gs := s.Groups()
	if got := []string{gs[1].Format(q.ASCII), gs[2].Format(q.ASCII)}; !slices.Equal(got, []string{"nu/(V*L)", "L*g/V^2"}) {
		t.Fatalf("groups %v", got)
	}
	names := []string{gs[0].Name, gs[1].Name, gs[2].Name} // as pisets names them
	_, err = pigroups.FitPowerLaw(y, x, &pigroups.FitOptions{Groups: gs, Names: names, Correlated: true})
	var fe *pigroups.Error
	if !errors.Is(err, pigroups.ErrCollinear) || !errors.Is(err, q.ErrInvalid) || !errors.As(err, &fe) {
		t.Fatalf("err = %v, want ErrCollinear", err)
	}
	if math.Abs(fe.Cond-1287) > 5 || !slices.Equal(fe.Groups, []int{1, 2}) {
		t.Errorf("Cond %v, Groups %v; want 1287 and [1 2]", fe.Cond, fe.Groups)
	}
	for _, want := range []string{"Π₂ and Π₃ vary together", "Π₃ ∝ Π₂^1.99", "above 100", "varying V moves them together", "vary L, nu or g as well", "fit one of them alone"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("%q lacks %q", err, want)
		}
	}
	// Unnamed, the fit's groups are Π₀ (fitted), Π₁ and Π₂ (FitOptions.Names).
	if _, err := pigroups.FitPowerLaw(y, x, nil); !strings.Contains(fmt.Sprint(err), "Π₁ and Π₂ vary together") || !strings.Contains(fmt.Sprint(err), "vary what separates them") {
		t.Errorf("without names or groups: %v", err)
	}
	// A looser threshold lets the fit through, with wide intervals.
	if _, err := pigroups.FitPowerLaw(y, x, &pigroups.FitOptions{MaxCollinear: 1e4}); errors.Is(err, pigroups.ErrCollinear) {
		t.Errorf("MaxCollinear 1e4: %v", err)
	}
}

// TestFitCorrelatedGroupsAccepted: groups that are correlated but not
// nearly powers of one another fit. ln x₂ = ln x₁ + a small, varied
// offset: correlation about 0.99, condition number about 14 (√(1.99/0.01)),
// well under 100.
func TestFitCorrelatedGroupsAccepted(t *testing.T) {
	off := []float64{0.1, -0.1, 0.05, -0.05, 0, 0.08, -0.08, 0.02}
	var y, x1, x2 []float64
	for i, o := range off {
		a := math.Exp(float64(i) * 0.3)
		x1, x2 = append(x1, a), append(x2, a*math.Exp(o))
		y = append(y, 3*math.Pow(a, 0.5)*math.Pow(a*math.Exp(o), 0.25)*(1+0.001*float64(i%3-1)))
	}
	f, err := pigroups.FitPowerLaw(y, [][]float64{x1, x2}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(f.Exponents[0]-0.5) > 0.05 || math.Abs(f.Exponents[1]-0.25) > 0.05 {
		t.Errorf("exponents %v, want 0.5 and 0.25", f.Exponents)
	}
}

// TestFitCollinearThree: Π₃ = Π₁·Π₂ exactly over rows where Π₁ and Π₂
// vary independently: the three vary together, and the relation is
// written with every one of them.
func TestFitCollinearThree(t *testing.T) {
	a := []float64{1, 2, 3, 4, 5, 6, 7}
	b := []float64{5, 1, 4, 2, 7, 3, 6}
	var c, y []float64
	for i := range a {
		c = append(c, a[i]*b[i])
		y = append(y, float64(i+1))
	}
	_, err := pigroups.FitPowerLaw(y, [][]float64{a, b, c}, nil)
	var fe *pigroups.Error
	if !errors.As(err, &fe) || !errors.Is(err, pigroups.ErrCollinear) || len(fe.Groups) != 3 {
		t.Fatalf("err = %v, want ErrCollinear naming 3 groups", err)
	}
	if msg := err.Error(); !strings.Contains(msg, "Π₁, Π₂ and Π₃ vary together") || strings.Contains(msg, "(·") || strings.Contains(msg, "NaN") || strings.Contains(msg, "Inf") {
		t.Errorf("%q", msg)
	}
}
