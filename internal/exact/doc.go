// Package exact holds the exact algorithms shared by pigroups and
// similarity: elimination, rank, null space and solution of small
// matrices over an exact number type (quantity.Rat, through the Field
// constraint), and fraction-free Gauss–Jordan elimination of int64
// matrices, with the overflow-checked int64 arithmetic they rest on, and
// the one integer power of a float64 (PowInt). No
// floating tolerance is used; an overflow is an error, so a result is
// either exact or refused. It holds algorithms only: its types never
// appear in an exported signature of the module.
package exact
