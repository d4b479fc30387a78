package turbo_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

func series(xy ...float64) []turbo.SuctionPoint {
	var s []turbo.SuctionPoint
	for i := 0; i+1 < len(xy); i += 2 {
		s = append(s, turbo.SuctionPoint{NPSHA: q.New(xy[i], q.Length), Head: q.New(xy[i+1], q.Length)})
	}
	return s
}

// TestNPSH3ByHand: a series whose 97 % head falls on a point. By hand:
// the reference is the mean head of the three highest-NPSHA points,
// (40 + 40 + 40)/3 = 40 m; 97 % of it is 38.8 m, the head at NPSHA = 4 m,
// and the head rises on either side of it (37.8 m at 3 m, 39.8 m at 5 m),
// so NPSH3 = 4 m. The secant either side is 1.0 m/m, so with u_H = 0.1 m
// and u_NPSHA = 0.05 m:
//
//	u from the head = √(0.1² + 0.97²·0.1²/3)/1.0 = √(0.01 + 0.0031363) = 0.114614 m
//	u = √(0.05² + 0.114614²) = 0.125046 m
func TestNPSH3ByHand(t *testing.T) {
	s := series(8, 40, 2, 35.8, 3, 37.8, 4, 38.8, 5, 39.8, 6, 40, 7, 40) // unsorted on purpose
	r, err := turbo.FindNPSH3(s, turbo.NPSH3Options{NPSHU: q.New(0.05, q.Length), HeadU: q.New(0.1, q.Length)})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"NPSH3", r.NPSH3.Value(), 4, 1e-9},
		{"reference", r.ReferenceHead.Value(), 40, 1e-12},
		{"97 %", r.DropHead.Value(), 38.8, 1e-12},
		{"slope", r.Slope, 1.0, 1e-12},
		{"u from head", r.UFromHead.Value(), 0.114614, 1e-6},
		{"u", r.U.Value(), 0.125046, 1e-6},
	} {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("%s = %v, by hand %v", c.name, c.got, c.want)
		}
	}
	if len(r.Pooled) != 0 {
		t.Errorf("monotone series pooled at %v", r.Pooled)
	}
}

// TestNPSH3KnownCurve: a suction series sampled every 0.25 m from a
// known curve, H = 40 m above NPSHA 6 m and 40 − 2·(6 − NPSHA)² below,
// has its 3 % point where 2·(6 − x)² = 1.2: x = 6 − √0.6 = 5.225403 m.
// The faired curve finds it within its uncertainty (u_H = 0.05 m) and
// within 1 cm.
func TestNPSH3KnownCurve(t *testing.T) {
	var xy []float64
	for x := 3.0; x <= 9; x += 0.25 {
		h := 40.0
		if x < 6 {
			h -= 2 * (6 - x) * (6 - x)
		}
		xy = append(xy, x, h)
	}
	r, err := turbo.FindNPSH3(series(xy...), turbo.NPSH3Options{HeadU: q.New(0.05, q.Length)})
	if err != nil {
		t.Fatal(err)
	}
	want := 6 - math.Sqrt(0.6)
	if d := math.Abs(r.NPSH3.Value() - want); d > 0.01 || d > 2*r.U.Value() {
		t.Errorf("NPSH3 = %v ± %v, known %v", r.NPSH3.Value(), r.U.Value(), want)
	}
}

// TestNPSH3Scatter: heads that scatter on the plateau are pooled into a
// non-decreasing series before fairing, the head's uncertainty comes
// from the reference points' scatter, and the faired curve never rises
// as NPSHA falls.
func TestNPSH3Scatter(t *testing.T) {
	s := series(3, 36.0, 3.5, 37.9, 4, 39.1, 4.5, 39.6, 5, 40.05, 6, 39.95, 7, 40.1, 8, 39.9, 9, 40.0)
	r, err := turbo.FindNPSH3(s, turbo.NPSH3Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Pooled) == 0 {
		t.Error("the plateau's scatter was not pooled")
	}
	// Reference (40.1 + 39.9 + 40.0)/3 = 40.0 m; scatter s = 0.1 m.
	if math.Abs(r.ReferenceHead.Value()-40) > 1e-12 || math.Abs(r.HeadU.Value()-0.1) > 1e-12 {
		t.Errorf("reference %v, u_H %v; by hand 40 and 0.1", r.ReferenceHead, r.HeadU)
	}
	lo, hi := r.Faired.Range()
	prev := math.Inf(-1)
	for i := 0; i <= 200; i++ {
		y, err := r.Faired.At(lo + (hi-lo)*float64(i)/200)
		if err != nil || y < prev-1e-12 {
			t.Fatalf("faired curve falls at step %d: %v after %v (%v)", i, y, prev, err)
		}
		prev = y
	}
	// 38.8 m lies between 37.9 m (3.5 m) and 39.1 m (4 m).
	if x := r.NPSH3.Value(); !(x > 3.5 && x < 4) {
		t.Errorf("NPSH3 = %v, want between 3.5 and 4 m", x)
	}
}

// TestNPSH3Refuses: a series that does not fall to 97 %, too few points,
// one reference point without a head uncertainty, and a wrong dimension
// are refused with one class each.
func TestNPSH3Refuses(t *testing.T) {
	for _, c := range []struct {
		name  string
		s     []turbo.SuctionPoint
		opt   turbo.NPSH3Options
		class error
	}{
		{"no drop", series(3, 39.5, 4, 39.8, 5, 40, 6, 40, 7, 40), turbo.NPSH3Options{}, q.ErrRange},
		{"too few", series(3, 30, 5, 40, 6, 40, 7, 40), turbo.NPSH3Options{}, q.ErrInvalid},
		{"one reference", series(3, 30, 5, 40, 6, 40), turbo.NPSH3Options{ReferencePoints: 1}, q.ErrInvalid},
		{"head in Pa", []turbo.SuctionPoint{{NPSHA: q.New(3, q.Length), Head: q.New(1, q.Pressure)}}, turbo.NPSH3Options{}, q.ErrDimension},
		{"negative NPSHU", series(3, 30, 4, 38, 5, 40, 6, 40, 7, 40), turbo.NPSH3Options{NPSHU: q.New(-1, q.Length)}, q.ErrInvalid},
	} {
		_, err := turbo.FindNPSH3(c.s, c.opt)
		if oneClass(err) != c.class {
			t.Errorf("%s: %v, want class %v", c.name, err, c.class)
		}
	}
}
