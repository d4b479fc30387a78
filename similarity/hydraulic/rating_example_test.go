package hydraulic_test

import (
	"fmt"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// A 1:25 model weir's rating (invented measurements), checked for scale
// effects, fitted and carried to the prototype.
func ExampleFitRating() {
	heads := []float64{0.04, 0.08, 0.10, 0.12, 0.14, 0.16, 0.18}               // m, model
	flows := []float64{0.0119, 0.0349, 0.0490, 0.0640, 0.0808, 0.0990, 0.1179} // m³/s, model
	r, err := hydraulic.FitRating(hydraulic.RatingInput{
		Head: quantity.NewSeries(heads, quantity.Length), Discharge: quantity.NewSeries(flows, quantity.VolumeFlowRate),
		CrestLength: quantity.New(0.6, quantity.Length), LengthRatio: 1.0 / 25,
		KinematicViscosity: quantity.New(1.14e-6, quantity.KinematicViscosity),
		Density:            quantity.New(999.1, quantity.Density), SurfaceTension: quantity.New(0.0735, quantity.SurfaceTension),
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, p := range r.Points {
		if p.Excluded {
			fmt.Printf("h = %.2f m excluded: %v fails\n", p.Head, p.Failed)
		}
	}
	fmt.Printf("model: Q = %.3f·h^%.3f, n in [%.3f, %.3f]; C_d = %.3f\n", r.C, r.N, r.NInterval[0], r.NInterval[1], r.WeirCoefficient)
	lo, hi := r.ProtoHeadRange()
	fmt.Printf("prototype heads %.1f … %.1f m\n", lo, hi)
	v, _ := r.Prototype(quantity.New(3.5, quantity.Length))
	fmt.Printf("h_p = 3.5 m: Q_p = %.0f m³/s, band %.0f … %.0f m³/s\n", v.Discharge.Value(), v.Band[0].Value(), v.Band[1].Value())
	_, err = r.Prototype(quantity.New(6, quantity.Length))
	fmt.Println(err)
	// Output:
	// h = 0.04 m excluded: [head h] fails
	// model: Q = 1.545·h^1.500, n in [1.490, 1.511]; C_d = 0.872
	// prototype heads 2.0 … 4.5 m
	// h_p = 3.5 m: Q_p = 253 m³/s, band 252 … 254 m³/s
	// hydraulic: prototype rating: head 6 m is outside the range of validity 2 … 4.5 m: an extrapolation (use Extrapolate to make one deliberately)
}
