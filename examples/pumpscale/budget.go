package main

import (
	"fmt"
	"io"
	"math"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
)

// Invented readings of the model's suction test at the NPSH3 point (3 %
// head drop at the best-efficiency flow), and the invented uncertainties
// of the loop's instruments.
const (
	suctionGauge = -66.68e3 // Pa, gauge: the suction transducer reads against the room
	barometer    = 101.0e3  // Pa, absolute, the day's barometer
	suctionPipeD = 0.1524   // m, the model's suction pipe (6 in)
	uGauge       = 150.0    // Pa, suction transducer calibration
	uBarometer   = 50.0     // Pa, barometer calibration
	uThermometer = 0.2      // K, loop thermometer
	uFlow        = 0.005    // relative, flowmeter
	uNPSH3Pick   = 0.04     // m, repeatability of the 3 % drop point (Type A)
	dofNPSH3Pick = 5        // six suction curves
	coverage95   = 0.95
)

// gpmOf returns a flow in US gallons per minute, for the report.
func gpmOf(x q.Quantity) float64 {
	f, _ := units.MustParse("gpm").ValueOf(x)
	return f
}

// NPSHBudget is the model's NPSH3 found from its suction readings and
// carried to the prototype, with their uncertainties.
type NPSHBudget struct {
	Model, Proto uncertain.Measured
	Budget       uncertain.Budget // of the prototype's NPSH3, in m
}

// npshBudget finds the model's NPSH3 from the suction readings,
// NPSH3 = (p_gauge + p_baro − p_v(T))/(ρ(T)·g) + V²/(2g) with V = Q/A, and
// carries it to the prototype by the Thoma number held equal:
// NPSH3_p = NPSH3_m·H_p/H_m, the head ratio being the exact affinity ratio
// (the head reading cancels). The thermometer reaches p_v and ρ through
// their exact temperature slopes.
func npshBudget(w io.Writer, bepFlow q.Quantity, headRatio float64) (NPSHBudget, error) {
	set := uncertain.NewSet()
	src := func(s uncertain.Source) uncertain.ID { return set.MustAdd(s) }
	sys := uncertain.Systematic
	gauge := src(uncertain.Source{Name: "suction transducer", U: q.New(uGauge, q.Pressure), Effect: sys})
	baro := src(uncertain.Source{Name: "barometer", U: q.New(uBarometer, q.Pressure), Effect: sys})
	therm := src(uncertain.Source{Name: "loop thermometer", U: q.New(uThermometer, q.Temperature), Effect: sys})
	flow := src(uncertain.Source{Name: "flowmeter", U: q.Scalar(uFlow), Relative: true, Effect: sys})
	pick := src(uncertain.Source{Name: "3 % drop point (6 curves)", U: q.New(uNPSH3Pick, q.Length), Type: uncertain.TypeA, DoF: dofNPSH3Pick, Effect: uncertain.Random})

	T := q.New(modelWaterC+273.15, q.Temperature)
	pv, dpv, err := fluids.VapourPressureSlope(T)
	if err != nil {
		return NPSHBudget{}, err
	}
	st, err := fluids.FreshWater().At(T, q.New(barometer, q.Pressure))
	if err != nil {
		return NPSHBudget{}, err
	}
	drho, _, err := fluids.FreshWater().Slopes(T)
	if err != nil {
		return NPSHBudget{}, err
	}
	g := units.StandardGravity()
	area := q.New(math.Pi/4*suctionPipeD*suctionPipeD, q.Area)
	var out NPSHBudget
	out.Model, err = uncertain.Eval(func() uncertain.Measured {
		Tm := set.MustMeasure(T, therm)
		pvm := uncertain.Apply(Tm, pv, dpv)
		rho := uncertain.Apply(Tm, st.Density, drho)
		p := set.MustMeasure(q.New(suctionGauge, q.Pressure), gauge).Add(set.MustMeasure(q.New(barometer, q.Pressure), baro))
		v := set.MustMeasure(bepFlow, flow).DivQ(area)
		head := p.Sub(pvm).Div(rho.MulQ(g))
		return head.Add(v.Mul(v).DivQ(g.Scale(2))).Add(set.MustMeasure(q.New(0, q.Length), pick))
	})
	if err != nil {
		return NPSHBudget{}, err
	}
	out.Proto = out.Model.Scale(1 / headRatio)
	if out.Budget, err = out.Proto.Budget("NPSH3 (prototype)", coverage95); err != nil {
		return NPSHBudget{}, err
	}
	out.Budget = out.Budget.In("m", 1)
	if out.Proto.Value() < 0.1 { // a small prototype's NPSH3 reads in mm
		out.Budget = out.Budget.In("mm", 1e-3)
	}
	fmt.Fprintf(w, "\nNPSH3 with its uncertainty (invented suction readings and instrument figures; standard uncertainties, first order, GUM):\n")
	fmt.Fprintf(w, "  tested model (%g in at %g rpm): suction %.2f kPa gauge + barometer %.1f kPa absolute − p_v(%g °C) %.0f Pa, over ρg, + V²/2g at %g gpm in a %.1f in pipe\n",
		testDiaIn, testRPM, suctionGauge/1e3, barometer/1e3, modelWaterC, pv.Value(), gpmOf(bepFlow), suctionPipeD/0.0254)
	fmt.Fprintf(w, "  = %.3f m (%.2f ft), u = %.3f m; the gauge reading is relative to the day's barometer, which is a source of its own\n",
		out.Model.Value(), out.Model.Value()/0.3048, out.Model.U().Value())
	fmt.Fprintf(w, "  prototype NPSH3 = tested model's NPSH3·H_p/H_t (the head reading cancels in σ·H_p):\n\n")
	fmt.Fprint(w, out.Budget)
	return out, nil
}
