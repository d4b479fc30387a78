package ship_test

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// byHandRun analyses TestSelfPropulsionByHand's run (D = 0.2 m, n = 10
// rev/s, J_TM = 0.5) with the open-water test's chord c_0.7.
func byHandRun(t *testing.T, chord float64) ship.SelfPropulsionPoint {
	t.Helper()
	water := fluids.State{Density: quantity.New(1000, quantity.Density), KinematicViscosity: quantity.New(1.14e-6, quantity.KinematicViscosity)}
	ot := ship.OpenWaterTest{Diameter: quantity.New(0.2, quantity.Length), Chord: quantity.New(chord, quantity.Length), Water: water, Order: 1}
	for _, j := range []float64{0.1, 0.3, 0.5, 0.7, 0.9} {
		ot.Runs = append(ot.Runs, ship.OpenWaterRun{Speed: quantity.New(j*3, quantity.Velocity), RevsPerSecond: 15,
			Thrust: quantity.New((0.4-0.4*j)*360, quantity.Force), Torque: quantity.New((0.05-0.04*j)*72, quantity.Torque)})
	}
	ow, err := ship.ReduceOpenWater(ot)
	if err != nil {
		t.Fatal(err)
	}
	pts, err := ship.AnalyseSelfPropulsion(ship.SelfPropulsionTest{Diameter: quantity.New(0.2, quantity.Length), Water: water, OpenWater: ow,
		Runs: []ship.SelfPropulsionRun{{ModelSpeed: quantity.New(1.2, quantity.Velocity), RevsPerSecond: 10, Thrust: quantity.New(32, quantity.Force),
			Torque: quantity.New(0.96, quantity.Torque), TowingForce: quantity.New(4, quantity.Force), Resistance: quantity.New(30, quantity.Force)}}})
	if err != nil {
		t.Fatal(err)
	}
	return pts[0]
}

// TestSelfPropulsionReynoldsByHand: the run's blade Reynolds number by
// hand, V_A = J·nD = 0.5·10·0.2 = 1 m/s, 0.7πnD = 4.398 23 m/s,
// √(1 + 19.3444) = 4.510 47 m/s:
//
//	c_0.7 = 0.06 m: Re_0.7 = 0.06·4.510 47/1.14×10⁻⁶ = 237 394 (no warning)
//	c_0.7 = 0.04 m: Re_0.7 = 0.04·4.510 47/1.14×10⁻⁶ = 158 262 (< 2×10⁵: warned)
func TestSelfPropulsionReynoldsByHand(t *testing.T) {
	for _, c := range []struct {
		chord, re float64
		warn      bool
	}{{0.06, 237394, false}, {0.04, 158262, true}} {
		p := byHandRun(t, c.chord)
		if math.Abs(p.Reynolds-c.re) > 1 {
			t.Errorf("c = %v: Re_0.7 = %v, by hand %v", c.chord, p.Reynolds, c.re)
		}
		if got := p.Warning != ""; got != c.warn {
			t.Errorf("c = %v: warning %q, want one: %v", c.chord, p.Warning, c.warn)
		}
		if c.warn && !strings.Contains(p.Warning, "self-propulsion run 1 (V_M = 1.2 m/s)") {
			t.Errorf("warning %q does not name run 1", p.Warning)
		}
	}
}

// TestSpeedPowerWarnsLowPropellerReynolds: every self-propulsion run
// below the usual minimum carries a warning, runs counted from 1, and
// the speed–power table prints each once.
func TestSpeedPowerWarnsLowPropellerReynolds(t *testing.T) {
	in := speedPowerInput(t, 0)
	ow := *in.SelfPropulsion.OpenWater
	ow.Chord /= 10
	in.SelfPropulsion.OpenWater = &ow
	sp, err := ship.PredictSpeedPower(in)
	if err != nil {
		t.Fatal(err)
	}
	tb := sp.Table(false)
	for i, p := range sp.Factors {
		if !(p.Reynolds > 0 && p.Reynolds < ship.UsualOpenWaterReynolds) {
			t.Fatalf("run %d: Re_0.7 = %v, want a low one", i+1, p.Reynolds)
		}
		want := fmt.Sprintf("WARNING: self-propulsion run %d (V_M", i+1)
		if !strings.HasPrefix("WARNING: "+p.Warning, want) || strings.Count(tb, want) != 1 {
			t.Errorf("run %d: warning %q, printed %d times, want %q once", i+1, p.Warning, strings.Count(tb, want), want)
		}
	}
	if strings.Contains(tb, "run 0") {
		t.Errorf("table counts runs from 0:\n%s", tb)
	}
	if !strings.Contains(tb, "C_P = 1 on P_D and C_N = 1 on n") {
		t.Errorf("table does not state C_P and C_N:\n%s", tb)
	}
}

// TestOutlierNoteLabel: a fit's outlier note names the externally
// studentised residual as such and gives the residual in units of S
// (the two differ: S includes the outlier, the studentised residual
// does not).
func TestOutlierNoteLabel(t *testing.T) {
	ot := synOpenWater(0.002)
	r := &ot.Runs[4]
	r.Thrust = quantity.New(r.Thrust.Value()*1.08, quantity.Force)
	ow, err := ship.ReduceOpenWater(ot)
	if err != nil {
		t.Fatal(err)
	}
	if len(ow.KT.Outliers) == 0 {
		t.Fatal("no outlier flagged")
	}
	row := ow.KT.Rows[ow.KT.Outliers[0]]
	want := fmt.Sprintf("has an externally studentised residual of %.3g from the faired K_T (its residual %.3g is %.3g times the fit's residual standard deviation S = ",
		math.Abs(row.Studentized), row.Residual, math.Abs(row.Residual)/ow.KT.S)
	if !strings.Contains(ow.Warning, want) {
		t.Errorf("warning %q\nlacks %q", ow.Warning, want)
	}
	if strings.Contains(ow.Warning, "residual standard deviations from") {
		t.Errorf("warning %q calls the studentised residual a multiple of S", ow.Warning)
	}
}

// TestPoweringTableTenKQ: the ITTC-1978 table prints 10K_Q like every
// other open-water table.
func TestPoweringTableTenKQ(t *testing.T) {
	r, err := ship.ITTC1978(poweringInput())
	if err != nil {
		t.Fatal(err)
	}
	tb := ship.PoweringTable([]ship.PoweringResult{r}, false)
	if !strings.Contains(tb, "10K_Q") || !strings.Contains(tb, fmt.Sprintf(" %.4f ", 10*r.KQ)) {
		t.Errorf("table lacks 10K_Q = %.4f:\n%s", 10*r.KQ, tb)
	}
}
