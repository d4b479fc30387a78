package pigroups_test

import (
	"encoding/binary"
	"fmt"
	"math"
	"math/big"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// bigRank is the reference: the rank of an integer matrix by Gaussian
// elimination over math/big rationals.
func bigRank(rows [][]int64) int {
	m := make([][]*big.Rat, len(rows))
	for i, r := range rows {
		m[i] = make([]*big.Rat, len(r))
		for j, x := range r {
			m[i][j] = new(big.Rat).SetInt64(x)
		}
	}
	rank := 0
	if len(m) == 0 {
		return 0
	}
	for c := 0; c < len(m[0]) && rank < len(m); c++ {
		p := -1
		for r := rank; r < len(m); r++ {
			if m[r][c].Sign() != 0 {
				p = r
				break
			}
		}
		if p < 0 {
			continue
		}
		m[rank], m[p] = m[p], m[rank]
		for r := range m {
			if r == rank || m[r][c].Sign() == 0 {
				continue
			}
			f := new(big.Rat).Quo(m[r][c], m[rank][c])
			for k := c; k < len(m[r]); k++ {
				m[r][k].Sub(m[r][k], new(big.Rat).Mul(f, m[rank][k]))
			}
		}
		rank++
	}
	return rank
}

// FuzzMatrix builds a problem from a random dimensional matrix (up to 30
// variables, rank 0 included) and checks its rank against the math/big
// reference, that the default set has n − r groups, each dimensionless,
// and that nothing panics.
func FuzzMatrix(f *testing.F) {
	f.Add([]byte{3, 1, 0, 0, 0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0, 2, 0, 3, 0, 0, 0, 0})
	f.Add([]byte{2})                      // rank 0: dimensionless variables
	f.Add(make([]byte, 1+30*7))           // 30 dimensionless variables
	f.Add([]byte{30, 255, 1, 2, 3, 4, 5}) // 30 variables, bytes repeat
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) == 0 {
			return
		}
		n := int(data[0])%30 + 1
		data = data[1:]
		byteAt := func(k int) int8 {
			if len(data) == 0 {
				return 0
			}
			return int8(data[k%len(data)])
		}
		vars := make([]pigroups.Variable, n)
		cols := make([][7]int64, n)
		for j := range n {
			var e [7]int
			for b := range 7 {
				e[b] = int(byteAt(j*7+b)) % 4 // small exponents, negative too
				cols[j][b] = int64(e[b])
			}
			d, err := q.NewDim(e[0], e[1], e[2], e[3], e[4], e[5], e[6])
			if err != nil {
				return
			}
			vars[j] = pigroups.Var(fmt.Sprintf("x%d", j), d)
		}
		if byteAt(7*n)%2 == 0 {
			vars[0] = vars[0].AsDependent()
		}
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			return
		}
		rows := make([][]int64, 7)
		for b := range 7 {
			rows[b] = make([]int64, n)
			for j := range n {
				rows[b][j] = cols[j][b]
			}
		}
		if want := bigRank(rows); p.Rank() != want {
			t.Fatalf("rank %d, math/big reference %d", p.Rank(), want)
		}
		s, err := p.DefaultSet()
		if err != nil {
			return // a refusal with an error is fine (a base only the dependent variable carries)
		}
		if s.Len() != p.NumGroups() {
			t.Fatalf("%d groups, n − r = %d", s.Len(), p.NumGroups())
		}
		for _, g := range s.Groups() {
			// Dimensionless by the reference: Σⱼ eⱼ·A[b][j] = 0 in math/big.
			exps := g.Exponents()
			for b := range 7 {
				sum := new(big.Rat)
				for j, e := range exps {
					sum.Add(sum, new(big.Rat).Mul(big.NewRat(e.Num(), e.Den()), new(big.Rat).SetInt64(cols[j][b])))
				}
				if sum.Sign() != 0 {
					t.Fatalf("group %s is not dimensionless in base %d", g, b)
				}
			}
		}
		_ = p.RankNote()
	})
}

// FuzzProblemUnits builds problems from "symbol=unit" text and checks
// that nothing panics and the Pi set evaluates to finite numbers or a
// typed error.
func FuzzProblemUnits(f *testing.F) {
	f.Add("F=N;rho=kg/m^3;V=m/s;D=m;mu=Pa*s", "F", 2.0)
	f.Add("T=N;n=rpm;D=m;rho=kg/m^3", "T", 1e300)
	f.Add("a=1;b=%;c=rad", "", 0.0)
	f.Add("x=m;x=s", "x", -1.0)
	f.Fuzz(func(t *testing.T, spec, dep string, value float64) {
		if len(spec) > 400 {
			return
		}
		var vars []pigroups.Variable
		for _, part := range strings.Split(spec, ";") {
			sym, unit, _ := strings.Cut(part, "=")
			v, err := pigroups.VarUnit(sym, unit)
			if err != nil {
				return
			}
			if sym == dep {
				v = v.AsDependent()
			}
			vars = append(vars, v)
		}
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			return
		}
		s, err := p.DefaultSet()
		if err != nil {
			return
		}
		row := make([]q.Quantity, len(vars))
		for i, v := range vars {
			row[i] = q.New(value, v.Dim)
		}
		out, err := s.WithCoefficients().Evaluator().Row(row, make([]float64, s.Len()))
		if err != nil {
			return
		}
		for _, x := range out {
			if math.IsInf(x, 0) || math.IsNaN(x) && !math.IsNaN(value) && value > 0 {
				t.Fatalf("value %v gives group %v", value, x)
			}
		}
	})
}

// FuzzFit fits power laws to arbitrary numbers and predicts at arbitrary
// points: every result is finite or a typed error.
func FuzzFit(f *testing.F) {
	seed := make([]byte, 8*12)
	for i := range 12 {
		binary.LittleEndian.PutUint64(seed[8*i:], math.Float64bits(float64(i+1)*1.7))
	}
	f.Add(seed, 5.0)
	f.Add(seed[:40], math.Inf(1))
	f.Fuzz(func(t *testing.T, data []byte, at float64) {
		var xs []float64
		for len(data) >= 8 && len(xs) < 64 {
			xs = append(xs, math.Float64frombits(binary.LittleEndian.Uint64(data)))
			data = data[8:]
		}
		n := len(xs) / 2
		if n < 3 {
			return
		}
		fit, err := pigroups.FitPowerLaw(xs[:n], [][]float64{xs[n : 2*n]}, nil)
		if err != nil {
			return
		}
		for _, v := range append([]float64{fit.C, fit.R2}, fit.Exponents...) {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("fit %+v not finite", fit)
			}
		}
		pr, err := fit.Predict(at)
		if err != nil {
			return
		}
		if !(pr.Value > 0) || math.IsInf(pr.Value, 0) || math.IsInf(pr.Individual[1], 0) {
			t.Fatalf("Predict(%v) = %+v", at, pr)
		}
	})
}
