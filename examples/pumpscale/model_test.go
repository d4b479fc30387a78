package main

import (
	"bytes"
	"math"
	"regexp"
	"strings"
	"testing"
)

// TestModelFlagsCarryTheTest: the invented curve was taken on a 10 in
// impeller at 1750 rpm; -dm 2 -nm 100 describe a model that was not
// tested, whose curve is the test carried by the affinity laws. By hand
// for the 200 gpm, 118 ft, 52 % point:
//
//	Q = 200·(100/1750)·(2/10)³ = 0.091429 gpm
//	H = 118·(100/1750)²·(2/10)² = 0.015412 ft
//	η_BEP = 1 − 0.165·(10/2)^0.2 = 0.77234 (Moody's efficiency formula,
//	a step-down), so every point loses 6.266 points: 52 % → 45.73 %
//
// The head coefficient ψ = gH/u² is then the tested model's: at the BEP
// u = π·0.0508·100/60 = 0.26599 m/s, H = 96 ft·(100/1750)²·0.2² =
// 0.0038218 m, ψ = 9.80665·0.0038218/0.26599² = 0.5297, as at 10 in and
// 1750 rpm (u = 23.274 m/s, H = 29.2608 m, ψ = 0.5297); it printed the
// tested curve (200 gpm, 118 ft) whatever -dm and -nm said, ψ ≈ 4800.
// The specific speed is the tested model's, 1614, not 92.
func TestModelFlagsCarryTheTest(t *testing.T) {
	var out bytes.Buffer
	rows, s, err := evaluateAll(&out, []string{"-out", "", "-dm", "2", "-dp", "2", "-nm", "100", "-np", "100"})
	if err != nil {
		t.Fatal(err)
	}
	const gpm, ft = 3.785411784e-3 / 60, 0.3048
	r := rows[0]
	if got, want := r.ModelQ.Value(), 200*(100.0/1750)*0.008*gpm; math.Abs(got/want-1) > 1e-12 {
		t.Errorf("model Q %v m³/s, by hand %v", got, want)
	}
	if got, want := r.ModelH.Value(), 118*math.Pow(100.0/1750, 2)*0.04*ft; math.Abs(got/want-1) > 1e-12 {
		t.Errorf("model H %v m, by hand %v", got, want)
	}
	if got, want := r.ModelEta.Value(), 0.52-0.165*(math.Pow(5, 0.2)-1); math.Abs(got-want) > 1e-12 || math.Abs(want-0.457345) > 1e-6 {
		t.Errorf("model η %v, by hand %v", got, want)
	}
	u := math.Pi * 0.0508 * 100 / 60
	psi := 9.80665 * rows[3].ModelH.Value() / (u * u)
	ut := math.Pi * 0.254 * 1750 / 60
	if psiT := 9.80665 * 96 * ft / (ut * ut); math.Abs(psi-psiT) > 1e-9 || math.Abs(psi-0.5297) > 5e-5 {
		t.Errorf("ψ = %v, tested model's %v (0.5297 by hand)", psi, psiT)
	}
	if math.Abs(s.SpecificSpeed.US-1750*math.Sqrt(800)/math.Pow(96, 0.75)) > 1e-6 {
		t.Errorf("N_s = %v, want the tested model's 1614", s.SpecificSpeed.US)
	}
	for _, want := range []string{
		" 0.09143  0.01541 ", "45.7% |",
		"the invented test was taken on a 10 in impeller at 1750 rpm (the tested model); the model here, 2 in at 100 rpm, was not tested",
		"specific speed N_s = 1614 (rpm, gpm, ft)",
		"NOTE: the prototype (2 in) is smaller than the tested model: its efficiency is the test's stepped down",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("report lacks %q", want)
		}
	}
	if strings.Contains(out.String(), "    200  118.0") {
		t.Error("the tested curve is printed as the 2 in model's")
	}
}

// TestPrototypeFromTheTest: the prototype's curve comes from the test,
// whatever model -dm and -nm name: the affinity laws compose, and so does
// Moody's efficiency formula, (1 − η)(10/8)^n·(8/24)^n = (1 − η)(10/24)^n.
// An 8 in model at 2000 rpm gives the default prototype's rows (24 in at
// 1180 rpm, 7457 gpm at 86.15 % at the BEP).
func TestPrototypeFromTheTest(t *testing.T) {
	def, err := evaluate(&bytes.Buffer{}, []string{"-out", ""})
	if err != nil {
		t.Fatal(err)
	}
	other, err := evaluate(&bytes.Buffer{}, []string{"-out", "", "-dm", "8", "-nm", "2000"})
	if err != nil {
		t.Fatal(err)
	}
	for i := range def {
		a, b := def[i], other[i]
		for k, p := range [][2]float64{{a.ProtoQ.Value(), b.ProtoQ.Value()}, {a.ProtoH.Value(), b.ProtoH.Value()}, {a.ProtoEta, b.ProtoEta}, {a.ProtoP.Value(), b.ProtoP.Value()}} {
			if math.Abs(p[1]/p[0]-1) > 1e-12 {
				t.Errorf("point %d, quantity %d: %v from the 8 in model, %v from the tested one", i, k, p[1], p[0])
			}
		}
	}
	if eta := 1 - 0.165*math.Pow(10.0/24, 0.2); math.Abs(other[3].ProtoEta-eta) > 1e-12 {
		t.Errorf("BEP η_p %v, by hand %v", other[3].ProtoEta, eta)
	}
}

// TestReadableRefusalAndColumns: the IEC 60193 refusal is a note in
// words, with the Reynolds number to three figures and no package
// prefix: Re_M = 0.0508·(π·0.0508·100/60)/1.0034e-6 = 1.35×10⁴. The SI
// columns carry the US ones' significant figures: at -dp 240 -np 50 the
// 200 gpm point goes to 200·(50/1750)·24³ = 78994 gpm = 4983.8 L/s (4984),
// 118·(50/1750)²·24² = 55.484 ft = 16.912 m, and at η_p = 0.52 +
// 0.165·(1 − (10/240)^0.2) = 0.59761, P = 995.65·9.80665·4.98377·16.9115/
// 0.59761 = 1377.0 kW (1377) = 1846.6 hp (1847).
func TestReadableRefusalAndColumns(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-out", "", "-dm", "2", "-dp", "2", "-nm", "100", "-np", "100"}); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	if !strings.Contains(s, "(IEC 60193 step-up not applied: Re_M = 1.35×10⁴, below 10⁵)") {
		t.Errorf("no readable refusal in\n%s", s)
	}
	if strings.Contains(s, "turbo:") || regexp.MustCompile(`[1-9]\d{6,}|[1-9]\d*\.\d{6,}`).MatchString(s[:strings.Index(s, "Acceptance test")]) {
		t.Errorf("package prefix or a long float in\n%s", s)
	}
	out.Reset()
	if _, err := evaluate(&out, []string{"-out", "", "-dp", "240", "-np", "50"}); err != nil {
		t.Fatal(err)
	}
	if want := "    78994    55.48      1847  59.8% |      4984    16.91      1377\n"; !strings.Contains(out.String(), want) {
		t.Errorf("report lacks %q:\n%s", want, out.String())
	}
}
