package similarity_test

import (
	"math"
	"testing"
	"time"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

// FuzzPlan builds plans from random requirements over a ship-resistance
// problem and checks that Solve ends quickly with a solution whose known
// ratios are finite and positive, or with an error.
func FuzzPlan(f *testing.F) {
	f.Add([]byte{0, 1, 2, 3, 4, 5}, 0.0625)
	f.Add([]byte{0, 0, 0, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7, 7}, 1e-300)
	p := pigroups.MustProblem(
		pigroups.Dep("R", q.Force).WithKind("force"),
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("rho", q.Density, "density"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"))
	set, _ := p.PiSet("rho", "V", "L")
	groups := set.Groups()
	syms := []string{"R", "V", "L", "g", "rho", "mu"}
	f.Fuzz(func(t *testing.T, ops []byte, ratio float64) {
		if len(ops) > 40 {
			ops = ops[:40]
		}
		pl := similarity.NewPlan(p)
		for k, op := range ops {
			switch op % 8 {
			case 0, 1, 2:
				pl.Hold(groups[int(op)%len(groups)])
			case 3:
				pl.SameFluid("rho", "mu")
			case 4:
				pl.SameGravity("g")
			case 5, 6:
				pl.Fix(syms[int(op/8)%len(syms)], ratio*float64(k+1))
			default:
				pl.Fix(syms[int(op/8)%len(syms)], ratio)
			}
		}
		start := time.Now()
		s, err := pl.Solve()
		if d := time.Since(start); d > 2*time.Second {
			t.Fatalf("Solve took %v", d)
		}
		if err != nil {
			return
		}
		for _, sym := range syms {
			r, err := s.Ratio(sym)
			if err != nil {
				continue
			}
			if !math.IsNaN(r.Value) && (!(r.Value > 0) || math.IsInf(r.Value, 0)) {
				t.Fatalf("λ_%s = %v", sym, r.Value)
			}
		}
	})
}

// FuzzRules runs the rule library and the fluid states over the whole
// float range: every result is finite and positive, or an error.
func FuzzRules(f *testing.F) {
	f.Add(0.04, 1.0, 1.0)
	f.Add(1e-300, 1e300, math.NaN())
	f.Add(-1.0, math.Inf(1), 0.0)
	f.Fuzz(func(t *testing.T, a, b, c float64) {
		finite := func(name string, xs ...float64) {
			for _, x := range xs {
				if !(x > 0) || math.IsInf(x, 0) {
					t.Fatalf("%s(%v, %v, %v) gives %v", name, a, b, c, x)
				}
			}
		}
		solved := func(name string, s *similarity.Solution, err error) {
			if err != nil {
				return
			}
			for _, d := range []q.Dim{q.Velocity, q.Force, q.Power, q.Time} {
				if r, err := s.DerivedRatio(d); err == nil && !math.IsNaN(r.Value) {
					finite(name, r.Value)
				}
			}
		}
		s, err := similarity.Froude(similarity.Scales{Length: a, Density: b})
		solved("Froude", s, err)
		s, err = similarity.Reynolds(similarity.Scales{Length: a, KinematicViscosity: b, Density: c})
		solved("Reynolds", s, err)
		s, err = similarity.Mach(similarity.Scales{Length: a, SpeedOfSound: b, Density: c})
		solved("Mach", s, err)
		s, err = similarity.Weber(similarity.Scales{Length: a, Density: b, SurfaceTension: c})
		solved("Weber", s, err)
		s, err = similarity.Euler(similarity.Scales{Length: a, Density: b, Velocity: c})
		solved("Euler", s, err)
		s, err = similarity.Strouhal(similarity.Scales{Length: a, Velocity: b})
		solved("Strouhal", s, err)
		for _, fl := range []fluids.Fluid{fluids.FreshWater(), fluids.SeaWater(), fluids.Water{Salinity: q.New(c, q.Dimensionless)}, fluids.Air(),
			fluids.Constant{FluidName: "oil", Density: q.New(c, q.Density), Viscosity: q.New(b, q.DynamicViscosity)}} {
			st, err := fl.At(q.New(a, q.Temperature), q.New(b, q.Pressure))
			if err != nil {
				continue
			}
			finite(fl.Name(), st.Density.Value(), st.DynamicViscosity.Value(), st.KinematicViscosity.Value())
		}
		if st, err := fluids.StandardAtmosphere(q.New(a, q.Length), fluids.GeopotentialAlt); err == nil {
			finite("StandardAtmosphere", st.Density.Value(), st.Pressure.Value(), st.Temperature.Value(), st.SpeedOfSound.Value())
		}
		if tr, pr, err := fluids.TotalRatios(b, a); err == nil {
			finite("TotalRatios", tr, pr)
		}
	})
}
