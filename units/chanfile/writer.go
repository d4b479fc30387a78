package chanfile

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// MissingText is what Writer writes for a missing value (a NaN): "NaN",
// which Reader, spreadsheets and most data tools read as missing. An empty
// field is not used, since in a file of one column it would make a blank
// line, which Reader skips.
const MissingText = "NaN"

// maxNumberLen is the longest number Writer writes:
// "-2.2250738585072014e-308", 17 digits, a sign, a point and an exponent.
const maxNumberLen = 24

// Writer writes Series as a channel file: a header of "name [unit]"
// fields, then one row per index, each value in its column's unit in the
// shortest form that reads back to the same float64. A NaN is written as
// MissingText. What Writer writes, Reader reads back: a header that would
// not read back to the same names and units, or a value that is not a
// finite float64 in its column's unit, is refused.
type Writer struct {
	w     *bufio.Writer
	name  string
	cols  []Column
	comma byte
	buf   []byte
	line  int // the last line written
}

// NewWriter writes the header for cols to w; name is the file's name for
// messages. Each column's Name and Unit are used; a column must not be a
// gauge column (values are written as read, absolute), nor one with a
// Fault (a column a reader could not read). A name the header
// cannot carry so that Reader reads it back (a newline, a first name
// starting with '#', leading or trailing space, a duplicate, invalid
// UTF-8, a field longer than MaxFieldLen) is refused, as is a number of
// columns whose rows could be longer than MaxLineLen.
func NewWriter(w io.Writer, name string, cols []Column, opt Options) (*Writer, error) {
	comma := byte(',')
	if opt.Comma != 0 {
		if opt.Comma >= 0x80 || opt.Comma == '"' || opt.Comma == '\n' || opt.Comma == '\r' || opt.Comma == '#' {
			return nil, &Error{File: name, Reason: fmt.Sprintf("delimiter %q is not a single ASCII byte other than a quote, # or newline", opt.Comma), class: quantity.ErrInvalid}
		}
		comma = byte(opt.Comma)
	}
	if len(cols) == 0 {
		return nil, &Error{File: name, Reason: "no columns", class: quantity.ErrInvalid}
	}
	if len(cols) > MaxColumns || len(cols)*(maxNumberLen+1) > MaxLineLen {
		return nil, &Error{File: name, Reason: fmt.Sprintf("%d columns: a row could be longer than %d bytes, which Reader refuses", len(cols), MaxLineLen), class: quantity.ErrInvalid}
	}
	head := make([]string, len(cols))
	for i, c := range cols {
		if c.Name == "" {
			return nil, &Error{File: name, Line: 1, Column: i + 1, Reason: "a column without a name", class: quantity.ErrInvalid}
		}
		if c.Gauge {
			return nil, &Error{File: name, Line: 1, Column: i + 1, Field: c.Name, Reason: "a gauge column: the reader made it absolute; write it with Gauge false and its pressure unit", class: quantity.ErrInvalid}
		}
		if c.Fault != nil {
			return nil, &Error{File: name, Line: 1, Column: i + 1, Field: c.Name, Reason: "a column a reader could not read (its Fault is set): its unit is not known", class: quantity.ErrInvalid}
		}
		u := c.Unit.String()
		if c.Unit.Equal(units.One()) {
			u = "1"
		}
		head[i] = c.Name + " [" + u + "]"
	}
	var hb bytes.Buffer
	cw := csv.NewWriter(&hb)
	cw.Comma = rune(comma)
	if err := cw.Write(head); err != nil {
		return nil, &Error{File: name, Line: 1, Reason: "the header", Err: err, class: quantity.ErrInvalid}
	}
	cw.Flush()
	// The header is read back as Reader reads it: the names and units
	// must come back as given.
	back, err := NewReader(bytes.NewReader(hb.Bytes()), name, Options{Comma: opt.Comma})
	if err == nil {
		err = back.refusal(back.active) // every column must read
	}
	if err != nil {
		e := &Error{File: name, Line: 1, Reason: "the header would not read back (" + err.(*Error).Reason + ")", class: quantity.ErrInvalid}
		if c := err.(*Error).Column; c > 0 && c <= len(cols) {
			e.Column, e.Field = c, cols[c-1].Name
		}
		return nil, e
	}
	if n := len(back.Columns()); n != len(cols) {
		return nil, &Error{File: name, Line: 1, Reason: fmt.Sprintf("the header would not read back: %d columns read as %d (a name holds the delimiter, a quote or a line break)", len(cols), n), class: quantity.ErrInvalid}
	}
	for i, c := range back.Columns() {
		if c.Name != cols[i].Name || !c.Unit.Equal(cols[i].Unit) {
			return nil, &Error{File: name, Line: 1, Column: i + 1, Field: cols[i].Name, Reason: fmt.Sprintf("the header would not read back: it reads as %q in %v", c.Name, c.Unit), class: quantity.ErrInvalid}
		}
	}
	bw := bufio.NewWriterSize(w, 1<<16)
	wr := &Writer{w: bw, name: name, cols: cols, comma: comma, line: 1}
	if _, err := bw.Write(hb.Bytes()); err != nil {
		return nil, wr.ioError(err)
	}
	return wr, nil
}

// ioError wraps a failure of the underlying writer.
func (w *Writer) ioError(err error) error {
	return &Error{File: w.name, Reason: "write failed", Err: err, class: quantity.ErrInvalid}
}

// Write writes the rows of s, one Series per column in the column's order,
// converted from SI to each column's unit. The Series must have the
// columns' dimensions and one length. A value that is infinite, or whose
// conversion to the column's unit overflows float64 or underflows to 0,
// is refused with the line and column it would have had; the rows before
// it are written.
func (w *Writer) Write(s []quantity.Series) error {
	if len(s) != len(w.cols) {
		return &Error{File: w.name, Reason: fmt.Sprintf("%d series for %d columns", len(s), len(w.cols)), class: quantity.ErrInvalid}
	}
	n := 0
	for j, c := range w.cols {
		if s[j].Dim() != c.Unit.Dim() {
			return &Error{File: w.name, Column: j + 1, Field: c.Name, Reason: fmt.Sprintf("series of %s for column %q in %v", quantity.Describe(s[j].Dim()), c.Name, c.Unit), Err: quantity.ErrDimension}
		}
		if j == 0 {
			n = s[j].Len()
		} else if s[j].Len() != n {
			return &Error{File: w.name, Column: j + 1, Field: c.Name, Reason: fmt.Sprintf("series of %d values, column 1 has %d", s[j].Len(), n), class: quantity.ErrInvalid}
		}
	}
	for i := 0; i < n; i++ {
		b := w.buf[:0]
		for j, c := range w.cols {
			if j > 0 {
				b = append(b, w.comma)
			}
			v := s[j].Values()[i]
			if math.IsNaN(v) {
				b = append(b, MissingText...)
				continue
			}
			x := (v - c.Unit.Offset()) / c.Unit.Factor()
			if !readsBack(x, v, c.Unit) {
				reason := fmt.Sprintf("an infinite value in column %q: a file holds finite numbers or missing ones", c.Name)
				if !math.IsInf(v, 0) {
					reason = fmt.Sprintf("%v in SI is beyond the range of float64 in %v", v, c.Unit)
				}
				return &Error{File: w.name, Line: w.line + 1, Column: j + 1, Field: c.Name, Reason: reason, class: quantity.ErrRange}
			}
			b = strconv.AppendFloat(b, x, 'g', -1, 64)
		}
		b = append(b, '\n')
		w.buf = b
		if _, err := w.w.Write(b); err != nil {
			return w.ioError(err)
		}
		w.line++
	}
	return nil
}

// readsBack reports whether x, the SI value v in unit u, is finite and
// reads back as Reader reads it to a finite value, neither of them an
// underflow to 0 of a nonzero number.
func readsBack(x, v float64, u units.Unit) bool {
	if math.IsInf(x, 0) || math.IsNaN(x) || x == 0 && v != u.Offset() {
		return false
	}
	y := x * u.Factor()
	back := y + u.Offset()
	return !math.IsInf(back, 0) && !math.IsNaN(back) && (x == 0 || y != 0)
}

// Flush writes any buffered data to the underlying writer.
func (w *Writer) Flush() error {
	if err := w.w.Flush(); err != nil {
		return w.ioError(err)
	}
	return nil
}
