package quantity_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
)

// TestErrorsOneType: every error the package returns other than a
// dimension error — text that does not parse, an exact rational
// operation that cannot be done, Series of different lengths — is a
// *quantity.Error matching exactly one class, also when wrapped again;
// a dimension error is a *DimensionError of class ErrDimension.
func TestErrorsOneType(t *testing.T) {
	one := func(_ any, err error) error { return err }
	lengths := func() (err error) {
		defer func() { err, _ = recover().(error) }()
		var c q.Series
		c.SetAdd(q.NewSeries(make([]float64, 3), q.Length), q.NewSeries(make([]float64, 2), q.Length))
		return nil
	}
	classes := []error{q.ErrDimension, q.ErrRange, q.ErrParse, q.ErrUnknown, q.ErrInvalid}
	for _, c := range []struct {
		name  string
		err   error
		class error
		text  string // a part of the message
	}{
		{"ParseDim", one(q.ParseDim("L^x")), q.ErrParse, "at offset"},
		{"ParseDim too long", one(q.ParseDim(strings.Repeat("L", 300))), q.ErrParse, "longer than 256"},
		{"ParseQuantitySI", one(q.ParseQuantitySI("1..2 m")), q.ErrParse, "at offset"},
		{"ParseRat", one(q.ParseRat("1/x")), q.ErrParse, `parse "1/x"`},
		{"NewRat zero denominator", one(q.NewRat(1, 0)), q.ErrRange, "zero denominator"},
		{"Rat.Add overflow", one(q.RatInt(math.MaxInt64).Add(q.RatInt(math.MaxInt64))), q.ErrRange, "64-bit fractions"},
		{"Rat.Div by 0", one(q.RatInt(1).Div(q.RatInt(0))), q.ErrRange, "division by zero"},
		{"Coprime short dst", one(q.Coprime(make([]q.Rat, 1), []q.Rat{q.RatInt(1), q.RatInt(2)})), q.ErrInvalid, "lengths 1 and 2"},
		{"Series lengths", lengths(), q.ErrInvalid, "series of lengths 3 and 2"},
		{"MarshalText NaN", one(q.New(math.NaN(), q.Length).MarshalText()), q.ErrInvalid, "not finite"},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		for _, err := range []error{c.err, fmt.Errorf("run 7: %w", c.err)} {
			var e *q.Error
			if !errors.As(err, &e) {
				t.Errorf("%s: %T is not a *quantity.Error", c.name, err)
				continue
			}
			var n int
			for _, cl := range classes {
				if errors.Is(err, cl) {
					n++
				}
			}
			if n != 1 || !errors.Is(err, c.class) {
				t.Errorf("%s: %v matches %d classes, want %v alone", c.name, err, n, c.class)
			}
			if !strings.Contains(err.Error(), c.text) {
				t.Errorf("%s: %q does not say %q", c.name, err, c.text)
			}
		}
	}
}

// TestClassOf: the one class of an error, through wrapping; nil for an
// error of no class.
func TestClassOf(t *testing.T) {
	_, parseErr := q.ParseDim("L^x")
	for _, tc := range []struct {
		err  error
		want error
	}{
		{nil, nil},
		{errors.New("disk full"), nil},
		{parseErr, q.ErrParse},
		{fmt.Errorf("reading: %w", parseErr), q.ErrParse},
		{q.New(1, q.Length).Check(q.Time), q.ErrDimension},
	} {
		if got := q.ClassOf(tc.err); got != tc.want {
			t.Errorf("ClassOf(%v) = %v, want %v", tc.err, got, tc.want)
		}
	}
}
