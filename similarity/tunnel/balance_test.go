package tunnel_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// classes are the module's error classes; every error matches one.
var classes = []error{q.ErrDimension, q.ErrRange, q.ErrParse, q.ErrUnknown, q.ErrInvalid}

func oneClass(t *testing.T, err error) {
	t.Helper()
	n := 0
	for _, c := range classes {
		if errors.Is(err, c) {
			n++
		}
	}
	if n != 1 {
		t.Errorf("%v matches %d classes, want 1", err, n)
	}
	var te *tunnel.Error
	var de *q.Error
	if !errors.As(err, &te) && !(errors.As(err, &de) && de.Class == q.ErrDimension) {
		t.Errorf("%v (%T) is neither a *tunnel.Error nor a *quantity.Error of class ErrDimension", err, err)
	}
}

// threeComp is an invented three-component balance (NF, AF, PM) in the
// readings-from-loads form: R = C₁F + C₂q(F), readings in mV/V, loads
// in N and N·m, q(F) = (N², N·A, N·m, A², A·m, m²).
func threeComp(t *testing.T) *tunnel.Calibration {
	t.Helper()
	c, err := tunnel.NewCalibration("test", tunnel.ReadingsFromLoads, "mV/V",
		[]tunnel.ComponentRange{{tunnel.NormalForce, -2000, 2000}, {tunnel.AxialForce, -200, 200}, {tunnel.PitchingMoment, -100, 100}},
		[][]float64{{5e-4, 2e-5, 1e-5}, {1e-5, 4e-3, 0}, {-2e-5, 0, 1e-2}},
		[][]float64{{1e-9, 2e-9, 0, 0, 0, 1e-8}, {0, 0, 0, 3e-8, 0, 0}, {5e-10, 0, 2e-8, 0, 0, 0}})
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestBalanceIterativeByHand: loads N = 1500 N, A = −80 N, m = 40 N·m
// give, written out term by term,
//
//	R_N = 5e-4·1500 + 2e-5·(−80) + 1e-5·40 + 1e-9·1500² + 2e-9·1500·(−80) + 1e-8·40²
//	    = 0.75 − 0.0016 + 0.0004 + 0.00225 − 0.00024 + 0.000016 = 0.750826
//	R_A = 1e-5·1500 + 4e-3·(−80) + 3e-8·80² = 0.015 − 0.32 + 0.000192 = −0.304808
//	R_m = −2e-5·1500 + 1e-2·40 + 5e-10·1500² + 2e-8·1500·40
//	    = −0.03 + 0.4 + 0.001125 + 0.0012 = 0.372325
//
// and the iterative inversion returns the loads from those readings.
func TestBalanceIterativeByHand(t *testing.T) {
	c := threeComp(t)
	r := []float64{0.750826, -0.304808, 0.372325}
	var want tunnel.Loads
	want[tunnel.NormalForce], want[tunnel.AxialForce], want[tunnel.PitchingMoment] = 1500, -80, 40
	got, err := c.Readings(want)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(r, got, cmpopts.EquateApprox(0, 1e-12)); d != "" {
		t.Errorf("readings (-hand +got):\n%s", d)
	}
	l, err := c.Loads(r)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(want[:], l[:], cmpopts.EquateApprox(0, 1e-8)); d != "" {
		t.Errorf("loads (-hand +got):\n%s", d)
	}
	// The first-order estimate alone, C₁⁻¹R, misses the interactions by
	// about R_N's 0.002 mV/V, ≈ 4 N: the iteration matters.
	lin, _ := tunnel.NewCalibration("", tunnel.ReadingsFromLoads, "mV/V", c.Components(),
		[][]float64{{5e-4, 2e-5, 1e-5}, {1e-5, 4e-3, 0}, {-2e-5, 0, 1e-2}}, nil)
	l1, err := lin.Loads(r)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(l1[tunnel.NormalForce]-1500) < 2 {
		t.Errorf("first-order N = %v: the interactions should move it by several newtons", l1[tunnel.NormalForce])
	}
}

// TestBalanceDirectByHand: the direct form F = C₁R + C₂q(R) with two
// components (NF in N, PM in N·m) and readings 0.5, 0.2 mV/V:
//
//	N = 2000·0.5 + 10·0.2 + 4·0.25 + 1·0.1 + 0·0.04 = 1000 + 2 + 1 + 0.1 = 1003.1
//	m = −3·0.5 + 100·0.2 + 0 + 0 + 2·0.04 = −1.5 + 20 + 0.08 = 18.58
func TestBalanceDirectByHand(t *testing.T) {
	c, err := tunnel.NewCalibration("", tunnel.LoadsFromReadings, "mV/V",
		[]tunnel.ComponentRange{{tunnel.NormalForce, -2000, 2000}, {tunnel.PitchingMoment, -100, 100}},
		[][]float64{{2000, 10}, {-3, 100}}, [][]float64{{4, 1, 0}, {0, 0, 2}})
	if err != nil {
		t.Fatal(err)
	}
	l, err := c.Loads([]float64{0.5, 0.2})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(l[tunnel.NormalForce]-1003.1) > 1e-9 || math.Abs(l[tunnel.PitchingMoment]-18.58) > 1e-12 {
		t.Errorf("loads %v; by hand N = 1003.1, m = 18.58", l)
	}
	// Readings inverts the direct form by iteration.
	r, err := c.Readings(l)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r[0]-0.5) > 1e-12 || math.Abs(r[1]-0.2) > 1e-12 {
		t.Errorf("readings %v, want 0.5, 0.2", r)
	}
}

// TestBalanceRoundTrip: for any loads in the calibrated range, loads →
// readings by the known matrix → loads recovers them (property).
func TestBalanceRoundTrip(t *testing.T) {
	c := threeComp(t)
	rapid.Check(t, func(rt *rapid.T) {
		var l tunnel.Loads
		l[tunnel.NormalForce] = rapid.Float64Range(-2000, 2000).Draw(rt, "N")
		l[tunnel.AxialForce] = rapid.Float64Range(-200, 200).Draw(rt, "A")
		l[tunnel.PitchingMoment] = rapid.Float64Range(-100, 100).Draw(rt, "m")
		r, err := c.Readings(l)
		if err != nil {
			rt.Fatal(err)
		}
		got, err := c.Loads(r)
		if err != nil {
			rt.Fatal(err)
		}
		for _, k := range []tunnel.Component{tunnel.NormalForce, tunnel.AxialForce, tunnel.PitchingMoment} {
			if math.Abs(got[k]-l[k]) > 1e-9*2000 {
				rt.Fatalf("%v: %v recovered as %v", k, l[k], got[k])
			}
		}
	})
}

// TestBalanceOutOfRange: readings that reduce to a load beyond the
// calibrated range are refused, naming the component, class ErrRange.
func TestBalanceOutOfRange(t *testing.T) {
	c := threeComp(t)
	var l tunnel.Loads
	l[tunnel.NormalForce], l[tunnel.AxialForce], l[tunnel.PitchingMoment] = 1999, 0, 0
	r, err := c.Readings(l)
	if err != nil {
		t.Fatal(err)
	}
	r[0] *= 1.01 // about 2019 N
	_, err = c.Loads(r)
	var te *tunnel.Error
	if !errors.Is(err, q.ErrRange) || !errors.As(err, &te) || te.Input != "NF" || !strings.Contains(err.Error(), "calibrated range") {
		t.Errorf("beyond range: %v", err)
	}
	oneClass(t, err)
	for _, bad := range [][]float64{{1, 2}, {math.NaN(), 0, 0}, {math.Inf(1), 0, 0}} {
		_, err := c.Loads(bad)
		if err == nil {
			t.Errorf("%v accepted", bad)
			continue
		}
		oneClass(t, err)
	}
}

// TestNewCalibrationRefuses: a singular matrix, a wrong shape, a repeated
// component, an empty range.
func TestNewCalibrationRefuses(t *testing.T) {
	two := []tunnel.ComponentRange{{tunnel.NormalForce, -1, 1}, {tunnel.PitchingMoment, -1, 1}}
	for name, tc := range map[string]struct {
		comps []tunnel.ComponentRange
		lin   [][]float64
	}{
		"singular":   {two, [][]float64{{1, 2}, {2, 4}}},
		"shape":      {two, [][]float64{{1, 0}}},
		"repeated":   {[]tunnel.ComponentRange{{tunnel.NormalForce, -1, 1}, {tunnel.NormalForce, -1, 1}}, [][]float64{{1, 0}, {0, 1}}},
		"empty":      {[]tunnel.ComponentRange{{tunnel.NormalForce, 1, 1}}, [][]float64{{1}}},
		"not finite": {two, [][]float64{{1, math.NaN()}, {0, 1}}},
	} {
		_, err := tunnel.NewCalibration("", tunnel.ReadingsFromLoads, "mV/V", tc.comps, tc.lin, nil)
		if err == nil {
			t.Errorf("%s: accepted", name)
			continue
		}
		oneClass(t, err)
	}
}

const calText = `# invented three-component balance for the tests
similis-balance 1
name      T-3 (invented)
form      readings-from-loads
readings  mV/V
component NF kN   -2    2     # kN
component AF lbf  -40   40
component PM N*m  -100  100
linear    NF 0.5   0.0889644323  0.01
linear    AF 0.01  0.0177928864  0
linear    PM -0.02 0             0.01
quadratic NF 0.001 0 0 0 0 0
`

// TestParseCalibrationUnits: the file's kN and lbf are converted to SI.
// The NF row gives 0.5 mV/V per kN = 5e-4 per N; AF's column is per lbf,
// 0.0889644323 mV/V per lbf over 4.4482216152605 N/lbf (the pound-force's
// definition, NIST SP 811 (2008), App. B.8) = 0.02 per N (to the nine
// digits written); PM's column 0.01 per N·m; the quadratic NF² term
// 0.001 per kN² = 1e-9 per N². So N = 1000 N, A = 10 N, m = 20 N·m read
//
//	R_N = 5e-4·1000 + 0.02·10 + 0.01·20 + 1e-9·1000² = 0.5 + 0.2 + 0.2 + 0.001 = 0.901
//	R_A = 1e-5·1000 + 0.004·10 = 0.01 + 0.04 = 0.05
//	R_m = −2e-5·1000 + 0.01·20 = −0.02 + 0.2 = 0.18
func TestParseCalibrationUnits(t *testing.T) {
	c, err := tunnel.ParseCalibration(strings.NewReader(calText))
	if err != nil {
		t.Fatal(err)
	}
	if c.Name() != "T-3 (invented)" || c.Form() != tunnel.ReadingsFromLoads || c.ReadingUnit() != "mV/V" {
		t.Errorf("header: %v", c)
	}
	if d := cmp.Diff([]tunnel.ComponentRange{{tunnel.NormalForce, -2000, 2000}, {tunnel.AxialForce, -40 * 4.4482216152605, 40 * 4.4482216152605}, {tunnel.PitchingMoment, -100, 100}},
		c.Components(), cmpopts.EquateApprox(1e-12, 0)); d != "" {
		t.Errorf("ranges:\n%s", d)
	}
	var l tunnel.Loads
	l[tunnel.NormalForce], l[tunnel.AxialForce], l[tunnel.PitchingMoment] = 1000, 10, 20
	r, err := c.Readings(l)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([]float64{0.901, 0.05, 0.18}, r, cmpopts.EquateApprox(1e-8, 0)); d != "" {
		t.Errorf("readings (-hand +got):\n%s", d)
	}
}

// TestParseCalibrationErrors: each malformed file is refused with its
// line and one class.
func TestParseCalibrationErrors(t *testing.T) {
	head := "similis-balance 1\nform readings-from-loads\nreadings mV/V\n"
	for _, tc := range []struct {
		text  string
		class error
		line  int
	}{
		{"", q.ErrParse, 0},
		{"similis-balance 2\n", q.ErrParse, 1},
		{head + "component XX N -1 1\n", q.ErrUnknown, 4},
		{head + "component NF N*m -1 1\n", q.ErrDimension, 4},
		{head + "component NF furlong -1 1\n", q.ErrUnknown, 4},
		{head + "component NF N 1 -1\n", q.ErrRange, 4},
		{head + "component NF N -1 x\n", q.ErrParse, 4},
		{head + "component NF N -1 1\nlinear NF 1 2\n", q.ErrParse, 5},
		{head + "component NF N -1 1\nlinear NF NaN\n", q.ErrParse, 5},
		{head + "component NF N -1 1\nlinear NF 1\nlinear NF 1\n", q.ErrParse, 6},
		{head + "component NF N -1 1\nlinear NF 1\ncomponent PM N*m -1 1\n", q.ErrParse, 6},
		{head + "component NF N -1 1\n", q.ErrParse, 0},
		{head + "component NF N -1 1\nlinear NF 0\n", q.ErrInvalid, 0},
		{"similis-balance 1\nform readings-from-loads\nreadings Pa\n", q.ErrDimension, 3},
		{"similis-balance 1\nform sideways\n", q.ErrUnknown, 2},
		{"similis-balance 1\nbogus\n", q.ErrUnknown, 2},
		{"similis-balance 1\nname a\x01b\n", q.ErrParse, 2},
		{"similis-balance 1\n" + strings.Repeat("#", tunnel.MaxCalibrationLine+1) + "\n", q.ErrRange, 2},
		{strings.Repeat("# padding\n", tunnel.MaxCalibrationBytes/10+1), q.ErrRange, 0},
		{"similis-balance 1\xff\n", q.ErrParse, 0},
	} {
		_, err := tunnel.ParseCalibration(strings.NewReader(tc.text))
		var te *tunnel.Error
		if !errors.Is(err, tc.class) || !errors.As(err, &te) || te.Line != tc.line {
			t.Errorf("%.60q: %v (line %v), want class %v on line %d", tc.text, err, te, tc.class, tc.line)
			continue
		}
		oneClass(t, err)
	}
}
