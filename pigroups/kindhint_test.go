package pigroups_test

import (
	"errors"
	"slices"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// An unknown kind names the kinds known for the variable's dimension and
// says the kind may be left out. "head" is no kind of the package; a
// length may be a length (inferred) or a mean free path (given
// explicitly), by the package's own table.
func TestUnknownKindListsKnownKinds(t *testing.T) {
	_, err := pigroups.NewProblem(pigroups.VarKind("H", q.Length, "head"), pigroups.Var("D", q.Length))
	if !errors.Is(err, pigroups.ErrUnknownKind) || !errors.Is(err, q.ErrUnknown) {
		t.Fatalf("err = %v, want ErrUnknownKind of class ErrUnknown", err)
	}
	for _, want := range []string{`"H"`, `kind "head"`, "the kinds known for dimension L are length, mean free path", "leave the kind out"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("%q lacks %q", err, want)
		}
	}
	// The list is every kind of the dimension: inferred ones first, then
	// those a variable must be given (resistance for a force).
	force := pigroups.KindsOfDim(q.Force)
	if i, j := slices.Index(force, "force"), slices.Index(force, "resistance"); i < 0 || j < i {
		t.Errorf("KindsOfDim(force) = %v, want force before resistance", force)
	}
	for _, k := range pigroups.KindsOfDim(q.Pressure) {
		if d, ok := pigroups.KindDim(k); !ok || d != q.Pressure {
			t.Errorf("KindsOfDim(pressure) holds %q of dimension %v", k, d)
		}
	}
}
