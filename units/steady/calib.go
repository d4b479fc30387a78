package steady

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units"
)

// Bounds on a calibration file: ParseCalibration reads at most
// MaxCalBytes bytes, lines of at most MaxCalLine bytes, at most
// MaxDegree + 1 coefficients and at most MaxTablePoints rows.
const (
	MaxCalBytes    = 64 << 10
	MaxCalLine     = 1024
	MaxDegree      = 9
	MaxTablePoints = 2000
)

// Calibration carries a raw reading (a bridge output in mV/V, a voltage)
// to an engineering value (a force, a speed), over the raw range it was
// calibrated on, with its standard uncertainty. It is a polynomial or a
// table, read by ParseCalibration.
type Calibration struct {
	Name   string
	Raw    units.Unit // the unit of the raw reading
	Eng    units.Unit // the unit of the engineering value
	Lo, Hi float64    // the calibrated range, in Raw
	// U is the calibration's standard uncertainty, in Eng taken as an
	// interval, applied as one systematic source to every value the
	// calibration gives.
	U float64

	coef []float64 // polynomial: y = Σ coef[k]·x^k, in Raw and Eng
	x, y []float64 // table rows, x strictly increasing
}

// IsTable reports whether c interpolates a table (rather than evaluating
// a polynomial).
func (c *Calibration) IsTable() bool { return c.x != nil }

// Coefficients returns a copy of a polynomial calibration's coefficients
// c_0 … c_m, c_k in Eng/Raw^k, or nil for a table.
func (c *Calibration) Coefficients() []float64 { return append([]float64(nil), c.coef...) }

// eval returns y(x) and dy/dx, in the file's units, for x inside the
// range.
func (c *Calibration) eval(x float64) (y, dydx float64) {
	if c.x == nil {
		for k := len(c.coef) - 1; k >= 0; k-- { // Horner, with the derivative
			dydx = dydx*x + y
			y = y*x + c.coef[k]
		}
		return y, dydx
	}
	// Table: the segment holding x, by bisection.
	lo, hi := 0, len(c.x)-1
	for hi-lo > 1 {
		mid := (lo + hi) / 2
		if c.x[mid] <= x {
			lo = mid
		} else {
			hi = mid
		}
	}
	s := (c.y[hi] - c.y[lo]) / (c.x[hi] - c.x[lo])
	return c.y[lo] + s*(x-c.x[lo]), s
}

// Eval returns the engineering value of the raw reading raw, with the
// derivative dEng/dRaw, both in SI. A reading outside [Lo, Hi] is refused
// with a *RangeError (Row −1): the calibration is never extrapolated.
func (c *Calibration) Eval(raw quantity.Quantity) (eng, slope quantity.Quantity, err error) {
	x, err := c.Raw.ValueOf(raw)
	if err != nil {
		return eng, slope, &Error{Op: "calibrate", Channel: c.Name, Row: -1, Reason: "the raw reading", Err: err}
	}
	if !(x >= c.Lo && x <= c.Hi) {
		return eng, slope, c.rangeErr("", -1, quantity.Series{}, x)
	}
	y, d := c.eval(x)
	eng, slope = c.Eng.Of(y), c.slope(d)
	if !finite(eng.Value()) || !finite(slope.Value()) {
		return quantity.Quantity{}, quantity.Quantity{}, outOfRange("calibrate", c.Name, -1, "at raw %g the value %g or the slope %g is out of the range of a float64 in SI", x, y, d)
	}
	return eng, slope, nil
}

// slope is dy/dx in SI from its value in the file's units.
func (c *Calibration) slope(d float64) quantity.Quantity {
	return quantity.New(d*c.Eng.Factor()/c.Raw.Factor(), c.Eng.Dim()).Div(quantity.New(1, c.Raw.Dim()))
}

func (c *Calibration) rangeErr(channel string, row int, t quantity.Series, x float64) *RangeError {
	e := &RangeError{Calibration: c.Name, Channel: channel, Row: row, Value: x, Lo: c.Lo, Hi: c.Hi, Unit: c.Raw.String()}
	if row >= 0 && row < t.Len() {
		e.Time, e.HasTime = t.At(row), true
	}
	return e
}

// Apply sets dst to the engineering values of the raw samples raw of the
// channel named channel. A missing
// sample (NaN) stays missing. A sample outside the calibrated range is
// refused with a *RangeError naming the channel, the row and, when t
// (the history's time channel, or an empty Series) holds it, its time;
// dst is then left as it was. raw must have the dimension of Raw. The
// calibration's uncertainty is attached to each point's mean afterwards,
// with AddSource. dst's
// storage is reused when it is large enough, and dst may be raw itself.
func (c *Calibration) Apply(dst *quantity.Series, raw quantity.Series, channel string, t quantity.Series) error {
	if dst == nil {
		return invalid("calibrate", channel, -1, "no destination series")
	}
	if raw.Dim() != c.Raw.Dim() {
		return &Error{Op: "calibrate", Channel: channel, Row: -1, Reason: "calibration " + strconv.Quote(c.Name),
			Err: &quantity.Error{Op: "check", Name: channel, Dims: [2]quantity.Dim{raw.Dim(), c.Raw.Dim()}, Binary: true, Class: quantity.ErrDimension}}
	}
	rf, ro := c.Raw.Factor(), c.Raw.Offset()
	v := raw.Values()
	for i, a := range v {
		x := (a - ro) / rf
		if math.IsNaN(x) {
			continue
		}
		if !(x >= c.Lo && x <= c.Hi) {
			return c.rangeErr(channel, i, t, x)
		}
	}
	out := dst.Values()
	if cap(out) >= len(v) {
		out = out[:len(v)] // in place when dst is raw: each sample is read before it is written
	} else {
		out = make([]float64, len(v))
	}
	ef, eo := c.Eng.Factor(), c.Eng.Offset()
	for i, a := range v {
		x := (a - ro) / rf
		if math.IsNaN(x) {
			out[i] = math.NaN()
			continue
		}
		y, _ := c.eval(x)
		out[i] = y*ef + eo
	}
	*dst = quantity.NewSeries(out, c.Eng.Dim())
	return nil
}

// Source returns the calibration's uncertainty source: Type B, normal,
// systematic, named "calibration <name>", its standard uncertainty U in
// SI.
func (c *Calibration) Source() uncertain.Source {
	return uncertain.Source{
		Name: "calibration " + c.Name,
		U:    quantity.New(c.U*c.Eng.Factor(), c.Eng.Dim()),
		Type: uncertain.TypeB, Dist: uncertain.Normal, Effect: uncertain.Systematic,
	}
}

// sourceIn returns the ID of the calibration's source in set, adding it
// the first time: every value the calibration gives shares the one
// systematic source, so their errors are correlated as they should be.
func (c *Calibration) sourceIn(set *uncertain.Set) (uncertain.ID, error) {
	src := c.Source()
	for i := 0; i < set.Len(); i++ {
		s, err := set.Source(uncertain.ID(i))
		if err == nil && s.Name == src.Name {
			if s != src {
				return 0, &uncertain.Error{Source: src.Name, Reason: "a source of this name with another uncertainty is in the set already"}
			}
			return uncertain.ID(i), nil
		}
	}
	return set.Add(src)
}

// Measured returns the engineering value of a raw mean x (a steady
// point's mean, tared or not) with its uncertainty: x's sources carried
// through the calibration's slope at x (first order), plus the
// calibration's own systematic source, registered in set once (see
// Source). A mean outside the calibrated range is refused with a
// *RangeError naming channel.
func (c *Calibration) Measured(set *uncertain.Set, channel string, x uncertain.Measured) (uncertain.Measured, error) {
	const op = "calibrate"
	if set == nil {
		return uncertain.Measured{}, invalid(op, channel, -1, "no uncertainty set")
	}
	if x.Dim() != c.Raw.Dim() {
		return uncertain.Measured{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "calibration " + strconv.Quote(c.Name),
			Err: &quantity.Error{Op: "check", Name: channel, Dims: [2]quantity.Dim{x.Dim(), c.Raw.Dim()}, Binary: true, Class: quantity.ErrDimension}}
	}
	y, slope, err := c.Eval(x.Quantity())
	if err != nil {
		if re, ok := err.(*RangeError); ok {
			re.Channel = channel
		}
		return uncertain.Measured{}, err
	}
	id, err := c.sourceIn(set)
	if err != nil {
		return uncertain.Measured{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "registering the calibration's source", Err: err}
	}
	cal, err := set.Measure(quantity.New(0, c.Eng.Dim()), id)
	if err != nil {
		return uncertain.Measured{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "the calibration's source", Err: err}
	}
	m, err := uncertain.Eval(func() uncertain.Measured {
		lin := x.MulQ(slope)
		return lin.Add(uncertain.Exact(y.Sub(lin.Quantity()))).Add(cal)
	})
	if err != nil {
		return uncertain.Measured{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "carrying the mean through the calibration", Err: err}
	}
	return m, nil
}

// Calibrate returns p with the channel's mean carried through the
// calibration (see Measured). The channel's Stats stay in the raw unit.
func (c *Calibration) Calibrate(set *uncertain.Set, p Point, channel string) (Point, error) {
	for i, v := range p.Values {
		if v.Name != channel {
			continue
		}
		m, err := c.Measured(set, channel, v.Mean)
		if err != nil {
			return Point{}, err
		}
		out := p
		out.Values = append([]Value(nil), p.Values...)
		out.Values[i].Mean = m
		return out, nil
	}
	return Point{}, invalid("calibrate", channel, -1, "point %q has no such channel", p.Tag)
}

// AddSource returns p with the calibration's systematic source added to
// the mean of channel, a channel already in engineering units (carried
// through the calibration sample by sample with Apply): the value is
// unchanged, its uncertainty gains the calibration's (see Source). The
// channel must have the dimension of Eng.
func (c *Calibration) AddSource(set *uncertain.Set, p Point, channel string) (Point, error) {
	const op = "calibration source"
	if set == nil {
		return Point{}, invalid(op, channel, -1, "no uncertainty set")
	}
	for i, v := range p.Values {
		if v.Name != channel {
			continue
		}
		if v.Mean.Dim() != c.Eng.Dim() {
			return Point{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "calibration " + strconv.Quote(c.Name),
				Err: &quantity.Error{Op: "check", Name: channel, Dims: [2]quantity.Dim{v.Mean.Dim(), c.Eng.Dim()}, Binary: true, Class: quantity.ErrDimension}}
		}
		id, err := c.sourceIn(set)
		if err != nil {
			return Point{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "registering the calibration's source", Err: err}
		}
		for k := range v.Mean.Terms() {
			if tid, _ := v.Mean.Term(k); tid == id && v.Mean.Set() == set {
				return Point{}, invalid(op, channel, -1, "point %q carries the source %q already", p.Tag, c.Source().Name)
			}
		}
		cal, err := set.Measure(quantity.New(0, c.Eng.Dim()), id)
		if err != nil {
			return Point{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "the calibration's source", Err: err}
		}
		m, err := uncertain.Eval(func() uncertain.Measured { return v.Mean.Add(cal) })
		if err != nil {
			return Point{}, &Error{Op: op, Channel: channel, Row: -1, Reason: "adding the calibration's source", Err: err}
		}
		out := p
		out.Values = append([]Value(nil), p.Values...)
		out.Values[i].Mean = m
		return out, nil
	}
	return Point{}, invalid(op, channel, -1, "point %q has no such channel", p.Tag)
}

// ParseCalibration reads a calibration file (file names it in errors).
// The format is line-oriented text; '#' starts a comment, blank lines are
// skipped, and each line is a keyword and its values separated by
// spaces or tabs:
//
//	# invented: drag balance, bridge output to force
//	name         drag
//	raw          mV/V           # unit of the raw reading
//	engineering  N              # unit of the engineering value
//	range        -2  2          # calibrated raw range, in the raw unit
//	uncertainty  0.35           # standard uncertainty, engineering unit
//	c0           0.12  N
//	c1           250.3 N/(mV/V)
//	c2           -1.2           # unit omitted: N/(mV/V)^2 understood
//
// A polynomial gives its coefficients c0 … c9 (y = Σ c_k·x^k, x in the
// raw unit, y in the engineering unit); a coefficient may carry a unit,
// which must convert to engineering/raw^k and is converted. A table
// gives instead two or more rows "point <raw> <engineering>" in the raw
// and engineering units, raw strictly increasing and engineering
// strictly monotone, interpolated linearly between rows; its range is its
// first and last raw values, and a range line is refused. name, raw,
// engineering and uncertainty are required, and range for a polynomial,
// each once. A polynomial must be strictly monotone over its range
// (checked at 256 equal steps and the ends). Units are read by
// units.Parse.
//
// Every problem is a *ParseError naming the file and line; the reading
// is bounded (MaxCalBytes, MaxCalLine, MaxDegree, MaxTablePoints) and
// never panics.
func ParseCalibration(r io.Reader, file string) (*Calibration, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxCalBytes+1))
	if err != nil {
		return nil, &ParseError{File: file, Reason: "reading", Err: err}
	}
	if len(data) > MaxCalBytes {
		return nil, &ParseError{File: file, Reason: fmt.Sprintf("longer than %d bytes", MaxCalBytes), Err: quantity.ErrRange}
	}
	c := &Calibration{}
	seen := map[string]int{}
	var coefSet [MaxDegree + 1]bool
	var coef [MaxDegree + 1]float64
	var hasRange bool
	for ln := 1; len(data) > 0; ln++ {
		var line []byte
		line, data, _ = bytes.Cut(data, []byte{'\n'})
		fail := func(text, format string, args ...any) error {
			return &ParseError{File: file, Line: ln, Text: truncate(text), Reason: fmt.Sprintf(format, args...)}
		}
		if len(line) > MaxCalLine {
			return nil, fail("", "a line longer than %d bytes", MaxCalLine)
		}
		if !utf8.Valid(line) {
			return nil, fail("", "not valid UTF-8")
		}
		s, _, _ := strings.Cut(string(line), "#")
		f := strings.Fields(s)
		if len(f) == 0 {
			continue
		}
		key := f[0]
		if prev, dup := seen[key]; dup && key != "point" {
			return nil, fail(key, "given again (first on line %d)", prev)
		} else if !dup {
			seen[key] = ln // the first line of each keyword
		}
		rest := strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(s), key))
		switch {
		case key == "name":
			c.Name = rest
		case key == "raw" || key == "engineering":
			u, err := units.Parse(rest)
			if err != nil {
				return nil, &ParseError{File: file, Line: ln, Text: truncate(rest), Reason: "the " + key + " unit", Err: err}
			}
			if key == "raw" {
				c.Raw = u
			} else {
				c.Eng = u
			}
		case key == "range":
			if len(f) != 3 {
				return nil, fail(rest, "want two numbers, the low and high raw readings")
			}
			lo, err1 := number(f[1])
			hi, err2 := number(f[2])
			if err1 != nil || err2 != nil {
				return nil, fail(rest, "want two finite numbers")
			}
			if !(lo < hi) {
				return nil, fail(rest, "want low < high")
			}
			c.Lo, c.Hi, hasRange = lo, hi, true
		case key == "uncertainty":
			if len(f) != 2 {
				return nil, fail(rest, "want one number, the standard uncertainty in the engineering unit")
			}
			u, err := number(f[1])
			if err != nil || u < 0 {
				return nil, fail(rest, "want a finite number ≥ 0")
			}
			c.U = u
		case key == "point":
			if len(f) != 3 {
				return nil, fail(rest, "want two numbers, raw and engineering")
			}
			if len(c.x) >= MaxTablePoints {
				return nil, fail("", "more than %d rows", MaxTablePoints)
			}
			x, err1 := number(f[1])
			y, err2 := number(f[2])
			if err1 != nil || err2 != nil {
				return nil, fail(rest, "want two finite numbers")
			}
			c.x, c.y = append(c.x, x), append(c.y, y)
		case len(key) >= 2 && key[0] == 'c' && key[1] >= '0' && key[1] <= '9':
			k, err := strconv.Atoi(key[1:])
			if err != nil || k > MaxDegree || len(key) > 2 && key[1] == '0' {
				return nil, fail(key, "a coefficient c0 … c%d", MaxDegree)
			}
			if len(f) < 2 {
				return nil, fail(key, "want a number and, if wanted, its unit")
			}
			v, err := number(f[1])
			if err != nil {
				return nil, fail(f[1], "want a finite number")
			}
			if ut := strings.TrimSpace(strings.TrimPrefix(rest, f[1])); ut != "" {
				if seen["raw"] == 0 || seen["engineering"] == 0 {
					return nil, fail(ut, "a coefficient's unit before the raw and engineering units are given")
				}
				v, err = coefIn(v, ut, k, c.Raw, c.Eng)
				if err != nil {
					return nil, &ParseError{File: file, Line: ln, Text: truncate(ut), Reason: fmt.Sprintf("the unit of c%d", k), Err: err}
				}
			}
			coef[k], coefSet[k] = v, true
		default:
			return nil, fail(key, "unknown keyword: want name, raw, engineering, range, uncertainty, c0 … c%d or point", MaxDegree)
		}
	}
	missing := func(what string) error {
		return &ParseError{File: file, Reason: "no " + what + " line"}
	}
	for _, k := range []string{"name", "raw", "engineering", "uncertainty"} {
		if seen[k] == 0 {
			return nil, missing(k)
		}
	}
	if c.Name == "" {
		return nil, &ParseError{File: file, Line: seen["name"], Reason: "an empty name"}
	}
	nc := 0
	for k, ok := range coefSet {
		if ok {
			nc = k + 1
		}
	}
	switch {
	case nc > 0 && c.x != nil:
		return nil, &ParseError{File: file, Line: seen["point"], Reason: "both coefficients and table rows: give one or the other"}
	case nc == 0 && c.x == nil:
		return nil, missing("coefficient (c0 …) or table row (point)")
	case c.x != nil:
		if hasRange {
			return nil, &ParseError{File: file, Line: seen["range"], Reason: "a table's range is its first and last rows: no range line"}
		}
		if len(c.x) < 2 {
			return nil, &ParseError{File: file, Line: seen["point"], Reason: "a table of one row: want two or more"}
		}
		up := c.y[1] > c.y[0]
		for i := 1; i < len(c.x); i++ {
			if !(c.x[i] > c.x[i-1]) {
				return nil, &ParseError{File: file, Reason: fmt.Sprintf("table row %d: raw %g after %g: want strictly increasing", i+1, c.x[i], c.x[i-1])}
			}
			if c.y[i] == c.y[i-1] || (c.y[i] > c.y[i-1]) != up {
				return nil, &ParseError{File: file, Reason: fmt.Sprintf("table row %d: engineering %g after %g: want strictly monotone", i+1, c.y[i], c.y[i-1])}
			}
			dx, dy := c.x[i]-c.x[i-1], c.y[i]-c.y[i-1]
			if sl := dy / dx; !finite(dx) || !finite(dy) || sl == 0 || !finite(sl*c.Eng.Factor()/c.Raw.Factor()) {
				return nil, &ParseError{File: file, Reason: fmt.Sprintf("table row %d: the step from the row before is out of the range of a float64", i+1), Err: quantity.ErrRange}
			}
		}
		for i, y := range c.y {
			if !finite(y*c.Eng.Factor() + c.Eng.Offset()) {
				return nil, &ParseError{File: file, Reason: fmt.Sprintf("table row %d: engineering %g overflows in SI", i+1, y), Err: quantity.ErrRange}
			}
		}
		c.Lo, c.Hi = c.x[0], c.x[len(c.x)-1]
	default:
		if !hasRange {
			return nil, missing("range")
		}
		c.coef = append([]float64(nil), coef[:nc]...)
		if err := c.checkMonotone(); err != nil {
			return nil, &ParseError{File: file, Line: seen["c1"], Reason: err.Error()}
		}
	}
	if !finite(c.U * c.Eng.Factor()) {
		return nil, &ParseError{File: file, Line: seen["uncertainty"], Reason: "the uncertainty overflows in SI", Err: quantity.ErrRange}
	}
	return c, nil
}

// checkMonotone refuses a polynomial whose derivative is zero or changes
// sign at 257 equally spaced raw values of its range, or whose values
// there are not finite.
func (c *Calibration) checkMonotone() error {
	const steps = 256
	sign := 0.0
	for i := 0; i <= steps; i++ {
		x := c.Lo + (c.Hi-c.Lo)*float64(i)/steps
		y, d := c.eval(x)
		if !finite(y) || !finite(d) || !finite(y*c.Eng.Factor()+c.Eng.Offset()) || !finite(d*c.Eng.Factor()/c.Raw.Factor()) {
			return fmt.Errorf("the polynomial is not finite at raw %g", x)
		}
		s := math.Copysign(1, d)
		if d == 0 || sign != 0 && s != sign {
			return fmt.Errorf("the polynomial is not strictly monotone over the range [%g, %g] (slope %g at raw %g)", c.Lo, c.Hi, d, x)
		}
		sign = s
	}
	return nil
}

// coefIn converts v in the unit text ut to the unit of the k-th
// coefficient, eng/raw^k.
func coefIn(v float64, ut string, k int, raw, eng units.Unit) (float64, error) {
	u, err := units.Parse(ut)
	if err != nil {
		return 0, err
	}
	want := eng
	if k > 0 {
		p, err := raw.Pow(k, 1)
		if err != nil {
			return 0, err
		}
		if want, err = eng.Div(p); err != nil {
			return 0, err
		}
	}
	return units.ConvertUnits(v, u, want)
}

// number reads a finite decimal number.
func number(s string) (float64, error) {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		return 0, err
	}
	if !finite(v) {
		return 0, strconv.ErrRange
	}
	return v, nil
}

// truncate shortens s for an error message.
func truncate(s string) string {
	const n = 40
	if len(s) <= n {
		return s
	}
	i := n
	for i > 0 && !utf8.RuneStart(s[i]) {
		i--
	}
	return s[:i] + "…"
}
