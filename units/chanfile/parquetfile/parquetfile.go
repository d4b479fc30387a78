package parquetfile

import (
	"fmt"
	"io"
	"maps"
	"math"
	"slices"
	"strings"
	"unicode"
	"unicode/utf8"

	"github.com/parquet-go/parquet-go"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/internal/filebase"
)

// UnitKey is the prefix of the key-value metadata entry that holds a
// column's unit: UnitKey + name.
const UnitKey = "similis.unit."

// MaxColumns bounds the number of columns of a file, as in chanfile.
const MaxColumns = chanfile.MaxColumns

// Error reports a problem in a Parquet file: the row (from 1; 0 when the
// schema or the footer is concerned) and the column (from 1, its place
// among the file's top-level columns, whichever are read; 0 when the
// whole file or row is concerned). It matches exactly one class of
// package quantity under errors.Is: the class of Err when Err has one (an
// unknown unit is quantity.ErrUnknown, with the *units.Error
// reachable by errors.As); otherwise quantity.ErrRange for a number
// outside float64 (an infinite value, an overflow or underflow in SI, an
// integer not exact as a float64), quantity.ErrInvalid for a bad argument
// or a failed write of the destination, and quantity.ErrParse for a file
// that is not valid or not readable Parquet.
type Error struct {
	File   string
	Row    int64
	Column int
	Field  string // the column's name, if any
	Reason string
	Err    error // an underlying error, or nil
	class  error // the class when Err has none; nil means quantity.ErrParse
}

// Error implements the error interface: "run.parquet: row 14, column 3 "V": …".
func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("parquetfile: ")
	if e.File != "" {
		sb.WriteString(e.File)
		sb.WriteString(": ")
	}
	if e.Row > 0 {
		fmt.Fprintf(&sb, "row %d: ", e.Row)
	}
	if e.Column > 0 {
		fmt.Fprintf(&sb, "column %d ", e.Column)
	}
	if e.Field != "" {
		fmt.Fprintf(&sb, "%q", e.Field)
	}
	if e.Column > 0 || e.Field != "" {
		sb.WriteString(": ")
	}
	return filebase.Finish(&sb, e.Reason, e.Err)
}

// Unwrap returns the underlying error.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is the error's class (see Error), when Err
// has no class of its own; otherwise errors.Is finds the class on Err.
func (e *Error) Is(target error) bool { return filebase.Is(e.Err, e.class, target) }

// Options adjust how a file is read and written. The zero value reads
// units from the metadata or the column names and refuses gauge columns.
type Options struct {
	// Units gives the unit text of columns that have no unit metadata,
	// by column name ("V": "kn"). An entry for a column that has
	// metadata is an error, so that two statements cannot disagree, and
	// so is an entry for a column the file does not have; an entry for a
	// column of the file that Columns leaves out is not used.
	Units map[string]string
	// Reference, if set, is the absolute ambient pressure that gauge
	// columns (a unit "kPa(g)", "psig") are read against, as in chanfile.
	Reference quantity.Quantity
	// RowGroupRows is the number of rows per row group when writing;
	// 0 means 1<<17.
	RowGroupRows int
	// Columns names the columns to read, in the order Read returns
	// them; nil reads every column in the file's order. An empty list,
	// a name twice or a name the file lacks is an error
	// (quantity.ErrInvalid). A column not named is never decoded, nor
	// are its pages checked: its type, its compression and its values
	// cannot fail the file.
	Columns []string
	// Metadata, when writing, is further key-value metadata of the file,
	// written beside the unit entries (a test's group definitions, the
	// facility's run number); Reader.Metadata reads it back. A key must
	// be valid UTF-8, not empty, and not start with UnitKey, whose
	// entries are the columns' units; a value must be valid UTF-8. It is
	// not used when reading.
	Metadata map[string]string
}

// funcOf reports whether a column name is written as a function of a
// channel, u(F) or n_eff(V): a word and a parenthesis right after it,
// with no blank. Such a name carries no unit even when its parentheses
// hold one's symbol (F for farad, V for volt); the unit of the column
// is the metadata's. "P (kPa)" or "P(kPa" are not such names.
func funcOf(name string) bool {
	i := strings.IndexByte(name, '(')
	if i <= 0 || !strings.HasSuffix(name, ")") || strings.ContainsAny(name, " \t[]") {
		return false
	}
	for k, r := range name[:i] {
		if !(r == '_' || unicode.IsLetter(r) || k > 0 && unicode.IsDigit(r)) {
			return false
		}
	}
	return true
}

// orderedGroup is a schema group whose columns keep the order given,
// where a plain group sorts them by name.
type orderedGroup struct {
	parquet.Group
	rank map[string]int // a column's place in the order given
}

// Fields returns the group's fields in the order given.
func (g orderedGroup) Fields() []parquet.Field {
	f := g.Group.Fields()
	slices.SortFunc(f, func(a, b parquet.Field) int { return g.rank[a.Name()] - g.rank[b.Name()] })
	return f
}

// Writer writes Series as a Parquet channel file.
type Writer struct {
	pw   *parquet.GenericWriter[any]
	name string
	cols []chanfile.Column
	rows []parquet.Row // reused
	row  int64
}

// NewWriter starts a Parquet file on w with one optional DOUBLE column
// per entry of cols, in that order, each holding values in the column's
// Unit; name is the file's name for messages. A column must have a name
// that is valid UTF-8 (a name Reader reads back), a unit, and be neither
// a gauge column nor one with a Fault (a column a reader could not
// read); a name that carries a unit ("V [kn]") must carry the column's
// unit, which Reader checks against the metadata.
func NewWriter(w io.Writer, name string, cols []chanfile.Column, opt Options) (*Writer, error) {
	if len(cols) == 0 {
		return nil, &Error{File: name, Reason: "no columns", class: quantity.ErrInvalid}
	}
	if len(cols) > MaxColumns {
		return nil, &Error{File: name, Reason: fmt.Sprintf("%d columns, more than %d", len(cols), MaxColumns), class: quantity.ErrInvalid}
	}
	g := parquet.Group{}
	rank := make(map[string]int, len(cols))
	opts := []parquet.WriterOption{parquet.Compression(&parquet.Zstd)}
	for i, c := range cols {
		if c.Name == "" {
			return nil, &Error{File: name, Column: i + 1, Reason: "a column without a name", class: quantity.ErrInvalid}
		}
		if !utf8.ValidString(c.Name) {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: "a column name that is not valid UTF-8", class: quantity.ErrInvalid}
		}
		if _, dup := g[c.Name]; dup {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: "a second column of this name", class: quantity.ErrInvalid}
		}
		if c.Gauge {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: "a gauge column: the reader made it absolute; write it with Gauge false and its pressure unit", class: quantity.ErrInvalid}
		}
		if c.Fault != nil {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: "a column a reader could not read (its Fault is set): its unit is not known", class: quantity.ErrInvalid}
		}
		u := c.Unit.String()
		if c.Unit.Equal(units.One()) {
			u = "1"
		}
		if back, err := chanfile.ParseHeaderField("x [" + u + "]"); err != nil || !back.Unit.Equal(c.Unit) {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: fmt.Sprintf("the unit %q would not read back", u), class: quantity.ErrInvalid}
		}
		if inName, err := chanfile.ParseHeaderField(c.Name); err == nil && !funcOf(c.Name) && (!inName.Unit.Equal(c.Unit) || inName.Gauge) {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: fmt.Sprintf("the name carries the unit %q and the column's unit is %q: the reader would refuse the disagreement", inName.Text, u), class: quantity.ErrInvalid}
		}
		g[c.Name] = parquet.Optional(parquet.Leaf(parquet.DoubleType))
		rank[c.Name] = i
		opts = append(opts, parquet.KeyValueMetadata(UnitKey+c.Name, u))
	}
	keys := slices.Sorted(maps.Keys(opt.Metadata)) // one file for one input
	for _, k := range keys {
		v := opt.Metadata[k]
		switch {
		case k == "" || !utf8.ValidString(k):
			return nil, &Error{File: name, Field: k, Reason: "a metadata key that is empty or not valid UTF-8", class: quantity.ErrInvalid}
		case strings.HasPrefix(k, UnitKey):
			return nil, &Error{File: name, Field: k, Reason: "a metadata key starting with " + UnitKey + ", the prefix of the columns' units", class: quantity.ErrInvalid}
		case !utf8.ValidString(v):
			return nil, &Error{File: name, Field: k, Reason: "a metadata value that is not valid UTF-8", class: quantity.ErrInvalid}
		}
		opts = append(opts, parquet.KeyValueMetadata(k, v))
	}
	n := opt.RowGroupRows
	if n <= 0 {
		n = 1 << 17
	}
	opts = append(opts, parquet.MaxRowsPerRowGroup(int64(n)), parquet.CreatedBy("similis", "", ""))
	schema := parquet.NewSchema("channels", orderedGroup{Group: g, rank: rank})
	opts = append(opts, schema)
	cfg, err := parquet.NewWriterConfig(opts...)
	if err != nil {
		return nil, &Error{File: name, Reason: "writer configuration", Err: err, class: quantity.ErrInvalid}
	}
	return &Writer{pw: parquet.NewGenericWriter[any](w, cfg), name: name, cols: cols}, nil
}

// Write writes the rows of s, one Series per column in the column's
// order, converted from SI to each column's unit. The Series must have the
// columns' dimensions and one length. A NaN is written as a null. A value
// that is infinite, or whose conversion to the column's unit overflows
// float64 or underflows to 0, is refused with its row and column, and
// nothing of s is written.
func (w *Writer) Write(s []quantity.Series) error {
	if len(s) != len(w.cols) {
		return &Error{File: w.name, Reason: fmt.Sprintf("%d series for %d columns", len(s), len(w.cols)), class: quantity.ErrInvalid}
	}
	n := 0
	for j, c := range w.cols {
		if s[j].Dim() != c.Unit.Dim() {
			return &Error{File: w.name, Column: j + 1, Field: c.Name, Reason: fmt.Sprintf("series of %s for a column in %v", quantity.Describe(s[j].Dim()), c.Unit), Err: quantity.ErrDimension}
		}
		if j == 0 {
			n = s[j].Len()
		} else if s[j].Len() != n {
			return &Error{File: w.name, Column: j + 1, Field: c.Name, Reason: fmt.Sprintf("series of %d values, column 1 has %d", s[j].Len(), n), class: quantity.ErrInvalid}
		}
	}
	for j, c := range w.cols {
		for i, v := range s[j].Values() {
			if math.IsNaN(v) {
				continue
			}
			if !readsBack(v, c.Unit) {
				reason := "an infinite value: a file holds finite numbers or missing ones"
				if !math.IsInf(v, 0) {
					reason = fmt.Sprintf("%v in SI is beyond the range of float64 in %v", v, c.Unit)
				}
				return &Error{File: w.name, Row: w.row + int64(i) + 1, Column: j + 1, Field: c.Name, Reason: reason, class: quantity.ErrRange}
			}
		}
	}
	const chunk = 1024
	if w.rows == nil {
		w.rows = make([]parquet.Row, chunk)
	}
	for start := 0; start < n; start += chunk {
		m := min(chunk, n-start)
		for i := 0; i < m; i++ {
			row := w.rows[i][:0]
			for j, c := range w.cols {
				x := s[j].Values()[start+i]
				if math.IsNaN(x) {
					row = append(row, parquet.NullValue().Level(0, 0, j))
					continue
				}
				v := (x - c.Unit.Offset()) / c.Unit.Factor()
				row = append(row, parquet.DoubleValue(v).Level(0, 1, j))
			}
			w.rows[i] = row
		}
		if _, err := w.pw.WriteRows(w.rows[:m]); err != nil {
			return &Error{File: w.name, Row: w.row + 1, Reason: "write failed", Err: err, class: quantity.ErrInvalid}
		}
		w.row += int64(m)
	}
	return nil
}

// readsBack reports whether the SI value v, written in unit u, is a
// finite number there that Reader reads back to a finite SI value,
// neither of them an underflow to 0 of a nonzero number.
func readsBack(v float64, u units.Unit) bool {
	x := (v - u.Offset()) / u.Factor()
	if math.IsInf(x, 0) || math.IsNaN(x) || x == 0 && v != u.Offset() {
		return false
	}
	y := x * u.Factor()
	back := y + u.Offset()
	return !math.IsInf(back, 0) && !math.IsNaN(back) && (x == 0 || y != 0)
}

// Close writes the last row group and the footer. The file is not valid
// until Close returns nil.
func (w *Writer) Close() error {
	if err := w.pw.Close(); err != nil {
		return &Error{File: w.name, Reason: "closing the file", Err: err, class: quantity.ErrInvalid}
	}
	return nil
}
