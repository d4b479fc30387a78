// Package filebase holds what the channel-file packages (chanfile and
// parquetfile) share: how their errors match a class of package quantity
// and end their messages, and how Read reuses the caller's Series.
package filebase

import (
	"strings"

	"similis.dev/similis/quantity"
)

// ClassOf returns the class of package quantity that err matches under
// errors.Is (ErrDimension, ErrRange, ErrParse, ErrUnknown or ErrInvalid),
// or nil if it matches none.
func ClassOf(err error) error { return quantity.ClassOf(err) }

// Is is the Is method of a file error whose underlying error is err and
// whose own class is class (nil meaning quantity.ErrParse): it reports
// whether target is that class, and is false for every target when err
// has a class of its own, which errors.Is then finds on err. So the error
// matches exactly one class.
func Is(err, class, target error) bool {
	if err != nil && ClassOf(err) != nil {
		return false
	}
	if class == nil {
		return target == quantity.ErrParse
	}
	return target == class
}

// Finish ends a file error's message in sb with reason and, when err is
// not nil, ": " and err's message, and returns the message.
func Finish(sb *strings.Builder, reason string, err error) string {
	sb.WriteString(reason)
	if err != nil {
		sb.WriteString(": ")
		sb.WriteString(err.Error())
	}
	return sb.String()
}

// Batch readies dst for a Read of n columns: it grows dst to n Series
// (keeping their storage) and returns it with vals, allocated when it
// is shorter than n, holding each Series' values emptied, for Read to append to.
func Batch(dst []quantity.Series, n int, vals [][]float64) ([]quantity.Series, [][]float64) {
	for len(dst) < n {
		dst = append(dst, quantity.Series{})
	}
	dst = dst[:n]
	if len(vals) < n {
		vals = make([][]float64, n)
	}
	for j := range dst {
		vals[j] = dst[j].Values()[:0]
	}
	return dst, vals
}
