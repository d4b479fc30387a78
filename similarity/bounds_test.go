package similarity_test

import (
	"errors"
	"fmt"
	"testing"
	"time"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// TestConflictBounded: a plan of 25 requirements whose conflict involves
// the first few is answered in a bounded time (an exhaustive subset
// search took seconds at 16). The limit is far above the normal figure
// (about a millisecond).
func TestConflictBounded(t *testing.T) {
	vars := []pigroups.Variable{
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("rho", q.Density, "density"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"),
	}
	for i := range 20 {
		vars = append(vars, pigroups.VarKind(fmt.Sprintf("x%d", i), q.Length, "length"))
	}
	p := pigroups.MustProblem(vars...)
	pl := similarity.NewPlan(p).
		HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/25)
	for i := range 20 {
		pl.Fix(fmt.Sprintf("x%d", i), 1.0/25)
	}
	start := time.Now()
	_, err := pl.Solve()
	elapsed := time.Since(start)
	ce := similarity.ConflictOf(err)
	if ce == nil {
		t.Fatalf("Solve: %v", err)
	}
	if len(ce.Constraints) != 5 {
		t.Errorf("conflicting set %v", ce.Constraints)
	}
	if elapsed > 2*time.Second {
		t.Errorf("25 requirements took %v", elapsed)
	}
	// Past the bound, a typed error.
	big := similarity.NewPlan(p)
	for range similarity.MaxRequirements + 1 {
		big.SameGravity("g")
	}
	if _, err := big.Solve(); !errors.Is(err, similarity.ErrPlan) {
		t.Errorf("%d requirements: %v", similarity.MaxRequirements+1, err)
	}
}

// TestLargeProblemsBounded: the default set of a 64-variable problem and
// the enumeration of a problem with millions of repeating sets end in
// bounded time, the latter with a typed error.
func TestLargeProblemsBounded(t *testing.T) {
	dims := []q.Dim{q.Length, q.Mass, q.Time, q.Temperature, q.Velocity, q.Density, q.Pressure, q.Current}
	vars := make([]pigroups.Variable, 64)
	for i := range vars {
		vars[i] = pigroups.Var(fmt.Sprintf("v%d", i), dims[i%len(dims)])
	}
	p := pigroups.MustProblem(vars...)
	start := time.Now()
	s, err := p.DefaultSet()
	if err != nil || s.Len() != 64-p.Rank() {
		t.Fatalf("DefaultSet: %v", err)
	}
	if _, err := p.RepeatingSets(); !errors.Is(err, pigroups.ErrTooManySets) {
		t.Errorf("RepeatingSets of C(64, %d) sets: %v", p.Rank(), err)
	}
	if d := time.Since(start); d > 30*time.Second {
		t.Errorf("took %v", d)
	}
}
