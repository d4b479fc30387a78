package pigroups_test

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"pgregory.net/rapid"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestRankZeroRepeatingSetsAgree: when every variable is dimensionless
// the rank is 0, the empty set is the one repeating set, and
// RepeatingSets, EachRepeating, CheckRepeating and PiSet all say so.
func TestRankZeroRepeatingSetsAgree(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("C_p", q.Dimensionless), pigroups.Var("Re", q.Dimensionless), pigroups.Var("α", q.Dimensionless))
	if err := p.CheckRepeating(); err != nil {
		t.Fatalf("CheckRepeating(): %v", err)
	}
	s, err := p.PiSet()
	if err != nil || s.Len() != 3 {
		t.Fatalf("PiSet(): %v, %v", s, err)
	}
	sets, err := p.RepeatingSets()
	if err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff([][]string{{}}, sets, cmpopts.EquateEmpty()); diff != "" {
		t.Errorf("RepeatingSets (-want +got):\n%s", diff)
	}
	n := 0
	p.EachRepeating(func(set []string) bool { n++; return len(set) == 0 })
	if n != 1 {
		t.Errorf("EachRepeating visited %d sets, want the one empty set", n)
	}
}

// TestNoGroupsNoRepeatingSet: a problem whose rank equals its number of
// variables has no group; no set is valid for any of the four.
func TestNoGroupsNoRepeatingSet(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Var("L", q.Length), pigroups.Var("t", q.Time))
	if err := p.CheckRepeating("L", "t"); !errors.Is(err, pigroups.ErrNoGroups) || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("CheckRepeating(L, t) = %v, want ErrNoGroups", err)
	}
	if _, err := p.PiSet("L", "t"); !errors.Is(err, pigroups.ErrNoGroups) {
		t.Errorf("PiSet(L, t) = %v, want ErrNoGroups", err)
	}
	if sets, err := p.RepeatingSets(); err != nil || len(sets) != 0 {
		t.Errorf("RepeatingSets = %v, %v; want none", sets, err)
	}
}

// TestRepeatingSetsAgreeProperty: on random small problems (dimensionless
// variables included, so rank 0 occurs) every subset of the independent
// variables is in RepeatingSets exactly when CheckRepeating accepts it
// and exactly when PiSet builds a set from it, and EachRepeating visits
// the same sets in the same order.
func TestRepeatingSetsAgreeProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(1, 6).Draw(t, "n")
		nb := rapid.IntRange(0, 3).Draw(t, "bases")
		var vars []pigroups.Variable
		for i := range n {
			e := make([]int, 7)
			for b := range nb {
				e[b] = rapid.IntRange(-2, 2).Draw(t, "e")
			}
			v := pigroups.Var(fmt.Sprintf("x%d", i), q.MustDim(e[0], e[1], e[2], e[3], e[4], e[5], e[6]))
			if i == 0 && rapid.Bool().Draw(t, "dep") {
				v = v.AsDependent()
			}
			vars = append(vars, v)
		}
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			t.Fatal(err)
		}
		listed, err := p.RepeatingSets()
		if err != nil {
			t.Fatal(err)
		}
		var each [][]string
		p.EachRepeating(func(s []string) bool { each = append(each, s); return true })
		if diff := cmp.Diff(listed, each, cmpopts.EquateEmpty()); diff != "" {
			t.Fatalf("EachRepeating differs from RepeatingSets:\n%s", diff)
		}
		var cand []string
		for _, v := range vars {
			if v.Role != pigroups.Dependent {
				cand = append(cand, v.Symbol)
			}
		}
		for mask := range 1 << len(cand) {
			var set []string
			for k, s := range cand {
				if mask&(1<<k) != 0 {
					set = append(set, s)
				}
			}
			inList := slices.ContainsFunc(listed, func(l []string) bool { return slices.Equal(l, set) })
			checkErr := p.CheckRepeating(set...)
			_, piErr := p.PiSet(set...)
			if inList != (checkErr == nil) || inList != (piErr == nil) {
				t.Fatalf("set %v (rank %d, %d groups): listed %v, CheckRepeating %v, PiSet %v", set, p.Rank(), p.NumGroups(), inList, checkErr, piErr)
			}
		}
	})
}

// TestLabelFollowsAngleMeasure: the label of a group with a rotational
// speed follows the measure the variable holds. With n in rad/s,
// T/(n²·D⁴·ρ) = K_T/(4π²); with n in rev/s it is K_T itself (ITTC
// By hand: 600 rpm = 10 rev/s, T = 200 N, D = 0.25 m, ρ = 1000 kg/m³:
// K_T = 200/(1000·10²·0.25⁴) = 0.512, evaluated from the rev/s value.
func TestLabelFollowsAngleMeasure(t *testing.T) {
	mk := func(a pigroups.AngleMeasure) *pigroups.Set {
		n := pigroups.VarKind("n", q.AngularVelocity, "rotational speed")
		n.Angle = a
		p := pigroups.MustProblem(pigroups.Dep("T", q.Force).WithKind("force"), n,
			pigroups.VarKind("D", q.Length, "length"), pigroups.VarKind("ρ", q.Density, "density"))
		s, err := p.PiSet("n", "D", "ρ")
		if err != nil {
			t.Fatal(err)
		}
		return s
	}
	if l := mk(pigroups.Radians).Groups()[0].Label(); l != "K_T/(4π²)" {
		t.Errorf("n in rad/s: label %q, want K_T/(4π²)", l)
	}
	rev := mk(pigroups.Revolutions)
	g := rev.Groups()[0]
	if l := g.Label(); l != "K_T" {
		t.Errorf("n in rev/s: label %q, want K_T", l)
	}
	if d := g.Describe(); strings.Contains(d, "4π²") {
		t.Errorf("n in rev/s: %q mentions 4π²", d)
	}
	v, err := rev.WithCoefficients().Evaluator().Row([]q.Quantity{q.New(200, q.Force), q.New(10, q.AngularVelocity), q.New(0.25, q.Length), q.New(1000, q.Density)}, make([]float64, 1))
	if err != nil || math.Abs(v[0]-0.512) > 1e-12 {
		t.Errorf("K_T from n = 10 rev/s: %v, %v; want 0.512", v, err)
	}
	bad := pigroups.Var("n", q.AngularVelocity)
	bad.Angle = 7
	if _, err := pigroups.NewProblem(bad, pigroups.Var("D", q.Length)); !errors.Is(err, pigroups.ErrBadAngle) || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("angle measure 7: %v", err)
	}
}

// TestPiSetManyMatches: a set whose groups have more matches than the
// first block PiSet holds them in (one per group, twenty viscosities each
// μₖ/(ρ·V·D) a 1/Re, and Δp/(ρ·V²) with four names) gives every group
// the matches it has on its own, in the same order.
func TestPiSetManyMatches(t *testing.T) {
	vars := []pigroups.Variable{pigroups.Dep("dp", q.Pressure), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length)}
	for k := range 20 {
		vars = append(vars, pigroups.Var(fmt.Sprintf("mu%d", k), q.DynamicViscosity))
	}
	p := pigroups.MustProblem(vars...)
	s, err := p.PiSet("rho", "V", "D")
	if err != nil {
		t.Fatal(err)
	}
	describe := func(ms []pigroups.Match) []string {
		var out []string
		for _, m := range ms {
			out = append(out, m.Describe())
		}
		return out
	}
	total := 0
	for _, g := range s.Groups() {
		alone, err := p.NewGroup(g.Name, g.Product())
		if err != nil {
			t.Fatal(err)
		}
		if diff := cmp.Diff(describe(alone.Matches), describe(g.Matches)); diff != "" {
			t.Errorf("%s: matches in the set differ from its own (-own +set):\n%s", g, diff)
		}
		total += len(g.Matches)
	}
	if total <= s.Len() {
		t.Errorf("%d matches in all: the test needs more than the %d of PiSet's first block", total, s.Len())
	}
}
