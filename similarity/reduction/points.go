package reduction

import (
	"slices"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/steady"
)

type pointsKind uint8

const (
	allRows pointsKind = iota
	labelRuns
	timeSpans
	detected
)

// Points says which spans of a history are its points. The zero value is
// AllRows. Build one with AllRows, Runs, Spans or Detected.
type Points struct {
	kind    pointsKind
	channel string        // the label channel (Runs) or time channel (Spans)
	except  []float64     // Runs: labels that are not points
	only    []float64     // Runs: the labels that are points, if set
	minLen  int           // Runs: fewest samples of a run
	spans   []steady.Span // Spans
	crit    Criterion     // Detected
}

// Tolerance is one channel's steadiness tolerance for Detected: the
// largest standard deviation of a moving window and the largest change
// between the means of its halves (see steady.Detect).
type Tolerance struct {
	Channel    string
	SD, Change quantity.Quantity
}

// Criterion states when a history is steady, for Detected: the moving
// window's half-width in samples, the fewest steady samples of a point,
// and the channels judged.
type Criterion struct {
	Half, MinLen int
	Channels     []Tolerance
}

// AllRows makes every row a result of its own, with the groups of that
// row and no uncertainty: the row-by-row reduction of a file.
func AllRows() Points { return Points{} }

// Runs makes each run of equal value of the label channel a point (a run
// number logged by the carriage), dropping the runs whose label is one of
// except (0 for "between runs") and those shorter than minLen samples.
// A point is tagged "run <label>". The label channel must hold numbers:
// a column of text run tags ("Lauf 1", a chanfile.Label column) is
// refused by Reduce with an *Error of Op "plan" naming the column; log
// the run number as a number, or find the points with Spans or Detected.
func Runs(label string, minLen int, except ...float64) Points {
	return Points{kind: labelRuns, channel: label, minLen: minLen, except: slices.Clone(except)}
}

// Run makes the run (or runs) of the label channel whose label is one of
// labels the points: a zero window logged under its own label, say.
// Reduce refuses a Run with no label given, and, as for Runs, a label
// channel of text.
func Run(label string, minLen int, labels ...float64) Points {
	// Never nil: a Run with no label is refused by Reduce, not taken for
	// Runs.
	return Points{kind: labelRuns, channel: label, minLen: minLen, only: append([]float64{}, labels...)}
}

// Spans makes each time span of the time channel a point, tagged
// "span 1", "span 2", … (see steady.TimeWindows). Reduce refuses Spans
// with no span given.
func Spans(time string, spans ...steady.Span) Points {
	return Points{kind: timeSpans, channel: time, spans: slices.Clone(spans)}
}

// Detected finds the points by the moving-window criterion c (see
// steady.Detect), tagged "point 1", "point 2", ….
func Detected(c Criterion) Points {
	c.Channels = slices.Clone(c.Channels)
	return Points{kind: detected, crit: c}
}

// String names the mode: "all rows", "runs of run", "time spans of t",
// "detected".
func (p Points) String() string {
	switch p.kind {
	case labelRuns:
		return "runs of " + p.channel
	case timeSpans:
		return "time spans of " + p.channel
	case detected:
		return "detected steady windows"
	}
	return "all rows"
}

// check refuses a mode that can find no point whatever the file holds:
// Spans with no span, Run with no label. what is "points" or "zero".
func (p Points) check(what string) *Error {
	switch {
	case p.kind == timeSpans && len(p.spans) == 0:
		return &Error{Op: "plan", Channel: p.channel, Reason: what + ": Spans of " + p.channel + " with no spans given: give at least one steady.Span"}
	case p.kind == labelRuns && p.only != nil && len(p.only) == 0:
		return &Error{Op: "plan", Channel: p.channel, Reason: what + ": Run of " + p.channel + " with no labels given: give the labels of the runs wanted, or use Runs for every run"}
	}
	return nil
}

// channels returns the channels the mode reads.
func (p Points) channels() []string {
	switch p.kind {
	case labelRuns, timeSpans:
		return []string{p.channel}
	case detected:
		var out []string
		for _, t := range p.crit.Channels {
			out = append(out, t.Channel)
		}
		return out
	}
	return nil
}

// window is a point's window with its tag and, for a run, its label.
type window struct {
	steady.Window
	tag      string
	label    float64
	hasLabel bool
}

// windows finds the points' windows in the history; get returns a
// channel by name (ok false when the history has no such channel).
func (p Points) windows(get func(string) (quantity.Series, bool)) ([]window, error) {
	need := func(name string) (quantity.Series, error) {
		s, ok := get(name)
		if !ok {
			return s, &Error{Channel: name, Reason: "points: no such channel"}
		}
		return s, nil
	}
	var out []window
	switch p.kind {
	case labelRuns:
		lab, err := need(p.channel)
		if err != nil {
			return nil, err
		}
		seen := map[float64]int{}
		for _, r := range steady.Runs(lab) {
			if slices.Contains(p.except, r.Label) || p.only != nil && !slices.Contains(p.only, r.Label) || r.Len() < max(p.minLen, steady.MinSamples) {
				continue
			}
			// A label logged again later is a second run of that label:
			// "run 1", then "run 1 (2)".
			seen[r.Label]++
			tag := "run " + strconv.FormatFloat(r.Label, 'g', -1, 64)
			if k := seen[r.Label]; k > 1 {
				tag += " (" + strconv.Itoa(k) + ")"
			}
			out = append(out, window{Window: r.Window, tag: tag, label: r.Label, hasLabel: true})
		}
	case timeSpans:
		t, err := need(p.channel)
		if err != nil {
			return nil, err
		}
		ws, err := steady.TimeWindows(t, p.spans...)
		if err != nil {
			return nil, &Error{Channel: p.channel, Reason: "points", Err: err}
		}
		for i, w := range ws {
			out = append(out, window{Window: w, tag: "span " + strconv.Itoa(i+1)})
		}
	case detected:
		c := steady.Criterion{Half: p.crit.Half, MinLen: p.crit.MinLen}
		for _, tol := range p.crit.Channels {
			s, err := need(tol.Channel)
			if err != nil {
				return nil, err
			}
			c.Channels = append(c.Channels, steady.Tolerance{Name: tol.Channel, Data: s, SD: tol.SD, Change: tol.Change})
		}
		ws, err := steady.Detect(c)
		if err != nil {
			return nil, &Error{Reason: "points", Err: err}
		}
		for i, w := range ws {
			out = append(out, window{Window: w, tag: "point " + strconv.Itoa(i+1)})
		}
	}
	return out, nil
}
