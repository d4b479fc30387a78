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
// Values are read into quantity.Series in SI, chunk by chunk, so a file of
// any length reduces in bounded memory. An empty field, NA, NaN or the
// Options' missing marker is a missing value: it is held as NaN and
// counted per column, never dropped. Every other field that is not a
// finite number is an error that names the file, line and column. A
// number read is the number written: one beyond the range of float64
// (1e999), a nonzero one too small for it (1e-400, which would read as
// 0), or one whose value in SI overflows or underflows (1e308 in km) is
// an error matching quantity.ErrRange, never ±Inf or 0.
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
