package fit

import (
	"math"
	"testing"
)

// The NIST Statistical Reference Datasets for linear least squares
// (StRD, https://www.itl.nist.gov/div898/strd/lls/lls.shtml): data and
// certified values as NIST publishes them, to 15 significant digits.

// Pontius, P., NIST, load cell calibration: deflection y against load x,
// 20 loads measured twice (40 rows). Model y = B0 + B1·x + B2·x².
var pontiusY = []float64{
	.11019, .21956, .32949, .43899, .54803, .65694, .76562, .87487, .98292, 1.09146,
	1.20001, 1.30822, 1.41599, 1.52399, 1.63194, 1.73947, 1.84646, 1.95392, 2.06128, 2.16844,
	.11052, .22018, .32939, .43886, .54798, .65739, .76596, .87474, .98300, 1.09150,
	1.20004, 1.30818, 1.41613, 1.52408, 1.63159, 1.73965, 1.84696, 1.95445, 2.06177, 2.16829,
}

func pontiusX() []float64 {
	x := make([]float64, 40)
	for i := range x {
		x[i] = 150000 * float64(i%20+1)
	}
	return x
}

// Certified values, NIST StRD Pontius.
var (
	pontiusB  = []float64{0.673565789473684e-03, 0.732059160401003e-06, -0.316081871345029e-14}
	pontiusSE = []float64{0.107938612033077e-03, 0.157817399981659e-09, 0.486652849992036e-16}
	pontiusS  = 0.205177424076185e-03 // residual standard deviation
	pontiusR2 = 0.999999900178537
)

// Wampler, R. H. (1970), J. Amer. Statist. Assoc. 65, 549–565, NIST StRD
// Wampler1: y = 1 + x + x² + x³ + x⁴ + x⁵ exactly at x = 0 … 20; every
// certified coefficient is 1 with standard deviation 0.
func wampler1() (x, y []float64) {
	for i := 0; i <= 20; i++ {
		v := float64(i)
		x = append(x, v)
		y = append(y, 1+v+v*v+v*v*v+v*v*v*v+v*v*v*v*v)
	}
	return x, y
}

// relErr is |got − want|/|want|.
func relErr(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }

func TestNISTPontius(t *testing.T) {
	f, err := FitPoly(pontiusX(), pontiusY, 2, nil)
	if err != nil {
		t.Fatal(err)
	}
	a, se, err := f.Power()
	if err != nil {
		t.Fatal(err)
	}
	for k := range 3 {
		// The certified values are given to 15 digits; a QR solution in
		// the scaled variable keeps at least 9 of them here.
		if e := relErr(a[k], pontiusB[k]); e > 1e-9 {
			t.Errorf("B%d = %.15g, certified %.15g (relative error %.2g)", k, a[k], pontiusB[k], e)
		}
		if e := relErr(se[k], pontiusSE[k]); e > 1e-8 {
			t.Errorf("SE(B%d) = %.15g, certified %.15g (relative error %.2g)", k, se[k], pontiusSE[k], e)
		}
	}
	if e := relErr(f.S, pontiusS); e > 1e-9 {
		t.Errorf("S = %.15g, certified %.15g", f.S, pontiusS)
	}
	if e := relErr(f.R2, pontiusR2); e > 1e-12 {
		t.Errorf("R² = %.15g, certified %.15g", f.R2, pontiusR2)
	}
	if f.DoF != 37 {
		t.Errorf("DoF = %d, want 37 (NIST: residual degrees of freedom 37)", f.DoF)
	}
}

func TestNISTWampler1(t *testing.T) {
	x, y := wampler1()
	f, err := FitPoly(x, y, 5, nil)
	if err != nil {
		t.Fatal(err)
	}
	a, se, err := f.Power()
	if err != nil {
		t.Fatal(err)
	}
	for k := range 6 {
		if e := math.Abs(a[k] - 1); e > 1e-8 {
			t.Errorf("B%d = %.15g, certified 1", k, a[k])
		}
		if se[k] > 1e-6 {
			t.Errorf("SE(B%d) = %.3g, certified 0", k, se[k])
		}
	}
}
