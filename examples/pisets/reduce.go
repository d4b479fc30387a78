package main

import (
	"bufio"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"slices"
	"strconv"
	"strings"
	"time"

	"github.com/schollz/progressbar/v3"
	"golang.org/x/term"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
	"similis.dev/similis/units/formula"
	"similis.dev/similis/units/steady"
)

// gaugeHelp ends the message of a gauge channel read without a reference.
const gaugeHelp = "is a gauge pressure: give -baro with the barometer reading (as -baro 1002hPa), or -std-atm to use 101325 Pa as an explicit choice"

// dataError is a problem in the data file (exit 1), as opposed to a
// usage error (exit 2).
type dataError struct{ err error }

func (e *dataError) Error() string { return e.err.Error() }
func (e *dataError) Unwrap() error { return e.err }

// reduceOptions are the flags of the data mode.
type reduceOptions struct {
	data, derive, baro string
	stdAtm             bool
	jsonl              bool   // JSON lines instead of CSV
	parquet            bool   // Parquet instead of CSV
	fit                bool   // fit the first group as a power law of the others
	plot               string // a .png or .svg file for the fit
	nonfiniteMissing   bool   // a non-finite derived value is a counted missing value, not an error
	fluids             bool   // the formula may call the fluid properties (nu_water(T), …)
	points             *reduction.Points
	zero               *reduction.Points
	tare               []string
	plotW, plotH, dpi  *float64
}

// size returns the plot's size and resolution, the defaults when the
// flags were not defined (a test calling reduce directly).
func (o reduceOptions) size() plotSize {
	s := plotSize{6, 4, 150}
	if o.plotW != nil {
		s = plotSize{*o.plotW, *o.plotH, *o.dpi}
	}
	return s
}

// groupSink writes the groups of each chunk.
type groupSink interface {
	Write([]quantity.Series) error
	Flush() error
}

// channelSource is a channel file being read: CSV/TSV or Parquet.
type channelSource interface {
	Columns() []chanfile.Column
	Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error)
}

// parquetSink writes the groups as a Parquet file; Flush closes it.
type parquetSink struct{ *parquetfile.Writer }

func (p parquetSink) Flush() error { return p.Close() }

// isTerminal reports whether w is a terminal, where a progress bar is
// drawn. Tests leave it as it is: their writers are buffers.
var isTerminal = func(w io.Writer) bool {
	f, ok := w.(*os.File)
	return ok && term.IsTerminal(int(f.Fd()))
}

// progress draws a bar on standard error for a long file when standard
// error is a terminal; for a short file, or not a terminal, it does nothing.
type progress struct {
	bar *progressbar.ProgressBar
}

// Long files: a bar is worth drawing beyond these.
const (
	progressBytes = 4 << 20
	progressRows  = 100_000
)

func newProgress(log io.Writer, total int64, bytes bool) progress {
	if !isTerminal(log) || bytes && total < progressBytes || !bytes && total < progressRows {
		return progress{}
	}
	opts := []progressbar.Option{
		progressbar.OptionSetWriter(log),
		progressbar.OptionSetDescription("pisets: reducing"),
		progressbar.OptionThrottle(100 * time.Millisecond),
		progressbar.OptionClearOnFinish(),
		progressbar.OptionSetPredictTime(true),
	}
	if bytes {
		opts = append(opts, progressbar.OptionShowBytes(true))
	} else {
		opts = append(opts, progressbar.OptionShowCount(), progressbar.OptionSetItsString("rows"))
	}
	return progress{progressbar.NewOptions64(total, opts...)}
}

func (p progress) set(n int64) {
	if p.bar != nil {
		p.bar.Set64(n)
	}
}

func (p progress) finish() {
	if p.bar != nil {
		p.bar.Finish()
	}
}

// jsonLines writes one JSON object per row: {"row":1,"Π₁":0.17,...},
// with null for a missing value.
type jsonLines struct {
	w    *bufio.Writer
	keys [][]byte // `,"Π₁":`
	row  int
	line []byte
}

func newJSONLines(out io.Writer, names []string) *jsonLines {
	j := &jsonLines{w: bufio.NewWriterSize(out, 1<<16)}
	for _, n := range names {
		k, _ := json.Marshal(n)
		j.keys = append(j.keys, append(append([]byte{','}, k...), ':'))
	}
	return j
}

func (j *jsonLines) Write(s []quantity.Series) error {
	n := 0
	if len(s) > 0 {
		n = s[0].Len()
	}
	for i := 0; i < n; i++ {
		j.row++
		b := append(j.line[:0], `{"row":`...)
		b = strconv.AppendInt(b, int64(j.row), 10)
		for g, k := range j.keys {
			b = append(b, k...)
			if x := s[g].Values()[i]; math.IsNaN(x) || math.IsInf(x, 0) {
				b = append(b, "null"...)
			} else {
				b = strconv.AppendFloat(b, x, 'g', -1, 64)
			}
		}
		b = append(b, "}\n"...)
		j.line = b
		if _, err := j.w.Write(b); err != nil {
			return err
		}
	}
	return nil
}

func (j *jsonLines) Flush() error { return j.w.Flush() }

// reduce evaluates the Pi set of r over every row of the channel file:
// each variable is the channel of its symbol's name or a derived channel
// defined by the -derive formula text over the channels. The groups are
// written to out as a channel file; a summary goes to log.
func reduce(r *Report, opt reduceOptions, out, log io.Writer) error {
	f, err := os.Open(opt.data)
	if err != nil {
		return &usageError{fmt.Sprintf("-data: %v", err)}
	}
	defer f.Close()
	var ro chanfile.Options
	if strings.HasSuffix(strings.ToLower(opt.data), ".tsv") {
		ro.Comma = '\t'
	}
	switch {
	case opt.baro != "" && opt.stdAtm:
		return &usageError{"-baro and -std-atm: give one reference pressure"}
	case opt.baro != "":
		q, err := units.ParseQuantity(opt.baro)
		if err != nil || q.Dim() != quantity.Pressure {
			return &usageError{fmt.Sprintf("-baro %s: want an absolute pressure such as 1002hPa", cli.Quote(opt.baro))}
		}
		ro.Reference = q
	case opt.stdAtm:
		ro.Reference = units.StandardReference()
	}
	// Without a reference, gauge channels that enter the variables only
	// through differences, where the ambient cancels, are read against a
	// provisional one; any other use of them is refused below, as before.
	var note string
	help := gaugeHelp
	if ro.Reference.Dim() != quantity.Pressure && opt.points == nil {
		n, why := cancelledGauges(f, opt, r, ro)
		switch {
		case n != "":
			note = n
			ro.Reference = units.StandardReference()
		case why != "":
			help += "; without it gauge channels may enter only as differences such as P2 - P1, where the ambient cancels, and here " + why
		}
		if _, err := f.Seek(0, io.SeekStart); err != nil {
			return &usageError{fmt.Sprintf("-data: %v", err)}
		}
	}
	var rd channelSource
	var bar progress
	var done func(rows int) int64 // rows or bytes read so far
	parquet := strings.HasSuffix(strings.ToLower(opt.data), ".parquet")
	if parquet {
		st, err := f.Stat()
		if err != nil {
			return &usageError{fmt.Sprintf("-data: %v", err)}
		}
		pr, err := parquetfile.NewReader(f, st.Size(), opt.data, parquetfile.Options{Reference: ro.Reference})
		var pe *parquetfile.Error
		if errors.Is(err, units.ErrGauge) && errors.As(err, &pe) {
			return &usageError{fmt.Sprintf("%s: column %d %q %s", pe.File, pe.Column, pe.Field, help)}
		}
		if err != nil {
			return &dataError{err}
		}
		rd = pr
		bar = newProgress(log, pr.NumRows(), false)
		done = func(rows int) int64 { return int64(rows) }
	} else {
		cr, err := chanfile.NewReader(f, opt.data, ro)
		var fe *chanfile.Error
		if errors.Is(err, units.ErrGauge) && errors.As(err, &fe) {
			return &usageError{fmt.Sprintf("%s:%d:%d: %q %s", fe.File, fe.Line, fe.Column, fe.Field, help)}
		}
		if err != nil {
			return &dataError{err}
		}
		rd = cr
		if st, err := f.Stat(); err == nil {
			bar = newProgress(log, st.Size(), true)
		}
		done = func(int) int64 { return cr.Offset() }
	}
	cols := rd.Columns()
	// A channel bound to a variable must convert to the variable's unit;
	// the message names the fix. The reduction checks the rest.
	vars := r.problem.Variables()
	for i, v := range vars {
		for _, c := range cols {
			if c.Name != v.Symbol || c.Fault != nil {
				continue // a column that cannot be read fails when selected
			}
			if d := c.Unit.Dim(); d != v.Dim {
				return &usageError{fmt.Sprintf("variable %s is %s, but channel %q of %s is %s", v.Symbol, quantity.Describe(v.Dim), v.Symbol, opt.data, quantity.Describe(d))}
			}
			if _, err := units.ConvertUnits(1, c.Unit, r.units[i]); err != nil {
				return &usageError{bindError(v.Symbol, r.units[i], c, opt.data, err)}
			}
		}
	}
	groups := r.set.Groups()
	if opt.fit && len(groups) < 2 {
		return &usageError{"-fit needs at least two groups"}
	}
	if opt.plot != "" && len(groups) != 2 {
		return &usageError{fmt.Sprintf("-plot draws one group against one other; this set has %d groups", len(groups))}
	}
	spec := &reduction.Spec{
		Derive:           opt.derive,
		NonfiniteMissing: opt.nonfiniteMissing,
		Set:              r.set,
		Units:            r.units,
	}
	if opt.fluids {
		spec.Funcs = fluids.FormulaFuncs()
	}
	if opt.points != nil {
		return reducePoints(spec, opt, rd, parquet, out, log)
	}
	// The columns: the trade's symbol where a group is exactly one (Re,
	// Fr, K_T), else Π₁, Π₂, …; the definitions travel with the file.
	defs := spec.Groups()
	outCols := make([]chanfile.Column, len(defs))
	names := make([]string, len(defs))
	for g, gr := range defs {
		outCols[g] = chanfile.Column{Name: gr.Column, Unit: units.One()}
		names[g] = gr.Column
	}
	var w groupSink
	switch {
	case opt.jsonl:
		w = newJSONLines(out, names)
	case opt.parquet:
		pw, err := parquetfile.NewWriter(out, "standard output", outCols, parquetfile.Options{Metadata: reduction.ParquetMetadata(defs)})
		if err != nil {
			return err
		}
		w = parquetSink{pw}
	default:
		rw, err := reduction.NewRowsWriter(out, "standard output", defs, reduction.WriteOptions{
			Notes: []string{fmt.Sprintf("the groups of each data row of %s, in its order", opt.data)}})
		if err != nil {
			return err
		}
		w = rw
	}
	sink := &rowSink{w: w, bar: bar, done: done}
	if opt.fit {
		sink.fits = &fitRows{}
	}
	in := reduction.Input{Name: opt.data, Source: rd, Rows: sink}
	if !parquet {
		in.LineOf = func(row int) int { return reduction.LineOfRow(opt.data, row) }
	}
	res, err := spec.Reduce(in)
	if err != nil {
		if sink.err != nil {
			return sink.err
		}
		return libError(err, help)
	}
	bar.finish()
	if err := w.Flush(); err != nil {
		return err
	}
	rows, fits := res.Rows, sink.fits
	if res.DerivedText != "" {
		for _, line := range strings.Split(strings.TrimSpace(res.DerivedText), "\n") {
			fmt.Fprintf(log, "pisets: derived: %s\n", line)
		}
	}
	fmt.Fprintf(log, "pisets: reduced %d rows of %s to %d groups:\n", rows, opt.data, len(groups))
	for g, gr := range groups {
		col := ""
		if c := defs[g].Column; c != gr.Name {
			col = "; column " + c
		}
		fmt.Fprintf(log, "pisets:   %s = %s  (%s)%s\n", gr.Name, gr.Format(quantity.Unicode), gr.Label(), col)
		if d := gr.Describe(); d != "" {
			fmt.Fprintf(log, "pisets:     %s\n", d) // the named group's name and definition
		}
	}
	for _, c := range res.Columns { // the channels read; the others were not parsed
		for _, rdg := range c.Readings {
			fmt.Fprintf(log, "pisets: channel %s: %v\n", c.Name, rdg)
		}
		if c.Gauge && note == "" {
			fmt.Fprintf(log, "pisets: channel %s: gauge (%s) read as absolute with the reference %g Pa\n", c.Name, c.Text, ro.Reference.Value())
		}
		if c.Missing > 0 {
			fmt.Fprintf(log, "pisets: channel %s: %d missing %s (NaN group fields in those rows)\n", c.Name, c.Missing, plural(c.Missing, "value", "values"))
		}
	}
	if note != "" {
		fmt.Fprintln(log, note)
	}
	for _, v := range res.Derived {
		if c := res.Nonfinite[v]; c > 0 {
			fmt.Fprintf(log, "pisets: derived %s: %d non-finite %s counted as missing (-nonfinite=missing; NaN group fields in those rows)\n", v, c, plural(c, "value", "values"))
		}
	}
	if fits != nil {
		law, err := reportFit(fits, groups, log)
		if err != nil {
			return err
		}
		if opt.plot != "" {
			if err := plotFit(opt.plot, fits, law, groups, opt.data, opt.size()); err != nil {
				return &usageError{fmt.Sprintf("-plot: %v", err)}
			}
			fmt.Fprintf(log, "pisets: plot written to %s\n", opt.plot)
		}
	}
	fmt.Fprintln(log, "pisets: reduced test data only; a rating, an acceptance test or a design follows its standard and the engineer responsible")
	return nil
}

// cancelledGauges reports whether the file's gauge channels may be read
// without the ambient pressure (see gaugeCancels): the line that says so
// when they may, why not when they may not; both are empty for a file
// with no gauge channel, or one the check cannot open (the reading
// proper then reports it).
func cancelledGauges(f *os.File, opt reduceOptions, r *Report, ro chanfile.Options) (note, why string) {
	ro.Reference = units.StandardReference()
	var rd selectSource
	if strings.HasSuffix(strings.ToLower(opt.data), ".parquet") {
		st, err := f.Stat()
		if err != nil {
			return "", ""
		}
		pr, err := parquetfile.NewReader(f, st.Size(), opt.data, parquetfile.Options{Reference: ro.Reference})
		if err != nil {
			return "", ""
		}
		defer pr.Close()
		rd = pr
	} else {
		cr, err := chanfile.NewReader(f, opt.data, ro)
		if err != nil {
			return "", ""
		}
		rd = cr
	}
	if !slices.ContainsFunc(rd.Columns(), func(c chanfile.Column) bool { return c.Gauge }) {
		return "", ""
	}
	var vars []string
	for _, v := range r.problem.Variables() {
		vars = append(vars, v.Symbol)
	}
	var funcs []formula.Func
	if opt.fluids {
		funcs = fluids.FormulaFuncs()
	}
	gauges, derived, rows, why := gaugeCancels(rd, vars, opt.derive, funcs)
	if why != "" {
		return "", why
	}
	return gaugeNote(gauges, derived, rows), ""
}

// bindError explains why channel c cannot be read as variable sym
// declared in vu: the same angle rule as units.ConvertUnits, with the
// fix named.
func bindError(sym string, vu units.Unit, c chanfile.Column, file string, err error) string {
	cu := c.Unit.Format(quantity.Unicode)
	vs := vu.Format(quantity.Unicode)
	msg := fmt.Sprintf("variable %s is declared %s, but channel %q of %s is in %s: %v", sym, vs, c.Name, file, cu, err)
	cp, _ := c.Unit.Angle()
	vp, _ := vu.Angle()
	if errors.Is(err, units.ErrAngle) {
		switch {
		case vp > cp:
			msg += fmt.Sprintf("; if the channel counts revolutions, write its unit in the header as (%s)*rev; or declare the variable in %s (%s=%s)", cu, cu, sym, cu)
		case vp < cp:
			msg += fmt.Sprintf("; declare the variable with the channel's angle (%s=%s, or rad/s)", sym, cu)
		}
	}
	return msg
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// exitCode maps an error of the data mode to the command's exit code.
func exitCode(err error) int {
	var de *dataError
	if errors.As(err, &de) {
		return 1
	}
	return 2
}

// rowSink takes the groups of each chunk from the reduction: it writes
// them, keeps them for the fit and moves the progress bar.
type rowSink struct {
	w    groupSink
	fits *fitRows
	bar  progress
	done func(rows int) int64
	rows int
	err  error // the sink's own error, which is not the data's
}

func (s *rowSink) Write(g []quantity.Series) error {
	if err := s.w.Write(g); err != nil {
		s.err = err
		return err
	}
	n := 0
	if len(g) > 0 {
		n = g[0].Len()
	}
	if s.fits != nil {
		vals := make([][]float64, len(g))
		for i := range g {
			vals[i] = g[i].Values()
		}
		if err := s.fits.add(vals, n); err != nil {
			s.err = err
			return err
		}
	}
	s.rows += n
	s.bar.set(s.done(s.rows))
	return nil
}

// libError sorts an error of the reduction: a spec that does not fit the
// file is a usage error (exit 2), anything else bad data (exit 1); a
// derived value that is not finite names the flag that counts it.
func libError(err error, help string) error {
	var fe *chanfile.Error
	if errors.Is(err, units.ErrGauge) && errors.As(err, &fe) {
		return &usageError{fmt.Sprintf("%s:%d:%d: %q %s", fe.File, fe.Line, fe.Column, fe.Field, help)}
	}
	var pe *parquetfile.Error
	if errors.Is(err, units.ErrGauge) && errors.As(err, &pe) {
		return &usageError{fmt.Sprintf("%s: column %d %q %s", pe.File, pe.Column, pe.Field, help)}
	}
	var re *reduction.Error
	if errors.As(err, &re) {
		if re.Op == "plan" {
			return &usageError{strings.TrimPrefix(err.Error(), "reduction: ")}
		}
		if re.Op == "derive" && errors.Is(err, quantity.ErrRange) {
			return &dataError{fmt.Errorf("%w; use -nonfinite=missing to count such values as missing", err)}
		}
	}
	return &dataError{err}
}

// reducePoints reduces the file to steady points: the runs of a label
// channel, tared by a zero window, each channel's mean with the standard
// uncertainty of the mean and each group with its uncertainty, written
// as a channel file whose comment lines carry the groups' definitions.
func reducePoints(spec *reduction.Spec, opt reduceOptions, rd chanfile.Source, parquet bool, out, log io.Writer) error {
	spec.Points, spec.Zero, spec.Tare = *opt.points, opt.zero, opt.tare
	in := reduction.Input{Name: opt.data, Source: rd}
	if !parquet {
		in.LineOf = func(row int) int { return reduction.LineOfRow(opt.data, row) }
	}
	res, err := spec.Reduce(in)
	if err != nil {
		return libError(err, gaugeHelp)
	}
	if opt.parquet {
		err = reduction.WritePointsParquet(out, res)
	} else {
		err = reduction.WritePoints(out, res, reduction.WriteOptions{})
	}
	if err != nil {
		return err
	}
	if res.DerivedText != "" {
		for _, line := range strings.Split(strings.TrimSpace(res.DerivedText), "\n") {
			fmt.Fprintf(log, "pisets: derived: %s\n", line)
		}
	}
	fmt.Fprintf(log, "pisets: reduced %d rows of %s to %d steady points (%s):\n", res.Rows, opt.data, len(res.Points), spec.Points)
	if z := res.Zero; z != nil {
		fmt.Fprintf(log, "pisets:   zero: rows %d to %d, subtracted from %s\n", z.Window.Start+1, z.Window.End, strings.Join(opt.tare, ", "))
	}
	for _, p := range res.Points {
		line := fmt.Sprintf("pisets:   %s: rows %d to %d", p.Tag, p.Window.Start+1, p.Window.End)
		for g, gr := range res.Groups {
			line += fmt.Sprintf(", %s = %.5g ± %.2g", gr.Column, p.Groups[g].Value(), p.Groups[g].U().Value())
		}
		if p.Drifting() {
			line += " (drifting)"
		}
		fmt.Fprintln(log, line)
	}
	for _, g := range res.Groups {
		fmt.Fprintf(log, "pisets:   %s  (%s)\n", g.Definition, g.Label)
	}
	fmt.Fprintln(log, "pisets: ± is the standard uncertainty (k = 1): the points' repeatability from s/√n_eff, n_eff from the samples' autocorrelation, and the zero's; a fluid property's own correlation uncertainty is not included")
	fmt.Fprintln(log, "pisets: reduced test data only; a rating, an acceptance test or a design follows its standard and the engineer responsible")
	return nil
}

// parseSpan reads a zero span "FROM,TO" of times with units ("0.5s,2s").
func parseSpan(text string) (steady.Span, error) {
	a, b, ok := strings.Cut(text, ",")
	if !ok {
		return steady.Span{}, fmt.Errorf("want FROM,TO as 0.5s,2s")
	}
	from, err := units.ParseQuantity(strings.TrimSpace(a))
	if err != nil || from.Dim() != quantity.Time {
		return steady.Span{}, fmt.Errorf("%s is not a time", cli.Quote(a))
	}
	to, err := units.ParseQuantity(strings.TrimSpace(b))
	if err != nil || to.Dim() != quantity.Time {
		return steady.Span{}, fmt.Errorf("%s is not a time", cli.Quote(b))
	}
	return steady.Span{From: from, To: to}, nil
}
