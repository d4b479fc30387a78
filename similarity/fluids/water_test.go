package fluids_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
	"similis.dev/similis/units/formula"
)

// TestVapourPressureAndSurfaceTension against values computed once with
// the IAPWS reference implementation in Debian's python3-iapws 1.5.2
// (iapws97._PSat_T, the IF97 saturation equation, and _iapws._Tension,
// the IAPWS 2014 surface tension release).
func TestVapourPressureAndSurfaceTension(t *testing.T) {
	for _, c := range []struct {
		T, pv, sigma float64
	}{
		{273.16, 611.6570000106653, 0.07564627110368254},
		{283.15, 1228.1838693402237, 0.07422104407784691},
		{288.15, 1705.7448743923737, 0.0734858035333309},
		{293.15, 2339.214766776897, 0.07273614042160757},
		{313.15, 7384.42748706953, 0.06959631235370246},
		{373.15, 101417.97792131013, 0.058911868587664076},
		{473.15, 1554671.8682698254, 0.03767451239928297},
		{647.0, 22038291.942536045, 3.661503828708931e-06},
	} {
		T := q.New(c.T, q.Temperature)
		pv, err := fluids.VapourPressure(T)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(pv.Value()-c.pv) > 1e-12*c.pv || pv.Dim() != q.Pressure {
			t.Errorf("p_v(%g K) = %.15g, IAPWS-IF97 %.15g", c.T, pv.Value(), c.pv)
		}
		s, err := fluids.SurfaceTension(T)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(s.Value()-c.sigma) > 1e-12*c.sigma || s.Dim() != q.SurfaceTension {
			t.Errorf("σ(%g K) = %.15g, IAPWS %.15g", c.T, s.Value(), c.sigma)
		}
	}
	for _, T := range []float64{270, 700, math.NaN()} {
		if _, err := fluids.VapourPressure(q.New(T, q.Temperature)); !errors.Is(err, q.ErrRange) {
			t.Errorf("p_v at %g K: %v", T, err)
		}
		if _, err := fluids.SurfaceTension(q.New(T, q.Temperature)); !errors.Is(err, q.ErrRange) {
			t.Errorf("σ at %g K: %v", T, err)
		}
	}
	if _, err := fluids.VapourPressure(q.New(20, q.Pressure)); !errors.Is(err, q.ErrDimension) {
		t.Errorf("a pressure for a temperature: %v", err)
	}
}

// TestDynamicPressure: (γ/2)·p·Ma² equals ½ρV² for air (γ = 1.4) at
// 101 325 Pa and 288.15 K moving at Ma 0.5, with ρ = p/(RT) and
// V = Ma·√(γRT) worked by hand (R = 287.05287 J/(kg·K), ISO 2533):
// 0.7·101325·0.25 = 17731.875 Pa.
func TestDynamicPressure(t *testing.T) {
	air := fluids.Air()
	got, err := air.DynamicPressure(q.New(101325, q.Pressure), 0.5)
	if err != nil {
		t.Fatal(err)
	}
	const R, T, p = 287.05287, 288.15, 101325.0
	rho := p / (R * T)
	v := 0.5 * math.Sqrt(1.4*R*T)
	if want := 0.5 * rho * v * v; math.Abs(got.Value()-want) > 1e-9*want || math.Abs(want-17731.875) > 1e-6 {
		t.Errorf("q = %v, ½ρV² = %v", got, want)
	}
	if _, err := air.DynamicPressure(q.New(-1, q.Pressure), 0.5); !errors.Is(err, q.ErrRange) {
		t.Errorf("a negative pressure: %v", err)
	}
}

// The vapour pressure and surface tension of a model basin's water at
// 15 °C and a prototype's at 28 °C (IAPWS-IF97, IAPWS 2014).
func ExampleVapourPressure() {
	for _, c := range []float64{15, 28} {
		T := q.New(c+273.15, q.Temperature)
		pv, _ := fluids.VapourPressure(T)
		s, _ := fluids.SurfaceTension(T)
		fmt.Printf("%g °C: p_v = %.1f Pa, σ = %.5f N/m\n", c, pv.Value(), s.Value())
	}
	// Output:
	// 15 °C: p_v = 1705.7 Pa, σ = 0.07349 N/m
	// 28 °C: p_v = 3782.8 Pa, σ = 0.07151 N/m
}

// TestHumidAir: the CIPM-2007 density against the IAPWS-2010 formulation
// for humid air (computed once with python3-iapws 1.5.2,
// iapws.humidAir.HumidAir(T, P, xw)); the two formulations agree to
// 1.6×10⁻⁵ at these points (tolerance 3×10⁻⁵). The CIPM saturation
// pressure (Davis) agrees with IAPWS-IF97 within 10⁻³.
func TestHumidAir(t *testing.T) {
	a := fluids.HumidAir{}
	for _, c := range []struct{ T, p, xv, rho float64 }{
		{293.15, 101325, 0.0115, 1.1993731445091942},
		{295.15, 95000, 0.01, 1.1174673424371742},
		{298.15, 101325, 0.02, 1.1754302569086756},
		{290.15, 70000, 0.005, 0.8391180206983258},
	} {
		got, err := a.DensityMole(q.New(c.p, q.Pressure), q.New(c.T, q.Temperature), c.xv)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got.Value()/c.rho-1) > 3e-5 {
			t.Errorf("ρ(%g K, %g Pa, x_v %g) = %.6f, IAPWS-2010 %.6f", c.T, c.p, c.xv, got.Value(), c.rho)
		}
	}
	// At 100 % relative humidity x_v·p/f is the saturation pressure.
	T := q.New(293.15, q.Temperature)
	xv, _ := a.MoleFraction(q.New(101325, q.Pressure), T, 1)
	pv, _ := fluids.VapourPressure(T)
	f := 1.00062 + 3.14e-8*101325 + 5.6e-7*400
	if d := xv * 101325 / f / pv.Value(); math.Abs(d-1) > 1e-3 {
		t.Errorf("Davis p_sv / IAPWS-IF97 p_v = %v", d)
	}
	for _, c := range []struct {
		T, p, rh float64
	}{{280, 101325, 0.5}, {293.15, 120000, 0.5}, {293.15, 101325, 1.2}} {
		if _, err := a.Density(q.New(c.p, q.Pressure), q.New(c.T, q.Temperature), c.rh); !errors.Is(err, q.ErrRange) {
			t.Errorf("%v: %v", c, err)
		}
	}
}

// TestNitrogen: the saturation equation passes the normal boiling point
// (77.355 K at 101 325 Pa) and the triple point (63.151 K, 12.52 kPa)
// (Span et al., 2000, values from memory), and inverts; the ideal gas's
// viscosity at 273 K is Sutherland's μ₀; a cryogenic test section at
// 110 K and 1.5 bar keeps 110 K − T_sat(1.5 bar) above condensation, with
// T_sat between the normal boiling point and 85 K.
func TestNitrogen(t *testing.T) {
	p, err := fluids.NitrogenSaturationPressure(q.New(77.355, q.Temperature))
	if err != nil || math.Abs(p.Value()/101325-1) > 2e-3 {
		t.Errorf("p_sat(77.355 K) = %v, %v; want 101325 Pa", p, err)
	}
	pt, _ := fluids.NitrogenSaturationPressure(q.New(63.151, q.Temperature))
	if math.Abs(pt.Value()/12520-1) > 5e-3 {
		t.Errorf("p_sat at the triple point = %v, want 12.52 kPa", pt)
	}
	ts, err := fluids.NitrogenSaturationTemperature(q.New(101325, q.Pressure))
	back, _ := fluids.NitrogenSaturationPressure(ts)
	if err != nil || math.Abs(back.Value()-101325) > 1e-6 {
		t.Errorf("inversion: %v → %v (%v)", ts, back, err)
	}
	s, _ := fluids.Nitrogen().At(q.New(273, q.Temperature), q.New(101325, q.Pressure))
	if math.Abs(s.DynamicViscosity.Value()-1.663e-5) > 1e-12 {
		t.Errorf("μ(273 K) = %v", s.DynamicViscosity)
	}
	m, err := fluids.CondensationMargin(q.New(110, q.Temperature), q.New(1.5e5, q.Pressure))
	t15, _ := fluids.NitrogenSaturationTemperature(q.New(1.5e5, q.Pressure))
	if err != nil || m.Value() != 110-t15.Value() || !(t15.Value() > 77.355 && t15.Value() < 85) {
		t.Errorf("margin %v (T_sat %v), %v", m, t15, err)
	}
	if _, err := fluids.NitrogenSaturationPressure(q.New(200, q.Temperature)); !errors.Is(err, q.ErrRange) {
		t.Errorf("above the critical point: %v", err)
	}
}

// TestThermalProperties against reference values computed once with
// python3-iapws 1.5.2 at 101.325 kPa: fresh water from IAPWS-95 (c_p),
// IAPWS 2011 (k) and IAPWS 2008 (μ, through Pr); dry air from the Lemmon
// et al. (2000, 2004) equations (iapws.humidAir.Air). The tolerances are
// the simpler formulations' own accuracy.
func TestThermalProperties(t *testing.T) {
	w := fluids.FreshWater()
	for _, c := range []struct{ T, cp, k, pr float64 }{
		{280.65, 4199.63013779429, 0.5734165107210468, 10.294641268542206},
		{291.15, 4185.584368002716, 0.5944181978816595, 7.412385431355108},
		{305.65, 4179.437459736626, 0.6181141336667222, 5.115444132658593},
	} {
		T := q.New(c.T, q.Temperature)
		cp, err := w.SpecificHeat(T)
		if err != nil || math.Abs(cp.Value()/c.cp-1) > 1e-4 {
			t.Errorf("water c_p(%g K) = %v, IAPWS-95 %v (%v)", c.T, cp, c.cp, err)
		}
		k, err := w.ThermalConductivity(T)
		if err != nil || math.Abs(k.Value()/c.k-1) > 3e-3 {
			t.Errorf("water k(%g K) = %v, IAPWS 2011 %v (%v)", c.T, k, c.k, err)
		}
		pr, err := w.Prandtl(T)
		if err != nil || math.Abs(pr/c.pr-1) > 1e-2 {
			t.Errorf("water Pr(%g K) = %v, IAPWS %v (%v)", c.T, pr, c.pr, err)
		}
	}
	air := fluids.Air()
	for _, c := range []struct{ T, k, cp, pr float64 }{
		{250, 0.02256441192777562, 1005.54192113014, 0.7147110730836492},
		{300, 0.026384473239079283, 1006.3739076641025, 0.7070635473841832},
		{350, 0.03000328649564614, 1009.2105936892406, 0.7019014896520507},
	} {
		T := q.New(c.T, q.Temperature)
		k, err := air.ThermalConductivity(T)
		if err != nil || math.Abs(k.Value()/c.k-1) > 2e-2 {
			t.Errorf("air k(%g K) = %v, reference %v (%v)", c.T, k, c.k, err)
		}
		cp, _ := air.SpecificHeat()
		if math.Abs(cp.Value()/c.cp-1) > 5e-3 {
			t.Errorf("air c_p = %v, reference %v at %g K", cp, c.cp, c.T)
		}
		pr, err := air.Prandtl(T)
		if err != nil || math.Abs(pr/c.pr-1) > 2e-2 {
			t.Errorf("air Pr(%g K) = %v, reference %v (%v)", c.T, pr, c.pr, err)
		}
	}
	if _, err := fluids.SeaWater().ThermalConductivity(q.New(290, q.Temperature)); !errors.Is(err, q.ErrRange) {
		t.Errorf("sea water k: %v", err)
	}
	if _, err := w.SpecificHeat(q.New(380, q.Temperature)); !errors.Is(err, q.ErrRange) {
		t.Errorf("c_p above the table: %v", err)
	}
}

// TestVapourPressureSlope: the exact derivative of the IF97 equation
// agrees with a central difference of VapourPressure (step 1 mK) to 1e-6,
// its value is VapourPressure's, and out of range it is refused. At
// 100 °C the slope is about 3.62 kPa/K (steam tables, from memory: the
// Clausius–Clapeyron slope h_fg/(T·Δv) = 2257 kJ/kg/(373.15 K·1.672 m³/kg)
// = 3.617 kPa/K).
func TestVapourPressureSlope(t *testing.T) {
	for _, c := range []float64{273.16, 283.15, 293.15, 303.15, 373.15, 500, 640} {
		T := q.New(c, q.Temperature)
		pv, s, err := fluids.VapourPressureSlope(T)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := fluids.VapourPressure(T)
		if math.Abs(pv.Value()/want.Value()-1) > 1e-14 {
			t.Errorf("%v K: p_v %v, VapourPressure %v", c, pv, want)
		}
		const h = 1e-3
		lo, _ := fluids.VapourPressure(q.New(c-h, q.Temperature))
		hi, _ := fluids.VapourPressure(q.New(c+h, q.Temperature))
		fd := (hi.Value() - lo.Value()) / (2 * h)
		if math.Abs(s.Value()/fd-1) > 1e-6 {
			t.Errorf("%v K: slope %v, central difference %v", c, s.Value(), fd)
		}
		if d, _ := q.Pressure.Div(q.Temperature); s.Dim() != d {
			t.Errorf("slope dimension %v", s.Dim())
		}
	}
	_, s, _ := fluids.VapourPressureSlope(q.New(373.15, q.Temperature))
	if math.Abs(s.Value()-3617) > 10 {
		t.Errorf("slope at 100 °C %v Pa/K, want about 3617", s.Value())
	}
	if _, _, err := fluids.VapourPressureSlope(q.New(700, q.Temperature)); !errors.Is(err, q.ErrRange) {
		t.Errorf("700 K: %v", err)
	}
}

// TestSalinityIsAMassFraction: Water.Salinity and the S argument of
// FormulaFuncs' sea-water functions share one convention, the mass
// fraction in kg/kg: the reference salinity 35.16504 g/kg (TEOS-10) is
// 0.03516504 in both, and gives SeaWater's density. A salinity written
// as 35 (g/kg read as kg/kg) or of another dimension is refused, the
// range stated in kg/kg.
func TestSalinityIsAMassFraction(t *testing.T) {
	ref, err := fluids.SeaWater().AtCelsius(15)
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range []q.Quantity{
		q.New(0.03516504, q.Dimensionless),
		units.MustParse("g/kg").Of(35.16504),
	} {
		st, err := fluids.Water{Salinity: s}.AtCelsius(15)
		if err != nil || math.Abs(st.Density.Value()/ref.Density.Value()-1) > 1e-12 {
			t.Errorf("Salinity %v: ρ = %v, %v; SeaWater %v", s, st.Density, err, ref.Density)
		}
	}
	fs := map[string]formula.Func{}
	for _, f := range fluids.FormulaFuncs() {
		fs[f.Name] = f
	}
	rho, err := fs["rho_sea"].Eval([]float64{288.15, 0.03516504})
	if err != nil || math.Abs(rho/ref.Density.Value()-1) > 1e-12 {
		t.Errorf("rho_sea(288.15 K, 0.03516504) = %v, %v; SeaWater %v", rho, err, ref.Density)
	}
	var re *fluids.RangeError
	_, err = fluids.Water{Salinity: q.New(35, q.Dimensionless)}.AtCelsius(15)
	if !errors.As(err, &re) || re.Unit != "kg/kg" || re.Hi != 0.045 || !errors.Is(err, q.ErrRange) {
		t.Errorf("salinity 35 kg/kg: %v", err)
	}
	_, err = fs["rho_sea"].Eval([]float64{288.15, 35})
	if !errors.As(err, &re) || !strings.Contains(err.Error(), "35 kg/kg outside 0 … 0.045 kg/kg") {
		t.Errorf("rho_sea(T, 35): %v", err)
	}
	_, err = fluids.Water{Salinity: q.New(35, q.Density)}.AtCelsius(15)
	if !errors.Is(err, q.ErrDimension) || !strings.Contains(err.Error(), "Water.Salinity") {
		t.Errorf("salinity as a density: %v", err)
	}
	if _, err := fluids.SeaWater().SpecificHeat(q.New(288.15, q.Temperature)); !errors.As(err, &re) || re.Unit != "kg/kg" {
		t.Errorf("sea water's specific heat: %v", err)
	}
}
