package chanfile

import (
	"strings"
	"time"
)

// timeLayouts are the timestamp forms a Reader recognises, most specific
// first: ISO 8601 date and time (with T or a space, with or without a
// zone offset), ISO 8601 date alone, a day.month.year date and time (the
// dotted order is day first), and a clock time alone. A fractional second
// after the seconds, with a point or a comma, is read with every form
// that has seconds. A date written with slashes (03/04/2026) is not read:
// the order of day and month is ambiguous.
var timeLayouts = [...]struct {
	layout string
	zone   bool // the layout carries a zone offset
	date   bool // the layout carries a date
	name   string
}{
	{"2006-01-02T15:04:05Z07:00", true, true, "ISO 8601 date and time"},
	{"2006-01-02 15:04:05Z07:00", true, true, "ISO 8601 date and time"},
	{"2006-01-02T15:04:05", false, true, "ISO 8601 date and time"},
	{"2006-01-02 15:04:05", false, true, "ISO 8601 date and time"},
	{"2006-01-02T15:04Z07:00", true, true, "ISO 8601 date and time"},
	{"2006-01-02T15:04", false, true, "ISO 8601 date and time"},
	{"2006-01-02 15:04", false, true, "ISO 8601 date and time"},
	{"2006-01-02", false, true, "ISO 8601 date"},
	{"02.01.2006 15:04:05", false, true, "day.month.year date and clock time"},
	{"02.01.2006 15:04", false, true, "day.month.year date and clock time"},
	{"02.01.2006", false, true, "day.month.year date"},
	{"15:04:05", false, false, "clock time"},
	{"15:04", false, false, "clock time"},
}

// maxTimeLen bounds the length of a field tried as a timestamp.
const maxTimeLen = 64

// timeLayout returns the index of the first layout that reads s, or -1.
func timeLayout(s string) int {
	if len(s) > maxTimeLen || len(s) < 4 || !(s[0] >= '0' && s[0] <= '9') {
		return -1
	}
	if !strings.ContainsAny(s, ":-.") {
		return -1
	}
	for i, l := range timeLayouts {
		if _, err := time.ParseInLocation(l.layout, s, time.UTC); err == nil {
			return i
		}
	}
	return -1
}

// epochName reports whether a channel name says its numbers are seconds
// since 1970-01-01 UTC (Unix time): "epoch", "unix time", "posix".
func epochName(name string) bool {
	n := strings.ToLower(name)
	return strings.Contains(n, "epoch") || strings.Contains(n, "unix") || strings.Contains(n, "posix")
}
