package pigroups_test

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units"
)

// classesOf returns the module's error classes err matches.
func classesOf(err error) []error {
	var cl []error
	for _, c := range []error{q.ErrDimension, q.ErrRange, q.ErrParse, q.ErrUnknown, q.ErrInvalid} {
		if errors.Is(err, c) {
			cl = append(cl, c)
		}
	}
	return cl
}

// TestErrorsOneType: every error the package returns — forming a
// problem, checking a repeating set, evaluating, fitting — is a
// *pigroups.Error matching its kind and exactly one class of the module,
// also when wrapped again; a cause from another package is kept for
// errors.As and not copied into the reason.
func TestErrorsOneType(t *testing.T) {
	err2 := func(_ any, err error) error { return err }
	p := pigroups.MustProblem(pigroups.Dep("F", q.Force), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length))
	s, err := p.PiSet("ρ", "V", "D")
	if err != nil {
		t.Fatal(err)
	}
	ev := s.Evaluator()
	row := func(f, rho, v, d float64) []q.Quantity {
		return []q.Quantity{q.New(f, q.Force), q.New(rho, q.Density), q.New(v, q.Velocity), q.New(d, q.Length)}
	}
	ok := []float64{1, 2, 3, 4, 5}
	law, err := pigroups.FitPowerLaw([]float64{2, 4.1, 5.9, 8.2, 9.9}, [][]float64{ok}, nil)
	if err != nil {
		t.Fatal(err)
	}
	set := uncertain.NewSet()
	ml, err := law.Measured(set, "fit")
	if err != nil {
		t.Fatal(err)
	}
	length := set.MustMeasure(q.New(1, q.Length), set.MustAdd(uncertain.Source{Name: "L", U: q.New(0.01, q.Length)}))
	asDim := func(err error) bool { var e *q.Error; return errors.As(err, &e) && e.Class == q.ErrDimension }
	asUnit := func(err error) bool { var e *units.Error; return errors.As(err, &e) }
	for _, c := range []struct {
		name  string
		err   error
		kind  error
		class error
		cause func(error) bool // a cause kept for errors.As, if any
	}{
		{"no variables", err2(pigroups.NewProblem()), pigroups.ErrNoVariables, q.ErrInvalid, nil},
		{"unknown kind", err2(pigroups.NewProblem(pigroups.VarKind("a", q.Length, "flux capacitance"))), pigroups.ErrUnknownKind, q.ErrUnknown, nil},
		{"kind's dimension", err2(pigroups.NewProblem(pigroups.VarKind("a", q.Length, "density"))), pigroups.ErrKindDimension, q.ErrDimension, nil},
		{"unit does not parse", err2(pigroups.VarUnit("x", "furlong")), nil, q.ErrUnknown, asUnit},
		{"repeating count", p.CheckRepeating("ρ", "V"), pigroups.ErrRepeatingCount, q.ErrInvalid, nil},
		{"repeating unknown", p.CheckRepeating("ρ", "V", "x"), pigroups.ErrRepeatingUnknown, q.ErrUnknown, nil},
		{"no groups", pigroups.MustProblem(pigroups.Var("L", q.Length), pigroups.Var("t", q.Time)).CheckRepeating("L", "t"), pigroups.ErrNoGroups, q.ErrInvalid, nil},
		{"exponent of unknown", err2(s.Groups()[0].Exponent("x")), pigroups.ErrUnknownVariable, q.ErrUnknown, nil},
		{"evaluate count", err2(ev.Row(row(1, 1, 1, 1)[:3], make([]float64, 1))), nil, q.ErrInvalid, nil},
		{"evaluate dimension", err2(ev.Row([]q.Quantity{q.New(1, q.Length), q.New(1, q.Density), q.New(1, q.Velocity), q.New(1, q.Length)}, make([]float64, 1))), nil, q.ErrDimension, asDim},
		{"evaluate not finite", err2(ev.Row(row(1e300, 1e-300, 1e-10, 1e-10), make([]float64, 1))), pigroups.ErrNotFinite, q.ErrRange, nil},
		{"fit too few rows", err2(pigroups.FitPowerLaw([]float64{1, 2}, [][]float64{{1, 2}}, nil)), pigroups.ErrTooFewRows, q.ErrInvalid, nil},
		{"fit collinear", err2(pigroups.FitPowerLaw(ok, [][]float64{{2, 2, 2, 2, 2}}, nil)), pigroups.ErrCollinear, q.ErrInvalid, nil},
		{"measured law: a group of a dimension", func() error { _, _, err := ml.Predict(length); return err }(), pigroups.ErrFitShape, q.ErrDimension, asDim},
		{"measured law: a second registration", err2(law.Measured(set, "fit")), nil, q.ErrInvalid, func(err error) bool { var e *uncertain.Error; return errors.As(err, &e) }},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		for _, err := range []error{c.err, fmt.Errorf("run 7: %w", c.err)} {
			var pe *pigroups.Error
			if !errors.As(err, &pe) {
				t.Errorf("%s: %T is not a *pigroups.Error", c.name, err)
				continue
			}
			if cl := classesOf(err); len(cl) != 1 || cl[0] != c.class {
				t.Errorf("%s: %v matches %v, want %v alone", c.name, err, cl, c.class)
			}
			if c.kind != nil && !errors.Is(err, c.kind) {
				t.Errorf("%s: %v is not %v", c.name, err, c.kind)
			}
			if c.cause != nil && !c.cause(err) {
				t.Errorf("%s: %v loses its cause", c.name, err)
			}
			if pe.Err != nil && strings.Contains(pe.Reason, pe.Err.Error()) {
				t.Errorf("%s: the reason %q repeats the cause as text", c.name, pe.Reason)
			}
			if strings.Count(err.Error(), "pigroups:") != 1 {
				t.Errorf("%s: %q", c.name, err)
			}
		}
	}
}
