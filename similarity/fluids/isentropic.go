package fluids

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
)

// Total is a stagnation (total) condition: the temperature and pressure
// the gas would reach brought to rest isentropically. Tunnels are set and
// limited by their total conditions (settling-chamber temperature and
// pressure), not by the test section's static state.
type Total struct {
	Temperature, Pressure quantity.Quantity
}

// String writes "T₀ = 288.15 K, p₀ = 101325 Pa".
func (t Total) String() string {
	return fmt.Sprintf("T₀ = %.6g K, p₀ = %.6g Pa", t.Temperature.Value(), t.Pressure.Value())
}

// TotalRatios returns T₀/T and p₀/p for a perfect gas of ratio of
// specific heats gamma at Mach number ma: T₀/T = 1 + (γ − 1)/2·Ma² and
// p₀/p = (T₀/T)^(γ/(γ−1)) (the isentropic relations of compressible-flow
// texts, common practice).
func TotalRatios(gamma, ma float64) (tr, pr float64, err error) {
	if !(gamma > 1) || math.IsInf(gamma, 0) {
		return 0, 0, &RangeError{Fluid: "perfect gas", What: "ratio of specific heats", Value: gamma, Lo: 1, Hi: math.Inf(1), Unit: unitOne}
	}
	if !(ma >= 0) || ma > 50 {
		return 0, 0, &RangeError{Fluid: "perfect gas", What: "Mach number", Value: ma, Lo: 0, Hi: 50, Unit: unitOne}
	}
	tr = 1 + 0.5*(gamma-1)*ma*ma
	pr = math.Pow(tr, gamma/(gamma-1))
	if math.IsInf(pr, 0) || math.IsNaN(pr) {
		return 0, 0, &RangeError{Fluid: "perfect gas", What: "total-to-static pressure ratio at this γ and Mach number", Value: pr, Lo: 1, Hi: math.MaxFloat64, Unit: unitOne}
	}
	return tr, pr, nil
}

// StaticAt returns the static state of the gas moving at Mach number ma
// from the total condition tot, by the isentropic relations. Like At, it
// refuses a gas whose constants are of the wrong dimension or give no
// physical gas.
func (g IdealGas) StaticAt(tot Total, ma float64) (State, error) {
	if err := check(tot.Temperature, tot.Pressure); err != nil {
		return State{}, err
	}
	if _, err := g.constants(); err != nil {
		return State{}, err
	}
	tr, pr, err := TotalRatios(g.Gamma, ma)
	if err != nil {
		return State{}, err
	}
	return g.At(tot.Temperature.Scale(1/tr), tot.Pressure.Scale(1/pr))
}

// TotalOf returns the total condition of a static state s moving at Mach
// number ma, by the isentropic relations, for a gas whose constants At
// would accept.
func (g IdealGas) TotalOf(s State, ma float64) (Total, error) {
	if err := check(s.Temperature, s.Pressure); err != nil {
		return Total{}, err
	}
	if _, err := g.constants(); err != nil {
		return Total{}, err
	}
	tr, pr, err := TotalRatios(g.Gamma, ma)
	if err != nil {
		return Total{}, err
	}
	t0, p0 := s.Temperature.Value()*tr, s.Pressure.Value()*pr
	if math.IsInf(t0, 0) || math.IsInf(p0, 0) {
		return Total{}, &RangeError{Fluid: g.Name(), What: "static temperature giving a finite total condition", Value: s.Temperature.Value(), Lo: 0, Hi: math.MaxFloat64 / tr, Unit: "K"}
	}
	return Total{Temperature: s.Temperature.Scale(tr), Pressure: s.Pressure.Scale(pr)}, nil
}

// DynamicPressure returns q = ½ρV² of a perfect gas at static pressure p
// moving at Mach number ma, written q = (γ/2)·p·Ma² (the same quantity,
// since a² = γp/ρ): the load a balance and a model see per unit of force
// coefficient and reference area. p must be absolute, and the gas's
// constants ones At would accept.
func (g IdealGas) DynamicPressure(p quantity.Quantity, ma float64) (quantity.Quantity, error) {
	if err := p.CheckNamed("static pressure", quantity.Pressure); err != nil {
		return quantity.Quantity{}, err
	}
	if v := p.Value(); !(v > 0) || math.IsInf(v, 0) {
		return quantity.Quantity{}, &RangeError{Fluid: g.Name(), What: "absolute static pressure", Value: v, Lo: 0, Hi: math.Inf(1), Unit: "Pa"}
	}
	if _, err := g.constants(); err != nil {
		return quantity.Quantity{}, err
	}
	if !(ma >= 0) || ma > 50 {
		return quantity.Quantity{}, &RangeError{Fluid: g.Name(), What: "Mach number", Value: ma, Lo: 0, Hi: 50, Unit: unitOne}
	}
	q := p.Scale(0.5 * g.Gamma * ma * ma)
	if math.IsInf(q.Value(), 0) {
		return quantity.Quantity{}, &RangeError{Fluid: g.Name(), What: "static pressure giving a finite dynamic pressure", Value: p.Value(), Lo: 0, Hi: math.MaxFloat64 / (0.5 * g.Gamma * ma * ma), Unit: "Pa"}
	}
	return q, nil
}
