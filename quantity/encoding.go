package quantity

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// AppendText appends the text form of d, as String writes it, to b. It
// implements encoding.TextAppender.
func (d Dim) AppendText(b []byte) ([]byte, error) { return append(b, d.String()...), nil }

// MarshalText encodes d as String writes it ("L⁻¹ M T⁻²"); ParseDim, and
// so UnmarshalText, reads it back exactly.
func (d Dim) MarshalText() ([]byte, error) { return d.AppendText(nil) }

// UnmarshalText decodes a dimension written in any form ParseDim accepts.
func (d *Dim) UnmarshalText(b []byte) error {
	v, err := ParseDim(string(b))
	if err != nil {
		return err
	}
	*d = v
	return nil
}

// AppendText appends the text form of q, as String writes it, to b: the
// shortest decimal that reads back to the same float64, a space, and the
// unit (a name of String's fixed set where the dimension is exactly its,
// else the SI base-unit form: "101325 Pa", "0.0010016 Pa·s",
// "1.225 kg·m⁻³"). A value that is
// not finite is refused, since no number written in a data file should
// read back as NaN or ±Inf. It implements encoding.TextAppender.
func (q Quantity) AppendText(b []byte) ([]byte, error) {
	if math.IsNaN(q.v) || math.IsInf(q.v, 0) {
		return b, &Error{Op: "format", Input: q.String(), Reason: "a value that is not finite has no text form", Class: ErrInvalid}
	}
	b = strconv.AppendFloat(b, q.v, 'g', -1, 64)
	if uint64(q.d) != 0 {
		b = append(b, ' ')
		b = append(b, q.d.unitText(false)...)
	}
	return b, nil
}

// MarshalText encodes q as String writes it; UnmarshalText reads it back
// to the same bits. JSON encodes a Quantity through it, as a string.
func (q Quantity) MarshalText() ([]byte, error) { return q.AppendText(nil) }

// UnmarshalText decodes a number, optionally followed by a space and a
// dimension in any form ParseDim accepts ("1.225 kg·m⁻³", "1.225 kg
// m^-3", "2.5"), or one of the unit names String writes ("101325 Pa").
// Other units are the units package's job (units.ParseQuantity).
func (q *Quantity) UnmarshalText(b []byte) error {
	v, err := ParseQuantitySI(string(b))
	if err != nil {
		return err
	}
	*q = v
	return nil
}

// ParseQuantitySI reads a quantity written as String and MarshalText
// write it: a finite number and, after a space, a dimension in SI base
// units or ISO form, or alone one of the unit names String or ASCII
// writes — N, Pa, W, N·m, Pa·s, N/m, N/m³, W/m², W/(m·K), W/(m²·K), J/K,
// J/(kg·K), or their ASCII spellings N*m, Pa*s, N/m^3, W/m^2, W/(m*K),
// W/(m^2*K), J/(kg*K). A unit text of "N" alone is so the newton, not the
// ISO symbol of amount of substance (write mol), and "N·m" the newton
// metre, not amount of substance times length. It reports an *Error of
// class ErrParse.
func ParseQuantitySI(s string) (Quantity, error) {
	if len(s) > maxDimText+64 {
		return Quantity{}, parseError(s[:64]+"…", 64, "text too long")
	}
	t := strings.TrimSpace(s)
	lead := strings.Index(s, t)
	num, rest, _ := strings.Cut(t, " ")
	if num == "" {
		return Quantity{}, parseError(s, lead, "expected a number")
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		pe := parseError(s, lead, fmt.Sprintf("%q is not a finite number", num))
		pe.Err = err // the *strconv.NumError, if there is one
		return Quantity{}, pe
	}
	if v == 0 && strings.ContainsAny(strings.SplitN(strings.ToLower(num), "e", 2)[0], "123456789") {
		return Quantity{}, parseError(s, lead, fmt.Sprintf("%q underflows to zero", num))
	}
	if d, ok := namedDim(rest); ok {
		return Quantity{v, d}, nil
	}
	d, err := ParseDim(rest)
	if err != nil {
		if pe, ok := err.(*Error); ok {
			pe.Input, pe.Offset = s, pe.Offset+lead+len(num)+1
		}
		return Quantity{}, err
	}
	return Quantity{v, d}, nil
}
