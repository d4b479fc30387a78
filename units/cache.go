package units

import (
	"sync"
	"sync/atomic"
)

// cache holds parsed expressions of the built-in table.
var (
	cache    sync.Map // string → Unit
	cacheLen atomic.Int64
)

// Parse reads a unit expression with the built-in table.
//
// Grammar: factors are unit symbols (with an SI prefix where the SI allows
// one), positive numbers, or parenthesised expressions, each optionally
// raised to a power. A space, '*', '·' or '⋅' is a product; '/' divides by
// the next factor and applies left to right, so kg/m/s is kg/(m·s). A
// product written after a division without parentheses (W/m·K) is refused
// as ambiguous: write W/(m·K). Exponents are integers ("m^2", "s^-1",
// "m**2"), Unicode superscripts ("m²", "s⁻¹"), fractions in parentheses
// ("m^(1/2)") or decimals equal to simple fractions ("in^0.5").
//
// A temperature scale written alone (°C, degF) is a scale and converts
// levels affinely; inside a compound unit (W/(m·°C)) it denotes its degree
// as an interval, as engineering data sheets mean it (common practice).
// Δ°C, ΔdegF (ASCII degC_diff) spell temperature differences explicitly.
//
// Errors are *Error values of OpParse. Parse never panics and its work is
// bounded by MaxExprLen and MaxDepth. Results are cached, so parsing the
// same expression again is a map lookup.
func Parse(expr string) (Unit, error) {
	if u, ok := cache.Load(expr); ok {
		return u.(Unit), nil
	}
	u, err := parseWith(builtinTable{}, expr)
	if err != nil {
		return Unit{}, err
	}
	if cacheLen.Load() < maxCacheLen {
		if _, loaded := cache.LoadOrStore(expr, u); !loaded {
			cacheLen.Add(1)
		}
	}
	return u, nil
}

// MustParse is like Parse but panics on error. It is meant for
// package-level declarations of units written in code.
func MustParse(expr string) Unit {
	u, err := Parse(expr)
	if err != nil {
		panic(err)
	}
	return u
}

// parseUncached is Parse without the cache: it always parses expr afresh
// (for the first-parse benchmark).
// It exists for measurement and for callers that parse many distinct
// one-off expressions and do not want them kept.
func parseUncached(expr string) (Unit, error) { return parseWith(builtinTable{}, expr) }
