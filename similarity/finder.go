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
		return quantity.Quantity{}, &PlanError{Err: ErrNoRoot, Reason: fmt.Sprintf("%s: no temperature in %g … %g K gives %g", f.Name(), lo.Value(), hi.Value(), target)}
	}
	return quantity.New(T, quantity.Temperature), nil
}

// TunnelLimits bound a wind tunnel's total (stagnation) temperature and
// pressure, the settling-chamber conditions a facility is specified and
// certified by.
type TunnelLimits struct {
	MinTemperature, MaxTemperature quantity.Quantity // total temperature T₀
	MinPressure, MaxPressure       quantity.Quantity // total pressure p₀
	// MaxDynamicPressure, if set, is the largest q = (γ/2)·p·Ma² the
	// balance and the model may see in the test section.
	MaxDynamicPressure quantity.Quantity
	// CondensationMargin, if set, is how far (in kelvin) the static
	// temperature must stay above the gas's saturation temperature at the
	// static pressure; it applies to nitrogen (fluids.Nitrogen).
	CondensationMargin quantity.Quantity
}

// TunnelCondition is a condition found for a model: the total condition
// the tunnel runs at, and the static state in the test section at the
// held Mach number.
type TunnelCondition struct {
	Total fluids.Total // settling-chamber T₀ and p₀
	// Temperature and Pressure are the test section's static state.
	Temperature, Pressure, Velocity quantity.Quantity
	Mach                            float64 // held equal to the prototype's
	ModelReynolds, FullReynolds     float64
	// ReynoldsRatio is Re_model/Re_prototype: 1 when both groups hold,
	// less when the limits allow only part of the way.
	ReynoldsRatio float64
	Achieved      bool
	Note          string
	// Binding names the limits that set the condition ("maximum total
	// pressure", "maximum dynamic pressure", "condensation margin",
	// "minimum total temperature", …), and Q is the dynamic pressure in
	// the test section.
	Binding []string
	Q       quantity.Quantity
}

// TunnelCaution accompanies every pressurised or cryogenic tunnel
// condition.
const TunnelCaution = "Pressurised and cryogenic tunnel conditions must stay within the facility's certified operating envelope; " +
	"pressure vessels are operated to the applicable pressure-equipment code under the facility's responsible engineer."

// FindTunnelCondition finds the total temperature and pressure of an
// ideal-gas tunnel at which a model at lengthRatio holds both the
// prototype's Mach and Reynolds numbers, within the limits, which are
// total conditions. The test section's static state follows from the
// total one by the isentropic relations at the held Mach number (see
// fluids.TotalRatios); both are returned. With the Mach number held,
// V_m = Ma·a(T), and the static pressure needed for the Reynolds number
// is p(T) = Re·μ(T)·R·T/(V_m·L_m), which rises with T: the lowest allowed
// total temperature needs the least total pressure. When no condition
// within the limits holds both, it returns the one that comes closest in
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
	if !(tlo > 0 && thi >= tlo && plo > 0 && phi >= plo) || math.IsInf(thi+phi, 0) {
		return TunnelCondition{}, &PlanError{Err: ErrBadRatio, Reason: "tunnel limits must be positive and finite with minimum ≤ maximum"}
	}
	for _, c := range []struct {
		n string
		v float64
	}{{"prototype speed", protoSpeed.Value()}, {"prototype length", protoLength.Value()}, {"prototype density", proto.Density.Value()},
		{"prototype viscosity", proto.DynamicViscosity.Value()}, {"prototype speed of sound", proto.SpeedOfSound.Value()}} {
		if !(c.v > 0) || math.IsInf(c.v, 0) {
			return TunnelCondition{}, &PlanError{Err: ErrBadRatio, Symbol: c.n, Reason: fmt.Sprintf("%s %v is not positive and finite (a fluid state without a speed of sound cannot set a Mach number)", c.n, c.v)}
		}
	}
	if _, err := gas.At(quantity.New(tlo, quantity.Temperature), quantity.New(plo, quantity.Pressure)); err != nil {
		return TunnelCondition{}, err
	}
	ma := protoSpeed.Value() / proto.SpeedOfSound.Value()
	tr, pr, err := fluids.TotalRatios(gas.Gamma, ma)
	if err != nil {
		return TunnelCondition{}, err
	}
	rep := proto.Density.Value() * protoSpeed.Value() * protoLength.Value() / proto.DynamicViscosity.Value()
	lm := protoLength.Value() * lengthRatio
	speed := func(T float64) float64 { return ma * math.Sqrt(gas.Gamma*gas.R*T) }
	// need0 is the total pressure that gives the full-scale Reynolds
	// number at total temperature T0.
	need0 := func(T0 float64) float64 {
		T := T0 / tr
		return pr * rep * gas.Viscosity(T) * gas.R * T / (speed(T) * lm)
	}
	c := TunnelCondition{Mach: ma, FullReynolds: rep}
	pmaxName := "maximum total pressure"
	if q := lim.MaxDynamicPressure; q != (quantity.Quantity{}) {
		if err := q.CheckNamed("maximum dynamic pressure", quantity.Pressure); err != nil {
			return TunnelCondition{}, err
		}
		if !(q.Value() > 0) || math.IsInf(q.Value(), 0) {
			return TunnelCondition{}, &PlanError{Err: ErrBadRatio, Reason: "the maximum dynamic pressure must be positive and finite"}
		}
		if pq := pr * 2 * q.Value() / (gas.Gamma * ma * ma); pq < phi {
			phi, pmaxName = pq, "maximum dynamic pressure"
		}
	}
	tminName := "minimum total temperature"
	if mg := lim.CondensationMargin; mg != (quantity.Quantity{}) {
		if err := mg.CheckNamed("condensation margin", quantity.Temperature); err != nil {
			return TunnelCondition{}, err
		}
		if gas.GasName != fluids.Nitrogen().GasName {
			return TunnelCondition{}, &PlanError{Err: ErrBadRatio, Reason: "a condensation margin is checked for nitrogen; " + gas.GasName + " has no saturation curve here"}
		}
		// The margin at total temperature T0, with the pressure the
		// Reynolds number needs (capped at the limit).
		margin := func(T0 float64) float64 {
			p := min(max(need0(T0), plo), phi) / pr
			ts, err := fluids.NitrogenSaturationTemperature(quantity.New(p, quantity.Pressure))
			if err != nil {
				return math.Inf(1) // above the critical pressure: no condensation
			}
			return T0/tr - ts.Value() - mg.Value()
		}
		if margin(tlo) < 0 {
			if margin(thi) < 0 {
				return TunnelCondition{}, &PlanError{Err: ErrNoRoot, Reason: fmt.Sprintf("no total temperature up to %.4g K keeps the static temperature %.3g K above nitrogen saturation", thi, mg.Value())}
			}
			t0, err := bisect(margin, tlo, thi)
			if err != nil {
				return TunnelCondition{}, &PlanError{Err: ErrNoRoot, Reason: "the condensation margin could not be located"}
			}
			tlo, tminName = t0, "condensation margin"
		}
	}
	T0, p0 := tlo, need0(tlo)
	switch {
	case p0 > phi:
		p0 = phi
		c.Binding = append(c.Binding, pmaxName, tminName)
		c.Note = fmt.Sprintf("the Reynolds number needs a total pressure of %.4g Pa even at the lowest allowed total temperature; at the %s it reaches only part of full scale", need0(tlo), pmaxName)
	case p0 < plo:
		// Warm the gas until the minimum pressure gives the right Re.
		if need0(thi) < plo {
			T0, p0 = thi, plo
			c.Binding = append(c.Binding, "minimum total pressure", "maximum total temperature")
			c.Note = "even at the highest total temperature the minimum total pressure overshoots the full-scale Reynolds number"
		} else {
			var err error
			if T0, err = bisect(func(T0 float64) float64 { return need0(T0) - plo }, tlo, thi); err != nil {
				return TunnelCondition{}, &PlanError{Err: ErrNoRoot, Reason: "no total temperature within the limits gives the Reynolds number at the minimum pressure"}
			}
			p0 = plo
			c.Binding = append(c.Binding, "minimum total pressure")
		}
	default:
		c.Binding = append(c.Binding, tminName)
	}
	c.Total = fluids.Total{Temperature: quantity.New(T0, quantity.Temperature), Pressure: quantity.New(p0, quantity.Pressure)}
	T, p := T0/tr, p0/pr
	rho := p / (gas.R * T)
	c.Temperature, c.Pressure = quantity.New(T, quantity.Temperature), quantity.New(p, quantity.Pressure)
	c.Velocity = quantity.New(speed(T), quantity.Velocity)
	c.ModelReynolds = rho * speed(T) * lm / gas.Viscosity(T)
	c.ReynoldsRatio = c.ModelReynolds / rep
	c.Q = quantity.New(0.5*gas.Gamma*p*ma*ma, quantity.Pressure)
	c.Achieved = math.Abs(c.ReynoldsRatio-1) < 1e-6
	if c.Achieved {
		c.Note = "Mach and Reynolds numbers both held"
	}
	return c, nil
}
