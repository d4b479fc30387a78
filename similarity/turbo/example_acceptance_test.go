package turbo_test

import (
	"fmt"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
	"similis.dev/similis/units"
)

// An acceptance test of a pump specified at 1480 rpm (invented readings):
// the points are reduced to 1480 rpm, the curves fitted, and the
// guarantee judged against grade 2B.
func ExampleCheckGuarantee() {
	rpm, ls, kw := units.MustParse("rpm"), units.MustParse("L/s"), units.MustParse("kW")
	m := units.MustParse("m")
	readings := [][4]float64{ // Q L/s, H m, P kW, n rpm
		{60, 44.4, 36.8, 1478}, {75, 42.4, 40.6, 1476}, {90, 40.2, 44.6, 1482},
		{100, 38.6, 47.2, 1481}, {110, 36.8, 49.9, 1479}, {125, 34.0, 53.9, 1477}, {140, 30.8, 57.9, 1483},
	}
	var pts []turbo.TestPoint
	for _, r := range readings {
		pts = append(pts, turbo.TestPoint{Flow: ls.Of(r[0]), Head: m.Of(r[1]), Power: kw.Of(r[2]), Speed: rpm.Of(r[3])})
	}
	red, err := turbo.ReducePoints(pts, turbo.TestConditions{SpecifiedSpeed: rpm.Of(1480), Density: q.New(998.2, q.Density)})
	if err != nil {
		fmt.Println(err)
		return
	}
	curves, err := turbo.FitPumpCurves(red, turbo.CurveOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	g := turbo.Guarantee{Flow: ls.Of(100), Head: m.Of(39), Efficiency: 0.80}
	v, err := turbo.CheckGuarantee(curves, g, turbo.Grade2B)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Q–H order %d, Q–η order %d\n", curves.Head.Order, curves.Efficiency.Order)
	fmt.Printf("H(Q_G) = %.2f m, bar %.2f … %.2f m: %v\n", v.HeadAtGuaranteeFlow.Y, v.HeadBar[0], v.HeadBar[1], v.MeetsVertical)
	fmt.Printf("η at Q_X = %.1f L/s: %.3f ≥ %.3f: %v\n", 1e3*v.Intersection[0], v.EfficiencyAt.Y, v.EfficiencyMin, v.EfficiencyMet)
	fmt.Println("grade", v.Grade, "met:", v.Met)
	fmt.Print(v.Table(false))
	// Output:
	// Q–H order 2, Q–η order 3
	// H(Q_G) = 38.61 m, bar 37.05 … 40.95 m: true
	// η at Q_X = 99.3 L/s: 0.800 ≥ 0.760: true
	// grade 2B met: true
	// Acceptance check, grade 2B (t_Q ±8 %, t_H ±5 %, t_P +8 %, t_η −5 %): MET, PROVISIONAL
	// check                      fitted        tolerance           met
	// H at Q_G (vertical bar)    38.61 m       37.05 … 40.95 m     yes
	// Q at H_G (horizontal bar)  0.09772 m³/s  0.092 … 0.108 m³/s  yes
	// η at Q_X = 0.09931 m³/s    0.8001        ≥ 0.7600            yes
	// PROVISIONAL: the verdict rests on tolerance factors and a test-speed band quoted from memory; check them against ISO 9906:2012 Table 8 (and the contract, which may set its own) before a pump is accepted or rejected on it
	// CAUTION: Pump and turbine performance scaled from a model test is an estimate subject to scale effects; guaranteed performance comes from the acceptance test to the applicable standard (ISO 9906, IEC 60193), and the installation, its suction conditions and its pressure parts are designed to the applicable local codes and checked by licensed engineers.
}

// NPSH3 from a suction series at constant flow: the head at high NPSHA
// is the reference, and NPSH3 is where the faired head is 97 % of it.
func ExampleFindNPSH3() {
	m := units.MustParse("m")
	readings := [][2]float64{ // NPSHA m, H m
		{9, 38.62}, {8, 38.58}, {7, 38.60}, {6, 38.55}, {5, 38.3}, {4.5, 37.9}, {4, 37.0}, {3.5, 35.2},
	}
	var s []turbo.SuctionPoint
	for _, r := range readings {
		s = append(s, turbo.SuctionPoint{NPSHA: m.Of(r[0]), Head: m.Of(r[1])})
	}
	r, err := turbo.FindNPSH3(s, turbo.NPSH3Options{NPSHU: m.Of(0.05)})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("reference %.2f m, 97 %% = %.2f m\n", r.ReferenceHead.Value(), r.DropHead.Value())
	fmt.Printf("NPSH3 = %.2f m, u = %.3f m\n", r.NPSH3.Value(), r.U.Value())
	// Output:
	// reference 38.60 m, 97 % = 37.44 m
	// NPSH3 = 4.20 m, u = 0.052 m
}

// One test point taken at 1450 rpm, reduced to the specified 1480 rpm.
func ExampleReducePoints() {
	rpm, ls, kw, m := units.MustParse("rpm"), units.MustParse("L/s"), units.MustParse("kW"), units.MustParse("m")
	pts := []turbo.TestPoint{{Flow: ls.Of(100), Head: m.Of(40), Power: kw.Of(50), Speed: rpm.Of(1450)}}
	red, err := turbo.ReducePoints(pts, turbo.TestConditions{SpecifiedSpeed: rpm.Of(1480), Density: q.New(998.2, q.Density)})
	if err != nil {
		fmt.Println(err)
		return
	}
	r := red[0]
	fmt.Printf("Q %.2f L/s, H %.2f m, P %.2f kW, η %.1f %%\n", 1e3*r.Flow.Value(), r.Head.Value(), r.Power.Value()/1e3, 100*r.Efficiency)
	// Output:
	// Q 102.07 L/s, H 41.67 m, P 53.17 kW, η 78.3 %
}

// The tolerance factors of grade 2B.
func ExampleGrade_Tolerance() {
	t, _ := turbo.Grade2B.Tolerance()
	fmt.Printf("t_Q ±%g %%, t_H ±%g %%, t_P +%g %%, t_η −%g %%\n", 100*t.FlowPlus, 100*t.HeadPlus, 100*t.PowerPlus, 100*t.EfficiencyMinus)
	// Output:
	// t_Q ±8 %, t_H ±5 %, t_P +8 %, t_η −5 %
}
