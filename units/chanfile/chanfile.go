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
	"time"
	"unicode/utf8"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile/internal/filebase"
)

// MaxColumns bounds the number of channels of one file.
const MaxColumns = 4096

// MaxFieldLen bounds the length of one field in bytes.
const MaxFieldLen = 1024

// Column is one channel of a file: its name, its unit as read and the
// readings the dialect made of the unit text.
//
// Unit is the unit the values are read in; Unit.String spells it in the
// module's ASCII notation (a header written "°C" prints "degC", "m3/h"
// prints "m^3/h"), and Text keeps the unit as the header wrote it. The
// Unit of a Timestamp column is s; that of a Label column is 1 (units.One)
// and means nothing: its Kind says the column holds text.
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
	// Kind is what the column holds: numbers, timestamps or labels.
	Kind Kind
	// Start is the time of the first sample of a Timestamp column, whose
	// values are seconds from it (zero for other kinds). For a column of
	// clock times without a date it has no date (year 0).
	Start time.Time
	// Index is the column's place in the file, from 1, and Header its
	// header field as written (in a Parquet file, its name in the
	// schema); both are zero for a column given to a Writer.
	Index  int
	Header string
	// Fault, when not nil, is why the column cannot be read: its header
	// (a unit the dialect does not read, no unit, a malformed field) or
	// its first values (dates of no stated order). The column is listed
	// so that the others can be read: a reader returns Fault (an *Error
	// of its package naming the column and where) when the column is
	// selected or when every column is read, never otherwise. Name,
	// Header and Text are as far as they were read; Unit and Kind say
	// nothing.
	Fault error
}

// Error reports a problem in a file, with the line and column (both from
// 1; column 0 when the whole line is concerned). It matches exactly one
// class of package quantity under errors.Is: the class of Err when Err
// has one (an unknown unit in a header is quantity.ErrUnknown, with the
// *units.Error reachable by errors.As); otherwise quantity.ErrRange
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

// Error implements the error interface: "loop.csv:14:3: …" for a
// line and column, "loop.csv: column 3: …" for a column with no line
// and "loop.csv: …" for the whole file or an argument (a line 0 is not
// printed).
func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("chanfile: ")
	switch {
	case e.Line > 0:
		fmt.Fprintf(&sb, "%s:%d", e.File, e.Line)
		if e.Column > 0 {
			fmt.Fprintf(&sb, ":%d", e.Column)
		}
		sb.WriteString(": ")
	case e.File != "":
		sb.WriteString(e.File)
		if e.Column > 0 {
			fmt.Fprintf(&sb, ": column %d", e.Column)
		}
		sb.WriteString(": ")
	case e.Column > 0:
		fmt.Fprintf(&sb, "column %d: ", e.Column)
	}
	if e.Field != "" {
		fmt.Fprintf(&sb, "%q: ", e.Field)
	}
	return filebase.Finish(&sb, e.Reason, e.Err)
}

// Unwrap returns the underlying error.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is the error's class (see Error), when Err
// has no class of its own; otherwise errors.Is finds the class on Err.
func (e *Error) Is(target error) bool { return filebase.Is(e.Err, e.class, target) }

// Options adjust how a file is read. The zero value detects the encoding,
// the delimiter and the decimal mark, reads every column, takes the
// empty field, NA, NaN, nan and #N/A as missing, and refuses gauge
// channels.
type Options struct {
	// Comma is the field delimiter: 0 detects it from the first lines
	// (tab, ';', ',' or runs of blanks, reported by Reader.Format); ' '
	// splits at runs of spaces and tabs; any other ASCII byte is used as
	// given ('\t' for TSV).
	Comma rune
	// Decimal is the decimal mark of the numbers: 0 detects it (',' only
	// when the delimiter is not a comma and the numbers of the first lines
	// use it), '.' or ','. With ',' a number with a '.' is refused, since
	// it could be a thousands separator.
	Decimal byte
	// Encoding is the character encoding: DetectEncoding (the zero value)
	// reads UTF-8 and UTF-16 with a byte-order mark; Latin1 and
	// Windows1252 read an export in an 8-bit code page.
	Encoding Encoding
	// Missing is an extra marker for a missing value (as in "-999").
	Missing string
	// MissingValues, if not nil, replaces the default missing markers
	// (the empty field, NA, NaN, nan and #N/A): []string{"", "---",
	// "-9999"}. Without "" an empty field is an error.
	MissingValues []string
	// Reference, if set, is the absolute ambient pressure that gauge
	// channels are read against. Leave it zero to refuse gauge channels.
	Reference quantity.Quantity
	// Columns, if not nil, names the columns to read, in the order
	// Reader.Columns and Read return them (by alias, channel name or the
	// header field as written). The other columns are skipped without
	// parsing their header unit or their fields, so their content cannot
	// fail the file; each row must still have the header's number of
	// fields.
	Columns []string
	// Aliases renames columns: the key is a channel name or a header field
	// as written ("Pump speed [rpm]" or "Pump speed"), the value the name
	// to use ("n"). A name with spaces or signs can so be made a variable.
	Aliases map[string]string
	// Location is the time zone of timestamps written without one; nil
	// means UTC.
	Location *time.Location
	// SlashDates is the order of day and month in dates written with
	// slashes (03/04/2026); the zero value refuses a column of them.
	SlashDates DateOrder
}

// SniffBytes bounds the bytes a Reader looks at to detect the delimiter,
// the decimal mark, a units row and the kind of each column: the first
// SniffLines lines within the first SniffBytes bytes.
const (
	SniffBytes = 1 << 15
	SniffLines = 32
)

// Kind is what a column holds.
type Kind uint8

// The kinds of column. A Number column holds values in its unit; a
// Timestamp column holds times (ISO 8601, a dotted date and clock time, a
// clock time alone, or seconds since 1970 in a column whose name says
// epoch, unix or posix), read as seconds from the first sample with the
// absolute start in Column.Start; a Label column holds text (a run tag),
// kept as strings (Reader.Labels).
const (
	Number Kind = iota
	Timestamp
	Label
)

// String returns "number", "timestamp" or "label".
func (k Kind) String() string {
	switch k {
	case Number:
		return "number"
	case Timestamp:
		return "timestamp"
	case Label:
		return "label"
	}
	return fmt.Sprintf("Kind(%d)", uint8(k))
}

// Format is how a file was read: what Options gave or what the Reader
// detected, with a Reading for every detected choice.
type Format struct {
	Encoding Encoding
	Comma    rune // ',', ';', '\t', another byte, or ' ' for runs of blanks
	Decimal  byte // '.' or ','
	UnitsRow bool // the units are in a row under the names
	Readings []units.Reading
}

// ParseHeaderField reads one header field into a channel name and unit:
// "V [kn]", "Torque (in-lb)", "Q m3/h", "Re [1]". The unit is read with
// units.ParseDialect. A gauge unit is returned with Gauge set and the
// unit of the gauge level; the caller decides whether it has a reference.
func ParseHeaderField(field string) (Column, error) {
	name, unit, err := splitHeader(field)
	if err != nil {
		return Column{}, err
	}
	f := strings.TrimSpace(strings.TrimPrefix(field, "\ufeff"))
	if unit == "" {
		return Column{}, &Error{Field: f, Reason: fmt.Sprintf("no unit for the channel: write %q for a dimensionless one", name+" [1]")}
	}
	col := Column{Name: name, Text: unit}
	if err := parseUnit(&col); err != nil {
		return Column{}, &Error{Field: f, Reason: "not a unit", Err: err}
	}
	return col, nil
}

// splitHeader splits a header field into a name and a unit text, which
// is empty when the field has none.
func splitHeader(field string) (name, unit string, err error) {
	f := strings.TrimSpace(strings.TrimPrefix(field, "\ufeff"))
	if len(f) > MaxFieldLen {
		return "", "", &Error{Field: f[:32] + "…", Reason: "header field too long"}
	}
	if !utf8.ValidString(f) {
		return "", "", &Error{Field: f, Reason: "header field is not valid UTF-8"}
	}
	switch {
	case strings.HasSuffix(f, "]") && strings.LastIndexByte(f, '[') >= 0:
		i := strings.LastIndexByte(f, '[')
		name, unit = f[:i], f[i+1:len(f)-1]
	case strings.HasSuffix(f, ")") && !strings.HasSuffix(f, "(g)") && !strings.HasSuffix(f, "(a)") && strings.LastIndexByte(f, '(') >= 0:
		i := matchingOpen(f)
		if i < 0 {
			return "", "", &Error{Field: f, Reason: "unbalanced parentheses"}
		}
		name, unit = f[:i], f[i+1:len(f)-1]
		if n := strings.TrimSpace(name); strings.HasSuffix(n, "/") && !strings.ContainsAny(n, " \t") {
			name = n[:len(n)-1] // Q/(m3/h), quantity/unit
		}
	default:
		i := strings.LastIndexAny(f, " \t")
		if i < 0 {
			if j := strings.IndexByte(f, '/'); j > 0 && j < len(f)-1 {
				// The heading quantity/unit of ISO 80000-1: "V/kn",
				// "Q/(m3/h)"; the caller checks that the unit is one.
				return f[:j], unitCell(f[j+1:]), nil
			}
			return f, "", nil
		}
		name, unit = f[:i], f[i+1:]
	}
	name, unit = strings.TrimSpace(name), strings.TrimSpace(unit)
	if name == "" {
		return "", "", &Error{Field: f, Reason: "no channel name before the unit"}
	}
	return name, unit, nil
}

// slashed reports whether a header field was split at a slash
// (quantity/unit) rather than at brackets or a space.
func slashed(f string) bool {
	return !strings.ContainsAny(f, " \t") && !strings.HasSuffix(f, "]") && !strings.HasSuffix(f, ")")
}

// parseUnit reads c.Text into c.Unit, c.Readings and c.Gauge.
func parseUnit(c *Column) error {
	if c.Text == "-" || c.Text == "1" {
		c.Unit = units.One()
		return nil
	}
	if g, err := units.ParseGauge("1 " + c.Text); err == nil {
		c.Unit, c.Gauge = g.Unit, true
		return nil
	}
	u, rd, err := units.ParseDialect(c.Text)
	if err != nil {
		return err
	}
	c.Unit, c.Readings = u, rd
	return nil
}

// unitCell returns the unit text of a field of a units row: "[m/s]",
// "(m/s)" or "m/s".
func unitCell(s string) string {
	s = strings.TrimSpace(s)
	if len(s) >= 2 && (s[0] == '[' && s[len(s)-1] == ']' || s[0] == '(' && s[len(s)-1] == ')') {
		s = strings.TrimSpace(s[1 : len(s)-1])
	}
	return s
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

// MaxLineLen bounds the length of one line in bytes (after decoding to
// UTF-8).
const MaxLineLen = 1 << 16

// Reader reads a channel file chunk by chunk. Lines are split at the
// delimiter; a field may be quoted ("Q, flow (m3/h)", with "" for a quote
// inside), but a quoted field may not span lines (with runs of blanks as
// the delimiter, quotes are not read). Lines starting with '#' and blank
// lines are skipped, except a row that starts with a missing marker such
// as #N/A; CR LF line ends and a byte-order mark are accepted.
type Reader struct {
	name    string
	opt     Options
	br      *bufio.Reader
	dec     *decoder
	comma   byte
	blanks  bool // split at runs of blanks
	decimal byte
	format  Format
	ncol    int       // fields of the header
	cols    []Column  // the columns read
	idx     []int     // the file column of each
	mul     []float64 // SI = x·mul + add
	add     []float64
	layout  []int      // Timestamp columns: the layout, or -1 for seconds since 1970
	started []bool     // Timestamp columns: the start is known
	startX  []float64  // seconds since 1970 of the first sample
	prev    []float64  // clock-only columns: the last time read
	labels  [][]string // Label columns: the last chunk
	intern  []map[string]string
	missing map[string]bool
	missNum [][]byte // markers that read as numbers (-9999, ---)
	line    int      // the last line read
	raw     []byte   // the last line read, before splitting
	pend    []byte   // a line read ahead, to be read again
	hasPend bool
	pendOff int64 // the bytes of the line read ahead
	// the offset of the start of the last line read
	lineStart int64
	fields    [][]byte    // reused
	unq       []byte      // reused storage for unquoted fields
	num       []byte      // reused storage for a number with a decimal comma
	vals      [][]float64 // reused
	active    []int       // the columns Read fills (all, or those of Select)
	checked   bool        // the active columns can be read together (see refusal)
	headLine  int         // the line of the header
	unitLine  int         // the line of the units row, if any
	done      bool
	off       int64 // bytes of lines read, after a byte-order mark
}

// maxInterned bounds the distinct labels a Label column shares storage
// for; beyond it each label is its own string.
const maxInterned = 4096

// NewReader reads the comment lines and the header row of r (and a units
// row under it, if there is one), looking at most at SniffBytes bytes to
// detect what Options leave open; name is the file's name for messages.
func NewReader(r io.Reader, name string, opt Options) (*Reader, error) {
	rd := &Reader{name: name, opt: opt}
	if err := rd.options(); err != nil {
		return nil, err
	}
	if err := rd.open(r); err != nil {
		return nil, err
	}
	lines, err := rd.sniff()
	if err != nil {
		return nil, err
	}
	ok, err := rd.next()
	if err != nil {
		return nil, err
	}
	if !ok {
		return nil, &Error{File: name, Line: max(rd.line, 1), Reason: "no header row"}
	}
	if len(rd.fields) > MaxColumns {
		return nil, &Error{File: name, Line: rd.line, Reason: fmt.Sprintf("%d columns, more than %d", len(rd.fields), MaxColumns)}
	}
	head := make([]string, len(rd.fields))
	for i, f := range rd.fields {
		head[i] = string(f)
	}
	headLine := rd.line
	rd.ncol = len(head)
	// A units row under the names, or the first data row, read again.
	var unitRow []string
	skip := 1
	if ok, err := rd.next(); err != nil {
		return nil, err
	} else if ok {
		if rd.isUnitsRow() {
			unitRow = make([]string, len(rd.fields))
			for i, f := range rd.fields {
				unitRow[i] = string(f)
			}
			skip = 2
			rd.format.UnitsRow = true
			rd.unitLine = rd.line
			rd.format.Readings = append(rd.format.Readings, units.Reading{From: fmt.Sprintf("line %d", rd.line), To: "the units of the columns", Note: "no field is a number or a time and some are units"})
		} else {
			rd.pend = append(rd.pend[:0], rd.raw...)
			rd.hasPend = true
			rd.pendOff = rd.off - rd.lineStart
			rd.off = rd.lineStart
		}
	}
	if err := rd.columns(head, headLine, unitRow, lines[min(skip, len(lines)):]); err != nil {
		return nil, err
	}
	return rd, nil
}

// options checks the options and sets up the missing markers.
func (r *Reader) options() error {
	opt := r.opt
	if opt.Comma != 0 && opt.Comma != ' ' {
		if opt.Comma >= 0x80 || opt.Comma == '"' || opt.Comma == '\n' || opt.Comma == '\r' || opt.Comma == '#' {
			return &Error{File: r.name, Reason: fmt.Sprintf("delimiter %q is not a single ASCII byte other than a quote, # or newline", opt.Comma), class: quantity.ErrInvalid}
		}
	}
	if opt.Decimal != 0 && opt.Decimal != '.' && opt.Decimal != ',' {
		return &Error{File: r.name, Reason: fmt.Sprintf("decimal mark %q is neither '.' nor ','", opt.Decimal), class: quantity.ErrInvalid}
	}
	if opt.Decimal != 0 && rune(opt.Decimal) == opt.Comma {
		return &Error{File: r.name, Reason: fmt.Sprintf("the decimal mark and the delimiter are both %q", opt.Decimal), class: quantity.ErrInvalid}
	}
	if opt.Encoding > Windows1252 {
		return &Error{File: r.name, Reason: fmt.Sprintf("unknown %v", opt.Encoding), class: quantity.ErrInvalid}
	}
	markers := opt.MissingValues
	if markers == nil {
		markers = []string{"", "NA", "NaN", "nan", "#N/A"}
	}
	if opt.Missing != "" {
		markers = append(markers[:len(markers):len(markers)], opt.Missing)
	}
	r.missing = map[string]bool{}
	for _, m := range markers {
		if len(m) > 0 && numStart(m[0]) {
			r.missNum = append(r.missNum, []byte(m))
		} else {
			r.missing[m] = true
		}
	}
	return nil
}

// open detects the encoding by a byte-order mark and sets up the decoding.
func (r *Reader) open(src io.Reader) error {
	enc := r.opt.Encoding
	raw := bufio.NewReaderSize(src, 4096)
	bom, _ := raw.Peek(3)
	switch {
	case bytes.HasPrefix(bom, []byte("\xef\xbb\xbf")) && (enc == DetectEncoding || enc == UTF8):
		raw.Discard(3)
		enc = UTF8
	case bytes.HasPrefix(bom, []byte("\xff\xfe")) && (enc == DetectEncoding || enc == UTF16LE):
		raw.Discard(2)
		if enc == DetectEncoding {
			r.format.Readings = append(r.format.Readings, units.Reading{From: "byte-order mark FF FE", To: "UTF-16LE"})
		}
		enc = UTF16LE
	case bytes.HasPrefix(bom, []byte("\xfe\xff")) && (enc == DetectEncoding || enc == UTF16BE):
		raw.Discard(2)
		if enc == DetectEncoding {
			r.format.Readings = append(r.format.Readings, units.Reading{From: "byte-order mark FE FF", To: "UTF-16BE"})
		}
		enc = UTF16BE
	case enc == DetectEncoding:
		head, _ := raw.Peek(512)
		if e, ok := utf16Hint(head); ok {
			return &Error{File: r.name, Line: 1, Reason: fmt.Sprintf("the file looks like %v without a byte-order mark (many zero bytes): read it with Options.Encoding = chanfile.%s", e, map[Encoding]string{UTF16LE: "UTF16LE", UTF16BE: "UTF16BE"}[e])}
		}
		enc = UTF8
	}
	r.format.Encoding = enc
	var in io.Reader = raw
	if enc != UTF8 {
		r.dec = &decoder{src: raw, enc: enc, name: r.name}
		in = r.dec
	}
	r.br = bufio.NewReaderSize(in, MaxLineLen)
	return nil
}

// sniff looks at the first lines (at most SniffLines lines in SniffBytes
// bytes), checks they are text, and detects the delimiter and the decimal
// mark that Options leave open. It returns those lines, comments and
// blank lines left out.
func (r *Reader) sniff() ([][]byte, error) {
	win, err := r.br.Peek(SniffBytes)
	eof := err != nil
	if err != nil && err != io.EOF {
		return nil, sourceError(r.name, 1, err)
	}
	if r.format.Encoding == UTF8 {
		if err := checkUTF8(r.name, win, eof); err != nil {
			return nil, err
		}
	}
	var lines [][]byte
	for len(win) > 0 && len(lines) < SniffLines {
		var b []byte
		if i := bytes.IndexByte(win, '\n'); i >= 0 {
			b, win = win[:i], win[i+1:]
		} else if eof {
			b, win = win, nil
		} else {
			break
		}
		b = bytes.TrimSuffix(b, []byte{'\r'})
		if len(b) == 0 || r.comment(b) {
			continue
		}
		lines = append(lines, bytes.Clone(b))
	}
	// The delimiter.
	switch c := r.opt.Comma; {
	case c == ' ':
		r.blanks = true
	case c != 0:
		r.comma = byte(c)
	default:
		r.comma = ','
		c, blanks, how := sniffComma(lines)
		r.comma, r.blanks = c, blanks
		if len(lines) > 0 {
			to := fmt.Sprintf("%q", rune(c))
			if blanks {
				to = "runs of blanks"
			}
			r.format.Readings = append(r.format.Readings, units.Reading{From: "delimiter", To: to, Note: fmt.Sprintf("%s in the first %d lines; set Options.Comma to choose", how, len(lines))})
		}
	}
	if r.blanks {
		r.format.Comma = ' '
	} else {
		r.format.Comma = rune(r.comma)
	}
	// The decimal mark.
	r.decimal = r.opt.Decimal
	if r.decimal == 0 {
		r.decimal = '.'
		if !r.blanks && r.comma == ',' {
			r.format.Decimal = r.decimal
			return lines, nil
		}
		commas, points := 0, 0
		for _, l := range lines[min(1, len(lines)):] {
			r.splitLine(l)
			for _, f := range r.fields {
				switch {
				case commaNumber(f):
					commas++
				case bytes.IndexByte(f, '.') >= 0 && numStart(firstByte(f)):
					if _, err := strconv.ParseFloat(string(f), 64); err == nil {
						points++
					}
				}
			}
		}
		switch {
		case commas > 0 && points > 0:
			return nil, &Error{File: r.name, Reason: fmt.Sprintf("the first lines have %d numbers with a decimal comma and %d with a decimal point: set Options.Decimal to the file's decimal mark", commas, points)}
		case commas > 0:
			r.decimal = ','
			r.format.Readings = append(r.format.Readings, units.Reading{From: "decimal mark", To: "','", Note: fmt.Sprintf("%d numbers of the first lines written with a decimal comma; set Options.Decimal to choose", commas)})
		case points > 0:
			r.format.Readings = append(r.format.Readings, units.Reading{From: "decimal mark", To: "'.'", Note: "numbers of the first lines written with a decimal point; set Options.Decimal to choose"})
		}
	}
	r.format.Decimal = r.decimal
	return lines, nil
}

func firstByte(b []byte) byte {
	if len(b) == 0 {
		return 0
	}
	return b[0]
}

// commaNumber reports whether f is a number written with a decimal
// comma: -12,5 or 1,5e-3.
func commaNumber(f []byte) bool {
	i := 0
	if i < len(f) && (f[i] == '+' || f[i] == '-') {
		i++
	}
	d := 0
	for i < len(f) && f[i] >= '0' && f[i] <= '9' {
		i, d = i+1, d+1
	}
	if i >= len(f) || f[i] != ',' {
		return false
	}
	i++
	e := 0
	for i < len(f) && f[i] >= '0' && f[i] <= '9' {
		i, e = i+1, e+1
	}
	if e == 0 {
		return false
	}
	if i < len(f) && (f[i] == 'e' || f[i] == 'E') {
		i++
		if i < len(f) && (f[i] == '+' || f[i] == '-') {
			i++
		}
		x := 0
		for i < len(f) && f[i] >= '0' && f[i] <= '9' {
			i, x = i+1, x+1
		}
		if x == 0 {
			return false
		}
	}
	return i == len(f)
}

// sniffComma detects the delimiter of lines: the first of tab, ';' and
// ',' that splits every line into the same number (two or more) of
// fields; else runs of blanks, if no line has any of them and they split
// every line alike; else the first that splits the header; else ','.
func sniffComma(lines [][]byte) (c byte, blanks bool, how string) {
	if len(lines) == 0 {
		return ',', false, "no line"
	}
	cands := []byte{'\t', ';', ','}
	for _, c := range cands {
		n := countFields(lines[0], c)
		if n < 2 {
			continue
		}
		same := true
		for _, l := range lines[1:] {
			if countFields(l, c) != n {
				same = false
				break
			}
		}
		if same {
			return c, false, fmt.Sprintf("%d fields on each line", n)
		}
	}
	any := false
	for _, l := range lines {
		if bytes.ContainsAny(l, "\t;") {
			any = true
			break
		}
		for _, f := range bytes.Fields(l) {
			if bytes.IndexByte(f, ',') >= 0 && !commaNumber(f) {
				any = true // a comma that is not a decimal comma
			}
		}
	}
	if !any && len(lines) > 1 {
		// Runs of blanks split a header "t[s] V[kn]" as well as "V [kn]":
		// they are taken only when the rows under the header are numbers
		// (a units row may come first).
		n := len(bytes.Fields(lines[0]))
		same := n >= 2
		numeric := 0
		for i, l := range lines[1:] {
			fs := bytes.Fields(l)
			if len(fs) != n {
				same = false
				break
			}
			all := true
			for _, f := range fs {
				if _, err := strconv.ParseFloat(string(bytes.Replace(f, []byte{','}, []byte{'.'}, 1)), 64); err != nil {
					all = false
				}
			}
			if all {
				numeric++
			} else if i > 0 {
				same = false
			}
		}
		if same && numeric > 0 {
			return ' ', true, fmt.Sprintf("%d fields on each line", n)
		}
	}
	for _, c := range cands {
		if countFields(lines[0], c) >= 2 {
			return c, false, "the header split by it, though not every line alike"
		}
	}
	return ',', false, "no delimiter found: one column"
}

// countFields counts the fields of a line split at c outside quotes.
func countFields(l []byte, c byte) int {
	n, quoted := 1, false
	for _, b := range l {
		switch {
		case b == '"':
			quoted = !quoted
		case b == c && !quoted:
			n++
		}
	}
	return n
}

// isUnitsRow reports whether the record just read is a row of units
// under the names: no field is a number or a timestamp, and at least one
// is a unit.
func (r *Reader) isUnitsRow() bool {
	if len(r.fields) != r.ncol {
		return false
	}
	units := 0
	for _, f := range r.fields {
		if len(f) == 0 {
			continue
		}
		if _, err := r.number(f); err == nil {
			return false
		}
		if timeLayout(string(f), r.opt.SlashDates) >= 0 || slashDate(string(f)) {
			return false
		}
		if numStart(f[0]) && string(f) != "-" && string(f) != "1" {
			return false // a number with a unit (12 kn), in a data row
		}
		c := Column{Text: unitCell(string(f))}
		if c.Text != "" && parseUnit(&c) == nil {
			units++
		}
	}
	return units > 0
}

// headSpec is a header field split into a channel name and a unit text.
type headSpec struct {
	field, name, unit string
	err               error
	aliased           bool
}

// columns sets up the columns to read from the header, the units row
// (nil if none) and the sampled data lines. Without Options.Columns every
// column of the file is listed, and one that cannot be read keeps its
// fault in Column.Fault, returned only when it is read (see refusal);
// with Options.Columns a fault in a column named there fails at once.
func (r *Reader) columns(head []string, line int, unitRow []string, sample [][]byte) error {
	specs := make([]headSpec, len(head))
	for i, h := range head {
		f := strings.TrimSpace(strings.TrimPrefix(h, "\ufeff"))
		s := headSpec{field: f}
		if unitRow != nil {
			s.name, s.unit = f, unitCell(unitRow[i])
			if !utf8.ValidString(f) {
				s.err = &Error{Field: f, Reason: "header field is not valid UTF-8"}
			}
		} else {
			s.name, s.unit, s.err = splitHeader(f)
		}
		if a, ok := r.opt.Aliases[f]; ok {
			s.name, s.aliased = a, true
		} else if a, ok := r.opt.Aliases[s.name]; ok && s.err == nil {
			s.name, s.aliased = a, true
		}
		specs[i] = s
	}
	// The columns to read, in the order asked.
	var idx []int
	if r.opt.Columns == nil {
		for i := range head {
			idx = append(idx, i)
		}
	} else {
		for _, want := range r.opt.Columns {
			found := -1
			for i, s := range specs {
				if s.name == want || s.field == want {
					if found >= 0 {
						return &Error{File: r.name, Line: line, Column: i + 1, Field: want, Reason: fmt.Sprintf("Options.Columns names both column %d and column %d: rename one with Options.Aliases", found+1, i+1), class: quantity.ErrInvalid}
					}
					found = i
				}
			}
			if found < 0 {
				names := make([]string, len(specs))
				for i, s := range specs {
					names[i] = strconv.Quote(s.name)
				}
				list := strings.Join(names, ", ")
				if len(list) > 400 {
					list = list[:400] + "…"
				}
				return &Error{File: r.name, Line: line, Field: want, Reason: "Options.Columns names no column of the file (columns: " + list + ")", class: quantity.ErrInvalid}
			}
			idx = append(idx, found)
		}
	}
	// Sampled fields of the columns read.
	samples := make([][]string, len(idx))
	for _, l := range sample {
		if r.splitLine(l) != nil || len(r.fields) != len(head) {
			continue
		}
		for k, i := range idx {
			f := r.fields[i]
			if !r.isMissing(f) {
				samples[k] = append(samples[k], string(f))
			}
		}
	}
	r.headLine = line
	for k, i := range idx {
		c, mul, add, layout, err := r.column(specs[i], i, line, unitRow != nil, samples[k])
		if err != nil {
			c.Fault = err
		}
		r.cols = append(r.cols, c)
		r.mul = append(r.mul, mul)
		r.add = append(r.add, add)
		r.layout = append(r.layout, layout)
	}
	r.idx = idx
	n := len(idx)
	r.active = make([]int, n)
	for k := range r.active {
		r.active[k] = k
	}
	r.started, r.startX, r.prev = make([]bool, n), make([]float64, n), make([]float64, n)
	r.labels, r.intern = make([][]string, n), make([]map[string]string, n)
	// The start of each Timestamp column, from its first sample.
	for k := range r.cols {
		if r.cols[k].Kind == Timestamp && r.cols[k].Fault == nil {
			if _, err := r.timeValue(k, []byte(samples[k][0])); err != nil {
				r.cols[k].Fault = &Error{File: r.name, Line: line, Column: idx[k] + 1, Field: short([]byte(samples[k][0])), Reason: err.Error()}
			}
			r.prev[k] = 0
		}
	}
	if r.opt.Columns != nil {
		// The columns were named: a fault in one fails the file now.
		if err := r.refusal(r.active); err != nil {
			return err
		}
		r.checked = true
	}
	return nil
}

// column sets up the column of header field s (column i of the file,
// from 0) from its sampled fields. It returns the column, SI = x·mul +
// add, the layout of a Timestamp column, and the column's fault if it
// cannot be read; the column is then listed as far as it was read.
func (r *Reader) column(s headSpec, i, line int, unitRow bool, sample []string) (c Column, mul, add float64, layout int, fault *Error) {
	c = Column{Name: s.name, Text: s.unit, Index: i + 1, Header: s.field}
	mul, layout = 1, -2
	if c.Name == "" {
		c.Name = s.field
	}
	if s.err != nil {
		e := s.err.(*Error)
		e.File, e.Line, e.Column = r.name, line, i+1
		return c, mul, add, layout, e
	}
	unitErr := error(nil)
	if c.Text != "" {
		unitErr = parseUnit(&c)
	}
	if unitErr != nil && !unitRow && slashed(s.field) {
		// "dp/dx": a name with a slash, not quantity/unit.
		c.Text, unitErr = "", nil
		if !s.aliased {
			c.Name = s.field
		}
	}
	physical := c.Text != "" && unitErr == nil && c.Unit.Dim() != units.One().Dim()
	kind, layout := r.kind(s.name, physical, sample)
	// "-" is no unit: times and text under it are read as under an
	// empty unit (an exporter writes "-" for a column with no unit).
	noUnit := c.Text == "" || c.Text == "-"
	if kind == Timestamp && layout == -1 && !noUnit && !(unitErr == nil && c.Unit.Dim() == quantity.Time && c.Unit.Factor() == 1 && !c.Gauge) {
		kind, layout = Number, -2 // an epoch in ms or days: a number in its unit
	}
	fail := func(reason string, err, class error) (Column, float64, float64, int, *Error) {
		c.Unit, c.Readings, c.Gauge = units.Unit{}, nil, false
		return c, 1, 0, -2, &Error{File: r.name, Line: line, Column: i + 1, Field: s.field, Reason: reason, Err: err, class: class}
	}
	if layout == slashUnread {
		reason := fmt.Sprintf("dates such as %q may be day/month or month/day: set Options.SlashDates to chanfile.DayFirst or chanfile.MonthFirst", short([]byte(sample[0])))
		if r.opt.SlashDates != SlashRefused {
			reason = fmt.Sprintf("dates such as %q are not all in one form read with Options.SlashDates (a four-digit year, then an optional clock time hh:mm or hh:mm:ss)", short([]byte(sample[0])))
		}
		c.Kind = Timestamp
		return fail(reason, nil, quantity.ErrInvalid)
	}
	c.Kind = kind
	if c.Kind != Number && unitErr != nil {
		// "Run tag": no unit, the whole field is the name.
		c.Unit, c.Readings, c.Gauge = units.One(), nil, false
		if !unitRow && !s.aliased && !strings.HasSuffix(s.field, "]") && !strings.HasSuffix(s.field, ")") {
			c.Name = s.field
		}
	}
	switch c.Kind {
	case Number:
		if c.Text == "" {
			if unitRow {
				return fail(fmt.Sprintf("no unit for the channel in the units row (line %d): write its unit there, or 1 or - for a dimensionless one", r.unitLine), nil, nil)
			}
			return fail(fmt.Sprintf("no unit for the channel: write %q for a dimensionless one", c.Name+" [1]"), nil, nil)
		}
		if unitErr != nil {
			return fail("not a unit", unitErr, nil)
		}
		// Unit.Of is x·factor + offset; the reader applies the same.
		mul, add = c.Unit.Factor(), c.Unit.Offset()
		if c.Gauge {
			ref := r.opt.Reference
			if ref.Dim() != quantity.Pressure || !(ref.Value() > 0) || math.IsInf(ref.Value(), 0) {
				return fail("a gauge pressure channel needs the absolute ambient pressure it was read against: set Options.Reference to the barometer reading (or units.StandardReference(), chosen explicitly)", units.ErrGauge, quantity.ErrInvalid)
			}
			add += ref.Value()
			c.Unit = units.MustParse("Pa")
		}
	case Timestamp:
		c.Unit = units.MustParse("s")
		c.Readings = []units.Reading{r.timeReading(layout, sample[0])}
	case Label:
		c.Unit = units.One()
		if len(sample) > 0 {
			c.Readings = append(c.Readings, units.Reading{From: sample[0], To: "a label", Note: "the column's first values are text, neither numbers nor times"})
		}
	}
	return c, mul, add, layout, nil
}

// refusal returns why the columns at ks (in Columns' order) cannot be
// read together, or nil: the first of them with a Fault, or the first
// whose channel name an earlier one has.
func (r *Reader) refusal(ks []int) error {
	seen := make(map[string]int, len(ks))
	for _, k := range ks {
		c := &r.cols[k]
		if c.Fault != nil {
			return c.Fault
		}
		if j, dup := seen[c.Name]; dup {
			return &Error{File: r.name, Line: r.headLine, Column: c.Index, Field: c.Header, Reason: fmt.Sprintf("channel %q is also column %d: rename one with Options.Aliases", c.Name, j)}
		}
		seen[c.Name] = c.Index
	}
	return nil
}

// kind tells a column's kind from its name and its sampled fields (the
// missing ones left out), and for a Timestamp column the layout (-1 for
// seconds since 1970).
func (r *Reader) kind(name string, physical bool, sample []string) (Kind, int) {
	if len(sample) == 0 {
		if name == "" {
			// An unnamed column with no values: the empty field after a
			// row-ending delimiter ("t [s];F [N];"), which many exports
			// write. It is read as an empty text column, not refused
			// for want of a unit.
			return Label, -2
		}
		return Number, -2
	}
	nums := 0
	for _, s := range sample {
		if _, err := r.number([]byte(s)); err == nil || errors.Is(err, strconv.ErrRange) {
			nums++
		}
	}
	if nums == len(sample) && epochName(name) {
		return Timestamp, -1
	}
	if nums > 0 {
		return Number, -2
	}
	l := timeLayout(sample[0], r.opt.SlashDates)
	if l >= 0 {
		for _, s := range sample[1:] {
			if _, err := time.Parse(timeLayouts[l].layout, s); err != nil {
				l = -1
				break
			}
		}
	}
	if l >= 0 {
		return Timestamp, l
	}
	if slashDate(sample[0]) {
		return Timestamp, slashUnread
	}
	if physical {
		// A channel with a unit: its text is a bad value, named on reading.
		return Number, -2
	}
	return Label, -2
}

// slashUnread marks a column of dates with slashes and no order given.
const slashUnread = -3

// timeReading says how a Timestamp column is read.
func (r *Reader) timeReading(layout int, first string) units.Reading {
	if layout < 0 {
		return units.Reading{From: first, To: "time in s from the first sample", Note: "seconds since 1970-01-01 UTC, as the column's name says"}
	}
	l := timeLayouts[layout]
	note := l.name
	switch {
	case !l.date:
		note += ", no date: the start is a time of day on no date, and a clock that goes back (midnight) is refused"
	case !l.zone && r.opt.Location == nil:
		note += ", no time zone written: read in UTC (set Options.Location)"
	case !l.zone:
		note += ", no time zone written: read in " + r.opt.Location.String()
	}
	return units.Reading{From: first, To: "time in s from the first sample", Note: note}
}

// timeValue reads one field of Timestamp column k as seconds from the
// column's start, setting the start at the first sample.
func (r *Reader) timeValue(k int, f []byte) (float64, error) {
	c := &r.cols[k]
	l := r.layout[k]
	if l < 0 {
		x, err := r.number(f)
		if err != nil || math.IsInf(x, 0) || math.IsNaN(x) || math.Abs(x) > 1e11 {
			return 0, errors.New("not a number of seconds since 1970 (within ±3000 years)")
		}
		if !r.started[k] {
			sec, frac := math.Modf(x)
			c.Start = time.Unix(int64(sec), int64(math.Round(frac*1e9))).UTC()
			r.startX[k], r.started[k] = x, true
		}
		return x - r.startX[k], nil
	}
	loc := r.opt.Location
	if loc == nil {
		loc = time.UTC
	}
	if len(f) > maxTimeLen {
		return 0, fmt.Errorf("not a timestamp written as the column's first (%s)", timeLayouts[l].name)
	}
	t, err := time.ParseInLocation(timeLayouts[l].layout, string(f), loc)
	if err != nil {
		return 0, fmt.Errorf("not a timestamp written as the column's first (%s)", timeLayouts[l].name)
	}
	if !r.started[k] {
		c.Start, r.started[k] = t, true
	}
	if y := t.Year() - c.Start.Year(); y > 250 || y < -250 {
		return 0, fmt.Errorf("more than 250 years from the first sample (%s)", c.Start.Format(time.RFC3339))
	}
	s := t.Sub(c.Start).Seconds()
	if !timeLayouts[l].date {
		if s < r.prev[k] {
			return 0, errors.New("the clock goes back: it may have passed midnight; log the date with the time (ISO 8601: 2026-03-04T00:00:05)")
		}
		r.prev[k] = s
	}
	return s, nil
}

// number reads a numeric field with the file's decimal mark.
func (r *Reader) number(f []byte) (float64, error) {
	point := r.decimal
	if point == 0 {
		point = '.'
	}
	if x, ok := plainDecimal(f, point); ok {
		return x, nil
	}
	if r.decimal == ',' {
		if bytes.IndexByte(f, '.') >= 0 {
			return 0, errDecimalPoint
		}
		r.num = append(r.num[:0], f...)
		if i := bytes.IndexByte(r.num, ','); i >= 0 {
			r.num[i] = '.'
		}
		f = r.num
	}
	return strconv.ParseFloat(string(f), 64)
}

// pow10 holds the powers of ten a float64 holds exactly.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15}

// plainDecimal reads, in place, the number a data system writes most
// often: an optional sign, digits, and at most one decimal mark point,
// with no exponent and at most 15 digits in all. Its digits are then an
// integer below 2⁵³ and its scale a power of ten, both exact in a
// float64, so one correctly rounded division gives the correctly rounded
// value, the very float64 strconv.ParseFloat returns. Any other field
// reports false and is read by ParseFloat.
func plainDecimal(f []byte, point byte) (float64, bool) {
	i, neg := 0, false
	if len(f) > 0 && (f[0] == '-' || f[0] == '+') {
		neg, i = f[0] == '-', 1
	}
	var mant uint64
	digits, frac := 0, -1
	for ; i < len(f); i++ {
		c := f[i]
		switch {
		case c >= '0' && c <= '9':
			mant = mant*10 + uint64(c-'0')
			digits++
			if frac >= 0 {
				frac++
			}
		case c == point && frac < 0:
			frac = 0
		default:
			return 0, false
		}
	}
	if digits == 0 || digits > 15 {
		return 0, false
	}
	x := float64(mant)
	if frac > 0 {
		x /= pow10[frac]
	}
	if neg {
		x = -x
	}
	return x, true
}

var errDecimalPoint = errors.New("a '.' in a number of a file whose decimal mark is ','")

// comment reports whether a line is a comment: it starts with '#',
// but not with a missing marker such as #N/A followed by a delimiter.
func (r *Reader) comment(b []byte) bool {
	if len(b) == 0 || b[0] != '#' {
		return false
	}
	for m := range r.missing {
		if len(m) > 0 && m[0] == '#' && bytes.HasPrefix(b, []byte(m)) {
			if len(b) == len(m) || strings.IndexByte(",;\t ", b[len(m)]) >= 0 || b[len(m)] == r.comma {
				return false
			}
		}
	}
	return true
}

// isMissing reports whether f is a missing marker.
func (r *Reader) isMissing(f []byte) bool {
	if len(f) > 0 && numStart(f[0]) {
		for _, m := range r.missNum {
			if bytes.Equal(f, m) {
				return true
			}
		}
		return false
	}
	return r.missing[string(f)]
}

// next reads the next record into r.fields, skipping comments and blank
// lines. It returns false at the end of the input.
func (r *Reader) next() (bool, error) {
	if r.hasPend {
		r.hasPend = false
		r.off += r.pendOff
		r.raw = r.pend
		return true, r.split(r.pend)
	}
	for {
		b, err := r.br.ReadSlice('\n')
		if err == bufio.ErrBufferFull {
			r.line++
			return false, &Error{File: r.name, Line: r.line, Reason: fmt.Sprintf("a line longer than %d bytes", MaxLineLen)}
		}
		if err != nil && err != io.EOF {
			return false, sourceError(r.name, r.line+1, err)
		}
		if len(b) == 0 && err == io.EOF {
			return false, nil
		}
		r.line++
		r.lineStart = r.off
		r.off += int64(len(b))
		b = bytes.TrimSuffix(b, []byte{'\n'})
		b = bytes.TrimSuffix(b, []byte{'\r'})
		if len(b) == 0 || r.comment(b) {
			if err == io.EOF {
				return false, nil
			}
			continue
		}
		r.raw = b
		return true, r.split(b)
	}
}

// splitLine splits a line into r.fields, as split does.
func (r *Reader) splitLine(b []byte) error { return r.split(b) }

// split splits one line into r.fields.
func (r *Reader) split(b []byte) error {
	r.fields = r.fields[:0]
	if r.blanks {
		start := -1
		for i, c := range b {
			blank := c == ' ' || c == '\t'
			switch {
			case blank && start >= 0:
				r.fields = append(r.fields, b[start:i])
				start = -1
			case !blank && start < 0:
				start = i
			}
		}
		if start >= 0 {
			r.fields = append(r.fields, b[start:])
		}
		return nil
	}
	if bytes.IndexByte(b, '"') < 0 {
		for {
			i := bytes.IndexByte(b, r.comma)
			if i < 0 {
				r.fields = append(r.fields, trim(b))
				return nil
			}
			r.fields = append(r.fields, trim(b[:i]))
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

// trim is bytes.TrimSpace, without its work for a field that starts
// and ends with a printable ASCII byte, as most fields do.
func trim(f []byte) []byte {
	if len(f) > 0 && f[0] > ' ' && f[0] < 0x7f && f[len(f)-1] > ' ' && f[len(f)-1] < 0x7f {
		return f
	}
	return bytes.TrimSpace(f)
}

// Offset returns the number of bytes of the file read so far, after a
// byte-order mark, for a progress display against the file's size. For a
// file decoded from UTF-16 or a code page it counts the bytes decoded,
// which run ahead of the lines read by at most MaxLineLen bytes.
func (r *Reader) Offset() int64 {
	if r.dec != nil {
		return r.dec.in
	}
	return r.off
}

// Columns returns the columns read, in the file's order or that of
// Options.Columns; their Missing counts grow as chunks are read. Without
// Options.Columns a column that cannot be read is listed too, with its
// Column.Fault.
func (r *Reader) Columns() []Column { return r.cols }

// Format returns how the file is read: its encoding, delimiter, decimal
// mark and whether it has a units row, with a Reading for each choice
// the Reader made rather than Options.
func (r *Reader) Format() Format { return r.format }

// Labels returns the labels of column k (in Columns' order) for the rows
// of the last chunk Read returned, "" for a missing one, or nil if the
// column is not a Label column. The slice is reused by the next Read.
func (r *Reader) Labels(k int) []string {
	if k < 0 || k >= len(r.cols) || r.cols[k].Kind != Label {
		return nil
	}
	return r.labels[k]
}

// Select makes Read fill only the columns at idx (in the order of
// Columns, from 0): the fields of the other columns are split off but
// never parsed, so a bad value there cannot fail the file, and their
// Series and Labels stay empty and their Missing counts stop growing.
// Columns still lists every column. Call it after NewReader, before or
// between Reads; an index out of range or given twice is an *Error of
// class quantity.ErrInvalid. Selecting a column whose header cannot be
// read returns its Column.Fault, and selecting two columns of one
// channel name the error saying so; the selection is then unchanged.
// Select(nil) reads no column.
func (r *Reader) Select(idx []int) error {
	seen := make([]bool, len(r.cols))
	for _, k := range idx {
		if k < 0 || k >= len(r.cols) || seen[k] {
			return &Error{File: r.name, Reason: "select: column index out of range or repeated", class: quantity.ErrInvalid}
		}
		seen[k] = true
	}
	var active []int
	for k, on := range seen { // in the order of Columns
		if on {
			active = append(active, k)
		}
	}
	if err := r.refusal(active); err != nil {
		return err
	}
	r.active, r.checked = active, true
	return nil
}

// Read reads up to rows rows (4096 if rows is not positive) into dst,
// one Series per column of Columns in SI (dst is grown to the number of
// columns and its storage reused), and returns the number of rows read.
// It returns io.EOF with 0 rows at the end of the file. A gauge column is
// absolute: its level plus Options.Reference. A Timestamp column is in
// seconds from its first sample; a Label column's Series is empty (its
// text is in Labels). A missing value is NaN. After Select, only the
// selected columns are parsed and filled; the others' Series are empty.
// When every column is read (no Options.Columns, no Select), the first
// Read refuses a file with a column that cannot be read (its
// Column.Fault) or two columns of one channel name, as NewReader
// refused it before columns could be selected after the header.
func (r *Reader) Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error) {
	if rows <= 0 {
		rows = 4096
	}
	dst, r.vals = filebase.Batch(dst, len(r.cols), r.vals)
	for j := range r.cols {
		r.labels[j] = r.labels[j][:0]
	}
	vals := r.vals
	n := 0
	var err error
	if !r.checked && !r.done {
		// Every column is read: one that cannot be fails the file.
		r.checked = true
		if e := r.refusal(r.active); e != nil {
			fe := *e.(*Error)
			fe.Reason += " (to read only the columns you need, name them in Options.Columns or choose them with Reader.Select)"
			err, r.done = &fe, true
		}
	}
	for n < rows && !r.done {
		var ok bool
		ok, err = r.next()
		if err != nil || !ok {
			r.done = true
			break
		}
		if len(r.fields) != r.ncol {
			err = &Error{File: r.name, Line: r.line, Reason: fmt.Sprintf("a row of %d fields, not the header's %d", len(r.fields), r.ncol)}
			r.done = true
			break
		}
	fields:
		for _, j := range r.active {
			i := r.idx[j]
			f := r.fields[i]
			col := &r.cols[j]
			if r.isMissing(f) {
				if col.Kind == Label {
					r.labels[j] = append(r.labels[j], "")
				} else {
					vals[j] = append(vals[j], math.NaN())
				}
				col.Missing++
				continue
			}
			switch col.Kind {
			case Label:
				if !utf8.Valid(f) {
					err = &Error{File: r.name, Line: r.line, Column: i + 1, Field: short(f), Reason: "a label that is not valid UTF-8: the file is probably in an 8-bit code page; read it with Options.Encoding = chanfile.Windows1252 (or chanfile.Latin1)"}
					break fields
				}
				m := r.intern[j]
				s, ok := m[string(f)]
				if !ok {
					s = string(f)
					if m == nil {
						m = map[string]string{}
						r.intern[j] = m
					}
					if len(m) < maxInterned {
						m[s] = s
					}
				}
				r.labels[j] = append(r.labels[j], s)
				continue
			case Timestamp:
				t, terr := r.timeValue(j, f)
				if terr != nil {
					err = &Error{File: r.name, Line: r.line, Column: i + 1, Field: short(f), Reason: terr.Error()}
					break fields
				}
				vals[j] = append(vals[j], t)
				continue
			}
			x, perr := r.number(f)
			if perr != nil || math.IsInf(x, 0) || math.IsNaN(x) {
				reason, class := "not a finite number", error(nil)
				all := r.opt.Columns == nil && len(r.active) == len(r.cols)
				switch text := textCell(f); {
				case errors.Is(perr, strconv.ErrRange):
					reason, class = "a number beyond the range of float64", quantity.ErrRange
				case perr == errDecimalPoint && !text:
					reason = perr.Error() + ": set Options.Decimal if the file's decimal mark is '.'"
				case withUnit(string(f)):
					reason = "a value with a unit in a data row: the unit belongs in the header"
				case text && len(f) <= 64:
					reason = fmt.Sprintf("not a finite number but text: if it marks a missing value, set Options.Missing = %s (or list it in Options.MissingValues)", strconv.Quote(string(f)))
					if all {
						reason += "; to read only the columns you need, name them in Options.Columns"
					}
				case all:
					reason = "not a finite number (to read only the columns you need, name them in Options.Columns)"
				}
				err = &Error{File: r.name, Line: r.line, Column: i + 1, Field: short(f), Reason: reason, class: class}
				break fields
			}
			if x == 0 && nonzero(f) {
				err = &Error{File: r.name, Line: r.line, Column: i + 1, Field: short(f), Reason: "a nonzero number too small for float64 (it would read as 0)", class: quantity.ErrRange}
				break fields
			}
			si := x*r.mul[j] + r.add[j]
			if math.IsInf(si, 0) || math.IsNaN(si) || x != 0 && x*r.mul[j] == 0 {
				err = &Error{File: r.name, Line: r.line, Column: i + 1, Field: short(f), Reason: fmt.Sprintf("the value in %s is beyond the range of float64 in SI units", col.Text), class: quantity.ErrRange}
				break fields
			}
			vals[j] = append(vals[j], si)
		}
		if err != nil {
			// The row in error is not part of the chunk.
			r.done = true
			for j := range vals {
				vals[j] = vals[j][:min(len(vals[j]), n)]
				r.labels[j] = r.labels[j][:min(len(r.labels[j]), n)]
			}
			break
		}
		n++
	}
	for j, c := range r.cols {
		if c.Kind == Label {
			dst[j] = quantity.NewSeries(vals[j][:0], c.Unit.Dim())
			continue
		}
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

// textCell reports whether a field of a number column is text, as a
// marker of a missing value is ("n.a.", "n/a", "ERR"): it has a letter
// and is not a number with either decimal mark (1.5e3, inf).
func textCell(f []byte) bool {
	if bytes.IndexFunc(f, func(c rune) bool { return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' }) < 0 {
		return false
	}
	if _, err := strconv.ParseFloat(string(f), 64); err == nil || errors.Is(err, strconv.ErrRange) {
		return false
	}
	if i := bytes.IndexByte(f, ','); i >= 0 {
		g := bytes.Clone(f)
		g[i] = '.'
		if _, err := strconv.ParseFloat(string(g), 64); err == nil || errors.Is(err, strconv.ErrRange) {
			return false
		}
	}
	return true
}

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
