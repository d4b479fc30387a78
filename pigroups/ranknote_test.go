package pigroups_test

import (
	"fmt"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestRankNoteCases: counts, plurals and combinations are right, with
// more base dimensions than variables included (worked out by hand).
func TestRankNoteCases(t *testing.T) {
	cases := []struct {
		name string
		vars []pigroups.Variable
		want []string
	}{
		{"capillary rise", []pigroups.Variable{pigroups.Dep("h", q.Length), pigroups.Var("σ", q.SurfaceTension),
			pigroups.Var("ρg", q.SpecificWeight), pigroups.Var("d", q.Length)},
			[]string{"the rank is 2, less than the 3 base dimensions", "a product of powers of L and M T⁻²", "so there are 2 groups (4 variables less the rank 2)", "would give 1 group"}},
		{"two forces: L, M and T occur only as one combination", []pigroups.Variable{pigroups.Dep("F1", q.Force), pigroups.Var("F2", q.Force)},
			[]string{"the rank is 1, less than the 3 base dimensions", "a power of L M T⁻²", "only 1 combination of the base dimensions is independent", "so there is 1 group (2 variables less the rank 1)", "would give none"}},
		{"three forces", []pigroups.Variable{pigroups.Dep("F1", q.Force), pigroups.Var("F2", q.Force), pigroups.Var("F3", q.Force)},
			[]string{"so there are 2 groups (3 variables less the rank 1)", "would give none"}},
	}
	for _, c := range cases {
		note := pigroups.MustProblem(c.vars...).RankNote()
		for _, w := range c.want {
			if !strings.Contains(note, w) {
				t.Errorf("%s: note lacks %q:\n%s", c.name, w, note)
			}
		}
		if strings.Contains(note, "-") && strings.Contains(note, "not -") {
			t.Errorf("%s: negative count in %s", c.name, note)
		}
	}
}

var groupCount = regexp.MustCompile(`so there (?:is|are) (\d+) groups? \((\d+) variables? less the rank (\d+)\)`)

// TestRankNoteProperty: for random problems of deficient rank, the note's
// group count is n − r, with the right plural.
func TestRankNoteProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(1, 6).Draw(t, "n")
		// Variables built from at most two combinations of L, M, T, so
		// the rank is usually below the number of bases.
		a := q.MustDim(1, 1, -2, 0, 0, 0, 0)
		b := q.MustDim(rapid.IntRange(-2, 2).Draw(t, "bl"), 0, rapid.IntRange(-2, 2).Draw(t, "bt"), 0, 0, 0, 0)
		vars := make([]pigroups.Variable, n)
		for i := range vars {
			ea, eb := rapid.IntRange(-2, 2).Draw(t, "ea"), rapid.IntRange(-2, 2).Draw(t, "eb")
			da, _ := a.Pow(ea, 1)
			db, _ := b.Pow(eb, 1)
			d, _ := da.Mul(db)
			vars[i] = pigroups.Var(fmt.Sprintf("x%d", i), d)
		}
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			t.Fatal(err)
		}
		note := p.RankNote()
		if p.Rank() == len(p.Bases()) {
			if note != "" {
				t.Fatalf("full rank, note %q", note)
			}
			return
		}
		m := groupCount.FindStringSubmatch(note)
		if m == nil {
			t.Fatalf("note without a count: %q", note)
		}
		g, _ := strconv.Atoi(m[1])
		nv, _ := strconv.Atoi(m[2])
		r, _ := strconv.Atoi(m[3])
		if g != p.NumGroups() || nv != n || r != p.Rank() || g != n-r {
			t.Fatalf("note %q for n=%d r=%d", note, n, p.Rank())
		}
		if (g == 1) != strings.Contains(note, "there is 1 group ") {
			t.Fatalf("plural: %q", note)
		}
	})
}

// TestEquivalentReordered: the same problem with its variables listed in
// another order gives equivalent sets; different variables do not.
func TestEquivalentReordered(t *testing.T) {
	a := pigroups.MustProblem(pigroups.Dep("F", q.Force), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("μ", q.DynamicViscosity))
	b := pigroups.MustProblem(pigroups.Var("μ", q.DynamicViscosity), pigroups.Var("D", q.Length), pigroups.Dep("F", q.Force),
		pigroups.Var("V", q.Velocity), pigroups.Var("ρ", q.Density))
	c := pigroups.MustProblem(pigroups.Dep("F", q.Force), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("L", q.Length), pigroups.Var("μ", q.DynamicViscosity))
	sa, _ := a.PiSet("ρ", "V", "D")
	sb, _ := b.PiSet("μ", "D", "ρ")
	sc, _ := c.PiSet("ρ", "V", "L")
	if ok, err := pigroups.Equivalent(sa, sb); !ok || err != nil {
		t.Errorf("reordered problem: %v, %v", ok, err)
	}
	if ok, err := pigroups.Equivalent(sb, sa); !ok || err != nil {
		t.Errorf("reordered problem, reversed: %v, %v", ok, err)
	}
	if ok, _ := pigroups.Equivalent(sa, sc); ok {
		t.Error("sets over different variables reported equivalent")
	}
}
