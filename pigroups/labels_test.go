package pigroups_test

import (
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestLabelsFollowKinds: a group's label follows its variables' kinds. A
// force given no kind over ρ·V²·L² is ∝C_D and, for a hull's resistance,
// ∝C_T (both said); of the kind resistance ∝C_T, of the kind drag ∝C_D. A
// rotational speed makes V/(n·D) the advance coefficient J, a frequency
// the Strouhal number's inverse. A group with a rotational speed always
// states its definition with n's measure, ψ_p with n in rev/s included.
func TestLabelsFollowKinds(t *testing.T) {
	force := func(kind string) pigroups.Variable {
		return pigroups.Variable{Symbol: "R", Dim: q.Force, Kind: kind, Role: pigroups.Dependent}
	}
	n := pigroups.VarKind("n", q.AngularVelocity, "rotational speed").InRevolutions()
	cases := []struct {
		name  string
		vars  []pigroups.Variable
		rep   []string
		label string
		desc  string // a part of Describe
	}{
		{"plain force", []pigroups.Variable{force(""), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length)},
			[]string{"ρ", "V", "L"}, "∝C_D (∝C_T for a hull's resistance)", "for a hull's resistance (give the force the kind resistance) the group is read as ∝C_T, the total resistance coefficient"},
		{"resistance", []pigroups.Variable{force("resistance"), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length)},
			[]string{"ρ", "V", "L"}, "∝C_T", "proportional to the total resistance coefficient"},
		{"drag", []pigroups.Variable{force("drag"), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length)},
			[]string{"ρ", "V", "L"}, "∝C_D", "proportional to the drag coefficient"},
		{"advance coefficient", []pigroups.Variable{pigroups.Dep("V", q.Velocity), n, pigroups.Var("D", q.Length)},
			[]string{"n", "D"}, "J", "J (advance coefficient; J = V/(n·D), n in revolutions per second"},
		{"Strouhal", []pigroups.Variable{pigroups.Dep("V", q.Velocity), pigroups.Var("f", q.Frequency), pigroups.Var("D", q.Length)},
			[]string{"f", "D"}, "1/St", "Strouhal number"},
		{"pump pressure coefficient in rev/s", []pigroups.Variable{pigroups.Dep("Δp", q.Pressure).WithKind("pressure difference"), pigroups.Var("ρ", q.Density), n, pigroups.Var("D", q.Length)},
			[]string{"ρ", "n", "D"}, "ψ_p", "ψ_p (pressure coefficient of a pump or fan; ψ_p = Δp/(ρ·n²·D²), n in revolutions per second"},
	}
	for _, c := range cases {
		s, err := pigroups.MustProblem(c.vars...).PiSet(c.rep...)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		g := s.Groups()[0]
		if g.Label() != c.label || !strings.Contains(g.Describe(), c.desc) {
			t.Errorf("%s: label %q, describe %q; want %q and %q", c.name, g.Label(), g.Describe(), c.label, c.desc)
		}
	}
}
