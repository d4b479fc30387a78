package main

import (
	"fmt"
	"io"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
	"similis.dev/similis/units"
)

// JobResult keeps the whole job's key numbers for the test.
type JobResult struct {
	Set        *pigroups.Set
	Conflict   *similarity.Conflict
	Compromise *similarity.Compromise
	NaiveForce q.Quantity // model resistance scaled by λ_F alone
	// ModelResistance is the invented model reading, from inventedCT.
	ModelResistance q.Quantity
	Extrapolate     *ship.HullResult
}

// The invented 32 m catamaran and its invented model data.
const (
	shipLength     = 32.0    // m, waterline
	shipWettedArea = 414.7   // m²
	inventedCT     = 10.3e-3 // the model's total resistance coefficient at 15 kn Froude-scaled (invented)
	allowance      = 0.0004  // C_A (invented, the basin's own in practice)
)

// wholeJob runs variables → Pi set → conflicting plan → compromise →
// transfer → extrapolation for an invented 32 m catamaran.
func wholeJob(w io.Writer, scale float64) (*JobResult, error) {
	res := &JobResult{}
	fmt.Fprintln(w, "\n2. Variables of ship resistance → Pi set")
	p, err := pigroups.NewProblem(
		pigroups.Dep("R", q.Force).WithKind("resistance"),
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("rho", q.Density, "density"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"))
	if err != nil {
		return nil, err
	}
	set, err := p.PiSet("rho", "V", "L")
	if err != nil {
		return nil, err
	}
	res.Set = set.WithConventional()
	fmt.Fprint(w, p.MatrixTable())
	fmt.Fprint(w, res.Set.Format(q.Unicode))

	var fr, re pigroups.Group
	for _, g := range set.Groups() {
		if len(g.Matches) == 0 {
			continue
		}
		switch g.Matches[0].Symbol {
		case "Fr":
			fr = g
		case "Re":
			re = g
		}
	}
	// One water on each side throughout: the model runs in the tank's
	// fresh water, the ship in sea water, both at 15 °C.
	sea, err := fluids.SeaWater().AtCelsius(15)
	if err != nil {
		return nil, err
	}
	tank, err := fluids.FreshWater().AtCelsius(15)
	if err != nil {
		return nil, err
	}
	fmt.Fprintf(w, "\n3. A 1:%g model in the tank's fresh water, the ship in sea water (both 15 °C), holding Fr and Re\n", scale)
	plan := similarity.NewPlan(p).Hold(fr).Hold(re).FixFluids(tank, sea, "rho", "mu", "").SameGravity("g").Fix("L", 1/scale)
	_, err = plan.Solve()
	if res.Conflict = similarity.ConflictOf(err); res.Conflict == nil {
		return nil, fmt.Errorf("expected a conflict, got %v", err)
	}
	fmt.Fprintln(w, "  conflict:", res.Conflict.Summary)
	for _, r := range res.Conflict.Remedies {
		fmt.Fprintf(w, "  - %s\n", r)
	}

	fmt.Fprintln(w, "\n4. The compromise: hold Fr, let Re float (threshold 1e6, a rule of thumb)")
	proto := map[string]q.Quantity{"V": units.MustParse("kn").Of(15), "L": q.New(shipLength, q.Length), "g": units.StandardGravity(),
		"rho": sea.Density, "mu": sea.DynamicViscosity}
	base := similarity.NewPlan(p).FixFluids(tank, sea, "rho", "mu", "").SameGravity("g").Fix("L", 1/scale).Basis("rho", "V", "L")
	if res.Compromise, err = base.Compromise(proto, similarity.Priority{Group: fr}, similarity.Priority{Group: re, MinModel: 1e6}); err != nil {
		return nil, err
	}
	rep, err := similarity.NewReport(res.Compromise.Solution, similarity.ReportOptions{
		Title: "Catamaran model plan", Prototype: proto, Units: map[string]string{"V": "kn", "mu": "mPa*s"},
		Groups: set.Groups(), Compromise: res.Compromise})
	if err != nil {
		return nil, err
	}
	fmt.Fprint(w, rep.Text())

	fmt.Fprintln(w, "\n5. An invented model resistance carried to full scale by Froude scaling alone")
	vm, err := res.Compromise.Solution.ToModel(proto["V"])
	if err != nil {
		return nil, err
	}
	// The invented reading follows the model's size and speed: an
	// invented C_TM held at the Froude-scaled speed,
	// R_m = C_TM·½·ρ_tank·V_m²·S_m.
	lm, sm := shipLength/scale, shipWettedArea/(scale*scale)
	rm := q.New(inventedCT*0.5*tank.Density.Value()*vm.Value()*vm.Value()*sm, q.Force)
	res.ModelResistance = rm
	if res.NaiveForce, err = res.Compromise.Solution.ToPrototype(rm); err != nil {
		return nil, err
	}
	pr := units.Printer{Precision: 4}
	fmt.Fprintf(w, "  model: L = %s, S = %s, V = %s, R = %s (invented: C_TM = %g×10⁻³ held at the Froude-scaled speed)\n",
		pr.Format(q.New(lm, q.Length)), pr.Format(q.New(sm, q.Area)), must(pr.FormatIn(vm, units.MustParse("m/s"))), pr.Format(rm), inventedCT*1e3)
	fmt.Fprintf(w, "  → ship %s (λ_F = λ_ρ·λ_L³, ignoring the Reynolds number)\n", must(pr.FormatIn(res.NaiveForce, units.MustParse("kN"))))

	fmt.Fprintln(w, "\n6. The same reading extrapolated by the ITTC-1957 line (Froude's hypothesis)")
	res.Extrapolate, err = ship.ExtrapolateHull(ship.HullTest{
		Scale: 1 / scale, ModelLength: q.New(lm, q.Length), ModelWettedArea: q.New(sm, q.Area),
		Speeds: []q.Quantity{vm}, Resistances: []q.Quantity{rm},
		Tank: tank,
		Sea:  sea, Allowance: allowance})
	if err != nil {
		return nil, err
	}
	pt := res.Extrapolate.Points[0]
	fmt.Fprintf(w, "  model Re = %.3g, ship Re = %.3g; no form factor (1 + k = 1), C_A = %g (invented)\n", pt.ModelReynolds, pt.ShipReynolds, allowance)
	fmt.Fprintf(w, "  C_Tm = %.4f, C_Fm = %.4f, C_R = C_Tm − C_Fm = %.4f; ship C_Fs = %.4f, C_Ts = C_Fs + C_R + C_A = %.4f\n", pt.ModelCT*1e3, pt.ModelCF*1e3, pt.Residual*1e3, pt.ShipCF*1e3, pt.ShipCT*1e3)
	fmt.Fprintln(w, "  (coefficients × 1000)")
	if pt.Warning != "" {
		fmt.Fprintln(w, "  WARNING:", pt.Warning)
	}
	fmt.Fprintf(w, "  ship resistance %s, effective power %s — the friction correction the held Froude number cannot give\n",
		must(pr.FormatIn(pt.ShipResistance, units.MustParse("kN"))), must(pr.FormatIn(pt.EffectivePower, units.MustParse("kW"))))
	fmt.Fprintln(w, "\nCAUTION:", ship.HullCaution)
	return res, nil
}

func must(s string, err error) string {
	if err != nil {
		return "(" + err.Error() + ")"
	}
	return s
}
