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
// column. Values are read chunk by chunk, so a file of any length reduces
// in bounded memory. A file that is not valid Parquet gives an *Error; the
// decoder is guarded so that a damaged file cannot crash the caller.
//
// Writer writes Series in chosen units as optional DOUBLE columns in the
// order given (a NaN becomes a null), with zstd compression, row groups of
// Options.RowGroupRows rows, and the unit metadata.
package parquetfile
