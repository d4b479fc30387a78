package similarity

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// ErrUnknownRatio is returned by transfers whose ratio has no value.
var ErrUnknownRatio = errors.New("the ratio depends on a free ratio with no value")

func (s *Solution) ratioFor(d quantity.Dim) (float64, error) {
	r, err := s.DerivedRatio(d)
	if err != nil {
		return 0, err
	}
	if math.IsNaN(r.Value) {
		return 0, planError("transfer", "", ErrUnknownRatio, fmt.Sprintf("%s: the ratio %s depends on free ratios with no value (%s)", quantity.Describe(d), r.Law, strings.Join(s.free, ", ")))
	}
	return r.Value, nil
}

// ToPrototype carries a measured model quantity to full scale through the
// ratio its dimension implies: q_p = q_m/λ. That is the whole answer only
// when every group of the other variables is held; while one floats
// (FloatingGroups is not empty) the result is the ratio's share alone,
// without the scale effect of the floating group, and a caller that
// prints it should say so.
func (s *Solution) ToPrototype(q quantity.Quantity) (quantity.Quantity, error) {
	r, err := s.cachedRatio(q.Dim())
	if err != nil {
		return quantity.Quantity{}, err
	}
	return scaled(q, 1/r)
}

// scaled returns q·f, refusing a result that is not finite.
func scaled(q quantity.Quantity, f float64) (quantity.Quantity, error) {
	out := q.Scale(f)
	if v := out.Value(); math.IsNaN(v) || math.IsInf(v, 0) {
		return quantity.Quantity{}, planError("transfer", "", ErrBadRatio, fmt.Sprintf("%v scaled by %g is not finite", q, f))
	}
	return out, nil
}

// ToModel carries a prototype quantity to the model: q_m = λ·q_p.
func (s *Solution) ToModel(q quantity.Quantity) (quantity.Quantity, error) {
	r, err := s.cachedRatio(q.Dim())
	if err != nil {
		return quantity.Quantity{}, err
	}
	return scaled(q, r)
}

// nilDst is the error for a nil destination Series.
func nilDst(op string) error {
	return planError(op, "", ErrPlan, op+": the destination Series is nil")
}

// SeriesToPrototype carries a whole measured Series to full scale into
// dst, with one ratio and no allocation once dst has grown. A nil dst is
// an error matching quantity.ErrInvalid.
func (s *Solution) SeriesToPrototype(dst *quantity.Series, m quantity.Series) error {
	if dst == nil {
		return nilDst("series to prototype")
	}
	r, err := s.cachedRatio(m.Dim())
	if err != nil {
		return err
	}
	dst.SetScale(m, 1/r)
	return nil
}

// SeriesToModel carries a prototype Series to the model into dst. A nil
// dst is an error matching quantity.ErrInvalid.
func (s *Solution) SeriesToModel(dst *quantity.Series, p quantity.Series) error {
	if dst == nil {
		return nilDst("series to model")
	}
	r, err := s.cachedRatio(p.Dim())
	if err != nil {
		return err
	}
	dst.SetScale(p, r)
	return nil
}

// VariableToPrototype carries a model value of one of the plan's variables
// through that variable's own ratio, which differs from the ratio of its
// dimension when the plan scales two variables of one dimension apart (a
// distorted model's horizontal and vertical lengths).
func (s *Solution) VariableToPrototype(symbol string, q quantity.Quantity) (quantity.Quantity, error) {
	i := s.plan.index(symbol)
	if i < 0 {
		return quantity.Quantity{}, unknownVar("to prototype", symbol, s.plan.vars)
	}
	if err := q.CheckNamed(symbol, s.plan.vars[i].Dim); err != nil {
		return quantity.Quantity{}, err
	}
	if r, ok := s.variableRatio(i); ok {
		return scaled(q, 1/r)
	}
	r, err := s.Ratio(symbol)
	if err != nil {
		return quantity.Quantity{}, err
	}
	if math.IsNaN(r.Value) {
		return quantity.Quantity{}, planError("VariableToPrototype", symbol, ErrUnknownRatio, fmt.Sprintf("λ_%s = %s depends on a free ratio with no value", symbol, r.Law))
	}
	return scaled(q, 1/r.Value)
}

// SetPoints turns a prototype operating point, given by variable symbol,
// into model set points in the units chosen by symbol ("kn", "rpm",
// "L/s"). A variable without a chosen unit is given in its coherent SI
// unit, the one quantity.Quantity.String writes: a special name or a
// compound of one where its dimension has one (Pa·s for a dynamic
// viscosity, N·m for a torque, W for a power; units.DerivedUnit), else
// SI base units (m/s). Every variable of the operating point must have a
// known ratio.
//
// Each Value's Number is the model value as computed, at full precision
// (8.5 m/s at a ratio of 0.2 is 1.7000000000000002 m/s), so that a
// program reading it gets the number computed, unrounded. Round for an
// operator when printing: units.Value formats with a precision applied
// to the number and the unit kept, so fmt.Printf("%.4g", v) writes
// "1.7 m/s" and "0.001002 Pa·s".
func (s *Solution) SetPoints(prototype map[string]quantity.Quantity, unitOf map[string]string) (map[string]units.Value, error) {
	out := make(map[string]units.Value, len(prototype))
	for sym, q := range prototype {
		i := s.plan.index(sym)
		if i < 0 {
			return nil, unknownVar("set points", sym, s.plan.vars)
		}
		if err := q.CheckNamed(sym, s.plan.vars[i].Dim); err != nil {
			return nil, err
		}
		r, err := s.Ratio(sym)
		if err != nil {
			return nil, err
		}
		if math.IsNaN(r.Value) {
			return nil, planError("SetPoints", sym, ErrUnknownRatio, fmt.Sprintf("set point for %s: λ_%s = %s depends on a free ratio with no value", sym, sym, r.Law))
		}
		m, err := scaled(q, r.Value)
		if err != nil {
			return nil, err
		}
		u, ok := units.DerivedUnit(m.Dim())
		if !ok {
			u = units.BaseUnit(m.Dim())
		}
		if name, ok := unitOf[sym]; ok {
			var err error
			if u, err = units.Parse(name); err != nil {
				return nil, planError("SetPoints", sym, err, fmt.Sprintf("set point unit for %s", sym))
			}
		}
		v, err := u.ValueOf(m)
		if err != nil {
			return nil, err
		}
		out[sym] = units.Value{Number: v, Unit: u}
	}
	return out, nil
}
