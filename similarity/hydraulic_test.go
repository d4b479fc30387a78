package similarity_test

import (
	"fmt"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// TestFreeSurfaceChecks by hand: V = 0.4 m/s over h = 0.03 m of water
// (ν = 1.0035e-6 m²/s, ρ = 998.2 kg/m³, σ = 0.0727 N/m): Re = 11958
// passes 10⁴, We = 998.2·0.16·0.03/0.0727 = 65.9 fails 100, and 3 cm fails
// the 5 cm head.
func TestFreeSurfaceChecks(t *testing.T) {
	cs, err := similarity.FreeSurfaceChecks(quantity.New(0.4, quantity.Velocity), quantity.New(0.03, quantity.Length),
		quantity.New(1.0035e-6, quantity.KinematicViscosity), quantity.New(998.2, quantity.Density),
		quantity.New(0.0727, quantity.SurfaceTension), similarity.DefaultFreeSurfaceLimits())
	if err != nil {
		t.Fatal(err)
	}
	re, we := 0.4*0.03/1.0035e-6, 998.2*0.16*0.03/0.0727
	if math.Abs(cs[0].Value-re) > 1e-9*re || !cs[0].Pass || math.Abs(cs[1].Value-we) > 1e-9*we || cs[1].Pass || cs[2].Pass {
		t.Errorf("checks %v; by hand Re %v, We %v", cs, re, we)
	}
}

// TestShields by hand: τ = 0.5 Pa on quartz sand (2650 kg/m³) of 1 mm in
// water (998.2 kg/m³, ν = 1.0035e-6): θ = 0.5/(1651.8·9.80665·0.001) =
// 0.03087; u* = √(0.5/998.2) = 0.02238 m/s, Re* = 22.30. A 1:20 distorted
// model with vertical 1:5 in the same water with the same sand needs
// grains of λ_h²/λ_L = (1/25)/(1/20) = 0.8 of the prototype's.
func TestShields(t *testing.T) {
	th, rs, err := similarity.Shields(quantity.New(0.5, quantity.Pressure), quantity.New(2650, quantity.Density), quantity.New(998.2, quantity.Density),
		quantity.New(0.001, quantity.Length), quantity.New(1.0035e-6, quantity.KinematicViscosity), quantity.New(9.80665, quantity.Acceleration))
	if err != nil {
		t.Fatal(err)
	}
	wth := 0.5 / (1651.8 * 9.80665 * 0.001)
	wrs := math.Sqrt(0.5/998.2) * 0.001 / 1.0035e-6
	if math.Abs(th-wth) > 1e-12 || math.Abs(rs-wrs) > 1e-9 {
		t.Errorf("θ = %v, Re* = %v; by hand %v, %v", th, rs, wth, wrs)
	}
	s, err := similarity.SedimentFor(1.0/20, 1.0/5, 1, 1)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(s.Grain-0.8) > 1e-15 || math.Abs(s.ReStar-math.Sqrt(0.8)*0.8) > 1e-15 || !s.Exaggerated {
		t.Errorf("%+v", s)
	}
}

// A 1:40 undistorted movable-bed model: with the prototype's sand the
// grains would have to be 40 times smaller (silt, cohesive); with a light
// plastic of Δ = 0.05 against sand's 1.65 they can be larger.
func ExampleSedimentFor() {
	sand, _ := similarity.SedimentFor(1.0/40, 1.0/40, 1, 1)
	plastic, _ := similarity.SedimentFor(1.0/40, 1.0/40, 0.05/1.65, 1)
	fmt.Printf("same sand: grain ratio %.4f, Re* ratio %.4f\n", sand.Grain, sand.ReStar)
	fmt.Printf("light plastic: grain ratio %.3f, Re* ratio %.3f\n", plastic.Grain, plastic.ReStar)
	// Output:
	// same sand: grain ratio 0.0250, Re* ratio 0.0040
	// light plastic: grain ratio 0.825, Re* ratio 0.130
}
