package quantity_test

import (
	"errors"
	"math"
	"reflect"
	"testing"

	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
)

// TestSeriesMatchesQuantity checks every Series operation against the same
// operation applied element by element with Quantity.
func TestSeriesMatchesQuantity(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(0, 40).Draw(t, "n")
		da, db := genDim(t, "da"), genDim(t, "db")
		av := rapid.SliceOfN(rapid.Float64Range(1e-3, 1e3), n, n).Draw(t, "a")
		bv := rapid.SliceOfN(rapid.Float64Range(1e-3, 1e3), n, n).Draw(t, "b")
		cv := rapid.SliceOfN(rapid.Float64Range(1e-3, 1e3), n, n).Draw(t, "c")
		a, b, c := q.NewSeries(av, da), q.NewSeries(bv, db), q.NewSeries(cv, da)
		k := genQuantity(t, db, "k")
		f := rapid.Float64Range(-10, 10).Draw(t, "f")
		var z q.Series
		check := func(name string, s *q.Series, op func(i int) q.Quantity) {
			if s.Len() != n {
				t.Fatalf("%s: length %d, want %d", name, s.Len(), n)
			}
			for i := range n {
				if w := op(i); s.At(i) != w {
					t.Fatalf("%s[%d] = %v, element-wise %v", name, i, s.At(i), w)
				}
			}
		}
		check("Add", z.SetAdd(a, c), func(i int) q.Quantity { return a.At(i).Add(c.At(i)) })
		check("Sub", z.SetSub(a, c), func(i int) q.Quantity { return a.At(i).Sub(c.At(i)) })
		check("Mul", z.SetMul(a, b), func(i int) q.Quantity { return a.At(i).Mul(b.At(i)) })
		check("Div", z.SetDiv(a, b), func(i int) q.Quantity { return a.At(i).Div(b.At(i)) })
		check("MulQ", z.SetMulQ(a, k), func(i int) q.Quantity { return a.At(i).Mul(k) })
		check("DivQ", z.SetDivQ(a, k), func(i int) q.Quantity { return a.At(i).Div(k) })
		check("QDiv", z.SetQDiv(k, a), func(i int) q.Quantity { return k.Div(a.At(i)) })
		check("AddQ", z.SetAddQ(b, k), func(i int) q.Quantity { return b.At(i).Add(k) })
		check("SubQ", z.SetSubQ(b, k), func(i int) q.Quantity { return b.At(i).Sub(k) })
		check("Scale", z.SetScale(a, f), func(i int) q.Quantity { return a.At(i).Scale(f) })
		check("Pow", z.SetPow(a, 2, 1), func(i int) q.Quantity { return a.At(i).Pow(2, 1) })
		check("Inv", z.SetInv(a), func(i int) q.Quantity { return a.At(i).Inv() })
		sq, _ := da.Pow(2, 1)
		a2 := q.NewSeries(av, sq)
		check("Sqrt", z.SetSqrt(a2), func(i int) q.Quantity { return a2.At(i).Sqrt() })
		r := q.NewSeries(av, q.Dimensionless)
		check("Powf", z.SetPowf(r, f), func(i int) q.Quantity { return q.Powf(r.At(i), f) })
		check("Log10", z.SetLog10(r), func(i int) q.Quantity { return q.Log10(r.At(i)) })
		check("Log", z.SetLog(r), func(i int) q.Quantity { return q.Log(r.At(i)) })
		var small q.Series
		small.SetScale(q.NewSeries(bv, q.Dimensionless), 1e-3)
		check("Exp", z.SetExp(small), func(i int) q.Quantity { return q.Exp(q.Scalar(bv[i] * 1e-3)) })
		var sum q.Quantity = q.New(0, da)
		for i := range n {
			sum = sum.Add(a.At(i))
		}
		if a.Sum() != sum {
			t.Fatalf("Sum = %v, element-wise %v", a.Sum(), sum)
		}
		if da != db {
			mustPanicRapid(t, func() { z.SetAdd(a, b) })
		}
	})
}

func TestSeriesStatistics(t *testing.T) {
	s := q.NewSeries([]float64{3, 1, 4, 1, 5}, q.Pressure)
	if s.Mean() != q.New(2.8, q.Pressure) || s.Min() != q.New(1, q.Pressure) || s.Max() != q.New(5, q.Pressure) {
		t.Errorf("Mean %v, Min %v, Max %v", s.Mean(), s.Min(), s.Max())
	}
	var empty q.Series
	if !math.IsNaN(empty.Mean().Value()) || !math.IsNaN(empty.Min().Value()) {
		t.Error("statistics of an empty series should be NaN")
	}
	if err := s.Check(q.Velocity); !errors.Is(err, q.ErrDimension) {
		t.Errorf("Check: %v", err)
	}
	// Values is a view.
	s.Values()[0] = 9
	if s.At(0).Value() != 9 {
		t.Error("Values is documented as a view")
	}
	var c q.Series
	c.Set(s)
	s.Values()[0] = 0
	if c.At(0).Value() != 9 {
		t.Error("Set should copy")
	}
	defer func() {
		var le *q.Error
		if r := recover(); r == nil || !errors.As(r.(error), &le) || le.Lengths != [2]int{5, 2} || !errors.Is(le, q.ErrInvalid) {
			t.Errorf("length mismatch: panic %v", r)
		}
	}()
	c.SetAdd(s, q.NewSeries([]float64{1, 2}, q.Pressure))
}

func TestSeriesNoAllocs(t *testing.T) {
	a := q.NewSeries(make([]float64, 1000), q.Velocity)
	b := q.NewSeries(make([]float64, 1000), q.Length)
	var z q.Series
	z.SetMul(a, b)
	allocs := testing.AllocsPerRun(100, func() {
		z.SetMul(a, b).SetDiv(z, b).SetMulQ(z, q.Scalar(2)).SetScale(z, 0.5)
	})
	if allocs != 0 {
		t.Errorf("%v allocations per run, want 0 once the destination has grown", allocs)
	}
}

// TestInPlaceVerbs: an in-place Series operation never shares its name
// with a value method of Quantity, so a verb means one thing (Scale is
// kept, deprecated, for one caller).
func TestInPlaceVerbs(t *testing.T) {
	value := map[string]bool{}
	qt := reflect.TypeFor[q.Quantity]()
	for i := range qt.NumMethod() {
		value[qt.Method(i).Name] = true
	}
	st := reflect.TypeFor[*q.Series]()
	for i := range st.NumMethod() {
		m := st.Method(i)
		inPlace := m.Type.NumOut() == 1 && m.Type.Out(0) == st
		if inPlace && value[m.Name] && m.Name != "Scale" {
			t.Errorf("(*Series).%s is in place but shares its name with Quantity.%s, a value method", m.Name, m.Name)
		}
	}
}
