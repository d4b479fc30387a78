package tunnel_test

import (
	"errors"
	"math"
	"slices"
	"strings"
	"testing"

	"similis.dev/similis/similarity/tunnel"

	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// TestWallCorrections2DCompressible: the section of TestCorrectWalls2D
// (c = 0.3 m, h = 0.9 m, Λ = 0.25, α = 6°, C_lu = 0.82, C_du = 0.0125,
// C_m¼u = −0.08) at Ma = 0.62, β = √(1 − 0.3844). The wanted values are
// the documented formulas evaluated once in Python 3 (plain float
// arithmetic): ε_sb = Λσ/β³, ε_wb = (c/4h)C_du(1 + 0.4Ma²)/β²,
// q/q_u = 1 + (2 − Ma²)ε, C_l = C_lu[1 − σ/β² − (2 − Ma²)ε], … (the
// compressibility factors quoted from memory, as the method's doc says).
// The old corrections ignored the Mach number and gave the Ma = 0 values.
func TestWallCorrections2DCompressible(t *testing.T) {
	r, err := tunnel.CorrectWalls2D(tunnel.Section2D{Chord: q.New(0.3, q.Length), Height: q.New(0.9, q.Length),
		ShapeFactor: 0.25, AlphaDeg: 6, CL: 0.82, CD: 0.0125, CM: -0.08, Mach: 0.62})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"σ", r.Sigma, 0.02284630648}, {"β", r.Beta, 0.7846018098}, {"ε_sb", r.SolidBlock, 0.01182518899},
		{"ε_wb", r.WakeBlock, 0.001952295863}, {"ε", r.Blockage, 0.01377748486}, {"q/q_u", r.DynamicPressureFactor, 1.022258905},
		{"Ma/Ma_u", r.MachFactor, 1.014836698}, {"Re/Re_u", r.ReynoldsFactor, 1.010070239}, {"α", r.AlphaDeg, 6.132773514},
		{"C_l", r.CL, 0.7713156461}, {"C_m¼", r.CM, -0.07106297118}, {"C_d", r.CD, 0.01207394883},
	} {
		if math.Abs(c.got-c.want) > 5e-10*math.Max(1, math.Abs(c.want)) {
			t.Errorf("%s = %.10g, by hand %.10g", c.name, c.got, c.want)
		}
	}
}

// TestWallCorrections3DCompressible: the model of TestCorrectWalls3D
// (S = 0.3 m², C = 3 m², V = 0.012 m³, K·τ₁ = 0.86, δ = 0.125,
// C_Lu = 0.75, C_Du = 0.04, α = 4°) at Ma = 0.62, the documented
// formulas evaluated once in Python 3: ε_sb = K·τ₁·V/(C^1.5·β³),
// ε_wb = (S/4C)·C_Du·(1 + 0.4Ma²)/β² (factors from memory),
// q/q_u = (1 + ε)²(1 − Ma²ε).
func TestWallCorrections3DCompressible(t *testing.T) {
	r, err := tunnel.CorrectWalls3D(tunnel.Model3D{WingArea: q.New(0.3, q.Area), TunnelArea: q.New(3, q.Area),
		ModelVolume: q.New(0.012, q.Volume), ShapeFactor: 0.86, Delta: 0.125, AlphaDeg: 4, CL: 0.75, CD: 0.04, Mach: 0.62})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"ε_sb", r.SolidBlock, 0.004111969631}, {"ε_wb", r.WakeBlock, 0.001874204029}, {"q/q_u", r.DynamicPressureFactor, 1.009679465},
		{"C_L", r.CL, 0.7428099969}, {"α", r.AlphaDeg, 4.53203766}, {"C_D", r.CD, 0.04651361681},
	} {
		if math.Abs(c.got-c.want) > 5e-10*math.Max(1, math.Abs(c.want)) {
			t.Errorf("%s = %.10g, by hand %.10g", c.name, c.got, c.want)
		}
	}
	// First order in ε, q/q_u = 1 + (2 − Ma²)ε (the classical form).
	if d := r.DynamicPressureFactor - (1 + (2-0.3844)*r.Blockage); math.Abs(d) > 3*r.Blockage*r.Blockage {
		t.Errorf("q/q_u differs from 1 + (2 − Ma²)ε by %v, more than second order", d)
	}
}

// TestWallCorrectionsRefuseHighMach: above MaxWallCorrectionMach (0.8)
// the linear corrections are refused with a *tunnel.Error of
// class ErrRange, as are Ma ≥ 1, a negative or a NaN Mach number.
func TestWallCorrectionsRefuseHighMach(t *testing.T) {
	for _, ma := range []float64{0.85, 0.99, 1, 2, -0.1, math.NaN(), math.MaxFloat64} {
		_, err2 := tunnel.CorrectWalls2D(tunnel.Section2D{Chord: q.New(0.3, q.Length), Height: q.New(0.9, q.Length),
			ShapeFactor: 0.25, CL: 0.5, CD: 0.01, Mach: ma})
		_, err3 := tunnel.CorrectWalls3D(tunnel.Model3D{WingArea: q.New(0.3, q.Area), TunnelArea: q.New(3, q.Area),
			ModelVolume: q.New(0.012, q.Volume), ShapeFactor: 0.86, Delta: 0.125, CL: 0.5, CD: 0.04, Mach: ma})
		for _, err := range []error{err2, err3} {
			var ce *tunnel.Error
			if !errors.As(err, &ce) || !errors.Is(err, q.ErrRange) || errors.Is(err, q.ErrInvalid) || !strings.Contains(ce.Input, "Mach") {
				t.Errorf("Ma = %v: %v", ma, err)
			}
		}
	}
}

// TestWallCorrectionsIncompressibleUnchanged: at Ma = 0 every result is
// bit for bit what the incompressible formulas (written out here as the
// corrections computed them before the Mach number was taken) give.
func TestWallCorrectionsIncompressibleUnchanged(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		c := rapid.Float64Range(0.05, 0.5).Draw(t, "c")
		h := rapid.Float64Range(2.6*c, 8*c).Draw(t, "h")
		lam := rapid.Float64Range(0, 1).Draw(t, "Λ")
		al, cl := rapid.Float64Range(-15, 15).Draw(t, "α"), rapid.Float64Range(-1.5, 2).Draw(t, "C_l")
		cd, cm := rapid.Float64Range(0.005, 0.1).Draw(t, "C_d"), rapid.Float64Range(-0.2, 0.1).Draw(t, "C_m")
		r, err := tunnel.CorrectWalls2D(tunnel.Section2D{Chord: q.New(c, q.Length), Height: q.New(h, q.Length), ShapeFactor: lam, AlphaDeg: al, CL: cl, CD: cd, CM: cm})
		if err != nil {
			t.Fatal(err)
		}
		sig := math.Pi * math.Pi / 48 * (c / h) * (c / h)
		esb, ewb := lam*sig, c/(4*h)*cd
		e := esb + ewb
		wcl := cl * (1 - sig - 2*e)
		want := tunnel.Corrected2D{Sigma: sig, Beta: 1, SolidBlock: esb, WakeBlock: ewb, Blockage: e, VelocityFactor: 1 + e, MachFactor: 1 + e,
			ReynoldsFactor: 1 + e, DynamicPressureFactor: 1 + 2*e, DeltaAlphaDeg: 57.3 * sig / (2 * math.Pi) * (cl + 4*cm),
			CL: wcl, CM: cm*(1-2*e) + sig*wcl/4, CD: cd * (1 - 3*esb - 2*ewb), ChordToHeight: c / h}
		want.AlphaDeg = al + want.DeltaAlphaDeg
		if r != want {
			t.Fatalf("2-D at Ma 0:\n got %+v\nwant %+v", r, want)
		}

		s := rapid.Float64Range(0.05, 0.6).Draw(t, "S")
		v := rapid.Float64Range(0, 0.05).Draw(t, "V")
		k, d := rapid.Float64Range(0, 1.5).Draw(t, "Kτ₁"), rapid.Float64Range(0, 0.3).Draw(t, "δ")
		m := tunnel.Model3D{WingArea: q.New(s, q.Area), TunnelArea: q.New(3, q.Area), ModelVolume: q.New(v, q.Volume), ShapeFactor: k, Delta: d,
			AlphaDeg: al, CL: cl, CD: cd, CM: cm, CurvatureFactor: 0.1, LiftSlopePerDeg: 0.08, TailCurvatureFactor: 0.5, TailMomentSlopePerDeg: -0.02}
		r3, err := tunnel.CorrectWalls3D(m)
		if err != nil {
			t.Fatal(err)
		}
		esb3, ewb3 := k*v/math.Pow(3, 1.5), s/(4*3)*cd
		e3 := esb3 + ewb3
		f := (1 + e3) * (1 + e3)
		clq := cl / f
		da := 57.3 * d * s / 3 * clq
		w3 := tunnel.Corrected3D{Beta: 1, SolidBlock: esb3, WakeBlock: ewb3, Blockage: e3, DynamicPressureFactor: f, DeltaAlphaDeg: da,
			DeltaCD: d * s / 3 * clq * clq, DeltaAlphaCurvatureDeg: 0.1 * da}
		w3.DeltaCLCurvature = -w3.DeltaAlphaCurvatureDeg * 0.08
		w3.DeltaCMCurvature = -0.25 * w3.DeltaCLCurvature
		w3.TailAngleDeg = 0.5 * da
		w3.DeltaCMTail = 0.02 * w3.TailAngleDeg
		w3.AlphaDeg = al + da + w3.DeltaAlphaCurvatureDeg
		w3.CL = clq + w3.DeltaCLCurvature
		w3.CD = cd/f + w3.DeltaCD
		w3.CM = cm/f + w3.DeltaCMCurvature + w3.DeltaCMTail
		if r3 != w3 {
			t.Fatalf("3-D at Ma 0:\n got %+v\nwant %+v", r3, w3)
		}
	})
}

// TestWallCorrectionsExtremeFinite: extreme finite inputs that gave ±Inf
// or NaN with a nil error are refused.
func TestWallCorrectionsExtremeFinite(t *testing.T) {
	max := math.MaxFloat64
	sec := func(mod func(*tunnel.Section2D)) error {
		s := tunnel.Section2D{Chord: q.New(0.3, q.Length), Height: q.New(0.9, q.Length), ShapeFactor: 0.25, CL: 0.5, CD: 0.01}
		mod(&s)
		_, err := tunnel.CorrectWalls2D(s)
		return err
	}
	mod := func(f func(*tunnel.Model3D)) error {
		m := tunnel.Model3D{WingArea: q.New(0.3, q.Area), TunnelArea: q.New(3, q.Area), ModelVolume: q.New(0.012, q.Volume), ShapeFactor: 0.86, Delta: 0.125, CL: 0.5, CD: 0.04}
		f(&m)
		_, err := tunnel.CorrectWalls3D(m)
		return err
	}
	for _, c := range []struct {
		name string
		err  error
	}{
		{"2-D: C_l = 1e308, C_m = −1e308", sec(func(s *tunnel.Section2D) { s.CL, s.CM = 1e308, -1e308 })},
		{"2-D: C_d = 1e300", sec(func(s *tunnel.Section2D) { s.CD = 1e300 })},
		{"2-D: α = 1e300", sec(func(s *tunnel.Section2D) { s.AlphaDeg = 1e300 })},
		{"3-D: volume MaxFloat64 in a 1e-10 m² section", mod(func(m *tunnel.Model3D) {
			m.ModelVolume, m.TunnelArea, m.WingArea = q.New(max, q.Volume), q.New(1e-10, q.Area), q.New(1e-11, q.Area)
		})},
		{"3-D: C_L = 1e308, C_m = −1e308", mod(func(m *tunnel.Model3D) { m.CL, m.CM = 1e308, -1e308 })},
		{"3-D: tail slope 1e308 against C_m −1e308", mod(func(m *tunnel.Model3D) {
			m.TailCurvatureFactor, m.TailMomentSlopePerDeg, m.CM = 1, 1e308, -1e308
		})},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
		}
	}
}

// cryoCase is a nitrogen tunnel for the survey aircraft of the tunnel
// example: 18 km, Ma 0.6, chord 2 m, a 1:40 model.
func cryoCase() (fluids.State, q.Quantity, q.Quantity) {
	proto, _ := fluids.StandardAtmosphere(q.New(18000, q.Length), fluids.GeopotentialAlt)
	return proto, q.New(0.6*proto.SpeedOfSound.Value(), q.Velocity), q.New(2.0, q.Length)
}

// TestTunnelFinderKeepsNitrogenGas: with no margin given, a nitrogen
// tunnel whose limits allow a total temperature of 70 K is not reported
// at a static state at or below saturation (the old finder returned one
// as achieved); the saturation binds and is named.
func TestTunnelFinderKeepsNitrogenGas(t *testing.T) {
	proto, V, L := cryoCase()
	lim := tunnel.Limits{MinTemperature: q.New(70, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e4, q.Pressure), MaxPressure: q.New(4.5e5, q.Pressure)}
	c, err := tunnel.FindCondition(fluids.Nitrogen(), proto, V, L, 1.0/40, lim)
	if err != nil {
		t.Fatal(err)
	}
	ts, err := fluids.NitrogenSaturationTemperature(c.Pressure)
	if err != nil {
		t.Fatal(err)
	}
	if !(c.Temperature.Value() > ts.Value()) || c.Temperature.Value()-ts.Value() > 1e-6 {
		t.Errorf("static %v at %v: saturation %v; want just above it (the saturation binds)", c.Temperature, c.Pressure, ts)
	}
	if !slices.Contains(c.Binding, "saturation temperature (no margin given)") || c.Gas != "nitrogen" {
		t.Errorf("binding %v, gas %q", c.Binding, c.Gas)
	}
	if _, err := fluids.Nitrogen().At(c.Temperature, c.Pressure); err != nil {
		t.Errorf("the found state is refused by the gas model: %v", err)
	}
	// Limits that lie wholly below air's range are a range error.
	lim.MaxTemperature = q.New(120, q.Temperature)
	if _, err := tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/40, lim); !errors.Is(err, q.ErrRange) {
		t.Errorf("air at 70 … 120 K: %v", err)
	}
}

// TestTunnelFinderCautions: a nitrogen condition carries the
// asphyxiation and cold cautions besides the general one; the load
// C·S·q at the found q is compared with a rated load and an overload is
// flagged and said; a warm air tunnel carries neither gas caution and
// says that no rating was given.
func TestTunnelFinderCautions(t *testing.T) {
	proto, V, L := cryoCase()
	lim := tunnel.Limits{MinTemperature: q.New(110, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e5, q.Pressure), MaxPressure: q.New(4.5e5, q.Pressure),
		RatedLoad: q.New(500, q.Force), LoadArea: q.New(0.6*0.02, q.Area)}
	c, err := tunnel.FindCondition(fluids.Nitrogen(), proto, V, L, 1.0/40, lim)
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Contains(c.Cautions, tunnel.Caution) || !slices.Contains(c.Cautions, tunnel.AsphyxiantCaution) ||
		!slices.Contains(c.Cautions, tunnel.ColdCaution) {
		t.Errorf("cautions %q", c.Cautions)
	}
	load := 0.012 * c.Q.Value() // C·S·q by hand
	if math.Abs(c.Load.Value()-load) > 1e-9*load || c.Overloaded != (load > 500) {
		t.Errorf("load %v, overloaded %v; by hand %v N", c.Load, c.Overloaded, load)
	}
	lim.RatedLoad = q.New(load/2, q.Force)
	c, err = tunnel.FindCondition(fluids.Nitrogen(), proto, V, L, 1.0/40, lim)
	if err != nil || !c.Overloaded || !strings.Contains(strings.Join(c.Cautions, "\n"), "OVERLOAD") {
		t.Errorf("a load of twice the rating: %v, %+v", err, c)
	}
	warm := tunnel.Limits{MinTemperature: q.New(280, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(5e5, q.Pressure)}
	c, err = tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/12, warm)
	if err != nil {
		t.Fatal(err)
	}
	all := strings.Join(c.Cautions, "\n")
	if slices.Contains(c.Cautions, tunnel.AsphyxiantCaution) || slices.Contains(c.Cautions, tunnel.ColdCaution) ||
		!strings.Contains(all, "no rated load given") || !strings.Contains(all, "responsible engineer") {
		t.Errorf("warm air cautions %q", c.Cautions)
	}
	lim.LoadArea = q.Quantity{}
	if _, err := tunnel.FindCondition(fluids.Nitrogen(), proto, V, L, 1.0/40, lim); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("a rated load without a load area: %v", err)
	}
}

// TestTunnelFinderExtremeFinite: a prototype length of MaxFloat64 gave
// an infinite full-scale Reynolds number with a nil error; extreme
// finite inputs are refused or give finite numbers.
func TestTunnelFinderExtremeFinite(t *testing.T) {
	proto, V, _ := cryoCase()
	lim := tunnel.Limits{MinTemperature: q.New(280, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(5e5, q.Pressure)}
	for _, c := range []struct {
		name  string
		L     float64
		ratio float64
		V     q.Quantity
	}{
		{"length MaxFloat64", math.MaxFloat64, 0.1, V}, {"length 1e300", 1e300, 0.1, V}, {"length 1e300, ratio 1e300", 1e300, 1e300, V},
		{"speed 1e300", 2, 0.1, q.New(1e300, q.Velocity)}, {"length 1e-300", 1e-300, 1e-300, V},
	} {
		r, err := tunnel.FindCondition(fluids.Air(), proto, c.V, q.New(c.L, q.Length), c.ratio, lim)
		if err == nil && !allFinite(r.FullReynolds, r.ModelReynolds, r.ReynoldsRatio, r.Total.Pressure.Value(), r.Total.Temperature.Value(),
			r.Pressure.Value(), r.Temperature.Value(), r.Velocity.Value(), r.Q.Value()) {
			t.Errorf("%s: %+v with a nil error", c.name, r)
		}
	}
	if _, err := tunnel.FindCondition(fluids.Air(), proto, V, q.New(math.MaxFloat64, q.Length), 0.1, lim); err == nil {
		t.Errorf("length MaxFloat64 accepted")
	}
}

// allFinite reports whether every value is a finite number.
func allFinite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// TestTunnelFinderQLimitBelowMinimum: a dynamic-pressure limit that
// allows less than the minimum total pressure is refused (the finder
// used to return a total pressure below the tunnel's minimum).
func TestTunnelFinderQLimitBelowMinimum(t *testing.T) {
	proto, V, L := cryoCase()
	lim := tunnel.Limits{MinTemperature: q.New(280, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e5, q.Pressure), MaxPressure: q.New(5e5, q.Pressure), MaxDynamicPressure: q.New(1e3, q.Pressure)}
	c, err := tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/12, lim)
	if !errors.Is(err, q.ErrRange) {
		t.Errorf("q ≤ 1 kPa with p₀ ≥ 1 bar: %v, total %v", err, c.Total)
	}
}
