package reduction_test

import (
	"bytes"
	"flag"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"strconv"
	"testing"
)

var update = flag.Bool("update", false, "rewrite testdata/carriage.csv from the generator")

// The INVENTED towing-carriage log of the tests, examples and
// benchmarks: 200 Hz for 14 s (2800 rows), generated deterministically.
// Channels:
//
//	t     time, s
//	run   the carriage's run label: 0 at rest and between runs, 1, 2, 3
//	V     carriage speed, m/s
//	F     resistance dynamometer, N, with an offset of 0.80 N
//	T_w   tank water temperature, °C
//
// The carriage stands still from 0 to 2.5 s (the zero window is taken
// from 0.5 s to 2 s), ramps to each run's speed, holds it, and stops:
//
//	run 1:  4.0 s ≤ t < 6.5 s,   V 1.0 m/s, F 0.80 + 4.0 N
//	run 2:  7.5 s ≤ t < 10.0 s,  V 1.5 m/s, F 0.80 + 8.6 N
//	run 3: 11.0 s ≤ t < 13.5 s,  V 2.0 m/s, F 0.80 + 15.0 N
//
// F's noise is first-order autoregressive (φ = 0.6, stationary standard
// deviation 0.05 N), V's white (0.002 m/s), T_w's white (0.005 K) about
// 18 °C.
const (
	fxRate  = 200.0
	fxRows  = 2800
	fxOff   = 0.80
	fxPhi   = 0.6
	fxSigF  = 0.05
	fxSigV  = 0.002
	fxSigT  = 0.005
	fxTemp  = 18.0
	fxHullL = 2.0 // m, the model's length in the derived channels
)

var fxRuns = []struct{ from, to, v, net float64 }{
	{4.0, 6.5, 1.0, 4.0},
	{7.5, 10.0, 1.5, 8.6},
	{11.0, 13.5, 2.0, 15.0},
}

// carriageRows returns the invented log's rows: t, run, V, F, T_w.
func carriageRows(seed uint64, rows int) [][5]float64 {
	g := newCarriage(seed)
	out := make([][5]float64, rows)
	for i := range out {
		out[i] = g.next()
	}
	return out
}

// carriage generates the invented log row by row, for a log too long
// to hold.
type carriage struct {
	rate  float64 // samples per second
	r     *rand.Rand
	innov float64
	e     float64
	i     int
}

func newCarriage(seed uint64) *carriage {
	r := rand.New(rand.NewPCG(seed, 11))
	return &carriage{rate: fxRate, r: r, innov: fxSigF * math.Sqrt(1-fxPhi*fxPhi), e: r.NormFloat64() * fxSigF}
}

// next returns the next row: t, run, V, F, T_w.
func (g *carriage) next() [5]float64 {
	r := g.r
	dur := float64(fxRows) / fxRate
	ti := float64(g.i) / g.rate
	g.i++
	tc := math.Mod(ti, dur) // a longer log repeats the cycle
	v, x, run := 0.0, 0.0, 0.0
	prevV, prevX, prevEnd := 0.0, 0.0, 2.5
	for k, rn := range fxRuns {
		switch {
		case tc >= rn.from && tc < rn.to:
			v, x, run = rn.v, rn.net, float64(k+1)
		case tc >= prevEnd && tc < rn.from:
			f := (tc - prevEnd) / (rn.from - prevEnd)
			v, x = prevV+f*(rn.v-prevV), prevX+f*(rn.net-prevX)
		}
		prevV, prevX, prevEnd = rn.v, rn.net, rn.to
	}
	if tc >= 13.5 {
		f := math.Max(0, 1-(tc-13.5)/0.5)
		v, x = 2.0*f, 15.0*f
	}
	g.e = fxPhi*g.e + g.innov*r.NormFloat64()
	return [5]float64{ti, run, v + fxSigV*r.NormFloat64(), fxOff + x + g.e, fxTemp + fxSigT*r.NormFloat64()}
}

// carriageCSV writes the invented log as a channel file.
func carriageCSV(seed uint64, rows int) []byte {
	var b bytes.Buffer
	b.WriteString("# INVENTED towing-carriage log, 200 Hz: for tests and examples only\n")
	b.WriteString("# at rest 0 to 2.5 s (zero), runs 1-3, run = 0 at rest and between runs\n")
	b.WriteString("t [s],run [1],V [m/s],F [N],T_w [°C]\n")
	for _, r := range carriageRows(seed, rows) {
		fmt.Fprintf(&b, "%s,%g,%s,%s,%s\n", strconv.FormatFloat(r[0], 'f', 3, 64), r[1],
			strconv.FormatFloat(r[2], 'f', 5, 64), strconv.FormatFloat(r[3], 'f', 4, 64), strconv.FormatFloat(r[4], 'f', 4, 64))
	}
	return b.Bytes()
}

// TestFixtureFile checks that testdata/carriage.csv is what the
// generator writes (go test -run TestFixtureFile -update rewrites it).
func TestFixtureFile(t *testing.T) {
	want := carriageCSV(1, fxRows)
	if *update {
		if err := os.WriteFile("testdata/carriage.csv", want, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	got, err := os.ReadFile("testdata/carriage.csv")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Error("testdata/carriage.csv differs from the generator; rerun with -update")
	}
}
