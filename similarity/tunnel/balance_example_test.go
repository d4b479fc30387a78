package tunnel_test

import (
	"fmt"
	"strings"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// A three-component balance calibrated in the readings-from-loads form
// (invented): the readings of a point are inverted by iteration to the
// loads (the readings of TestBalanceIterativeByHand, worked there by
// hand from N = 1500 N, A = −80 N, m = 40 N·m), and a reading beyond the calibrated range is refused.
func ExampleParseCalibration() {
	const file = `similis-balance 1
name      B-3 (invented)
form      readings-from-loads
readings  mV/V
component NF N    -2000 2000
component AF N    -200  200
component PM N*m  -100  100
linear    NF 5e-4   2e-5  1e-5
linear    AF 1e-5   4e-3  0
linear    PM -2e-5  0     1e-2
quadratic NF 1e-9 2e-9 0 0 0 1e-8
quadratic AF 0 0 0 3e-8 0 0
quadratic PM 5e-10 0 2e-8 0 0 0
`
	c, err := tunnel.ParseCalibration(strings.NewReader(file))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(c)
	l, err := c.Loads([]float64{0.750826, -0.304808, 0.372325})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("NF = %.2f N, AF = %.2f N, PM = %.2f N·m\n", l[tunnel.NormalForce], l[tunnel.AxialForce], l[tunnel.PitchingMoment])
	_, err = c.Loads([]float64{1.2, 0, 0})
	fmt.Println(err)
	// Output:
	// 3-component balance "B-3 (invented)", readings-from-loads, readings in mV/V: NF -2000…2000 N AF -200…200 N PM -100…100 N·m
	// NF = 1500.00 N, AF = -80.00 N, PM = 40.00 N·m
	// tunnel: balance reduction: NF = 2388.79 N is outside the calibrated range -2000 … 2000: the calibration does not hold there and the balance may be overloaded
}

// Body-axis loads resolved in wind axes at α = 8°, and moved from the
// balance centre to a moment reference point 0.12 m ahead of it.
func ExampleLoads_ToWind() {
	var l tunnel.Loads
	l[tunnel.NormalForce], l[tunnel.AxialForce], l[tunnel.PitchingMoment] = 400, 12, 3
	m, err := l.About(tunnel.Offset{X: q.New(0.12, q.Length)})
	if err != nil {
		fmt.Println(err)
		return
	}
	w, err := m.ToWind(8, 0)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v: L = %.2f N, D = %.2f N, m = %.2f N·m\n", w.Axes, w.Lift, w.Drag, w.Pitch)
	// Output:
	// wind axes: L = 394.44 N, D = 67.55 N, m = -45.00 N·m
}

// The lift curve and parabolic polar fitted to corrected coefficients
// (invented, exact), the points above 10° left out as stalled.
func ExampleFitPolar() {
	alpha := []float64{-4, -2, 0, 2, 4, 6, 8, 10, 12, 14}
	var cl, cd []float64
	for _, a := range alpha {
		l := 0.09 * (a + 1.8)
		if a > 10 {
			l = 0.95
		}
		cl, cd = append(cl, l), append(cd, 0.021+0.055*l*l)
	}
	p, err := tunnel.FitPolar(alpha, cl, cd, -4, 10, 0)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%d points: dC_L/dα = %.4f /°, α₀ = %.2f°, C_D0 = %.4f, K = %.4f\n", p.N, p.LiftSlopePerDeg.Value, p.ZeroLiftAlphaDeg.Value, p.CD0.Value, p.K.Value)
	// Output:
	// 8 points: dC_L/dα = 0.0900 /°, α₀ = -1.80°, C_D0 = 0.0210, K = 0.0550
}

// One point of an invented run through the whole reduction: a
// three-component balance in the direct form, a 20 N model, the moments
// moved 50 mm forward, wind axes at 4°, coefficients on q_u and the wall
// corrections of a closed 6 m² section (the numbers of TestReduceByHand).
func ExampleReduction_Reduce() {
	cal, err := tunnel.NewCalibration("invented", tunnel.LoadsFromReadings, "mV/V",
		[]tunnel.ComponentRange{{tunnel.NormalForce, -1000, 1000}, {tunnel.AxialForce, -100, 100}, {tunnel.PitchingMoment, -50, 50}},
		[][]float64{{1000, 0, 0}, {0, 100, 0}, {0, 0, 10}}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	r := tunnel.Reduction{
		Calibration: cal,
		Tare:        tunnel.WeightTare{Weight: 20},
		Offset:      tunnel.Offset{X: q.New(0.05, q.Length)},
		Reference:   tunnel.Reference{Area: q.New(0.5, q.Area), Span: q.New(2, q.Length), Chord: q.New(0.2, q.Length)},
		Walls:       tunnel.Model3D{TunnelArea: q.New(6, q.Area), ModelVolume: q.New(0.01, q.Volume), ShapeFactor: 0.9, Delta: 0.12},
	}
	p, err := r.Reduce(tunnel.Point{Readings: []float64{0.3, 0.02, 0.05}, Attitude: tunnel.Attitude{PitchDeg: 4}, DynamicPressure: q.New(1000, q.Pressure)})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("L = %.2f N, D = %.2f N; uncorrected C_L = %.4f, C_D = %.4f\n", p.Wind.Lift, p.Wind.Drag, p.Uncorrected.CL, p.Uncorrected.CD)
	fmt.Printf("corrected: α = %.3f°, C_L = %.4f, C_D = %.4f, C_m = %.4f\n", p.Corrected.AlphaDeg, p.Corrected.CL, p.Corrected.CD, p.Corrected.CM)
	// Output:
	// L = 319.13 N, D = 22.92 N; uncorrected C_L = 0.6383, C_D = 0.0458
	// corrected: α = 4.365°, C_L = 0.6363, C_D = 0.0497, C_m = -0.1545
}
