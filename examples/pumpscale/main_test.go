package main

import (
	"bytes"
	"errors"
	"flag"
	"math"
	"strings"
	"testing"
)

func TestRuns(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "gpm", "kW", "CAUTION"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-np", "0"}); err == nil {
		t.Error("-np 0 accepted")
	}
}

// TestByHand carries the 800 gpm point: Q_p = 800·(1180/1750)·2.4³ gpm,
// H_p = 96·(1180/1750)²·2.4² ft (common practice affinity laws), η_p =
// 1 − 0.165·(1/2.4)^0.2 (Moody at the best-efficiency point, 83.5 %), and
// shaft power ρgQH/η with 1 gpm = 6.30901964e-5 m³/s and 1 ft = 0.3048 m
// exactly. The 200 gpm part-load point gains the same 2.65 points as the
// best-efficiency point, not the 7.7 Moody's formula would give it alone.
func TestByHand(t *testing.T) {
	rows, err := evaluate(&bytes.Buffer{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	r := rows[3]
	n, d := 1180.0/1750, 2.4
	qp := 800 * n * d * d * d * 6.30901964e-5
	hp := 96 * n * n * d * d * 0.3048
	eta := 1 - 0.165*math.Pow(1/2.4, 0.2)
	pp := 998.2 * 9.80665 * qp * hp / eta
	got := []float64{r.ProtoQ.Value(), r.ProtoH.Value(), r.ProtoEta, r.ProtoP.Value()}
	want := []float64{qp, hp, eta, pp}
	for i := range got {
		if math.Abs(got[i]/want[i]-1) > 1e-12 {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
	gain := 0.165 * (1 - math.Pow(1/2.4, 0.2)) // 0.0265026
	if math.Abs(gain-0.0265026) > 1e-6 {
		t.Fatalf("hand gain %v", gain)
	}
	for i, m := range []float64{0.52, 0.71, 0.80, 0.835, 0.81, 0.72} {
		if math.Abs(rows[i].ProtoEta-(m+gain)) > 1e-12 {
			t.Errorf("point %d: η_p = %v, want %v + %v", i, rows[i].ProtoEta, m, gain)
		}
	}
}

// TestHelp: -h prints the usage and is not an error for main.
func TestHelp(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-h"})
	if !errors.Is(err, flag.ErrHelp) || !strings.Contains(out.String(), "Usage") {
		t.Errorf("-h: %v, %q", err, out.String())
	}
}
