package turbo_test

import (
	"errors"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestAffinityScalesNamed: the affinity laws take their ratios by name; a
// missing one is refused with the field named, so swapped or forgotten
// ratios cannot pass silently.
func TestAffinityScalesNamed(t *testing.T) {
	var te *turbo.Error
	if _, err := turbo.AffinityLaws(turbo.AffinityScales{Diameter: 0.5, Density: 1}); !errors.As(err, &te) || te.Input != "rotational speed" {
		t.Errorf("missing rotational speed: %v", err)
	}
	// Model/prototype everywhere: a model at 2× the speed and 1/2 the
	// diameter has λ_Q = 2·(1/2)³ = 1/4 (affinity laws, common practice).
	a, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 2, Diameter: 0.5, Density: 1})
	if err != nil || math.Abs(a.Flow-0.25) > 1e-15 || math.Abs(a.Head-1) > 1e-15 || math.Abs(a.Power-2*2*2/32.0) > 1e-15 {
		t.Errorf("affinity %+v, %v", a, err)
	}
}

// TestAffinityScalesUnsetNamesTheFix: a ratio left zero is refused, the
// message naming the field and the value for "the same" (1), in the class
// quantity.ErrInvalid alone; a negative ratio stays a range error.
func TestAffinityScalesUnsetNamesTheFix(t *testing.T) {
	cases := []struct {
		name string
		sc   turbo.AffinityScales
		want string
	}{
		{"density", turbo.AffinityScales{RotationalSpeed: 1.2, Diameter: 0.5},
			"turbo: affinity laws: AffinityScales.Density is not set (0): give the model/prototype density ratio ρ_m/ρ_p: 1 for the same fluid"},
		{"speed", turbo.AffinityScales{Diameter: 0.5, Density: 1},
			"turbo: affinity laws: AffinityScales.RotationalSpeed is not set (0): give the model/prototype rotational speed ratio n_m/n_p: 1 for the same speed"},
		{"diameter", turbo.AffinityScales{RotationalSpeed: 1.2, Density: 1},
			"turbo: affinity laws: AffinityScales.Diameter is not set (0): give the model/prototype diameter ratio D_m/D_p: 1 for the same size"},
	}
	for _, c := range cases {
		_, err := turbo.AffinityLaws(c.sc)
		if err == nil || err.Error() != c.want || !errors.Is(err, quantity.ErrInvalid) || errors.Is(err, quantity.ErrRange) {
			t.Errorf("%s: %v\nwant %q (ErrInvalid)", c.name, err, c.want)
		}
	}
	if _, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 1, Diameter: 1, Density: -1}); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("negative density ratio: %v, want a range error", err)
	}
}
