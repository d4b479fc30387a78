// Package parquetfile reads and writes channel files in Apache Parquet,
// with the unit of every column stored in the file's key-value metadata,
// so a reduced data set keeps its units without a side file.
//
// Each column's unit is held under the key "similis.unit.<column name>"
// in the footer's key-value metadata, written in the strict unit syntax of
// package units ("m/s", "kg/m^3", "1" for a dimensionless group). The
// Parquet format also has key-value metadata on each column chunk, but the
// Parquet library used here does not write it, and a file-level entry per
// column is read by every Parquet tool; the key names the column, so the
// unit travels with the column's name.
//
// A file from elsewhere that has no unit metadata can still be read: the
// unit is taken from Options.Units, or from a column name that carries one
// the way a channel-file header does ("V [kn]", "Q m3/h"); a column with
// no unit from either is refused rather than taken as dimensionless. Unit
// text from any of the three is read with the data-sheet dialect of
// package units, and the readings are kept on the Column, as in package
// chanfile.
//
// A Reader is a chanfile.Source and a chanfile.Selector: chanfile.ReadAll
// reads a small file whole (labels included, up to a bound of rows), and
// package similarity/reduction reduces a file of any length chunk by
// chunk.
//
// # What is read
//
// A caller may name the columns it wants (Options.Columns); the others
// are never decoded, nor their pages checked, so a column of a type or a
// compression not read, or a damaged one, does not fail the file unless
// it is asked for. With no names, every column is listed: one the reader
// cannot read (a type or a unit it does not read, a gauge column with no
// reference, pages the check below refuses) carries its error in
// chanfile.Column.Fault and fails the first Read, unless Reader.Select,
// called after NewReader with the columns a caller found it needs in the
// schema, leaves it out (Reader is a chanfile.Selector); selecting it
// returns its Fault. Select never decodes the columns it leaves out;
// NewReader checked the pages of every column of a type it reads, and a
// column whose pages fail the check is listed with its fault rather than
// failing the file.
//
// A column read is flat, not repeated, and one of four kinds (Kind):
//
//   - Number: DOUBLE, FLOAT, INT32 or INT64, with a plain integer
//     logical or converted type or none, or a DECIMAL stored as INT32,
//     INT64, FIXED_LEN_BYTE_ARRAY or BYTE_ARRAY (at most 16 bytes, 38
//     digits). A DECIMAL is unscaled × 10^−scale, converted to float64
//     once: the float64 nearest the exact decimal (a DECIMAL(9,3) 12345 is
//     12.345 as the literal 12.345 is), then to SI by its unit, which
//     comes from the metadata, Options.Units or the name as for any
//     number. An integer beyond ±2⁵³ is refused, since it would not be
//     exact; a DECIMAL is rounded as said. A BOOLEAN is a number too,
//     1 for true and 0 for false, dimensionless (unit one, stated in a
//     Reading), so that a logged state (a valve open, a carriage
//     running) reads as the 0/1 channel a text export writes and its
//     mean over a window is the fraction of the window it was true. Its
//     name may carry the unit one ("valve [1]"); another unit in
//     brackets or parentheses, or in the metadata, is refused.
//   - Time: a TIMESTAMP (MILLIS, MICROS or NANOS; adjusted to UTC or
//     not), a DATE, or a legacy INT96 timestamp, read as seconds (unit
//     s) from the column's first sample, exact to one rounding of the
//     tick count; Reader.Origin keeps that sample's instant and says
//     whether the file stores it in UTC or as a wall-clock reading of no
//     stated zone. An INT96 is 8 bytes of nanoseconds within the day and
//     4 of the Julian day number (2440588 is 1970-01-01), both
//     little-endian, as the older writers define it; it states no zone
//     (writers differ), so its Origin is not marked UTC, and nanoseconds
//     outside one day are refused (ErrRange). Instants more than 2⁵³
//     ticks from the first (for INT96, 2⁵³ ns, about 104 days) are
//     refused (ErrRange). A unit given to a time column is refused, not
//     applied.
//   - TimeOfDay: a TIME (MILLIS in an INT32, MICROS or NANOS in an
//     INT64, or the older TIME_MILLIS and TIME_MICROS, adjusted to UTC)
//     read as seconds since midnight (unit s), with no date and no
//     Origin; a Reading states it. A value outside 0 to 24 h is refused
//     (ErrRange).
//   - Label: a STRING, UTF8 or ENUM, read as text by Reader.Labels, one
//     string a row; the column's Series from Read is empty. A label that
//     is not valid UTF-8 is refused.
//
// Refused, with the column named: a BYTE_ARRAY or FIXED_LEN_BYTE_ARRAY
// with no logical type, JSON, BSON, UUID, INTERVAL and the other
// logical types, nested groups and repeated columns: their stored bytes
// are not a value in a unit. Such a column, or one with no unit or a
// gauge column with no reference, is listed by Reader.Columns with its
// error in chanfile.Column.Fault when Options.Columns is not given.
//
// A unit stated twice must agree: a unit in the metadata, or in
// Options.Units, that differs from the unit the column's name carries
// ("V [kn]" with "m/s") is refused with both named; the metadata and
// Options.Units together are refused in any case. A name written as a
// function of a channel, u(F) or n_eff(V) (a word and a parenthesis with
// no blank between), carries no unit when the metadata gives one, though
// F and V are unit symbols too.
//
// A null, or a NaN, is a missing value, held as NaN (an empty label) and
// counted on the column; an infinite value is an error with the row and
// column; a value that overflows float64 in SI, or a nonzero one that
// underflows to 0, is an error matching quantity.ErrRange. Values are
// read chunk by chunk, so a file of any length reduces in bounded memory.
// A file that is not valid Parquet gives an *Error.
//
// # Bounded reading
//
// Before anything is decoded, the footer (at most MaxFooterBytes) and
// every page header of the columns read are checked. Their Thrift
// structure is walked first: no string or list may declare more than the
// bytes that hold it, and the footer's lists may not decode to more than
// 256 MiB. A page may hold at most MaxPageBytes, compressed or not, and
// its decompressed size is bounded from its own headers. What a
// compressed frame declares is checked too, since a decoder allocates it
// at once: a zstd frame's content size and window, a snappy block's
// length, none may exceed MaxPageBytes or the page's uncompressed size. A
// gzip stream declares no size: it is inflated in the check, into
// nothing, to the page's declared uncompressed size and one byte more, and
// refused if it reaches it, so a small page that inflates far beyond its
// size is never held. Counts inside a page are checked as well, since the
// decoder allocates what they declare: the runs of definition levels and
// of dictionary indices, and the value count of a DELTA_BINARY_PACKED or
// DELTA_LENGTH_BYTE_ARRAY header, may not declare more values than the
// page; numbers encoded RLE or BIT_PACKED (defined for booleans only) and
// DELTA_BYTE_ARRAY, whose decoded size the page does not bound, are
// refused. Booleans encoded RLE are read when their runs declare no more
// values than the page and are runs the decoder reads right: it expands
// a repeated run into whole bytes, each a copy of the run's value byte,
// so a run of true written as the byte 1 (as the format writes it,
// where the Parquet library used here writes 0xFF), or a run that is
// not the last and not a multiple of 8 values, would be misread, and
// is refused with a message rather than read wrong; booleans written
// PLAIN are always read. The rows the footer and the row groups declare must agree with
// each other and with the values of the pages, so NumRows is no larger
// than what the pages hold; and Read takes memory for the rows it reads,
// never for the rows it is asked for. Pages compressed with ZSTD, SNAPPY
// or GZIP, or not compressed, are read; LZ4 and BROTLI pages are refused
// with a message, since their decoders' memory cannot be bounded in
// advance (a damaged LZ4 block makes the decoder grow its buffer without
// end). Encrypted files and data in other files are refused. A panic left
// in the decoder becomes an *Error, so a damaged file cannot crash the
// caller.
//
// Writer writes Series in chosen units as optional DOUBLE columns in the
// order given (a NaN becomes a null), with zstd compression, row groups of
// Options.RowGroupRows rows, the unit metadata and the further entries
// of Options.Metadata (a test's group definitions, read back by
// Reader.Metadata; a key starting with UnitKey is refused). It refuses what Reader
// would not read back: an infinite value, a value that is not a finite
// float64 in its column's unit, a name that is not valid UTF-8.
//
// Every error matches exactly one class of package quantity under
// errors.Is (see Error).
package parquetfile
