package chanfile

import (
	"io"

	"similis.dev/similis/quantity"
)

// Source is a source of channels: a file being read (a *Reader, or a
// Parquet reader of package parquetfile, which both satisfy it as they
// are) or channels held in memory (SeriesSource). Columns describes the
// channels; Read fills dst with up to rows rows of each, in SI, one
// Series per column in the order of Columns, reusing dst's storage, and
// returns io.EOF with 0 rows at the end.
type Source interface {
	Columns() []Column
	Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error)
}

// Selector is a Source that can be told which columns to deliver, so
// that it need not convert a column nobody asked for. After Select(idx),
// Columns still describes every column of the file, but Read fills only
// dst[k] for k in idx (the others are left empty, of length 0).
//
// Both *Reader and the Parquet reader of package parquetfile implement
// it: the columns are chosen after the header (or the schema) is read
// and before any data row is parsed, so a column nobody asked for is
// never converted and its content cannot fail the file.
type Selector interface {
	Source
	Select(idx []int) error
}

// Select returns a Source over the columns of src at idx, in that order:
// its Columns are those columns and Read delivers only them. When src is
// a Selector it is asked to read only those columns; otherwise src reads
// every column and the others are dropped after each chunk. An index
// outside src's columns, or one given twice, is an *Error of class
// quantity.ErrInvalid; a column whose Fault is set returns that fault,
// and so does a Selector's own refusal (two columns of one name).
func Select(src Source, idx ...int) (Source, error) {
	cols := src.Columns()
	seen := make(map[int]bool, len(idx))
	for _, k := range idx {
		if k < 0 || k >= len(cols) || seen[k] {
			return nil, &Error{Reason: "select: column index out of range or repeated", class: quantity.ErrInvalid}
		}
		seen[k] = true
	}
	for _, k := range idx {
		if cols[k].Fault != nil {
			return nil, cols[k].Fault
		}
	}
	s := &selected{src: src, idx: append([]int(nil), idx...)}
	if sel, ok := src.(Selector); ok {
		if err := sel.Select(s.idx); err != nil {
			return nil, err
		}
	}
	return s, nil
}

type selected struct {
	src  Source
	idx  []int
	full []quantity.Series
	cols []Column
}

// Columns returns the selected columns, with their current Missing counts.
func (s *selected) Columns() []Column {
	all := s.src.Columns()
	s.cols = s.cols[:0]
	for _, k := range s.idx {
		s.cols = append(s.cols, all[k])
	}
	return s.cols
}

// Read reads the selected columns.
func (s *selected) Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error) {
	var n int
	var err error
	s.full, n, err = s.src.Read(s.full, rows)
	if err != nil {
		return dst, n, err
	}
	if cap(dst) < len(s.idx) {
		dst = make([]quantity.Series, len(s.idx))
	}
	dst = dst[:len(s.idx)]
	for i, k := range s.idx {
		dst[i] = s.full[k]
	}
	return dst, n, nil
}

// Labels returns the labels of the selected column k for the rows of
// the last chunk Read returned, as the source's Labels method gives them
// (nil when the source has none or the column is not a Label column).
func (s *selected) Labels(k int) []string {
	l, ok := s.src.(labeler)
	if !ok || k < 0 || k >= len(s.idx) {
		return nil
	}
	return l.Labels(s.idx[k])
}

// SeriesSource is a Source over channels held in memory, read chunk by
// chunk like a file. Read returns views of the Series given (no copy),
// so the caller must not change them while the source is read.
type SeriesSource struct {
	cols []Column
	data []quantity.Series
	n    int // rows
	off  int // rows read
}

// NewSeriesSource returns a Source over data, one Series per column of
// cols, in SI. Each Series must have its column's dimension and all must
// have one length; otherwise it returns an *Error of class
// quantity.ErrInvalid. A NaN is a missing value, counted on its column.
func NewSeriesSource(cols []Column, data []quantity.Series) (*SeriesSource, error) {
	if len(cols) != len(data) {
		return nil, &Error{Reason: "series source: columns and series differ in number", class: quantity.ErrInvalid}
	}
	if len(cols) > MaxColumns {
		return nil, &Error{Reason: "series source: too many columns", class: quantity.ErrInvalid}
	}
	s := &SeriesSource{cols: append([]Column(nil), cols...), data: append([]quantity.Series(nil), data...)}
	for i, d := range data {
		if i == 0 {
			s.n = d.Len()
		}
		if d.Len() != s.n {
			return nil, &Error{Column: i + 1, Field: cols[i].Name, Reason: "series source: series of different lengths", class: quantity.ErrInvalid}
		}
		if d.Dim() != cols[i].Unit.Dim() {
			return nil, &Error{Column: i + 1, Field: cols[i].Name, Reason: "series source: series of another dimension than its column's unit", class: quantity.ErrInvalid}
		}
		s.cols[i].Missing = 0
		for _, x := range d.Values() {
			if x != x {
				s.cols[i].Missing++
			}
		}
	}
	return s, nil
}

// Columns returns the channels.
func (s *SeriesSource) Columns() []Column { return s.cols }

// Read returns the next rows (4096 if rows is not positive) as views of
// the Series held; io.EOF with 0 rows at the end.
func (s *SeriesSource) Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error) {
	if rows <= 0 {
		rows = 4096
	}
	if s.off >= s.n {
		return dst, 0, io.EOF
	}
	n := min(rows, s.n-s.off)
	if cap(dst) < len(s.data) {
		dst = make([]quantity.Series, len(s.data))
	}
	dst = dst[:len(s.data)]
	for i, d := range s.data {
		dst[i] = quantity.NewSeries(d.Values()[s.off:s.off+n], d.Dim())
	}
	s.off += n
	return dst, n, nil
}

// Rewind starts the source again from its first row.
func (s *SeriesSource) Rewind() { s.off = 0 }
