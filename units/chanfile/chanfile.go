package chanfile

import (
	"bufio"
	"bytes"
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
// 1; column 0 when the whole line is concerned). It matches exactly one
// class of package quantity under errors.Is: the class of Err when Err
// has one (an unknown unit in a header is quantity.ErrUnknown, with the
// *units.ParseError reachable by errors.As); otherwise quantity.ErrRange
// for a number outside float64 (a value that overflows or underflows),
// quantity.ErrInvalid for a bad argument (an option, a series, a column
// that cannot be written) or a failed read or write of the underlying
// file, and quantity.ErrParse for malformed text.
type Error struct {
	File   string
	Line   int
	Column int
	Field  string // the text of the field, if any
	Reason string
	Err    error // an underlying error (a units parse error, an I/O error), or nil
	class  error // the class when Err has none; nil means quantity.ErrParse
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

// Is reports whether target is the error's class (see Error), when Err
// has no class of its own; otherwise errors.Is finds the class on Err.
func (e *Error) Is(target error) bool {
	if e.Err != nil && classOf(e.Err) != nil {
		return false
	}
	if e.class == nil {
		return target == quantity.ErrParse
	}
	return target == e.class
}

// classes are the error classes of package quantity.
var classes = [...]error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}

// classOf returns the class of package quantity that err matches under
// errors.Is (ErrDimension, ErrRange, ErrParse, ErrUnknown or ErrInvalid),
// or nil if it matches none. An error of this package matches exactly one.
func classOf(err error) error {
	for _, c := range classes {
		if errors.Is(err, c) {
			return c
		}
	}
	return nil
}

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

// MaxLineLen bounds the length of one line in bytes.
const MaxLineLen = 1 << 16

// Reader reads a channel file chunk by chunk. Lines are split at the
// delimiter; a field may be quoted ("Q, flow (m3/h)", with "" for a quote
// inside), but a quoted field may not span lines. Lines starting with '#'
// and blank lines are skipped; CR LF line ends and a UTF-8 byte-order
// mark are accepted.
type Reader struct {
	name    string
	opt     Options
	br      *bufio.Reader
	comma   byte
	cols    []Column
	mul     []float64 // SI = x·mul + add
	add     []float64
	missNum []byte      // Options.Missing when it reads as a number (-999)
	line    int         // the last line read
	fields  [][]byte    // reused
	unq     []byte      // reused storage for unquoted fields
	vals    [][]float64 // reused
	missing map[string]bool
	done    bool
	off     int64 // bytes of lines read, after a byte-order mark
}

// NewReader reads the comment lines and the header row of r; name is the
// file's name for messages.
func NewReader(r io.Reader, name string, opt Options) (*Reader, error) {
	br := bufio.NewReaderSize(r, MaxLineLen)
	if b, err := br.Peek(3); err == nil && bytes.Equal(b, []byte("\xef\xbb\xbf")) {
		br.Discard(3) // a UTF-8 byte-order mark
	}
	comma := byte(',')
	if opt.Comma != 0 {
		if opt.Comma >= 0x80 || opt.Comma == '"' || opt.Comma == '\n' || opt.Comma == '\r' || opt.Comma == '#' {
			return nil, &Error{File: name, Reason: fmt.Sprintf("delimiter %q is not a single ASCII byte other than a quote, # or newline", opt.Comma), class: quantity.ErrInvalid}
		}
		comma = byte(opt.Comma)
	}
	rd := &Reader{name: name, opt: opt, br: br, comma: comma, missing: map[string]bool{"": true, "NA": true, "NaN": true, "nan": true}}
	if opt.Missing != "" {
		rd.missing[opt.Missing] = true
		if numStart(opt.Missing[0]) {
			rd.missNum = []byte(opt.Missing)
		}
	}
	ok, err := rd.next()
	if err != nil {
		return nil, err
	}
	if !ok {
		return nil, &Error{File: name, Line: max(rd.line, 1), Reason: "no header row"}
	}
	head := rd.fields
	line := rd.line
	if len(head) > MaxColumns {
		return nil, &Error{File: name, Line: line, Reason: fmt.Sprintf("%d columns, more than %d", len(head), MaxColumns)}
	}
	seen := map[string]int{}
	for i, fb := range head {
		f := string(fb)
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
		// Unit.Of is x·factor + offset; the reader applies the same.
		mul, add := c.Unit.Factor(), c.Unit.Offset()
		if c.Gauge {
			ref := opt.Reference
			if ref.Dim() != quantity.Pressure || !(ref.Value() > 0) || math.IsInf(ref.Value(), 0) {
				return nil, &Error{File: name, Line: line, Column: i + 1, Field: f, Reason: "a gauge pressure channel needs the absolute ambient pressure it was read against: set Options.Reference to the barometer reading (or units.StandardReference(), chosen explicitly)", Err: units.ErrGauge, class: quantity.ErrInvalid}
			}
			add += ref.Value()
			c.Unit = units.MustParse("Pa")
		}
		rd.cols = append(rd.cols, c)
		rd.mul = append(rd.mul, mul)
		rd.add = append(rd.add, add)
	}
	return rd, nil
}

// next reads the next record into r.fields, skipping comments and blank
// lines. It returns false at the end of the input.
func (r *Reader) next() (bool, error) {
	for {
		b, err := r.br.ReadSlice('\n')
		if err == bufio.ErrBufferFull {
			r.line++
			return false, &Error{File: r.name, Line: r.line, Reason: fmt.Sprintf("a line longer than %d bytes", MaxLineLen)}
		}
		if err != nil && err != io.EOF {
			return false, &Error{File: r.name, Line: r.line + 1, Reason: "read failed", Err: err, class: quantity.ErrInvalid}
		}
		if len(b) == 0 && err == io.EOF {
			return false, nil
		}
		r.line++
		r.off += int64(len(b))
		b = bytes.TrimSuffix(b, []byte{'\n'})
		b = bytes.TrimSuffix(b, []byte{'\r'})
		if len(b) == 0 || b[0] == '#' {
			if err == io.EOF {
				return false, nil
			}
			continue
		}
		return true, r.split(b)
	}
}

// split splits one line into r.fields.
func (r *Reader) split(b []byte) error {
	r.fields = r.fields[:0]
	if bytes.IndexByte(b, '"') < 0 {
		for {
			i := bytes.IndexByte(b, r.comma)
			if i < 0 {
				r.fields = append(r.fields, bytes.TrimSpace(b))
				return nil
			}
			r.fields = append(r.fields, bytes.TrimSpace(b[:i]))
			b = b[i+1:]
		}
	}
	// Quoted fields: the slow path, with its own storage.
	r.unq = r.unq[:0]
	var ends []int
	for {
		b = bytes.TrimLeft(b, " \t")
		if len(b) > 0 && b[0] == '"' {
			i := 1
			for {
				j := bytes.IndexByte(b[i:], '"')
				if j < 0 {
					return &Error{File: r.name, Line: r.line, Column: len(ends) + 1, Reason: "a quoted field without its closing quote (a quoted field may not span lines)"}
				}
				r.unq = append(r.unq, b[i:i+j]...)
				i += j + 1
				if i < len(b) && b[i] == '"' {
					r.unq = append(r.unq, '"')
					i++
					continue
				}
				break
			}
			rest := bytes.TrimLeft(b[i:], " \t")
			if len(rest) > 0 && rest[0] != r.comma {
				return &Error{File: r.name, Line: r.line, Column: len(ends) + 1, Reason: "text after the closing quote of a field"}
			}
			ends = append(ends, len(r.unq))
			if len(rest) == 0 {
				break
			}
			b = rest[1:]
			continue
		}
		i := bytes.IndexByte(b, r.comma)
		if i < 0 {
			r.unq = append(r.unq, bytes.TrimSpace(b)...)
			ends = append(ends, len(r.unq))
			break
		}
		r.unq = append(r.unq, bytes.TrimSpace(b[:i])...)
		ends = append(ends, len(r.unq))
		b = b[i+1:]
	}
	start := 0
	for _, e := range ends {
		r.fields = append(r.fields, r.unq[start:e])
		start = e
	}
	return nil
}

// Offset returns the number of bytes of the file read so far, after a
// byte-order mark, for a progress display against the file's size.
func (r *Reader) Offset() int64 { return r.off }

// Columns returns the channels of the file; their Missing counts grow as
// chunks are read.
func (r *Reader) Columns() []Column { return r.cols }

// Read reads up to rows rows (4096 if rows is not positive) into dst,
// one Series per column in SI (dst is grown to the number of columns and
// its storage reused), and returns the number of rows read. It returns io.EOF with 0 rows at the end of the
// file. A gauge column is absolute: its level plus Options.Reference.
func (r *Reader) Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error) {
	if rows <= 0 {
		rows = 4096
	}
	for len(dst) < len(r.cols) {
		dst = append(dst, quantity.Series{})
	}
	dst = dst[:len(r.cols)]
	if r.vals == nil {
		r.vals = make([][]float64, len(r.cols))
	}
	for j := range r.cols {
		r.vals[j] = dst[j].Values()[:0]
	}
	vals := r.vals
	n := 0
	var err error
	for n < rows && !r.done {
		var ok bool
		ok, err = r.next()
		if err != nil || !ok {
			r.done = true
			break
		}
		if len(r.fields) != len(r.cols) {
			err = &Error{File: r.name, Line: r.line, Reason: fmt.Sprintf("a row of %d fields, not the header's %d", len(r.fields), len(r.cols))}
			r.done = true
			break
		}
		for j, f := range r.fields {
			if len(f) == 0 || !numStart(f[0]) && r.missing[string(f)] || r.missNum != nil && bytes.Equal(f, r.missNum) {
				vals[j] = append(vals[j], math.NaN())
				r.cols[j].Missing++
				continue
			}
			x, perr := strconv.ParseFloat(string(f), 64)
			if perr != nil || math.IsInf(x, 0) || math.IsNaN(x) {
				reason, class := "not a finite number", error(nil)
				if errors.Is(perr, strconv.ErrRange) {
					reason, class = "a number beyond the range of float64", quantity.ErrRange
				} else if withUnit(string(f)) {
					reason = "a value with a unit in a data row: the unit belongs in the header"
				}
				err = &Error{File: r.name, Line: r.line, Column: j + 1, Field: short(f), Reason: reason, class: class}
				r.done = true
				break
			}
			if x == 0 && nonzero(f) {
				err = &Error{File: r.name, Line: r.line, Column: j + 1, Field: short(f), Reason: "a nonzero number too small for float64 (it would read as 0)", class: quantity.ErrRange}
				r.done = true
				break
			}
			si := x*r.mul[j] + r.add[j]
			if math.IsInf(si, 0) || math.IsNaN(si) || x != 0 && x*r.mul[j] == 0 {
				err = &Error{File: r.name, Line: r.line, Column: j + 1, Field: short(f), Reason: fmt.Sprintf("the value in %s is beyond the range of float64 in SI units", r.cols[j].Text), class: quantity.ErrRange}
				r.done = true
				break
			}
			vals[j] = append(vals[j], si)
		}
		if err != nil {
			// The row in error is not part of the chunk.
			for j := range vals {
				vals[j] = vals[j][:min(len(vals[j]), n)]
			}
			break
		}
		n++
	}
	for j, c := range r.cols {
		dst[j] = quantity.NewSeries(vals[j], c.Unit.Dim())
	}
	if err != nil {
		return dst, n, err
	}
	if n == 0 && r.done {
		return dst, 0, io.EOF
	}
	return dst, n, nil
}

// short returns a field for a message, cut at 64 bytes.
func short(f []byte) string {
	if len(f) > 64 {
		return string(f[:64]) + "…"
	}
	return string(f)
}

// nonzero reports whether the number f, which strconv.ParseFloat read,
// has a nonzero digit before its exponent.
func nonzero(f []byte) bool {
	hex := false
	if len(f) > 0 && (f[0] == '+' || f[0] == '-') {
		f = f[1:]
	}
	if len(f) > 1 && f[0] == '0' && (f[1] == 'x' || f[1] == 'X') {
		hex, f = true, f[2:]
	}
	for _, c := range f {
		switch {
		case c >= '1' && c <= '9':
			return true
		case hex && (c >= 'a' && c <= 'f' || c >= 'A' && c <= 'F'):
			return true
		case !hex && (c == 'e' || c == 'E'), hex && (c == 'p' || c == 'P'):
			return false
		}
	}
	return false
}

// numStart reports whether c can start a number; a missing marker that
// does not (NA, NaN) is looked up only for fields that do not.
func numStart(c byte) bool { return c >= '0' && c <= '9' || c == '-' || c == '+' || c == '.' }

// withUnit reports whether a field is a number and a unit (12 kn, 160
// m3/h, 12kn), strict or as a data sheet writes it.
func withUnit(f string) bool {
	if _, err := units.ParseValue(f); err == nil {
		return true
	}
	num, unit, ok := strings.Cut(strings.TrimSpace(f), " ")
	if !ok {
		return false
	}
	if _, err := strconv.ParseFloat(num, 64); err != nil {
		return false
	}
	_, _, err := units.ParseDialect(strings.TrimSpace(unit))
	return err == nil
}
