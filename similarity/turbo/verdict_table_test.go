package turbo_test

import (
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestVerdictProvisionalAndTable: every verdict says PROVISIONAL itself
// (its first note) and carries PumpCaution, and its Table prints each
// check. Grade 1E on handCurves (Q_G = 0.1 m³/s, H_G = 40 m, η_G = 0.80,
// P_G = 50 kW), by hand (see TestCheckGuaranteeByHand): t_Q ±5 %, t_H
// ±3 %, t_P +4 %, t_η 0; H(Q_G) = 39.2 m in 40·(0.97 … 1.03) =
// 38.8 … 41.2 m; H = H_G at Q = √(7.2/800) = 0.09487 m³/s, outside
// 0.1·(0.95 … 1.05); Q_X = 0.0985685 m³/s, η(Q_X) = 0.7935 < 0.80 and
// P(Q_X) = 49.57 kW ≤ 50·1.04 = 52 kW: NOT MET.
func TestVerdictProvisionalAndTable(t *testing.T) {
	g := turbo.Guarantee{Flow: q.New(0.1, q.VolumeFlowRate), Head: q.New(40, q.Length), Power: q.New(50e3, q.Power), Efficiency: 0.80}
	v, err := turbo.CheckGuarantee(handCurves(t), g, turbo.Grade1E)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([]string{turbo.ProvisionalNote}, v.Notes); d != "" || v.Caution != turbo.PumpCaution {
		t.Errorf("notes (-want +got):\n%s\ncaution %q", d, v.Caution)
	}
	want := []string{
		"Acceptance check, grade 1E (t_Q ±5 %, t_H ±3 %, t_P +4 %, t_η 0 %): NOT MET, PROVISIONAL",
		"check                      fitted                  tolerance           met",
		"H at Q_G (vertical bar)    39.2 m                  38.8 … 41.2 m       yes",
		"Q at H_G (horizontal bar)  0.09487 m³/s (outside)  0.095 … 0.105 m³/s  NO",
		"η at Q_X = 0.09857 m³/s    0.7935                  ≥ 0.8000            NO",
		"P at Q_X = 0.09857 m³/s    49.57 kW                ≤ 52 kW             yes",
		turbo.ProvisionalNote,
		"CAUTION: " + turbo.PumpCaution,
		"",
	}
	if d := cmp.Diff(want, strings.Split(v.Table(false), "\n")); d != "" {
		t.Errorf("Table (-want +got):\n%s", d)
	}
	if v.String() != v.Table(false) {
		t.Error("String is not Table(false)")
	}
	v2u, err := turbo.CheckGuarantee(handCurves(t), g, turbo.Grade2U)
	if err != nil {
		t.Fatal(err)
	}
	if first, _, _ := strings.Cut(v2u.Table(false), "\n"); first != "Acceptance check, grade 2U (t_Q +16 %, t_H +10 %, t_P +16 %, t_η −5 %): NOT MET, PROVISIONAL" {
		t.Errorf("2U heading %q", first)
	}
	if md := v.Table(true); !strings.Contains(md, "| H at Q_G (vertical bar) | 39.2 m") {
		t.Errorf("Markdown table:\n%s", md)
	}
}
