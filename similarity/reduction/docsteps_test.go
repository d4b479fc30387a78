package reduction_test

import (
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/steady"
)

// docSteps is the package doc's code block, run on the INVENTED carriage
// log; the lines between the markers are those of the doc, word for
// word (TestDocBlock checks it).
func docSteps(t *testing.T, dir string, out io.Writer) *reduction.Result {
	check := func(err error) {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
	}
	var err error
	fmt := struct{ Println func(...any) (int, error) }{func(a ...any) (int, error) { return fmt.Fprintln(out, a...) }}
	// doc:begin
	problem, err := pigroups.NewProblem(
		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
		pigroups.Variable{Symbol: "nu", Dim: quantity.KinematicViscosity},
	)
	check(err)
	set, err := problem.PiSet("rho", "V", "L") // the repeating variables
	check(err)
	rest := steady.Span{From: quantity.New(0.5, quantity.Time), To: quantity.New(2, quantity.Time)}
	zero := reduction.Spans("t", rest) // the carriage at rest: the zero
	spec := &reduction.Spec{
		Derive: "rho = rho_water(T_w); nu = nu_water(T_w); L = 2 {m}",
		Funcs:  fluids.FormulaFuncs(),
		Points: reduction.Runs("run", 200, 0), // runs of 200 samples or more, but not label 0
		Zero:   &zero,
		Tare:   []string{"F"}, // the channels to tare: never a temperature
		Also:   []string{"T_w"},
		Set:    set.WithConventional(), // Re, C_T, … where a group is one
	}
	res, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	check(err)
	for _, p := range res.Points {
		f, _ := p.Value("F") // f.Mean: the tared resistance with its uncertainty
		for g, m := range p.Groups {
			fmt.Println(p.Tag, f.Mean, res.Groups[g].Column, m) // "run 1 … Re …"
		}
	}
	err = reduction.SavePoints(filepath.Join(dir, "points.csv"), res, reduction.WriteOptions{})
	check(err)
	// doc:end
	return res
}

// TestDocSteps: the doc's steps reduce the carriage log to its three
// runs, the resistance tared by the 0.80 N offset (4.0, 8.6, 15.0 N, the
// generator's levels, within 0.02 N), the water temperature not tared,
// and a points file written.
func TestDocSteps(t *testing.T) {
	dir := t.TempDir()
	var sb strings.Builder
	res := docSteps(t, dir, &sb)
	want := []struct {
		tag string
		f   float64
	}{{"run 1", 4.0}, {"run 2", 8.6}, {"run 3", 15.0}}
	if len(res.Points) != len(want) {
		t.Fatalf("%d points, want %d", len(res.Points), len(want))
	}
	for k, w := range want {
		p := res.Points[k]
		f, _ := p.Value("F")
		tw, _ := p.Value("T_w")
		if p.Tag != w.tag || math.Abs(f.Mean.Value()-w.f) > 0.02 || !f.Tared || tw.Tared {
			t.Errorf("point %d: %s F %v (tared %v) T_w tared %v, want %s F %v N tared, T_w not", k+1, p.Tag, f.Mean, f.Tared, tw.Tared, w.tag, w.f)
		}
	}
	if !strings.Contains(sb.String(), "run 1") || !strings.Contains(sb.String(), " Re ") {
		t.Errorf("printed %q, want run 1 … Re …", sb.String())
	}
	if _, err := os.Stat(filepath.Join(dir, "points.csv")); err != nil {
		t.Error(err)
	}
}

// TestDocBlock: every line of the package doc's code block is a line of
// docSteps (after check(err) lines and the test file's path are set
// aside), in order, so the doc shows steps that run.
func TestDocBlock(t *testing.T) {
	doc, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	var block []string
	for _, l := range strings.Split(string(doc), "\n") {
		if s, ok := strings.CutPrefix(l, "//\t"); ok {
			block = append(block, strings.TrimSpace(s))
		}
	}
	src, err := os.ReadFile("docsteps_test.go")
	if err != nil {
		t.Fatal(err)
	}
	body := string(src)
	begin, end := "// doc:"+"begin", "// doc:"+"end"
	body = body[strings.Index(body, begin):strings.Index(body, end)]
	var code []string
	for _, l := range strings.Split(body, "\n")[1:] {
		l = strings.TrimSpace(strings.ReplaceAll(l, "testdata/carriage.csv", "carriage.csv"))
		if l != "" && l != "check(err)" {
			code = append(code, l)
		}
	}
	if len(block) < 10 {
		t.Fatalf("the doc has %d lines of code, want the steps written out", len(block))
	}
	if strings.Join(block, "\n") != strings.Join(code, "\n") {
		t.Errorf("the doc's block and docSteps differ:\ndoc:\n%s\n\ntest:\n%s", strings.Join(block, "\n"), strings.Join(code, "\n"))
	}
}
