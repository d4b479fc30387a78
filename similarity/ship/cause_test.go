package ship_test

import (
	"errors"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// TestCauseKept: an error a ship procedure meets in another package (the
// water correlation's range, the friction line's) is kept as the cause,
// reachable with errors.As, and the *ship.Error takes its class, so the
// error matches exactly one class.
func TestCauseKept(t *testing.T) {
	classes := []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}
	count := func(err error) int {
		n := 0
		for _, c := range classes {
			if errors.Is(err, c) {
				n++
			}
		}
		return n
	}
	run, _ := hullRun(t)
	run.TankTemperature = uncertain.Exact(quantity.New(420, quantity.Temperature)) // above the fresh-water correlation's range
	_, err := ship.ExtrapolateHullRun(run)
	var se *ship.Error
	var re *fluids.RangeError
	if !errors.As(err, &se) || se.Input != "tank temperature" || !errors.As(err, &re) || !errors.Is(err, quantity.ErrRange) || count(err) != 1 {
		t.Errorf("tank water at 420 K: %v", err)
	}
	_, err = ship.FormFactorDoubleBody([]float64{3e6, 1e4}, []float64{4e-3, 4e-3}, ship.LineITTC1957)
	var inner *ship.Error
	if !errors.As(err, &se) || se.Input != "Reynolds number" || !errors.As(se.Err, &inner) || count(err) != 1 {
		t.Errorf("double body at Re = 10⁴: %v", err)
	}
}
