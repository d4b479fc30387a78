package tunnel

import (
	"fmt"
	"math"
	"strconv"

	"similis.dev/similis/internal/roots"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

// Limits bound a wind tunnel's total (stagnation) temperature and
// pressure, the settling-chamber conditions a facility is specified and
// certified by.
type Limits struct {
	MinTemperature, MaxTemperature quantity.Quantity // total temperature T₀
	MinPressure, MaxPressure       quantity.Quantity // total pressure p₀, absolute
	// MaxDynamicPressure, if set, is the largest q = (γ/2)·p·Ma² the
	// balance and the model may see in the test section.
	MaxDynamicPressure quantity.Quantity
	// CondensationMargin is how far (in kelvin) the static temperature
	// must stay above the gas's condensation temperature at the static
	// pressure (fluids.IdealGas.LowestTemperature). It applies to a gas
	// with a saturation curve (fluids.Nitrogen); unset, it is zero there:
	// the test section is kept a gas, but with no margin. The margin is
	// the free stream's: local supersonic expansion over the model lowers
	// the static temperature below the free stream's and reduces it.
	CondensationMargin quantity.Quantity
	// RatedLoad, if set, is the rated load of the weakest member of the
	// model's load path (balance, sting, model or support), and LoadArea
	// the model's largest force coefficient times its reference area
	// (C·S, m²), so that C·S·q is the largest load at the found dynamic
	// pressure. The finder compares the two and says so in Cautions; it
	// does not lower q for it (MaxDynamicPressure does).
	RatedLoad, LoadArea quantity.Quantity
}

// Condition is a condition found for a model: the total condition
// the tunnel runs at, and the static state in the test section at the
// held Mach number.
type Condition struct {
	Total fluids.Total // settling-chamber T₀ and p₀
	// Temperature and Pressure are the test section's static state (pressures absolute).
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
	// Gas is the test gas's name, as the condition was computed for it.
	Gas string
	// Z is the estimated compressibility factor p/(ρ·R·T) of a nitrogen
	// test gas at the static state (fluids.NitrogenCompressibility),
	// dimensionless; zero when not estimated (another gas, or a state
	// outside the estimate's range, which Note then says). The
	// condition itself is the ideal gas's.
	//
	// DensityError and ReynoldsError are the relative errors of the
	// ideal-gas density and model Reynolds number against that
	// estimate, (ideal − real)/real, dimensionless: Z − 1 for the
	// density; for Re_m, at the held Mach number, Z·a_ideal/a_real − 1,
	// since the real speed of sound, and so the test speed, differs too
	// (the viscosity is the dilute gas's and the total-to-static
	// relations the perfect gas's in both). A negative ReynoldsError
	// means the real Re_m is higher than ModelReynolds. When |1 − Z|
	// exceeds RealGasWarning, Note carries a warning with both.
	Z, DensityError, ReynoldsError float64
	// Load is LoadArea·Q, the largest load on the model's load path at
	// this condition (zero when no LoadArea was given); Overloaded is
	// set when it exceeds the RatedLoad.
	Load       quantity.Quantity
	Overloaded bool
	// Cautions are the safety notes for running this condition: always
	// Caution, the asphyxiation and cold hazards of a test gas
	// other than air or below 0 °C, and the load against its rating.
	Cautions []string
}

// Caution accompanies every pressurised or cryogenic tunnel
// condition.
const Caution = "Pressurised and cryogenic tunnel conditions must stay within the facility's certified operating envelope; " +
	"pressure vessels are operated to the applicable pressure-equipment code, and every run follows the facility's safety rules " +
	"under its responsible engineer, whose word overrides any figure computed here."

// RealGasWarning is the departure |1 − Z| of the test gas's estimated
// compressibility factor from the ideal gas's beyond which the
// condition's Note warns that its density and Reynolds number are off.
const RealGasWarning = 0.005

// AsphyxiantCaution is added for a test gas other than air.
const AsphyxiantCaution = "The test gas is not air: nitrogen or any inert gas vented or leaking into the test hall lowers the oxygen content " +
	"without warning and can kill by asphyxiation; enter enclosed spaces only under the facility's oxygen-monitoring, ventilation and " +
	"entry procedures."

// ColdCaution is added for a total temperature below 0 °C.
const ColdCaution = "Cryogenic gas, liquid nitrogen and cold model, sting and tunnel surfaces cause cold burns and embrittle materials; " +
	"handle the model only after warm-up or with the protective equipment the facility's rules require, and use materials rated for the temperature."

// FindCondition finds the total temperature and pressure of an
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
//
// The gas's own range narrows the limits: the static temperature is kept
// at or above the gas's lowest temperature and above its condensation
// temperature at the static pressure plus the CondensationMargin (zero
// when unset), and the total temperature at or below the gas's highest;
// a found state the gas model refuses is never returned. The condition
// is the ideal gas's; for nitrogen it also carries the real gas's
// estimated compressibility factor at the static state and the errors
// of the ideal-gas density and Reynolds number (Z, DensityError,
// ReynoldsError), with a warning in Note beyond RealGasWarning. The
// returned condition carries its safety Cautions, which defer to the facility's
// safety rules and its responsible engineer.
func FindCondition(gas fluids.IdealGas, proto fluids.State, protoSpeed, protoLength quantity.Quantity, lengthRatio float64, lim Limits) (Condition, error) {
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
			return Condition{}, err
		}
	}
	if !(lengthRatio > 0) || math.IsInf(lengthRatio, 0) {
		return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("length ratio", fmt.Sprintf("length ratio %.4g is not positive and finite", lengthRatio))}
	}
	tlo, thi, plo, phi := lim.MinTemperature.Value(), lim.MaxTemperature.Value(), lim.MinPressure.Value(), lim.MaxPressure.Value()
	if !(tlo > 0 && thi >= tlo && plo > 0 && phi >= plo) || math.IsInf(thi+phi, 0) {
		return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", "tunnel limits must be positive and finite with minimum ≤ maximum")}
	}
	for _, c := range []struct {
		n string
		v float64
	}{{"prototype speed", protoSpeed.Value()}, {"prototype length", protoLength.Value()}, {"prototype density", proto.Density.Value()},
		{"prototype viscosity", proto.DynamicViscosity.Value()}, {"prototype speed of sound", proto.SpeedOfSound.Value()}} {
		if !(c.v > 0) || math.IsInf(c.v, 0) {
			return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange(c.n, fmt.Sprintf("%s %.4g is not positive and finite (a fluid state without a speed of sound cannot set a Mach number)", c.n, c.v))}
		}
	}
	if _, err := gas.LowestTemperature(lim.MinPressure); err != nil {
		return Condition{}, err // the gas's constants
	}
	ma := protoSpeed.Value() / proto.SpeedOfSound.Value()
	tr, pr, err := fluids.TotalRatios(gas.Gamma, ma)
	if err != nil {
		return Condition{}, err
	}
	rep := proto.Density.Value() * protoSpeed.Value() * protoLength.Value() / proto.DynamicViscosity.Value()
	lm := protoLength.Value() * lengthRatio
	if !(rep > 0) || math.IsInf(rep, 0) || !(lm > 0) || math.IsInf(lm, 0) {
		return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", fmt.Sprintf("the full-scale Reynolds number %.4g and the model length %.4g m must be positive and finite", rep, lm))}
	}
	tminName, tmaxName := "minimum total temperature", "maximum total temperature"
	// The gas's own range: the static temperature T₀/tr at or above its
	// lowest, the total temperature at or below its highest.
	// The gas's constants in SI units (K, J/(kg·K)), their dimensions
	// checked by LowestTemperature above.
	gmin, gmax, rgas := gas.MinTemperature.Value(), gas.MaxTemperature.Value(), gas.R.Value()
	if g := gmin * tr; g > tlo {
		tlo, tminName = g, "lowest temperature of the "+gas.GasName+" model"
		for i := 0; i < 8 && tlo/tr < gmin; i++ {
			tlo = math.Nextafter(tlo, math.Inf(1)) // T₀/tr rounded below the bound
		}
	}
	if gmax > 0 && gmax < thi {
		thi, tmaxName = gmax, "highest temperature of the "+gas.GasName+" model"
	}
	if !(tlo <= thi) {
		return Condition{}, &fluids.RangeError{Fluid: gas.GasName, Unit: "K", What: fmt.Sprintf("total temperature of the tunnel limits at Mach %.3g (the gas model holds for static temperatures %.4g … %.4g K)", ma, gmin, gmax),
			Value: lim.MaxTemperature.Value(), Lo: tlo, Hi: thi}
	}
	// mu is Sutherland's law, NaN outside the gas's range (which the
	// searches below read as no root).
	mu := func(T float64) float64 {
		v, err := gas.Viscosity(quantity.New(T, quantity.Temperature))
		if err != nil {
			return math.NaN()
		}
		return v.Value()
	}
	speed := func(T float64) float64 { return ma * math.Sqrt(gas.Gamma*rgas*T) }
	// need0 is the total pressure that gives the full-scale Reynolds
	// number at total temperature T0.
	need0 := func(T0 float64) float64 {
		T := T0 / tr
		return pr * rep * mu(T) * rgas * T / (speed(T) * lm)
	}
	c := Condition{Mach: ma, FullReynolds: rep, Gas: gas.GasName}
	pmaxName := "maximum total pressure"
	if q := lim.MaxDynamicPressure; q != (quantity.Quantity{}) {
		if err := q.CheckNamed("maximum dynamic pressure", quantity.Pressure); err != nil {
			return Condition{}, err
		}
		if !(q.Value() > 0) || math.IsInf(q.Value(), 0) {
			return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", "the maximum dynamic pressure must be positive and finite")}
		}
		if pq := pr * 2 * q.Value() / (gas.Gamma * ma * ma); pq < phi {
			phi, pmaxName = pq, "maximum dynamic pressure"
		}
		if phi < plo {
			return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", fmt.Sprintf("the maximum dynamic pressure %.4g Pa allows a total pressure of only %.4g Pa (absolute) at Mach %.3g, below the minimum total pressure %.4g Pa (absolute)", q.Value(), phi, ma, plo))}
		}
	}
	if mg := lim.CondensationMargin; mg != (quantity.Quantity{}) || gas.Saturation != fluids.NoSaturation {
		given := mg != (quantity.Quantity{})
		if given {
			if err := mg.CheckNamed("condensation margin", quantity.Temperature); err != nil {
				return Condition{}, err
			}
		}
		if gas.Saturation == fluids.NoSaturation {
			return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", "a condensation margin is checked for a gas with a saturation curve (nitrogen); "+gas.GasName+" has none here")}
		}
		m := mg.Value()
		if !(m >= 0) || math.IsInf(m, 0) {
			return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", fmt.Sprintf("the condensation margin %.4g K must be finite and not negative", m))}
		}
		name := "condensation margin"
		if !given {
			name = "saturation temperature (no margin given)"
		}
		// The margin at total temperature T0, with the pressure the
		// Reynolds number needs (capped at the limits).
		margin := func(T0 float64) float64 {
			p := min(max(need0(T0), plo), phi) / pr
			lo, err := gas.LowestTemperature(quantity.New(p, quantity.Pressure))
			if err != nil {
				return math.NaN()
			}
			return T0/tr - lo.Value() - m
		}
		// The static state must lie strictly above the condensation
		// temperature, so the search keeps the side where the margin is
		// positive.
		if !(margin(tlo) > 0) {
			if !(margin(thi) > 0) {
				return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.Invalid("", fmt.Sprintf("no total temperature up to %.4g K keeps the static %s gas %.3g K above its condensation temperature", thi, gas.GasName, m))}
			}
			lo, hi := tlo, thi
			for range 200 {
				mid := 0.5 * (lo + hi)
				if margin(mid) > 0 {
					hi = mid
				} else {
					lo = mid
				}
				if hi-lo <= 1e-12*hi {
					break
				}
			}
			tlo, tminName = hi, name
		}
	}
	T0, p0 := tlo, need0(tlo)
	switch {
	case math.IsNaN(p0):
		return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.Invalid("", "no total pressure gives the Reynolds number at the lowest allowed total temperature")}
	case p0 > phi:
		p0 = phi
		c.Binding = append(c.Binding, pmaxName, tminName)
		c.Note = fmt.Sprintf("the Reynolds number needs a total pressure of %s bar (absolute) even at the lowest allowed total temperature; at the %s it reaches only part of full scale", sig(need0(tlo)/1e5, 3), pmaxName)
	case p0 < plo:
		// Warm the gas until the minimum pressure gives the right Re.
		if need0(thi) < plo {
			T0, p0 = thi, plo
			c.Binding = append(c.Binding, "minimum total pressure", tmaxName)
			c.Note = "even at the highest total temperature the minimum total pressure overshoots the full-scale Reynolds number"
		} else {
			var err error
			if T0, err = roots.Bisect(func(T0 float64) float64 { return need0(T0) - plo }, tlo, thi); err != nil {
				return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.Fault{Reason: "no total temperature within the limits gives the Reynolds number at the minimum pressure", Class: quantity.ErrInvalid, Err: err}}
			}
			p0 = plo
			c.Binding = append(c.Binding, "minimum total pressure")
		}
	default:
		c.Binding = append(c.Binding, tminName)
	}
	c.Total = fluids.Total{Temperature: quantity.New(T0, quantity.Temperature), Pressure: quantity.New(p0, quantity.Pressure)}
	T, p := T0/tr, p0/pr
	st, err := gas.At(quantity.New(T, quantity.Temperature), quantity.New(p, quantity.Pressure))
	if err != nil {
		return Condition{}, err // never a state the gas model refuses
	}
	c.Temperature, c.Pressure = st.Temperature, st.Pressure
	c.Velocity = quantity.New(speed(T), quantity.Velocity)
	c.ModelReynolds = st.Density.Value() * speed(T) * lm / st.DynamicViscosity.Value()
	c.ReynoldsRatio = c.ModelReynolds / rep
	c.Q = quantity.New(0.5*gas.Gamma*p*ma*ma, quantity.Pressure)
	if !tunnelFinite(T0, p0, c.Velocity.Value(), c.ModelReynolds, c.ReynoldsRatio, c.Q.Value()) {
		return Condition{}, &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", fmt.Sprintf("the condition is not finite (T₀ = %.4g K, p₀ = %.4g Pa absolute, Re_m = %.4g): the inputs are outside any tunnel's range", T0, p0, c.ModelReynolds))}
	}
	c.Achieved = math.Abs(c.ReynoldsRatio-1) < 1e-6
	if c.Achieved {
		c.Note = "Mach and Reynolds numbers both held"
	}
	if gas.Saturation == fluids.NitrogenSaturation {
		c.realGas()
	}
	if err := c.caution(gas, lim); err != nil {
		return Condition{}, err
	}
	return c, nil
}

// plainSig writes x with at least n significant figures in plain
// decimals (a whole number when it has n digits before the point), for
// the load notes: plainSig(4993.2, 4) is 4993, plainSig(0.39904, 4)
// 0.3990, plainSig(113.4, 2) 113, plainSig(0.0100, 2) 0.010.
func plainSig(x float64, n int) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return fmt.Sprint(x)
	}
	// Round to n figures first, so that a value rounding up across a
	// decade (0.99996 to 4 figures) takes the decimals of its new decade:
	// 1.000, not 1.0000.
	// Whole numbers are written whole, unrounded.
	r, _ := strconv.ParseFloat(strconv.FormatFloat(x, 'e', n-1, 64), 64)
	d := n - 1 - int(math.Floor(math.Log10(math.Abs(r))))
	if d <= 0 {
		return fmt.Sprintf("%.0f", x)
	}
	return fmt.Sprintf("%.*f", d, r)
}

// overloadRemedy says what can lower an overload at the condition. The
// found condition is the least total pressure that holds the Reynolds
// number at the coldest allowed gas, so a lower total pressure always
// gives up Reynolds number; at the tunnel's minimum total pressure it is
// not available at all.
func (c *Condition) overloadRemedy() string {
	for _, b := range c.Binding {
		if b != "minimum total pressure" {
			continue
		}
		return "the tunnel is at its minimum total pressure already, so q cannot be lowered there; use a smaller model, " +
			"test at a lower lift coefficient, or use a stronger balance (a lower total pressure would also lose the Reynolds number)"
	}
	return "use a smaller model, test at a lower lift coefficient, or use a stronger balance; a lower total pressure " +
		"(a dynamic-pressure limit) also lowers the load but gives up part of the Reynolds number"
}

// tunnelFinite reports whether every value is a finite number.
func tunnelFinite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// realGas estimates the nitrogen test gas's compressibility at the
// condition's static state, fills Z, DensityError and ReynoldsError, and
// adds to Note a warning when the ideal gas is off by more than
// RealGasWarning, or that the estimate is out of its range.
func (c *Condition) realGas() {
	e, err := fluids.NitrogenCompressibility(c.Temperature, c.Pressure)
	if err != nil {
		c.addNote(fmt.Sprintf("real-gas departure not estimated (%v): near saturation the ideal-gas density and Re_m can be off by several per cent", err))
		return
	}
	c.Z, c.DensityError, c.ReynoldsError = e.Z, e.Z-1, e.Z/e.SoundSpeedRatio-1
	if math.Abs(1-e.Z) > RealGasWarning {
		c.addNote(fmt.Sprintf("WARNING real gas: at the static %.1f K and %.4g bar (absolute) nitrogen's compressibility factor is Z ≈ %.4f "+
			"(second-virial estimate, generalized correlation): the ideal-gas density is %s and the ideal-gas speed of sound, so the test speed at the held Mach number, %s, "+
			"so the stated Re_m is %s and the real Re_m/Re is about %.4g; the facility's real-gas data govern the run",
			c.Temperature.Value(), c.Pressure.Value()/1e5, e.Z, lowHigh(c.DensityError), lowHigh(1/e.SoundSpeedRatio-1), lowHigh(c.ReynoldsError),
			c.ReynoldsRatio/(1+c.ReynoldsError)))
	}
}

// lowHigh says a relative error x as "1.6 % low" or "0.9 % high".
func lowHigh(x float64) string {
	if x < 0 {
		return fmt.Sprintf("%.1f %% low", -100*x)
	}
	return fmt.Sprintf("%.1f %% high", 100*x)
}

// addNote appends s to the condition's Note.
func (c *Condition) addNote(s string) {
	if c.Note != "" {
		c.Note += "; "
	}
	c.Note += s
}

// caution fills the condition's load and safety notes.
func (c *Condition) caution(gas fluids.IdealGas, lim Limits) error {
	c.Cautions = []string{Caution}
	if gas.GasName != fluids.Air().GasName {
		c.Cautions = append(c.Cautions, AsphyxiantCaution)
	}
	if c.Total.Temperature.Value() < 273.15 {
		c.Cautions = append(c.Cautions, ColdCaution)
	}
	rated, area := lim.RatedLoad, lim.LoadArea
	if area != (quantity.Quantity{}) {
		if err := fail("tunnel condition finder", similarity.CheckInputs(true, similarity.Input{Name: "load area C·S", Value: area, Dim: quantity.Area})); err != nil {
			return err
		}
		c.Load = c.Q.Mul(area)
		if math.IsInf(c.Load.Value(), 0) {
			return &Error{Op: "tunnel condition", Fault: similarity.OutOfRange("", "the load C·S·q is not finite")}
		}
	}
	switch {
	case rated != (quantity.Quantity{}):
		if err := fail("tunnel condition finder", similarity.CheckInputs(true, similarity.Input{Name: "rated load", Value: rated, Dim: quantity.Force})); err != nil {
			return err
		}
		if area == (quantity.Quantity{}) {
			return &Error{Op: "tunnel condition", Fault: similarity.Invalid("", "a rated load needs the load area C·S (the largest force coefficient times the reference area) to compare with")}
		}
		if l, r := c.Load.Value(), rated.Value(); l > r {
			c.Overloaded = true
			c.Cautions = append(c.Cautions, fmt.Sprintf("OVERLOAD: the load C·S·q = %s N at q = %s kPa exceeds the rated %s N of the balance, sting or model by %s %%; "+
				"do not run this condition: %s, as the responsible engineer decides.", plainSig(l, 4), plainSig(c.Q.Value()/1e3, 4), plainSig(r, 4), plainSig(100*(l/r-1), 2), c.overloadRemedy()))
		} else {
			c.Cautions = append(c.Cautions, fmt.Sprintf("load: C·S·q = %s N at q = %s kPa is %s %% of the rated %s N; gusts, starting loads and stall buffet add to it.", plainSig(l, 4), plainSig(c.Q.Value()/1e3, 4), plainSig(100*l/r, 2), plainSig(r, 4)))
		}
	default:
		c.Cautions = append(c.Cautions, fmt.Sprintf("load: no rated load given — check the model, sting and balance against their ratings at q = %s kPa before running.", plainSig(c.Q.Value()/1e3, 4)))
	}
	return nil
}
