package fit

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/stat/distuv"
)

// Criterion is a rule for choosing a polynomial's order.
type Criterion uint8

const (
	// NextTerm chooses the smallest order m whose next coefficient is not
	// significant: in the fit of order m+1, the two-sided t test of the
	// highest coefficient (t = B/SE with N − m − 2 degrees of freedom)
	// gives p > 0.05. The highest coefficient's t statistic is the same
	// in t as in x, since rescaling x multiplies that coefficient and its
	// standard error by one factor. A criterion of this kind can stop early
	// when the even and odd terms alternate in importance; compare the
	// Candidates when the choice matters.
	NextTerm Criterion = iota
	// TopTerm chooses the highest order whose own highest coefficient is
	// significant (two-sided t test, p ≤ 0.05), eliminating backwards
	// from the highest order compared; order 0 if none is. It does not
	// stop early where a term of odd or even order alone is small (a
	// curve symmetric about the middle of the range).
	TopTerm
	// AICc chooses the order of least corrected Akaike information
	// criterion, AICc = N·ln(SSE/N) + 2k + 2k(k+1)/(N − k − 1) with
	// k = order + 2 (Hurvich and Tsai, Biometrika 76 (1989) 297–307), the
	// lower order on a tie. Orders with N − k − 1 ≤ 0 are not compared.
	AICc
)

// SignificanceLevel is the level of the NextTerm test.
const SignificanceLevel = 0.05

// String returns the criterion's name.
func (c Criterion) String() string {
	switch c {
	case NextTerm:
		return "next term not significant at 5 %"
	case TopTerm:
		return "highest order with a significant top coefficient at 5 %"
	case AICc:
		return "least AICc"
	}
	return fmt.Sprintf("Criterion(%d)", uint8(c))
}

// SelectPoly fits polynomials of order 0 to maxOrder and returns the one
// the criterion chooses, with the orders it compared in Selection. When
// NextTerm finds every term up to maxOrder significant, it returns
// maxOrder and says so in Notes: the true order may be higher.
func SelectPoly(x, y []float64, maxOrder int, c Criterion, opt *Options) (*Poly, error) {
	const op = "SelectPoly"
	if err := checkXY(op, x, y); err != nil {
		return nil, err
	}
	o, err := options(op, opt, len(x))
	if err != nil {
		return nil, err
	}
	if c > AICc {
		return nil, invalid(op, -1, "unknown criterion %d", uint8(c))
	}
	if maxOrder < 0 || maxOrder > MaxOrder {
		return nil, invalid(op, -1, "highest order %d: want 0 … %d", maxOrder, MaxOrder)
	}
	// Each order needs one more distinct x and one residual degree of
	// freedom; the NextTerm test of order m needs order m+1 fitted too.
	top := min(maxOrder, distinct(x)-1, len(x)-2)
	if top < 0 {
		return nil, invalid(op, -1, "%d rows: want at least 2", len(x))
	}
	fits := make([]*Poly, 0, top+1)
	for m := 0; m <= top; m++ {
		f, err := fitPoly(op, x, y, m, o)
		if err != nil {
			if m == 0 {
				return nil, err
			}
			break // ill-conditioned from this order on: the lower orders are the candidates
		}
		fits = append(fits, f)
	}
	n := float64(len(x))
	cands := make([]Candidate, len(fits))
	for m, f := range fits {
		cd := Candidate{Order: m, SSE: f.SSE, PNext: 1, PTop: topP(f)}
		if k := float64(m + 2); n-k-1 > 0 && f.SSE > 0 {
			cd.AICc = n*math.Log(f.SSE/n) + 2*k + 2*k*(k+1)/(n-k-1)
		}
		if m+1 < len(fits) {
			cd.PNext = topP(fits[m+1])
		}
		cands[m] = cd
	}
	best := len(fits) - 1
	var note string
	switch c {
	case NextTerm:
		best = -1
		for m := range len(fits) - 1 {
			if cands[m].PNext > SignificanceLevel {
				best = m
				break
			}
		}
		if best < 0 {
			best = len(fits) - 1
			note = fmt.Sprintf("every term up to order %d is significant at 5 %%: the relation may need a higher order than was compared", best)
		}
	case TopTerm:
		best = 0
		for m := len(fits) - 1; m > 0; m-- {
			if cands[m].PTop <= SignificanceLevel {
				best = m
				break
			}
		}
		if best == len(fits)-1 && best > 0 {
			note = fmt.Sprintf("the top coefficient of the highest order compared, %d, is significant at 5 %%: the relation may need a higher order", best)
		}
	case AICc:
		best = -1
		for m, cd := range cands {
			if cd.SSE == 0 {
				best = m // an exact fit: its AICc is −∞, the least there is
				break
			}
			if k := float64(m + 2); n-k-1 <= 0 {
				continue
			}
			if best < 0 || cd.AICc < cands[best].AICc {
				best = m
			}
		}
		if best < 0 {
			return nil, invalid(op, -1, "%d rows are too few to compare orders by AICc", len(x))
		}
	}
	f := fits[best]
	f.Selection = cands
	f.Notes = append(f.Notes, fmt.Sprintf("order %d chosen by %v among orders 0 … %d", best, c, len(fits)-1))
	if note != "" {
		f.Notes = append(f.Notes, note)
	}
	return f, nil
}

// topP returns the two-sided p-value of the t test of f's highest
// coefficient (1 for order 0, whose only coefficient is not tested).
func topP(f *Poly) float64 {
	m := f.Order
	if m == 0 {
		return 1
	}
	b, se := f.B[m], f.StdErr[m]
	switch {
	case se == 0 && b == 0:
		return 1
	case se == 0:
		return 0
	}
	return 2 * distuv.StudentsT{Mu: 0, Sigma: 1, Nu: float64(f.DoF)}.Survival(math.Abs(b/se))
}
