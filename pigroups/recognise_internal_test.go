package pigroups

import (
	"fmt"
	"slices"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
)

// recogniseScan is recognition looking at every form of the group's
// length, as it did before forms were indexed by signature.
func (p *Problem) recogniseScan(exps []quantity.Rat) []string {
	var terms []int
	for i, e := range exps {
		if !e.IsZero() {
			terms = append(terms, i)
		}
	}
	if len(terms) >= len(compiledByLen) {
		return nil
	}
	var out []Match
	var last *Named
	for _, fi := range compiledByLen[len(terms)] {
		f := &compiled[fi]
		if f.named == last || !p.sameDims(f, terms) {
			continue
		}
		if m, ok := p.matchForm(nil, f, terms, exps); ok {
			out = append(out, m)
			last = f.named
		}
	}
	slices.SortStableFunc(out, func(a, b Match) int {
		if a.Exact() != b.Exact() {
			if a.Exact() {
				return -1
			}
			return 1
		}
		if d := len(a.Assumed) - len(b.Assumed); d != 0 {
			return d
		}
		return absCmp(a.Power, b.Power)
	})
	var s []string
	for _, m := range out {
		s = append(s, m.Describe())
	}
	return s
}

// TestRecogniseBySignature: recognition through the signature index
// finds what a scan of every form of the group's length finds, in the
// same order, for each catalogue form written in variables of its kinds
// (given, and inferred from the dimensions) and raised to several powers;
// and every form is recognised as its own named group.
func TestRecogniseBySignature(t *testing.T) {
	powers := []quantity.Rat{quantity.RatInt(1), quantity.RatInt(-1), quantity.RatInt(2), quantity.MustRat(1, 2)}
	checked := 0
	for _, f := range compiled {
		for _, given := range []bool{true, false} {
			var vars []Variable
			ok := true
			for k, t := range f.terms {
				if !t.known {
					ok = false
					break
				}
				v := Var(fmt.Sprintf("x%d", k), t.dim)
				if given {
					v = v.WithKind(t.Name)
				}
				vars = append(vars, v)
			}
			if !ok {
				continue
			}
			p, err := NewProblem(vars...)
			if err != nil {
				t.Fatalf("%s: %v", f.named.Symbol, err)
			}
			for _, pw := range powers {
				exps := make([]quantity.Rat, len(vars))
				for k, term := range f.terms {
					if exps[k], err = term.Exp.Mul(pw); err != nil {
						t.Fatal(err)
					}
				}
				var got []string
				found := false
				for _, m := range p.recognise(exps) {
					got = append(got, m.Describe())
					found = found || m.Symbol == f.named.Symbol
				}
				if diff := cmp.Diff(p.recogniseScan(exps), got); diff != "" {
					t.Errorf("%s, power %v, kinds given %v (-scan +index):\n%s", f.named.Symbol, pw, given, diff)
				}
				if given && !found {
					t.Errorf("%s, power %v: not recognised as itself: %v", f.named.Symbol, pw, got)
				}
				checked++
			}
		}
	}
	if checked < 100 {
		t.Errorf("%d cases checked", checked)
	}
}

// TestInferKindsTable: the table of known dimensions gives every
// dimension the kinds package quantity names for it, synonyms left out,
// as does the cache for any other dimension.
func TestInferKindsTable(t *testing.T) {
	var dims []quantity.Dim
	for _, k := range quantity.Kinds() {
		dims = append(dims, k.Dim)
	}
	for _, d := range tradeKinds {
		dims = append(dims, d)
	}
	for a := -3; a <= 3; a++ {
		for b := -2; b <= 2; b++ {
			dims = append(dims, quantity.MustDim(a, b, a-b, 0, b, 0, 0))
		}
	}
	for _, d := range dims {
		if diff := cmp.Diff(kindsOf(d), inferKinds(d)); diff != "" {
			t.Errorf("%v (-kindsOf +inferKinds):\n%s", d, diff)
		}
	}
}
