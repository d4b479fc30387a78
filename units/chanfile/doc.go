// Package chanfile reads and writes delimited text files of logged test
// channels (CSV or TSV) whose header row carries each channel's name and
// unit, as an acquisition system writes them:
//
//	# pump loop, run 12 (comment lines start with #)
//	t [s], Q m3/h, P1 (kPa), T_in °F, Torque (in-lb), n [rpm]
//	0.0, 41.2, 212.5, 68.0, 84.1, 1450
//
// A header field is a name followed by a unit in brackets ("V [kn]"), in
// parentheses ("Torque (in-lb)"), or after the last space ("Q m3/h").
// Units are read with the data-sheet dialect of package units
// (units.ParseDialect), and every lenient reading is kept on the Column so
// a reduced data set records its interpretation. A dimensionless channel
// is written "Re [1]" or "Re [-]"; a name with no unit is refused rather
// than taken as dimensionless. A gauge pressure channel (psig, barg,
// kPa(g)) is refused unless a reference pressure is given in Options, in
// which case it is read as absolute and the column says so.
//
// A file is read as a data system exports it. With no options the
// Reader looks at the first lines (at most SniffLines lines in SniffBytes
// bytes) and detects the delimiter (tab, ';', ',' or runs of blanks) and
// the decimal mark ('.' or ','), and reports each choice as a Reading of
// Reader.Format; an option overrides it. The units may follow each name
// ("V [kn]", "V (kn)", "Q m3/h", or the quantity/unit heading "V/kn" of
// ISO 80000-1) or stand in a row under the names ("[kn]", "kn", "-"). In
// a units row a column of numbers needs its unit, or 1 or "-" when it is
// dimensionless; a timestamp or label column takes an empty cell or
// "-", which an exporter writes for "no unit": under either, the
// column's values tell whether it holds numbers, times or text. The
// same holds for "[-]" in a header field. The
// file may be UTF-8, with or without a byte-order mark, or UTF-16 with
// one; a file in an 8-bit code page (0xB0 for °) is refused with the
// option that reads it (Options.Encoding = Windows1252 or Latin1).
//
// A column is a Number, a Timestamp or a Label, told from its first
// values. Timestamps (ISO 8601 date and time, a dotted day.month.year
// date, a clock time alone, or seconds since 1970 in a column named
// epoch, unix or posix) are read as seconds from the first sample, the
// absolute start kept in Column.Start; text (a run tag) is kept as labels
// (Reader.Labels). Options.Columns names the columns wanted: the others
// are skipped without parsing, so a bad cell or an unknown unit there
// cannot fail the file; Reader.Select does the same for columns chosen
// after the header is read (Reader is a Selector), before any data row
// is parsed. Options.Aliases renames a column ("Pump speed" to
// n), and Options.MissingValues sets the missing markers (#N/A, -9999,
// ---, the empty field).
//
// A column whose header cannot be read (a unit the dialect does not
// read, as "Temp [degF?]", a name with no unit, a malformed field, a
// gauge channel with no reference, dates of no stated order) does not
// fail NewReader: Reader.Columns lists it with its header as written
// and its Column.Fault, an *Error naming the line, the column and the
// fix. Selecting it (Options.Columns, Reader.Select, Select) returns
// that error; so does selecting two columns of one channel name. When
// every column is read, with no Options.Columns and no Select, the
// first Read refuses the file as NewReader did before, and says how to
// leave the column out. A fault of the whole file still fails it
// whatever is selected: bytes that are not text in the encoding read, a
// decimal mark that cannot be told, a line longer than MaxLineLen, a row
// of another number of fields than the header, a quoted field left open.
//
// Values are read into quantity.Series in SI, chunk by chunk, so a file of
// any length reduces in bounded memory. An empty field, NA, NaN, #N/A or the
// Options' missing markers is a missing value: it is held as NaN and
// counted per column, never dropped. Every other field that is not a
// finite number is an error that names the file, line and column; one
// that is text ("n.a.", "ERR") names the option that would read it as
// missing (Options.Missing = "n.a."). A
// number read is the number written: one beyond the range of float64
// (1e999), a nonzero one too small for it (1e-400, which would read as
// 0), or one whose value in SI overflows or underflows (1e308 in km) is
// an error matching quantity.ErrRange, never ±Inf or 0.
//
// ReadAll reads a file small enough to hold in memory whole (a steady
// test of a few minutes, a zero file) into one Series per column and the
// text of its label columns, refusing a file of more rows than the bound
// it is given. Whole.Channel gives a column of numbers by name for
// package steady (steady.Runs, steady.TimeWindows, steady.Channel) and
// refuses a text column, whose Series is empty; the text of a run tag
// logged as text is in Whole.Labels, and steady.TextRuns finds its runs:
//
//	f, err := os.Open("rig.csv")
//	// handle err; defer f.Close()
//	r, err := chanfile.NewReader(f, "rig.csv", chanfile.Options{})
//	w, err := chanfile.ReadAll(r, 1_000_000) // refuses a longer file
//	q, err := w.Channel("Q")                 // numbers, in SI (m³/s)
//	runs := steady.TextRuns(w.Labels[w.Index("Bemerkung")]) // a text run tag
//
// The package doc of steady carries this on to the steady points.
// Package similarity/reduction runs the whole pipeline of a test on any
// Source — choosing the columns, finding and reducing the steady points
// in bounded memory, the zero, the calibrations and the dimensionless
// groups with their uncertainty — and is the place to start for a file
// of any length.
//
// Writer writes Series back in chosen units with a header Reader reads
// back, and numbers in the shortest form that reads back to the same
// float64. A missing value is written as MissingText ("NaN"), so that a
// file of one column keeps the row (an empty field there would be a blank
// line). Writer refuses what Reader would not read back: a column name
// that does not come back the same through the header (a newline, a
// first name starting with '#', surrounding space), an infinite value, a
// value that is not a finite float64 in its column's unit.
//
// Every error of the package matches exactly one class of package
// quantity under errors.Is (see Error); a failed read or write of the
// underlying file is an *Error naming the file, with the I/O error kept.
package chanfile
