package ship

import (
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/similarity"
)

// Table writes the extrapolation as the trade presents it, one row per
// run: model speed, Fn, C_TM, C_FM and C_R (×10³), ship speed in knots,
// C_FS and C_TS (×10³; C_TS includes C_A), ship resistance in kN and
// effective power in kW; then the wetted surfaces, every warning and the
// caution. Markdown if md is set.
func (r *HullResult) Table(md bool) string {
	head := []string{"V_m m/s", "Fn", "C_TM×10³", "C_FM×10³", "C_R×10³", "V_s kn", "C_FS×10³", "C_TS×10³", "R_TS kN", "P_E kW"}
	var rows [][]string
	var warn []string
	for _, p := range r.Points {
		rows = append(rows, []string{
			fmt.Sprintf("%.3f", p.ModelSpeed.Value()), fmt.Sprintf("%.3f", p.Froude),
			fmt.Sprintf("%.3f", p.ModelCT*1e3), fmt.Sprintf("%.3f", p.ModelCF*1e3), fmt.Sprintf("%.3f", p.Residual*1e3),
			fmt.Sprintf("%.2f", p.ShipSpeed.Value()*3600/1852), fmt.Sprintf("%.3f", p.ShipCF*1e3), fmt.Sprintf("%.3f", p.ShipCT*1e3),
			fmt.Sprintf("%.2f", p.ShipResistance.Value()/1e3),
			fmt.Sprintf("%.1f", p.EffectivePower.Value()/1e3),
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
// includes ΔC_F, C_A and C_AAS), R_TS (kN), P_E (kW), w_TS, J, K_T, 10K_Q,
// η_O, η_H, η_R, η_D, n (rpm) and P_D (kW, all shafts), K_T and K_Q with
// n in revolutions per second (10K_Q as the other open-water tables print it); then the source of C_A, every warning and
// the caution. Markdown if md is set.
func PoweringTable(rs []PoweringResult, md bool) string {
	head := []string{"V_S kn", "Fn", "C_R×10³", "ΔC_F×10³", "C_A×10³", "C_TS×10³", "R_TS kN", "P_E kW", "w_TS", "J", "K_T", "10K_Q", "η_O", "η_H", "η_R", "η_D", "n rpm", "P_D kW"}
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
			sig4(r.ShipResistance.Value() / 1e3), sig4(r.EffectivePower.Value() / 1e3),
			fmt.Sprintf("%.3f", r.ShipWake), fmt.Sprintf("%.3f", r.J), fmt.Sprintf("%.4f", r.KT), fmt.Sprintf("%.4f", 10*r.KQ),
			fmt.Sprintf("%.3f", r.Eta0), fmt.Sprintf("%.3f", r.EtaH), fmt.Sprintf("%.3f", r.EtaR), fmt.Sprintf("%.3f", r.EtaD),
			fmt.Sprintf("%.1f", r.RPM), sig4(r.DeliveredPower.Value() / 1e3),
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
func sigN(x float64, n int) string { return fmt.Sprintf("%.*f", sigDecimals(x, n), x) }

// fmtCoef formats a coefficient to four significant digits with its unit.
func fmtCoef(x float64, unit string) string { return fmt.Sprintf("%.4g %s", x, unit) }
