package pigroups_test

import (
	"math"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
)

// TestPredictMarksExtrapolation: a prediction outside the fitted range
// says so, in the value and in its note.
func TestPredictMarksExtrapolation(t *testing.T) {
	re := []float64{1e4, 2e4, 5e4, 1e5, 2e5}
	y := make([]float64, len(re))
	for i, r := range re {
		y[i] = 0.023 * math.Pow(r, 0.8) * (1 + 0.001*float64(i%2)) // near Dittus–Boelter at Pr = 1
	}
	f, err := pigroups.FitPowerLaw(y, [][]float64{re}, &pigroups.FitOptions{Names: []string{"Nu", "Re"}})
	if err != nil {
		t.Fatal(err)
	}
	if f.Ranges[0] != [2]float64{1e4, 2e5} {
		t.Errorf("range %v", f.Ranges[0])
	}
	in, _ := f.Predict(5e4)
	if in.Extrapolated || in.Note() != "" {
		t.Errorf("inside the range: %+v", in)
	}
	for _, x := range []float64{5e3, 3e5} {
		out, err := f.Predict(x)
		if err != nil {
			t.Fatal(err)
		}
		if !out.Extrapolated || len(out.Outside) != 1 || out.Outside[0] != 1 || !strings.Contains(out.Note(), "EXTRAPOLATED: Re = ") {
			t.Errorf("Predict(%g): %+v, note %q", x, out, out.Note())
		}
	}
}
