package similarity

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// MeasuredRatio returns the ratio (model/prototype) of the dimension d
// as a measured value: its law evaluated at the free ratios, each given
// either in free as a measured value (a scale known to its uncertainty,
// say a model length measured against a drawing's) or fixed in the
// solution (exact). The exponents are exact.
func (s *Solution) MeasuredRatio(d quantity.Dim, free map[string]uncertain.Measured) (uncertain.Measured, error) {
	r, err := s.DerivedRatio(d)
	if err != nil {
		return uncertain.Measured{}, err
	}
	for sym := range free {
		if !slices.Contains(s.Params(), sym) {
			return uncertain.Measured{}, planError("MeasuredRatio", "", ErrBadRatio, fmt.Sprintf("λ_%s is not a parameter of this plan (%s)", sym, strings.Join(s.Params(), ", ")))
		}
	}
	out := uncertain.Exact(quantity.Scalar(1))
	for _, t := range r.Law.Terms {
		x, ok := free[t.Name]
		if !ok {
			fixed, ferr := s.Ratio(t.Name)
			if ferr != nil || math.IsNaN(fixed.Value) {
				return uncertain.Measured{}, planError("MeasuredRatio", "", ErrUnknownRatio, fmt.Sprintf("%s: the free ratio λ_%s has no value; give it in free", quantity.Describe(d), t.Name))
			}
			x = uncertain.Exact(quantity.Scalar(fixed.Value))
		}
		if !x.Quantity().IsDimensionless() || !(x.Value() > 0) || math.IsInf(x.Value(), 0) {
			return uncertain.Measured{}, planError("MeasuredRatio", "", ErrBadRatio, fmt.Sprintf("free ratio λ_%s = %v: want a positive number", t.Name, x.Quantity()))
		}
		if out, err = uncertain.Eval(func() uncertain.Measured {
			return out.Mul(x.Pow(int(t.Exp.Num()), int(t.Exp.Den())))
		}); err != nil {
			return uncertain.Measured{}, err
		}
	}
	return out, nil
}

// MeasuredToPrototype carries a measured model value to full scale,
// q_p = q_m/λ, with λ from MeasuredRatio: the uncertainty of the model
// value and of any measured free ratio both reach the result.
func (s *Solution) MeasuredToPrototype(m uncertain.Measured, free map[string]uncertain.Measured) (uncertain.Measured, error) {
	r, err := s.MeasuredRatio(m.Dim(), free)
	if err != nil {
		return uncertain.Measured{}, err
	}
	return uncertain.Eval(func() uncertain.Measured { return m.Div(r) })
}
