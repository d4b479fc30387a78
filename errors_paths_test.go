package similis_test

import (
	"bytes"
	"errors"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
	"similis.dev/similis/units/formula"
)

// TestErrorClassAcrossPackages: an error that crosses a package boundary
// keeps exactly one class and its cause. A water temperature out of range
// reached through a hull run is ErrRange and still a *fluids.RangeError;
// a channel header's unknown unit is ErrUnknown and still a
// *units.Error; a formula's non-finite row is ErrRange and a
// *formula.Error; a file that is not Parquet is a parse error and a
// *parquetfile.Error.
func TestErrorClassAcrossPackages(t *testing.T) {
	classes := map[string]error{
		"dimension": quantity.ErrDimension, "range": quantity.ErrRange, "parse": quantity.ErrParse,
		"unknown": quantity.ErrUnknown, "invalid": quantity.ErrInvalid,
	}
	ex := func(v float64, d quantity.Dim) uncertain.Measured { return uncertain.Exact(quantity.New(v, d)) }
	// A 5 m model at 1.5 m/s with 40 N, in a tank at 45 °C: beyond the
	// fresh-water correlation's 0 … 40 °C.
	_, hullErr := ship.ExtrapolateHullRun(ship.HullRun{
		Scale: 1.0 / 20, ModelLength: ex(5, quantity.Length), ModelWettedArea: ex(4, quantity.Area),
		ModelSpeed: ex(1.5, quantity.Velocity), ModelResistance: ex(40, quantity.Force),
		TankTemperature: ex(318.15, quantity.Temperature), SeaTemperature: ex(288.15, quantity.Temperature),
		Tank: fluids.FreshWater(), Sea: fluids.SeaWater(),
	})
	// The unknown unit is refused when the column is read.
	cr, headerErr := chanfile.NewReader(strings.NewReader("t [s],V [furlongs]\n0,1\n"), "run7.csv", chanfile.Options{})
	if headerErr == nil {
		_, _, headerErr = cr.Read(nil, 0)
	}
	var formulaErr error
	if p, err := formula.Compile("y = 1/x", formula.Input{Name: "x", Dim: quantity.Dimensionless}); err != nil {
		t.Fatal(err)
	} else {
		_, formulaErr = p.Evaluator().Row([]float64{0}, make([]float64, 1))
	}
	junk := []byte("PAR1 this is not a Parquet file PAR1")
	_, parquetErr := parquetfile.NewReader(bytes.NewReader(junk), int64(len(junk)), "run7.parquet", parquetfile.Options{})

	var (
		fluidRange *fluids.RangeError
		parseErr   *units.Error
		fRange     *formula.Error
		pqErr      *parquetfile.Error
		chanErr    *chanfile.Error
	)
	cases := []struct {
		name  string
		err   error
		class string
		as    []any // pointers errors.As must fill
	}{
		{"hull run, tank at 45 °C", hullErr, "range", []any{&fluidRange}},
		{"channel header, unknown unit", headerErr, "unknown", []any{&chanErr, &parseErr}},
		{"formula, 1/0", formulaErr, "range", []any{&fRange}},
		{"Parquet, not a file", parquetErr, "parse", []any{&pqErr}},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		for _, wrapped := range []error{c.err, errors.Join(c.err), wrapf(c.err)} {
			var matched []string
			for name, cl := range classes {
				if errors.Is(wrapped, cl) {
					matched = append(matched, name)
				}
			}
			if len(matched) != 1 || matched[0] != c.class {
				t.Errorf("%s: %v matches %v, want only %s", c.name, wrapped, matched, c.class)
			}
			for _, target := range c.as {
				if !errors.As(wrapped, target) {
					t.Errorf("%s: %v: errors.As(%T) fails", c.name, wrapped, target)
				}
			}
		}
	}
}

type wrapErr struct{ err error }

func (w wrapErr) Error() string { return "harness: " + w.err.Error() }
func (w wrapErr) Unwrap() error { return w.err }

func wrapf(err error) error { return wrapErr{err} }
