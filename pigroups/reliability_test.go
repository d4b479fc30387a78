package pigroups_test

import (
	"errors"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestRankZero: a problem whose variables are all dimensionless has rank
// 0; every variable is its own group (it used to panic).
func TestRankZero(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("C_D", q.Dimensionless), pigroups.Var("Re", q.Dimensionless), pigroups.Var("α", q.Dimensionless))
	if p.Rank() != 0 || p.NumGroups() != 3 {
		t.Fatalf("rank %d, groups %d", p.Rank(), p.NumGroups())
	}
	for _, get := range []func() (*pigroups.Set, error){func() (*pigroups.Set, error) { return p.PiSet() }, p.DefaultSet} {
		s, err := get()
		if err != nil {
			t.Fatal(err)
		}
		var got []string
		for _, g := range s.Groups() {
			got = append(got, g.String())
		}
		if strings.Join(got, " ") != "C_D Re α" {
			t.Errorf("groups %v", got)
		}
	}
}

// TestDependentOnlyBase: a base dimension only the dependent variable
// carries is named, with what to do, not reported as "no groups".
func TestDependentOnlyBase(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("F", q.Force), pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length), pigroups.Var("L", q.Length))
	if p.NumGroups() != 1 {
		t.Fatalf("groups %d", p.NumGroups())
	}
	_, err := p.DefaultSet()
	if !errors.Is(err, pigroups.ErrDependentOnly) || !strings.Contains(err.Error(), `only the dependent variable "F" carries M`) {
		t.Errorf("DefaultSet: %v", err)
	}
}
