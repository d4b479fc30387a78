package units

import (
	"math"
	"strings"
)

// lookupIn resolves a symbol in the built-in index: an exact spelling,
// or an SI prefix on a unit that takes one (precomputed at start-up).
func lookupIn(idx *tableIndex, sym string) (*entry, bool) {
	if e, ok := idx.bySym[sym]; ok {
		return e, true
	}
	e, ok := idx.prefixed[sym]
	return e, ok
}

// prefixedEntry returns the entry for prefix p on base.
func prefixedEntry(p prefix, base *entry) *entry {
	e := *base
	e.u.factor = applyPrefix(base.u.factor, p.exp)
	e.sym = p.ascii + base.sym
	e.u = symbolUnit(e.u, e.sym)
	e.uni = p.uni + base.uni
	if rest, ok := strings.CutPrefix(base.tex, `\mathrm{`); ok && p.ascii != "u" {
		e.tex = `\mathrm{` + p.ascii + rest
	} else {
		e.tex = p.tex + base.tex
	}
	e.prefixable = false
	return &e
}

// applyPrefix returns f·10^e, dividing by an exact power of ten for
// negative e so that, for example, centistokes is 1e-6 m²/s to the last
// bit.
func applyPrefix(f float64, e int) float64 {
	if e >= 0 {
		return f * math.Pow10(e)
	}
	if e >= -22 {
		return f / math.Pow10(-e)
	}
	return f / 1e22 / math.Pow10(-e-22)
}

var prefixSpellingTable = func() map[string][]string {
	m := make(map[string][]string)
	for _, p := range prefixes {
		if p.ascii == "u" {
			m[p.ascii] = microSpellings
		} else {
			m[p.ascii] = []string{p.ascii}
		}
	}
	return m
}()

func prefixSpellings(p prefix) []string { return prefixSpellingTable[p.ascii] }
