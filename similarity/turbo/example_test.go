package turbo_test

import (
	"fmt"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// Pump affinity laws for a 20 % speed-up and a doubled impeller.
func ExampleAffinityLaws() {
	a, _ := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 1.2, Diameter: 2, Density: 1})
	fmt.Printf("flow ×%.2f, head ×%.2f, power ×%.2f\n", a.Flow, a.Head, a.Power)
	// Output:
	// flow ×9.60, head ×5.76, power ×55.30
}

// A model point carried to a prototype twice the size at half the speed:
// Q and H by the affinity laws, η by Moody's step-up, P = ρgQH/η_P.
func ExamplePrototypePointOf() {
	a, _ := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 2, Diameter: 0.5, Density: 1})
	d := turbo.Diameters{Model: q.New(0.25, q.Length), Prototype: q.New(0.5, q.Length)}
	etaP, _ := turbo.MoodyStepUp(0.80, d, turbo.MoodyStepUpOptions{})
	p, err := turbo.PrototypePointOf(turbo.PrototypeInput{Affinity: a,
		Model:   turbo.ModelPoint{Flow: q.New(0.025, q.VolumeFlowRate), Head: q.New(40, q.Length), Efficiency: 0.80},
		StepUp:  turbo.StepUpApplied{Method: "Moody, n = 1/5", Efficiency: etaP},
		Density: q.New(998.2, q.Density)})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Q_P = %.4g m³/s, H_P = %.4g m, η_P = %.4f (%s, +%.4f), P_P = %.4g kW\n",
		p.Flow.Value(), p.Head.Value(), p.Efficiency, p.StepUp, p.Gain, p.Power.Value()/1e3)
	// Output:
	// Q_P = 0.1 m³/s, H_P = 40 m, η_P = 0.8259 (Moody, n = 1/5, +0.0259), P_P = 47.41 kW
}
