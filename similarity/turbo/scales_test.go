package turbo_test

import (
	"errors"
	"math"
	"testing"

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
