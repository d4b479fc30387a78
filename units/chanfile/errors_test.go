package chanfile_test

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// errDisk is the failure of a destination.
var errDisk = errors.New("disk full")

// failAfter is a destination that takes n bytes and then fails.
type failAfter struct{ n int }

func (f *failAfter) Write(p []byte) (int, error) {
	if len(p) > f.n {
		k := f.n
		f.n = 0
		return k, errDisk
	}
	f.n -= len(p)
	return len(p), nil
}

// TestWriteFailureNamesFileAndClass: a destination that fails gives an
// *Error naming the file, of class quantity.ErrInvalid, with the I/O
// error kept, also when wrapped again.
func TestWriteFailureNamesFileAndClass(t *testing.T) {
	cols := []chanfile.Column{{Name: "V", Unit: units.MustParse("m/s")}}
	s := []quantity.Series{quantity.NewSeries(make([]float64, 1<<15), quantity.Velocity)}
	for _, at := range []int{0, 100} {
		w, err := chanfile.NewWriter(&failAfter{at}, "out.csv", cols, chanfile.Options{})
		if err == nil {
			err = w.Write(s)
		}
		if err == nil {
			err = w.Flush()
		}
		for _, e := range []error{err, fmt.Errorf("reducing run 12: %w", err)} {
			var fe *chanfile.Error
			if !errors.As(e, &fe) || fe.File != "out.csv" || !errors.Is(e, errDisk) || !errors.Is(e, quantity.ErrInvalid) || classes(e) != 1 {
				t.Errorf("failing after %d bytes: %v, want an *Error of out.csv, ErrInvalid only, keeping %v", at, e, errDisk)
			}
		}
	}
}

// TestErrorsInOneClass: each error matches exactly one class of package
// quantity, the one stated, and keeps its cause, also when wrapped.
func TestErrorsInOneClass(t *testing.T) {
	for _, tc := range []struct {
		name, text string
		class      error
		cause      any // a pointer to an error type errors.As must find, or nil
	}{
		{"unknown unit", "V [furlongs]\n1\n", quantity.ErrUnknown, new(*units.Error)},
		{"unknown dialect unit", "Q blorps/h\n1\n", quantity.ErrUnknown, new(*units.Error)},
		{"ambiguous unit", "W ton\n1\n", quantity.ErrParse, new(*units.Error)},
		{"gauge without reference", "P1 psig\n12\n", quantity.ErrInvalid, nil},
		{"overflow", "L [km]\n1e308\n", quantity.ErrRange, nil},
		{"underflow", "L [km]\n1e-400\n", quantity.ErrRange, nil},
		{"text", "L [km]\nabc\n", quantity.ErrParse, nil},
		{"ragged", "a [m],b [m]\n1\n", quantity.ErrParse, nil},
	} {
		r, err := chanfile.NewReader(strings.NewReader(tc.text), "f.csv", chanfile.Options{})
		if err == nil {
			_, _, err = r.Read(nil, 0)
		}
		for _, e := range []error{err, fmt.Errorf("run 12: %w", err)} {
			var fe *chanfile.Error
			if !errors.As(e, &fe) || fe.File != "f.csv" || !errors.Is(e, tc.class) || classes(e) != 1 {
				t.Errorf("%s: %v matches %d classes, want only %v", tc.name, e, classes(e), tc.class)
			}
			if tc.cause != nil && !errors.As(e, tc.cause) {
				t.Errorf("%s: %v does not keep its cause %T", tc.name, e, tc.cause)
			}
		}
	}
	r, err := chanfile.NewReader(strings.NewReader("P1 psig\n1\n"), "f.csv", chanfile.Options{})
	if err == nil {
		_, _, err = r.Read(nil, 0)
	}
	if !errors.Is(err, units.ErrGauge) {
		t.Errorf("gauge without reference: %v does not match units.ErrGauge", err)
	}
}
