package steady

import (
	"math"
	"sort"

	"similis.dev/similis/quantity"
)

// Run is a window over which a label channel holds one value.
type Run struct {
	Window
	Label float64 // the label's value (in SI) over the run
}

// Runs returns the runs of equal label value in label, in order: each
// maximal span of consecutive samples whose labels are equal. A sample
// whose label is NaN (missing) belongs to no run. The caller keeps the
// runs it wants (a label of 0 for "between runs", say) and those long
// enough; Runs drops nothing. label is a channel of numbers: the Series
// chanfile gives a text column (a Label column, "Lauf 1") is empty and
// has no run — read its text with TextRuns (chanfile.Whole.Channel
// refuses such a column rather than return it empty).
func Runs(label quantity.Series) []Run {
	var out []Run
	equalRuns(label.Values(), func(x float64) bool { return x != x }, func(w Window, x float64) {
		out = append(out, Run{w, x})
	})
	return out
}

// equalRuns calls emit for each maximal span of consecutive equal values
// of v, in order, skipping the values that are missing.
func equalRuns[T comparable](v []T, missing func(T) bool, emit func(Window, T)) {
	for i := 0; i < len(v); {
		if missing(v[i]) {
			i++
			continue
		}
		j := i + 1
		for j < len(v) && v[j] == v[i] {
			j++
		}
		emit(Window{i, j}, v[i])
		i = j
	}
}

// TextRun is a window over which a text label channel holds one value.
type TextRun struct {
	Window
	Label string
}

// TextRuns returns the runs of equal text in labels, in order, as Runs
// does for numbers: for a run tag logged as text ("Lauf 1", "zero"), the
// labels of a chanfile Label column (chanfile.Whole.Labels). An empty
// label (a missing one) belongs to no run; TextRuns drops nothing else.
func TextRuns(labels []string) []TextRun {
	var out []TextRun
	equalRuns(labels, func(l string) bool { return l == "" }, func(w Window, l string) {
		out = append(out, TextRun{w, l})
	})
	return out
}

// RunsWhere returns the maximal runs of consecutive samples where cond is
// true, in order, keeping those of at least minLen samples.
func RunsWhere(cond []bool, minLen int) []Window {
	var out []Window
	for i := 0; i < len(cond); {
		if !cond[i] {
			i++
			continue
		}
		j := i + 1
		for j < len(cond) && cond[j] {
			j++
		}
		if j-i >= minLen {
			out = append(out, Window{i, j})
		}
		i = j
	}
	return out
}

// Span is a time window, From ≤ t ≤ To.
type Span struct{ From, To quantity.Quantity }

// TimeWindows returns, for each span, the window of the samples whose
// time t lies in [From, To]. The time channel t must be a time, finite
// and strictly increasing; a span must lie inside the record (From ≥ the
// first time, To ≤ the last) and hold at least MinSamples samples.
func TimeWindows(t quantity.Series, spans ...Span) ([]Window, error) {
	const op = "time windows"
	if err := t.Check(quantity.Time); err != nil {
		return nil, &Error{Op: op, Channel: "time", Row: -1, Reason: "the time channel", Err: err}
	}
	v := t.Values()
	for i, a := range v {
		if a-a != 0 {
			return nil, outOfRange(op, "time", i, "time %v: not a finite number", a)
		}
		if i > 0 && !(a > v[i-1]) {
			return nil, invalid(op, "time", i, "time %v s after %v s: want strictly increasing times", a, v[i-1])
		}
	}
	if len(v) == 0 {
		return nil, invalid(op, "time", -1, "an empty time channel")
	}
	out := make([]Window, 0, len(spans))
	for k, s := range spans {
		if s.From.Dim() != quantity.Time || s.To.Dim() != quantity.Time {
			return nil, invalid(op, "", -1, "span %d: from %v to %v: want times", k+1, s.From, s.To)
		}
		lo, hi := s.From.Value(), s.To.Value()
		switch {
		case !(lo < hi):
			return nil, invalid(op, "", -1, "span %d: from %v to %v: want from < to", k+1, s.From, s.To)
		case lo < v[0] || hi > v[len(v)-1]:
			return nil, outOfRange(op, "", -1, "span %d: from %v to %v: outside the record, %v s to %v s", k+1, s.From, s.To, v[0], v[len(v)-1])
		}
		i := sort.SearchFloat64s(v, lo)
		j := sort.Search(len(v), func(j int) bool { return v[j] > hi })
		if j-i < MinSamples {
			return nil, invalid(op, "", -1, "span %d: from %v to %v: %d samples, want at least %d", k+1, s.From, s.To, j-i, MinSamples)
		}
		out = append(out, Window{i, j})
	}
	return out, nil
}

// Tolerance is one channel's steadiness tolerance for Detect.
type Tolerance struct {
	Name string
	Data quantity.Series
	// SD is the largest standard deviation a steady window may show.
	SD quantity.Quantity
	// Change is the largest difference a steady window may show between
	// the means of its second and first halves.
	Change quantity.Quantity
}

// Criterion states when a history is steady, for Detect.
type Criterion struct {
	// Half is the half-width h of the moving window, in samples: sample i
	// is judged on the window of the 2h + 1 samples i − h … i + h.
	Half int
	// MinLen is the fewest consecutive steady samples that make a point.
	MinLen int
	// Channels are the channels judged, each with its tolerances; a
	// sample is steady only when every one of them is.
	Channels []Tolerance
}

// Detect finds the steady points of a history by a moving-window
// criterion. Sample i is steady when the window of the 2h + 1 samples
// i − h … i + h lies inside the record, holds no missing value, and for
// every channel of c
//
//	s ≤ SD   and   |x̄₂ − x̄₁| ≤ Change,
//
// with s the window's sample standard deviation (n − 1 in the
// denominator) and x̄₁, x̄₂ the means of its h samples before and h
// samples after i. A steady point is a maximal run of consecutive steady
// samples at least MinLen long. A sample whose window reaches into a
// change of level is steady only if the window still meets every
// tolerance, so a point starts up to h samples after a change ends and
// ends up to h samples before the next begins; the tolerances decide how
// close to a change a point may reach, and the samples at the record's
// first and last h rows are never steady. Detect works in O(n) per
// channel with running sums; it allocates three arrays of n + 1.
func Detect(c Criterion) ([]Window, error) {
	const op = "detect"
	if c.Half < 1 || c.MinLen < 1 {
		return nil, invalid(op, "", -1, "half-width %d and minimum length %d: want both ≥ 1", c.Half, c.MinLen)
	}
	if len(c.Channels) == 0 {
		return nil, invalid(op, "", -1, "no channel to judge")
	}
	n := c.Channels[0].Data.Len()
	for _, ch := range c.Channels {
		d := ch.Data.Dim()
		switch {
		case ch.Data.Len() != n:
			return nil, invalid(op, ch.Name, -1, "%d samples, the first channel %d", ch.Data.Len(), n)
		case ch.SD.Dim() != d:
			return nil, &Error{Op: op, Channel: ch.Name, Row: -1, Reason: "the SD tolerance",
				Err: &quantity.Error{Op: "check", Name: ch.Name + " SD tolerance", Dims: [2]quantity.Dim{ch.SD.Dim(), d}, Binary: true, Class: quantity.ErrDimension}}
		case ch.Change.Dim() != d:
			return nil, &Error{Op: op, Channel: ch.Name, Row: -1, Reason: "the change tolerance",
				Err: &quantity.Error{Op: "check", Name: ch.Name + " change tolerance", Dims: [2]quantity.Dim{ch.Change.Dim(), d}, Binary: true, Class: quantity.ErrDimension}}
		case !(ch.SD.Value() > 0) || !(ch.Change.Value() > 0) || !finite(ch.SD.Value()) || !finite(ch.Change.Value()):
			return nil, invalid(op, ch.Name, -1, "tolerances %v and %v: want finite values > 0", ch.SD, ch.Change)
		}
	}
	h := c.Half
	w := 2*h + 1
	steady := make([]bool, n)
	for i := h; i+h < n; i++ {
		steady[i] = true
	}
	// Running sums of x − ref and its square, and a count of missing
	// values, each n + 1 long.
	s1 := make([]float64, n+1)
	s2 := make([]float64, n+1)
	miss := make([]int, n+1)
	for _, ch := range c.Channels {
		v := ch.Data.Values()
		ref := math.NaN()
		for _, a := range v {
			if finite(a) {
				ref = a
				break
			}
		}
		for i, a := range v {
			e, m := a-ref, 0
			if !finite(e) {
				e, m = 0, 1
			}
			s1[i+1] = s1[i] + e
			s2[i+1] = s2[i] + e*e
			miss[i+1] = miss[i] + m
		}
		sd, change := ch.SD.Value(), ch.Change.Value()
		fw, fh := float64(w), float64(h)
		for i := h; i+h < n; i++ {
			if !steady[i] {
				continue
			}
			a, b := i-h, i+h+1
			if miss[b] != miss[a] {
				steady[i] = false
				continue
			}
			sum := s1[b] - s1[a]
			ss := s2[b] - s2[a]
			variance := max((ss-sum*sum/fw)/(fw-1), 0)
			m1 := (s1[i] - s1[a]) / fh
			m2 := (s1[b] - s1[i+1]) / fh
			if !(math.Sqrt(variance) <= sd) || !(math.Abs(m2-m1) <= change) {
				steady[i] = false
			}
		}
	}
	return RunsWhere(steady, c.MinLen), nil
}
