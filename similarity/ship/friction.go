package ship

import (
	"fmt"
	"math"

	"similis.dev/similis/similarity"
)

// FrictionLine is a flat-plate friction (or model–ship correlation) line:
// the frictional resistance coefficient C_F = R_F/(½ρV²S) as a function of
// the Reynolds number. The zero value is the ITTC-1957 line.
type FrictionLine uint8

const (
	// LineITTC1957 is the ITTC-1957 model–ship correlation line,
	// C_F = 0.075/(log₁₀Re − 2)².
	LineITTC1957 FrictionLine = iota
	// LineSchoenherr is the Schoenherr (ATTC-1947) line, given implicitly
	// by 0.242/√C_F = log₁₀(Re·C_F) and solved here to 1e-12.
	LineSchoenherr
	// LineHughes is the Hughes (1954) line for a two-dimensional plate,
	// C_F = 0.066/(log₁₀Re − 2.03)².
	LineHughes
	// LineKatsui is the Katsui (2005) line,
	// C_F = 0.0066577/(log₁₀Re − 4.3762)^a with a = 0.042612·log₁₀Re + 0.56725,
	// used from Re = 10⁶ (it rises steeply below, toward its pole).
	LineKatsui
)

var lineNames = [...]string{"ITTC-1957", "Schoenherr (ATTC-1947)", "Hughes (1954)", "Katsui (2005)"}

// String returns the line's name.
func (l FrictionLine) String() string {
	if int(l) < len(lineNames) {
		return lineNames[l]
	}
	return fmt.Sprintf("FrictionLine(%d)", uint8(l))
}

// Range of the Reynolds numbers the lines are used for: from a towed model
// in turbulent flow to the largest ships.
const (
	minLineRe = 1e5
	maxLineRe = 1e10
)

// CF returns the line's C_F at the Reynolds number re (based on length),
// which must lie between 10⁵ and 10¹⁰: below, the flow over a model is
// laminar or transitional and no line applies; above, no ship is.
func (l FrictionLine) CF(re float64) (float64, error) {
	if l == LineKatsui && re < 1e6 {
		return 0, &Error{Op: l.String() + " line", Fault: similarity.Invalid("", fmt.Sprintf("Reynolds number %g is below 10⁶, where the line is not used", re))}
	}
	if !(re >= minLineRe && re <= maxLineRe) {
		return 0, &Error{Op: l.String() + " line", Fault: similarity.Invalid("", fmt.Sprintf("Reynolds number %g is outside 10⁵ … 10¹⁰ or not finite", re))}
	}
	lg := math.Log10(re)
	switch l {
	case LineITTC1957:
		d := lg - 2
		return 0.075 / (d * d), nil
	case LineSchoenherr:
		return schoenherr(lg), nil
	case LineHughes:
		d := lg - 2.03
		return 0.066 / (d * d), nil
	case LineKatsui:
		a := 0.042612*lg + 0.56725
		return 0.0066577 / math.Pow(lg-4.3762, a), nil
	}
	return 0, &Error{Op: "friction line", Fault: similarity.Invalid("", fmt.Sprintf("unknown line %d", uint8(l)))}
}

// slope returns dC_F/dRe of the line at re, where its value is cf (as
// CF returned it): for the explicit lines by differentiating their
// formulas, for Schoenherr's implicit line by differentiating
// 0.242/√C_F = log₁₀Re + log₁₀C_F.
func (l FrictionLine) slope(re, cf float64) float64 {
	lg := math.Log10(re)
	dlg := 1 / (re * math.Ln10) // d log₁₀Re / dRe
	switch l {
	case LineITTC1957:
		return -2 * cf / (lg - 2) * dlg
	case LineHughes:
		return -2 * cf / (lg - 2.03) * dlg
	case LineSchoenherr:
		// −0.121·C^(−3/2)·dC = (dRe/Re + dC/C)/ln 10
		return -(1 / (re * math.Ln10)) / (0.121*math.Pow(cf, -1.5) + 1/(cf*math.Ln10))
	case LineKatsui:
		a := 0.042612*lg + 0.56725
		dlnC := -0.042612*math.Log(lg-4.3762) - a/(lg-4.3762) // d ln C_F / d log₁₀Re
		return cf * dlnC * dlg
	}
	return 0
}

// schoenherr solves 0.242/√C_F = log₁₀Re + log₁₀C_F by Newton's method in
// x = 1/√C_F: f(x) = 0.242·x + 2·log₁₀x − log₁₀Re.
func schoenherr(lg float64) float64 {
	d := lg - 2
	x := d / math.Sqrt(0.075) // the ITTC-1957 value as a start
	for range 50 {
		f := 0.242*x + 2*math.Log10(x) - lg
		dx := f / (0.242 + 2/(x*math.Ln10))
		x -= dx
		if math.Abs(dx) <= 1e-15*x {
			break
		}
	}
	return 1 / (x * x)
}
