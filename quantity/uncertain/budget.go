package uncertain

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/stat/distuv"

	"similis.dev/similis/quantity"
)

// Line is one source's line in a budget.
type Line struct {
	ID     ID
	Source Source
	// Sensitivity is the sensitivity coefficient c = ∂y/∂x for the
	// source's error, in the units of y per unit of the source's U (per
	// 1 for a relative source).
	Sensitivity quantity.Quantity
	// SensitivityUnknown reports a source whose standard uncertainty is
	// zero: a value carries c·u for each source, so c cannot be
	// recovered from it; Sensitivity is then zero and the report shows
	// "–". The contribution is zero either way.
	SensitivityUnknown bool
	// Contribution is |c|·u(δ), in the units of y.
	Contribution quantity.Quantity
	// Percent is the share of u_c² that the source's own variance
	// makes, 100·(c·u)²/u_c²; with correlations the shares need not sum
	// to 100.
	Percent float64
}

// Budget is the uncertainty statement of one value.
type Budget struct {
	Name  string // what the value is, for the report
	Value quantity.Quantity
	// U is the combined standard uncertainty u_c, correlations included.
	U quantity.Quantity
	// Systematic and Random are the parts of u_c from the sources of
	// each effect, each with the correlations within it.
	Systematic, Random quantity.Quantity
	// DoF is the effective degrees of freedom by the Welch–Satterthwaite
	// formula (GUM eq. G.2b); +Inf when every source has infinite
	// degrees of freedom.
	DoF float64
	// Coverage is the coverage probability p, K the coverage factor
	// (the Student t quantile for DoF), Expanded = K·U.
	Coverage, K float64
	Expanded    quantity.Quantity
	// Correlated reports that correlations between distinct sources
	// entered u_c. The Welch–Satterthwaite formula assumes independent
	// terms (GUM G.4.1): correlated sources are then taken together, as
	// one term with their joint variance and the smallest of their
	// degrees of freedom, and DoF is an approximation.
	Correlated bool
	Lines      []Line // largest contribution first
	// Unit and Factor, if set by In, are the unit the report shows the
	// value, its uncertainties and the contributions in (value in Unit =
	// SI value / Factor), and the numerator of the sensitivities' units
	// (kN/K). Without them the report chooses the SI unit, named where
	// the dimension has a name and with a decimal prefix where the value
	// is large or small (kN, mPa·s). Sources stay in SI.
	Unit   string
	Factor float64
}

// In returns the budget reported in a unit of the caller's choice: unit
// is its symbol and factor its size in SI (In("kN", 1000)). The figures
// themselves are unchanged; a factor that is not a positive finite
// number leaves the report's own choice.
func (b Budget) In(unit string, factor float64) Budget {
	b.Unit, b.Factor = unit, factor
	return b
}

// Budget returns the uncertainty budget of m at coverage probability p
// (0.95 for the usual 95 % statement). Name labels the report.
func (m Measured) Budget(name string, p float64) (Budget, error) {
	if !(p > 0 && p < 1) {
		return Budget{}, &Error{Reason: fmt.Sprintf("coverage probability %v: want 0 < p < 1", p)}
	}
	if !m.finite() {
		return Budget{}, rangeError("budget %q: the value %v or a sensitivity is not a finite number", name, m.q)
	}
	d := m.q.Dim()
	uc2 := m.variance(-1)
	if !finite(uc2) {
		return Budget{}, rangeError("budget %q: the combined variance overflows", name)
	}
	b := Budget{
		Name: name, Value: m.q, Coverage: p,
		U:          quantity.New(math.Sqrt(uc2), d),
		Systematic: quantity.New(math.Sqrt(m.variance(int(Systematic))), d),
		Random:     quantity.New(math.Sqrt(m.variance(int(Random))), d),
	}
	var ws float64
	for i := 0; i < int(m.n); i++ {
		src := m.set.src[m.id[i]]
		ci := m.d[i]
		var c quantity.Quantity
		if src.Relative {
			c = quantity.New(ci/src.U.Value(), d)
		} else {
			c = quantity.New(ci, d).Div(src.U)
		}
		unknown := src.U.Value() == 0
		if unknown || !finite(c.Value()) {
			// No derivative is carried for a zero u (c·u = 0); a u so
			// small that c overflows is reported the same way.
			c, unknown = quantity.New(0, c.Dim()), true
		}
		pct := 0.0
		if uc2 > 0 {
			pct = 100 * ci * ci / uc2
			if !finite(pct) {
				r := ci / math.Sqrt(uc2) // ci² overflowed, u_c² did not
				pct = 100 * r * r
			}
			if !finite(pct) {
				return Budget{}, rangeError("budget %q: source %q's share of u_c² overflows (correlated contributions cancel almost exactly)", name, src.Name)
			}
		}
		b.Lines = append(b.Lines, Line{ID: m.id[i], Source: src, Sensitivity: c, SensitivityUnknown: unknown,
			Contribution: quantity.New(math.Abs(ci), d), Percent: pct})
	}
	// Welch–Satterthwaite over groups of correlated sources: each group
	// enters with its own variance (covariances included) and the
	// smallest degrees of freedom among its sources; an uncorrelated
	// source is a group of one, as in GUM eq. G.2b.
	var group [MaxTerms]int
	for i := range int(m.n) {
		group[i] = i
	}
	find := func(i int) int {
		for group[i] != i {
			i = group[i]
		}
		return i
	}
	for i := 0; i < int(m.n) && m.set.corr != nil; i++ {
		for j := i + 1; j < int(m.n); j++ {
			if m.set.r(m.id[i], m.id[j]) != 0 {
				b.Correlated = true
				group[find(j)] = find(i)
			}
		}
	}
	for g := range int(m.n) {
		if find(g) != g {
			continue
		}
		var v float64
		nu := math.Inf(1)
		for i := range int(m.n) {
			if find(i) != g {
				continue
			}
			if dof := m.set.src[m.id[i]].DoF; dof > 0 {
				nu = min(nu, dof)
			}
			for j := range int(m.n) {
				if find(j) == g {
					v += m.set.r(m.id[i], m.id[j]) * m.d[i] * m.d[j]
				}
			}
		}
		if !math.IsInf(nu, 1) && uc2 > 0 {
			// Each group's share of u_c², squared: ν_eff = 1/Σ (v_g/u_c²)²/ν_g,
			// GUM eq. G.2b divided through by u_c⁴ so that no power of a
			// large variance overflows.
			ws += (v / uc2) * (v / uc2) / nu
		}
	}
	sort.SliceStable(b.Lines, func(i, j int) bool {
		return b.Lines[i].Contribution.Value() > b.Lines[j].Contribution.Value()
	})
	b.DoF = math.Inf(1)
	if ws > 0 {
		b.DoF = 1 / ws
	}
	if !(b.DoF > 0) {
		// A share overflowed (degrees of freedom near zero): no usable ν_eff.
		return Budget{}, rangeError("budget %q: the effective degrees of freedom are not a positive number", name)
	}
	var err error
	if b.K, err = CoverageFactor(p, b.DoF); err != nil {
		return Budget{}, &Error{Reason: fmt.Sprintf("budget %q", name), Err: err}
	}
	b.Expanded = b.U.Scale(b.K)
	if !finite(b.Expanded.Value()) {
		return Budget{}, rangeError("budget %q: the expanded uncertainty overflows", name)
	}
	return b, nil
}

// CoverageFactor returns the coverage factor for coverage probability p
// and nu degrees of freedom: the (1+p)/2 quantile of Student's t
// distribution (GUM G.3.4, Table G.2), or of the normal distribution for
// infinite nu. As for a Source, nu = 0 means infinite (the normal
// quantile), as does +Inf. A fractional nu is used as it is (GUM G.4.1
// truncates it; the difference is small and on the safe side only when
// truncated).
//
// A p outside 0 < p < 1 or a negative or NaN nu is an *Error of class
// quantity.ErrInvalid; a nu so small that the quantile is not a finite
// number (ν = 10⁻³⁰⁰) is one of class quantity.ErrRange.
func CoverageFactor(p, nu float64) (float64, error) {
	if !(p > 0 && p < 1) {
		return 0, &Error{Reason: fmt.Sprintf("coverage probability %v: want 0 < p < 1", p)}
	}
	if !(nu >= 0) {
		return 0, &Error{Reason: fmt.Sprintf("degrees of freedom %v: want ν > 0, or 0 for infinite", nu)}
	}
	q := (1 + p) / 2
	if nu == 0 || math.IsInf(nu, 1) || nu > 1e7 {
		return distuv.UnitNormal.Quantile(q), nil
	}
	k := distuv.StudentsT{Mu: 0, Sigma: 1, Nu: nu}.Quantile(q)
	if !finite(k) {
		return 0, rangeError("coverage factor for ν = %v at p = %v is not a finite number: too few degrees of freedom", nu, p)
	}
	return k, nil
}

// String returns the budget as a plain-text table.
func (b Budget) String() string { return b.format(false) }

// Markdown returns the budget as a Markdown table with its statement.
func (b Budget) Markdown() string { return b.format(true) }

func (b Budget) format(md bool) string {
	var sb strings.Builder
	name := b.Name
	if name == "" {
		name = "y"
	}
	// ν_eff: "= ∞"; "> 100" beyond it (k then differs from the normal
	// distribution's by under 1 %); whole below 100 (GUM G.4.1 truncates
	// to the next lower integer); one decimal under 10, where k still
	// changes with it.
	dof := "= ∞"
	switch {
	case math.IsInf(b.DoF, 1):
	case b.DoF > 100:
		dof = "> 100"
	case b.DoF >= 10:
		dof = fmt.Sprintf("= %.0f", math.Floor(b.DoF))
	default:
		dof = fmt.Sprintf("= %.1f", b.DoF)
	}
	unit, f := displayUnit(b.Value.Dim(), math.Max(math.Abs(b.Value.Value()), b.U.Value()))
	if b.Factor > 0 && finite(b.Factor) && b.Unit != "" {
		unit, f = b.Unit, b.Factor
	}
	rel := "relative u undefined at a zero value"
	if v := b.Value.Value(); v != 0 {
		rel = sig(100*b.U.Value()/math.Abs(v), 2) + " %"
	}
	y, u := roundPair(b.Value.Value()/f, b.U.Value()/f)
	// U and the two parts in the notation of y and u where they can be.
	ref := math.Max(math.Abs(b.Value.Value()), b.U.Value()) / f
	bigU := sideText(ref, b.Expanded.Value()/f)
	headSci := sciFor(ref, b.U.Value()/f)
	fmt.Fprintf(&sb, "%s = %s, u_c = %s (%s), ν_eff %s, k = %.2f, U(%s %%) = %s\n",
		name, withUnit(y, unit), withUnit(u, unit), rel, dof, b.K, strconv.FormatFloat(100*b.Coverage, 'g', 4, 64), withUnit(bigU, unit))
	sys := sideText(ref, b.Systematic.Value()/f)
	rnd := sideText(ref, b.Random.Value()/f)
	fmt.Fprintf(&sb, "systematic part %s, random part %s\n", withUnit(sys, unit), withUnit(rnd, unit))
	contrib := "contribution"
	if unit != "" {
		contrib += " (" + unit + ")"
	}
	head := []string{"source", "type", "distribution", "effect", "u(source)", "c", contrib, "% of u_c²"}
	rows := [][]string{}
	for _, l := range b.Lines {
		// A source in the result's dimension in the headline's notation,
		// any other in its own.
		su := math.Abs(l.Source.U.Value())
		sci := sciFor(su, su)
		if l.Source.U.Dim() == b.Value.Dim() {
			sci = headSci
		}
		u := withUnit(sigIn(l.Source.U.Value(), 2, sci), unitName(l.Source.U.Dim()))
		if l.Source.Relative {
			u = sig(100*l.Source.U.Value(), 2) + " % of value"
		}
		typ := l.Source.Type.String()
		if l.Source.Type == TypeA {
			typ = fmt.Sprintf("A (ν = %g)", l.Source.DoF)
		}
		dist := l.Source.Dist.String()
		if l.Source.Type == TypeA {
			dist = "t"
		}
		c := "–"
		if !l.SensitivityUnknown {
			xd := l.Source.U.Dim()
			c = withUnit(sigFrom(l.Sensitivity.Value()/f, 3, -4), sensitivityUnit(unit, b.Value.Dim(), f, xd))
		}
		rows = append(rows, []string{l.Source.Name, typ, dist, l.Source.Effect.String(), u, c,
			sigIn(l.Contribution.Value()/f, 2, headSci), fmt.Sprintf("%.1f", l.Percent)})
	}
	if md {
		sb.WriteString("\n| " + strings.Join(head, " | ") + " |\n|")
		for i := range head {
			if i >= 4 {
				sb.WriteString("---:|")
			} else {
				sb.WriteString("---|")
			}
		}
		sb.WriteString("\n")
		for _, r := range rows {
			sb.WriteString("| " + strings.Join(r, " | ") + " |\n")
		}
	} else {
		w := make([]int, len(head))
		for i, h := range head {
			w[i] = len([]rune(h))
		}
		for _, r := range rows {
			for i, c := range r {
				w[i] = max(w[i], len([]rune(c)))
			}
		}
		line := func(r []string) {
			for i, c := range r {
				pad := strings.Repeat(" ", w[i]-len([]rune(c)))
				if i >= 4 {
					sb.WriteString(pad + c)
				} else {
					sb.WriteString(c + pad)
				}
				if i < len(r)-1 {
					sb.WriteString("  ")
				}
			}
			sb.WriteString("\n")
		}
		line(head)
		for _, r := range rows {
			line(r)
		}
	}
	if b.Correlated {
		sb.WriteString("correlated sources: u_c includes their covariance; ν_eff takes each correlated group as one term with its smallest ν (approximate)\n")
	}
	return sb.String()
}
