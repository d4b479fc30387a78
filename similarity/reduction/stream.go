package reduction

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/steady"
)

// streams reports whether the spec's points are found in one pass: Runs
// and Spans (and a zero of either kind), whose windows are known row by
// row. Detected judges each sample on the samples around it, so it
// reads the history whole (points).
func (s *Spec) streams() bool {
	ok := func(p Points) bool { return p.kind == labelRuns || p.kind == timeSpans }
	return ok(s.Points) && (s.Zero == nil || ok(*s.Zero))
}

// tracker finds the windows of a Runs or Spans mode row by row.
type tracker struct {
	p     Points
	wins  []window // found, in the order the mode gives them
	given int      // Runs: the windows ready has returned
	// Runs.
	inRun    bool
	cur      float64
	curStart int
	seen     map[float64]int
	// Spans: the first row at or after From, the first row after To
	// (−1 while not met); the time read so far.
	start, end  []int
	first, prev float64
	terr        error // the time channel's first fault
}

func newTracker(p Points) *tracker {
	t := &tracker{p: p, seen: map[float64]int{}}
	if p.kind == timeSpans {
		t.start = make([]int, len(p.spans))
		t.end = make([]int, len(p.spans))
		for k := range t.start {
			t.start[k], t.end[k] = -1, -1
		}
	}
	return t
}

// wanted reports whether a run of this label can be a point.
func (t *tracker) wanted(label float64) bool {
	return !slices.Contains(t.p.except, label) && (t.p.only == nil || slices.Contains(t.p.only, label))
}

// closeRun ends the current run at row end, keeping it as a window if it
// is one, as windows does.
func (t *tracker) closeRun(end int) {
	if !t.inRun {
		return
	}
	t.inRun = false
	if !t.wanted(t.cur) || end-t.curStart < max(t.p.minLen, steady.MinSamples) {
		return
	}
	t.seen[t.cur]++
	tag := "run " + strconv.FormatFloat(t.cur, 'g', -1, 64)
	if k := t.seen[t.cur]; k > 1 {
		tag += " (" + strconv.Itoa(k) + ")"
	}
	t.wins = append(t.wins, window{Window: steady.Window{Start: t.curStart, End: end}, tag: tag, label: t.cur, hasLabel: true})
}

const opTime = "time windows"

// feed takes the mode's channel over the rows base, base+1, … .
func (t *tracker) feed(x quantity.Series, base int) {
	v := x.Values()
	switch t.p.kind {
	case labelRuns:
		for i, a := range v {
			switch {
			case math.IsNaN(a):
				t.closeRun(base + i)
			case !t.inRun:
				t.inRun, t.cur, t.curStart = true, a, base+i
			case a != t.cur:
				t.closeRun(base + i)
				t.inRun, t.cur, t.curStart = true, a, base+i
			}
		}
	case timeSpans:
		if t.terr != nil {
			return
		}
		if err := x.Check(quantity.Time); err != nil {
			t.terr = &steady.Error{Op: opTime, Channel: "time", Row: -1, Reason: "the time channel", Err: err}
			return
		}
		for i, a := range v {
			row := base + i
			if a-a != 0 {
				t.terr = &steady.Error{Op: opTime, Channel: "time", Row: row, Reason: fmt.Sprintf("time %v: not a finite number", a), Err: quantity.ErrRange}
				return
			}
			if row > 0 && !(a > t.prev) {
				t.terr = &steady.Error{Op: opTime, Channel: "time", Row: row, Reason: fmt.Sprintf("time %v s after %v s: want strictly increasing times", a, t.prev)}
				return
			}
			if row == 0 {
				t.first = a
			}
			t.prev = a
			for k, s := range t.p.spans {
				if t.start[k] < 0 && a >= s.From.Value() {
					t.start[k] = row
				}
				if t.end[k] < 0 && a > s.To.Value() {
					t.end[k] = row
				}
			}
		}
	}
}

// finish ends the record at rows and checks the spans as
// steady.TimeWindows does.
func (t *tracker) finish(rows int) error {
	switch t.p.kind {
	case labelRuns:
		t.closeRun(rows)
		return nil
	}
	if t.terr != nil {
		return t.terr
	}
	if rows == 0 {
		return &steady.Error{Op: opTime, Channel: "time", Row: -1, Reason: "an empty time channel"}
	}
	for k, s := range t.p.spans {
		if s.From.Dim() != quantity.Time || s.To.Dim() != quantity.Time {
			return &steady.Error{Op: opTime, Row: -1, Reason: fmt.Sprintf("span %d: from %v to %v: want times", k+1, s.From, s.To)}
		}
		lo, hi := s.From.Value(), s.To.Value()
		switch {
		case !(lo < hi):
			return &steady.Error{Op: opTime, Row: -1, Reason: fmt.Sprintf("span %d: from %v to %v: want from < to", k+1, s.From, s.To)}
		case lo < t.first || hi > t.prev:
			return &steady.Error{Op: opTime, Row: -1, Reason: fmt.Sprintf("span %d: from %v to %v: outside the record, %v s to %v s", k+1, s.From, s.To, t.first, t.prev), Err: quantity.ErrRange}
		}
		i, j := t.start[k], t.end[k]
		if j < 0 {
			j = rows
		}
		if i < 0 {
			i = rows
		}
		if j-i < steady.MinSamples {
			return &steady.Error{Op: opTime, Row: -1, Reason: fmt.Sprintf("span %d: from %v to %v: %d samples, want at least %d", k+1, s.From, s.To, max(j-i, 0), steady.MinSamples)}
		}
		// A span that runs to the last row closes here: ready returns it.
		t.start[k], t.end[k] = i, j
		t.wins = append(t.wins, window{Window: steady.Window{Start: i, End: j}, tag: "span " + strconv.Itoa(k+1)})
	}
	return nil
}

// ready returns the windows whose rows are all read (for Runs, only
// those not returned before); low is the first row a window still open
// may need (rows when none).
func (t *tracker) ready(rows int) (out []steady.Window, low int) {
	low = rows
	switch t.p.kind {
	case labelRuns:
		for _, w := range t.wins[t.given:] {
			out = append(out, w.Window)
		}
		t.given = len(t.wins)
		if t.inRun && t.wanted(t.cur) {
			low = t.curStart
		}
	case timeSpans:
		for k := range t.p.spans {
			switch {
			case t.start[k] >= 0 && t.end[k] >= 0:
				out = append(out, steady.Window{Start: t.start[k], End: t.end[k]})
			case t.start[k] >= 0:
				low = min(low, t.start[k])
			}
		}
	}
	return out, low
}

// winStats is the statistics of one window's channels, or the first
// error met summarizing them.
type winStats struct {
	stats []steady.Stats
	err   error
}

// history holds the rows of the reduced channels a window still open
// may need: rows base … base+len.
type history struct {
	names []string
	dims  []quantity.Dim
	vals  [][]float64
	base  int
}

// summarize returns the statistics of window w of the channels at idx,
// with an error as steady.Reduce names it (the channel, the row of the
// history).
func (h *history) summarize(w steady.Window, idx []int) winStats {
	out := winStats{stats: make([]steady.Stats, len(idx))}
	for i, k := range idx {
		st, err := steady.Summarize(quantity.NewSeries(h.vals[k], h.dims[k]), steady.Window{Start: w.Start - h.base, End: w.End - h.base})
		if err != nil {
			var se *steady.Error
			if errors.As(err, &se) {
				se.Channel = h.names[k]
				if se.Row >= 0 {
					se.Row += h.base
				}
			}
			out.err = err
			return out
		}
		out.stats[i] = st
	}
	return out
}

// drop forgets the rows before low.
func (h *history) drop(low int) {
	k := low - h.base
	if k <= 0 {
		return
	}
	for c := range h.vals {
		n := copy(h.vals[c], h.vals[c][k:])
		h.vals[c] = h.vals[c][:n]
	}
	h.base = low
}

// stream reads the file once, chunk by chunk, finding the windows of the
// points and of the zero as the rows arrive and summarizing each window
// as soon as its last row is read; it keeps only the rows of the windows
// still open. The points are then made in the order of points: the zero
// first, each point's means registered in the set, tared, calibrated,
// and its groups evaluated.
func (r *run) stream() error {
	s := r.spec
	derived := map[string]int{}
	if r.prog != nil {
		for o, n := range r.prog.Outputs() {
			derived[n] = o
		}
	}
	has := func(n string) bool {
		_, sel := r.idx[n]
		_, der := derived[n]
		return sel || der
	}
	reduce := r.reduced(has)
	h := &history{names: reduce, dims: make([]quantity.Dim, len(reduce)), vals: make([][]float64, len(reduce))}
	allIdx := make([]int, len(reduce))
	for i := range allIdx {
		allIdx[i] = i
	}
	var tareIdx []int
	for _, n := range s.Tare {
		tareIdx = append(tareIdx, slices.Index(reduce, n))
	}
	pt := newTracker(s.Points)
	var zt *tracker
	if s.Zero != nil {
		zt = newTracker(*s.Zero)
	}
	pstats := map[steady.Window]winStats{}
	zstats := map[steady.Window]winStats{}
	var chunk []quantity.Series
	var dout [][]float64
	if r.prog != nil {
		dout = make([][]float64, len(r.prog.Outputs()))
	}
	get := func(name string, n int) (quantity.Series, bool) {
		if k, ok := r.idx[name]; ok {
			return quantity.NewSeries(chunk[k].Values()[:n], chunk[k].Dim()), true
		}
		if o, ok := derived[name]; ok {
			return quantity.NewSeries(dout[o][:n], r.prog.Dim(o)), true
		}
		return quantity.Series{}, false
	}
	collect := func(t *tracker, into map[steady.Window]winStats, idx []int) int {
		ws, low := t.ready(r.res.Rows)
		for _, w := range ws {
			if _, done := into[w]; !done {
				into[w] = h.summarize(w, idx)
			}
		}
		return low
	}
	var err error
	for n := range r.chunks(&chunk, &err) {
		base := r.res.Rows
		if r.prog != nil {
			for o := range dout {
				dout[o] = grow(dout[o], n)
			}
			if err := r.derive(chunk, dout, n, base); err != nil {
				return err
			}
		}
		for k, name := range reduce {
			x, _ := get(name, n)
			h.vals[k] = append(h.vals[k], x.Values()...)
			h.dims[k] = x.Dim()
		}
		r.res.Rows += n
		for _, t := range []*tracker{pt, zt} {
			if t == nil {
				continue
			}
			x, ok := get(t.p.channel, n)
			if !ok {
				return setOp(r.fail(0, &Error{Channel: t.p.channel, Reason: "points: no such channel"}), "points")
			}
			t.feed(x, base)
		}
		low := collect(pt, pstats, allIdx)
		if zt != nil {
			low = min(low, collect(zt, zstats, tareIdx))
		}
		// Forget the rows no open window needs, once they are half the
		// history, so that each row is moved at most once or twice.
		if k := low - h.base; k > 0 && (len(h.vals) == 0 || 2*k >= len(h.vals[0])) {
			h.drop(low)
		}
	}
	if err != nil {
		return err
	}
	// The end of the record: the last windows, then the points in order.
	if err := pt.finish(r.res.Rows); err != nil {
		return setOp(r.fail(0, &Error{Channel: s.Points.channel, Reason: "points", Err: err}), "points")
	}
	collect(pt, pstats, allIdx)
	if len(pt.wins) == 0 {
		return r.fail(0, &Error{Op: "points", Reason: "no points found (" + s.Points.String() + ")", Err: quantity.ErrRange})
	}
	if err := r.streamZero(zt, zstats, h, tareIdx, collect); err != nil {
		return setOp(err, "zero")
	}
	lims := make([]quantity.Quantity, len(reduce))
	for k, n := range reduce {
		lim, ok := s.Drift[n]
		if !ok {
			lim = quantity.New(math.MaxFloat64, h.dims[k])
		}
		lims[k] = lim
	}
	return r.finishPoints(pt.wins, func(w window) (steady.Point, error) {
		st := pstats[w.Window]
		return pointOf(r.res.Set, w.tag, w.Window, reduce, h.dims, lims, st)
	})
}

// streamZero makes the zero from its window's statistics, or from the
// zero file.
func (r *run) streamZero(zt *tracker, zstats map[steady.Window]winStats, h *history, tareIdx []int, collect func(*tracker, map[steady.Window]winStats, []int) int) error {
	s := r.spec
	if zt == nil {
		var zero *steady.Point
		if err := r.zero(nil, &zero); err != nil {
			return err
		}
		r.res.Zero = zero
		return nil
	}
	if r.in.Zero != nil {
		return r.fail(0, &Error{Reason: "two zeros: Spec.Zero and Input.Zero"})
	}
	if len(s.Tare) == 0 {
		return r.fail(0, &Error{Reason: "a zero but no channel to tare (Spec.Tare)"})
	}
	if err := zt.finish(r.res.Rows); err != nil {
		return r.fail(0, &Error{Channel: s.Zero.channel, Reason: "points", Err: err})
	}
	if len(zt.wins) != 1 {
		return r.fail(0, &Error{Point: "zero", Reason: fmt.Sprintf("the zero gives %d windows, want 1", len(zt.wins))})
	}
	collect(zt, zstats, tareIdx)
	w := zt.wins[0].Window
	names := make([]string, len(tareIdx))
	dims := make([]quantity.Dim, len(tareIdx))
	lims := make([]quantity.Quantity, len(tareIdx))
	for i, k := range tareIdx {
		names[i], dims[i] = h.names[k], h.dims[k]
		lims[i] = quantity.New(math.MaxFloat64, dims[i])
	}
	p, err := pointOf(r.res.Set, "zero", w, names, dims, lims, zstats[w])
	if err != nil {
		return r.stepErr("zero", err)
	}
	r.res.Zero = &p
	return nil
}

// pointOf makes a point of a window's statistics as steady.Reduce does:
// each channel's mean registered in set as a Type A source of standard
// uncertainty Stats.UMean and NEff − 1 degrees of freedom, and flagged
// when it drifts beyond its limit.
func pointOf(set *uncertain.Set, tag string, w steady.Window, names []string, dims []quantity.Dim, lims []quantity.Quantity, ws winStats) (steady.Point, error) {
	const op = "reduce"
	p := steady.Point{Tag: tag, Window: w, Values: make([]steady.Value, 0, len(names))}
	for k, name := range names {
		lim := lims[k]
		if err := lim.CheckNamed(name+" drift limit", dims[k]); err != nil {
			return steady.Point{}, &steady.Error{Op: op, Channel: name, Row: -1, Reason: "drift limit", Err: err}
		}
		if !(lim.Value() > 0) || math.IsInf(lim.Value(), 0) {
			return steady.Point{}, &steady.Error{Op: op, Channel: name, Row: -1, Reason: fmt.Sprintf("drift limit %v: want a finite value > 0", lim)}
		}
		if ws.err != nil && k == firstBad(ws) {
			return steady.Point{}, ws.err
		}
		if k >= len(ws.stats) {
			// Every window is summarized before its point is made; a
			// window that was not is a fault of this package, reported
			// rather than a panic.
			return steady.Point{}, &steady.Error{Op: op, Channel: name, Row: -1, Reason: fmt.Sprintf("window [%d, %d) was not summarized", w.Start, w.End)}
		}
		st := ws.stats[k]
		src := uncertain.Source{
			Name: fmt.Sprintf("%s: %s mean", tag, name),
			U:    st.UMean, Type: uncertain.TypeA, DoF: st.NEff - 1, Effect: uncertain.Random,
		}
		id, err := set.Add(src)
		if err != nil {
			return steady.Point{}, &steady.Error{Op: op, Channel: name, Row: -1, Reason: "registering the mean's source", Err: err}
		}
		m, err := set.Measure(st.Mean, id)
		if err != nil {
			return steady.Point{}, &steady.Error{Op: op, Channel: name, Row: -1, Reason: "the mean", Err: err}
		}
		p.Values = append(p.Values, steady.Value{Name: name, Stats: st, Mean: m, Drifting: math.Abs(st.Drift.Value()) > lim.Value()})
	}
	return p, nil
}

// firstBad is the channel whose summary failed: the first whose
// statistics are unset.
func firstBad(ws winStats) int {
	for k, st := range ws.stats {
		if st.N == 0 {
			return k
		}
	}
	return len(ws.stats)
}
