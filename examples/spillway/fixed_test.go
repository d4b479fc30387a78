package main

import (
	"bytes"
	"math"
	"strings"
	"testing"
)

// TestModelFixedAcrossScales: the model is one geometry whatever -scale
// says (crest radius 0.03 m, crest length 0.76 m, design discharge
// 450/30^2.5 = 91.287 L/s, its measured rating); the prototype is the
// model × x. At 1:2 by hand: prototype crest radius 0.03·2 = 0.06 m,
// crest length 0.76·2 = 1.52 m, design discharge 0.091287·2^2.5 =
// 0.51640 m³/s; the model's design head is the default's, (Q/C)^(1/n) =
// 0.1401 m; the prototype's rating table reads in significant figures. It checked a 0.9/2 = 0.45 m model radius beside the 0.76 m
// crest and the rating measured on the 1:30 model.
func TestModelFixedAcrossScales(t *testing.T) {
	var def, two bytes.Buffer
	r30, err := evaluate(&def, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	r2, err := evaluate(&two, append([]string{"-scale", "2"}, noPlot...))
	if err != nil {
		t.Fatal(err)
	}
	qm := 450 / math.Pow(30, 2.5)
	if math.Abs(r2.ModelDischarge/qm-1) > 1e-12 || math.Abs(r30.ModelDischarge/qm-1) > 1e-12 {
		t.Errorf("model design discharges %v (1:2), %v (1:30), want %v", r2.ModelDischarge, r30.ModelDischarge, qm)
	}
	if r2.CrestRadius.Value != 0.03 || r30.CrestRadius.Value != 0.03 {
		t.Errorf("model crest radius %v (1:2), %v (1:30), want 0.03 m", r2.CrestRadius.Value, r30.CrestRadius.Value)
	}
	if math.Abs(r2.CrestHeads[0]/r30.CrestHeads[0]-1) > 1e-12 || math.Abs(r2.CrestHeads[0]-0.1401) > 5e-5 {
		t.Errorf("model design heads %v, %v, want one, 0.1401 m", r2.CrestHeads[0], r30.CrestHeads[0])
	}
	if qp := qm * math.Pow(2, 2.5); math.Abs(qp-0.51640) > 5e-6 {
		t.Fatalf("hand prototype discharge %v", qp)
	}
	// The rating table of the small prototype keeps four figures: at
	// h_p = 0.150 m, Q_p = 1.9641·(0.150/2)^1.5612·2^2.5 = 0.1947 m³/s
	// (the model rating's printed C and n); it printed "0.2 … 0.2".
	if qp := 1.9641 * math.Pow(0.075, 1.5612) * math.Pow(2, 2.5); math.Abs(qp-0.1947) > 1e-4 {
		t.Fatalf("hand Q_p %v", qp)
	}
	for _, want := range []string{
		"the model is fixed (crest radius 0.03 m, crest length 0.76 m, its measured rating below); the prototype is the model × 2",
		"design discharge 0.5164 m³/s → model 91.29 L/s",
		"crest: model radius 0.03 m, the prototype's 0.0600 m at 1:2",
		"crest radius R = 0.0300 m",
		"crest length b_m = 0.76 m (prototype 1.52 m)",
		"range of validity: model heads 0.075 … 0.180 m, prototype 0.150 … 0.360 m",
		"     0.150     0.1947      0.1924 … 0.1971 ",
	} {
		if !strings.Contains(two.String(), want) {
			t.Errorf("-scale 2 report lacks %q", want)
		}
	}
	if !strings.Contains(def.String(), "design discharge 450 m³/s → model 91.29 L/s") ||
		!strings.Contains(def.String(), "crest: model radius 0.03 m, the prototype's 0.900 m at 1:30") {
		t.Errorf("default report changed:\n%s", def.String())
	}
}

// TestDistortionAndGrainClass: at -hscale 5000 -vscale 2 the
// exaggeration is 5000/2 = 2500, beyond the 10 of common practice for
// river models, and FAILS; the movable-bed grain ratio is
// λ_z²/λ_x = (1/2)²/(1/5000) = 1250, so the 1 mm sand becomes a 1250 mm
// grain: a boulder (above 200 mm, ISO 14688-1), not "sand". The default
// (1:120 across, 1:30 deep) is exaggerated 4 times and passes, its grain
// 1 mm·(1/30)²/(1/120) = 0.133 mm, sand.
func TestDistortionAndGrainClass(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, append([]string{"-hscale", "5000", "-vscale", "2"}, noPlot...))
	if err != nil {
		t.Fatal(err)
	}
	if r.DistortionCheck.Pass || r.DistortionCheck.Value != 2500 || math.Abs(r.ModelGrain-1.25) > 1e-12 || r.ModelGrainClass != "boulders" {
		t.Errorf("check %v, grain %v m (%s)", r.DistortionCheck, r.ModelGrain, r.ModelGrainClass)
	}
	for _, want := range []string{
		"vertical exaggeration λ_z/λ_x = 2500 (limit ≤ 10, common practice for river models",
		"FAILS: distortion beyond common practice",
		"model grain size d50 = 1250 mm (boulders, by the size classes of ISO 14688-1",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("report lacks %q", want)
		}
	}
	if strings.Contains(out.String(), "model sand") {
		t.Error("a 1.25 m grain is called sand")
	}
	out.Reset()
	r, err = evaluate(&out, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	if !r.DistortionCheck.Pass || math.Abs(r.ModelGrain-1e-3/7.5) > 1e-15 || r.ModelGrainClass != "sand" ||
		!strings.Contains(out.String(), "vertical exaggeration λ_z/λ_x = 4.00 (limit ≤ 10") ||
		!strings.Contains(out.String(), "model grain size d50 = 0.133 mm (sand,") {
		t.Errorf("default: check %v, grain %v m (%s)", r.DistortionCheck, r.ModelGrain, r.ModelGrainClass)
	}
}
