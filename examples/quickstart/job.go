package main

import (
	"fmt"
	"io"
	"math"

	"similis.dev/similis/examples/internal/cli"
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
	// ModelResistance is the invented model reading, R_m =
	// ModelCT·½ρV_m²S_m, with ModelCT = C_FM(Re_m) + Residual: the
	// towing-tank test's residuary coefficient C_R at the same Froude
	// number (inventedCR), held for a model of any size, on the ITTC-1957
	// line at this model's Reynolds number (Froude's hypothesis).
	ModelResistance q.Quantity
	ModelCT         float64
	Residual        float64
	Extrapolate     *ship.HullResult
}

// The invented 32 m catamaran and its invented model data.
const (
	shipLength     = 32.0   // m, waterline
	shipWettedArea = 414.7  // m²
	allowance      = 0.0004 // C_A (invented, the basin's own in practice)
)

// The same vessel's invented resistance test as examples/towingtank
// prints it: its 2 m model (S = 1.62 m²) towed at these speeds in the
// same 15 °C fresh water, so that both programs give one C_TM at one
// Froude number.
var (
	tankModelLength, tankModelArea = 2.0, 1.62                                                         // m, m²
	tankSpeeds                     = []float64{0.50, 0.65, 0.80, 1.00, 1.30, 1.60, 2.00, 2.40}         // m/s
	tankResistances                = []float64{1.105, 1.778, 2.600, 4.055, 7.270, 12.14, 22.30, 38.10} // N
)

// inventedCR returns the invented test's residuary coefficient C_R at
// the Froude number fn, with the C_TM and C_F it comes from: the towing-tank
// test's C_TM = R/(½ρV²S) interpolated linearly in Fn between its two
// neighbouring runs, less the ITTC-1957 C_F of its 2 m model at the
// speed of that Froude number, V = Fn·√(g·L), in the tank's water (rho
// its density, nu its kinematic viscosity). C_R is quoted to 10⁻⁷ (four
// decimals of 10³C_R) as the invented test's record gives it, and the
// C_TM returned is C_F + C_R.
func inventedCR(fn, rho, nu float64) (cr, ct, cf float64, err error) {
	const g = 9.80665
	ctAt := func(i int) (float64, float64) {
		v := tankSpeeds[i]
		return v / math.Sqrt(g*tankModelLength), tankResistances[i] / (0.5 * rho * v * v * tankModelArea)
	}
	for i := 1; i < len(tankSpeeds); i++ {
		f0, c0 := ctAt(i - 1)
		f1, c1 := ctAt(i)
		if fn >= f0 && fn <= f1 {
			ct = c0 + (fn-f0)/(f1-f0)*(c1-c0)
			cf, err := ship.LineITTC1957.CF(fn * math.Sqrt(g*tankModelLength) * tankModelLength / nu)
			if err != nil {
				return 0, 0, 0, err
			}
			// The record quotes 10³C_R to four decimals; C_TM is
			// C_F + C_R, within 5×10⁻⁸ of the interpolated value, so
			// that the printed sums add up.
			cr = math.Round((ct-cf)*1e7) / 1e7
			return cr, cf + cr, cf, nil
		}
	}
	return 0, 0, 0, fmt.Errorf("the Froude number %.4g is outside the invented resistance test's range", fn)
}

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
	// The invented reading follows the model's size and speed by
	// Froude's hypothesis: the residuary coefficient C_R of the
	// towing-tank test at this Froude number is held, and the model's
	// own frictional coefficient is added, C_TM = C_FM(Re_m) + C_R, so
	// R_m = C_TM·½·ρ_tank·V_m²·S_m.
	lm, sm := shipLength/scale, shipWettedArea/(scale*scale)
	fn := vm.Value() / math.Sqrt(9.80665*lm)
	nuTank := tank.KinematicViscosity.Value()
	cr, ctTank, cfTank, err := inventedCR(fn, tank.Density.Value(), nuTank)
	if err != nil {
		return nil, err
	}
	rem := vm.Value() * lm / nuTank
	cfm, err := ship.LineITTC1957.CF(rem)
	if err != nil {
		return nil, err
	}
	ctm := cfm + cr
	res.ModelCT, res.Residual = ctm, cr
	rm := q.New(ctm*0.5*tank.Density.Value()*vm.Value()*vm.Value()*sm, q.Force)
	res.ModelResistance = rm
	if res.NaiveForce, err = res.Compromise.Solution.ToPrototype(rm); err != nil {
		return nil, err
	}
	pr := units.Printer{Precision: 4}
	fmt.Fprintf(w, "  model: L = %s, S = %s, V = %s (Fn = %.4f), R = %s\n", pr.Format(q.New(lm, q.Length)), pr.Format(q.New(sm, q.Area)),
		must(pr.FormatIn(vm, units.MustParse("m/s"))), fn, siSig(rm.Value(), "N", 4))
	fmt.Fprintf(w, "  (invented: the towingtank example's test of the same vessel, on its 2 m model at this Froude number, gives 10³C_TM = %.4f\n", ctTank*1e3)
	fmt.Fprintf(w, "  (linear in Fn between its runs) and 10³C_R = 10³(C_TM − C_FM) = %.4f − %.4f = %.4f; Froude's hypothesis holds C_R for a model\n",
		ctTank*1e3, cfTank*1e3, cr*1e3)
	fmt.Fprintf(w, "  of any size, so this model reads 10³C_TM = 10³(C_FM + C_R) = %.4f + %.4f = %.4f, with its own ITTC-1957 C_FM at Re = %.3g)\n",
		cfm*1e3, cr*1e3, ctm*1e3, rem)
	fmt.Fprintf(w, "  → ship %s (λ_F = λ_ρ·λ_L³, ignoring the Reynolds number: a smaller model, with its larger C_FM, predicts a heavier ship)\n",
		siSig(res.NaiveForce.Value(), "N", 4))

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
	fmt.Fprintf(w, "  10³C_TM = %.3f, 10³C_FM = %.3f, 10³C_R = 10³(C_TM − C_FM) = %.3f; ship 10³C_FS = %.3f, 10³C_TS = 10³(C_FS + C_R + C_A) = %.3f\n",
		pt.ModelCT*1e3, pt.ModelCF*1e3, pt.Residual*1e3, pt.ShipCF*1e3, pt.ShipCT*1e3)
	if pt.Warning != "" {
		fmt.Fprintln(w, "  WARNING:", pt.Warning)
	}
	kn, _ := units.MustParse("kn").ValueOf(pt.ShipSpeed)
	fmt.Fprintf(w, "  ship: L = %.4g m, S = %.4g m² (wetted), V = %.4g kn = %s m/s, sea water at 15 °C, ρ = %s kg/m³\n",
		shipLength, shipWettedArea, kn, cli.Sig(pt.ShipSpeed.Value(), 4), cli.Sig(sea.Density.Value(), 6))
	fmt.Fprintf(w, "  ship resistance R = C_TS·½ρV²S = %s, effective power P_E = R·V = %s — the friction correction the held Froude number cannot give\n",
		siSig(pt.ShipResistance.Value(), "N", 3), siSig(pt.EffectivePower.Value(), "W", 3))
	fmt.Fprintln(w, "\nCAUTION:", ship.HullCaution)
	return res, nil
}

func must(s string, err error) string {
	if err != nil {
		return "(" + err.Error() + ")"
	}
	return s
}
