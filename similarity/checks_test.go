package similarity_test

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// TestSharedChecks checks the shared checks for trade procedures: the
// fault each finds, its class and the input it names.
func TestSharedChecks(t *testing.T) {
	l := func(v float64) quantity.Quantity { return quantity.New(v, quantity.Length) }
	cases := []struct {
		name   string
		f      *similarity.Fault
		input  string
		class  error
		reason string
	}{
		{"all good", similarity.CheckInputs(true, similarity.Input{Name: "chord", Value: l(0.1), Dim: quantity.Length}), "", nil, ""},
		{"wrong dimension", similarity.CheckInputs(true, similarity.Input{Name: "chord", Value: quantity.New(1, quantity.Area), Dim: quantity.Length}), "chord", quantity.ErrDimension, ""},
		{"zero", similarity.CheckInputs(true, similarity.Input{Name: "chord", Value: l(0), Dim: quantity.Length}), "chord", quantity.ErrInvalid, "chord must be positive and finite"},
		{"zero allowed", similarity.CheckInputs(false, similarity.Input{Name: "chord", Value: l(0), Dim: quantity.Length}), "", nil, ""},
		{"infinite", similarity.CheckInputs(true, similarity.Input{Name: "a", Value: l(1), Dim: quantity.Length}, similarity.Input{Name: "b", Value: l(math.Inf(1)), Dim: quantity.Length}), "b", quantity.ErrInvalid, "b must be positive and finite"},
		{"result NaN", similarity.CheckResults(false, similarity.Result{Name: "C_D", Value: math.NaN()}), "C_D", quantity.ErrRange, "the C_D (NaN) is out of the range of a float64 for these inputs"},
		{"result zero, positive", similarity.CheckResults(true, similarity.Result{Name: "head", Value: 0}), "head", quantity.ErrRange, "the head (0) is out of the range of a float64 for these inputs"},
		{"result zero allowed", similarity.CheckResults(false, similarity.Result{Name: "head", Value: 0}), "", nil, ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			if c.class == nil {
				if c.f != nil {
					t.Fatalf("fault %+v, want none", *c.f)
				}
				return
			}
			if c.f == nil {
				t.Fatal("no fault")
			}
			if c.f.Input != c.input || c.f.Class != c.class || c.f.Reason != c.reason {
				t.Errorf("fault %+v, want input %q, class %v, reason %q", *c.f, c.input, c.class, c.reason)
			}
			if c.reason == "" {
				var de *quantity.Error
				if !errors.As(c.f.Cause(), &de) || de.Class != quantity.ErrDimension {
					t.Errorf("cause %v, want the *quantity.Error of class ErrDimension", c.f.Cause())
				}
			}
		})
	}
}

// TestGravityOr checks the default (g_n = 9.80665 m/s², SI Brochure) and
// that a given gravity is checked.
func TestGravityOr(t *testing.T) {
	g, f := similarity.GravityOr(quantity.Quantity{})
	if f != nil || g != quantity.New(9.80665, quantity.Acceleration) {
		t.Errorf("unset: %v, %v; want 9.80665 m/s²", g, f)
	}
	if g, f = similarity.GravityOr(quantity.New(9.81, quantity.Acceleration)); f != nil || g.Value() != 9.81 {
		t.Errorf("given: %v, %v; want 9.81 m/s²", g, f)
	}
	if _, f = similarity.GravityOr(quantity.New(-1, quantity.Acceleration)); f == nil || f.Input != "gravity" || f.Class != quantity.ErrInvalid {
		t.Errorf("negative: %+v; want an ErrInvalid fault naming gravity", f)
	}
	if _, f = similarity.OrDefault("roughness", quantity.New(1, quantity.Velocity), quantity.New(1e-4, quantity.Length)); f == nil || f.Class != quantity.ErrDimension {
		t.Errorf("wrong dimension: %+v; want an ErrDimension fault", f)
	}
}

// TestClassOf checks that a wrapped class is found and that an error of
// none of quantity's classes is given ErrInvalid.
func TestClassOf(t *testing.T) {
	for _, c := range []struct {
		err, want error
	}{
		{fmt.Errorf("reading: %w", quantity.ErrParse), quantity.ErrParse},
		{&quantity.Error{Op: "check", Class: quantity.ErrDimension}, quantity.ErrDimension},
		{errors.New("disk full"), quantity.ErrInvalid},
		{fmt.Errorf("a: %w", quantity.ErrRange), quantity.ErrRange},
		{fmt.Errorf("plan: %w", similarity.ErrConflict), similarity.ErrConflict},
	} {
		if got := similarity.ClassOf(c.err); got != c.want {
			t.Errorf("ClassOf(%v) = %v, want %v", c.err, got, c.want)
		}
	}
	var f *similarity.Fault
	if f.Cause() != nil {
		t.Error("a nil Fault has a cause")
	}
}

// ExampleFormatTable prints a two-column table of numbers, right-aligned.
func ExampleFormatTable() {
	fmt.Print(similarity.FormatTable([]string{"V m/s", "R N"}, [][]string{{"1.2", "14.8"}, {"2.25", "61.06"}}, false, true))
	fmt.Print(similarity.FormatTable([]string{"V m/s", "R N"}, [][]string{{"1.2", "14.8"}}, true, true))
	// Output:
	// V m/s    R N
	//   1.2   14.8
	//  2.25  61.06
	// | V m/s | R N |
	// | ---: | ---: |
	// | 1.2 | 14.8 |
}

// TestCheckRatios checks that a ratio not positive and finite is refused
// with its name, and that usable ratios pass.
func TestCheckRatios(t *testing.T) {
	if f := similarity.CheckRatios(similarity.Result{Name: "length", Value: 0.04}, similarity.Result{Name: "time", Value: 0.2}); f != nil {
		t.Errorf("usable ratios: fault %+v", *f)
	}
	for _, v := range []float64{0, -1, math.Inf(1), math.NaN()} {
		f := similarity.CheckRatios(similarity.Result{Name: "length", Value: 1}, similarity.Result{Name: "discharge", Value: v})
		if f == nil || f.Input != "discharge" || f.Class != quantity.ErrRange {
			t.Errorf("discharge ratio %v: fault %+v, want an ErrRange fault naming the discharge", v, f)
		}
	}
}

// testError is an error type as a trade writes one, embedding a Fault.
type testError struct {
	Op string
	similarity.Fault
}

func (e *testError) Error() string { return "trade: " + e.Op + ": " + e.Message() }

// TestFaultEmbedded checks that an error embedding a Fault matches its
// class and no other, unwraps to its cause, and prints the reason and the
// cause; and that each constructor gives its class.
func TestFaultEmbedded(t *testing.T) {
	cause := fmt.Errorf("reading: %w", quantity.ErrParse)
	var err error = &testError{Op: "fit", Fault: similarity.Caused("head", "the head column", cause)}
	if got, want := err.Error(), "trade: fit: the head column: reading: cannot parse"; got != want {
		t.Errorf("message %q, want %q", got, want)
	}
	n := 0
	for _, c := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
		if errors.Is(err, c) {
			n++
		}
	}
	if n != 1 || !errors.Is(err, quantity.ErrParse) || errors.Unwrap(err) != cause {
		t.Errorf("classes matched %d, ErrParse %v, cause %v", n, errors.Is(err, quantity.ErrParse), errors.Unwrap(err))
	}
	if f := similarity.Invalid("x", "bad"); f.Class != quantity.ErrInvalid || f.Message() != "bad" {
		t.Errorf("Invalid: %+v", f)
	}
	if f := similarity.OutOfRange("x", "too big"); f.Class != quantity.ErrRange || f.Input != "x" {
		t.Errorf("OutOfRange: %+v", f)
	}
	if f := similarity.Caused("x", "r", errors.New("disk full")); f.Class != quantity.ErrInvalid {
		t.Errorf("Caused of a classless error: class %v, want ErrInvalid", f.Class)
	}
}

// TestFail checks the three outcomes of Fail: no fault, a fault that is
// its cause alone (returned as it is), and a fault made the trade's error.
func TestFail(t *testing.T) {
	newErr := func(op string, f similarity.Fault) *testError { return &testError{Op: op, Fault: f} }
	if err := similarity.Fail("fit", nil, newErr); err != nil {
		t.Errorf("no fault: %v", err)
	}
	bare := similarity.CheckInputs(true, similarity.Input{Name: "head", Value: quantity.New(1, quantity.Pressure), Dim: quantity.Length})
	var de *quantity.Error
	if err := similarity.Fail("fit", bare, newErr); !errors.As(err, &de) || de.Class != quantity.ErrDimension || err != bare.Err {
		t.Errorf("dimension fault: %v (%T), want the *quantity.Error of class ErrDimension itself", err, err)
	}
	f := similarity.Invalid("head", "head must be positive")
	var te *testError
	if err := similarity.Fail("fit", &f, newErr); !errors.As(err, &te) || te.Op != "fit" || err.Error() != "trade: fit: head must be positive" {
		t.Errorf("fault: %v", err)
	}
}
