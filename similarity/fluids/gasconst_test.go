package fluids_test

import (
	"errors"
	"fmt"
	"go/ast"
	"go/parser"
	"go/token"
	"math"
	"path/filepath"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// TestPredefinedGasConstants: every constant of the predefined gases is
// the published value it came from, in its dimension, with the source
// beside it.
func TestPredefinedGasConstants(t *testing.T) {
	beta, err := q.DynamicViscosity.Div(mustDim(t)(q.Temperature.Pow(1, 2)))
	if err != nil {
		t.Fatal(err)
	}
	// CODATA 2018: R = N_A·k = 6.022 140 76 × 10²³ mol⁻¹ × 1.380 649 ×
	// 10⁻²³ J/K, 8.314 462 618 J/(mol·K) as CODATA rounds it (both
	// factors exact in the SI since 2019).
	const rMolar = 8.314462618
	// Molar mass of N₂, 28.0134 g/mol: twice the standard atomic weight
	// of nitrogen, 14.0067 (IUPAC conventional value, from memory).
	const mN2 = 2 * 14.0067e-3
	// ISO 2533:1975, Table 1: R* = 8 314.32 J/(kmol·K), M = 28.964 420
	// kg/kmol, and R = R*/M stated as 287.052 87 J/(kg·K).
	const rStarISO, mAirISO = 8314.32, 28.964420
	// Nitrogen's Sutherland viscosity: μ₀ = 1.663 × 10⁻⁵ Pa·s at
	// T₀ = 273 K, S = 107 K (F. M. White, Viscous Fluid Flow, Table 1-2,
	// from memory), so β = μ₀·(T₀ + S)/T₀^(3/2).
	const mu0N2, t0N2, sN2 = 1.663e-5, 273.0, 107.0
	air, n2 := fluids.Air(), fluids.Nitrogen()
	for _, c := range []struct {
		name   string
		got    q.Quantity
		want   float64
		dim    q.Dim
		source string
	}{
		{"air R", air.R, 287.05287, q.SpecificHeatCapacity, "ISO 2533:1975, Table 1"},
		{"air β", air.Beta, 1.458e-6, beta, "ISO 2533:1975, Table 1 (β_S)"},
		{"air S", air.S, 110.4, q.Temperature, "ISO 2533:1975, Table 1"},
		{"air k₀", air.KRef, 0.0241, q.ThermalConductivity, "White, Viscous Fluid Flow, Table 1-3, from memory"},
		{"air T₀ of k₀", air.KTemp, 273, q.Temperature, "White, Table 1-3, from memory"},
		{"air S_k", air.KS, 194, q.Temperature, "White, Table 1-3, from memory"},
		{"air lowest T", air.MinTemperature, 132.6, q.Temperature, "maxcondentherm, Lemmon et al., J. Phys. Chem. Ref. Data 29 (2000) 331, from memory"},
		{"air highest T", air.MaxTemperature, 600, q.Temperature, "the bound Air states (γ = 1.4 no longer holds)"},
		{"nitrogen R", n2.R, rMolar / mN2, q.SpecificHeatCapacity, "CODATA 2018 R over M(N₂) = 28.0134 g/mol"},
		{"nitrogen β", n2.Beta, mu0N2 * (t0N2 + sN2) / math.Pow(t0N2, 1.5), beta, "White, Table 1-2, from memory"},
		{"nitrogen S", n2.S, sN2, q.Temperature, "White, Table 1-2, from memory"},
		{"nitrogen k₀", n2.KRef, 0.0242, q.ThermalConductivity, "White, Table 1-3, from memory"},
		{"nitrogen T₀ of k₀", n2.KTemp, 273, q.Temperature, "White, Table 1-3, from memory"},
		{"nitrogen S_k", n2.KS, 150, q.Temperature, "White, Table 1-3, from memory"},
		{"nitrogen lowest T", n2.MinTemperature, 63.151, q.Temperature, "triple point, Span et al., J. Phys. Chem. Ref. Data 29 (2000) 1361"},
		{"nitrogen highest T", n2.MaxTemperature, 600, q.Temperature, "the bound Nitrogen states (γ = 1.4 no longer holds)"},
	} {
		if c.got.Dim() != c.dim || c.got.Value() != c.want {
			t.Errorf("%s = %v (%s); want %v %s (%s)", c.name, c.got, q.Describe(c.got.Dim()), c.want, q.Describe(c.dim), c.source)
		}
	}
	if air.Gamma != 1.4 || n2.Gamma != 1.4 {
		t.Errorf("γ of air %v, of nitrogen %v; want 1.4 (ISO 2533:1975, Table 1, κ; diatomic gas, common practice)", air.Gamma, n2.Gamma)
	}
	// The stated R of ISO 2533 is R*/M rounded to its last stated digit,
	// 10⁻⁵ J/(kg·K).
	if r := rStarISO / mAirISO; math.Abs(air.R.Value()-r) > 0.5e-5 {
		t.Errorf("air R %v differs from ISO 2533's R*/M = %v", air.R.Value(), r)
	}
	// CODATA 2018's rounded R is N_A·k to ten figures.
	if r := 6.02214076e23 * 1.380649e-23; math.Abs(rMolar/r-1) > 1e-9 {
		t.Errorf("R = %v, N_A·k = %v", rMolar, r)
	}
	// Nitrogen's β gives back μ₀ at T₀.
	if mu, err := n2.Viscosity(q.New(t0N2, q.Temperature)); err != nil || math.Abs(mu.Value()/mu0N2-1) > 1e-14 {
		t.Errorf("nitrogen μ(273 K) = %v, %v; want %v Pa·s", mu, err, mu0N2)
	}
}

// mustDim unwraps a Dim operation that cannot fail for the dimensions
// named in a test.
func mustDim(t *testing.T) func(q.Dim, error) q.Dim {
	return func(d q.Dim, err error) q.Dim {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
		return d
	}
}

// TestSutherlandConstantDim: β's dimension is kg/(m·s·K^(1/2)),
// M L⁻¹ T⁻¹ Θ^(−1/2).
func TestSutherlandConstantDim(t *testing.T) {
	d := fluids.SutherlandConstantDim
	got := [q.NumBases]int{}
	for b := range q.NumBases {
		got[b] = d.Sixths(q.Base(b))
	}
	want := [q.NumBases]int{q.BaseL: -6, q.BaseM: 6, q.BaseT: -6, q.BaseTheta: -3}
	if got != want {
		t.Errorf("SutherlandConstantDim exponents in sixths %v (%s); want %v", got, d.SIUnit(), want)
	}
	if w := mustDim(t)(q.DynamicViscosity.Div(mustDim(t)(q.Temperature.Pow(1, 2)))); d != w {
		t.Errorf("SutherlandConstantDim = %s, want %s", d, w)
	}
}

// TestGasConstantWrongDimension: a gas whose constant has the wrong
// dimension is refused by every method that uses it, with an
// ErrDimension alone whose message names the gas, the field and both
// dimensions; it is never read as a number in an assumed unit.
func TestGasConstantWrongDimension(t *testing.T) {
	T, p := q.New(288.15, q.Temperature), q.New(101325, q.Pressure)
	for _, c := range []struct {
		field string
		set   func(*fluids.IdealGas)
		got   q.Quantity
		want  q.Dim
	}{
		{"R", func(g *fluids.IdealGas) { g.R = q.Scalar(287.05287) }, q.Scalar(287.05287), q.SpecificHeatCapacity},
		{"R", func(g *fluids.IdealGas) { g.R = q.New(287.05287, q.SpecificEnergy) }, q.New(287.05287, q.SpecificEnergy), q.SpecificHeatCapacity},
		{"Beta", func(g *fluids.IdealGas) { g.Beta = q.New(1.458e-6, q.DynamicViscosity) }, q.New(1.458e-6, q.DynamicViscosity), fluids.SutherlandConstantDim},
		{"S", func(g *fluids.IdealGas) { g.S = q.Scalar(110.4) }, q.Scalar(110.4), q.Temperature},
		{"S", func(g *fluids.IdealGas) { g.S = q.Quantity{} }, q.Quantity{}, q.Temperature},
		{"KRef", func(g *fluids.IdealGas) { g.KRef = q.New(0.0241, q.HeatTransferCoefficient) }, q.New(0.0241, q.HeatTransferCoefficient), q.ThermalConductivity},
		{"KTemp", func(g *fluids.IdealGas) { g.KTemp = q.Scalar(273) }, q.Scalar(273), q.Temperature},
		{"KS", func(g *fluids.IdealGas) { g.KS = q.New(0, q.Pressure) }, q.New(0, q.Pressure), q.Temperature},
		{"MinTemperature", func(g *fluids.IdealGas) { g.MinTemperature = q.Scalar(132.6) }, q.Scalar(132.6), q.Temperature},
		{"MaxTemperature", func(g *fluids.IdealGas) { g.MaxTemperature = q.New(600, q.Length) }, q.New(600, q.Length), q.Temperature},
	} {
		for _, base := range []fluids.IdealGas{fluids.Air(), fluids.Nitrogen()} {
			g := base
			c.set(&g)
			name := fmt.Sprintf("%s with %s = %v", g.GasName, c.field, c.got)
			wrongDimensionRefused(t, g)
			_, err := g.At(T, p)
			var re *fluids.RangeError
			if errors.As(err, &re) {
				t.Errorf("%s: a *RangeError (%v); want a dimension error", name, err)
			}
			if err == nil {
				continue
			}
			msg := err.Error()
			for _, want := range []string{g.GasName, "IdealGas." + c.field, q.Describe(c.want), q.Describe(c.got.Dim())} {
				if !strings.Contains(msg, want) {
					t.Errorf("%s: %q does not name %q", name, msg, want)
				}
			}
		}
	}
}

// TestGasOptionalConstants: the conductivity constants and the
// temperature bounds may be left as the zero Quantity (not modelled, not
// checked) or given as 0 K; the gas is then usable, and the conductivity
// says it has no constants.
func TestGasOptionalConstants(t *testing.T) {
	air := fluids.Air()
	for _, g := range []fluids.IdealGas{
		{GasName: "bare", R: air.R, Gamma: air.Gamma, Beta: air.Beta, S: air.S},
		{GasName: "zero kelvin", R: air.R, Gamma: air.Gamma, Beta: air.Beta, S: air.S,
			KTemp: q.New(0, q.Temperature), MinTemperature: q.New(0, q.Temperature), MaxTemperature: q.New(0, q.Temperature)},
	} {
		T := q.New(50, q.Temperature) // below air's own range: unchecked here
		s, err := g.At(T, q.New(1e5, q.Pressure))
		if err != nil {
			t.Errorf("%s: %v", g.GasName, err)
			continue
		}
		// ρ = p/(R·T) with ISO 2533's R.
		if want := 1e5 / (287.05287 * 50); math.Abs(s.Density.Value()/want-1) > 1e-14 {
			t.Errorf("%s: ρ = %v, want %v kg/m³", g.GasName, s.Density, want)
		}
		if _, err := g.ThermalConductivity(q.New(300, q.Temperature)); !errors.Is(err, q.ErrRange) {
			t.Errorf("%s: conductivity without constants: %v", g.GasName, err)
		}
	}
}

// TestRangeErrorUnitSet: every RangeError the package builds sets its
// Unit field, to a unit or to the package's mark of a dimensionless
// value, so that no bound is printed without its unit by an omission.
func TestRangeErrorUnitSet(t *testing.T) {
	names, err := filepath.Glob("*.go")
	if err != nil {
		t.Fatal(err)
	}
	fs := token.NewFileSet()
	n := 0
	for _, name := range names {
		if strings.HasSuffix(name, "_test.go") {
			continue
		}
		f, err := parser.ParseFile(fs, name, nil, 0)
		if err != nil {
			t.Fatal(err)
		}
		ast.Inspect(f, func(node ast.Node) bool {
			lit, ok := node.(*ast.CompositeLit)
			if !ok {
				return true
			}
			if id, ok := lit.Type.(*ast.Ident); !ok || id.Name != "RangeError" {
				return true
			}
			n++
			for _, e := range lit.Elts {
				if kv, ok := e.(*ast.KeyValueExpr); ok {
					if k, ok := kv.Key.(*ast.Ident); ok && k.Name == "Unit" {
						return true
					}
				}
			}
			t.Errorf("%s: a RangeError without a Unit", fs.Position(lit.Pos()))
			return true
		})
	}
	if n < 20 {
		t.Errorf("found %d RangeError literals; the scan is not reading the package", n)
	}
}

// ExampleIdealGas: a caller's own gas, its constants given as quantities
// in their dimensions. Carbon dioxide: R = 8.314 462 618/0.044 009
// J/(kg·K) (CODATA 2018; molar mass 44.009 g/mol), γ ≈ 1.29, and
// Sutherland's law with μ₀ = 1.370 × 10⁻⁵ Pa·s at 273 K, S = 222 K
// (F. M. White, Viscous Fluid Flow, Table 1-2, from memory).
func ExampleIdealGas() {
	const mu0, t0, s = 1.370e-5, 273.0, 222.0
	co2 := fluids.IdealGas{
		GasName: "carbon dioxide",
		R:       q.New(8.314462618/0.044009, q.SpecificHeatCapacity),
		Gamma:   1.29,
		Beta:    q.New(mu0*(t0+s)/math.Pow(t0, 1.5), fluids.SutherlandConstantDim),
		S:       q.New(s, q.Temperature),
		// Sutherland's law is stated from about 200 K (White); the gas
		// must also stay well above its condensation, not modelled here.
		MinTemperature: q.New(220, q.Temperature),
		MaxTemperature: q.New(600, q.Temperature),
	}
	st, err := co2.At(q.New(293.15, q.Temperature), q.New(101325, q.Pressure))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("ρ = %.4f kg/m³, μ = %.4g Pa·s, a = %.1f m/s\n", st.Density.Value(), st.DynamicViscosity.Value(), st.SpeedOfSound.Value())

	// A constant given without its dimension is refused, not read as
	// J/(kg·K).
	co2.R = q.Scalar(188.9)
	_, err = co2.At(q.New(293.15, q.Temperature), q.New(101325, q.Pressure))
	fmt.Println(errors.Is(err, q.ErrDimension))
	// Output:
	// ρ = 1.8295 kg/m³, μ = 1.465e-05 Pa·s, a = 267.3 m/s
	// true
}

// TestGasAtAllocs: checking a gas's constants on every call allocates
// nothing (a formula evaluates rho_air row by row).
func TestGasAtAllocs(t *testing.T) {
	air := fluids.Air()
	T, p := q.New(288.15, q.Temperature), q.New(101325, q.Pressure)
	if n := testing.AllocsPerRun(100, func() {
		if _, err := air.At(T, p); err != nil {
			t.Fatal(err)
		}
	}); n != 0 {
		t.Errorf("Air().At allocates %v times per call", n)
	}
}
