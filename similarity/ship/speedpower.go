package ship

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity"
)

// SpeedPowerInput is what a speed–power prediction needs: the ship and
// its allowances as one ITTC-1978 input, the self-propulsion test with
// its faired open-water and resistance curves, and the ship speeds.
type SpeedPowerInput struct {
	// Base holds the ship, the waters, the form factor, the allowances,
	// the propeller geometry and the correlation factors of every speed.
	// Its ModelSpeed, ModelResistance, ModelWake, ThrustDeduction,
	// RelativeRotative, OpenWater and Faired must be left unset: they
	// are filled at each speed from the tests.
	Base PoweringInput
	// SelfPropulsion is the test, with OpenWater and Resistance set; it
	// needs at least three runs at three speeds.
	SelfPropulsion SelfPropulsionTest
	// ShipSpeeds are the speeds of the prediction; each must correspond
	// (V_M = V_S·√λ) to a model speed within both the resistance test's
	// and the self-propulsion test's speeds.
	ShipSpeeds []quantity.Quantity
	// Level is the coverage probability of the band, 0.95 if zero.
	Level float64
}

// SpeedPowerPoint is one speed of the prediction with the band the fits
// put about it.
type SpeedPowerPoint struct {
	PoweringResult
	// PowerU and RevsU are the standard uncertainties of P_D and of n
	// from the fits alone and DoF their effective degrees of freedom;
	// Power and Revs are the intervals ±k·u about the prediction, with k
	// the coverage factor uncertain.CoverageFactor(Level, DoF) (Student's
	// t), which is not stored.
	//
	// PowerU is the standard uncertainty of P_D (W).
	PowerU float64
	// RevsU is the standard uncertainty of n (rev/s).
	RevsU float64
	// PowerDoF and RevsDoF are the effective degrees of freedom.
	PowerDoF float64
	RevsDoF  float64
	// Power is the interval of P_D (W).
	Power [2]float64
	// Revs is the interval of n (rev/s).
	Revs [2]float64
}

// SpeedPower is a speed–power curve with its band.
type SpeedPower struct {
	Points []SpeedPowerPoint
	// Factors are the self-propulsion runs analysed by thrust identity;
	// Wake, Thrust and EtaR their w_TM, t and η_R faired against the
	// model speed (m/s), each by the lowest order whose next term is not
	// significant (fit.NextTerm, orders 0 … 2).
	Factors            []SelfPropulsionPoint
	Wake, Thrust, EtaR *fit.Poly
	Level              float64
	// Warning, when not empty, names what the fits flag: outlying
	// runs of the resistance test or of the factors against speed (a
	// self-propulsion run's own warning, such as a propeller Reynolds
	// number below UsualOpenWaterReynolds, is in its Factors entry, and
	// the open-water curve's in every point's Warning).
	Warning string
	// Method states how the band was found, for the report.
	Method string
}

// SpeedPowerMethod describes the band of PredictSpeedPower.
const SpeedPowerMethod = "band from the fits alone (resistance C_TM(V), open-water K_T(J) and K_Q(J), and the faired w_TM, t, η_R): " +
	"first order, each coefficient's sensitivity by central differences through the whole chain (thrust identity, fairing of the factors, ITTC-1978), " +
	"combined with each fit's covariance, the fits taken as independent of one another; effective degrees of freedom by Welch–Satterthwaite with one term per fit (GUM G.4); " +
	"the measurement uncertainties of the tests themselves are not included"

// PredictSpeedPower analyses the self-propulsion test by thrust identity
// (AnalyseSelfPropulsion), fairs w_TM, t and η_R against the model speed,
// and predicts P_D and n by ITTC1978 at each ship speed from the faired
// resistance, the faired open-water curve and the faired factors, with
// the band the fits put about them (SpeedPowerMethod). A speed outside the
// tests' speeds is an *Error of class quantity.ErrRange: nothing is
// extrapolated.
func PredictSpeedPower(in SpeedPowerInput) (*SpeedPower, error) {
	const op = "speed–power prediction"
	b := in.Base
	if b.ModelSpeed != (quantity.Quantity{}) || b.ModelResistance != (quantity.Quantity{}) || b.ModelWake != 0 || b.ThrustDeduction != 0 ||
		b.RelativeRotative != 0 || len(b.OpenWater) > 0 || b.Faired != nil {
		return nil, &Error{Op: op, Fault: similarity.Invalid("base input", "the base input's model speed, resistance, self-propulsion factors and open-water curve come from the tests: leave them unset")}
	}
	sp := in.SelfPropulsion
	if sp.OpenWater == nil || sp.Resistance == nil {
		return nil, &Error{Op: op, Fault: similarity.Invalid("tests", "the prediction needs the faired open-water curve and the faired resistance curve")}
	}
	if !(in.Base.Scale > 0 && in.Base.Scale < 1) {
		return nil, &Error{Op: op, Fault: similarity.Invalid("scale", fmt.Sprintf("scale %v: want model/ship between 0 and 1", in.Base.Scale))}
	}
	if len(in.ShipSpeeds) == 0 || len(in.ShipSpeeds) > 1000 {
		return nil, &Error{Op: op, Fault: similarity.Invalid("ship speeds", fmt.Sprintf("%d ship speeds: want 1 … 1000", len(in.ShipSpeeds)))}
	}
	level := in.Level
	if level == 0 {
		level = 0.95
	}
	if !(level > 0 && level < 1) {
		return nil, &Error{Op: op, Fault: similarity.Invalid("level", fmt.Sprintf("coverage probability %v: want 0 < p < 1", level))}
	}
	pts, orders, facs, err := factors(sp, nil)
	if err != nil {
		return nil, err
	}
	out := &SpeedPower{Factors: pts, Wake: facs[0], Thrust: facs[1], EtaR: facs[2], Level: level, Method: SpeedPowerMethod}
	var warn []string
	if sp.Resistance.Warning != "" {
		warn = append(warn, "resistance curve: "+sp.Resistance.Warning)
	}
	for k, name := range []string{"w_TM", "t", "η_R"} {
		warn = append(warn, outlierNotes(facs[k], "V_M", " m/s", name)...)
	}

	out.Warning = joinWarnings(warn)
	vms := make([]float64, len(in.ShipSpeeds))
	for i, v := range in.ShipSpeeds {
		name := fmt.Sprintf("ship speed %d", i+1)
		if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: name, Value: v, Dim: quantity.Velocity})); err != nil {
			return nil, err
		}
		vm := v.Value() * math.Sqrt(in.Base.Scale)
		lo, hi := max(sp.Resistance.CT.XMin, facs[0].XMin), min(sp.Resistance.CT.XMax, facs[0].XMax)
		if !(vm >= lo && vm <= hi) {
			return nil, &Error{Op: op, Fault: similarity.OutOfRange(name, fmt.Sprintf("%s: %.4g m/s is a model speed of %.4g m/s, outside the tests' common range %.4g … %.4g m/s: not extrapolated", name, v.Value(), vm, lo, hi))}
		}
		vms[i] = vm
	}
	for i, vm := range vms {
		r, err := predictChain(in.Base, sp.Resistance, sp.OpenWater, facs, vm)
		if err != nil {
			return nil, &Error{Op: op, Fault: similarity.Caused(fmt.Sprintf("ship speed %d", i+1), fmt.Sprintf("ship speed %d (%.4g m/s)", i+1, in.ShipSpeeds[i].Value()), err)}
		}
		pt := SpeedPowerPoint{PoweringResult: r}
		if err := band(&pt, in.Base, sp, orders, facs, vm, level); err != nil {
			return nil, &Error{Op: op, Fault: similarity.Caused(fmt.Sprintf("ship speed %d", i+1), fmt.Sprintf("ship speed %d: the band", i+1), err)}
		}
		out.Points = append(out.Points, pt)
	}
	return out, nil
}

// factors analyses the self-propulsion test and fairs its w_TM, t and
// η_R against the model speed: by fit.NextTerm among orders 0 … 2 when
// orders is nil, or at the given orders (for the sensitivities, which
// must keep the orders).
func factors(sp SelfPropulsionTest, orders *[3]int) ([]SelfPropulsionPoint, [3]int, [3]*fit.Poly, error) {
	const op = "self-propulsion factors"
	var facs [3]*fit.Poly
	var ord [3]int
	pts, err := AnalyseSelfPropulsion(sp)
	if err != nil {
		return nil, ord, facs, err
	}
	v := make([]float64, len(pts))
	ys := [3][]float64{make([]float64, len(pts)), make([]float64, len(pts)), make([]float64, len(pts))}
	for i, p := range pts {
		v[i] = p.ModelSpeed
		ys[0][i], ys[1][i], ys[2][i] = p.Wake, p.ThrustDeduction, p.RelativeRotative
	}
	if len(pts) < 3 {
		return nil, ord, facs, &Error{Op: op, Fault: similarity.Invalid("runs", fmt.Sprintf("%d self-propulsion runs: want at least 3 to fair the factors against speed", len(pts)))}
	}
	for k, name := range []string{"w_TM", "t", "η_R"} {
		if orders == nil {
			facs[k], err = fit.SelectPoly(v, ys[k], 2, fit.NextTerm, nil)
		} else {
			facs[k], err = fit.FitPoly(v, ys[k], orders[k], nil)
		}
		if err != nil {
			return nil, ord, facs, &Error{Op: op, Fault: similarity.Caused(name, "fairing "+name+" against the model speed", err)}
		}
		ord[k] = facs[k].Order
	}
	return pts, ord, facs, nil
}

// predictChain runs ITTC1978 at the model speed vm from the faired
// curves.
func predictChain(base PoweringInput, res *ResistanceFit, ow *OpenWaterFit, facs [3]*fit.Poly, vm float64) (PoweringResult, error) {
	in := base
	in.ModelSpeed = quantity.New(vm, quantity.Velocity)
	in.ModelResistance = quantity.New(res.resistance(vm), quantity.Force)
	in.ModelWake, in.ThrustDeduction, in.RelativeRotative = facs[0].Eval(vm), facs[1].Eval(vm), facs[2].Eval(vm)
	in.Faired = ow
	return ITTC1978(in)
}

// band fills the point's uncertainties: the sensitivities of P_D and n to
// every fitted coefficient, by central differences through the chain,
// combined with each fit's covariance.
func band(pt *SpeedPowerPoint, base PoweringInput, sp SelfPropulsionTest, orders [3]int, facs [3]*fit.Poly, vm, level float64) error {
	type source struct {
		p      *fit.Poly
		eval   func(k int, h float64) (PoweringResult, error)
		varP   float64
		varN   float64
		dof    float64
		gp, gn []float64
	}
	chainWith := func(s SelfPropulsionTest) (PoweringResult, error) {
		_, _, f, err := factors(s, &orders)
		if err != nil {
			return PoweringResult{}, err
		}
		return predictChain(base, s.Resistance, s.OpenWater, f, vm)
	}
	var srcs []*source
	srcs = append(srcs, &source{p: sp.Resistance.CT, eval: func(k int, h float64) (PoweringResult, error) {
		s := sp
		s.Resistance = sp.Resistance.perturbed(k, h)
		return chainWith(s)
	}})
	for which, p := range []*fit.Poly{sp.OpenWater.KT, sp.OpenWater.KQ} {
		srcs = append(srcs, &source{p: p, eval: func(k int, h float64) (PoweringResult, error) {
			s := sp
			s.OpenWater = sp.OpenWater.perturbed(which, k, h)
			return chainWith(s)
		}})
	}
	for i := range facs {
		srcs = append(srcs, &source{p: facs[i], eval: func(k int, h float64) (PoweringResult, error) {
			f := facs
			c := *facs[i]
			c.B = slices.Clone(c.B)
			c.B[k] += h
			f[i] = &c
			return predictChain(base, sp.Resistance, sp.OpenWater, f, vm)
		}})
	}
	var vp, vn, wsP, wsN float64
	for _, s := range srcs {
		m := s.p.Order + 1
		s.gp, s.gn = make([]float64, m), make([]float64, m)
		for k := range m {
			h := 0.1 * s.p.StdErr[k]
			if !(h > 0) {
				continue
			}
			up, err := s.eval(k, h)
			if err != nil {
				return err
			}
			dn, err := s.eval(k, -h)
			if err != nil {
				return err
			}
			s.gp[k] = (up.DeliveredPower.Value() - dn.DeliveredPower.Value()) / (2 * h)
			s.gn[k] = (up.RevsPerSecond - dn.RevsPerSecond) / (2 * h)
		}
		for i := range m {
			for j := range m {
				c := s.p.Cov(i, j)
				s.varP += s.gp[i] * c * s.gp[j]
				s.varN += s.gn[i] * c * s.gn[j]
			}
		}
		s.varP, s.varN = max(0, s.varP), max(0, s.varN)
		vp += s.varP
		vn += s.varN
		s.dof = float64(s.p.DoF)
		wsP += s.varP * s.varP / s.dof
		wsN += s.varN * s.varN / s.dof
	}
	pt.PowerU, pt.RevsU = math.Sqrt(vp), math.Sqrt(vn)
	pt.PowerDoF, pt.RevsDoF = math.Inf(1), math.Inf(1)
	if wsP > 0 {
		pt.PowerDoF = vp * vp / wsP
	}
	if wsN > 0 {
		pt.RevsDoF = vn * vn / wsN
	}
	kp, err := uncertain.CoverageFactor(level, pt.PowerDoF)
	if err != nil {
		return err
	}
	kn, err := uncertain.CoverageFactor(level, pt.RevsDoF)
	if err != nil {
		return err
	}
	p, n := pt.DeliveredPower.Value(), pt.RevsPerSecond
	pt.Power = [2]float64{p - kp*pt.PowerU, p + kp*pt.PowerU}
	pt.Revs = [2]float64{n - kn*pt.RevsU, n + kn*pt.RevsU}
	if !allFinite(pt.PowerU, pt.RevsU, pt.Power[0], pt.Power[1], pt.Revs[0], pt.Revs[1]) {
		return &Error{Op: "speed–power band", Fault: similarity.OutOfRange("band", "the band is out of the range of a float64")}
	}
	return nil
}

// Table writes the speed–power curve as the trade presents it: per
// speed V_S (kn), P_E, w_TS, t, η_R, η_D, n (rpm) with its band and P_D
// (all shafts) with its band at Level, P_E and P_D to four significant
// figures, each in the unit with the SI prefix its column's largest
// value calls for (W, kW or MW, named in the header); then the method of the
// band, every warning (the fits', each self-propulsion run's, each
// speed's) and the caution.
func (s *SpeedPower) Table(md bool) string {
	pc := fmt.Sprintf("%.0f %%", 100*s.Level)
	var pes, pds []float64
	for _, p := range s.Points {
		pes, pds = append(pes, p.EffectivePower.Value()), append(pds, max(p.DeliveredPower.Value(), p.Power[1]))
	}
	ec, dc := siColumn(pes, "W"), siColumn(pds, "W")
	head := []string{"V_S kn", "P_E " + ec.unit, "w_TS", "t", "η_R", "η_D", "n rpm", "n " + pc + " rpm", "P_D " + dc.unit, "P_D " + pc + " " + dc.unit, "±%"}
	var rows [][]string
	var warn []string
	for _, p := range s.Points {
		vk := p.ShipSpeed.Value() * 3600 / 1852
		pd := p.DeliveredPower.Value()
		d := dc.decimals(pd)
		rows = append(rows, []string{
			fmt.Sprintf("%.2f", vk), ec.cell(p.EffectivePower.Value()),
			fmt.Sprintf("%.3f", p.ShipWake), fmt.Sprintf("%.3f", p.ThrustDeduction), fmt.Sprintf("%.3f", p.EtaR), fmt.Sprintf("%.3f", p.EtaD),
			fmt.Sprintf("%.1f", p.RPM), fmt.Sprintf("%.1f … %.1f", 60*p.Revs[0], 60*p.Revs[1]),
			dc.cell(pd), fmt.Sprintf("%.*f … %.*f", d, p.Power[0]/dc.scale, d, p.Power[1]/dc.scale),
			fmt.Sprintf("%.1f", 100*(p.Power[1]-pd)/pd),
		})
		if p.Warning != "" {
			warn = append(warn, fmt.Sprintf("WARNING (%.2f kn): %s", vk, p.Warning))
		}
	}
	var sb strings.Builder
	cp, cn := 1.0, 1.0
	if len(s.Points) > 0 {
		cp, cn = s.Points[0].CP, s.Points[0].CN
	}
	fmt.Fprintf(&sb, "Speed–power prediction, ITTC-1978 (n per propeller; P_D of all shafts; after the correlation factors C_P = %.3g on P_D and C_N = %.3g on n)\n", cp, cn)
	if md {
		sb.WriteString("\n")
	}
	sb.WriteString(similarity.FormatTable(head, rows, md, true))
	sb.WriteString("band: " + s.Method + "\n")
	if s.Warning != "" {
		sb.WriteString("WARNING (fits): " + s.Warning + "\n")
	}
	for _, f := range s.Factors {
		if f.Warning != "" {
			sb.WriteString("WARNING: " + f.Warning + "\n")
		}
	}
	for _, w := range warn {
		sb.WriteString(w + "\n")
	}
	sb.WriteString("CAUTION: " + PoweringCaution + "\n")
	return sb.String()
}
