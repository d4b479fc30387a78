package similis_test

import (
	"fmt"
	"strings"
	"sync"
	"testing"
	"time"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/units"
)

// TestConcurrentUse runs 32 goroutines for about two seconds over what
// harnesses do at once — parsing with unknown symbols against several
// user tables (which must not share suggestion lists), conversion,
// definitions, Pi sets and plans — so that `go test -race` (run by CI)
// sees any data race.
func TestConcurrentUse(t *testing.T) {
	d := 2 * time.Second
	if testing.Short() {
		d = 200 * time.Millisecond
	}
	tables := make([]*units.Table, 4)
	for i := range tables {
		tables[i] = units.NewTable()
		if err := tables[i].Define(fmt.Sprintf("own%d", i), "12000 BTU/h"); err != nil {
			t.Fatal(err)
		}
	}
	p := pigroups.MustProblem(pigroups.Dep("F", quantity.Force).WithKind("force"), pigroups.Var("ρ", quantity.Density),
		pigroups.Var("V", quantity.Velocity), pigroups.Var("D", quantity.Length), pigroups.Var("μ", quantity.DynamicViscosity))
	deadline := time.Now().Add(d)
	var wg sync.WaitGroup
	errs := make(chan error, 32)
	for w := range 32 {
		wg.Go(func() {
			tab := tables[w%len(tables)]
			for i := 0; time.Now().Before(deadline); i++ {
				switch (w + i) % 6 {
				case 0:
					// An unknown symbol: the suggestions must be this
					// table's and the built-in ones, no other table's.
					_, err := tab.Parse(fmt.Sprintf("own%dx", w%len(tables)))
					if err == nil {
						errs <- fmt.Errorf("unknown symbol accepted")
						return
					}
					for k := range tables {
						if k != w%len(tables) && strings.Contains(err.Error(), fmt.Sprintf(`"own%d"`, k)) {
							errs <- fmt.Errorf("table %d suggests table %d's unit: %v", w%len(tables), k, err)
							return
						}
					}
				case 1:
					if _, err := units.Convert(float64(i), "psi", "kPa"); err != nil {
						errs <- err
						return
					}
				case 2:
					_ = tab.Define(fmt.Sprintf("w%dn%d", w, i), "m/s")
				case 3:
					if _, err := p.PiSet("ρ", "V", "D"); err != nil {
						errs <- err
						return
					}
				case 4:
					if _, err := similarity.Froude(similarity.Scales{Length: 1.0 / float64(2+i%50), Density: 1}); err != nil {
						errs <- err
						return
					}
				default:
					if _, err := units.Parse(fmt.Sprintf("kg/m^%d", 1+i%3)); err != nil {
						errs <- err
						return
					}
				}
			}
		})
	}
	wg.Wait()
	close(errs)
	for err := range errs {
		t.Error(err)
	}
}
