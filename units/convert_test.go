package units_test

import (
	"math"
	"testing"

	"similis.dev/similis/units"
)

// conversionCase is one check of Convert against the outside world.
type conversionCase struct {
	v        float64
	from, to string
	want     float64
	rel      float64 // relative tolerance: 1e-12 for exact factors, else the published digits
	source   string
}

const exact = 1e-12

// The published digits from NIST SP 811 (2008), App. B.9 are quoted from
// memory, to the 7 significant figures NIST gives; the tolerance for them,
// 5e-7, is about half a unit in the last quoted digit.

var conversions = []conversionCase{
	// Length and area: exact from the international inch (1959).
	{1, "in", "m", 0.0254, exact, "exact by definition (1959 international inch)"},
	{1, "ft", "m", 0.3048, exact, "exact by definition"},
	{1, "yd", "m", 0.9144, exact, "exact by definition"},
	{1, "mi", "m", 1609.344, exact, "exact by definition"},
	{1, "nmi", "m", 1852, exact, "exact by definition (international nautical mile)"},
	{1, "mil", "m", 2.54e-5, exact, "exact by definition"},
	{1, "mil", "um", 25.4, exact, "exact by definition"},
	{1, "acre", "m^2", 4046.8564224, exact, "exact: 43 560 ft² of the international foot"},
	{1, "ha", "m^2", 1e4, exact, "SI Brochure (2019), Table 8"},
	{1, "km", "mi", 1 / 1.609344, exact, "exact by definition"},
	// Volume.
	{1, "L", "m^3", 1e-3, exact, "SI Brochure (2019), Table 8"},
	{1, "mL", "cm^3", 1, exact, "SI Brochure (2019), Table 8"},
	{1, "gal", "m^3", 3.785411784e-3, exact, "exact: 231 in³ (NIST SP 811 (2008), App. B.9)"},
	{1, "gal_imp", "L", 4.54609, exact, "exact by definition (UK Weights and Measures Act 1985)"},
	{1, "bbl", "m^3", 0.158987294928, exact, "exact: 42 US gallons"},
	{1, "ft^3", "L", 28.316846592, exact, "exact by definition"},
	// Mass.
	{1, "lb", "kg", 0.45359237, exact, "exact by definition (1959 international pound)"},
	{1, "oz", "g", 28.349523125, exact, "exact: 1/16 lb"},
	{1, "slug", "kg", 14.59390, 5e-7, "NIST SP 811 (2008), App. B.9: 1.459 390 E+01"},
	{1, "t", "kg", 1000, exact, "SI Brochure (2019), Table 8"},
	{1, "Da", "kg", 1.66053906660e-27, exact, "CODATA 2018"},
	{1, "ug", "kg", 1e-9, exact, "SI prefixes attach to the gram"},
	{1, "Rg", "kg", 1e24, exact, "CGPM 2022: ronna = 10²⁷"},
	// Force.
	{1, "lbf", "N", 4.4482216152605, exact, "exact: lb × g_n"},
	{1, "kip", "kN", 4.4482216152605, exact, "exact: 1000 lbf"},
	{1, "kgf", "N", 9.80665, exact, "exact: kg × g_n"},
	{1, "dyn", "N", 1e-5, exact, "exact by definition"},
	// Pressure.
	{1, "bar", "Pa", 1e5, exact, "exact by definition"},
	{1, "mbar", "Pa", 100, exact, "exact by definition"},
	{1, "atm", "Pa", 101325, exact, "exact (10th CGPM, 1954)"},
	{1, "Torr", "Pa", 101325.0 / 760, exact, "exact: atm/760"},
	{1, "mTorr", "Pa", 101325.0 / 760000, exact, "exact: atm/760 000"},
	{1, "mmHg", "Pa", 133.3224, 5e-7, "NIST SP 811 (2008), App. B.9: 1.333 224 E+02 (conventional)"},
	{1, "inHg", "Pa", 3386.389, 5e-7, "NIST SP 811 (2008), App. B.9: 3.386 389 E+03 (conventional)"},
	{1, "inHg", "kPa", 3.386389, 5e-7, "NIST SP 811 (2008), App. B.9: 3.386 389 E+03 (conventional)"},
	{1, "inH2O", "Pa", 249.0889, 5e-7, "NIST SP 811 (2008), App. B.9: 2.490 889 E+02 (conventional)"},
	{1, "psi", "Pa", 6894.757, 5e-7, "NIST SP 811 (2008), App. B.9: 6.894 757 E+03"},
	{1, "psi", "Pa", 6894.757293168361, exact, "exact: lbf/in²"},
	{1, "psf", "Pa", 47.88026, 5e-7, "NIST SP 811 (2008), App. B.9: 4.788 026 E+01"},
	{1, "ksi", "MPa", 6.894757, 5e-7, "NIST SP 811 (2008), App. B.9: 6.894 757 E+06 Pa"},
	{1, "MPa", "psi", 145.0377, 5e-7, "inverse of NIST SP 811 (2008), App. B.9 psi"},
	{1, "atm", "psi", 14.69595, 5e-7, "exact atm over exact psi, to 7 figures"},
	{1, "kgf/cm^2", "Pa", 98066.5, exact, "exact: technical atmosphere"},
	{1, "lbf/ft^2", "psf", 1, exact, "exact by definition"},
	// Energy and power.
	{1, "kWh", "J", 3.6e6, exact, "exact by definition"},
	{1, "kW*h", "MJ", 3.6, exact, "exact by definition"},
	{1, "BTU", "J", 1055.05585262, exact, "exact: International Table BTU"},
	{1, "cal", "J", 4.184, exact, "exact: thermochemical calorie"},
	{1, "kcal", "J", 4184, exact, "exact: thermochemical kilocalorie"},
	{1, "cal_IT", "J", 4.1868, exact, "exact: International Table calorie"},
	{1, "erg", "J", 1e-7, exact, "exact by definition"},
	{1, "eV", "J", 1.602176634e-19, exact, "exact: SI Brochure (2019), Table 8"},
	{1, "MeV", "pJ", 0.1602176634, exact, "exact: SI Brochure (2019), Table 8"},
	{1, "hp", "W", 745.6999, 5e-7, "NIST SP 811 (2008), App. B.9: 7.456 999 E+02 (550 ft·lbf/s)"},
	{1, "hp", "W", 745.69987158227022, exact, "exact: 550 ft·lbf/s"},
	{1, "BTU/h", "W", 0.2930711, 5e-7, "NIST SP 811 (2008), App. B.9: 2.930 711 E-01"},
	{1, "lbf*ft", "N*m", 1.355818, 5e-7, "NIST SP 811 (2008), App. B.9: 1.355 818 E+00"},
	{1, "ft*lbf/s", "W", 1.355818, 5e-7, "NIST SP 811 (2008), App. B.9: 1.355 818 E+00"},
	{1, "N*m", "J", 1, exact, "SI Brochure (2019), Table 4"},
	// Speed and flow.
	{1, "kn", "m/s", 1852.0 / 3600, exact, "exact: nmi/h"},
	{1, "kn", "m/s", 0.5144444, 5e-7, "NIST SP 811 (2008), App. B.9: 5.144 444 E-01"},
	{1, "mph", "m/s", 0.44704, exact, "exact: mi/h"},
	{1, "mph", "km/h", 1.609344, exact, "exact by definition"},
	{1, "gpm", "m^3/s", 6.30901964e-5, exact, "exact: US gal/min"},
	{1, "gpm", "L/s", 0.0630901964, exact, "exact: US gal/min"},
	{1, "cfm", "m^3/s", 4.719474432e-4, exact, "exact: ft³/min"},
	{1, "L/min", "m^3/s", 1.0 / 60000, exact, "exact by definition"},
	{1, "m/s^2", "ft/s^2", 1 / 0.3048, exact, "exact by definition"},
	// Viscosity.
	{1, "P", "Pa*s", 0.1, exact, "exact: CGS poise"},
	{1, "cP", "mPa*s", 1, exact, "exact: CGS centipoise"},
	{1, "St", "m^2/s", 1e-4, exact, "exact: CGS stokes"},
	{1, "cSt", "m^2/s", 1e-6, exact, "exact: CGS centistokes"},
	{1, "ft^2/s", "m^2/s", 0.09290304, exact, "exact by definition"},
	{1, "lbf*s/ft^2", "Pa*s", 47.88026, 5e-7, "NIST SP 811 (2008), App. B.9: 4.788 026 E+01"},
	// Density.
	{1, "lb/ft^3", "kg/m^3", 16.01846, 5e-7, "NIST SP 811 (2008), App. B.9: 1.601 846 E+01"},
	// Heat transfer, with scale symbols read as intervals in compounds.
	{1, "BTU/(h*ft^2*degF)", "W/(m^2*K)", 5.678263, 5e-7, "NIST SP 811 (2008), App. B.9: 5.678 263 E+00"},
	{1, "BTU/(h*ft*degF)", "W/(m*K)", 1.730735, 5e-7, "NIST SP 811 (2008), App. B.9: 1.730 735 E+00"},
	{1, "BTU/(lb*degF)", "J/(kg*K)", 4186.8, exact, "exact: IT BTU/(lb·°F) = 4.1868 kJ/(kg·K)"},
	{1, "BTU/(lb*degR)", "kJ/(kg*K)", 4.1868, exact, "exact: IT BTU/(lb·°R) = 4.1868 kJ/(kg·K)"},
	{1, "cal/(g*degC)", "J/(kg*K)", 4184, exact, "exact: thermochemical calorie"},
	{1, "W/(m*°C)", "W/(m*K)", 1, exact, "common practice: °C in a compound is its interval"},
	// Time and angle.
	{1, "min", "s", 60, exact, "SI Brochure (2019), Table 8"},
	{1, "h", "s", 3600, exact, "SI Brochure (2019), Table 8"},
	{1, "d", "h", 24, exact, "SI Brochure (2019), Table 8"},
	{1, "°", "rad", math.Pi / 180, exact, "SI Brochure (2019), Table 8"},
	{1, "′", "rad", math.Pi / 10800, exact, "SI Brochure (2019), Table 8"},
	{1, "″", "rad", math.Pi / 648000, exact, "SI Brochure (2019), Table 8"},
	{90, "deg", "rev", 0.25, exact, "exact by definition"},
	{1, "rev", "rad", 2 * math.Pi, exact, "exact by definition"},
	{1, "rpm", "rad/s", 2 * math.Pi / 60, exact, "exact by definition"},
	{60, "rpm", "rev/s", 1, exact, "exact by definition"},
	{1, "rpm/rev", "Hz", 1.0 / 60, exact, "exact: revolutions counted as cycles"},
	{1, "cd*sr", "lm", 1, exact, "SI Brochure (2019), Table 4"},
	// Ratios and prefixes.
	{1, "%", "1", 0.01, exact, "exact by definition"},
	{1, "ppm", "%", 1e-4, exact, "exact by definition"},
	{1, "µm", "m", 1e-6, exact, "SI Brochure (2019), Table 7 (micro sign)"},
	{1, "μm", "um", 1, exact, "Greek mu and ASCII u both mean micro"},
	{1, "QW", "W", 1e30, exact, "CGPM 2022: quetta = 10³⁰"},
	{1, "qm", "m", 1e-30, exact, "CGPM 2022: quecto = 10⁻³⁰"},
	{1, "rs", "s", 1e-27, exact, "CGPM 2022: ronto = 10⁻²⁷"},
	{1, "dam", "m", 10, exact, "SI Brochure (2019), Table 7"},
	{1, "MPa*m^(1/2)", "ksi*in^0.5", 1 / 1.098843, 5e-7, "NIST SP 811 (2008), App. B.9: ksi·in^1/2 = 1.098 843 E+06 Pa·m^1/2"},
}

func TestConvert(t *testing.T) {
	if len(conversions) < 80 {
		t.Fatalf("%d conversion checks, want at least 80", len(conversions))
	}
	for _, c := range conversions {
		got, err := units.Convert(c.v, c.from, c.to)
		if err != nil {
			t.Errorf("Convert(%v, %q, %q): %v [%s]", c.v, c.from, c.to, err, c.source)
			continue
		}
		if d := math.Abs(got-c.want) / math.Abs(c.want); d > c.rel {
			t.Errorf("Convert(%v, %q, %q) = %.12g, want %.12g (relative error %.2g > %.2g) [%s]", c.v, c.from, c.to, got, c.want, d, c.rel, c.source)
		}
		// And back.
		back, err := units.Convert(got, c.to, c.from)
		if err != nil || math.Abs(back-c.v) > 1e-12*math.Abs(c.v) {
			t.Errorf("round trip %q → %q → %q: %v, %v", c.from, c.to, c.from, back, err)
		}
	}
}

// TestTemperaturePoints checks fixed points of the temperature scales,
// exact by the definitions of the scales (NIST SP 811 (2008), §4.2.1.1
// and App. B.9: T/K = t/°C + 273.15, t/°F = 1.8 t/°C + 32, T/°R = 1.8 T/K).
func TestTemperaturePoints(t *testing.T) {
	cases := []struct {
		v        float64
		from, to string
		want     float64
	}{
		{-40, "degC", "degF", -40},
		{-40, "°F", "°C", -40},
		{0, "°C", "K", 273.15},
		{0, "°C", "°F", 32},
		{0, "°C", "°R", 491.67},
		{491.67, "degR", "degF", 32},
		{100, "°C", "°F", 212},
		{212, "℉", "℃", 100},
		{0, "K", "°F", -459.67},
		{300, "K", "degC", 26.85},
		{10, "Δ°C", "Δ°F", 18},
		{18, "degF_diff", "K", 10},
		{10, "K", "ΔdegC", 10},
		{1, "mK", "K", 1e-3},
	}
	for _, c := range cases {
		got, err := units.Convert(c.v, c.from, c.to)
		if err != nil {
			t.Errorf("Convert(%v, %q, %q): %v", c.v, c.from, c.to, err)
			continue
		}
		if math.Abs(got-c.want) > 1e-12*math.Max(1, math.Abs(c.want)) {
			t.Errorf("Convert(%v, %q, %q) = %.15g, want %v", c.v, c.from, c.to, got, c.want)
		}
	}
	q, err := units.ParseQuantity("20 °C")
	if err != nil || math.Abs(q.Value()-293.15) > 1e-12 {
		t.Errorf("ParseQuantity(20 °C) = %v, %v; want 293.15 K", q, err)
	}
}
