package uncertain_test

import (
	"errors"
	"fmt"
	"math"
	"os"
	"os/exec"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// TestMonteCarloTypeAIsScaledT: JCGM 101:2008 §6.4.9 draws the mean of n
// readings as x̄ + u·t_ν with u = s/√n and ν = n − 1, so for the model
// Y = X with x̄ = 0 and u = 1 the 95 % probabilistically symmetric
// interval is ±t₀.₉₇₅(ν). The quantiles are scipy.stats.t.ppf(0.975, ν)
// and the densities there scipy.stats.t.pdf (SciPy 1.10.1, Debian's
// python3-scipy). The tolerance is four standard errors of an order
// statistic: √(p(1−p)/N)/f(t_p), with p = 0.975 and N trials. ν = 2 and
// 2.01 must give nearly the same interval (no jump where the variance of
// t becomes finite).
func TestMonteCarloTypeAIsScaledT(t *testing.T) {
	const trials = 400_000
	for _, c := range []struct {
		nu, t, pdf float64
	}{
		{2, 4.302652729911275, 0.010763708554741088},
		{2.01, 4.282204280449282, 0.010856978575454933},
		{3, 3.182446305284263, 0.019194076379776017},
		{4, 2.7764451051977987, 0.02558081782667414},
		{10, 2.2281388519649385, 0.042384984670917905},
		{30, 2.0422724563012373, 0.05260186771232068},
	} {
		set := uncertain.NewSet()
		id := set.MustAdd(uncertain.Source{Name: "repeatability", U: quantity.Scalar(1), Type: uncertain.TypeA, DoF: c.nu})
		in := []uncertain.Measured{set.MustMeasure(quantity.Scalar(0), id)}
		mc, err := uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured { return x[0] }, trials, 0.95, 42)
		if err != nil {
			t.Fatal(err)
		}
		tol := 4 * math.Sqrt(0.975*0.025/trials) / c.pdf
		near(t, fmt.Sprintf("ν = %v: high end", c.nu), mc.High.Value(), c.t, tol)
		near(t, fmt.Sprintf("ν = %v: low end", c.nu), mc.Low.Value(), -c.t, tol)
	}
}

// TestMonteCarloTrialsBounded: a trial count above MaxTrials is refused
// with ErrRange, naming the maximum, before anything is allocated. The
// call with 10¹² trials runs in a child process under GOMEMLIMIT, so
// that an attempt to allocate 8 TB fails this test (the child dies)
// rather than the whole suite.
func TestMonteCarloTrialsBounded(t *testing.T) {
	const marker = "uncertain: refused cleanly"
	if os.Getenv("UNCERTAIN_MC_TRIALS_CHILD") == "1" {
		set := uncertain.NewSet()
		id := set.MustAdd(uncertain.Source{Name: "x", U: quantity.Scalar(1)})
		in := []uncertain.Measured{set.MustMeasure(quantity.Scalar(1), id)}
		_, err := uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured { return x[0] }, 1_000_000_000_000, 0.95, 1)
		if !errors.Is(err, quantity.ErrRange) || !strings.Contains(err.Error(), strconv.Itoa(uncertain.MaxTrials)) {
			t.Fatalf("10¹² trials: %v; want ErrRange naming the maximum %d", err, uncertain.MaxTrials)
		}
		fmt.Println(marker)
		return
	}
	cmd := exec.Command(os.Args[0], "-test.run=^TestMonteCarloTrialsBounded$", "-test.count=1")
	cmd.Env = append(os.Environ(), "UNCERTAIN_MC_TRIALS_CHILD=1", "GOMEMLIMIT=256MiB", "GOGC=50")
	out, err := cmd.CombinedOutput()
	if err != nil || !strings.Contains(string(out), marker) {
		t.Fatalf("child with 10¹² trials: %v\n%s", err, out)
	}
	if uncertain.MaxTrials*8 > 100<<20 {
		t.Errorf("MaxTrials = %d keeps %d MB of outputs", uncertain.MaxTrials, uncertain.MaxTrials*8>>20)
	}
}

// TestMonteCarloErrorsWrapCause: a two-set input and a model that fails
// on a trial are errors of one class, with the cause kept and the
// package's prefix once.
func TestMonteCarloErrorsWrapCause(t *testing.T) {
	a, b := uncertain.NewSet(), uncertain.NewSet()
	ia := a.MustAdd(uncertain.Source{Name: "a", U: quantity.Scalar(0.1)})
	ib := b.MustAdd(uncertain.Source{Name: "b", U: quantity.Scalar(0.1)})
	in := []uncertain.Measured{a.MustMeasure(quantity.Scalar(1), ia), b.MustMeasure(quantity.Scalar(1), ib)}
	_, err := uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured { return x[0].Add(x[1]) }, 1000, 0.95, 1)
	if !errors.Is(err, uncertain.ErrSets) || classes(err) != 1 || !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("two sets: %v (classes %d)", err, classes(err))
	}
	if err != nil && strings.Count(err.Error(), "uncertain:") != 1 {
		t.Errorf("message %q: want the package's prefix once", err)
	}
	// log(x − 1) with x = 1 ± 0.1 reaches the log of a value ≤ 0 on some trial.
	in = in[:1]
	_, err = uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured {
		return uncertain.Log(x[0].Sub(uncertain.Exact(quantity.Scalar(1))))
	}, 1000, 0.95, 1)
	var ue *uncertain.Error
	if !errors.As(err, &ue) || !errors.Is(err, quantity.ErrRange) || classes(err) != 1 || !strings.Contains(err.Error(), "trial") {
		t.Errorf("log of a value ≤ 0 on a trial: %v", err)
	}
	// A model whose dimension is wrong on the trial values keeps the
	// *quantity.Error of class quantity.ErrDimension.
	_, err = uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured {
		return x[0].Add(uncertain.Exact(quantity.New(1, quantity.Length)))
	}, 1000, 0.95, 1)
	var de *quantity.Error
	if !errors.As(err, &de) || de.Class != quantity.ErrDimension || classes(err) != 1 {
		t.Errorf("dimension error in the model: %v", err)
	}
}

// TestMonteCarloResultString: the result reads in the unit of the value,
// rounded to u's two significant digits (GUM §7.2.6), with no "[SI]".
// For y = x with x = 1000 N ± 5 N (normal), the mean, u and interval are
// within sampling error of 1000, 5 and 1000 ± 9.8 N.
func TestMonteCarloResultString(t *testing.T) {
	set := uncertain.NewSet()
	id := set.MustAdd(uncertain.Source{Name: "load cell", U: quantity.New(5, quantity.Force)})
	in := []uncertain.Measured{set.MustMeasure(quantity.New(1000, quantity.Force), id)}
	mc, err := uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured { return x[0] }, 100_000, 0.95, 5)
	if err != nil {
		t.Fatal(err)
	}
	s := mc.String()
	for _, want := range []string{"100000 trials", "y = 1000.0 N", "u = 5.0 N", "95 % interval [990.", "] N"} {
		if !strings.Contains(s, want) {
			t.Errorf("%q lacks %q", s, want)
		}
	}
	if strings.Contains(s, "SI") || strings.Contains(s, "kg") {
		t.Errorf("%q: want the named unit N", s)
	}
}
