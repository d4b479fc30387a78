package ship

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"similis.dev/similis/similarity"
)

// Table writes the extrapolation as the trade presents it, one row per
// run: model speed, Fn, C_TM, C_FM and C_R (×10³), ship speed in knots,
// C_FS and C_TS (×10³; C_TS includes C_A), ship resistance and
// effective power to four significant figures, each column in the unit
// with the SI prefix its largest value calls for (N, kN or MN; W, kW or
// MW), named in its header; then the wetted surfaces, every warning and
// the caution. Markdown if md is set.
func (r *HullResult) Table(md bool) string {
	var rs, pe []float64
	for _, p := range r.Points {
		rs, pe = append(rs, p.ShipResistance.Value()), append(pe, p.EffectivePower.Value())
	}
	rc, pc := siColumn(rs, "N"), siColumn(pe, "W")
	head := []string{"V_m m/s", "Fn", "C_TM×10³", "C_FM×10³", "C_R×10³", "V_s kn", "C_FS×10³", "C_TS×10³", "R_TS " + rc.unit, "P_E " + pc.unit}
	var rows [][]string
	var warn []string
	for _, p := range r.Points {
		rows = append(rows, []string{
			fmt.Sprintf("%.3f", p.ModelSpeed.Value()), fmt.Sprintf("%.3f", p.Froude),
			fmt.Sprintf("%.3f", p.ModelCT*1e3), fmt.Sprintf("%.3f", p.ModelCF*1e3), fmt.Sprintf("%.3f", p.Residual*1e3),
			fmt.Sprintf("%.2f", p.ShipSpeed.Value()*3600/1852), fmt.Sprintf("%.3f", p.ShipCF*1e3), fmt.Sprintf("%.3f", p.ShipCT*1e3),
			rc.cell(p.ShipResistance.Value()), pc.cell(p.EffectivePower.Value()),
		})
		if p.Warning != "" {
			warn = append(warn, "WARNING: "+p.Warning)
		}
	}
	line := r.Test.Line
	var sb strings.Builder
	fmt.Fprintf(&sb, "Hull extrapolation: %v line, 1 + k = %.3f, C_A = %g, λ = 1:%.4g\n", line, r.FormFactor, r.Test.Allowance, 1/r.Test.Scale)
	fmt.Fprintf(&sb, "C_TS = (1 + k)·C_FS + C_R + C_A; wetted surface model %.4g m², ship %.4g m²\n", r.Test.ModelWettedArea.Value(), r.ShipWettedArea.Value())
	if md {
		sb.WriteString("\n")
	}
	sb.WriteString(similarity.FormatTable(head, rows, md, true))
	for _, w := range warn {
		sb.WriteString(w + "\n")
	}
	sb.WriteString("CAUTION: " + r.Caution + "\n")
	return sb.String()
}

// PoweringTable writes ITTC-1978 predictions as the trade presents them,
// one row per speed: V_S (kn), Fn, C_R, ΔC_F, C_A and C_TS (×10³; C_TS
// includes ΔC_F, C_A and C_AAS), R_TS, P_E, w_TS, J, K_T, 10K_Q, η_O,
// η_H, η_R, η_D, n (rpm) and P_D (all shafts), K_T and K_Q with
// n in revolutions per second (10K_Q as the other open-water tables print
// it); R_TS, P_E and P_D to four significant figures, each column in the
// unit with the SI prefix its largest value calls for, named in its
// header; then the source of C_A, every warning and the caution.
// Markdown if md is set.
func PoweringTable(rs []PoweringResult, md bool) string {
	var rts, pe, pd []float64
	for _, r := range rs {
		rts, pe, pd = append(rts, r.ShipResistance.Value()), append(pe, r.EffectivePower.Value()), append(pd, r.DeliveredPower.Value())
	}
	rc, ec, dc := siColumn(rts, "N"), siColumn(pe, "W"), siColumn(pd, "W")
	head := []string{"V_S kn", "Fn", "C_R×10³", "ΔC_F×10³", "C_A×10³", "C_TS×10³", "R_TS " + rc.unit, "P_E " + ec.unit, "w_TS", "J", "K_T", "10K_Q", "η_O", "η_H", "η_R", "η_D", "n rpm", "P_D " + dc.unit}
	var rows [][]string
	var warn []string
	formula := false
	for _, r := range rs {
		formula = formula || r.CorrelationFromFormula
		if r.Warning != "" {
			warn = append(warn, fmt.Sprintf("WARNING (%.2f kn): %s", r.ShipSpeed.Value()*3600/1852, r.Warning))
		}
		rows = append(rows, []string{
			fmt.Sprintf("%.2f", r.ShipSpeed.Value()*3600/1852), fmt.Sprintf("%.3f", r.Froude),
			fmt.Sprintf("%.3f", r.Residual*1e3), fmt.Sprintf("%.3f", r.RoughnessAllowance*1e3), fmt.Sprintf("%.3f", r.CorrelationAllowance*1e3),
			fmt.Sprintf("%.3f", r.ShipCT*1e3),
			rc.cell(r.ShipResistance.Value()), ec.cell(r.EffectivePower.Value()),
			fmt.Sprintf("%.3f", r.ShipWake), fmt.Sprintf("%.3f", r.J), fmt.Sprintf("%.4f", r.KT), fmt.Sprintf("%.4f", 10*r.KQ),
			fmt.Sprintf("%.3f", r.Eta0), fmt.Sprintf("%.3f", r.EtaH), fmt.Sprintf("%.3f", r.EtaR), fmt.Sprintf("%.3f", r.EtaD),
			fmt.Sprintf("%.1f", r.RPM), dc.cell(r.DeliveredPower.Value()),
		})
	}
	var sb strings.Builder
	sb.WriteString("ITTC-1978 performance prediction (K_T, 10K_Q with n in rev/s; C_TS = (1 + k)C_FS + ΔC_F + C_A + C_R + C_AAS; P_D of all shafts)\n")
	if md {
		sb.WriteString("\n")
	}
	sb.WriteString(similarity.FormatTable(head, rows, md, true))
	if formula {
		sb.WriteString("C_A from the procedure's formula (5.68 − 0.6·log₁₀Re_S)·10⁻³ where the basin gave none\n")
	}
	for _, w := range warn {
		sb.WriteString(w + "\n")
	}
	sb.WriteString("CAUTION: " + PoweringCaution + "\n")
	return sb.String()
}

// sigDecimals is the number of decimals that shows x to n significant
// figures, none when x has n digits before the point: the tables print
// a resistance or a power of a small ship as 0.3184 kW, never as 0.
func sigDecimals(x float64, n int) int {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return 0
	}
	return min(max(0, n-1-int(math.Floor(math.Log10(math.Abs(x))))), 12)
}

// sig4 formats x to four significant figures (see sigDecimals).
func sig4(x float64) string { return sigN(x, 4) }

// sigN formats x to n significant figures, trailing zeros kept, so that
// one quantity printed twice has one digit count: 0.001 to two figures
// is 0.0010, beside 0.0032 (see sigDecimals).
func sigN(x float64, n int) string {
	d := sigDecimals(x, n)
	if r, err := strconv.ParseFloat(strconv.FormatFloat(x, 'e', n-1, 64), 64); err == nil && r != 0 {
		d = sigDecimals(r, n) // of x rounded, so that 0.99996 to four figures is 1.000
	}
	return fmt.Sprintf("%.*f", d, x)
}

// fmtCoef formats a coefficient to four significant digits with its unit.
func fmtCoef(x float64, unit string) string { return fmt.Sprintf("%.4g %s", x, unit) }

// column is a table column of a force or a power in one unit: the base
// unit with the SI prefix its largest value calls for.
type column struct {
	unit  string  // the prefixed unit, for the header
	scale float64 // the prefix's factor
}

// siColumn chooses the SI prefix of a column of forces or powers from
// its largest magnitude, rounded to four significant figures: the prefix
// that leaves that value between 10 and 9999 in the prefixed unit, so
// that four significant figures never pad a whole number with zeros
// (milli for a column below 1, and at most mega, the ship trade's range).
// Every value of the column is printed in that unit, so that the header
// names it once and truthfully: a column up to 29 076 kN is in MN
// (29.08), one up to 1618 W stays in W (124.1 … 1618), one up to
// 1297 kW stays in kW.
func siColumn(vals []float64, base string) column {
	big := 0.0
	for _, v := range vals {
		if r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'e', 3, 64), 64); err == nil && !math.IsInf(r, 0) && !math.IsNaN(r) {
			big = max(big, math.Abs(r))
		}
	}
	e := 0
	switch {
	case big > 0 && big < 1:
		e = -3
	case big >= 1:
		e = max(0, min(6, 3*int(math.Floor(math.Log10(big/10)/3))))
	}
	prefix := map[int]string{-3: "m", 0: "", 3: "k", 6: "M"}[e]
	return column{unit: prefix + base, scale: math.Pow(10, float64(e))}
}

// cell writes v in the column's unit to four significant figures.
func (c column) cell(v float64) string { return sig4(v / c.scale) }

// decimals is the number of decimals cell gives v, for a band printed
// beside it.
func (c column) decimals(v float64) int {
	x := v / c.scale
	if r, err := strconv.ParseFloat(strconv.FormatFloat(x, 'e', 3, 64), 64); err == nil && r != 0 {
		x = r
	}
	return sigDecimals(x, 4)
}
