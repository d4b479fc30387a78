package fit

import (
	"math"
	"testing"

	"pgregory.net/rapid"
)

// rows draws n distinct x in [1, 10] (at least order+2 of them) and y.
func rows(t *rapid.T, order int) (x, y []float64) {
	n := rapid.IntRange(order+3, 30).Draw(t, "n")
	for i := range n {
		// Spread with a jitter: distinct by construction.
		x = append(x, 1+9*(float64(i)+rapid.Float64Range(0, 0.9).Draw(t, "dx"))/float64(n))
		y = append(y, rapid.Float64Range(-100, 100).Draw(t, "y"))
	}
	return x, y
}

// Adding c·x^k to y changes only the coefficient of x^k, by c: least
// squares is linear in y and x^k lies in the model's space.
func TestPropertyAddPower(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		order := rapid.IntRange(1, 4).Draw(t, "order")
		x, y := rows(t, order)
		k := rapid.IntRange(0, order).Draw(t, "k")
		c := rapid.Float64Range(-10, 10).Draw(t, "c")
		f, err := FitPoly(x, y, order, nil)
		if err != nil {
			t.Fatal(err)
		}
		y2 := make([]float64, len(y))
		for i := range y {
			y2[i] = y[i] + c*math.Pow(x[i], float64(k))
		}
		g, err := FitPoly(x, y2, order, nil)
		if err != nil {
			t.Fatal(err)
		}
		a, _, err := f.Power()
		if err != nil {
			t.Fatal(err)
		}
		b, _, err := g.Power()
		if err != nil {
			t.Fatal(err)
		}
		for j := range a {
			want := a[j]
			if j == k {
				want += c
			}
			// Tolerance: rounding relative to the size of the data,
			// |y| ≤ 100 plus the added term, up to |c|·10^k.
			tol := 1e-8 * (100 + math.Abs(c)*math.Pow(10, float64(k)))
			if math.Abs(b[j]-want) > tol {
				t.Fatalf("coefficient %d: %v after adding %v·x^%d, want %v", j, b[j], c, k, want)
			}
		}
		// Residuals are unchanged.
		if math.Abs(f.SSE-g.SSE) > 1e-9*(1+f.SSE)*1e3 {
			t.Fatalf("SSE %v became %v", f.SSE, g.SSE)
		}
	})
}

// Multiplying every weight by one constant changes nothing.
func TestPropertyWeightScale(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		order := rapid.IntRange(0, 4).Draw(t, "order")
		x, y := rows(t, order)
		w := make([]float64, len(x))
		for i := range w {
			w[i] = rapid.Float64Range(0.1, 10).Draw(t, "w")
		}
		s := math.Pow(10, rapid.Float64Range(-30, 30).Draw(t, "log10 scale"))
		w2 := make([]float64, len(w))
		for i := range w {
			w2[i] = s * w[i]
		}
		f, err := FitPoly(x, y, order, &Options{Weights: w})
		if err != nil {
			t.Fatal(err)
		}
		g, err := FitPoly(x, y, order, &Options{Weights: w2})
		if err != nil {
			t.Fatal(err)
		}
		near := func(name string, a, b float64) {
			if math.Abs(a-b) > 1e-9*(math.Abs(a)+math.Abs(b)+1e-12) {
				t.Fatalf("%s: %v with weights w, %v with %v·w", name, a, b, s)
			}
		}
		for k := range f.B {
			near("B", f.B[k], g.B[k])
			near("SE", f.StdErr[k], g.StdErr[k])
		}
		near("S", f.S, g.S)
		p1, err1 := f.Predict(x[0])
		p2, err2 := g.Predict(x[0])
		if err1 != nil || err2 != nil {
			t.Fatal(err1, err2)
		}
		near("prediction interval", p1.New[1], p2.New[1])
	})
}

// A fairing of monotone points is monotone everywhere between them and
// passes through them.
func TestPropertyFairMonotone(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(2, 12).Draw(t, "n")
		dec := rapid.Bool().Draw(t, "decreasing")
		x, y := make([]float64, n), make([]float64, n)
		for i := range n {
			step := rapid.SampledFrom([]float64{0, 0, 0.001, 1, 100}).Draw(t, "dy")
			if i > 0 {
				x[i] = x[i-1] + rapid.Float64Range(0.01, 10).Draw(t, "dx")
				y[i] = y[i-1] + step
			}
		}
		if dec {
			for i := range y {
				y[i] = -y[i]
			}
		}
		f, err := Fair(x, y)
		if err != nil {
			t.Fatal(err)
		}
		prev, _ := f.At(x[0])
		for i := 1; i <= 2000; i++ {
			xi := min(x[0]+(x[n-1]-x[0])*float64(i)/2000, x[n-1])
			v, err := f.At(xi)
			if err != nil {
				t.Fatal(err)
			}
			if (!dec && v < prev) || (dec && v > prev) {
				t.Fatalf("not monotone at x = %v: %v after %v", xi, v, prev)
			}
			prev = v
		}
	})
}
