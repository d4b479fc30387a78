package parquetfile

import (
	"fmt"
	"io"
	"math"
	"math/big"
	"strconv"
	"strings"
	"time"
	"unicode/utf8"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/deprecated"
	"github.com/parquet-go/parquet-go/format"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/internal/filebase"
)

// Kind is what a column read holds.
type Kind uint8

const (
	// Number is a column of values in its unit (DOUBLE, FLOAT, an
	// integer or a DECIMAL), read in SI, or a BOOLEAN, read as 1 for
	// true and 0 for false (unit one).
	Number Kind = iota
	// Time is a column of instants (a TIMESTAMP, a DATE or a legacy
	// INT96 timestamp), read as seconds from the column's first sample;
	// Reader.Origin gives the instant of that sample.
	Time
	// Label is a column of text (STRING, UTF8 or ENUM), read by
	// Reader.Labels; its Series from Read is empty.
	Label
	// TimeOfDay is a column of clock times (a TIME), read as seconds
	// since midnight (unit s), not from the first sample; it has no
	// Origin, since a TIME has no date.
	TimeOfDay
)

// String returns "number", "time", "label" or "time of day".
func (k Kind) String() string {
	switch k {
	case Number:
		return "number"
	case Time:
		return "time"
	case Label:
		return "label"
	case TimeOfDay:
		return "time of day"
	}
	return "Kind(" + strconv.Itoa(int(k)) + ")"
}

// Origin is the instant of the first sample of a time column.
type Origin struct {
	// Time is the instant, in UTC.
	Time time.Time
	// UTC reports that the file stores instants (a TIMESTAMP adjusted to
	// UTC). When false, the file stores a wall-clock reading or a
	// calendar date of no stated zone, held in Time as if it were UTC:
	// the zone is the caller's to know.
	UTC bool
}

// store is how a column's values are stored.
type store uint8

const (
	kDouble store = iota
	kFloat
	kInt32
	kUint32
	kInt64
	kUint64
	kDecimal // an unscaled integer (INT32, INT64 or big-endian bytes) × 10^−scale
	kTime    // an integer count of ticks from 1970-01-01T00:00:00
	kLabel
	kBool  // a BOOLEAN, read as 1 or 0
	kClock // a TIME: an integer count of ticks from midnight
	kInt96 // a legacy INT96 timestamp: nanoseconds of the day and a Julian day
)

// rcol is the reading state of one column.
type rcol struct {
	leaf     int // the column chunk's index in a row group
	at       int // the column's place among the file's top-level columns, from 1
	store    store
	mul, add float64 // SI = x·mul + add
	scale    int32   // of a decimal
	tick     int64   // of a time or clock column: ticks per second; 0 for days
	utc      bool
	typ      string // of a clock column: its type as the file names it
	started  bool   // the first sample of a time column is read
	first    int64  // its ticks (an INT96: its nanoseconds of the day)
	firstDay int64  // an INT96: the Julian day of the first sample
	origin   Origin
	bad      *Error // a column the reader cannot read, left for Select

	pages  parquet.Pages // of the current row group, or nil
	vr     parquet.ValueReader
	buf    []parquet.Value
	labels []string
}

// Reader reads a Parquet channel file chunk by chunk.
type Reader struct {
	name string
	file *parquet.File
	// The row groups are read one at a time, each column to the rows
	// the group declares, so that a column short of values in one group
	// cannot borrow the next group's and shift against the others.
	groups  []parquet.RowGroup
	group   int   // the row group being read
	open    bool  // its pages are open
	inGroup int64 // rows read of it
	cols    []chanfile.Column
	rc      []rcol
	vals    [][]float64 // reused
	scratch []byte
	row     int64 // rows read so far
	done    bool
	active  []int // the columns Read fills: all, or those of Select
	meta    map[string]string
}

// guard turns a panic of the Parquet decoder on a damaged file into an
// error, so that reading a file never crashes the caller.
func guard(name string, err *error) {
	if p := recover(); p != nil {
		*err = &Error{File: name, Reason: fmt.Sprintf("not a readable Parquet file (the decoder failed: %v)", p)}
	}
}

// field is a top-level field of a file's schema.
type field struct {
	el    *format.SchemaElement
	leaf  int  // the index of its first column chunk
	leaf1 bool // a single leaf, not a group
}

// topFields lists the top-level fields of a schema and the number of
// leaves (column chunks per row group).
func topFields(schema []format.SchemaElement) ([]field, int, error) {
	if len(schema) == 0 {
		return nil, 0, fmt.Errorf("an empty schema")
	}
	n := int(schema[0].NumChildren.V)
	if n < 0 || n > len(schema)-1 {
		return nil, 0, fmt.Errorf("a schema root of %d children in %d elements", n, len(schema))
	}
	var out []field
	pos, leaves := 1, 0
	for range n {
		f := field{el: &schema[pos], leaf: leaves}
		for need := 1; need > 0; need-- {
			if pos >= len(schema) {
				return nil, 0, fmt.Errorf("a schema shorter than its groups declare")
			}
			e := &schema[pos]
			pos++
			if k := e.NumChildren.V; e.NumChildren.Valid && (k > 0 || !e.Type.Valid) {
				if k < 0 || int(k) > len(schema) {
					return nil, 0, fmt.Errorf("a schema group of %d children", k)
				}
				need += int(k)
				continue
			}
			leaves++
		}
		f.leaf1 = leaves == f.leaf+1 && !(f.el.NumChildren.Valid && (f.el.NumChildren.V > 0 || !f.el.Type.Valid))
		out = append(out, f)
	}
	if pos != len(schema) {
		return nil, 0, fmt.Errorf("%d schema elements after the root's children", len(schema)-pos)
	}
	return out, leaves, nil
}

// NewReader reads the footer and schema of the Parquet file r of size
// bytes; name is the file's name for messages. It reads the columns
// Options.Columns names, or every column; only these are checked and
// decoded.
func NewReader(r io.ReaderAt, size int64, name string, opt Options) (rd *Reader, err error) {
	defer guard(name, &err)
	if err := checkFooter(r, size); err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	f, err := parquet.OpenFile(r, size, parquet.SkipBloomFilters(true), parquet.SkipPageIndex(true), parquet.ReadBufferSize(1<<16))
	if err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	fields, leaves, err := topFields(f.Metadata().Schema)
	if err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	if len(fields) == 0 {
		return nil, &Error{File: name, Reason: "no columns"}
	}
	// The fields to read, in the order asked.
	var pick []int
	if opt.Columns == nil {
		for i := range fields {
			pick = append(pick, i)
		}
	} else {
		asked := map[string]bool{}
		for _, n := range opt.Columns {
			if asked[n] {
				return nil, &Error{File: name, Field: n, Reason: "Options.Columns names this column twice", class: quantity.ErrInvalid}
			}
			asked[n] = true
			at := -1
			for i, fd := range fields {
				if fd.el.Name != n {
					continue
				}
				if at >= 0 {
					return nil, &Error{File: name, Column: i + 1, Field: n, Reason: "a second column of this name in the file"}
				}
				at = i
			}
			if at < 0 {
				return nil, &Error{File: name, Field: n, Reason: "Options.Columns names a column the file does not have", class: quantity.ErrInvalid}
			}
			pick = append(pick, at)
		}
		if len(pick) == 0 {
			return nil, &Error{File: name, Reason: "Options.Columns names no column", class: quantity.ErrInvalid}
		}
	}
	if len(pick) > MaxColumns {
		return nil, &Error{File: name, Reason: fmt.Sprintf("%d columns, more than %d", len(pick), MaxColumns)}
	}
	use, optional, boolean := make([]bool, leaves), make([]bool, leaves), make([]bool, leaves)
	rd = &Reader{name: name, file: f}
	for _, i := range pick {
		fd := fields[i]
		col, c, err := column(f, fd, opt)
		if err != nil {
			e := err.(*Error)
			e.File, e.Column = name, i+1
			if e.Field == "" {
				e.Field = fd.el.Name
			}
			if opt.Columns != nil {
				return nil, e
			}
			// Every column asked for: one the reader cannot read is
			// listed with its fault, returned by the first Read unless
			// Select leaves it out; it is never decoded.
			rd.cols = append(rd.cols, chanfile.Column{Name: fd.el.Name, Index: i + 1, Header: fd.el.Name, Fault: e})
			rd.rc = append(rd.rc, rcol{at: i + 1, store: kLabel, bad: e})
			continue
		}
		c.at = i + 1
		col.Index, col.Header = i+1, fd.el.Name
		switch c.store {
		case kTime, kLabel, kClock, kInt96, kBool:
			c.mul = 1
		default:
			c.mul, c.add = col.Unit.Factor(), col.Unit.Offset()
		}
		if col.Gauge {
			ref := opt.Reference
			if ref.Dim() != quantity.Pressure || !(ref.Value() > 0) || math.IsInf(ref.Value(), 0) {
				e := &Error{File: name, Column: i + 1, Field: fd.el.Name, Reason: "a gauge pressure column needs the absolute ambient pressure it was read against: set Options.Reference to the barometer reading (or units.StandardReference(), chosen explicitly)", Err: units.ErrGauge, class: quantity.ErrInvalid}
				if opt.Columns != nil {
					return nil, e
				}
				rd.cols = append(rd.cols, chanfile.Column{Name: col.Name, Index: i + 1, Header: fd.el.Name, Text: col.Text, Fault: e})
				rd.rc = append(rd.rc, rcol{at: i + 1, store: kLabel, bad: e})
				continue
			}
			c.add += ref.Value()
			col.Unit = units.MustParse("Pa")
		}
		use[c.leaf] = true
		optional[c.leaf] = fd.el.RepetitionType.Valid && fd.el.RepetitionType.V == format.Optional
		boolean[c.leaf] = c.store == kBool
		col.Kind = chanfileKind(c.store)
		rd.cols = append(rd.cols, col)
		rd.rc = append(rd.rc, c)
	}
	for n := range opt.Units {
		found := false
		for _, fd := range fields {
			found = found || fd.el.Name == n
		}
		if !found {
			return nil, &Error{File: name, Field: n, Reason: "Options.Units names a column the file does not have", class: quantity.ErrInvalid}
		}
	}
	bad, first, err := checkPages(r, size, f, use, optional, boolean)
	if err != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: err}
	}
	if first != nil && opt.Columns != nil {
		return nil, &Error{File: name, Reason: "not a readable Parquet file", Err: first}
	}
	// Every column asked for: one whose pages fail the check is listed
	// with its fault, as a column of a type not read is.
	for j := range rd.rc {
		c := &rd.rc[j]
		if c.bad != nil || bad[c.leaf] == nil {
			continue
		}
		c.bad = &Error{File: name, Column: c.at, Field: rd.cols[j].Header, Reason: "not a readable Parquet column", Err: bad[c.leaf]}
		rd.cols[j] = chanfile.Column{Name: rd.cols[j].Name, Index: c.at, Header: rd.cols[j].Header, Text: rd.cols[j].Text, Fault: c.bad}
	}
	rd.groups = f.RowGroups()
	rd.active = make([]int, len(rd.rc))
	for j := range rd.active {
		rd.active[j] = j
	}
	for _, kv := range f.Metadata().KeyValueMetadata {
		if !strings.HasPrefix(kv.Key, UnitKey) {
			if rd.meta == nil {
				rd.meta = map[string]string{}
			}
			rd.meta[kv.Key] = kv.Value
		}
	}
	return rd, nil
}

// column reads the kind, storage and unit of one top-level field.
func column(f *parquet.File, fd field, opt Options) (chanfile.Column, rcol, error) {
	el := fd.el
	name := el.Name
	c := rcol{leaf: fd.leaf}
	if !fd.leaf1 {
		return chanfile.Column{}, c, &Error{Reason: "a nested group: a channel file holds flat columns"}
	}
	if el.RepetitionType.Valid && el.RepetitionType.V == format.Repeated {
		return chanfile.Column{}, c, &Error{Reason: "a repeated column: a channel file holds one value per row"}
	}
	if !el.Type.Valid {
		return chanfile.Column{}, c, &Error{Reason: "a column of no physical type"}
	}
	if err := classify(el, &c); err != nil {
		return chanfile.Column{}, c, err
	}
	meta, hasMeta := f.Lookup(UnitKey + name)
	given, hasGiven := opt.Units[name]
	if c.store == kTime || c.store == kLabel || c.store == kClock || c.store == kInt96 || c.store == kBool {
		what := "an instant, read in s from the column's first sample"
		col := chanfile.Column{Name: name, Unit: units.MustParse("s"), Text: "s"}
		switch c.store {
		case kLabel:
			what = "text"
			col = chanfile.Column{Name: name, Unit: units.One()}
		case kInt96:
			col.Readings = []units.Reading{{From: "INT96", To: "time in s from the first sample", Note: "a legacy timestamp: nanoseconds of the day and a Julian day (2440588 is 1970-01-01); the file states no time zone"}}
		case kClock:
			what = "a time of day, read in s since midnight"
			zone := "of no stated zone"
			if c.utc {
				zone = "in UTC"
			}
			col.Readings = []units.Reading{{From: c.typ, To: "time of day in s since midnight", Note: "a clock time " + zone + ", with no date"}}
		case kBool:
			what = "true or false, read as 1 or 0"
			col = chanfile.Column{Name: name, Unit: units.One(), Text: "1", Readings: []units.Reading{{From: "BOOLEAN", To: "1 for true, 0 for false", Note: "a dimensionless state channel: its mean over a window is the fraction of the window it was true"}}}
			// A name may carry the unit one ("valve [1]"); another unit
			// in brackets or parentheses contradicts the column's type.
			// A name such as "valve A" is a name, not a unit.
			if inName, err := chanfile.ParseHeaderField(name); err == nil && !funcOf(name) {
				switch {
				case inName.Unit.Equal(units.One()) && !inName.Gauge:
					col.Name = inName.Name
				case strings.HasSuffix(name, "]") || strings.HasSuffix(name, ")"):
					return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("the column's name gives the unit %q to a BOOLEAN column, read as 1 or 0 (unit one)", inName.Text)}
				}
			}
			// The unit one, stated once, agrees.
			switch {
			case hasMeta && hasGiven:
				return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("the file gives the unit %q and Options.Units gives %q: give one", meta, given), class: quantity.ErrInvalid}
			case hasMeta && (meta == "1" || meta == "-"), hasGiven && (given == "1" || given == "-"):
				hasMeta, hasGiven = false, false
			}
		}
		switch {
		case hasMeta:
			return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("the file gives the unit %q to a column of %s: a unit there is not read", meta, what)}
		case hasGiven:
			return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("Options.Units gives the unit %q to a column of %s: a unit there is not read", given, what), class: quantity.ErrInvalid}
		}
		return col, c, nil
	}
	var text, from string
	switch {
	case hasMeta && hasGiven:
		return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("the file gives the unit %q and Options.Units gives %q: give one", meta, given), class: quantity.ErrInvalid}
	case hasMeta:
		text, from = meta, "the file's metadata ("+UnitKey+name+")"
	case hasGiven:
		text, from = given, "Options.Units"
	}
	var col chanfile.Column
	var err error
	if text != "" {
		if strings.ContainsAny(text, "[]") {
			return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("unit %q: brackets are not part of a unit", text)}
		}
		col, err = chanfile.ParseHeaderField("x [" + text + "]")
		col.Name = name
		if err == nil {
			// A unit in the name too must be the same unit.
			if inName, nerr := chanfile.ParseHeaderField(name); nerr == nil && !(hasMeta && funcOf(name)) && (!inName.Unit.Equal(col.Unit) || inName.Gauge != col.Gauge) {
				class := error(quantity.ErrParse)
				if hasGiven {
					class = quantity.ErrInvalid
				}
				return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("%s gives the unit %q, the column's name gives %q: they disagree", from, text, inName.Text), class: class}
			}
		}
	} else if hasMeta || hasGiven {
		err = &chanfile.Error{Reason: "an empty unit: write \"1\" for a dimensionless column"}
	} else {
		col, err = chanfile.ParseHeaderField(name)
		if err != nil {
			return chanfile.Column{}, c, &Error{Reason: fmt.Sprintf("no unit for the column: the file has no %q entry and the name carries no unit; give one in Options.Units", UnitKey+name), Err: err}
		}
	}
	if err != nil {
		return chanfile.Column{}, c, &Error{Reason: "not a unit", Err: err}
	}
	return col, c, nil
}

// classify sets the storage of a column from its physical, logical and
// converted types, or refuses it.
func classify(el *format.SchemaElement, c *rcol) error {
	phys := el.Type.V
	bad := func(what string) error {
		return &Error{Reason: fmt.Sprintf("a column of %s stored as %v: not read (numbers, decimals, booleans, timestamps, dates, times of day and strings are)", what, phys)}
	}
	decimal := func(scale, precision int32) error {
		switch phys {
		case format.Int32, format.Int64, format.ByteArray:
		case format.FixedLenByteArray:
			if n := el.TypeLength.V; n < 1 || n > 16 {
				return &Error{Reason: fmt.Sprintf("a DECIMAL of %d bytes: at most 16 (38 digits) are read", n)}
			}
		default:
			return bad(fmt.Sprintf("DECIMAL(%d,%d)", precision, scale))
		}
		if scale < 0 || precision < 1 || scale > precision || precision > 38 {
			return &Error{Reason: fmt.Sprintf("a DECIMAL(%d,%d): the scale must lie from 0 to the precision, at most 38", precision, scale)}
		}
		c.store, c.scale = kDecimal, scale
		return nil
	}
	timestamp := func(tick int64, utc bool, what string) error {
		if phys != format.Int64 {
			return bad(what)
		}
		c.store, c.tick, c.utc = kTime, tick, utc
		return nil
	}
	clock := func(tick int64, utc bool, what string) error {
		c.store, c.tick, c.utc, c.typ = kClock, tick, utc, what
		return nil
	}
	label := func(what string) error {
		if phys != format.ByteArray {
			return bad(what)
		}
		c.store = kLabel
		return nil
	}
	integer := func(signed bool, what string) error {
		switch phys {
		case format.Int32:
			c.store = kInt32
			if !signed {
				c.store = kUint32
			}
		case format.Int64:
			c.store = kInt64
			if !signed {
				c.store = kUint64
			}
		default:
			return bad(what)
		}
		return nil
	}
	switch lt := el.LogicalType.Value.(type) {
	case nil:
	case *format.IntType:
		return integer(lt.IsSigned, lt.String())
	case *format.DecimalType:
		return decimal(lt.Scale, lt.Precision)
	case *format.TimestampType:
		var tick int64
		switch lt.Unit.Value.(type) {
		case *format.MilliSeconds:
			tick = 1e3
		case *format.MicroSeconds:
			tick = 1e6
		case *format.NanoSeconds:
			tick = 1e9
		default:
			return bad(lt.String())
		}
		return timestamp(tick, lt.IsAdjustedToUTC, lt.String())
	case *format.DateType:
		if phys != format.Int32 {
			return bad("DATE")
		}
		c.store = kTime
		return nil
	case *format.TimeType:
		// MILLIS in an INT32, MICROS and NANOS in an INT64.
		var tick int64
		stored := format.Int64
		switch lt.Unit.Value.(type) {
		case *format.MilliSeconds:
			tick, stored = 1e3, format.Int32
		case *format.MicroSeconds:
			tick = 1e6
		case *format.NanoSeconds:
			tick = 1e9
		}
		if tick == 0 || phys != stored {
			return bad(lt.String())
		}
		return clock(tick, lt.IsAdjustedToUTC, lt.String())
	case *format.StringType, *format.EnumType:
		return label(el.LogicalType.String())
	default:
		return bad("logical type " + el.LogicalType.String())
	}
	if el.ConvertedType.Valid {
		switch ct := el.ConvertedType.V; ct {
		case deprecated.UTF8, deprecated.Enum:
			return label(convertedName(ct))
		case deprecated.Decimal:
			return decimal(el.Scale.V, el.Precision.V)
		case deprecated.Date:
			if phys != format.Int32 {
				return bad("DATE")
			}
			c.store = kTime
			return nil
		case deprecated.TimestampMillis:
			return timestamp(1e3, true, "TIMESTAMP_MILLIS")
		case deprecated.TimestampMicros:
			return timestamp(1e6, true, "TIMESTAMP_MICROS")
		case deprecated.TimeMillis, deprecated.TimeMicros:
			// As TIME(MILLIS) in an INT32 and TIME(MICROS) in an INT64,
			// adjusted to UTC (the format's reading of these older types).
			tick, stored := int64(1e3), format.Int32
			if ct == deprecated.TimeMicros {
				tick, stored = 1e6, format.Int64
			}
			if phys != stored {
				return bad(convertedName(ct))
			}
			return clock(tick, true, convertedName(ct))
		case deprecated.Int8, deprecated.Int16, deprecated.Int32, deprecated.Int64:
			return integer(true, convertedName(ct))
		case deprecated.Uint8, deprecated.Uint16, deprecated.Uint32, deprecated.Uint64:
			return integer(false, convertedName(ct))
		default:
			return bad("converted type " + convertedName(ct))
		}
	}
	switch phys {
	case format.Double:
		c.store = kDouble
	case format.Float:
		c.store = kFloat
	case format.Int32:
		c.store = kInt32
	case format.Int64:
		c.store = kInt64
	case format.Boolean:
		c.store = kBool
	case format.Int96:
		c.store = kInt96 // the legacy timestamp: no other INT96 is written
	default:
		return &Error{Reason: fmt.Sprintf("a column of physical type %v with no logical type: a channel file holds numbers (DOUBLE, FLOAT, INT32, INT64, DECIMAL, BOOLEAN), instants (TIMESTAMP, DATE, INT96), times of day (TIME) or text (STRING)", phys)}
	}
	return nil
}

// convertedNames are the names of the converted types of the Parquet
// format (its parquet.thrift), by number.
var convertedNames = [...]string{"UTF8", "MAP", "MAP_KEY_VALUE", "LIST", "ENUM", "DECIMAL", "DATE", "TIME_MILLIS", "TIME_MICROS", "TIMESTAMP_MILLIS", "TIMESTAMP_MICROS", "UINT_8", "UINT_16", "UINT_32", "UINT_64", "INT_8", "INT_16", "INT_32", "INT_64", "JSON", "BSON", "INTERVAL"}

// convertedName names a converted type.
func convertedName(ct deprecated.ConvertedType) string {
	if ct >= 0 && int(ct) < len(convertedNames) {
		return convertedNames[ct]
	}
	return fmt.Sprintf("converted type %d", int(ct))
}

// Columns returns the channels read, in the order Read returns them;
// their Missing counts grow as chunks are read. A time column is in s; a
// label column is dimensionless and holds no numbers. Without
// Options.Columns a column the reader cannot read (a type it does not
// read, no unit, a gauge column with no reference) is listed too, with
// its error in Column.Fault, which the first Read returns unless Select
// leaves the column out; selecting it returns that error.
func (r *Reader) Columns() []chanfile.Column { return r.cols }

// Select makes Read fill only the columns at idx (from 0, in the order
// of Columns): the others are never decoded, so their type and values
// cannot fail the file, and their Series and Labels stay empty. Columns
// still lists every column. It must be called before the first Read; an
// index out of range or given twice, or a call after reading began, is
// an *Error of class quantity.ErrInvalid, and a column the reader
// cannot read returns its Column.Fault; the selection is then
// unchanged. The pages of every readable column were checked by
// NewReader.
func (r *Reader) Select(idx []int) error {
	if r.row > 0 || r.open || r.done || r.group > 0 {
		return &Error{File: r.name, Reason: "select after reading began", class: quantity.ErrInvalid}
	}
	seen := make([]bool, len(r.cols))
	for _, k := range idx {
		if k < 0 || k >= len(r.cols) || seen[k] {
			return &Error{File: r.name, Reason: "select: column index out of range or repeated", class: quantity.ErrInvalid}
		}
		seen[k] = true
	}
	for _, k := range idx {
		if e := r.rc[k].bad; e != nil {
			return e
		}
	}
	r.active = r.active[:0]
	for k, on := range seen {
		if on {
			r.active = append(r.active, k)
		}
	}
	return nil
}

// Metadata returns the file's key-value metadata other than the unit
// entries (UnitKey + name): what a writer put there with
// Options.Metadata, or another program's entries. It is nil when there
// are none; the map is the Reader's, not to be changed.
func (r *Reader) Metadata() map[string]string { return r.meta }

// chanfileKind is the chanfile.Kind a column of the given store fills in
// Columns: timestamps for TIMESTAMP, DATE and INT96 columns, labels for
// strings, numbers otherwise (a time of day is a number of seconds).
func chanfileKind(s store) chanfile.Kind {
	switch s {
	case kTime, kInt96:
		return chanfile.Timestamp
	case kLabel:
		return chanfile.Label
	}
	return chanfile.Number
}

// Kind returns what column j (from 0, in the order of Columns) holds.
func (r *Reader) Kind(j int) Kind {
	switch r.rc[j].store {
	case kTime, kInt96:
		return Time
	case kLabel:
		return Label
	case kClock:
		return TimeOfDay
	}
	return Number
}

// Origin returns the instant of the first sample of time column j (from
// 0), which its values are counted from; false for a column of another
// kind, or before a sample of it has been read.
func (r *Reader) Origin(j int) (Origin, bool) {
	c := &r.rc[j]
	return c.origin, (c.store == kTime || c.store == kInt96) && c.started
}

// Labels returns the text of label column j (from 0) for the rows of the
// last Read, one string a row ("" for a missing one, counted in Missing);
// nil for a column of another kind. The slice is reused by the next Read.
func (r *Reader) Labels(j int) []string {
	if r.rc[j].store != kLabel {
		return nil
	}
	return r.rc[j].labels
}

// NumRows returns the number of rows the file's footer declares, which
// NewReader checked against the row groups and the values of the pages
// of the columns read.
func (r *Reader) NumRows() int64 { return r.file.NumRows() }

// batch is the most rows Read decodes at a time, whatever it is asked
// for: the memory Read takes grows with the rows it has read, never with
// the rows asked for or the rows the footer declares.
const batch = 4096

// Read reads up to rows rows (4096 if rows is not positive) into dst,
// one Series per column read in SI (dst is grown to the number of
// columns and its storage reused), and returns the number of rows read.
// It returns io.EOF with 0 rows at the end of the file. A gauge column is
// absolute: its level plus Options.Reference. A time column holds
// seconds from its first sample; a label column's Series is empty, its
// text is returned by Labels. The Series grow by the rows read, so
// Read(dst, int(r.NumRows())) takes memory for the rows the file holds,
// whatever its footer declares. After Select, only the selected columns
// are decoded and filled; the others' Series are empty.
func (r *Reader) Read(dst []quantity.Series, rows int) (out []quantity.Series, n int, err error) {
	if rows <= 0 {
		rows = 4096
	}
	dst, r.vals = filebase.Batch(dst, len(r.cols), r.vals)
	for j := range r.cols {
		r.rc[j].labels = r.rc[j].labels[:0]
	}
	defer func() {
		if p := recover(); p != nil {
			r.done = true
			for j := range r.cols {
				dst[j] = quantity.NewSeries(nil, r.cols[j].Unit.Dim())
				r.rc[j].labels = r.rc[j].labels[:0]
			}
			out, n, err = dst, 0, &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("a damaged Parquet file (the decoder failed: %v)", p)}
		}
	}()
	for _, j := range r.active {
		if e := r.rc[j].bad; e != nil && !r.done {
			r.done = true
			return dst, 0, e
		}
	}
	for n < rows && !r.done && err == nil {
		var k int
		k, err = r.readBatch(min(batch, rows-n), n)
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

// fill reads up to len(dst) values of column c, from page to page of
// the row group; fewer at the end of its pages.
func fill(c *rcol, dst []parquet.Value) (int, error) {
	n := 0
	for n < len(dst) {
		if c.vr == nil {
			p, err := c.pages.ReadPage()
			if err == io.EOF {
				return n, nil
			}
			if err != nil {
				return n, err
			}
			c.vr = p.Values()
		}
		k, err := c.vr.ReadValues(dst[n:])
		n += k
		if err == io.EOF {
			c.vr = nil
			continue
		}
		if err != nil {
			return n, err
		}
		if k == 0 {
			return n, fmt.Errorf("a page that yields no values")
		}
	}
	return n, nil
}

// closeGroup closes the pages of the row group being read.
func (r *Reader) closeGroup() error {
	var err error
	for j := range r.cols {
		c := &r.rc[j]
		if c.pages != nil {
			if e := c.pages.Close(); e != nil && err == nil {
				err = e
			}
		}
		c.pages, c.vr = nil, nil
	}
	r.open = false
	return err
}

// readBatch reads up to k rows, appending to r.vals and the labels,
// which hold n rows of this call to Read; it returns the rows read.
func (r *Reader) readBatch(k, n int) (read int, err error) {
	if !r.open {
		if r.group >= len(r.groups) {
			r.done = true
			if r.row != r.file.NumRows() {
				return 0, &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("the file declares %d rows, its pages hold %d: a damaged file", r.file.NumRows(), r.row)}
			}
			return 0, nil
		}
		chunks := r.groups[r.group].ColumnChunks()
		for _, j := range r.active {
			c := &r.rc[j]
			if c.leaf >= len(chunks) {
				r.done = true
				return 0, &Error{File: r.name, Row: r.row + 1, Reason: fmt.Sprintf("row group %d has %d columns", r.group+1, len(chunks))}
			}
			c.pages = chunks[c.leaf].Pages()
		}
		r.open, r.inGroup = true, 0
	}
	declared := r.groups[r.group].NumRows()
	want := declared - r.inGroup // rows of the group still to read
	if want <= 0 {
		// The end of the row group: no column may hold more.
		var one [1]parquet.Value
		for _, j := range r.active {
			c := &r.rc[j]
			m, err := fill(c, one[:])
			if err != nil {
				r.done = true
				return 0, r.colError(j, r.row+1, "read failed", err)
			}
			if m > 0 {
				r.done = true
				return 0, &Error{File: r.name, Row: r.row + 1, Column: c.at, Field: r.cols[j].Name, Reason: fmt.Sprintf("row group %d declares %d rows, its pages hold more: a damaged file", r.group+1, declared)}
			}
		}
		if err := r.closeGroup(); err != nil {
			r.done = true
			return 0, &Error{File: r.name, Row: r.row + 1, Reason: "read failed", Err: err}
		}
		r.group++
		return 0, nil
	}
	m := int(min(int64(k), want))
	// Each column's values first, then row by row, so that the rows
	// before an error are whole and nothing after it is converted.
	good := m // the rows every column holds
	var short error
	for _, j := range r.active {
		c := &r.rc[j]
		if cap(c.buf) < batch {
			c.buf = make([]parquet.Value, batch)
		}
		got, ferr := fill(c, c.buf[:m])
		if got < good {
			good = got
			switch {
			case ferr != nil:
				short = r.colError(j, r.row+int64(got)+1, "read failed", ferr)
			default:
				short = &Error{File: r.name, Row: r.row + int64(got) + 1, Column: c.at, Field: r.cols[j].Name, Reason: fmt.Sprintf("row group %d declares %d rows, its pages hold %d: a damaged file", r.group+1, declared, r.inGroup+int64(got))}
			}
		} else if ferr != nil && short == nil {
			short = r.colError(j, r.row+int64(got)+1, "read failed", ferr)
		}
	}
	first := short
rows:
	for i := range good {
		for _, j := range r.active {
			if err := r.convert(j, r.rc[j].buf[i], r.row+int64(i)+1); err != nil {
				first, good = err, i
				break rows
			}
		}
	}
	if first != nil {
		r.done = true
	}
	for j := range r.vals {
		r.vals[j] = r.vals[j][:min(len(r.vals[j]), n+good)]
		if r.rc[j].store == kLabel {
			r.rc[j].labels = r.rc[j].labels[:min(len(r.rc[j].labels), n+good)]
		}
	}
	r.row += int64(good)
	r.inGroup += int64(good)
	return good, first
}

// colError is an error of column j at a row.
func (r *Reader) colError(j int, row int64, reason string, err error) *Error {
	return &Error{File: r.name, Row: row, Column: r.rc[j].at, Field: r.cols[j].Name, Reason: reason, Err: err}
}

// rangeError is an error of class quantity.ErrRange of column j at a row.
func (r *Reader) rangeError(j int, row int64, reason string) *Error {
	return &Error{File: r.name, Row: row, Column: r.rc[j].at, Field: r.cols[j].Name, Reason: reason, class: quantity.ErrRange}
}

// pow10 holds the powers of ten exact in float64.
var pow10 = [...]float64{1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// convert appends the value v of column j (at row) to r.vals[j], or to
// its labels.
func (r *Reader) convert(j int, v parquet.Value, row int64) error {
	c := &r.rc[j]
	vals := &r.vals[j]
	if v.IsNull() {
		r.cols[j].Missing++
		if c.store == kLabel {
			c.labels = append(c.labels, "")
		} else {
			*vals = append(*vals, math.NaN())
		}
		return nil
	}
	var x float64
	switch c.store {
	case kLabel:
		b := v.ByteArray()
		if !utf8.Valid(b) {
			return &Error{File: r.name, Row: row, Column: c.at, Field: r.cols[j].Name, Reason: "a label that is not valid UTF-8"}
		}
		c.labels = append(c.labels, string(b))
		return nil
	case kTime:
		var t int64
		if c.tick == 0 {
			t = int64(v.Int32())
		} else {
			t = v.Int64()
		}
		if !c.started {
			c.started, c.first = true, t
			switch c.tick {
			case 0:
				c.origin = Origin{Time: time.Unix(t*86400, 0).UTC()}
			case 1e3:
				c.origin = Origin{Time: time.UnixMilli(t).UTC(), UTC: c.utc}
			case 1e6:
				c.origin = Origin{Time: time.UnixMicro(t).UTC(), UTC: c.utc}
			default:
				c.origin = Origin{Time: time.Unix(0, t).UTC(), UTC: c.utc}
			}
		}
		d := t - c.first
		if (t >= c.first) != (d >= 0) || d > 1<<53 || d < -(1<<53) {
			return r.rangeError(j, row, fmt.Sprintf("an instant %d ticks from the first sample's, not exact in float64 seconds", uint64(t)-uint64(c.first)))
		}
		if c.tick == 0 {
			x = float64(d) * 86400
		} else {
			x = float64(d) / float64(c.tick) // one rounding: the nearest float64
		}
		*vals = append(*vals, x)
		return nil
	case kInt96:
		return r.int96(j, v, row)
	case kClock:
		var t int64
		if c.tick == 1e3 {
			t = int64(v.Int32())
		} else {
			t = v.Int64()
		}
		// A time of day: from midnight to the end of the day (24:00).
		if t < 0 || t > 86400*c.tick {
			return r.rangeError(j, row, fmt.Sprintf("a time of day of %d ticks of 1/%d s, outside 0 to 24 h", t, c.tick))
		}
		*vals = append(*vals, float64(t)/float64(c.tick)) // exact ticks, one rounding
		return nil
	case kBool:
		if v.Boolean() {
			*vals = append(*vals, 1)
		} else {
			*vals = append(*vals, 0)
		}
		return nil
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
			return r.rangeError(j, row, fmt.Sprintf("the integer %d is not exact as a float64", i))
		}
	case kUint64:
		u := uint64(v.Int64())
		x = float64(u)
		if u > 1<<53 {
			return r.rangeError(j, row, fmt.Sprintf("the integer %d is not exact as a float64", u))
		}
	case kDecimal:
		var err error
		x, err = r.decimal(c, v)
		if err != nil {
			return &Error{File: r.name, Row: row, Column: c.at, Field: r.cols[j].Name, Reason: "a damaged DECIMAL", Err: err}
		}
	}
	if math.IsNaN(x) {
		*vals = append(*vals, math.NaN())
		r.cols[j].Missing++
		return nil
	}
	if math.IsInf(x, 0) {
		return r.rangeError(j, row, "an infinite value: a channel file holds finite numbers or missing ones")
	}
	y := x * c.mul
	si := y + c.add
	if math.IsInf(si, 0) || math.IsNaN(si) || x != 0 && y == 0 {
		return r.rangeError(j, row, fmt.Sprintf("%v %s is beyond the range of float64 in SI units", x, r.cols[j].Text))
	}
	*vals = append(*vals, si)
	return nil
}

// unixJulianDay is the Julian day number of 1970-01-01, the day of
// Unix time 0 (the Julian day beginning at its noon; an INT96 timestamp
// counts nanoseconds from the midnight that starts this day).
const unixJulianDay = 2440588

// int96 appends the legacy INT96 timestamp v of column j (at row), 8
// bytes of nanoseconds within the day and 4 of the Julian day, both
// little-endian, as seconds from the column's first sample.
func (r *Reader) int96(j int, v parquet.Value, row int64) error {
	c := &r.rc[j]
	w := v.Int96()
	ns := int64(w[1])<<32 | int64(w[0])
	day := int64(int32(w[2]))
	const dayNs = 86400 * int64(time.Second)
	if ns < 0 || ns >= dayNs {
		return r.rangeError(j, row, fmt.Sprintf("an INT96 timestamp of %d ns within its day, outside one day: a damaged value", uint64(ns)))
	}
	if !c.started {
		c.started, c.first, c.firstDay = true, ns, day
		c.origin = Origin{Time: time.Unix((day-unixJulianDay)*86400, ns).UTC()}
	}
	// At most 2⁵³ ns (about 104 days) from the first sample.
	dd := day - c.firstDay
	var d int64
	if dd <= 105 && dd >= -105 {
		d = dd*dayNs + ns - c.first
	}
	if dd > 105 || dd < -105 || d > 1<<53 || d < -(1<<53) {
		return r.rangeError(j, row, fmt.Sprintf("an instant %d days from the first sample's, more than 2⁵³ ns: not exact in float64 seconds", dd))
	}
	r.vals[j] = append(r.vals[j], float64(d)/1e9) // one rounding: the nearest float64
	return nil
}

// decimal returns the float64 nearest the exact value of a DECIMAL:
// unscaled × 10^−scale, rounded once.
func (r *Reader) decimal(c *rcol, v parquet.Value) (float64, error) {
	var u int64
	switch v.Kind() {
	case parquet.Int32:
		u = int64(v.Int32())
	case parquet.Int64:
		u = v.Int64()
	default:
		b := v.ByteArray()
		if len(b) == 0 || len(b) > 16 {
			return 0, fmt.Errorf("%d bytes of unscaled value (1 to 16 are read)", len(b))
		}
		if len(b) > 8 {
			// Two's complement, big-endian, beyond int64.
			z := new(big.Int).SetBytes(b)
			if b[0]&0x80 != 0 {
				z.Sub(z, new(big.Int).Lsh(big.NewInt(1), uint(8*len(b))))
			}
			r.scratch = z.Append(r.scratch[:0], 10)
			return r.parseScaled(c.scale)
		}
		u = int64(int8(b[0])) // the sign extends
		for _, x := range b[1:] {
			u = u<<8 | int64(x)
		}
	}
	// Both the integer and the power of ten exact in float64: one
	// correctly rounded division is the nearest float64.
	if u <= 1<<53 && u >= -(1<<53) && int(c.scale) < len(pow10) {
		return float64(u) / pow10[c.scale], nil
	}
	r.scratch = strconv.AppendInt(r.scratch[:0], u, 10)
	return r.parseScaled(c.scale)
}

// parseScaled reads the integer in r.scratch × 10^−scale, correctly
// rounded by strconv.ParseFloat.
func (r *Reader) parseScaled(scale int32) (float64, error) {
	r.scratch = append(r.scratch, "e-"...)
	r.scratch = strconv.AppendInt(r.scratch, int64(scale), 10)
	return strconv.ParseFloat(string(r.scratch), 64)
}

// Close releases the reader's buffers.
func (r *Reader) Close() error {
	if !r.open {
		return nil
	}
	return r.closeGroup()
}
