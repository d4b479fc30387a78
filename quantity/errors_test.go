package quantity_test

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
)

// TestErrorsOneType: every error the package returns or panics with — a
// dimension that is wrong, text that does not parse, an exact rational
// operation that cannot be done, Series of different lengths — is a
// *quantity.Error matching exactly one class, also when wrapped again.
func TestErrorsOneType(t *testing.T) {
	lengths := func() (err error) {
		defer func() { err, _ = recover().(error) }()
		var c q.Series
		c.SetAdd(q.NewSeries(make([]float64, 3), q.Length), q.NewSeries(make([]float64, 2), q.Length))
		return nil
	}
	panicked := func(f func()) (err error) {
		defer func() { err, _ = recover().(error) }()
		f()
		return nil
	}
	L, v := q.New(2, q.Length), q.New(3, q.Velocity)
	huge := q.New(1, q.MustDim(20, 0, 0, 0, 0, 0, 0))
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
		{"Check", L.CheckNamed("D", q.Velocity), q.ErrDimension, "D: want velocity [m·s⁻¹], got length [m]"},
		{"Series.Check", q.NewSeries(nil, q.Length).Check(q.Velocity), q.ErrDimension, "want velocity"},
		{"NewDim", one(q.NewDim(30, 0, 0, 0, 0, 0, 0)), q.ErrDimension, "outside −21⅓ … 21⅙"},
		{"DimOf", one(q.DimOf(q.NumBases, 1, 1)), q.ErrDimension, "base 7 does not exist"},
		{"Dim.Mul overflow", one(huge.Dim().Mul(huge.Dim())), q.ErrDimension, "an exponent overflows"},
		{"Dim.Pow", one(q.Length.Pow(1, 4)), q.ErrDimension, "whole number of sixths"},
		{"Add panics", panicked(func() { L.Add(v) }), q.ErrDimension, "cannot add length [m] and velocity [m·s⁻¹]"},
		{"Mul panics", panicked(func() { huge.Mul(huge) }), q.ErrDimension, "cannot multiply [m²⁰] and [m²⁰]: an exponent overflows"},
		{"Div panics", panicked(func() { huge.Div(huge.Inv()) }), q.ErrDimension, "cannot divide"},
		{"Exp panics", panicked(func() { q.Exp(L) }), q.ErrDimension, "must be dimensionless"},
		{"Eval", one(q.Eval(func() q.Quantity { return v.Sub(L) })), q.ErrDimension, "cannot subtract"},
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

// TestErrorFields: the one error type carries what a dimension error and
// a parse error each need — the operation, the caller's name, the two
// dimensions, the input, the offset and the cause.
func TestErrorFields(t *testing.T) {
	get := func(err error) q.Error {
		var e *q.Error
		if !errors.As(err, &e) {
			t.Fatalf("%v (%T) is not a *quantity.Error", err, err)
		}
		return *e
	}
	_, overflow := q.MustDim(20, 0, 0, 0, 0, 0, 0).Mul(q.MustDim(2, 0, 0, 0, 0, 0, 0))
	_, badNumber := q.ParseQuantitySI("  1e999 m")
	for _, c := range []struct {
		name string
		got  q.Error
		want q.Error
	}{
		{"CheckNamed", get(q.New(1, q.Length).CheckNamed("D", q.Velocity)),
			q.Error{Op: "check", Name: "D", Dims: [2]q.Dim{q.Length, q.Velocity}, Binary: true, Class: q.ErrDimension}},
		{"Dim.Mul", get(overflow),
			q.Error{Op: "multiply", Dims: [2]q.Dim{q.MustDim(20, 0, 0, 0, 0, 0, 0), q.MustDim(2, 0, 0, 0, 0, 0, 0)}, Binary: true,
				Reason: "an exponent overflows", Class: q.ErrDimension}},
		{"ParseDim", get(one(q.ParseDim("L M^x"))),
			q.Error{Op: "parse", Input: "L M^x", Offset: 4, Reason: "expected an integer exponent", Class: q.ErrParse}},
	} {
		if c.got != c.want {
			t.Errorf("%s:\n got %+v\nwant %+v", c.name, c.got, c.want)
		}
	}
	// A number that does not parse keeps strconv's error as the cause,
	// which matches no class of the module.
	var ne *strconv.NumError
	if !errors.As(badNumber, &ne) || ne.Num != "1e999" || !errors.Is(badNumber, strconv.ErrRange) {
		t.Errorf("ParseQuantitySI cause: %v (%T), want the *strconv.NumError", errors.Unwrap(badNumber), errors.Unwrap(badNumber))
	}
	if c := q.ClassOf(badNumber); c != q.ErrParse {
		t.Errorf("ParseQuantitySI class %v, want ErrParse alone", c)
	}
	if get(badNumber).Offset != 2 {
		t.Errorf("ParseQuantitySI offset %d, want 2", get(badNumber).Offset)
	}
}

// one returns the error of a call that returns a value and an error.
func one(_ any, err error) error { return err }
