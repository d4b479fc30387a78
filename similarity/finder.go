package similarity

import (
	"errors"
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// ErrNoRoot is wrapped when a bracketing search finds no sign change.
var ErrNoRoot = errors.New("no root in the bracket")

// bisect finds x in [lo, hi] with f(x) = 0 by bisection, f(lo) and f(hi)
// having opposite signs; 200 halvings at most.
func bisect(f func(float64) float64, lo, hi float64) (float64, error) {
	flo, fhi := f(lo), f(hi)
	if flo == 0 {
		return lo, nil
	}
	if fhi == 0 {
		return hi, nil
	}
	if math.IsNaN(flo) || math.IsNaN(fhi) || (flo > 0) == (fhi > 0) {
		return 0, ErrNoRoot
	}
	for range 200 {
		mid := 0.5 * (lo + hi)
		fm := f(mid)
		if fm == 0 || hi-lo <= 1e-12*math.Abs(mid) {
			return mid, nil
		}
		if (fm > 0) == (flo > 0) {
			lo, flo = mid, fm
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi), nil
}

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
	T, err := bisect(g, lo.Value(), hi.Value())
	if err != nil {
		return quantity.Quantity{}, fmt.Errorf("similarity: %s: no temperature in %g … %g K gives %g: %w", f.Name(), lo.Value(), hi.Value(), target, err)
	}
	return quantity.New(T, quantity.Temperature), nil
}

// TunnelLimits bound a wind tunnel's stagnation-free test-section
// temperature and pressure.
type TunnelLimits struct {
	MinTemperature, MaxTemperature quantity.Quantity
	MinPressure, MaxPressure       quantity.Quantity
}

// TunnelCondition is a test-section condition found for a model.
type TunnelCondition struct {
	Temperature, Pressure, Velocity quantity.Quantity
	Mach                            float64 // held equal to the prototype's
	ModelReynolds, FullReynolds     float64
	// ReynoldsRatio is Re_model/Re_prototype: 1 when both groups hold,
	// less when the limits allow only part of the way.
	ReynoldsRatio float64
	Achieved      bool
	Note          string
}

// TunnelCaution accompanies every pressurised or cryogenic tunnel
// condition.
const TunnelCaution = "Pressurised and cryogenic tunnel conditions must stay within the facility's certified operating envelope; " +
	"pressure vessels are operated to the applicable pressure-equipment code under the facility's responsible engineer."

// FindTunnelCondition finds the test-section temperature and pressure of
// an ideal-gas tunnel at which a model at lengthRatio holds both the
// prototype's Mach and Reynolds numbers, within the limits. With the Mach
// number held, V_m = Ma·a(T), and the pressure needed for the Reynolds
// number is p(T) = Re·μ(T)·R·T/(V_m·L_m), which rises with T: the lowest
// allowed temperature needs the least pressure. When no condition within
// the limits holds both, it returns the one that comes closest in
// Reynolds number, with Achieved false.
func FindTunnelCondition(gas fluids.IdealGas, proto fluids.State, protoSpeed, protoLength quantity.Quantity, lengthRatio float64, lim TunnelLimits) (TunnelCondition, error) {
	for _, c := range []struct {
		n string
		q quantity.Quantity
		d quantity.Dim
	}{
		{"prototype speed", protoSpeed, quantity.Velocity}, {"prototype length", protoLength, quantity.Length},
		{"minimum temperature", lim.MinTemperature, quantity.Temperature}, {"maximum temperature", lim.MaxTemperature, quantity.Temperature},
		{"minimum pressure", lim.MinPressure, quantity.Pressure}, {"maximum pressure", lim.MaxPressure, quantity.Pressure},
	} {
		if err := c.q.CheckNamed(c.n, c.d); err != nil {
			return TunnelCondition{}, err
		}
	}
	if err := checkRatio("length", lengthRatio); err != nil {
		return TunnelCondition{}, err
	}
	tlo, thi, plo, phi := lim.MinTemperature.Value(), lim.MaxTemperature.Value(), lim.MinPressure.Value(), lim.MaxPressure.Value()
	if !(tlo > 0 && thi >= tlo && plo > 0 && phi >= plo) {
		return TunnelCondition{}, &PlanError{Reason: "tunnel limits must be positive with minimum ≤ maximum"}
	}
	ma := protoSpeed.Value() / proto.SpeedOfSound.Value()
	rep := proto.Density.Value() * protoSpeed.Value() * protoLength.Value() / proto.DynamicViscosity.Value()
	lm := protoLength.Value() * lengthRatio
	speed := func(T float64) float64 { return ma * math.Sqrt(gas.Gamma*gas.R*T) }
	need := func(T float64) float64 { return rep * gas.Viscosity(T) * gas.R * T / (speed(T) * lm) }
	c := TunnelCondition{Mach: ma, FullReynolds: rep}
	T, p := tlo, need(tlo)
	switch {
	case p > phi:
		p = phi
		c.Note = fmt.Sprintf("the Reynolds number needs %.4g Pa even at the lowest temperature; at the pressure limit it reaches only part of full scale", need(tlo))
	case p < plo:
		// Warm the gas until the minimum pressure gives the right Re.
		if need(thi) < plo {
			T, p = thi, plo
			c.Note = "even at the highest temperature the minimum pressure overshoots the full-scale Reynolds number"
		} else {
			var err error
			if T, err = bisect(func(T float64) float64 { return need(T) - plo }, tlo, thi); err != nil {
				return TunnelCondition{}, err
			}
			p = plo
		}
	}
	rho := p / (gas.R * T)
	c.Temperature, c.Pressure = quantity.New(T, quantity.Temperature), quantity.New(p, quantity.Pressure)
	c.Velocity = quantity.New(speed(T), quantity.Velocity)
	c.ModelReynolds = rho * speed(T) * lm / gas.Viscosity(T)
	c.ReynoldsRatio = c.ModelReynolds / rep
	c.Achieved = math.Abs(c.ReynoldsRatio-1) < 1e-6
	if c.Achieved {
		c.Note = "Mach and Reynolds numbers both held"
	}
	return c, nil
}
