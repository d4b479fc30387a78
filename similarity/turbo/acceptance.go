package turbo

import (
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
)

// Grade is an acceptance grade of ISO 9906:2012: 1U, 1E and 1B the
// tightest, 2B and 2U broader, 3B broader still. B grades are bilateral
// (a tolerance either side of the guarantee), U grades unilateral (flow
// and head no lower than guaranteed); 1E is for pumps bought on their
// energy use.
type Grade uint8

// The acceptance grades. The zero Grade is none of them.
const (
	Grade1U Grade = iota + 1
	Grade1E
	Grade1B
	Grade2B
	Grade2U
	Grade3B
)

// Grades returns the acceptance grades, tightest first.
func Grades() []Grade { return []Grade{Grade1U, Grade1E, Grade1B, Grade2B, Grade2U, Grade3B} }

// String returns the grade's name, "1B".
func (g Grade) String() string {
	if g >= Grade1U && g <= Grade3B {
		return [...]string{"1U", "1E", "1B", "2B", "2U", "3B"}[g-1]
	}
	return fmt.Sprintf("Grade(%d)", uint8(g))
}

// Tolerance holds the tolerance factors of an acceptance grade, as
// fractions: the flow and head may lie between Q_G(1 − FlowMinus) and
// Q_G(1 + FlowPlus), H_G(1 − HeadMinus) and H_G(1 + HeadPlus); the power
// may be at most P_G(1 + PowerPlus); the efficiency at least
// η_G(1 − EfficiencyMinus).
type Tolerance struct {
	FlowMinus, FlowPlus float64 // t_Q
	HeadMinus, HeadPlus float64 // t_H
	PowerPlus           float64 // t_P
	EfficiencyMinus     float64 // t_η
}

// Tolerance returns the grade's tolerance factors, those of ISO 9906:2012
// Table 8 for pumps of more than 10 kW shaft power, quoted from memory
// (the standard itself was not to hand). A verdict on them is
// provisional: check the factors against ISO 9906:2012 Table 8, and the
// contract, which may set its own, before a pump is accepted or rejected
// on them:
//
//	grade   t_Q     t_H     t_P    t_η
//	1U      +10 %   +6 %    +10 %  ≥ 0 %
//	1E      ±5 %    ±3 %    +4 %   ≥ 0 %
//	1B      ±5 %    ±3 %    +4 %   −3 %
//	2B      ±8 %    ±5 %    +8 %   −5 %
//	2U      +16 %   +10 %   +16 %  −5 %
//	3B      ±9 %    ±7 %    +9 %   −7 %
//
// The standard gives wider tolerances for pumps of 10 kW and below, which
// this table does not hold. A Grade out of the list is an *Error of class
// quantity.ErrInvalid.
func (g Grade) Tolerance() (Tolerance, error) {
	switch g {
	case Grade1U:
		return Tolerance{FlowPlus: 0.10, HeadPlus: 0.06, PowerPlus: 0.10}, nil
	case Grade1E:
		return Tolerance{FlowMinus: 0.05, FlowPlus: 0.05, HeadMinus: 0.03, HeadPlus: 0.03, PowerPlus: 0.04}, nil
	case Grade1B:
		return Tolerance{FlowMinus: 0.05, FlowPlus: 0.05, HeadMinus: 0.03, HeadPlus: 0.03, PowerPlus: 0.04, EfficiencyMinus: 0.03}, nil
	case Grade2B:
		return Tolerance{FlowMinus: 0.08, FlowPlus: 0.08, HeadMinus: 0.05, HeadPlus: 0.05, PowerPlus: 0.08, EfficiencyMinus: 0.05}, nil
	case Grade2U:
		return Tolerance{FlowPlus: 0.16, HeadPlus: 0.10, PowerPlus: 0.16, EfficiencyMinus: 0.05}, nil
	case Grade3B:
		return Tolerance{FlowMinus: 0.09, FlowPlus: 0.09, HeadMinus: 0.07, HeadPlus: 0.07, PowerPlus: 0.09, EfficiencyMinus: 0.07}, nil
	}
	return Tolerance{}, &Error{Op: "acceptance grade", Fault: similarity.Invalid("grade", fmt.Sprintf("grade %d is not one of ISO 9906's 1U, 1E, 1B, 2B, 2U, 3B", uint8(g)))}
}

// Guarantee is the guarantee point of a pump at its specified speed: the
// flow and head always, and the efficiency or the power input where they
// are guaranteed (left zero where not).
type Guarantee struct {
	Flow, Head quantity.Quantity // Q_G, H_G
	Power      quantity.Quantity // P_G, the pump power input; zero if not guaranteed
	Efficiency float64           // η_G; 0 if not guaranteed
}

// Verdict is the judgment of a guarantee point against one grade, on the
// fitted curves. The flows and heads are in m³/s and m, powers in W.
type Verdict struct {
	Grade     Grade
	Tolerance Tolerance

	// The tolerance cross through the guarantee point: the vertical bar
	// at Q_G from HeadBar[0] to HeadBar[1], the horizontal bar at H_G
	// from FlowBar[0] to FlowBar[1].
	//
	// HeadBar is the vertical bar's span of head (m).
	HeadBar [2]float64
	// FlowBar is the horizontal bar's span of flow (m³/s).
	FlowBar [2]float64
	// HeadAtGuaranteeFlow is the fitted head at Q_G, with its intervals;
	// the curve meets the vertical bar when it lies in HeadBar.
	HeadAtGuaranteeFlow fit.Prediction
	MeetsVertical       bool
	// FlowAtGuaranteeHead is the flow where the fitted Q–H curve has the
	// head H_G within the horizontal bar (the crossing nearest Q_G), and
	// MeetsHorizontal whether there is one (m³/s).
	FlowAtGuaranteeHead float64
	MeetsHorizontal     bool
	// HeadCrossing is the flow where the fitted Q–H curve has the head
	// H_G anywhere in the tested range (the crossing nearest Q_G), inside
	// the horizontal bar or not, and HeadCrossed whether there is one: a
	// curve that misses the bar may still cross H_G just outside it
	// (m³/s).
	HeadCrossing float64
	HeadCrossed  bool
	// FlowHeadMet: the fitted Q–H curve meets the cross, on either bar.
	FlowHeadMet bool

	// Intersection is the flow and head where the fitted Q–H curve meets
	// the straight line through the origin and the guarantee point;
	// set when the efficiency or the power is guaranteed: the flow
	// (m³/s) and the head (m).
	Intersection [2]float64
	// EfficiencyAt is the fitted efficiency at the intersection's flow,
	// EfficiencyMin = η_G(1 − t_η), EfficiencyMet whether
	// EfficiencyAt.Y ≥ EfficiencyMin; EfficiencyJudged is false where no
	// efficiency is guaranteed.
	EfficiencyAt                    fit.Prediction
	EfficiencyMin                   float64
	EfficiencyJudged, EfficiencyMet bool
	// PowerAt is the fitted power at the intersection's flow, PowerMax =
	// P_G(1 + t_P), PowerMet whether PowerAt.Y ≤ PowerMax; PowerJudged is
	// false where no power is guaranteed.
	PowerAt fit.Prediction
	// PowerMax is P_G(1 + t_P) (W).
	PowerMax              float64
	PowerJudged, PowerMet bool

	// Met is the verdict: every guaranteed quantity within its tolerance.
	Met bool
	// Notes says what the numbers above do not: first, always,
	// ProvisionalNote; then a bar partly outside the tested range, a
	// small pump whose grade tolerances are wider.
	Notes []string
	// Caution is PumpCaution.
	Caution string
}

// ProvisionalNote is the first of every Verdict's Notes: the tolerance
// factors of Grade.Tolerance and the test-speed band of ReducePoints are
// quoted from memory.
const ProvisionalNote = "PROVISIONAL: the verdict rests on tolerance factors and a test-speed band quoted from memory; " +
	"check them against ISO 9906:2012 Table 8 (and the contract, which may set its own) before a pump is accepted or rejected on it"

// CheckGuarantee judges the guarantee point g against the grade, on the
// curves fitted to the test points reduced to the specified speed, by the
// method of ISO 9906:2012 as summarised in the trade's references (KSB's
// centrifugal pump lexicon, "Tolerance"); this is what it implements:
//
//   - Flow and head: the tolerance cross through (Q_G, H_G) has a
//     vertical bar from H_G(1 − t_H−) to H_G(1 + t_H+) at Q_G and a
//     horizontal bar from Q_G(1 − t_Q−) to Q_G(1 + t_Q+) at H_G. The
//     guarantee is met if the fitted Q–H curve meets or touches either
//     bar: the fitted head at Q_G lies on the vertical bar, or the fitted
//     curve has the head H_G somewhere on the horizontal bar (sought on a
//     grid of 512 intervals, each change of sign refined by bisection).
//   - Efficiency: the straight line through the origin and the guarantee
//     point meets the fitted Q–H curve at the flow Q_X (the crossing
//     within the tested range nearest Q_G); the efficiency of the fitted
//     Q–η curve at Q_X must be at least η_G(1 − t_η).
//   - Power, where guaranteed: the fitted Q–P curve at the same Q_X must
//     be at most P_G(1 + t_P) (applied here at Q_X as the efficiency is;
//     where the contract says otherwise it governs).
//
// The verdict is read on the fitted curves, whose intervals are reported
// beside it; the standard's tolerance factors already allow for the
// measurement uncertainty of a test of the grade. Q_G must lie within the
// tested range, and, where the efficiency or power is guaranteed, the line
// must meet the fitted Q–H curve within it: an *Error of class
// quantity.ErrRange otherwise, since a curve is not extrapolated. Parts of
// the horizontal bar outside the tested range are not searched, and a
// Note says so. See PumpCaution.
func CheckGuarantee(c PumpCurves, g Guarantee, grade Grade) (Verdict, error) {
	const op = "acceptance check"
	t, err := grade.Tolerance()
	if err != nil {
		return Verdict{}, err
	}
	if c.Head == nil || c.Power == nil || c.Efficiency == nil {
		return Verdict{}, &Error{Op: op, Fault: similarity.Invalid("curves", "the Q–H, Q–P and Q–η curves must all be fitted (FitPumpCurves)")}
	}
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "guarantee flow", Value: g.Flow, Dim: quantity.VolumeFlowRate},
		similarity.Input{Name: "guarantee head", Value: g.Head, Dim: quantity.Length})); err != nil {
		return Verdict{}, err
	}
	powerGiven := g.Power != (quantity.Quantity{})
	if powerGiven {
		if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: "guarantee power", Value: g.Power, Dim: quantity.Power})); err != nil {
			return Verdict{}, err
		}
	}
	if !(g.Efficiency >= 0 && g.Efficiency <= 1) {
		return Verdict{}, &Error{Op: op, Fault: similarity.Invalid("guarantee efficiency", fmt.Sprintf("guarantee efficiency %.4g: want 0 (not guaranteed) to 1", g.Efficiency))}
	}
	qg, hg := g.Flow.Value(), g.Head.Value()
	v := Verdict{Grade: grade, Tolerance: t, Notes: []string{ProvisionalNote}, Caution: PumpCaution,
		HeadBar: [2]float64{hg * (1 - t.HeadMinus), hg * (1 + t.HeadPlus)},
		FlowBar: [2]float64{qg * (1 - t.FlowMinus), qg * (1 + t.FlowPlus)},
	}
	hf := c.Head
	if v.HeadAtGuaranteeFlow, err = hf.Predict(qg); err != nil {
		return Verdict{}, &Error{Op: op, Fault: similarity.Caused("guarantee flow", fmt.Sprintf("the guarantee flow %.6g m³/s against the tested range %.6g to %.6g m³/s", qg, hf.XMin, hf.XMax), err)}
	}
	hq := v.HeadAtGuaranteeFlow.Y
	v.MeetsVertical = hq >= v.HeadBar[0] && hq <= v.HeadBar[1]
	lo, hi := max(v.FlowBar[0], hf.XMin), min(v.FlowBar[1], hf.XMax)
	if lo > v.FlowBar[0] || hi < v.FlowBar[1] {
		v.Notes = append(v.Notes, fmt.Sprintf("the horizontal bar of the tolerance cross (%.6g to %.6g m³/s) reaches outside the tested range (%.6g to %.6g m³/s); only its part within the range was searched",
			v.FlowBar[0], v.FlowBar[1], hf.XMin, hf.XMax))
	}
	if lo < hi {
		v.FlowAtGuaranteeHead, v.MeetsHorizontal = rootNearest(func(x float64) float64 { return hf.Eval(x) - hg }, lo, hi, qg)
	}
	if v.MeetsHorizontal {
		v.HeadCrossing, v.HeadCrossed = v.FlowAtGuaranteeHead, true
	} else {
		v.HeadCrossing, v.HeadCrossed = rootNearest(func(x float64) float64 { return hf.Eval(x) - hg }, hf.XMin, hf.XMax, qg)
	}
	v.FlowHeadMet = v.MeetsVertical || v.MeetsHorizontal
	v.Met = v.FlowHeadMet
	v.EfficiencyJudged, v.PowerJudged = g.Efficiency > 0, powerGiven
	if v.EfficiencyJudged || v.PowerJudged {
		slope := hg / qg
		qx, ok := rootNearest(func(x float64) float64 { return hf.Eval(x) - slope*x }, hf.XMin, hf.XMax, qg)
		if !ok {
			return Verdict{}, &Error{Op: op, Fault: similarity.OutOfRange("intersection", fmt.Sprintf("the line through the origin and the guarantee point (H = %.6g s/m²·Q) does not meet the fitted Q–H curve within the tested range %.6g to %.6g m³/s: the efficiency and power cannot be judged without extrapolating",
				slope, hf.XMin, hf.XMax))}

		}
		v.Intersection = [2]float64{qx, hf.Eval(qx)}
		if v.EfficiencyJudged {
			if v.EfficiencyAt, err = c.Efficiency.Predict(qx); err != nil {
				return Verdict{}, &Error{Op: op, Fault: similarity.Caused("intersection", "the efficiency at the intersection", err)}
			}
			v.EfficiencyMin = g.Efficiency * (1 - t.EfficiencyMinus)
			v.EfficiencyMet = v.EfficiencyAt.Y >= v.EfficiencyMin
			v.Met = v.Met && v.EfficiencyMet
		}
		if v.PowerJudged {
			if v.PowerAt, err = c.Power.Predict(qx); err != nil {
				return Verdict{}, &Error{Op: op, Fault: similarity.Caused("intersection", "the power at the intersection", err)}
			}
			v.PowerMax = g.Power.Value() * (1 + t.PowerPlus)
			v.PowerMet = v.PowerAt.Y <= v.PowerMax
			v.Met = v.Met && v.PowerMet
		}
	}
	pw := c.Power.Eval(qg) // the fitted power at the guarantee flow, or the guaranteed power
	if powerGiven {
		pw = g.Power.Value()
	}
	if pw <= 10e3 {
		v.Notes = append(v.Notes, "the pump's power is 10 kW or less, for which ISO 9906 gives wider tolerances than these (not applied here)")
	}
	if !finite(hq, v.Intersection[0], v.Intersection[1], v.EfficiencyAt.Y, v.PowerAt.Y, v.FlowAtGuaranteeHead, v.HeadCrossing) {
		return Verdict{}, &Error{Op: op, Fault: similarity.OutOfRange("curves", "a fitted value is not finite")}
	}
	return v, nil
}

// rootGrid is the number of intervals on which rootNearest looks for a
// change of sign.
const rootGrid = 512

// rootNearest returns the root of f in [lo, hi] nearest x0, found as a
// change of sign (or a zero) on a grid of rootGrid intervals refined by
// bisection, and whether there is one.
func rootNearest(f func(float64) float64, lo, hi, x0 float64) (float64, bool) {
	best, found := 0.0, false
	consider := func(r float64) {
		if !found || math.Abs(r-x0) < math.Abs(best-x0) {
			best, found = r, true
		}
	}
	a, fa := lo, f(lo)
	if fa == 0 {
		consider(a)
	}
	for i := 1; i <= rootGrid; i++ {
		b := lo + (hi-lo)*float64(i)/rootGrid
		if i == rootGrid {
			b = hi
		}
		fb := f(b)
		switch {
		case fb == 0:
			consider(b)
		case fa != 0 && (fa < 0) != (fb < 0):
			x, y, fx := a, b, fa
			for range 200 {
				m := x + (y-x)/2
				if m <= x || m >= y {
					break
				}
				fm := f(m)
				if fm == 0 {
					x, y = m, m
					break
				}
				if (fm < 0) == (fx < 0) {
					x, fx = m, fm
				} else {
					y = m
				}
			}
			consider(x + (y-x)/2)
		}
		a, fa = b, fb
	}
	return best, found
}

// String returns v.Table(false).
func (v Verdict) String() string { return v.Table(false) }

// Table writes the verdict as a test report presents it: a line with the
// grade, its tolerance factors and the verdict, marked PROVISIONAL; one
// row per check (the head at Q_G on the vertical bar, the flow at H_G on
// the horizontal bar, and the efficiency and power at Q_X where they are
// guaranteed) with the fitted value, the tolerance and whether it is met,
// flows in m³/s, heads in m and powers in kW to four significant
// figures; then the notes and the caution. Markdown if md is set.
func (v Verdict) Table(md bool) string {
	t := v.Tolerance
	yes := func(b bool) string {
		if b {
			return "yes"
		}
		return "NO"
	}
	band := func(minus, plus float64) string {
		switch minus {
		case plus:
			return fmt.Sprintf("±%.3g %%", 100*plus)
		case 0:
			return fmt.Sprintf("+%.3g %%", 100*plus)
		}
		return fmt.Sprintf("−%.3g/+%.3g %%", 100*minus, 100*plus)
	}
	verdict := "NOT MET"
	if v.Met {
		verdict = "MET"
	}
	var sb strings.Builder
	teta := "0 %"
	if t.EfficiencyMinus != 0 {
		teta = fmt.Sprintf("−%.3g %%", 100*t.EfficiencyMinus)
	}
	fmt.Fprintf(&sb, "Acceptance check, grade %v (t_Q %s, t_H %s, t_P +%.3g %%, t_η %s): %s, PROVISIONAL\n",
		v.Grade, band(t.FlowMinus, t.FlowPlus), band(t.HeadMinus, t.HeadPlus), 100*t.PowerPlus, teta, verdict)
	if md {
		sb.WriteString("\n")
	}
	horiz := []string{"Q at H_G (horizontal bar)", "none in the bar", fmt.Sprintf("%.4g … %.4g m³/s", v.FlowBar[0], v.FlowBar[1]), yes(v.MeetsHorizontal)}
	switch {
	case v.MeetsHorizontal:
		horiz[1] = fmt.Sprintf("%.4g m³/s", v.FlowAtGuaranteeHead)
	case v.HeadCrossed:
		horiz[1] = fmt.Sprintf("%.4g m³/s (outside)", v.HeadCrossing)
	}
	rows := [][]string{
		{"H at Q_G (vertical bar)", fmt.Sprintf("%.4g m", v.HeadAtGuaranteeFlow.Y), fmt.Sprintf("%.4g … %.4g m", v.HeadBar[0], v.HeadBar[1]), yes(v.MeetsVertical)},
		horiz,
	}
	if v.EfficiencyJudged || v.PowerJudged {
		at := fmt.Sprintf(" at Q_X = %.4g m³/s", v.Intersection[0])
		if v.EfficiencyJudged {
			rows = append(rows, []string{"η" + at, fmt.Sprintf("%.4f", v.EfficiencyAt.Y), fmt.Sprintf("≥ %.4f", v.EfficiencyMin), yes(v.EfficiencyMet)})
		}
		if v.PowerJudged {
			rows = append(rows, []string{"P" + at, fmt.Sprintf("%.4g kW", v.PowerAt.Y/1e3), fmt.Sprintf("≤ %.4g kW", v.PowerMax/1e3), yes(v.PowerMet)})
		}
	}
	for _, l := range strings.SplitAfter(similarity.FormatTable([]string{"check", "fitted", "tolerance", "met"}, rows, md, false), "\n") {
		if l != "" {
			sb.WriteString(strings.TrimRight(l, " \n") + "\n") // no padding after the last column
		}
	}
	for _, n := range v.Notes {
		if strings.HasPrefix(n, "PROVISIONAL") {
			sb.WriteString(n + "\n")
			continue
		}
		sb.WriteString("NOTE: " + n + "\n")
	}
	c := v.Caution
	if c == "" {
		c = PumpCaution
	}
	sb.WriteString("CAUTION: " + c + "\n")
	return sb.String()
}
