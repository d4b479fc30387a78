package fluids_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units/formula"
)

func funcByName(t *testing.T, name string) formula.Func {
	t.Helper()
	for _, f := range fluids.FormulaFuncs() {
		if f.Name == name {
			return f
		}
	}
	t.Fatalf("no function %s", name)
	return formula.Func{}
}

func kelvin(c float64) quantity.Quantity { return quantity.New(c+273.15, quantity.Temperature) }

var atm = quantity.New(101325, quantity.Pressure)

// TestFormulaFuncsMatchAPI: each function gives what the package's own
// API gives for the same state.
func TestFormulaFuncsMatchAPI(t *testing.T) {
	for _, tc := range []float64{5, 20, 35} {
		T := tc + 273.15
		fresh, _ := fluids.FreshWater().At(kelvin(tc), atm)
		sea, _ := fluids.SeaWater().At(kelvin(tc), atm)
		pv, _ := fluids.VapourPressure(kelvin(tc))
		sigma, _ := fluids.SurfaceTension(kelvin(tc))
		air, _ := fluids.Air().At(kelvin(tc), quantity.New(90e3, quantity.Pressure))
		humid, _ := fluids.HumidAir{}.Density(quantity.New(95e3, quantity.Pressure), kelvin(max(min(tc, 25), 15)), 0.5)
		for _, c := range []struct {
			name string
			args []float64
			want float64
		}{
			{"rho_water", []float64{T}, fresh.Density.Value()},
			{"mu_water", []float64{T}, fresh.DynamicViscosity.Value()},
			{"nu_water", []float64{T}, fresh.KinematicViscosity.Value()},
			{"rho_sea", []float64{T, 0.03516504}, sea.Density.Value()},
			{"mu_sea", []float64{T, 0.03516504}, sea.DynamicViscosity.Value()},
			{"nu_sea", []float64{T, 0.03516504}, sea.KinematicViscosity.Value()},
			{"pv_water", []float64{T}, pv.Value()},
			{"sigma_water", []float64{T}, sigma.Value()},
			{"rho_air", []float64{T, 90e3}, air.Density.Value()},
			{"mu_air", []float64{T}, air.DynamicViscosity.Value()},
			{"nu_air", []float64{T, 90e3}, air.KinematicViscosity.Value()},
			{"rho_humid_air", []float64{max(min(tc, 25), 15) + 273.15, 95e3, 0.5}, humid.Value()},
		} {
			got, err := funcByName(t, c.name).Eval(c.args)
			if err != nil || math.Abs(got/c.want-1) > 1e-15 {
				t.Errorf("%s%v = %v, %v; the API gives %v", c.name, c.args, got, err, c.want)
			}
		}
	}
}

// TestFormulaFuncsIAPWS checks the functions called from a formula
// against python3-iapws 1.5.3 (IAPWS-95 at 0.101325 MPa for ρ and ν,
// IAPWS-IF97 eq. 30 for p_v, the IAPWS 2014 release for σ, IAPWS-08 for
// sea water at 35.16504 g/kg), within the tolerances the package's doc
// states (0.01 % for densities, 0.5 % for viscosities).
func TestFormulaFuncsIAPWS(t *testing.T) {
	p, err := formula.Options{Funcs: fluids.FormulaFuncs()}.Compile(
		"rho = rho_water(T); nu = nu_water(T); pv = pv_water(T); sigma = sigma_water(T); rho_s = rho_sea(T, 35.16504 {g/kg})",
		formula.Input{Name: "T", Dim: quantity.Temperature})
	if err != nil {
		t.Fatal(err)
	}
	ev := p.Evaluator()
	for _, c := range []struct {
		tc   float64
		want [5]float64 // ρ, ν, p_v, σ, ρ_sea
		tol  [5]float64
	}{
		{5, [5]float64{999.9666335453081, 1.5182235072976041e-06, 872.5748611295218, 0.0749417141275211, 1027.675587438249}, [5]float64{1e-4, 5e-3, 1e-9, 1e-9, 1e-4}},
		{20, [5]float64{998.207150468013, 1.0033950795192537e-06, 2339.214766776897, 0.07273614042160757, 1024.7660049717979}, [5]float64{1e-4, 5e-3, 1e-9, 1e-9, 1e-4}},
		{35, [5]float64{994.0333148825424, 7.23442170704435e-07, 5628.620144121381, 0.07040213389688842, math.NaN()}, [5]float64{1e-4, 5e-3, 1e-9, 1e-9, 0}},
	} {
		out, err := ev.Row([]float64{c.tc + 273.15}, make([]float64, 5))
		if err != nil {
			t.Fatal(err)
		}
		for i, w := range c.want {
			if !math.IsNaN(w) && math.Abs(out[i]/w-1) > c.tol[i] {
				t.Errorf("%g °C: %s = %v, IAPWS %v", c.tc, p.Outputs()[i], out[i], w)
			}
		}
	}
}

// TestFormulaFuncsDeriv: each declared derivative agrees with a central
// difference of Eval.
func TestFormulaFuncsDeriv(t *testing.T) {
	for _, f := range fluids.FormulaFuncs() {
		if f.Deriv == nil {
			if f.Name != "rho_humid_air" {
				t.Errorf("%s has no derivative", f.Name)
			}
			continue
		}
		for _, T := range []float64{283.15, 298.15} { // each side of the viscosity's two forms at 20 °C
			args := []float64{T, 95e3}[:len(f.Args)]
			if f.Args[len(f.Args)-1] == quantity.Dimensionless {
				args[1] = 0.03
			}
			checkDeriv(t, f, args)
		}
	}
}

func checkDeriv(t *testing.T, f formula.Func, args []float64) {
	{
		g := make([]float64, len(args))
		if err := f.Deriv(args, g); err != nil {
			t.Fatal(err)
		}
		for j := range args {
			h := args[j] * 1e-6
			up, lo := append([]float64(nil), args...), append([]float64(nil), args...)
			up[j] += h
			lo[j] -= h
			fu, _ := f.Eval(up)
			fl, _ := f.Eval(lo)
			if fd := (fu - fl) / (2 * h); math.Abs(g[j]-fd) > 1e-6*math.Abs(fd)+1e-18 {
				t.Errorf("%s: ∂/∂arg%d = %v, central difference %v", f.Name, j+1, g[j], fd)
			}
		}
	}
}

// TestFormulaFuncsRowOutOfRange: a derived channel at a temperature
// outside the correlation's range is an error naming its row, which
// keeps the package's *RangeError; a call of the wrong dimension does
// not compile.
func TestFormulaFuncsRowOutOfRange(t *testing.T) {
	opts := formula.Options{Funcs: fluids.FormulaFuncs(), Keep: []string{"Re"}}
	ins := []formula.Input{{Name: "T_w", Dim: quantity.Temperature}, {Name: "V", Dim: quantity.Velocity}}
	p, err := opts.Compile("L = 2 {m}\nnu = nu_water(T_w)\nRe = V*L/nu", ins...)
	if err != nil {
		t.Fatal(err)
	}
	T := quantity.NewSeries([]float64{288.15, 293.15, 323.15}, quantity.Temperature) // 50 °C at row 2
	V := quantity.NewSeries([]float64{1, 1, 1}, quantity.Velocity)
	err = p.Evaluator().Series([]quantity.Series{T, V}, [][]float64{make([]float64, 3)})
	var re *formula.Error
	var fe *fluids.RangeError
	if !errors.As(err, &re) || re.Row != 2 || re.Name != "nu" || !errors.As(err, &fe) || !errors.Is(err, quantity.ErrRange) {
		t.Fatalf("got %v", err)
	}
	if !strings.Contains(err.Error(), "row 3") || !strings.Contains(err.Error(), "nu_water") {
		t.Errorf("message %q", err)
	}
	_, err = opts.Compile("nu = nu_water(V)\nRe = V/nu", ins...)
	if !errors.Is(err, quantity.ErrDimension) {
		t.Errorf("nu_water(V): %v", err)
	}
}

// TestFormulaFuncsNoAlloc: evaluating a derived channel that calls a
// fluid function over a column allocates nothing.
func TestFormulaFuncsNoAlloc(t *testing.T) {
	p, err := formula.Options{Funcs: fluids.FormulaFuncs()}.Compile("nu = nu_water(T); rho = rho_sea(T, 35 {g/kg})", formula.Input{Name: "T", Dim: quantity.Temperature})
	if err != nil {
		t.Fatal(err)
	}
	col := make([]float64, 1000)
	for i := range col {
		col[i] = 275 + float64(i%30)
	}
	cols := []quantity.Series{quantity.NewSeries(col, quantity.Temperature)}
	dst := [][]float64{make([]float64, len(col)), make([]float64, len(col))}
	ev := p.Evaluator()
	if n := testing.AllocsPerRun(5, func() {
		if err := ev.Series(cols, dst); err != nil {
			t.Fatal(err)
		}
	}); n != 0 {
		t.Errorf("%v allocations", n)
	}
}

// ExampleFormulaFuncs reduces a towing-tank channel: the water's
// kinematic viscosity from its temperature, then the Reynolds number of
// a 2 m model (invented readings).
func ExampleFormulaFuncs() {
	p, err := formula.Options{Funcs: fluids.FormulaFuncs(), Keep: []string{"nu", "Re"}}.Compile(`L  = 2 {m}
nu = nu_water(T_w)
Re = V*L/nu`, formula.Input{Name: "T_w", Dim: quantity.Temperature}, formula.Input{Name: "V", Dim: quantity.Velocity})
	if err != nil {
		fmt.Println(err)
		return
	}
	out, err := p.Evaluator().Row([]float64{15 + 273.15, 1.5}, make([]float64, 2))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("ν = %.4g m²/s, Re = %.4g\n", out[0], out[1])
	_, err = p.Evaluator().Row([]float64{45 + 273.15, 1.5}, make([]float64, 2))
	fmt.Println(err)
	// Output:
	// ν = 1.14e-06 m²/s, Re = 2.633e+06
	// formula "L  = 2 {m}\nnu = nu_water(T_w)\nRe = V*L/nu": statement 2 (counting from 1): nu: at 16: nu_water: fluids: fresh water: temperature 45 °C outside 0 … 40 °C
}
