package pigroups_test

import (
	"testing"

	"similis.dev/similis/pigroups"
)

// TestPiSetAllocs bounds the allocations of a 12-variable Pi set: the
// set (its repeating indices inside it), its groups, their exponents, one
// slice for all the matches, and their Assumed lists and text (the column
// order and the per-group matches stay on the stack).
func TestPiSetAllocs(t *testing.T) {
	p, err := pigroups.NewProblem(twelveVars()...)
	if err != nil {
		t.Fatal(err)
	}
	const most = 6
	n := testing.AllocsPerRun(50, func() {
		if _, err := p.PiSet("rho", "n", "D"); err != nil {
			t.Fatal(err)
		}
	})
	if n > most {
		t.Errorf("PiSet: %v allocations, want at most %d", n, most)
	}
}

// TestNewProblemAllocs bounds the allocations of a 12-variable problem:
// the problem with its row list, and its copy of the variables, which
// holds their candidate kinds and their columns of the matrix.
func TestNewProblemAllocs(t *testing.T) {
	vars := twelveVars()
	const most = 2
	n := testing.AllocsPerRun(50, func() {
		if _, err := pigroups.NewProblem(vars...); err != nil {
			t.Fatal(err)
		}
	})
	if n > most {
		t.Errorf("NewProblem: %v allocations, want at most %d", n, most)
	}
}
