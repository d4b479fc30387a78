package hydraulic_test

import (
	"errors"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// TestNamedInputs: the sediment ratios and the Shields input are named, a
// bad one is refused naming its field, and an unset gravity is g_n.
func TestNamedInputs(t *testing.T) {
	var he *hydraulic.Error
	_, err := hydraulic.SedimentFor(hydraulic.SedimentRatios{Horizontal: 1.0 / 40, Vertical: 1.0 / 40, Viscosity: 1})
	if !errors.As(err, &he) || he.Input != "RelativeDensity" || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("SedimentFor without λ_Δ: %v", err)
	}
	in := hydraulic.ShieldsInput{BedShearStress: q.New(0.5, q.Pressure), GrainDensity: q.New(2650, q.Density),
		WaterDensity: q.New(998.2, q.Density), GrainDiameter: q.New(2e-4, q.Length), KinematicViscosity: q.New(1.0e-6, q.KinematicViscosity)}
	unset, _, err1 := hydraulic.Shields(in)
	in.Gravity = q.New(9.80665, q.Acceleration)
	given, _, err2 := hydraulic.Shields(in)
	// θ = 0.5/((2650 − 998.2)·9.80665·2e-4) = 0.154 33 by hand.
	if err1 != nil || err2 != nil || unset != given || unset < 0.15433 || unset > 0.15434 {
		t.Errorf("Shields with g unset %v (%v), with g_n %v (%v); want 0.15433", unset, err1, given, err2)
	}
	in.GrainDensity, in.WaterDensity = in.WaterDensity, in.GrainDensity
	if _, _, err := hydraulic.Shields(in); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("Shields with the densities swapped: %v", err)
	}
}
