package chanfile

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// MaxColumns bounds the number of channels of one file.
const MaxColumns = 4096

// MaxFieldLen bounds the length of one field in bytes.
const MaxFieldLen = 1024

// Column is one channel of a file: its name, its unit as read and the
// readings the dialect made of the unit text.
type Column struct {
	Name     string
	Unit     units.Unit
	Text     string          // the unit as written in the header
	Readings []units.Reading // lenient readings of Text, if any
	// Gauge reports that the channel was logged as a gauge pressure and
	// is read as absolute by adding Options.Reference.
	Gauge bool
	// Missing counts the missing values read so far.
	Missing int
}

// Error reports a problem in a file, with the line and column (both from
// 1; column 0 when the whole line is concerned). It matches
// quantity.ErrParse, and its Err under errors.Is.
type Error struct {
	File   string
	Line   int
	Column int
	Field  string // the text of the field, if any
	Reason string
	Err    error // an underlying error (a units parse error), or nil
}

// Error implements the error interface: "loop.csv:14:3: …".
func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("chanfile: ")
	if e.File != "" || e.Line > 0 {
		fmt.Fprintf(&sb, "%s:%d", e.File, e.Line)
		if e.Column > 0 {
			fmt.Fprintf(&sb, ":%d", e.Column)
		}
		sb.WriteString(": ")
	}
	if e.Field != "" {
		fmt.Fprintf(&sb, "%q: ", e.Field)
	}
	sb.WriteString(e.Reason)
	if e.Err != nil {
		sb.WriteString(": ")
		sb.WriteString(e.Err.Error())
	}
	return sb.String()
}

// Unwrap returns the underlying error.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is quantity.ErrParse, the class of an *Error.
func (e *Error) Is(target error) bool { return target == quantity.ErrParse }

// Options adjust how a file is read. The zero value reads CSV with '#'
// comments and refuses gauge channels.
type Options struct {
	// Comma is the field delimiter; 0 means ','. Use '\t' for TSV.
	Comma rune
	// Missing is an extra marker for a missing value, besides the empty
	// field, NA and NaN (as in "-999").
	Missing string
	// Reference, if set, is the absolute ambient pressure that gauge
	// channels are read against. Leave it zero to refuse gauge channels.
	Reference quantity.Quantity
}

// ParseHeaderField reads one header field into a channel name and unit:
// "V [kn]", "Torque (in-lb)", "Q m3/h", "Re [1]". The unit is read with
// units.ParseDialect. A gauge unit is returned with Gauge set and the
// unit of the gauge level; the caller decides whether it has a reference.
func ParseHeaderField(field string) (Column, error) {
	f := strings.TrimSpace(strings.TrimPrefix(field, "\ufeff"))
	if len(f) > MaxFieldLen {
		return Column{}, &Error{Field: f[:32] + "…", Reason: "header field too long"}
	}
	if !utf8.ValidString(f) {
		return Column{}, &Error{Field: f, Reason: "header field is not valid UTF-8"}
	}
	var name, unit string
	switch {
	case strings.HasSuffix(f, "]") && strings.LastIndexByte(f, '[') >= 0:
		i := strings.LastIndexByte(f, '[')
		name, unit = f[:i], f[i+1:len(f)-1]
	case strings.HasSuffix(f, ")") && !strings.HasSuffix(f, "(g)") && strings.LastIndexByte(f, '(') >= 0:
		i := matchingOpen(f)
		if i < 0 {
			return Column{}, &Error{Field: f, Reason: "unbalanced parentheses"}
		}
		name, unit = f[:i], f[i+1:len(f)-1]
	default:
		i := strings.LastIndexAny(f, " \t")
		if i < 0 {
			return Column{}, &Error{Field: f, Reason: fmt.Sprintf("no unit for the channel: write %q for a dimensionless one", f+" [1]")}
		}
		name, unit = f[:i], f[i+1:]
	}
	name, unit = strings.TrimSpace(name), strings.TrimSpace(unit)
	if name == "" {
		return Column{}, &Error{Field: f, Reason: "no channel name before the unit"}
	}
	if unit == "" {
		return Column{}, &Error{Field: f, Reason: fmt.Sprintf("no unit for the channel: write %q for a dimensionless one", name+" [1]")}
	}
	col := Column{Name: name, Text: unit}
	if unit == "-" || unit == "1" {
		col.Unit = units.One()
		return col, nil
	}
	if g, err := units.ParseGauge("1 " + unit); err == nil {
		col.Unit, col.Gauge = g.Unit, true
		return col, nil
	}
	u, rd, err := units.ParseDialect(unit)
	if err != nil {
		return Column{}, &Error{Field: f, Reason: "not a unit", Err: err}
	}
	col.Unit, col.Readings = u, rd
	return col, nil
}

// matchingOpen returns the index of the '(' matching the final ')' of s.
func matchingOpen(s string) int {
	depth := 0
	for i := len(s) - 1; i >= 0; i-- {
		switch s[i] {
		case ')':
			depth++
		case '(':
			depth--
			if depth == 0 {
				return i
			}
		}
	}
	return -1
}

// Reader reads a channel file chunk by chunk.
type Reader struct {
	name    string
	opt     Options
	cr      *csv.Reader
	cols    []Column
	conv    []func(float64) float64
	line    int // line of the last record read
	missing map[string]bool
	done    bool
}

// NewReader reads the comment lines and the header row of r; name is the
// file's name for messages.
func NewReader(r io.Reader, name string, opt Options) (*Reader, error) {
	br := bufio.NewReaderSize(r, 1<<16)
	if b, err := br.Peek(3); err == nil && bytes.Equal(b, []byte("\xef\xbb\xbf")) {
		br.Discard(3) // a UTF-8 byte-order mark
	}
	cr := csv.NewReader(br)
	cr.Comment = '#'
	cr.ReuseRecord = true
	cr.TrimLeadingSpace = true
	if opt.Comma != 0 {
		cr.Comma = opt.Comma
	}
	rd := &Reader{name: name, opt: opt, cr: cr, missing: map[string]bool{"": true, "NA": true, "NaN": true, "nan": true}}
	if opt.Missing != "" {
		rd.missing[opt.Missing] = true
	}
	head, err := cr.Read()
	if err != nil {
		if err == io.EOF {
			return nil, &Error{File: name, Line: 1, Reason: "no header row"}
		}
		return nil, rd.csvError(err)
	}
	line, _ := cr.FieldPos(0)
	if len(head) > MaxColumns {
		return nil, &Error{File: name, Line: line, Reason: fmt.Sprintf("%d columns, more than %d", len(head), MaxColumns)}
	}
	seen := map[string]int{}
	for i, f := range head {
		c, err := ParseHeaderField(f)
		if err != nil {
			e := err.(*Error)
			e.File, e.Line, e.Column = name, line, i+1
			return nil, e
		}
		if j, dup := seen[c.Name]; dup {
			return nil, &Error{File: name, Line: line, Column: i + 1, Field: f, Reason: fmt.Sprintf("channel %q is also column %d", c.Name, j+1)}
		}
		seen[c.Name] = i
		u := c.Unit
		conv := func(x float64) float64 { return u.Of(x).Value() }
		if c.Gauge {
			ref := opt.Reference
			if ref.Dim() != quantity.Pressure || !(ref.Value() > 0) || math.IsInf(ref.Value(), 0) {
				return nil, &Error{File: name, Line: line, Column: i + 1, Field: f, Reason: "a gauge pressure channel needs the absolute ambient pressure it was read against: set Options.Reference to the barometer reading (or units.StandardReference(), chosen explicitly)", Err: units.ErrGauge}
			}
			pa := ref.Value()
			conv = func(x float64) float64 { return u.Of(x).Value() + pa }
			c.Unit = units.MustParse("Pa")
		}
		rd.cols = append(rd.cols, c)
		rd.conv = append(rd.conv, conv)
	}
	cr.FieldsPerRecord = len(head)
	rd.line = line
	return rd, nil
}

// Columns returns the channels of the file; their Missing counts grow as
// chunks are read.
func (r *Reader) Columns() []Column { return r.cols }

// Read reads up to max rows into dst, one Series per column in SI (dst is
// grown to the number of columns and its storage reused), and returns the
// number of rows read. It returns io.EOF with 0 rows at the end of the
// file. A gauge column is absolute: its level plus Options.Reference.
func (r *Reader) Read(dst []quantity.Series, max int) ([]quantity.Series, int, error) {
	if max <= 0 {
		max = 4096
	}
	for len(dst) < len(r.cols) {
		dst = append(dst, quantity.Series{})
	}
	dst = dst[:len(r.cols)]
	vals := make([][]float64, len(r.cols))
	for j := range r.cols {
		vals[j] = dst[j].Values()[:0]
	}
	n := 0
	for n < max && !r.done {
		rec, err := r.cr.Read()
		if err == io.EOF {
			r.done = true
			break
		}
		if err != nil {
			return dst, n, r.csvError(err)
		}
		line, _ := r.cr.FieldPos(0)
		for j, f := range rec {
			if len(f) > MaxFieldLen {
				return dst, n, &Error{File: r.name, Line: line, Column: j + 1, Field: f[:32] + "…", Reason: "field too long"}
			}
			if r.missing[f] {
				vals[j] = append(vals[j], math.NaN())
				r.cols[j].Missing++
				continue
			}
			x, err := strconv.ParseFloat(f, 64)
			if err != nil || math.IsInf(x, 0) || math.IsNaN(x) {
				reason := "not a finite number"
				if _, verr := units.ParseValue(f); verr == nil {
					reason = "a value with a unit in a data row: the unit belongs in the header"
				}
				return dst, n, &Error{File: r.name, Line: line, Column: j + 1, Field: f, Reason: reason}
			}
			vals[j] = append(vals[j], r.conv[j](x))
		}
		n++
	}
	for j, c := range r.cols {
		dst[j] = quantity.NewSeries(vals[j], c.Unit.Dim())
	}
	if n == 0 && r.done {
		return dst, 0, io.EOF
	}
	return dst, n, nil
}

func (r *Reader) csvError(err error) error {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		reason := pe.Err.Error()
		if errors.Is(pe.Err, csv.ErrFieldCount) {
			reason = fmt.Sprintf("a row of a different number of fields than the header's %d", len(r.cols))
		}
		return &Error{File: r.name, Line: pe.Line, Column: pe.Column, Reason: reason}
	}
	return &Error{File: r.name, Line: r.line, Reason: "read failed", Err: err}
}
