package reduction

import (
	"bytes"
	"errors"
	"os"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

// TestDriftLimitWrongDimension: a drift limit of the wrong dimension is
// an ErrDimension naming the channel's drift limit, the same error read
// in one pass as over the whole history.
func TestDriftLimitWrongDimension(t *testing.T) {
	b, err := os.ReadFile("testdata/carriage.csv")
	if err != nil {
		t.Fatal(err)
	}
	p, err := pigroups.NewProblem(
		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
		pigroups.Variable{Symbol: "nu", Dim: quantity.KinematicViscosity},
	)
	if err != nil {
		t.Fatal(err)
	}
	set, err := p.PiSet("rho", "V", "L")
	if err != nil {
		t.Fatal(err)
	}
	spec := Spec{Points: Runs("run", 200, 0), Set: set,
		Derive: "rho = 998.6 {kg/m^3}; nu = 1.0547e-6 {m^2/s}; L = 2 {m}",
		Drift:  map[string]quantity.Quantity{"F": quantity.New(0.01, quantity.Length)}}
	reduce := func(whole bool) error {
		wholeHistory = whole
		defer func() { wholeHistory = false }()
		src, err := chanfile.NewReader(bytes.NewReader(b), "carriage.csv", chanfile.Options{})
		if err != nil {
			t.Fatal(err)
		}
		_, err = spec.Reduce(Input{Name: "carriage.csv", Source: src})
		return err
	}
	stream, whole := reduce(false), reduce(true)
	if !errors.Is(stream, quantity.ErrDimension) || !strings.Contains(stream.Error(), "F drift limit") {
		t.Errorf("one pass: %v, want an ErrDimension naming the F drift limit", stream)
	}
	if whole == nil || stream.Error() != whole.Error() {
		t.Errorf("one pass: %v\nwhole history: %v", stream, whole)
	}
}
