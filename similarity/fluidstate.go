package similarity

import (
	"fmt"
	"math"

	"similis.dev/similis/internal/roots"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// TemperatureFor finds the temperature, within [lo, hi], at which a
// property of a fluid at pressure p takes the value target — for example
// the water temperature giving a wanted kinematic viscosity in a tank.
func TemperatureFor(f fluids.Fluid, p quantity.Quantity, property func(fluids.State) float64, target float64, lo, hi quantity.Quantity) (quantity.Quantity, error) {
	for _, q := range []quantity.Quantity{lo, hi} {
		if err := q.CheckNamed("temperature limit", quantity.Temperature); err != nil {
			return quantity.Quantity{}, err
		}
	}
	g := func(T float64) float64 {
		s, err := f.At(quantity.New(T, quantity.Temperature), p)
		if err != nil {
			return math.NaN()
		}
		return property(s) - target
	}
	T, err := roots.Bisect(g, lo.Value(), hi.Value())
	if err != nil {
		return quantity.Quantity{}, planError("TemperatureFor", "", err, fmt.Sprintf("TemperatureFor: %s: no temperature in %g … %g K gives %g", f.Name(), lo.Value(), hi.Value(), target))
	}
	return quantity.New(T, quantity.Temperature), nil
}
