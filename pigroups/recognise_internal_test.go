package pigroups

import (
	"fmt"
	"slices"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
)

// recogniseScan is recognition looking at every form of the group's
// length, as it did before forms were indexed by signature, and matching
// each by the search over assignments, as it did before forms with
// distinct dimensions were matched in one pass.
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
		f := compiled[fi]
		f.distinct = false
		if f.named == last || !p.sameDims(&f, terms) {
			continue
		}
		if m, ok := p.matchForm(nil, &f, terms, exps); ok {
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
		if diff := cmp.Diff(kindsOf(d), *inferKinds(d)); diff != "" {
			t.Errorf("%v (-kindsOf +inferKinds):\n%s", d, diff)
		}
	}
}

// TestRecogniseRandom: recognition of a catalogue form written in
// variables in a random order, each of the form's kind given or inferred
// from its dimension, held in rad/s or rev/s, raised to a random power,
// finds what the scan by search finds.
func TestRecogniseRandom(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		f := compiled[rapid.IntRange(0, len(compiled)-1).Draw(t, "form")]
		order := rapid.Permutation(slices.Collect(func(yield func(int) bool) {
			for k := range f.terms {
				if !yield(k) {
					return
				}
			}
		})).Draw(t, "order")
		pw := quantity.MustRat(int64(rapid.SampledFrom([]int{-2, -1, 1, 2, 3}).Draw(t, "num")), int64(rapid.IntRange(1, 2).Draw(t, "den")))
		var vars []Variable
		var exps []quantity.Rat
		for i, k := range order {
			term := f.terms[k]
			if !term.known {
				return
			}
			v := Var(fmt.Sprintf("x%d", i), term.dim)
			if rapid.Bool().Draw(t, "given") {
				v = v.WithKind(term.Name)
			}
			if rapid.Bool().Draw(t, "rev") {
				v = v.InRevolutions()
			}
			e, err := term.Exp.Mul(pw)
			if err != nil {
				t.Fatal(err)
			}
			vars, exps = append(vars, v), append(exps, e)
		}
		p, err := NewProblem(vars...)
		if err != nil {
			t.Fatal(err)
		}
		var got []string
		for _, m := range p.recognise(exps) {
			got = append(got, m.Describe())
		}
		if diff := cmp.Diff(p.recogniseScan(exps), got); diff != "" {
			t.Fatalf("%v of %v (-scan +index):\n%s", exps, vars, diff)
		}
	})
}
