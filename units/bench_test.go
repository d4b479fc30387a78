package units_test

import (
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

var sinkUnit units.Unit
var sinkFloat float64

// BenchmarkParse measures a cached lookup and a first parse of a typical
// compound unit.
func BenchmarkParse(b *testing.B) {
	const expr = "BTU/(h*ft^2*degF)"
	b.Run("cached", func(b *testing.B) {
		units.MustParse(expr)
		b.ReportAllocs()
		for b.Loop() {
			sinkUnit, _ = units.Parse(expr)
		}
	})
	b.Run("first", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkUnit, _ = units.ParseUncached(expr)
		}
	})
}

// BenchmarkConvert measures Convert between two cached unit expressions,
// against multiplying by a known factor.
func BenchmarkConvert(b *testing.B) {
	b.Run("float64", func(b *testing.B) {
		f := 6894.757293168361 / 1000
		v := 14.7
		for b.Loop() {
			sinkFloat = v * f
		}
	})
	b.Run("cached", func(b *testing.B) {
		_, _ = units.Convert(1, "psi", "kPa")
		b.ReportAllocs()
		for b.Loop() {
			sinkFloat, _ = units.Convert(14.7, "psi", "kPa")
		}
	})
	b.Run("units", func(b *testing.B) {
		psi, kpa := units.MustParse("psi"), units.MustParse("kPa")
		b.ReportAllocs()
		for b.Loop() {
			sinkFloat, _ = units.ConvertUnits(14.7, psi, kpa)
		}
	})
}

// BenchmarkUnitAlgebra measures Unit.Div and Unit.Format, which work on
// the unit's own terms: each allocates at most its result's spelling.
func BenchmarkUnitAlgebra(b *testing.B) {
	w, mk := units.MustParse("W"), units.MustParse("m*K")
	b.Run("Div", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkUnit, _ = w.Div(mk)
		}
	})
	b.Run("Pow", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkUnit, _ = mk.Pow(2, 1)
		}
	})
	u := units.MustParse("BTU/(h*ft^2*degF)")
	b.Run("Format", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkString = u.Format(quantity.Unicode)
		}
	})
}

var sinkString string
