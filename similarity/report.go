package similarity

import (
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Caution is printed with every plan report.
const Caution = "Model-test predictions are estimates subject to scale effects. Hydraulic structures, hulls and " +
	"pressure vessels are designed to the applicable local codes and checked by licensed engineers."

// ReportOptions says what a plan report shows.
type ReportOptions struct {
	Title string
	// Prototype holds the prototype's values by variable symbol; model
	// values are these times the ratios.
	Prototype map[string]quantity.Quantity
	// Units chooses the unit each variable is printed in, by symbol
	// ("kn", "kN"); SI otherwise.
	Units map[string]string
	// Groups are listed with their prototype and model values and status.
	Groups []pigroups.Group
	// Compromise, if any, adds its floating groups' threshold checks.
	Compromise *Compromise
	// Conflict, if any, is reported with its remedies.
	Conflict *Conflict
	// Cautions are added to the standard caution.
	Cautions []string
}

// Report is a plan laid out for reading.
type Report struct {
	title    string
	groups   [][]string
	vars     [][]string
	notes    []string
	cautions []string
}

// NewReport lays out a solved plan, or a conflict. After a conflict
// there is no solution: NewReport(nil, ReportOptions{Conflict: ce}) lays
// out the conflict, its remedies and the cautions, and with the
// prototype's values in Prototype it says what each remedy would ask of
// the model fluid. A nil solution with no conflict to report is an error
// matching quantity.ErrInvalid.
//
// The measured (dependent) variable's ratio is printed only when every
// group of the other variables is held; while one floats, the report
// names it instead (see Solution.FloatingGroups), and for a floating group
// the fluid enters through its kinematic viscosity alone (Re) it notes the
// model kinematic viscosity that would hold it, beside water's, when the
// prototype fluid is known (Prototype values of ρ and μ or ν, or the
// plan's FixFluids).
func NewReport(s *Solution, o ReportOptions) (*Report, error) {
	r := &Report{title: o.Title}
	if r.title == "" {
		r.title = "Model test plan"
	}
	if s == nil && o.Conflict == nil {
		return nil, planError("NewReport", "", ErrPlan, "report: no solution and no conflict to report")
	}
	if s != nil {
		if err := r.solution(s, o); err != nil {
			return nil, err
		}
	}
	if o.Conflict != nil {
		r.notes = append(r.notes, "conflict: "+o.Conflict.Summary)
		for _, rem := range o.Conflict.Remedies {
			extra := rem.fluidNotes(o.Prototype)
			if len(extra) > 0 {
				// The prototype's fluid is known: its notes replace those
				// that assumed water.
				rem.Notes = rem.sol.gravityNotes()
			}
			r.notes = append(r.notes, "  "+rem.String())
			for _, n := range extra {
				r.notes = append(r.notes, "    "+n)
			}
		}
	}
	r.cautions = append([]string{Caution}, o.Cautions...)
	return r, nil
}

// solution lays out the groups and variables of a solved plan.
func (r *Report) solution(s *Solution, o ReportOptions) error {
	var p units.Printer
	p.Precision = 5
	floating := s.FloatingGroups()
	dep := s.plan.prob.DependentIndex()
	for _, g := range o.Groups {
		if err := s.plan.prob.CheckGroup(g); err != nil {
			return planError("NewReport", g.Name, err, "report")
		}
		label, exps := conventional(g)
		if len(g.Matches) == 0 {
			label = g.Name
		} else {
			label, _, _ = strings.Cut(label, " (")
		}
		ratio := Ratio{Law: s.groupLaw(exps)}
		ratio.Value = ratio.Law.Eval(s.values)
		status := "held"
		if !ratio.Law.IsOne() {
			status = "floating, ratio " + ratio.String()
		}
		measured := dep >= 0 && !exps[dep].IsZero()
		if measured && !ratio.Law.IsOne() {
			status = "measured (equal on both sides: every other group is held)"
			if len(floating) > 0 {
				status = "measured; not equal on both sides while " + floatingNames(floating) + " floats"
			}
		}
		proto, model := "", ""
		if v, ok := groupValue(s.plan.vars, exps, o.Prototype); ok {
			proto = fmt.Sprintf("%.4g", v)
			if !math.IsNaN(ratio.Value) && !(measured && len(floating) > 0) {
				model = fmt.Sprintf("%.4g", v*ratio.Value)
			}
		}
		r.groups = append(r.groups, []string{label, s.plan.prob.FormatProduct(exps, quantity.Unicode), proto, model, status})
	}
	for vi, v := range s.plan.vars {
		ratio, err := s.Ratio(v.Symbol)
		ratioText := ratio.String()
		if err != nil {
			ratioText = "out of the range of a float64"
			ratio.Value = math.NaN()
		}
		if vi == dep && math.IsNaN(ratio.Value) {
			// The measured variable scales as its dimension implies, but
			// only when every other group is held.
			if len(floating) > 0 {
				ratioText = "none while " + floatingNames(floating) + " floats"
			} else if d, err := s.DerivedRatio(v.Dim); err == nil {
				ratio, ratioText = d, d.String()
			}
		}
		proto, model := "", ""
		if q, ok := o.Prototype[v.Symbol]; ok {
			if err := q.CheckNamed(v.Symbol, v.Dim); err != nil {
				return err
			}
			u := units.BaseUnit(v.Dim)
			if du, ok := units.DerivedUnit(v.Dim); ok {
				u = du
			}
			if name, ok := o.Units[v.Symbol]; ok {
				var err error
				if u, err = units.Parse(name); err != nil {
					return planError("NewReport", v.Symbol, err, fmt.Sprintf("report unit for %s", v.Symbol))
				}
			}
			ps, err := p.FormatIn(q, u)
			if err != nil {
				return err
			}
			proto = ps
			if !math.IsNaN(ratio.Value) {
				model, _ = p.FormatIn(q.Scale(ratio.Value), u)
			}
		}
		r.vars = append(r.vars, []string{v.Symbol, proto, model, ratioText})
	}
	var free []string
	for _, f := range s.Free() {
		if dep < 0 || f != s.plan.vars[dep].Symbol {
			free = append(free, f)
		}
	}
	if len(free) > 0 {
		r.notes = append(r.notes, "underdetermined: free ratios "+strings.Join(free, ", ")+" have no value")
	}
	r.notes = append(r.notes, s.holdNotes(s.plan.prototypeFluid(o.Prototype))...)
	if o.Compromise != nil {
		for _, f := range o.Compromise.Floating {
			if f.MinModel > 0 && !f.Meets {
				r.notes = append(r.notes, fmt.Sprintf("%s floats to %.4g in the model, below the threshold %.3g: expect scale effects", f.Label, f.Model, f.MinModel))
			}
		}
	}
	return nil
}

// FormatTable returns rows under a header as aligned text, one line a
// row and two spaces between columns, or as a Markdown table when
// markdown is set. With numeric set every column holds numbers and is
// right-aligned (in Markdown too); otherwise columns are left-aligned.
// Widths count runes, so a column of "λ_L" lines up. A trade's printed
// report and the core's Report write their tables with it.
func FormatTable(head []string, rows [][]string, markdown, numeric bool) string {
	var sb strings.Builder
	w := make([]int, len(head))
	for i, h := range head {
		w[i] = len([]rune(h))
	}
	for _, row := range rows {
		for i, c := range row {
			w[i] = max(w[i], len([]rune(c)))
		}
	}
	line := func(cells []string) {
		if markdown {
			sb.WriteString("| " + strings.Join(cells, " | ") + " |\n")
			return
		}
		for i, c := range cells {
			pad := strings.Repeat(" ", w[i]-len([]rune(c)))
			if i > 0 {
				sb.WriteString("  ")
			}
			if numeric {
				sb.WriteString(pad + c)
			} else {
				sb.WriteString(c + pad)
			}
		}
		sb.WriteString("\n")
	}
	line(head)
	if markdown {
		sep := make([]string, len(head))
		for i := range sep {
			sep[i] = "---"
			if numeric {
				sep[i] = "---:"
			}
		}
		line(sep)
	}
	for _, row := range rows {
		line(row)
	}
	return sb.String()
}

func (r *Report) write(md bool) string {
	var sb strings.Builder
	if md {
		sb.WriteString("## " + r.title + "\n\n")
	} else {
		sb.WriteString(r.title + "\n" + strings.Repeat("=", len([]rune(r.title))) + "\n")
	}
	if len(r.groups) > 0 {
		if md {
			sb.WriteString("### Groups\n\n")
		} else {
			sb.WriteString("\nGroups\n")
		}
		sb.WriteString(FormatTable([]string{"group", "definition", "prototype", "model", "status"}, r.groups, md, false))
	}
	if len(r.vars) > 0 {
		if md {
			sb.WriteString("\n### Variables\n\n")
		} else {
			sb.WriteString("\nVariables\n")
		}
		sb.WriteString(FormatTable([]string{"variable", "prototype", "model", "ratio model/prototype"}, r.vars, md, false))
	}
	if len(r.notes) > 0 {
		sb.WriteString("\n")
		for _, n := range r.notes {
			if md {
				sb.WriteString("- " + strings.TrimSpace(n) + "\n")
			} else {
				sb.WriteString("note: " + n + "\n")
			}
		}
	}
	sb.WriteString("\n")
	for _, c := range r.cautions {
		if md {
			sb.WriteString("> **Caution.** " + c + "\n")
		} else {
			sb.WriteString("CAUTION: " + c + "\n")
		}
	}
	return sb.String()
}

// Text returns the report as plain text tables.
func (r *Report) Text() string { return r.write(false) }

// Markdown returns the report as Markdown.
func (r *Report) Markdown() string { return r.write(true) }
