package main

import (
	"errors"
	"io"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"
)

// towingFlags are the numeric flags the fuzz target sets, with the
// ranges the program declares.
var towingFlags = []struct {
	name     string
	min, max float64
}{
	{"scale", 2, 100}, {"tank", 1, 35}, {"sea", 0, 35}, {"ca", -0.001, 0.002}, {"maxfn", 0.1, 0.3},
	{"width", 1, 30}, {"depth", 0.5, 15},
}

// FuzzFlags runs the program with fuzzed flag values (no plot files) and
// with fuzzed free text as arguments: it never panics, a nil error comes
// only when every numeric flag is within its range, and a refused flag is
// a *cli.Error naming it.
func FuzzFlags(f *testing.F) {
	f.Add(16.0, 15.0, 15.0, 0.0004, 0.2, 4.5, 2.2, "-h")
	f.Add(100.0, 1.0, 0.0, -0.001, 0.3, 1.0, 0.5, "-scale NaN")
	f.Add(2.0, 35.0, 35.0, 0.002, 0.1, 30.0, 15.0, "extra")
	f.Add(1e308, -1e308, 5e-324, 0.0, 0.15, 1e300, 1e-300, "-depth 1e400 -width")
	for _, s := range []float64{3, 15, 17, 20, 40, 99.5} {
		f.Add(s, 15.0, 15.0, 0.0004, 0.2, 4.5, 2.2, "")
	}
	f.Fuzz(func(t *testing.T, scale, tank, sea, ca, maxfn, width, depth float64, free string) {
		vals := []float64{scale, tank, sea, ca, maxfn, width, depth}
		args := []string{"-plot=false"}
		sane := true
		for i, fl := range towingFlags {
			args = append(args, "-"+fl.name, strconv.FormatFloat(vals[i], 'g', -1, 64))
			sane = sane && vals[i] >= fl.min && vals[i] <= fl.max
		}
		err := run(io.Discard, args)
		if err == nil && !sane {
			t.Errorf("%v: accepted with a flag outside its range", args)
		}
		var ce *cli.Error
		if err != nil && !sane && (!errors.As(err, &ce) || !strings.Contains(err.Error(), "flag -")) {
			t.Errorf("%v: %v is not a usage error naming the flag", args, err)
		}
		// Every accepted scale alone runs to the end (the model's readings
		// are made consistent for it).
		if scale >= 2 && scale <= 100 {
			if err := run(io.Discard, []string{"-plot=false", "-scale", strconv.FormatFloat(scale, 'g', -1, 64)}); err != nil {
				t.Errorf("-scale %v: %v", scale, err)
			}
		}
		words := strings.Fields(free)
		if len(words) > 8 {
			words = words[:8]
		}
		// Free text may describe a job the methods refuse; it must not panic.
		_ = run(io.Discard, append([]string{"-plot=false"}, words...))
	})
}
