package units

import (
	"errors"
	"fmt"
	"strings"
	"unicode"
	"unicode/utf8"

	"similis.dev/similis/quantity"
)

// Reading records how a data-sheet spelling was read: the text as
// written, what it was read as, and why.
type Reading struct {
	From, To string
	Note     string
}

// String writes "GPM read as gal/min (US gallons per minute)".
func (r Reading) String() string {
	s := fmt.Sprintf("%s read as %s", r.From, r.To)
	if r.Note != "" {
		s += " (" + r.Note + ")"
	}
	return s
}

// dialectWords are the data-sheet spellings the dialect reads, with the
// strict spelling and a note (common practice of acquisition systems and
// pump, fan and tank data sheets).
var dialectWords = map[string]Reading{
	"hr":    {To: "h", Note: "hour"},
	"hrs":   {To: "h", Note: "hour"},
	"sec":   {To: "s", Note: "second"},
	"secs":  {To: "s", Note: "second"},
	"mins":  {To: "min", Note: "minute"},
	"GPM":   {To: "gal/min", Note: "US gallons per minute"},
	"gpm":   {To: "gal/min", Note: "US gallons per minute"},
	"bhp":   {To: "hp", Note: "brake horsepower, the mechanical horsepower of 550 ft·lbf/s"},
	"F":     {To: "degF", Note: "degree Fahrenheit, as an interval inside a compound unit"},
	"C":     {To: "degC", Note: "degree Celsius, as an interval inside a compound unit"},
	"Nm":    {To: "N*m", Note: "newton metre"},
	"RPM":   {To: "rpm", Note: "revolutions per minute"},
	"kts":   {To: "kn", Note: "knot, one nautical mile per hour"},
	"knots": {To: "kn", Note: "knot, one nautical mile per hour"},
	"CFM":   {To: "cfm", Note: "cubic feet per minute"},
	"mWC":   {To: "mH2O", Note: "metre of water column, conventional: 1000 kg/m³ and standard gravity"},
	"mmWC":  {To: "mmH2O", Note: "millimetre of water column, conventional: 1000 kg/m³ and standard gravity"},
	"inWC":  {To: "inH2O", Note: "inch of water column, conventional: 1000 kg/m³ and standard gravity"},
	"psia":  {To: "psi", Note: "pounds per square inch, absolute"},
	"bara":  {To: "bar", Note: "bar, absolute"},
}

// dialectWhole are data-sheet spellings read only as a whole unit.
var dialectWhole = map[string]Reading{
	"U/min": {To: "rev/min", Note: "revolutions per minute, the German Umdrehungen pro Minute"},
	"r/min": {To: "rev/min", Note: "revolutions per minute, as a motor nameplate writes it"},
}

// absoluteMarks are the marks of an absolute pressure after its unit:
// "bar(a)", "kPa(a)", "kPa (abs)".
var absoluteMarks = []string{"(a)", "(abs)", " abs"}

// torqueWords are the torque spellings in which lb is the pound-force.
var torqueWords = map[string]string{
	"in-lb": "in*lbf", "lb-in": "lbf*in", "ft-lb": "ft*lbf", "lb-ft": "lbf*ft",
	"in.lb": "in*lbf", "lb.in": "lbf*in", "ft.lb": "ft*lbf", "lb.ft": "lbf*ft",
	"in-lbs": "in*lbf", "ft-lbs": "ft*lbf", "in lb": "in*lbf", "ft lb": "ft*lbf",
}

// dialectRefused are data-sheet spellings too ambiguous to read, with the
// candidates.
var dialectRefused = map[string]string{
	"ton":  "could be a short ton (2000 lb), a long ton (2240 lb), a metric ton (write t) or a ton of refrigeration (write 12000 BTU/h)",
	"tons": "could be a short ton (2000 lb), a long ton (2240 lb), a metric ton (write t) or a ton of refrigeration (write 12000 BTU/h)",
	"PS":   "could be the metric horsepower (75 kgf·m/s) or the petasiemens",
	"SCFM": "is a volume flow at standard reference conditions that differ between standards; convert with the stated reference conditions and give ft^3/min",
	"Nm3":  "is the normal cubic metre, a volume at reference conditions that differ between standards; convert with the stated reference conditions and give m^3",
	"scfm": "is a volume flow at standard reference conditions that differ between standards; convert with the stated reference conditions and give ft^3/min",
}

// ParseDialect reads a unit as an acquisition system or a data sheet
// writes it, as well as everything Parse reads: hr, sec, mins, m3, ft3,
// kg/m3, m3/h, Pa.s, N.m, ft-lbf, lbf-ft, in-lb, GPM, bhp, ftH2O, mH2O,
// BTU/hr-ft2-F, Nm, RPM, U/min, r/min, mWC, inWC, kts, knots, CFM, and the
// absolute pressures psia, bara, bar(a), kPa(a). A bare C, the coulomb in
// SI, is refused: in a data file it almost always means °C, so the fix
// (°C, degC, or A*s for a charge) is named. Nm3 (the normal cubic metre)
// is refused, since its reference conditions differ. Every lenient reading is reported, so that a reduced data
// set can record its interpretation; a spelling with more than one
// meaning (ton, PS) or one that needs a reference (SCFM) is refused with
// the candidates, and a gauge pressure (psig, barg, kPa(g)) with an
// error matching ErrGauge that says how to read it (ParseGauge) and make it absolute. The dialect is for data files, never the
// default: Parse stays strict.
func ParseDialect(text string) (Unit, []Reading, error) {
	if _, gauge := gaugeSuffix(text); gauge {
		return Unit{}, nil, &Error{Op: OpParse, Input: text, Kind: ErrGauge, Reason: gaugeHelp}
	}
	if text == "C" {
		// A channel header's [C] is almost always a temperature; the
		// coulomb is read only when spelled so that it cannot be mistaken.
		return Unit{}, nil, &Error{Op: OpParse, Input: text, Kind: ErrAmbiguous, Symbol: "C", Reason: "a bare C is the coulomb in SI but usually means the degree Celsius in a data file: write °C or degC for a temperature, or A*s for a charge"}
	}
	if u, err := Parse(text); err == nil {
		return u, nil, nil
	}
	if len(text) > MaxExprLen {
		return Unit{}, nil, &Error{Op: OpParse, Input: text[:MaxExprLen] + "…", Offset: MaxExprLen, Kind: ErrTooLong, Reason: fmt.Sprintf("longer than %d bytes", MaxExprLen)}
	}
	if !utf8.ValidString(text) {
		return Unit{}, nil, &Error{Op: OpParse, Input: text, Kind: ErrSyntax, Reason: "invalid UTF-8"}
	}
	if rd, ok := dialectWhole[text]; ok {
		u, err := Parse(rd.To)
		if err != nil {
			return Unit{}, nil, err
		}
		rd.From = text
		return u, []Reading{rd}, nil
	}
	for _, mark := range absoluteMarks {
		base, ok := strings.CutSuffix(text, mark)
		if !ok || strings.TrimSpace(base) == "" {
			continue
		}
		base = strings.TrimSpace(base)
		u, rd, err := ParseDialect(base)
		if err != nil {
			return Unit{}, nil, err
		}
		if u.Dim() != quantity.Pressure {
			return Unit{}, nil, &Error{Op: OpParse, Input: text, Kind: ErrSyntax, Reason: fmt.Sprintf("%q marks an absolute pressure, but %s is not a pressure unit", mark, base)}
		}
		return u, append(rd, Reading{From: text, To: base, Note: "an absolute pressure"}), nil
	}
	// A pound in a torque (in-lb, lb-ft) is the pound-force; elsewhere
	// (lb/hr) it stays the pound of mass.
	if to, ok := torqueWords[text]; ok {
		u, err := Parse(to)
		if err != nil {
			return Unit{}, nil, err
		}
		return u, []Reading{{From: text, To: to, Note: "a torque: the pound is the pound-force"}}, nil
	}
	var readings []Reading
	var sb strings.Builder
	// A hyphenated denominator after '/' (BTU/hr-ft2-F) is one group.
	slash := strings.IndexByte(text, '/')
	denGroup := slash >= 0 && strings.Contains(text[slash+1:], "-") && !strings.ContainsAny(text[slash+1:], "()")
	i := 0
	for i < len(text) {
		r, n := utf8.DecodeRuneInString(text[i:])
		switch {
		case unicode.IsLetter(r):
			j := i
			for j < len(text) {
				r2, n2 := utf8.DecodeRuneInString(text[j:])
				if !(unicode.IsLetter(r2) || unicode.IsDigit(r2) && !endsWithPower(text[i:j], text[j:]) || r2 == '_') {
					break
				}
				j += n2
			}
			word := text[i:j]
			// Trailing digits that are a power: m3, ft2 (but not H2O).
			k := j
			for k < len(text) && text[k] >= '2' && text[k] <= '3' && (k+1 == len(text) || !isNameByte(text[k+1])) {
				k++
			}
			if word == "Nm" && k > j {
				word = "Nm" + text[j:k]
			}
			if why, bad := dialectRefused[word]; bad {
				return Unit{}, readings, &Error{Op: OpParse, Input: text, Offset: i, Kind: ErrAmbiguous, Symbol: word, Reason: fmt.Sprintf("%q %s", word, why)}
			}
			to := word
			if rd, ok := dialectWords[word]; ok {
				// F and C are farad and coulomb except in a hyphenated
				// denominator (BTU/hr-ft2-F), where they are the degree.
				inDen := denGroup && i > slash
				if _, known := builtinIndex.bySym[word]; !known || (word == "F" || word == "C") && inDen {
					to = rd.To
					readings = append(readings, Reading{From: word, To: to, Note: rd.Note})
				}
			}
			if strings.ContainsAny(to, "/*") {
				to = "(" + to + ")" // kg/Nm is kg/(N*m)
			}
			sb.WriteString(to)
			if k > j {
				sb.WriteString("^" + text[j:k])
				readings = append(readings, Reading{From: text[i:k], To: to + "^" + text[j:k], Note: "a trailing digit read as a power"})
			}
			i = k
		case r == '.' && i > 0 && i+1 < len(text) && isNameByte(text[i-1]) && isLetterByte(text[i+1]):
			sb.WriteByte('*')
			readings = append(readings, Reading{From: ".", To: "*", Note: "a dot between symbols read as a product"})
			i++
		case r == '-' && i > 0 && i+1 < len(text) && isNameByte(text[i-1]) && isLetterByte(text[i+1]):
			sb.WriteByte('*')
			readings = append(readings, Reading{From: "-", To: "*", Note: "a hyphen between symbols read as a product"})
			i++
		case r == '/' && denGroup && i == slash:
			sb.WriteString("/(")
			i++
		default:
			sb.WriteString(text[i : i+n])
			i += n
		}
	}
	if denGroup {
		sb.WriteByte(')')
	}
	strict := sb.String()
	u, err := Parse(strict)
	if err != nil {
		// The reading keeps the class of what is wrong with it: an
		// unknown symbol stays unknown, a syntax or exponent error stays
		// one (ErrParse), so a caller can tell them apart.
		kind := ErrSyntax
		var pe *Error
		if errors.As(err, &pe) && pe.Kind != nil {
			kind = pe.Kind
		}
		return Unit{}, readings, &Error{Op: OpParse, Input: text, Kind: kind, Reason: fmt.Sprintf("not a unit even as a data sheet writes it (read as %q)", strict), Err: err}
	}
	return u, readings, nil
}

// ParseValueDialect reads a number and a unit as a data sheet or a
// configuration file writes it ("12 m3/h", "3 bara", "1450 RPM"): the
// number as ParseValue reads it, the unit as ParseDialect does, with the
// lenient readings returned. It is opt-in, for configuration files whose
// authors write units as their instruments do; ParseValue stays strict.
// A gauge pressure ("2 kPag") is refused with an error matching ErrGauge,
// as in ParseValue.
func ParseValueDialect(s string) (Value, []Reading, error) {
	var readings []Reading
	v, err := parseValue(builtinTable{}, s, func(text string) (Unit, error) {
		u, rd, err := ParseDialect(text)
		readings = rd
		return u, err
	})
	if err != nil {
		return Value{}, nil, err
	}
	return v, readings, nil
}

func isNameByte(c byte) bool {
	return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_'
}
func isLetterByte(c byte) bool { return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' }

// endsWithPower reports whether the digits at rest end a symbol as a
// power (m3, ft2) rather than belong to it (H2O).
func endsWithPower(word, rest string) bool {
	if rest == "" || rest[0] < '2' || rest[0] > '3' {
		return false
	}
	return len(rest) == 1 || !isNameByte(rest[1])
}
