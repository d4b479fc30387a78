package main

import (
	"bufio"
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"
	"time"

	"github.com/schollz/progressbar/v3"
	"golang.org/x/term"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
	"similis.dev/similis/units/formula"
)

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
	var rd channelSource
	var bar progress
	var done func(rows int) int64 // rows or bytes read so far
	const gaugeHelp = "is a gauge pressure: give -baro with the barometer reading (as -baro 1002hPa), or -std-atm to use 101325 Pa as an explicit choice"
	parquet := strings.HasSuffix(strings.ToLower(opt.data), ".parquet")
	if parquet {
		st, err := f.Stat()
		if err != nil {
			return &usageError{fmt.Sprintf("-data: %v", err)}
		}
		pr, err := parquetfile.NewReader(f, st.Size(), opt.data, parquetfile.Options{Reference: ro.Reference})
		var pe *parquetfile.Error
		if errors.Is(err, units.ErrGauge) && errors.As(err, &pe) {
			return &usageError{fmt.Sprintf("%s: column %d %q %s", pe.File, pe.Column, pe.Field, gaugeHelp)}
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
			return &usageError{fmt.Sprintf("%s:%d:%d: %q %s", fe.File, fe.Line, fe.Column, fe.Field, gaugeHelp)}
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
	byName := map[string]int{}
	var inputs []formula.Input
	for i, c := range cols {
		if c.Kind == chanfile.Label {
			continue // text (a run tag): no variable
		}
		byName[c.Name] = i
		inputs = append(inputs, formula.Input{Name: c.Name, Dim: c.Unit.Dim()})
	}
	var prog *formula.Program
	var ev *formula.Evaluator
	derived := map[string]int{}
	if opt.derive != "" {
		if prog, err = formula.Compile(opt.derive, inputs...); err != nil {
			return &usageError{fmt.Sprintf("-derive: %v", err)}
		}
		ev = prog.Evaluator()
		if opt.nonfiniteMissing {
			// The loop below marks and counts each non-finite derived
			// value, by variable, after the evaluation.
			ev.SetCheck(formula.Unchecked)
		}
		for i, name := range prog.Outputs() {
			derived[name] = i
		}
	}
	// Where each variable comes from, with its dimension checked.
	type source struct {
		col, out int     // a channel, or a derived output (col < 0)
		scale    float64 // 1, or 1/(2π)^k for a variable held in revolutions
	}
	vars := r.problem.Variables()
	srcs := make([]source, len(vars))
	for i, v := range vars {
		vu := r.units[i]
		plane, _ := vu.Angle()
		// A channel's SI values hold angles in radians; a variable held in
		// revolutions takes them divided by (2π)^plane.
		scale := 1.0
		if v.Angle == pigroups.Revolutions && plane != 0 {
			scale = math.Pow(2*math.Pi, -float64(plane))
		}
		if j, ok := byName[v.Symbol]; ok {
			if d := cols[j].Unit.Dim(); d != v.Dim {
				return &usageError{fmt.Sprintf("variable %s is %s, but channel %q of %s is %s", v.Symbol, quantity.Describe(v.Dim), v.Symbol, opt.data, quantity.Describe(d))}
			}
			if _, err := units.ConvertUnits(1, cols[j].Unit, vu); err != nil {
				return &usageError{bindError(v.Symbol, vu, cols[j], opt.data, err)}
			}
			srcs[i] = source{col: j, scale: scale}
			continue
		}
		if k, ok := derived[v.Symbol]; ok {
			if d := prog.Dim(k); d != v.Dim {
				return &usageError{fmt.Sprintf("variable %s is %s, but -derive gives %s", v.Symbol, quantity.Describe(v.Dim), quantity.Describe(d))}
			}
			if plane == 0 && v.Angle == pigroups.Revolutions {
				return &usageError{fmt.Sprintf("variable %s is declared %s, which counts cycles, but -derive gives values in SI, where a rotational speed is in rad/s: declare %s in rad/s or rev/s", v.Symbol, vu.Format(quantity.Unicode), v.Symbol)}
			}
			srcs[i] = source{col: -1, out: k, scale: scale}
			continue
		}
		return &usageError{fmt.Sprintf("variable %s is neither a channel of %s nor defined by -derive (channels: %s)", v.Symbol, opt.data, channelNames(cols))}
	}
	set := r.set
	gev := set.Evaluator()
	groups := set.Groups()
	outCols := make([]chanfile.Column, len(groups))
	for g, gr := range groups {
		outCols[g] = chanfile.Column{Name: gr.Name, Unit: units.One()}
	}
	var fits *fitRows
	if opt.fit {
		if len(groups) < 2 {
			return &usageError{"-fit needs at least two groups"}
		}
		fits = &fitRows{}
	}
	if opt.plot != "" && len(groups) != 2 {
		return &usageError{fmt.Sprintf("-plot draws one group against one other; this set has %d groups", len(groups))}
	}
	var w groupSink
	if opt.jsonl {
		names := make([]string, len(groups))
		for g, gr := range groups {
			names[g] = gr.Name
		}
		w = newJSONLines(out, names)
	} else if opt.parquet {
		pw, err := parquetfile.NewWriter(out, "standard output", outCols, parquetfile.Options{})
		if err != nil {
			return err
		}
		w = parquetSink{pw}
	} else if w, err = chanfile.NewWriter(out, "standard output", outCols, chanfile.Options{}); err != nil {
		return err
	}
	var (
		chunk   []quantity.Series
		progIn  []quantity.Series
		progOut [][]float64
		varCols = make([]quantity.Series, len(vars))
		scaled  = make([][]float64, len(vars))
		gbuf    = make([][]float64, len(groups))
		gser    = make([]quantity.Series, len(groups))
		rows    int
		// non-finite derived values counted as missing, by variable
		nonfinite      = map[string]int{}
		nonfiniteOrder []string
	)
	for {
		var n int
		chunk, n, err = rd.Read(chunk, 4096)
		if err == io.EOF {
			break
		}
		if err != nil {
			return &dataError{err}
		}
		if prog != nil {
			progIn = progIn[:0]
			for _, in := range prog.Inputs() {
				progIn = append(progIn, chunk[byName[in.Name]])
			}
			if len(progOut) != len(prog.Outputs()) {
				progOut = make([][]float64, len(prog.Outputs()))
			}
			for k := range progOut {
				progOut[k] = grow(progOut[k], n)
			}
			if err := ev.Series(progIn, progOut); err != nil {
				var re *formula.RangeError
				if errors.As(err, &re) && re.Row >= 0 {
					return &dataError{fmt.Errorf("%s: -derive: %w; use -nonfinite=missing to count such values as missing", where(opt.data, rows+re.Row+1, parquet), err)}
				}
				return &dataError{fmt.Errorf("%s: rows %d to %d: -derive: %w", opt.data, rows+1, rows+n, err)}
			}
			// A derived value that is not finite although every channel
			// of its row is present was produced by the formula (0/0, an
			// overflow): an error, or with -nonfinite=missing a counted
			// missing value. A missing channel's NaN is already counted.
			for i, s := range srcs {
				if s.col >= 0 {
					continue
				}
				for k, x := range progOut[s.out][:n] {
					if !math.IsNaN(x) && !math.IsInf(x, 0) || anyNaN(progIn, k) {
						continue
					}
					if !opt.nonfiniteMissing {
						return &dataError{fmt.Errorf("%s: -derive gives %s = %v from a row with every channel present (a 0/0, an overflow or a function outside its domain); use -nonfinite=missing to count such values as missing", where(opt.data, rows+k+1, parquet), vars[i].Symbol, x)}
					}
					progOut[s.out][k] = math.NaN()
					if nonfinite[vars[i].Symbol] == 0 {
						nonfiniteOrder = append(nonfiniteOrder, vars[i].Symbol)
					}
					nonfinite[vars[i].Symbol]++
				}
			}
		}
		for i, s := range srcs {
			var vals []float64
			if s.col >= 0 {
				vals = chunk[s.col].Values()
			} else {
				vals = progOut[s.out]
			}
			if s.scale != 1 {
				scaled[i] = grow(scaled[i], n)
				for k, x := range vals[:n] {
					scaled[i][k] = x * s.scale
				}
				vals = scaled[i]
			}
			varCols[i] = quantity.NewSeries(vals[:n], vars[i].Dim)
		}
		for g := range gbuf {
			gbuf[g] = grow(gbuf[g], n)
		}
		if err := gev.Series(varCols, gbuf); err != nil {
			k, rerr := failingRow(gev, varCols, n, len(groups))
			if rerr == nil {
				return &dataError{fmt.Errorf("%s: rows %d to %d: %w", opt.data, rows+1, rows+n, err)}
			}
			return &dataError{fmt.Errorf("%s: %w", where(opt.data, rows+k+1, parquet), rerr)}
		}
		for g := range gbuf {
			gser[g] = quantity.NewSeries(gbuf[g], 0)
		}
		if err := w.Write(gser); err != nil {
			return err
		}
		if fits != nil {
			if err := fits.add(gbuf, n); err != nil {
				return err
			}
		}
		rows += n
		bar.set(done(rows))
	}
	bar.finish()
	if err := w.Flush(); err != nil {
		return err
	}
	if len(opt.derive) > 0 {
		for _, line := range strings.Split(strings.TrimSpace(prog.Text()), "\n") {
			fmt.Fprintf(log, "pisets: derived: %s\n", line)
		}
	}
	fmt.Fprintf(log, "pisets: reduced %d rows of %s to %d groups:\n", rows, opt.data, len(groups))
	for _, g := range groups {
		fmt.Fprintf(log, "pisets:   %s = %s  (%s)\n", g.Name, g.Format(quantity.Unicode), g.Label())
	}
	for _, c := range cols {
		for _, rdg := range c.Readings {
			fmt.Fprintf(log, "pisets: channel %s: %v\n", c.Name, rdg)
		}
		if c.Gauge {
			fmt.Fprintf(log, "pisets: channel %s: gauge (%s) read as absolute with the reference %g Pa\n", c.Name, c.Text, ro.Reference.Value())
		}
		if c.Missing > 0 {
			fmt.Fprintf(log, "pisets: channel %s: %d missing %s (NaN group fields in those rows)\n", c.Name, c.Missing, plural(c.Missing, "value", "values"))
		}
	}
	for _, v := range nonfiniteOrder {
		c := nonfinite[v]
		fmt.Fprintf(log, "pisets: derived %s: %d non-finite %s counted as missing (-nonfinite=missing; NaN group fields in those rows)\n", v, c, plural(c, "value", "values"))
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

// anyNaN reports whether any input column is missing (NaN) at row k.
func anyNaN(in []quantity.Series, k int) bool {
	for _, s := range in {
		if math.IsNaN(s.Values()[k]) {
			return true
		}
	}
	return false
}

// failingRow finds the first row of the chunk whose groups cannot be
// evaluated, and the error without a row index of its own.
func failingRow(gev *pigroups.Evaluator, cols []quantity.Series, n, groups int) (int, error) {
	q := make([]quantity.Quantity, len(cols))
	dst := make([]float64, groups)
rows:
	for k := range n {
		for i, c := range cols {
			if q[i] = c.At(k); math.IsNaN(q[i].Value()) {
				continue rows // a missing value: an empty group, not an error
			}
		}
		if _, err := gev.Row(q, dst); err != nil {
			return k, err
		}
	}
	return 0, nil
}

// where names a data row for a message: the file's line for a text file
// (comments, blank lines and the header counted), the row for Parquet.
func where(file string, row int, parquet bool) string {
	if parquet {
		return fmt.Sprintf("%s: row %d", file, row)
	}
	if line := lineOfRow(file, row); line > 0 {
		return fmt.Sprintf("%s:%d", file, line)
	}
	return fmt.Sprintf("%s: data row %d", file, row)
}

// lineOfRow returns the line of a text channel file that holds data row
// row (1-based), reading the file again as the channel reader does:
// blank lines and lines starting with '#' skipped, the first other line
// the header; 0 if the file cannot be read or is shorter.
func lineOfRow(file string, row int) int {
	f, err := os.Open(file)
	if err != nil {
		return 0
	}
	defer f.Close()
	br := bufio.NewReaderSize(f, chanfile.MaxLineLen)
	if b, err := br.Peek(3); err == nil && string(b) == "\xef\xbb\xbf" {
		br.Discard(3)
	}
	line, data := 0, -1 // data: rows seen, −1 before the header
	for {
		b, err := br.ReadSlice('\n')
		if len(b) == 0 && err != nil {
			return 0
		}
		line++
		b = bytes.TrimSuffix(bytes.TrimSuffix(b, []byte{'\n'}), []byte{'\r'})
		if len(b) > 0 && b[0] != '#' {
			if data++; data == row {
				return line
			}
		}
		if err != nil && err != bufio.ErrBufferFull {
			return 0
		}
	}
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func grow(v []float64, n int) []float64 {
	if cap(v) < n {
		return make([]float64, n)
	}
	return v[:n]
}

func channelNames(cols []chanfile.Column) string {
	s := ""
	for i, c := range cols {
		if i > 0 {
			s += ", "
		}
		s += c.Name
	}
	return s
}

// exitCode maps an error of the data mode to the command's exit code.
func exitCode(err error) int {
	var de *dataError
	if errors.As(err, &de) {
		return 1
	}
	return 2
}
