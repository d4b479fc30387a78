package tunnel_test

import (
	"fmt"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// A cryogenic nitrogen tunnel for a 1:40 model of an aircraft at 18 km
// and Ma 0.6 (invented): the finder keeps the static test section above
// nitrogen's saturation and returns the safety cautions with the load
// against the balance's rating.
func ExampleFindCondition() {
	proto, _ := fluids.StandardAtmosphere(q.New(18000, q.Length), fluids.GeopotentialAlt)
	V := q.New(0.6*proto.SpeedOfSound.Value(), q.Velocity)
	lim := tunnel.Limits{MinTemperature: q.New(110, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e4, q.Pressure), MaxPressure: q.New(4.5e5, q.Pressure),
		CondensationMargin: q.New(5, q.Temperature), RatedLoad: q.New(150, q.Force), LoadArea: q.New(0.012, q.Area)}
	c, err := tunnel.FindCondition(fluids.Nitrogen(), proto, V, q.New(2, q.Length), 1.0/40, lim)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: T₀ = %.1f K, p₀ = %.3f bar, Re_m/Re = %.3f, set by %v\n", c.Gas, c.Total.Temperature.Value(), c.Total.Pressure.Value()/1e5, c.ReynoldsRatio, c.Binding)
	fmt.Printf("load %.0f N, overloaded %v, %d cautions\n", c.Load.Value(), c.Overloaded, len(c.Cautions))
	// Output:
	// nitrogen: T₀ = 110.0 K, p₀ = 1.309 bar, Re_m/Re = 1.000, set by [minimum total temperature]
	// load 310 N, overloaded true, 4 cautions
}

// A section test at Ma 0.62: the blockage grows by 1/β³ and
// (1 + 0.4Ma²)/β², and above Ma 0.8 the corrections are refused.
func ExampleCorrectWalls2D() {
	s := tunnel.Section2D{Chord: q.New(0.3, q.Length), Height: q.New(0.9, q.Length), ShapeFactor: 0.25,
		AlphaDeg: 6, CL: 0.82, CD: 0.0125, CM: -0.08, Mach: 0.62}
	r, err := tunnel.CorrectWalls2D(s)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("ε = %.5f, q/q_u = %.4f, C_l = %.4f\n", r.Blockage, r.DynamicPressureFactor, r.CL)
	s.Mach = 0.85
	_, err = tunnel.CorrectWalls2D(s)
	fmt.Println(err)
	// Output:
	// ε = 0.01378, q/q_u = 1.0223, C_l = 0.7713
	// tunnel: 2-D wall correction: test-section Mach number 0.85 outside 0 … 0.8: the linear compressible corrections do not hold there; use ventilated walls and a wall-pressure method
}
