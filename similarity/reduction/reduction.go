package reduction

import (
	"cmp"
	"errors"
	"fmt"
	"io"
	"iter"
	"math"
	"slices"
	"strings"
	"unicode"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
	"similis.dev/similis/units/formula"
	"similis.dev/similis/units/steady"
)

// Calibration applies a calibration of package steady to a channel:
// sample by sample before the derived channels are computed (Samples),
// or to the channel's tared mean at each point.
type Calibration struct {
	Channel string
	Cal     *steady.Calibration
	Samples bool
}

// Spec is what a reduction does to every file of a campaign: the derived
// channels, the points, the zero, the calibrations and the Pi set. A Spec
// is not changed by Reduce, so one Spec may serve many goroutines.
type Spec struct {
	// Derive defines derived channels in the formula language of
	// package formula ("dp = P2 - P1; D = 0.25 {m}"), evaluated sample
	// by sample over the channels read (after any sample calibration).
	Derive string
	// Funcs are functions the formula text may call (formula.Options),
	// wired in by the caller: fluids.FormulaFuncs() for nu_water(T),
	// rho_sea(T, S), … (package similarity/fluids).
	Funcs []formula.Func
	// Keep names the derived statements kept as channels (nil: all).
	Keep []string
	// NonfiniteMissing makes a derived value that is not finite where
	// every channel is present (0/0) a counted missing value; by default
	// it is an error with its row.
	NonfiniteMissing bool

	// Points says which spans are points; the zero value is AllRows.
	Points Points
	// Zero, if set, gives the zero window of the same history (a
	// Run, Spans or Detected yielding exactly one window); Input.Zero
	// gives a zero file instead. The zero's mean is subtracted from the
	// channels of Tare at each point.
	Zero *Points
	// Tare names the channels the zero is subtracted from: those whose
	// transducers read an offset at rest (a force, a torque, a pressure
	// difference). A temperature must not be tared: an absolute
	// temperature has no offset, and a zero subtracted from it leaves a
	// meaningless difference; the zero is reduced over these channels
	// only, and every other channel keeps its value untared.
	Tare []string
	// Calibrations are applied to their channels.
	Calibrations []Calibration
	// Drift gives the largest drift across a point each channel may show
	// before it is flagged; a channel without an entry is not flagged.
	Drift map[string]quantity.Quantity
	// Also names further channels to reduce at each point besides the
	// variables' (a water temperature kept for the record).
	Also []string

	// Set is the Pi set. Each of its variables is the channel of its
	// symbol's name, or a derived channel of that name.
	Set *pigroups.Set
	// Units, if set, gives the unit each variable is declared in, in the
	// problem's order: a channel binds only when its unit converts to it
	// (rpm to rev/s, never Hz to rad/s), and it says whether a rotational
	// speed is held in revolutions.
	Units []units.Unit
	// ChunkRows is the rows read at a time (0: 4096).
	ChunkRows int
}

// Input is one file to reduce.
type Input struct {
	// Name names the file in results and errors.
	Name string
	// Source gives the channels; Open, if Source is nil, opens them
	// (and is then closed after the reduction, if it is an io.Closer).
	Source chanfile.Source
	Open   func() (chanfile.Source, error)
	// Zero, if set, is a zero file reduced whole as the zero: its
	// channels of Spec.Tare, as read (no sample calibration), in the
	// same unit as the file's. It is read once, by this input's
	// reduction, so each input of a campaign needs its own.
	Zero chanfile.Source
	// LineOf, if set, gives the line of a text file holding data row row
	// (from 1), for messages.
	LineOf func(row int) int
	// Rows, if set, receives the groups of each chunk in the all-rows
	// mode; otherwise they are kept in Result.Rows.
	Rows RowWriter
}

// RowWriter takes the groups of a chunk of rows, one Series per group.
type RowWriter interface {
	Write(groups []quantity.Series) error
}

// Group describes one group of the results: its column name (the trade's
// symbol where the group is exactly a named group, Re, Fr, K_T; else
// Π₁, Π₂, …), its definition and what it is.
type Group struct {
	Column     string
	Name       string // Π₁, Π₂, …
	Definition string // Π₁ = ρ·V·D/μ
	Label      string
}

// Point is one steady point: its window of rows, each channel's mean
// with its uncertainty and statistics, and each group with its
// uncertainty.
type Point struct {
	Tag      string
	Window   steady.Window
	Label    float64 // the run's label, when HasLabel
	HasLabel bool
	Channels []steady.Value
	Groups   []uncertain.Measured
}

// Drifting reports whether a channel of the point drifted beyond its limit.
func (p Point) Drifting() bool {
	for _, v := range p.Channels {
		if v.Drifting {
			return true
		}
	}
	return false
}

// Result is one file's reduction.
type Result struct {
	File    string
	Points  []Point
	Zero    *steady.Point
	Groups  []Group
	Columns []chanfile.Column // the channels read, with their missing counts
	Derived []string          // the derived channels' names
	// DerivedText is the derived channels' formula text as compiled, one
	// statement a line.
	DerivedText string
	Set         *uncertain.Set // the sources of every uncertainty
	// Rows is the number of rows read; in the all-rows mode RowGroups
	// holds the groups of every row unless Input.Rows took them.
	Rows      int
	RowGroups []quantity.Series
	// Nonfinite counts the derived values made missing, by channel,
	// with NonfiniteMissing.
	Nonfinite map[string]int
}

// Reduce reduces one file. It is a pure function of the spec and the
// input: the same channels give the same result, whatever else runs.
func (s *Spec) Reduce(in Input) (res *Result, err error) {
	src := in.Source
	if src == nil {
		if in.Open == nil {
			return nil, &Error{File: in.Name, Reason: "input has no source"}
		}
		if src, err = in.Open(); err != nil {
			return nil, setOp(wrap(in.Name, err), "read")
		}
		if c, ok := src.(io.Closer); ok {
			defer func() {
				if cerr := c.Close(); cerr != nil && err == nil {
					res, err = nil, &Error{File: in.Name, Reason: "close", Err: cerr}
				}
			}()
		}
	}
	if s.Set == nil {
		return nil, &Error{File: in.Name, Reason: "spec has no Pi set"}
	}
	r := &run{spec: s, in: in, res: &Result{File: in.Name, Set: uncertain.NewSet(), Nonfinite: map[string]int{}}}
	if err := r.plan(src); err != nil {
		return nil, setOp(err, "plan")
	}
	switch {
	case s.Points.kind == allRows:
		err = r.rows()
	case s.streams() && !wholeHistory:
		err = r.stream()
	default:
		err = r.points()
	}
	if err != nil {
		return nil, err
	}
	r.res.Columns = slices.Clone(r.sel.Columns())
	if r.prog != nil {
		r.res.DerivedText = r.prog.Text()
	}
	return r.res, nil
}

// wholeHistory makes Reduce read the history whole for every mode, as
// Detected does; the tests compare the two paths.
var wholeHistory = false

// setOp sets the Op of an *Error that has none.
func setOp(err error, op string) error {
	var e *Error
	if errors.As(err, &e) && e.Op == "" {
		e.Op = op
	}
	return err
}

// binding says where a variable's values come from.
type binding struct {
	col   int     // index among the selected columns, or −1
	out   int     // the derived output, when col < 0
	name  string  // the channel's name
	scale float64 // 1, or 1/(2π)^k for a variable held in revolutions
}

// run is the state of one file's reduction.
type run struct {
	spec  *Spec
	in    Input
	res   *Result
	sel   chanfile.Source
	names []string // the selected columns
	idx   map[string]int
	prog  *formula.Program
	ev    *formula.Evaluator
	pin   []int // the selected column of each program input
	vars  []pigroups.Variable
	binds []binding
	cals  map[string]Calibration
	// calbuf holds the calibrated samples of each chunk.
	calbuf map[string]*quantity.Series
}

func (r *run) fail(row int, e *Error) error {
	e.File = r.in.Name
	if row > 0 {
		e.Row = row
		if r.in.LineOf != nil {
			e.Line = r.in.LineOf(row)
		}
	}
	return e
}

// wrap makes err an *Error of file, with the line or row of a reader's
// error.
func wrap(file string, err error) error {
	var e *Error
	if errors.As(err, &e) {
		if e.File == "" {
			e.File = file
		}
		return e
	}
	e = &Error{File: file, Err: err}
	var ce *chanfile.Error
	var pe *parquetfile.Error
	switch {
	case errors.As(err, &ce):
		e.Line, e.located = ce.Line, ce.File != ""
	case errors.As(err, &pe):
		e.Row, e.located = int(pe.Row), pe.File != ""
	}
	return e
}

// plan finds the columns needed, compiles the derived channels, binds
// the variables and selects the columns from src.
func (r *run) plan(src chanfile.Source) error {
	s := r.spec
	cols := src.Columns()
	byName := map[string]int{}
	for i, c := range cols {
		byName[c.Name] = i
	}
	r.cals = map[string]Calibration{}
	for _, c := range s.Calibrations {
		if c.Cal == nil {
			return r.fail(0, &Error{Channel: c.Channel, Reason: "calibration is nil"})
		}
		if _, dup := r.cals[c.Channel]; dup {
			return r.fail(0, &Error{Channel: c.Channel, Reason: "two calibrations for one channel"})
		}
		r.cals[c.Channel] = c
	}
	if s.Points.kind == allRows {
		// Row by row there is no point to tare or mean to calibrate:
		// refuse rather than ignore.
		if s.Zero != nil || len(s.Tare) > 0 || r.in.Zero != nil {
			return r.fail(0, &Error{Reason: "a zero or Tare with AllRows: each row is its own result, with no point to tare; choose Runs, Spans or Detected"})
		}
		for _, c := range s.Calibrations {
			if !c.Samples {
				return r.fail(0, &Error{Channel: c.Channel, Reason: "a calibration of the mean with AllRows: calibrate the channel sample by sample (Samples)"})
			}
		}
	}
	want := map[string]bool{}
	// Derived channels: the columns the text names are its inputs.
	var inputs []formula.Input
	if s.Derive != "" {
		idents := identifiers(s.Derive)
		for _, c := range cols {
			if idents[c.Name] || !isIdentifier(c.Name) && strings.Contains(s.Derive, c.Name) {
				if c.Fault != nil {
					// A column the source cannot read has no unit to
					// compile against: its fault, not a dimension error.
					return wrap(r.in.Name, c.Fault)
				}
				inputs = append(inputs, formula.Input{Name: c.Name, Dim: r.dimOf(c)})
			}
		}
		opt := formula.Options{Funcs: s.Funcs, Keep: s.Keep}
		prog, err := opt.Compile(s.Derive, inputs...)
		if err != nil {
			return r.fail(0, &Error{Reason: "derived channels", Err: err})
		}
		r.prog, r.ev = prog, prog.Evaluator()
		if s.NonfiniteMissing {
			r.ev.SetCheck(formula.Unchecked)
		}
		r.res.Derived = prog.Outputs()
		for _, in := range inputs {
			want[in.Name] = true
			if slices.Contains(s.Tare, in.Name) || r.cals[in.Name].Cal != nil && !r.cals[in.Name].Samples {
				return r.fail(0, &Error{Channel: in.Name, Reason: "a derived channel reads this channel, which is tared or calibrated only at the mean; calibrate it sample by sample or derive from the point's values"})
			}
		}
	}
	for _, n := range s.Points.channels() {
		want[n] = true
	}
	if s.Zero != nil {
		for _, n := range s.Zero.channels() {
			want[n] = true
		}
	}
	for _, n := range slices.Concat(s.Tare, s.Also) {
		want[n] = true
	}
	for n := range r.cals {
		want[n] = true
	}
	r.vars = s.Set.Problem().Variables()
	if s.Units != nil && len(s.Units) != len(r.vars) {
		return r.fail(0, &Error{Reason: fmt.Sprintf("spec has %d units for %d variables", len(s.Units), len(r.vars))})
	}
	for _, v := range r.vars {
		if _, ok := byName[v.Symbol]; ok {
			want[v.Symbol] = true
		}
	}
	if err := s.Points.check("points"); err != nil {
		return r.fail(0, err)
	}
	if s.Zero != nil {
		if err := s.Zero.check("zero"); err != nil {
			return r.fail(0, err)
		}
	}
	for _, c := range cols {
		if want[c.Name] && c.Kind == chanfile.Label && c.Fault == nil {
			return r.fail(0, &Error{Channel: c.Name, Reason: textReason(s, c.Name)})
		}
	}
	var idx []int
	r.idx = map[string]int{}
	for i, c := range cols { // file order
		if want[c.Name] {
			r.idx[c.Name] = len(idx)
			r.names = append(r.names, c.Name)
			idx = append(idx, i)
		}
	}
	for n := range want {
		if _, ok := byName[n]; !ok && !r.isDerived(n) {
			return r.fail(0, &Error{Channel: n, Reason: "no such channel (channels: " + names(cols) + ")"})
		}
	}
	sel, err := chanfile.Select(src, idx...)
	if err != nil {
		return wrap(r.in.Name, err)
	}
	r.sel = sel
	if r.prog != nil {
		for _, in := range r.prog.Inputs() {
			r.pin = append(r.pin, r.idx[in.Name])
		}
	}
	return r.bind(cols, byName)
}

// textReason says why a text (label) column the spec reads is refused,
// and what to do instead.
func textReason(s *Spec, name string) string {
	runs := func(p *Points) bool { return p != nil && p.kind == labelRuns && p.channel == name }
	if runs(&s.Points) || runs(s.Zero) {
		return "a column of text is the run label: Runs and Run need a numeric run label " +
			"(log the run number as a number, or write a numeric column of it), " +
			"or find the points with Spans of the time channel or Detected"
	}
	return "a column of text, which the spec reads as numbers (as a variable, a derived " +
		"channel's input, a tared, calibrated or Also channel, or the time or steadiness " +
		"channel of the points): leave it out of the spec"
}

// reduced returns the channels reduced at each point, each once, of
// those has knows: the variables', the derived ones, the tared and
// calibrated ones and Also.
func (r *run) reduced(has func(string) bool) []string {
	var reduce []string
	add := func(n string) {
		if has(n) && !slices.Contains(reduce, n) {
			reduce = append(reduce, n)
		}
	}
	for _, b := range r.binds {
		add(b.name)
	}
	for _, n := range slices.Concat(r.res.Derived, r.spec.Tare, r.spec.Also) {
		add(n)
	}
	for _, c := range r.spec.Calibrations {
		add(c.Channel)
	}
	return reduce
}

// dimOf returns the dimension of a column as the derived channels see
// it: a sample-calibrated channel in its engineering unit.
func (r *run) dimOf(c chanfile.Column) quantity.Dim {
	if cal, ok := r.cals[c.Name]; ok && cal.Samples {
		return cal.Cal.Eng.Dim()
	}
	return c.Unit.Dim()
}

func (r *run) isDerived(n string) bool {
	return r.prog != nil && slices.Contains(r.prog.Outputs(), n)
}

// bind finds each variable's channel, checks its dimension and unit,
// and the scale that holds a rotational speed in revolutions.
func (r *run) bind(cols []chanfile.Column, byName map[string]int) error {
	r.binds = make([]binding, len(r.vars))
	for i, v := range r.vars {
		fail := func(reason string, err error) error {
			return r.fail(0, &Error{Reason: reason, Err: err})
		}
		var unit units.Unit // the channel's unit, when read
		var dim quantity.Dim
		b := binding{col: -1, name: v.Symbol, scale: 1}
		if j, ok := byName[v.Symbol]; ok {
			b.col = r.idx[v.Symbol]
			unit, dim = cols[j].Unit, r.dimOf(cols[j])
			if cal, ok := r.cals[v.Symbol]; ok {
				unit = cal.Cal.Eng
			}
		} else if r.isDerived(v.Symbol) {
			b.out = slices.Index(r.prog.Outputs(), v.Symbol)
			dim = r.prog.Dim(b.out)
		} else {
			return fail(fmt.Sprintf("variable %s is neither a channel of %s nor a derived channel (channels: %s)", v.Symbol, r.in.Name, names(cols)), nil)
		}
		if dim != v.Dim {
			return fail(fmt.Sprintf("variable %s is %s, but its channel is %s", v.Symbol, quantity.Describe(v.Dim), quantity.Describe(dim)), quantity.ErrDimension)
		}
		declared := unit
		if r.spec.Units != nil {
			declared = r.spec.Units[i]
			if declared.Dim() != v.Dim {
				return fail("declared unit of another dimension", quantity.ErrDimension)
			}
			if b.col >= 0 {
				if _, err := units.ConvertUnits(1, unit, declared); err != nil {
					return fail("channel's unit does not convert to the variable's", err)
				}
			}
		}
		plane, _ := declared.Angle()
		if v.Angle == pigroups.Revolutions && plane != 0 {
			b.scale = math.Pow(2*math.Pi, -float64(plane))
		}
		if b.col < 0 && v.Angle == pigroups.Revolutions && plane == 0 && v.Dim == quantity.Frequency {
			return fail("a derived rotational speed is in rad/s (SI); declare the variable in rad/s or rev/s", nil)
		}
		r.binds[i] = b
	}
	r.res.Groups = groupsOf(r.spec.Set)
	return nil
}

// groupsOf names the groups of a set for the results.
func groupsOf(set *pigroups.Set) []Group {
	var out []Group
	seen := map[string]bool{}
	for _, g := range set.Groups() {
		col := symbol(g)
		if col == "" || seen[col] {
			col = g.Name
		}
		seen[col] = true
		out = append(out, Group{Column: col, Name: g.Name, Definition: g.Name + " = " + g.Format(quantity.Unicode), Label: g.Label()})
	}
	return out
}

// symbol returns the trade's symbol of a group that is exactly a named
// group (Re, Fr, K_T), or "".
func symbol(g pigroups.Group) string {
	for _, m := range g.Matches {
		if m.Exact() && m.Power.String() == "1" && m.Factor() == 1 && m.Proxy == nil {
			return m.Symbol
		}
	}
	return ""
}

func names(cols []chanfile.Column) string {
	var sb strings.Builder
	for i, c := range cols {
		if i > 0 {
			sb.WriteString(", ")
		}
		sb.WriteString(c.Name)
	}
	return sb.String()
}

// chunks reads the selected columns chunk by chunk into *chunk, applies
// the sample calibrations to each and yields its number of rows. A failed
// read or calibration ends it with the error in *errp; the end of the
// input ends it leaving *errp alone.
func (r *run) chunks(chunk *[]quantity.Series, errp *error) iter.Seq[int] {
	return func(yield func(int) bool) {
		for {
			c, n, err := r.sel.Read(*chunk, r.spec.ChunkRows)
			*chunk = c
			if err == io.EOF {
				return
			}
			if err != nil {
				*errp = setOp(wrap(r.in.Name, err), "read")
				return
			}
			if err := r.calibrate(c, quantity.Series{}, r.res.Rows); err != nil {
				*errp = err
				return
			}
			if !yield(n) {
				return
			}
		}
	}
}

// calibrate applies the sample calibrations to a chunk of the selected
// columns; base is the rows read before it.
func (r *run) calibrate(chunk []quantity.Series, t quantity.Series, base int) error {
	for name, c := range r.cals {
		if !c.Samples {
			continue
		}
		k := r.idx[name]
		// Into a buffer of the run's own: the chunk may be a view of
		// the caller's data (a SeriesSource), which is not changed.
		if r.calbuf == nil {
			r.calbuf = map[string]*quantity.Series{}
		}
		buf := r.calbuf[name]
		if buf == nil {
			buf = new(quantity.Series)
			r.calbuf[name] = buf
		}
		if err := c.Cal.Apply(buf, chunk[k], name, t); err != nil {
			var re *steady.RangeError
			row := 0
			if errors.As(err, &re) && re.Row >= 0 {
				row = base + re.Row + 1
			}
			return r.fail(row, &Error{Op: "calibrate", Channel: name, Err: err})
		}
		chunk[k] = *buf
	}
	return nil
}

// derive evaluates the derived channels over n rows of the selected
// columns into out; base is the rows read before them.
func (r *run) derive(chunk []quantity.Series, out [][]float64, n, base int) error {
	in := make([]quantity.Series, len(r.pin))
	for k, j := range r.pin {
		in[k] = chunk[j]
	}
	if err := r.ev.Series(in, out); err != nil {
		var re *formula.Error
		if errors.As(err, &re) && re.Row >= 0 {
			return r.fail(base+re.Row+1, &Error{Op: "derive", Channel: re.Name, Reason: "derived channel", Err: err})
		}
		return r.fail(0, &Error{Op: "derive", Reason: "derived channels", Err: err})
	}
	names := r.prog.Outputs()
	for o := range out {
		// A result that depends on no input (D = 0.25 {m}) is computed
		// once; with no input column Series has no rows to fill.
		if c, ok := r.prog.Constant(o); ok {
			for k := range out[o][:n] {
				out[o][k] = c
			}
			continue
		}
		for k, x := range out[o][:n] {
			if !math.IsNaN(x) && !math.IsInf(x, 0) || anyNaN(in, k) {
				continue
			}
			if !r.spec.NonfiniteMissing {
				return r.fail(base+k+1, &Error{Op: "derive", Channel: names[o], Reason: fmt.Sprintf("derived value %v from a row with every channel present (a 0/0, an overflow or a function outside its domain)", x), Err: quantity.ErrRange})
			}
			out[o][k] = math.NaN()
			r.res.Nonfinite[names[o]]++
		}
	}
	return nil
}

func anyNaN(in []quantity.Series, k int) bool {
	for _, s := range in {
		if math.IsNaN(s.Values()[k]) {
			return true
		}
	}
	return false
}

func grow(v []float64, n int) []float64 {
	if cap(v) < n {
		return make([]float64, n)
	}
	return v[:n]
}

// rows reduces every row to its groups, chunk by chunk.
func (r *run) rows() error {
	gev := r.spec.Set.Evaluator()
	ng := r.spec.Set.Len()
	var (
		chunk  []quantity.Series
		dout   [][]float64
		vcols  = make([]quantity.Series, len(r.vars))
		scaled = make([][]float64, len(r.vars))
		gser   = make([]quantity.Series, ng)
		gbuf   = make([][]float64, ng)
		err    error
	)
	if r.prog != nil {
		dout = make([][]float64, len(r.prog.Outputs()))
	}
	for n := range r.chunks(&chunk, &err) {
		if r.prog != nil {
			for o := range dout {
				dout[o] = grow(dout[o], n)
			}
			if err := r.derive(chunk, dout, n, r.res.Rows); err != nil {
				return err
			}
		}
		for i, b := range r.binds {
			var vals []float64
			if b.col >= 0 {
				vals = chunk[b.col].Values()
			} else {
				vals = dout[b.out]
			}
			if b.scale != 1 {
				scaled[i] = grow(scaled[i], n)
				for k, x := range vals[:n] {
					scaled[i][k] = x * b.scale
				}
				vals = scaled[i]
			}
			vcols[i] = quantity.NewSeries(vals[:n], r.vars[i].Dim)
		}
		sink := r.in.Rows
		for g := range gbuf {
			if sink == nil {
				gbuf[g] = make([]float64, n)
			} else {
				gbuf[g] = grow(gbuf[g], n)
			}
		}
		if err := gev.Series(vcols, gbuf); err != nil {
			k, rerr := failingRow(gev, vcols, n, ng)
			if rerr == nil {
				return r.fail(0, &Error{Op: "groups", Reason: fmt.Sprintf("rows %d to %d: groups", r.res.Rows+1, r.res.Rows+n), Err: err})
			}
			return r.fail(r.res.Rows+k+1, &Error{Op: "groups", Reason: "groups", Err: rerr})
		}
		for g := range gbuf {
			gser[g] = quantity.NewSeries(gbuf[g], 0)
		}
		if sink != nil {
			if err := sink.Write(gser); err != nil {
				return r.fail(0, &Error{Op: "write", Reason: "writing the groups", Err: err})
			}
		} else {
			if r.res.RowGroups == nil {
				r.res.RowGroups = make([]quantity.Series, ng)
			}
			for g := range gbuf {
				r.res.RowGroups[g] = quantity.NewSeries(append(r.res.RowGroups[g].Values(), gbuf[g]...), 0)
			}
		}
		r.res.Rows += n
	}
	return err
}

// failingRow finds the first row of the chunk whose groups cannot be
// evaluated, and its error.
func failingRow(gev *pigroups.Evaluator, cols []quantity.Series, n, groups int) (int, error) {
	q := make([]quantity.Quantity, len(cols))
	dst := make([]float64, groups)
rows:
	for k := range n {
		for i, c := range cols {
			if q[i] = c.At(k); math.IsNaN(q[i].Value()) {
				continue rows
			}
		}
		if _, err := gev.Row(q, dst); err != nil {
			return k, err
		}
	}
	return 0, nil
}

// points reads the whole history, finds the points and reduces each.
func (r *run) points() error {
	s := r.spec
	hist := make([][]float64, len(r.names))
	dims := make([]quantity.Dim, len(r.names))
	var chunk []quantity.Series
	var err error
	for n := range r.chunks(&chunk, &err) {
		for k := range hist {
			hist[k] = append(hist[k], chunk[k].Values()[:n]...)
			dims[k] = chunk[k].Dim()
		}
		r.res.Rows += n
	}
	if err != nil {
		return err
	}
	series := map[string]quantity.Series{}
	for k, name := range r.names {
		series[name] = quantity.NewSeries(hist[k], dims[k])
	}
	if r.prog != nil {
		out := make([][]float64, len(r.prog.Outputs()))
		for o := range out {
			out[o] = make([]float64, r.res.Rows)
		}
		full := make([]quantity.Series, len(r.names))
		for k, name := range r.names {
			full[k] = series[name]
		}
		if err := r.derive(full, out, r.res.Rows, 0); err != nil {
			return err
		}
		for o, name := range r.prog.Outputs() {
			series[name] = quantity.NewSeries(out[o], r.prog.Dim(o))
		}
	}
	get := func(n string) (quantity.Series, bool) { x, ok := series[n]; return x, ok }
	ws, err := s.Points.windows(get)
	if err != nil {
		return setOp(r.fail(0, err.(*Error)), "points")
	}
	if len(ws) == 0 {
		return r.fail(0, &Error{Op: "points", Reason: "no points found (" + s.Points.String() + ")", Err: quantity.ErrRange})
	}
	// The channels reduced at each point: the variables', the derived
	// ones, the tared and calibrated ones and Also, each once.
	reduce := r.reduced(func(n string) bool { _, ok := series[n]; return ok })
	chs := make([]steady.Channel, len(reduce))
	for i, n := range reduce {
		x := series[n]
		lim, ok := s.Drift[n]
		if !ok {
			lim = quantity.New(math.MaxFloat64, x.Dim())
		}
		chs[i] = steady.Channel{Name: n, Data: x, DriftLimit: lim}
	}
	var zero *steady.Point
	if err := r.zero(series, &zero); err != nil {
		return setOp(err, "zero")
	}
	r.res.Zero = zero
	return r.finishPoints(ws, func(w window) (steady.Point, error) {
		return steady.Reduce(r.res.Set, w.tag, chs, w.Window)
	})
}

// finishPoints makes each window a point, in order: reduce gives its
// channels' means (registered in the result's set), which are then
// tared by the zero, calibrated, and carried into the groups.
func (r *run) finishPoints(ws []window, reduce func(window) (steady.Point, error)) error {
	s := r.spec
	zero := r.res.Zero
	gev := s.Set.Evaluator()
	vals := make([]uncertain.Measured, len(r.vars))
	for _, w := range ws {
		p, err := reduce(w)
		if err != nil {
			return r.stepErr(w.tag, err)
		}
		if zero != nil {
			if p, err = steady.Tare(p, *zero, s.Tare...); err != nil {
				return r.stepErr(w.tag, err)
			}
		}
		for _, c := range s.Calibrations {
			if c.Samples {
				p, err = c.Cal.AddSource(r.res.Set, p, c.Channel)
			} else {
				p, err = c.Cal.Calibrate(r.res.Set, p, c.Channel)
			}
			if err != nil {
				return r.stepErr(w.tag, err)
			}
		}
		for i, b := range r.binds {
			v, _ := p.Value(b.name)
			vals[i] = v.Mean
			if b.scale != 1 {
				vals[i] = v.Mean.Scale(b.scale)
			}
		}
		gs := make([]uncertain.Measured, s.Set.Len())
		var gerr error
		if _, err := uncertain.Eval(func() uncertain.Measured {
			_, gerr = gev.RowMeasured(vals, gs)
			return uncertain.Measured{}
		}); err != nil || gerr != nil {
			return r.fail(0, &Error{Op: "groups", Point: w.tag, Reason: "groups", Err: cmp.Or(gerr, err)})
		}
		r.res.Points = append(r.res.Points, Point{Tag: w.tag, Window: w.Window, Label: w.label, HasLabel: w.hasLabel, Channels: p.Values, Groups: gs})
	}
	return nil
}

// stepErr names the row of a steady error when it has one.
func (r *run) stepErr(tag string, err error) error {
	var se *steady.Error
	row := 0
	if errors.As(err, &se) && se.Row >= 0 {
		row = se.Row + 1
	}
	return r.fail(row, &Error{Op: "reduce", Point: tag, Err: err})
}

// zero reduces the zero: a window of the history or a zero file.
func (r *run) zero(series map[string]quantity.Series, out **steady.Point) error {
	s := r.spec
	if s.Zero == nil && r.in.Zero == nil {
		if len(s.Tare) > 0 {
			return r.fail(0, &Error{Reason: "Tare names channels but there is no zero (Spec.Zero or Input.Zero)"})
		}
		return nil
	}
	if s.Zero != nil && r.in.Zero != nil {
		return r.fail(0, &Error{Reason: "two zeros: Spec.Zero and Input.Zero"})
	}
	if len(s.Tare) == 0 {
		return r.fail(0, &Error{Reason: "a zero but no channel to tare (Spec.Tare)"})
	}
	var chs []steady.Channel
	var w steady.Window
	if s.Zero != nil {
		ws, err := s.Zero.windows(func(n string) (quantity.Series, bool) { x, ok := series[n]; return x, ok })
		if err != nil {
			return r.fail(0, err.(*Error))
		}
		if len(ws) != 1 {
			return r.fail(0, &Error{Point: "zero", Reason: fmt.Sprintf("the zero gives %d windows, want 1", len(ws))})
		}
		w = ws[0].Window
		for _, n := range s.Tare {
			chs = append(chs, steady.Channel{Name: n, Data: series[n], DriftLimit: quantity.New(math.MaxFloat64, series[n].Dim())})
		}
	} else {
		zcols := r.in.Zero.Columns()
		hist := make([][]float64, len(zcols))
		var chunk []quantity.Series
		rows := 0
		for {
			var n int
			var err error
			chunk, n, err = r.in.Zero.Read(chunk, s.ChunkRows)
			if err == io.EOF {
				break
			}
			if err != nil {
				return &Error{File: r.in.Name, Point: "zero", Reason: "zero file", Err: err}
			}
			for k := range hist {
				hist[k] = append(hist[k], chunk[k].Values()[:n]...)
			}
			rows += n
		}
		for _, n := range s.Tare {
			k := slices.IndexFunc(zcols, func(c chanfile.Column) bool { return c.Name == n })
			if k < 0 {
				return r.fail(0, &Error{Point: "zero", Channel: n, Reason: "the zero file has no such channel"})
			}
			x := quantity.NewSeries(hist[k], zcols[k].Unit.Dim())
			chs = append(chs, steady.Channel{Name: n, Data: x, DriftLimit: quantity.New(math.MaxFloat64, x.Dim())})
		}
		w = steady.Window{Start: 0, End: rows}
	}
	p, err := steady.Reduce(r.res.Set, "zero", chs, w)
	if err != nil {
		return r.stepErr("zero", err)
	}
	*out = &p
	return nil
}

// Value returns the result of the channel name at the point.
func (p Point) Value(name string) (steady.Value, bool) {
	for _, v := range p.Channels {
		if v.Name == name {
			return v, true
		}
	}
	return steady.Value{}, false
}

// identifiers returns the words of a formula text that could name a
// channel: runs of letters, digits and underscores.
func identifiers(text string) map[string]bool {
	out := map[string]bool{}
	for _, w := range strings.FieldsFunc(text, func(r rune) bool { return !isIdentRune(r) }) {
		out[w] = true
	}
	return out
}

func isIdentRune(r rune) bool { return r == '_' || unicode.IsLetter(r) || unicode.IsDigit(r) }

// isIdentifier reports whether a channel's name is one word of
// identifier characters; a name that is not is looked for as it is.
func isIdentifier(name string) bool {
	for _, r := range name {
		if !isIdentRune(r) {
			return false
		}
	}
	return name != ""
}
