package units_test

import (
	"encoding/json"
	"errors"
	"flag"
	"fmt"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

func ExampleConvert() {
	kpa, _ := units.Convert(14.7, "psi", "kPa")
	f, _ := units.Convert(20, "°C", "°F")
	h, _ := units.Convert(1, "BTU/(h*ft^2*degF)", "W/(m²·K)")
	fmt.Printf("%.4f kPa, %.1f °F, %.6f W/(m²·K)\n", kpa, f, h)
	_, err := units.Convert(1500, "rpm", "Hz")
	fmt.Println(errors.Is(err, units.ErrAngle))
	// Output:
	// 101.3529 kPa, 68.0 °F, 5.678263 W/(m²·K)
	// true
}

func ExampleParse() {
	u, err := units.Parse("BTU/(h*ft^2*degF)")
	if err != nil {
		panic(err)
	}
	fmt.Println(u.Format(quantity.Unicode), "|", u, "|", quantity.KindName(u.Dim()))
	_, err = units.Parse("W/m K")
	fmt.Println(err)
	_, err = units.Parse("kpa")
	fmt.Println(err)
	// Output:
	// BTU/(h·ft²·°F) | BTU/(h*ft^2*degF) | heat transfer coefficient
	// units: "W/m K": at offset 4: ambiguous expression: a product after a division: write the denominator in parentheses, as in W/(m·K), or put the factor first, as in K·W/m
	// units: "kpa": at offset 0: unknown unit symbol: "kpa" (did you mean "kPa", "Da" or "Pa"?)
}

func ExampleParseQuantity() {
	v, _ := units.ParseQuantity("12.5 kn")
	t, _ := units.ParseQuantity("20 °C")
	fmt.Printf("%.4f %v\n", v.Value(), v.Dim().SIUnit())
	fmt.Println(t)
	// Output:
	// 6.4306 m·s⁻¹
	// 293.15 K
}

func ExamplePrinter() {
	p := units.Printer{Prefix: true, Precision: 4}
	fmt.Println(p.Format(units.StandardAtmosphere()))
	fmt.Println(p.Format(quantity.New(1.8e-5, quantity.DynamicViscosity)))
	s, _ := p.FormatIn(quantity.New(745.7, quantity.Power), units.MustParse("hp"))
	fmt.Println(s)
	p.Style = quantity.LaTeX
	fmt.Println(p.Format(quantity.New(0.6, quantity.ThermalConductivity)))
	// Output:
	// 101.3 kPa
	// 18.00 µPa·s
	// 1.000 hp
	// 0.6000\,\mathrm{W}/(\mathrm{m}\cdot \mathrm{K})
}

func ExampleTable_Define() {
	lab := units.NewTable()
	_ = lab.Define("TR", "12000 BTU/h") // ton of refrigeration
	kw, _ := lab.Convert(2, "TR", "kW")
	fmt.Printf("2 TR = %.3f kW\n", kw)
	// Output:
	// 2 TR = 7.034 kW
}

func ExampleNewFlag() {
	speed := units.NewFlag(quantity.Velocity, units.Value{Number: 10, Unit: units.MustParse("kn")})
	fs := flag.NewFlagSet("towing", flag.ContinueOnError)
	fs.Var(speed, "speed", "towing speed")
	fmt.Println(fs.Parse([]string{"-speed", "12kn"}), speed)
	fmt.Println(speed.Set("12 kg"))
	// Output:
	// <nil> 12 kn
	// 12 kg: want velocity [m·s⁻¹], got mass [kg]
}

// A Flag in a configuration read from JSON is checked as on the command
// line: a speed given for a flow, or a temperature difference given for
// a level, is refused.
func ExampleFlag_UnmarshalText() {
	cfg := struct {
		Flow *units.Flag `json:"flow"`
		Tin  *units.Flag `json:"t_in"`
	}{
		Flow: units.NewFlag(quantity.VolumeFlowRate, units.MustParseValue("1 L/s")),
		Tin:  units.NewFlag(quantity.Temperature, units.MustParseValue("20 °C")),
	}
	fmt.Println(json.Unmarshal([]byte(`{"flow": "1.2 m/s"}`), &cfg))
	fmt.Println(json.Unmarshal([]byte(`{"t_in": "20 Δ°C"}`), &cfg))
	fmt.Println(json.Unmarshal([]byte(`{"flow": "90 L/min", "t_in": "68 °F"}`), &cfg), cfg.Flow, cfg.Tin)
	// Output:
	// 1.2 m/s: want volume flow rate [m³·s⁻¹], got velocity [m·s⁻¹]
	// units: cannot convert Δ°C (thermodynamic temperature [K]) to °C (thermodynamic temperature [K]): "20 Δ°C" is a temperature difference; the flag takes a temperature level (°C, °F, K)
	// <nil> 90 L/min 68 °F
}

// A channel header written by an acquisition system is read with the
// data-sheet dialect, and each lenient reading is reported.
func ExampleParseDialect() {
	u, readings, err := units.ParseDialect("BTU/hr-ft2-F")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(u)
	for _, r := range readings {
		fmt.Println(" ", r)
	}
	_, _, err = units.ParseDialect("psig")
	fmt.Println(err)
	// Output:
	// BTU/(h*ft^2*degF)
	//   hr read as h (hour)
	//   - read as * (a hyphen between symbols read as a product)
	//   ft2 read as ft^2 (a trailing digit read as a power)
	//   - read as * (a hyphen between symbols read as a product)
	//   F read as degF (degree Fahrenheit, as an interval inside a compound unit)
	// units: "psig": at offset 0: gauge pressure needs a reference pressure: a gauge level is relative to the ambient pressure: read it with ParseGauge and make it absolute with Gauge.Absolute and a barometer reading (or StandardReference, chosen explicitly)
}

// A transducer vented to atmosphere reads a gauge level; the absolute
// pressure a cavitation number needs takes the day's barometer reading.
func ExampleGauge_Absolute() {
	g := units.MustParseGauge("12.5 psig")
	baro := units.MustParseValue("1002 hPa") // invented barometer reading
	p, err := g.Absolute(baro.Quantity())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v + %v = %.1f kPa absolute\n", g, baro, p.Value()/1000)
	_, err = units.ParseValue("12.5 psig")
	fmt.Println(errors.Is(err, units.ErrGauge))
	// Output:
	// 12.5 psi(g) + 1002 hPa = 186.4 kPa absolute
	// true
}
