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
// that has seconds. A date written with slashes (03/04/2026) is read only
// with Options.SlashDates, since the order of day and month is ambiguous.
var timeLayouts = [...]struct {
	layout string
	zone   bool // the layout carries a zone offset
	date   bool // the layout carries a date
	name   string
	order  DateOrder // for a date with slashes, the order it is read in
}{
	{"2006-01-02T15:04:05Z07:00", true, true, "ISO 8601 date and time", 0},
	{"2006-01-02 15:04:05Z07:00", true, true, "ISO 8601 date and time", 0},
	{"2006-01-02T15:04:05", false, true, "ISO 8601 date and time", 0},
	{"2006-01-02 15:04:05", false, true, "ISO 8601 date and time", 0},
	{"2006-01-02T15:04Z07:00", true, true, "ISO 8601 date and time", 0},
	{"2006-01-02T15:04", false, true, "ISO 8601 date and time", 0},
	{"2006-01-02 15:04", false, true, "ISO 8601 date and time", 0},
	{"2006-01-02", false, true, "ISO 8601 date", 0},
	{"2006-01-02 15:04:05 -0700", true, true, "date and time with a zone offset", 0},
	{"2006/01/02 15:04:05", false, true, "year/month/day date and clock time", 0},
	{"2006/01/02 15:04", false, true, "year/month/day date and clock time", 0},
	{"2006/01/02", false, true, "year/month/day date", 0},
	{"2.1.2006 15:04:05", false, true, "day.month.year date and clock time", 0},
	{"2.1.2006 15:04", false, true, "day.month.year date and clock time", 0},
	{"2.1.2006", false, true, "day.month.year date", 0},
	{"15:04:05", false, false, "clock time", 0},
	{"15:04", false, false, "clock time", 0},
	{"2/1/2006 15:04:05", false, true, "day/month/year date and clock time", DayFirst},
	{"2/1/2006 15:04", false, true, "day/month/year date and clock time", DayFirst},
	{"2/1/2006", false, true, "day/month/year date", DayFirst},
	{"1/2/2006 15:04:05", false, true, "month/day/year date and clock time", MonthFirst},
	{"1/2/2006 15:04", false, true, "month/day/year date and clock time", MonthFirst},
	{"1/2/2006", false, true, "month/day/year date", MonthFirst},
}

// DateOrder is the order of day and month in a date written with
// slashes, which the file cannot tell (03/04/2026).
type DateOrder uint8

// The orders of a date with slashes. The zero value refuses such a date.
const (
	SlashRefused DateOrder = iota // a date with slashes is refused, naming this option
	DayFirst                      // 03/04/2026 is 3 April 2026
	MonthFirst                    // 03/04/2026 is 4 March 2026
)

// slashDate reports whether s starts as a date with slashes: 3/4/2026,
// 03/04/26.
func slashDate(s string) bool {
	parts := strings.SplitN(s, "/", 3)
	if len(parts) != 3 {
		return false
	}
	digits := func(p string, lo, hi int) bool {
		if len(p) < lo || len(p) > hi {
			return false
		}
		for i := 0; i < len(p); i++ {
			if p[i] < '0' || p[i] > '9' {
				return false
			}
		}
		return true
	}
	y, _, _ := strings.Cut(parts[2], " ")
	return digits(parts[0], 1, 2) && digits(parts[1], 1, 2) && digits(y, 2, 4)
}

// maxTimeLen bounds the length of a field tried as a timestamp.
const maxTimeLen = 64

// timeLayout returns the index of the first layout that reads s, or -1.
func timeLayout(s string, order DateOrder) int {
	if len(s) > maxTimeLen || len(s) < 4 || !(s[0] >= '0' && s[0] <= '9') {
		return -1
	}
	if !strings.ContainsAny(s, ":-./") {
		return -1
	}
	for i, l := range timeLayouts {
		if l.order != 0 && l.order != order {
			continue
		}
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
