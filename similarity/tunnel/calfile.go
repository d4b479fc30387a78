package tunnel

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/units"
)

// Bounds on a calibration file: ParseCalibration reads at most
// MaxCalibrationBytes and refuses a longer file, and a line of more than
// MaxCalibrationLine bytes.
const (
	MaxCalibrationBytes = 1 << 16
	MaxCalibrationLine  = 1024
)

// ParseCalibration reads a balance calibration in the package's own
// plain-text format. Each line is a keyword and its fields separated by
// spaces or tabs; '#' starts a comment; blank lines are ignored:
//
//	similis-balance 1
//	name       B-12, six components (invented)
//	form       readings-from-loads         # or loads-from-readings
//	readings   mV/V                        # the readings' unit: dimensionless
//	component  NF  N    -2000  2000        # name, load unit, calibrated min and max
//	component  PM  N*m  -120   120
//	linear     NF  0.9   0.01              # n first-order terms
//	linear     PM  0.002 1.5
//	quadratic  NF  1e-6 0 2e-7             # n(n+1)/2 second-order terms, optional
//
// The first line other than comments is "similis-balance 1" (the format
// and its version). name (free text, optional), form and readings come
// once each; then one component line per component, in the order of the
// readings and of the matrix columns; then, for each component, one
// linear line and at most one quadratic line (none means zero
// second-order terms). The components are NF, AF, SF, RM, PM, YM (see
// Component); a force's unit must be a force (N, kN, lbf) and a moment's
// a torque (N*m, in*lbf); the readings' unit must be dimensionless (mV/V,
// uV/V). The matrix's row of a component i and its column of j hold, in
// the units given:
//
//   - loads-from-readings: the load of i per reading of j, in
//     (unit of i)/(reading unit), and per product of readings j·k in
//     (unit of i)/(reading unit)²;
//   - readings-from-loads: the reading of i per load of j, in
//     (reading unit)/(unit of j), and per product of loads j·k in
//     (reading unit)/((unit of j)·(unit of k)).
//
// The second-order terms of a row run over the pairs j ≤ k in the order
// (1,1), (1,2), …, (1,n), (2,2), …, (n,n) of the components as declared.
// Everything is converted to SI loads.
//
// Errors are *Error values of class quantity.ErrParse (text that is not
// the format), quantity.ErrUnknown (a unit or component not known),
// quantity.ErrDimension (a unit of the wrong kind), quantity.ErrRange (a
// number out of range) or quantity.ErrInvalid (a calibration that cannot
// be used), with the line. The work is bounded by MaxCalibrationBytes.
func ParseCalibration(r io.Reader) (*Calibration, error) {
	const op = "balance calibration file"
	data, err := io.ReadAll(io.LimitReader(r, MaxCalibrationBytes+1))
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("file", "cannot read the file", err)}
	}
	perr := func(line int, class error, input, format string, args ...any) *Error {
		return &Error{Op: op, Line: line, Fault: similarity.Fault{Input: input, Reason: fmt.Sprintf(format, args...), Class: class}}
	}
	if len(data) > MaxCalibrationBytes {
		return nil, perr(0, quantity.ErrRange, "file", "the file is longer than %d bytes", MaxCalibrationBytes)
	}
	if !utf8.Valid(data) {
		return nil, perr(0, quantity.ErrParse, "file", "the file is not UTF-8 text")
	}
	var (
		header                 bool
		name                   string
		form                   Form
		readUnit               string
		comps                  []ComponentRange
		factors                []float64
		linear, quad           [numComponents][]float64
		linLine, quadLine      [numComponents]int
		nameSeen, unitSeen     bool
		matrixStarted, anyComp bool
	)
	index := func(c Component) int {
		for i, cr := range comps {
			if cr.Component == c {
				return i
			}
		}
		return -1
	}
	for ln, line := range strings.Split(string(data), "\n") {
		ln++
		if len(line) > MaxCalibrationLine {
			return nil, perr(ln, quantity.ErrRange, "line", "the line is longer than %d bytes", MaxCalibrationLine)
		}
		if i := strings.IndexByte(line, '#'); i >= 0 {
			line = line[:i]
		}
		line = strings.TrimRight(line, "\r")
		for _, r := range line {
			if unicode.IsControl(r) && r != '\t' {
				return nil, perr(ln, quantity.ErrParse, "line", "control character %U in the line", r)
			}
		}
		f := strings.Fields(line)
		if len(f) == 0 {
			continue
		}
		key := f[0]
		if !header {
			if len(f) != 2 || key != "similis-balance" || f[1] != "1" {
				return nil, perr(ln, quantity.ErrParse, key, "the file must begin with \"similis-balance 1\"")
			}
			header = true
			continue
		}
		switch key {
		case "name":
			if nameSeen {
				return nil, perr(ln, quantity.ErrParse, key, "name given twice")
			}
			nameSeen = true
			name = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(line), "name"))
			if utf8.RuneCountInString(name) > 200 {
				return nil, perr(ln, quantity.ErrRange, key, "the name is longer than 200 characters")
			}
		case "form":
			if form != 0 {
				return nil, perr(ln, quantity.ErrParse, key, "form given twice")
			}
			if len(f) != 2 {
				return nil, perr(ln, quantity.ErrParse, key, "form takes one word")
			}
			switch f[1] {
			case LoadsFromReadings.String():
				form = LoadsFromReadings
			case ReadingsFromLoads.String():
				form = ReadingsFromLoads
			default:
				return nil, perr(ln, quantity.ErrUnknown, key, "form %s: want loads-from-readings or readings-from-loads", strconv.Quote(f[1]))
			}
		case "readings":
			if unitSeen {
				return nil, perr(ln, quantity.ErrParse, key, "readings given twice")
			}
			if len(f) != 2 {
				return nil, perr(ln, quantity.ErrParse, key, "readings takes one unit")
			}
			u, err := units.Parse(f[1])
			if err != nil {
				e := &Error{Op: op, Fault: similarity.Caused(key, "the readings' unit", err)}
				e.Line = ln
				return nil, e
			}
			if u.Dim() != quantity.Dimensionless || u.IsScale() {
				return nil, perr(ln, quantity.ErrDimension, key, "the readings' unit %s is not dimensionless: give bridge outputs per volt of excitation (mV/V)", strconv.Quote(f[1]))
			}
			unitSeen, readUnit = true, f[1]
		case "component":
			if matrixStarted {
				return nil, perr(ln, quantity.ErrParse, key, "component lines come before the matrix")
			}
			if len(f) != 5 {
				return nil, perr(ln, quantity.ErrParse, key, "component takes a name, a unit, a minimum and a maximum")
			}
			c, ok := componentByName(f[1])
			if !ok {
				return nil, perr(ln, quantity.ErrUnknown, key, "component %s: want NF, AF, SF, RM, PM or YM", strconv.Quote(f[1]))
			}
			if index(c) >= 0 {
				return nil, perr(ln, quantity.ErrParse, key, "component %v given twice", c)
			}
			if len(comps) == MaxComponents {
				return nil, perr(ln, quantity.ErrRange, key, "more than %d components", MaxComponents)
			}
			u, err := units.Parse(f[2])
			if err != nil {
				e := &Error{Op: op, Fault: similarity.Caused(c.String(), "the unit of "+c.String(), err)}
				e.Line = ln
				return nil, e
			}
			if u.Dim() != c.Dim() || u.IsScale() || u.Offset() != 0 {
				return nil, perr(ln, quantity.ErrDimension, c.String(), "the unit %s of %v is not a %s", strconv.Quote(f[2]), c, map[bool]string{true: "force", false: "moment (torque)"}[c <= SideForce])
			}
			lo, err1 := parseNumber(f[3])
			hi, err2 := parseNumber(f[4])
			if err1 != nil || err2 != nil {
				return nil, perr(ln, quantity.ErrParse, c.String(), "the range of %v, %s … %s, is not two finite numbers", c, strconv.Quote(f[3]), strconv.Quote(f[4]))
			}
			k := u.Factor()
			if !(lo < hi) || math.IsInf(lo*k, 0) || math.IsInf(hi*k, 0) {
				return nil, perr(ln, quantity.ErrRange, c.String(), "the range of %v, %s … %s, must be finite with min < max", c, sig(lo, 6), sig(hi, 6))
			}
			comps = append(comps, ComponentRange{Component: c, Min: lo * k, Max: hi * k})
			factors = append(factors, k)
			anyComp = true
		case "linear", "quadratic":
			if !anyComp {
				return nil, perr(ln, quantity.ErrParse, key, "%s before any component", key)
			}
			matrixStarted = true
			if len(f) < 2 {
				return nil, perr(ln, quantity.ErrParse, key, "%s takes a component and its terms", key)
			}
			c, ok := componentByName(f[1])
			i := index(c)
			if !ok || i < 0 {
				return nil, perr(ln, quantity.ErrUnknown, key, "%s row for %s, which is not a declared component", key, strconv.Quote(f[1]))
			}
			n := len(comps)
			want, row, seen := n, &linear[c], &linLine[c]
			if key == "quadratic" {
				want, row, seen = n*(n+1)/2, &quad[c], &quadLine[c]
			}
			if *seen != 0 {
				return nil, perr(ln, quantity.ErrParse, c.String(), "a second %s row for %v (the first on line %d)", key, c, *seen)
			}
			if len(f)-2 != want {
				return nil, perr(ln, quantity.ErrParse, c.String(), "%s row of %v: %d terms, want %d", key, c, len(f)-2, want)
			}
			*seen = ln
			*row = make([]float64, want)
			for j, s := range f[2:] {
				v, err := parseNumber(s)
				if err != nil {
					return nil, perr(ln, quantity.ErrParse, c.String(), "%s row of %v, term %d: %s is not a finite number", key, c, j+1, strconv.Quote(s))
				}
				(*row)[j] = v
			}
		default:
			return nil, perr(ln, quantity.ErrUnknown, key, "unknown keyword %s", strconv.Quote(key))
		}
	}
	switch {
	case !header:
		return nil, perr(0, quantity.ErrParse, "file", "empty: the file must begin with \"similis-balance 1\"")
	case form == 0:
		return nil, perr(0, quantity.ErrParse, "form", "no form line")
	case !unitSeen:
		return nil, perr(0, quantity.ErrParse, "readings", "no readings line (the readings' unit)")
	case len(comps) == 0:
		return nil, perr(0, quantity.ErrParse, "component", "no component lines")
	}
	n := len(comps)
	lin, qd := make([][]float64, n), make([][]float64, n)
	for i, cr := range comps {
		if linear[cr.Component] == nil {
			return nil, perr(0, quantity.ErrParse, cr.Component.String(), "no linear row for %v", cr.Component)
		}
		lin[i] = linear[cr.Component]
		qd[i] = quad[cr.Component]
		if qd[i] == nil {
			qd[i] = make([]float64, n*(n+1)/2)
		}
		// To SI loads: a row of loads takes its load's factor; a column of
		// loads is divided by it.
		for j := range lin[i] {
			if form == LoadsFromReadings {
				lin[i][j] *= factors[i]
			} else {
				lin[i][j] /= factors[j]
			}
		}
		k := 0
		for j := range n {
			for l := j; l < n; l++ {
				if form == LoadsFromReadings {
					qd[i][k] *= factors[i]
				} else {
					qd[i][k] /= factors[j] * factors[l]
				}
				k++
			}
		}
	}
	return NewCalibration(name, form, readUnit, comps, lin, qd)
}

// componentByName returns the component of a two-letter abbreviation.
func componentByName(s string) (Component, bool) {
	for i, n := range componentNames {
		if n == s {
			return Component(i), true
		}
	}
	return 0, false
}

// parseNumber reads a finite decimal number.
func parseNumber(s string) (float64, error) {
	if len(s) > 40 {
		return 0, strconv.ErrRange
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		return 0, err
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, strconv.ErrRange
	}
	return v, nil
}
