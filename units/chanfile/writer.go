package chanfile

import (
	"bufio"
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Writer writes Series as a channel file: a header of "name [unit]"
// fields, then one row per index, each value in its column's unit in the
// shortest form that reads back to the same float64. A NaN is written as
// an empty field, which Reader reads as missing.
type Writer struct {
	w     *bufio.Writer
	cols  []Column
	comma byte
	buf   []byte
	line  int // the last line written
}

// NewWriter writes the header for cols to w. Each column's Name and Unit
// are used; a column must not be a gauge column (values are written as
// read, absolute).
func NewWriter(w io.Writer, cols []Column, opt Options) (*Writer, error) {
	comma := byte(',')
	if opt.Comma != 0 {
		if opt.Comma >= 0x80 || opt.Comma == '"' || opt.Comma == '\n' || opt.Comma == '\r' || opt.Comma == '#' {
			return nil, &Error{Reason: fmt.Sprintf("delimiter %q is not a single ASCII byte other than a quote, # or newline", opt.Comma)}
		}
		comma = byte(opt.Comma)
	}
	head := make([]string, len(cols))
	for i, c := range cols {
		if c.Name == "" {
			return nil, &Error{Column: i + 1, Reason: "a column without a name"}
		}
		if c.Gauge {
			return nil, &Error{Column: i + 1, Field: c.Name, Reason: "a gauge column: the reader made it absolute; write it with Gauge false and its pressure unit"}
		}
		u := c.Unit.String()
		if c.Unit.Equal(units.One()) {
			u = "1"
		}
		head[i] = c.Name + " [" + u + "]"
		if _, err := ParseHeaderField(head[i]); err != nil {
			return nil, &Error{Column: i + 1, Field: head[i], Reason: "the header would not read back", Err: err}
		}
	}
	bw := bufio.NewWriterSize(w, 1<<16)
	cw := csv.NewWriter(bw)
	cw.Comma = rune(comma)
	if err := cw.Write(head); err != nil {
		return nil, err
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return nil, err
	}
	return &Writer{w: bw, cols: cols, comma: comma, line: 1}, nil
}

// Write writes the rows of s, one Series per column in the column's order,
// converted from SI to each column's unit. The Series must have the
// columns' dimensions and one length.
func (w *Writer) Write(s []quantity.Series) error {
	if len(s) != len(w.cols) {
		return &Error{Reason: fmt.Sprintf("%d series for %d columns", len(s), len(w.cols))}
	}
	n := 0
	for j, c := range w.cols {
		if s[j].Dim() != c.Unit.Dim() {
			return &Error{Column: j + 1, Reason: fmt.Sprintf("series of %s for column %q in %v", quantity.Describe(s[j].Dim()), c.Name, c.Unit), Err: quantity.ErrDimension}
		}
		if j == 0 {
			n = s[j].Len()
		} else if s[j].Len() != n {
			return &Error{Column: j + 1, Reason: fmt.Sprintf("series of %d values, column 1 has %d", s[j].Len(), n)}
		}
	}
	for i := 0; i < n; i++ {
		b := w.buf[:0]
		for j, c := range w.cols {
			if j > 0 {
				b = append(b, w.comma)
			}
			q := s[j].At(i)
			if math.IsNaN(q.Value()) {
				continue
			}
			if math.IsInf(q.Value(), 0) {
				return &Error{Line: w.line + 1, Column: j + 1, Reason: fmt.Sprintf("an infinite value in column %q: a file holds finite numbers or missing ones", c.Name)}
			}
			x, err := c.Unit.ValueOf(q)
			if err != nil {
				return &Error{Line: w.line + 1, Column: j + 1, Reason: "cannot convert", Err: err}
			}
			b = strconv.AppendFloat(b, x, 'g', -1, 64)
		}
		b = append(b, '\n')
		w.buf = b
		if _, err := w.w.Write(b); err != nil {
			return err
		}
		w.line++
	}
	return nil
}

// Flush writes any buffered data to the underlying writer.
func (w *Writer) Flush() error { return w.w.Flush() }
