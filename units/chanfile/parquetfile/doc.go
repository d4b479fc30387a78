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
// Readable columns are flat, not repeated, of physical type DOUBLE, FLOAT,
// INT32 or INT64 (a plain integer logical type is accepted; a DECIMAL, a
// timestamp or a date is refused, since the integer stored is not the value
// in the unit). A null, or a NaN, is a missing value, held as NaN and
// counted on the column; an infinite value is an error with the row and
// column; a value that overflows float64 in SI, or a nonzero one that
// underflows to 0, is an error matching quantity.ErrRange. Values are read chunk by chunk, so a file of any length reduces
// in bounded memory. A file that is not valid Parquet gives an *Error.
//
// Before anything is decoded, the footer (at most MaxFooterBytes) and
// every page header are checked. Their Thrift structure is walked first:
// no string or list may declare more than the bytes that hold it, and the
// footer's lists may not decode to more than 256 MiB. A page may hold at most MaxPageBytes,
// compressed or not, and its decompressed size is bounded from its own
// headers. What a compressed frame declares is checked too, since a
// decoder allocates it at once: a zstd frame's content size and window, a
// snappy block's length, none may exceed MaxPageBytes or the page's
// uncompressed size. The rows the footer and the row groups declare must
// agree with each other and with the values of the pages, so NumRows is
// no larger than what the pages hold; and Read takes memory for the rows
// it reads, never for the rows it is asked for. Pages compressed with ZSTD or SNAPPY, or not compressed, are
// read; GZIP, LZ4 and BROTLI pages are refused with a message, since
// their decoders' memory cannot be bounded in advance (a damaged LZ4 block
// makes the decoder grow its buffer without end). Encrypted files and
// data in other files are refused. A panic left in the decoder becomes an
// *Error, so a damaged file cannot crash the caller.
//
// Writer writes Series in chosen units as optional DOUBLE columns in the
// order given (a NaN becomes a null), with zstd compression, row groups of
// Options.RowGroupRows rows, and the unit metadata. It refuses what Reader
// would not read back: an infinite value, a value that is not a finite
// float64 in its column's unit, a name that is not valid UTF-8.
//
// Every error matches exactly one class of package quantity under
// errors.Is (see Error).
package parquetfile
