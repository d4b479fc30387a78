package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/units/chanfile"
)

var dragArgs = []string{"-fluids", "-derive", "rho = rho_water(T_w); nu = nu_water(T_w); L = 2 {m}",
	"-dep", "F", "-repeat", "rho,V,L", "F=N", "rho=kg/m^3", "V=m/s", "L=m", "nu=m^2/s"}

// readPoints reads the command's points file with chanfile.
func readPoints(t *testing.T, b []byte) (map[string][]float64, int) {
	t.Helper()
	rd, err := chanfile.NewReader(bytes.NewReader(b), "points", chanfile.Options{})
	if err != nil {
		t.Fatalf("%v\n%s", err, b)
	}
	cols, n, err := rd.Read(nil, 0)
	if err != nil {
		t.Fatal(err)
	}
	out := map[string][]float64{}
	for i, c := range rd.Columns() {
		out[c.Name] = cols[i].Values()[:n]
	}
	return out, n
}

// TestRunsByHand: a log of 14 rows written out, two runs and a zero
// window of 4 samples each. Every window alternates a ± d about its mean,
// so its lag-1 autocorrelation is negative, n_eff = n = 4 and the
// standard uncertainty of the mean is s/2 with s² = 4d²/3, d/√3:
//
//	zero (t 0 … 0.015 s): F 0.6 ± 0.057735 N
//	run 1: V 2.0 ± 0.057735 m/s; F 10.5 − 0.6 = 9.9 N, u √2·0.057735 = 0.081650 N
//	run 2: V 3.0 ± 0.028868 m/s; F 20.7 − 0.6 = 20.1 N, u 0.081650 N
func TestRunsByHand(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "hand.csv")
	log := "# INVENTED\nt [s],run [1],V [m/s],F [N],T_w [°C]\n"
	labels := []string{"0", "0", "0", "0", "0", "1", "1", "1", "1", "0", "2", "2", "2", "2"}
	V := []string{"0", "0", "0", "0", "1", "1.9", "2.1", "1.9", "2.1", "2", "2.95", "3.05", "2.95", "3.05"}
	F := []string{"0.5", "0.7", "0.5", "0.7", "3", "10.6", "10.4", "10.6", "10.4", "15", "20.6", "20.8", "20.6", "20.8"}
	for i := range labels {
		log += strconv.FormatFloat(float64(i)*0.005, 'f', 3, 64) + "," + labels[i] + "," + V[i] + "," + F[i] + ",18\n"
	}
	os.WriteFile(path, []byte(log), 0o644)
	var out, errb bytes.Buffer
	args := append([]string{"-data", path, "-runs", "run", "-min-run", "4", "-zero", "0s,0.015s", "-tare", "F"}, dragArgs...)
	if code := run(args, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	cols, n := readPoints(t, out.Bytes())
	if n != 2 {
		t.Fatalf("%d points:\n%s", n, out.String())
	}
	want := map[string][]float64{
		"V": {2, 3}, "u(V)": {0.057735, 0.028868}, "n_eff(V)": {4, 4},
		"F": {9.9, 20.1}, "u(F)": {0.081650, 0.081650},
		"first row": {6, 11}, "last row": {9, 14}, "label": {1, 2},
	}
	for name, w := range want {
		for i := range w {
			if got := cols[name][i]; math.Abs(got-w[i]) > 1e-4*w[i] {
				t.Errorf("point %d %s = %.6g, want %.6g", i+1, name, got, w[i])
			}
		}
	}
	for _, s := range []string{"# group\tΠ₂\tΠ₂ = nu/(V·L)\t1/Re", "# point 1: run 1, rows 6 to 9"} {
		if !strings.Contains(out.String(), s) {
			t.Errorf("output lacks %q:\n%s", s, out.String())
		}
	}
	for _, s := range []string{"2 steady points", "zero: rows 1 to 4, subtracted from F", "run 2: rows 11 to 14", "standard uncertainty (k = 1)", "engineer responsible"} {
		if !strings.Contains(errb.String(), s) {
			t.Errorf("summary lacks %q:\n%s", s, errb.String())
		}
	}
}

// TestCarriageCommand reduces the invented 200 Hz carriage log through
// the command, to a file: three runs, each tared, the generator's levels
// within 4 standard uncertainties; a second run that fails leaves the
// file as it was.
func TestCarriageCommand(t *testing.T) {
	dir := t.TempDir()
	outFile := filepath.Join(dir, "points.csv")
	var errb bytes.Buffer
	args := append([]string{"-data", "testdata/carriage.csv", "-runs", "run", "-zero", "0.5s,2s", "-tare", "F", "-out", outFile}, dragArgs...)
	if code := run(args, nil, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	b, err := os.ReadFile(outFile)
	if err != nil {
		t.Fatal(err)
	}
	cols, n := readPoints(t, b)
	if n != 3 {
		t.Fatalf("%d points", n)
	}
	// The invented levels (testdata/carriage.csv's generator): V 1.0,
	// 1.5, 2.0 m/s; F net 4.0, 8.6, 15.0 N.
	for i, lv := range [][2]float64{{1.0, 4.0}, {1.5, 8.6}, {2.0, 15.0}} {
		if d := math.Abs(cols["V"][i] - lv[0]); d > 4*cols["u(V)"][i] {
			t.Errorf("run %d: V %g ± %g, level %g", i+1, cols["V"][i], cols["u(V)"][i], lv[0])
		}
		if d := math.Abs(cols["F"][i] - lv[1]); d > 4*cols["u(F)"][i] {
			t.Errorf("run %d: F %g ± %g, level %g", i+1, cols["F"][i], cols["u(F)"][i], lv[1])
		}
		// F's noise is correlated (φ = 0.6): n_eff well below the 500 samples.
		if ne := cols["n_eff(F)"][i]; ne > 300 || ne < 60 {
			t.Errorf("run %d: n_eff(F) = %g, want about 500·0.4/1.6 = 125", i+1, ne)
		}
	}
	// A failing run (a missing channel for -tare) leaves the file whole.
	bad := append([]string{"-data", "testdata/carriage.csv", "-runs", "run", "-zero", "0.5s,2s", "-tare", "G", "-out", outFile}, dragArgs...)
	if code := run(bad, nil, &errb); code == 0 {
		t.Fatal("a tare of no channel succeeded")
	}
	if b2, _ := os.ReadFile(outFile); !bytes.Equal(b, b2) {
		t.Error("a failed run changed the previous output")
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 1 {
		t.Errorf("%d files in the output directory, want 1", len(ents))
	}
}
