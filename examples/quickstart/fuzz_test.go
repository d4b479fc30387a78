package main

import (
	"errors"
	"io"
	"math"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"
)

// quickFlags are quickstart's numeric flags with their declared ranges.
var quickFlags = []struct {
	name     string
	min, max float64
}{{"v", 1e-3, 50}, {"d", 1e-3, 5}, {"l", 0.01, 1e4}, {"scale", 2, 100}}

// FuzzFlags runs the demo with fuzzed flag values and fuzzed free text:
// it never panics, a nil error comes only when every numeric flag is
// within its range, and a refused flag is a *cli.Error naming it.
func FuzzFlags(f *testing.F) {
	f.Add(2.5, 0.08, 40.0, 16.0, "-h")
	f.Add(50.0, 1e-3, 1e4, 100.0, "-v NaN")
	f.Add(1e-3, 5.0, 0.01, 2.0, "stray")
	f.Add(math.MaxFloat64, math.Copysign(0, -1), 5e-324, 1e308, "-scale 60 -l")
	f.Fuzz(func(t *testing.T, v, d, l, scale float64, free string) {
		vals := []float64{v, d, l, scale}
		var args []string
		sane := true
		for i, fl := range quickFlags {
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
		words := strings.Fields(free)
		if len(words) > 8 {
			words = words[:8]
		}
		_ = run(io.Discard, words) // must not panic
	})
}
