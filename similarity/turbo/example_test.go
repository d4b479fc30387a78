package turbo_test

import (
	"fmt"

	"similis.dev/similis/similarity/turbo"
)

// Pump affinity laws for a 20 % speed-up and a doubled impeller.
func ExampleAffinityLaws() {
	a, _ := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 1.2, Diameter: 2, Density: 1})
	fmt.Printf("flow ×%.2f, head ×%.2f, power ×%.2f\n", a.Flow, a.Head, a.Power)
	// Output:
	// flow ×9.60, head ×5.76, power ×55.30
}
