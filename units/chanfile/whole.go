package chanfile

import (
	"fmt"
	"io"

	"similis.dev/similis/quantity"
)

// Whole is a source's channels read whole by ReadAll.
type Whole struct {
	// Columns are the source's columns after its last row, with their
	// final Missing counts.
	Columns []Column
	// Series holds each column's values in SI, one Series per column of
	// Columns, each Rows long; a Label column's Series is empty (its text
	// is in Labels), and so is that of a column a Selector was told not
	// to read.
	Series []quantity.Series
	// Labels holds the text of each label column, one string a row (""
	// for a missing one): the column's Labels from the source (see
	// ReadAll), nil for a column of another kind or a source without
	// labels.
	Labels [][]string
	// Rows is the number of rows read.
	Rows int
}

// Index returns the place in Columns of the channel name, or -1 if no
// column has that name.
func (w Whole) Index(name string) int {
	for k, c := range w.Columns {
		if c.Name == name {
			return k
		}
	}
	return -1
}

// Channel returns the values of the channel name, in SI, for package
// steady (steady.Runs, steady.Channel.Data, steady.TimeWindows). It
// refuses, with an *Error of class quantity.ErrInvalid naming the
// channel, a name no column has and a column that holds no numbers: a
// text (Label) column, whose text is in Labels (steady.TextRuns finds
// its runs), and a column a Selector was told not to read. A column
// that could not be read returns its Column.Fault.
func (w Whole) Channel(name string) (quantity.Series, error) {
	k := w.Index(name)
	if k < 0 {
		return quantity.Series{}, &Error{Reason: fmt.Sprintf("Whole.Channel: no channel %q", name), class: quantity.ErrInvalid}
	}
	c := w.Columns[k]
	switch {
	case c.Fault != nil:
		return quantity.Series{}, c.Fault
	case c.Kind == Label:
		return quantity.Series{}, &Error{Column: c.Index, Reason: fmt.Sprintf("Whole.Channel: %q is a column of text: its text is in Whole.Labels (steady.TextRuns finds the runs of a text run tag)", name), class: quantity.ErrInvalid}
	case k >= len(w.Series) || w.Series[k].Len() != w.Rows:
		return quantity.Series{}, &Error{Column: c.Index, Reason: fmt.Sprintf("Whole.Channel: %q was not read (not selected)", name), class: quantity.ErrInvalid}
	}
	return w.Series[k], nil
}

// labeler is a Source that gives the text of its Label columns, as
// *Reader and the Parquet reader of package parquetfile do.
type labeler interface {
	Labels(k int) []string
}

// ReadAll reads src to its end and returns its channels whole, for a
// file small enough to hold in memory (8 bytes a value): a steady test
// of a few minutes, a zero file, a calibration run. The labels of a
// Label column are kept when src has a method Labels(k int) []string
// (a *Reader, a Parquet reader of package parquetfile, or a Source that
// Select returned over either).
//
// maxRows bounds the rows held. A source with more rows is refused with
// an *Error of class quantity.ErrRange naming the bound: read a longer
// file chunk by chunk with Read, or reduce it with package
// similarity/reduction, which finds and reduces the steady points of a
// file of any length in bounded memory. A maxRows below 1 is an *Error
// of class quantity.ErrInvalid. A read error is returned as the source
// gave it, with no partial result.
func ReadAll(src Source, maxRows int) (Whole, error) {
	if maxRows < 1 {
		name, _ := sourcePos(src)
		return Whole{}, &Error{File: name, Reason: fmt.Sprintf("ReadAll: maxRows %d is not positive", maxRows), class: quantity.ErrInvalid}
	}
	lab, _ := src.(labeler)
	cols := src.Columns()
	vals := make([][]float64, len(cols))
	var labels [][]string
	if lab != nil {
		labels = make([][]string, len(cols))
	}
	var dst []quantity.Series
	rows := 0
	for {
		// Ask for one row past the bound, to tell a file of exactly
		// maxRows rows from a longer one.
		var n int
		var err error
		want := 4096
		if maxRows-rows < want {
			want = maxRows - rows + 1
		}
		dst, n, err = src.Read(dst, want)
		if err == io.EOF {
			break
		}
		if err != nil {
			return Whole{}, err
		}
		if rows+n > maxRows {
			name, line := sourcePos(src)
			return Whole{}, &Error{File: name, Line: line, Reason: fmt.Sprintf("ReadAll: more than %d rows, the bound given: read a longer file chunk by chunk with Read, or reduce it with package similarity/reduction, which works in bounded memory", maxRows), class: quantity.ErrRange}
		}
		rows += n
		for k := range cols {
			if k < len(dst) {
				vals[k] = append(vals[k], dst[k].Values()...)
			}
			if lab != nil {
				if l := lab.Labels(k); l != nil {
					labels[k] = append(labels[k], l...)
				}
			}
		}
	}
	w := Whole{Columns: append([]Column(nil), src.Columns()...), Series: make([]quantity.Series, len(cols)), Labels: labels, Rows: rows}
	for k, c := range w.Columns {
		w.Series[k] = quantity.NewSeries(vals[k], c.Unit.Dim())
	}
	return w, nil
}

// sourcePos returns the file name of a source and the last line read,
// for a message ("" and 0 when the source is not a text file).
func sourcePos(src Source) (string, int) {
	switch s := src.(type) {
	case *Reader:
		return s.name, s.line
	case *selected:
		return sourcePos(s.src)
	}
	return "", 0
}
