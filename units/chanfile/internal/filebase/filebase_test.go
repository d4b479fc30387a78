package filebase

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
)

// TestIsOneClass: an error with no underlying class has its own (ErrParse
// when none is set); one whose underlying error has a class defers to it,
// matching no target itself.
func TestIsOneClass(t *testing.T) {
	wrapped := fmt.Errorf("unit: %w", quantity.ErrUnknown)
	for _, c := range []struct {
		err, class, want error
	}{
		{nil, nil, quantity.ErrParse},
		{nil, quantity.ErrRange, quantity.ErrRange},
		{errors.New("disk full"), quantity.ErrInvalid, quantity.ErrInvalid},
		{wrapped, quantity.ErrInvalid, nil},
	} {
		for _, target := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
			if got := Is(c.err, c.class, target); got != (target == c.want) {
				t.Errorf("Is(%v, %v, %v) = %v", c.err, c.class, target, got)
			}
		}
	}
	if got := ClassOf(wrapped); got != quantity.ErrUnknown {
		t.Errorf("ClassOf = %v, want ErrUnknown", got)
	}
	if got := ClassOf(errors.New("plain")); got != nil {
		t.Errorf("ClassOf(plain) = %v, want nil", got)
	}
}

// TestFinish: the reason, then the cause after ": " when there is one.
func TestFinish(t *testing.T) {
	var sb strings.Builder
	sb.WriteString("f: ")
	if got, want := Finish(&sb, "bad", errors.New("cause")), "f: bad: cause"; got != want {
		t.Errorf("Finish = %q, want %q", got, want)
	}
	sb.Reset()
	if got, want := Finish(&sb, "bad", nil), "bad"; got != want {
		t.Errorf("Finish = %q, want %q", got, want)
	}
}

// TestBatchReusesStorage: Batch grows dst to n Series, empties their
// values keeping the storage, and allocates nothing on a second call.
func TestBatchReusesStorage(t *testing.T) {
	dst := []quantity.Series{quantity.NewSeries(make([]float64, 3, 8), 0)}
	dst, vals := Batch(dst, 2, nil)
	if len(dst) != 2 || len(vals) != 2 || len(vals[0]) != 0 || cap(vals[0]) != 8 {
		t.Fatalf("Batch: %d Series, %d vals, len %d cap %d; want 2, 2, 0, 8", len(dst), len(vals), len(vals[0]), cap(vals[0]))
	}
	if n := testing.AllocsPerRun(100, func() { dst, vals = Batch(dst, 2, vals) }); n != 0 {
		t.Errorf("Batch allocates %v times on reuse", n)
	}
}
