package fit

import (
	"testing"

	"gonum.org/v1/gonum/mat"
	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// BenchmarkFitPoly compares the full fit (coefficients, covariance,
// leverages, studentised residuals, lack of fit) with a plain gonum QR
// least-squares solve of the same Vandermonde system, the baseline.
func BenchmarkFitPoly(b *testing.B) {
	x := pontiusX()
	b.Run("fit", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := FitPoly(x, pontiusY, 2, nil); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("gonum", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			a := mat.NewDense(len(x), 3, nil)
			for i, xi := range x {
				t := (xi - 1.575e6) / 1.425e6
				a.Set(i, 0, 1)
				a.Set(i, 1, t)
				a.Set(i, 2, t*t)
			}
			var qr mat.QR
			qr.Factorize(a)
			var beta mat.VecDense
			if err := qr.SolveVecTo(&beta, false, mat.NewVecDense(len(x), pontiusY)); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// BenchmarkPredict: a prediction with its intervals against evaluating
// the polynomial alone (the float64 baseline), and a prediction with
// uncertainty.
func BenchmarkPredict(b *testing.B) {
	f, err := FitPoly(pontiusX(), pontiusY, 2, nil)
	if err != nil {
		b.Fatal(err)
	}
	b.Run("float64", func(b *testing.B) {
		s := 0.0
		for b.Loop() {
			s += f.Eval(1e6)
		}
		_ = s
	})
	b.Run("predict", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := f.Predict(1e6); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("measured", func(b *testing.B) {
		set := uncertain.NewSet()
		m, err := f.Measured(set, "cell", quantity.Dimensionless, quantity.Dimensionless)
		if err != nil {
			b.Fatal(err)
		}
		x := set.MustMeasure(quantity.Scalar(1e6), set.MustAdd(uncertain.Source{Name: "load", U: quantity.Scalar(1000)}))
		b.ReportAllocs()
		for b.Loop() {
			if _, _, err := m.Predict(x); err != nil {
				b.Fatal(err)
			}
		}
	})
}
