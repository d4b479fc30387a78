package numlex

import (
	"math"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/google/go-cmp/cmp"
)

func TestScan(t *testing.T) {
	type out struct {
		Text   string
		End    int
		Reason string
		At     int
	}
	cases := []struct {
		in   string
		mode Mode
		want out
	}{
		{"1000 m", 0, out{"1000", 4, "", 0}},
		{"1.2.3", 0, out{"1.2.3", 5, "", 0}},
		{"3.2e-3 Pa", 0, out{"3.2e-3", 6, "", 0}},
		{"2e m", 0, out{"2", 1, "", 0}},
		{"2e-x", 0, out{"2", 1, "", 0}},
		{"-5", 0, out{"", 0, "", 0}},
		{"-5 K", Signed | Grouped, out{"-5", 2, "", 0}},
		{"1.5e3", NoExponent, out{"1.5", 3, "", 0}},
		{"101\u2009325 Pa", Signed | Grouped, out{"101325", 9, "", 0}},
		{"1\u202f000.125\u20095", Signed | Grouped, out{"1000.1255", 15, "", 0}},
		{"1.2.3", Signed | Grouped, out{"1.2", 3, "", 0}},
		{"1234\u2009567", Signed | Grouped, out{"", 0, errGroups, 4}},
		{"12\u200934", Signed | Grouped, out{"", 0, errGroups, 7}},
		{"12\u2009 m", Signed | Grouped, out{"", 0, "a thin space must stand between two digits", 2}},
		{"+ 5", Signed | Grouped, out{"", 0, "expected a number", 0}},
		{"1\u2009000e3", Signed | Grouped, out{"1000e3", 9, "", 0}},
	}
	for _, c := range cases {
		n, err := Scan(c.in, c.mode)
		got := out{Text: n.Text, End: n.End}
		if err != nil {
			got.Reason, got.At = err.Reason, err.Offset
		}
		if diff := cmp.Diff(c.want, got); diff != "" {
			t.Errorf("Scan(%q, %d) (-want +got):\n%s", c.in, c.mode, diff)
		}
	}
}

func TestFloat(t *testing.T) {
	cases := []struct {
		in    string
		x     float64
		class Class
	}{
		{"1.5", 1.5, OK},
		{"0.000", 0, OK},
		{"0e-400", 0, OK},
		{"1e-400", 0, Underflow},
		{"0.001e-400", 0, Underflow},
		{"5e-324", 5e-324, OK}, // the least subnormal float64
		{"1e400", 0, Overflow},
		{"1.2.3", 0, Malformed},
		{".", 0, Malformed},
		{"", 0, Malformed},
		{"Inf", 0, Malformed},
		{"NaN", 0, Malformed},
	}
	for _, c := range cases {
		x, class := Float(c.in)
		if x != c.x || class != c.class {
			t.Errorf("Float(%q) = %v, %d; want %v, %d", c.in, x, class, c.x, c.class)
		}
	}
}

// The lexers the module had before this one, kept as oracles: Scan must
// find the same numbers, refuse the same text and read it the same.

// oldRun is the unit parser's and the formula parser's number span.
func oldRun(s string) int {
	j := 0
	for j < len(s) && (s[j] >= '0' && s[j] <= '9' || s[j] == '.') {
		j++
	}
	if j < len(s) && (s[j] == 'e' || s[j] == 'E') {
		k := j + 1
		if k < len(s) && (s[k] == '+' || s[k] == '-') {
			k++
		}
		if k < len(s) && s[k] >= '0' && s[k] <= '9' {
			for k < len(s) && s[k] >= '0' && s[k] <= '9' {
				k++
			}
			j = k
		}
	}
	return j
}

// oldDecimal is the formula parser's exact-exponent span.
func oldDecimal(s string) int {
	j := 0
	for j < len(s) && (s[j] >= '0' && s[j] <= '9' || s[j] == '.') {
		j++
	}
	return j
}

// oldValue is the value reader's lexer.
func oldValue(t string) (num string, end int, reason string) {
	var sb []byte
	j := 0
	if j < len(t) && (t[j] == '+' || t[j] == '-') {
		sb = append(sb, t[j])
		j++
	}
	group, grouped, frac, digits := 0, false, false, 0
	for j < len(t) {
		c := t[j]
		switch {
		case c >= '0' && c <= '9':
			sb = append(sb, c)
			group++
			digits++
			j++
			continue
		case c == '.' && !frac:
			if grouped && group != 3 {
				return "", j, errGroups
			}
			sb = append(sb, c)
			frac, grouped, group = true, false, 0
			j++
			continue
		}
		r, n := utf8.DecodeRuneInString(t[j:])
		if r != '\u2009' && r != '\u202f' {
			break
		}
		k := j + n
		if group == 0 || k >= len(t) || t[k] < '0' || t[k] > '9' {
			return "", j, "a thin space must stand between two digits"
		}
		if frac || grouped {
			if group != 3 {
				return "", j, errGroups
			}
		} else if group > 3 {
			return "", j, errGroups
		}
		grouped, group = true, 0
		j = k
	}
	if grouped && !frac && group != 3 {
		return "", j, errGroups
	}
	if digits == 0 {
		return "", 0, "expected a number"
	}
	if j < len(t) && (t[j] == 'e' || t[j] == 'E') {
		k := j + 1
		if k < len(t) && (t[k] == '+' || t[k] == '-') {
			k++
		}
		if k < len(t) && t[k] >= '0' && t[k] <= '9' {
			for k < len(t) && t[k] >= '0' && t[k] <= '9' {
				k++
			}
			sb = append(sb, t[j:k]...)
			j = k
		}
	}
	return string(sb), j, ""
}

// oldFloat is how the readers classed the text they found.
func oldFloat(text string) (float64, Class) {
	x, err := strconv.ParseFloat(text, 64)
	switch {
	case err != nil && err.(*strconv.NumError).Err == strconv.ErrRange:
		return 0, Overflow
	case err != nil || math.IsInf(x, 0) || math.IsNaN(x):
		return 0, Malformed
	case x == 0 && strings.ContainsAny(strings.SplitN(strings.ToLower(text), "e", 2)[0], "123456789"):
		return 0, Underflow
	}
	return x, OK
}

// FuzzScan: on any text, Scan in each mode agrees with the lexer it
// replaced, and Float with the readers' classes; nothing panics.
func FuzzScan(f *testing.F) {
	for _, s := range []string{"1000 m", "1.2.3", "3.2e-3 Pa", "2e m", "-5 K", "+.5", "101\u2009325 Pa",
		"1\u202f000.125\u20095", "1234\u2009567", "12\u2009 m", "1e-400", "1e400", "0e-400", ".", "1.5e+", "9.80665 {m/s^2}", "\u2009"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		n, err := Scan(s, 0)
		if err != nil || n.End != oldRun(s) || n.Text != s[:n.End] {
			t.Fatalf("Scan(%q, 0) = %+v, %v; want end %d", s, n, err, oldRun(s))
		}
		n, err = Scan(s, NoExponent)
		if err != nil || n.End != oldDecimal(s) || n.Text != s[:n.End] {
			t.Fatalf("Scan(%q, NoExponent) = %+v, %v; want end %d", s, n, err, oldDecimal(s))
		}
		text, end, reason := oldValue(s)
		n, err = Scan(s, Signed|Grouped)
		if err != nil {
			if err.Reason != reason || err.Offset != end {
				t.Fatalf("Scan(%q, Signed|Grouped) refused at %d: %s; the old lexer: %d %q", s, err.Offset, err.Reason, end, reason)
			}
		} else if reason != "" || n.Text != text || n.End != end {
			t.Fatalf("Scan(%q, Signed|Grouped) = %+v; the old lexer: %q %d %q", s, n, text, end, reason)
		}
		for _, text := range []string{s, n.Text} {
			x, c := Float(text)
			ox, oc := oldFloat(text)
			if c != oc || x != ox && !(math.IsNaN(x) && math.IsNaN(ox)) {
				t.Fatalf("Float(%q) = %v, %d; the readers had %v, %d", text, x, c, ox, oc)
			}
		}
	})
}
