package parquetfile

import (
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strings"
	"unicode/utf8"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/format"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// UnitKey is the prefix of the key-value metadata entry that holds a
// column's unit: UnitKey + name.
const UnitKey = "similis.unit."

// MaxColumns bounds the number of columns of a file, as in chanfile.
const MaxColumns = chanfile.MaxColumns

// Error reports a problem in a Parquet file: the row (from 1; 0 when the
// schema or the footer is concerned) and the column (from 1; 0 when the
// whole file or row is concerned). It matches exactly one class of
// package quantity under errors.Is: the class of Err when Err has one (an
// unknown unit is quantity.ErrUnknown, with the *units.ParseError
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
// errors.Is, or nil if it matches none.
func classOf(err error) error {
	for _, c := range classes {
		if errors.Is(err, c) {
			return c
		}
	}
	return nil
}

// Options adjust how a file is read and written. The zero value reads
// units from the metadata or the column names and refuses gauge columns.
type Options struct {
	// Units gives the unit text of columns that have no unit metadata,
	// by column name ("V": "kn"). An entry for a column that has
	// metadata is an error, so that two statements cannot disagree.
	Units map[string]string
	// Reference, if set, is the absolute ambient pressure that gauge
	// columns (a unit "kPa(g)", "psig") are read against, as in chanfile.
	Reference quantity.Quantity
	// RowGroupRows is the number of rows per row group when writing;
	// 0 means 1<<17.
	RowGroupRows int
}

// kind is how a column's values are stored.
type kind uint8

const (
	kDouble kind = iota
	kFloat
	kInt32
	kUint32
	kInt64
	kUint64
)

// Reader reads a Parquet channel file chunk by chunk.
type Reader struct {
	name string
	file *parquet.File
	// The row groups are read one at a time, each to the rows it
	// declares, so that a column short of values in one group cannot
	// borrow the next group's and shift against the other columns.
	groups  []parquet.RowGroup
	group   int          // the row group being read
	cur     parquet.Rows // its rows, or nil before it is opened
	inGroup int64        // rows read of it
	cols    []chanfile.Column
	kinds   []kind
	mul     []float64 // SI = x·mul + add
	add     []float64
	rows    []parquet.Row // reused
	vals    [][]float64   // reused
	row     int64         // rows read so far
	done    bool
}

// guard turns a panic of the Parquet decoder on a damaged file into an
// error, so that reading a file never crashes the caller.
func guard(name string, err *error) {
	if p := recover(); p != nil {
		*err = &Error{File: name, Reason: fmt.Sprintf("not a readable Parquet file (the decoder failed: %v)", p)}
	}
}

// NewReader reads the footer and schema of the Parquet file r of size
// bytes; name is the file's name for messages.
func NewReader(r io.ReaderAt, size int64, name string, opt Options) (rd *Reader, err error) {
	defer guard(name, &err)
	if err := checkFooter(r, size); err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	f, err := parquet.OpenFile(r, size, parquet.SkipBloomFilters(true), parquet.SkipPageIndex(true), parquet.ReadBufferSize(1<<16))
	if err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	if err := checkPages(r, size, f); err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	rd = &Reader{name: name, file: f}
	fields := f.Schema().Fields()
	if len(fields) > MaxColumns {
		return nil, &Error{File: name, Reason: fmt.Sprintf("%d columns, more than %d", len(fields), MaxColumns)}
	}
	if len(fields) == 0 {
		return nil, &Error{File: name, Reason: "no columns"}
	}
	seen := map[string]bool{}
	for i, fd := range fields {
		col, k, err := column(f, fd, opt)
		if err != nil {
			e := err.(*Error)
			e.File, e.Column = name, i+1
			if e.Field == "" {
				e.Field = fd.Name()
			}
			return nil, e
		}
		seen[fd.Name()] = true
		mul, add := col.Unit.Factor(), col.Unit.Offset()
		if col.Gauge {
			ref := opt.Reference
			if ref.Dim() != quantity.Pressure || !(ref.Value() > 0) || math.IsInf(ref.Value(), 0) {
				return nil, &Error{File: name, Column: i + 1, Field: fd.Name(), Reason: "a gauge pressure column needs the absolute ambient pressure it was read against: set Options.Reference to the barometer reading (or units.StandardReference(), chosen explicitly)", Err: units.ErrGauge, class: quantity.ErrInvalid}
			}
			add += ref.Value()
			col.Unit = units.MustParse("Pa")
		}
		rd.cols = append(rd.cols, col)
		rd.kinds = append(rd.kinds, k)
		rd.mul = append(rd.mul, mul)
		rd.add = append(rd.add, add)
	}
	for n := range opt.Units {
		if !seen[n] {
			return nil, &Error{File: name, Field: n, Reason: "Options.Units names a column the file does not have", class: quantity.ErrInvalid}
		}
	}
	rd.groups = f.RowGroups()
	return rd, nil
}

// column reads the unit and storage of one top-level field.
func column(f *parquet.File, fd parquet.Field, opt Options) (chanfile.Column, kind, error) {
	name := fd.Name()
	if !fd.Leaf() {
		return chanfile.Column{}, 0, &Error{Reason: "a nested group: a channel file holds flat numeric columns"}
	}
	if fd.Repeated() {
		return chanfile.Column{}, 0, &Error{Reason: "a repeated column: a channel file holds one value per row"}
	}
	t := fd.Type()
	var k kind
	switch t.Kind() {
	case parquet.Double:
		k = kDouble
	case parquet.Float:
		k = kFloat
	case parquet.Int32:
		k = kInt32
	case parquet.Int64:
		k = kInt64
	default:
		return chanfile.Column{}, 0, &Error{Reason: fmt.Sprintf("a column of physical type %v: a channel file holds numbers (DOUBLE, FLOAT, INT32, INT64)", t.Kind())}
	}
	if lt := t.LogicalType(); lt != nil && lt.Value != nil {
		it, ok := lt.Value.(*format.IntType)
		if !ok {
			return chanfile.Column{}, 0, &Error{Reason: fmt.Sprintf("a column of logical type %v: the stored number is not the value in its unit; store it as DOUBLE", lt)}
		}
		if !it.IsSigned {
			switch k {
			case kInt32:
				k = kUint32
			case kInt64:
				k = kUint64
			}
		}
	} else if ct := t.ConvertedType(); ct != nil {
		return chanfile.Column{}, 0, &Error{Reason: fmt.Sprintf("a column of converted type %v: the stored number is not the value in its unit; store it as DOUBLE", *ct)}
	}
	meta, hasMeta := f.Lookup(UnitKey + name)
	given, hasGiven := opt.Units[name]
	var text string
	switch {
	case hasMeta && hasGiven:
		return chanfile.Column{}, 0, &Error{Reason: fmt.Sprintf("the file gives the unit %q and Options.Units gives %q: give one", meta, given), class: quantity.ErrInvalid}
	case hasMeta:
		text = meta
	case hasGiven:
		text = given
	}
	var col chanfile.Column
	var err error
	if text != "" {
		if strings.ContainsAny(text, "[]") {
			return chanfile.Column{}, 0, &Error{Reason: fmt.Sprintf("unit %q: brackets are not part of a unit", text)}
		}
		col, err = chanfile.ParseHeaderField("x [" + text + "]")
		col.Name = name
	} else if hasMeta || hasGiven {
		err = &chanfile.Error{Reason: "an empty unit: write \"1\" for a dimensionless column"}
	} else {
		col, err = chanfile.ParseHeaderField(name)
		if err != nil {
			return chanfile.Column{}, 0, &Error{Reason: fmt.Sprintf("no unit for the column: the file has no %q entry and the name carries no unit; give one in Options.Units", UnitKey+name), Err: err}
		}
	}
	if err != nil {
		return chanfile.Column{}, 0, &Error{Reason: "not a unit", Err: err}
	}
	return col, k, nil
}

// Columns returns the channels of the file; their Missing counts grow as
// chunks are read.
func (r *Reader) Columns() []chanfile.Column { return r.cols }

// NumRows returns the number of rows the file's footer declares, which
// NewReader checked against the row groups and the values of their pages.
func (r *Reader) NumRows() int64 { return r.file.NumRows() }

// batch is the most rows Read decodes at a time, whatever it is asked
// for: the memory Read takes grows with the rows it has read, never with
// the rows asked for or the rows the footer declares.
const batch = 4096

// Read reads up to rows rows (4096 if rows is not positive) into dst,
// one Series per column in SI (dst is grown to the number of columns and
// its storage reused), and returns the number of rows read. It returns
// io.EOF with 0 rows at the end of the file. A gauge column is absolute:
// its level plus Options.Reference. The Series grow by the rows read, so
// Read(dst, int(r.NumRows())) takes memory for the rows the file holds,
// whatever its footer declares.
func (r *Reader) Read(dst []quantity.Series, rows int) (out []quantity.Series, n int, err error) {
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
	defer func() {
		if p := recover(); p != nil {
			r.done = true
			for j := range r.cols {
				dst[j] = quantity.NewSeries(nil, r.cols[j].Unit.Dim())
			}
			out, n, err = dst, 0, &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("a damaged Parquet file (the decoder failed: %v)", p)}
		}
	}()
	if r.rows == nil {
		r.rows = make([]parquet.Row, batch)
	}
	for n < rows && !r.done && err == nil {
		var k int
		k, err = r.readBatch(r.rows[:min(batch, rows-n)], n)
		n += k
	}
	for j, c := range r.cols {
		dst[j] = quantity.NewSeries(r.vals[j], c.Unit.Dim())
	}
	if err != nil {
		return dst, n, err
	}
	if n == 0 && r.done {
		return dst, 0, io.EOF
	}
	return dst, n, nil
}

// readBatch reads up to len(buf) rows, appending to r.vals, which hold n
// rows of this call to Read; it returns the rows read.
func (r *Reader) readBatch(buf []parquet.Row, n int) (read int, err error) {
	vals := r.vals
	if r.cur == nil {
		if r.group >= len(r.groups) {
			r.done = true
			if r.row != r.file.NumRows() {
				return 0, &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("the file declares %d rows, its pages hold %d: a damaged file", r.file.NumRows(), r.row)}
			}
			return 0, nil
		}
		r.cur, r.inGroup = r.groups[r.group].Rows(), 0
	}
	declared := r.groups[r.group].NumRows()
	want := declared - r.inGroup // rows of the group still to read
	m, err := r.cur.ReadRows(buf[:min(int64(len(buf)), max(want, 1))])
	end := err == io.EOF || m == 0 && err == nil // the end of the row group
	if err == io.EOF {
		err = nil
	} else if err != nil {
		r.done = true
		err = &Error{File: r.name, Row: r.row + int64(m) + 1, Reason: "read failed", Err: err}
	}
	if err == nil && want == 0 && m > 0 {
		r.done = true
		err = &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("row group %d declares %d rows, its pages hold more: a damaged file", r.group+1, declared)}
	}
	for i := 0; i < m && err == nil; i++ {
		row := buf[i]
		if len(row) != len(r.cols) {
			err = &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("a row of %d values, not the schema's %d", len(row), len(r.cols))}
			break
		}
		for _, v := range row {
			c := v.Column()
			if c < 0 || c >= len(r.cols) {
				err = &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("a value of column index %d", c)}
				break
			}
			if len(vals[c]) != n+read {
				err = &Error{File: r.name, Row: r.row + 1, Column: c + 1, Field: r.cols[c].Name, Reason: "a second value in one row"}
				break
			}
			if v.IsNull() {
				vals[c] = append(vals[c], math.NaN())
				r.cols[c].Missing++
				continue
			}
			var x float64
			switch r.kinds[c] {
			case kDouble:
				x = v.Double()
			case kFloat:
				x = float64(v.Float())
			case kInt32:
				x = float64(v.Int32())
			case kUint32:
				x = float64(uint32(v.Int32()))
			case kInt64:
				i := v.Int64()
				x = float64(i)
				if i > 1<<53 || i < -(1<<53) {
					err = &Error{File: r.name, Row: r.row + 1, Column: c + 1, Field: r.cols[c].Name, Reason: fmt.Sprintf("the integer %d is not exact as a float64", i), class: quantity.ErrRange}
				}
			case kUint64:
				u := uint64(v.Int64())
				x = float64(u)
				if u > 1<<53 {
					err = &Error{File: r.name, Row: r.row + 1, Column: c + 1, Field: r.cols[c].Name, Reason: fmt.Sprintf("the integer %d is not exact as a float64", u), class: quantity.ErrRange}
				}
			}
			if err != nil {
				break
			}
			if math.IsNaN(x) {
				vals[c] = append(vals[c], math.NaN())
				r.cols[c].Missing++
				continue
			}
			if math.IsInf(x, 0) {
				err = &Error{File: r.name, Row: r.row + 1, Column: c + 1, Field: r.cols[c].Name, Reason: "an infinite value: a channel file holds finite numbers or missing ones", class: quantity.ErrRange}
				break
			}
			y := x * r.mul[c]
			si := y + r.add[c]
			if math.IsInf(si, 0) || math.IsNaN(si) || x != 0 && y == 0 {
				err = &Error{File: r.name, Row: r.row + 1, Column: c + 1, Field: r.cols[c].Name, Reason: fmt.Sprintf("%v %s is beyond the range of float64 in SI units", x, r.cols[c].Text), class: quantity.ErrRange}
				break
			}
			vals[c] = append(vals[c], si)
		}
		if err != nil {
			r.done = true
			break
		}
		for j := range vals {
			if len(vals[j]) != n+read+1 {
				err = &Error{File: r.name, Row: r.row + 1, Column: j + 1, Field: r.cols[j].Name, Reason: "a row without a value of this column"}
				r.done = true
				break
			}
		}
		if err != nil {
			break
		}
		read++
		r.row++
	}
	if err == nil {
		r.inGroup += int64(read)
		switch {
		case end && r.inGroup < declared:
			err = &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("row group %d declares %d rows, its pages hold %d: a damaged file", r.group+1, declared, r.inGroup)}
		case end:
			err = r.cur.Close()
			r.cur = nil
			r.group++
			if err != nil {
				err = &Error{File: r.name, Row: r.row + 1, Reason: "read failed", Err: err}
			}
		}
		if err != nil {
			r.done = true
		}
	}
	if err != nil {
		// The row in error is not part of the chunk.
		for j := range vals {
			vals[j] = vals[j][:min(len(vals[j]), n+read)]
		}
	}
	return read, err
}

// Close releases the reader's buffers.
func (r *Reader) Close() error {
	if r.cur == nil {
		return nil
	}
	err := r.cur.Close()
	r.cur = nil
	return err
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
// that is valid UTF-8 (a name Reader reads back), a unit, and not be a
// gauge column.
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
		u := c.Unit.String()
		if c.Unit.Equal(units.One()) {
			u = "1"
		}
		if back, err := chanfile.ParseHeaderField("x [" + u + "]"); err != nil || !back.Unit.Equal(c.Unit) {
			return nil, &Error{File: name, Column: i + 1, Field: c.Name, Reason: fmt.Sprintf("the unit %q would not read back", u), class: quantity.ErrInvalid}
		}
		g[c.Name] = parquet.Optional(parquet.Leaf(parquet.DoubleType))
		rank[c.Name] = i
		opts = append(opts, parquet.KeyValueMetadata(UnitKey+c.Name, u))
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
