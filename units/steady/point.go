package steady

import (
	"fmt"
	"math"
	"slices"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// Channel is one channel of a history, with the drift its points may show.
type Channel struct {
	Name string
	Data quantity.Series
	// DriftLimit is the largest |Stats.Drift| a point may show before it
	// is flagged as drifting; it must have the channel's dimension and be
	// finite and > 0.
	DriftLimit quantity.Quantity
}

// Value is one channel's result at a steady point.
type Value struct {
	Name     string
	Stats    Stats
	Drifting bool // |Stats.Drift| > the channel's DriftLimit
	// Mean is the point's estimate with its uncertainty: Stats.Mean with
	// a Type A source of standard uncertainty Stats.UMean and
	// Stats.NEff − 1 degrees of freedom, then as Tare and calibration
	// have changed it.
	Mean uncertain.Measured
	// Tared reports that a zero has been subtracted from Mean.
	Tared bool
}

// Point is a steady point: a window and each channel's result over it.
type Point struct {
	Tag    string // names the point's sources: "point 3", "zero"
	Window Window
	Values []Value
}

// Value returns the result of the channel name.
func (p Point) Value(name string) (Value, bool) {
	for _, v := range p.Values {
		if v.Name == name {
			return v, true
		}
	}
	return Value{}, false
}

// Reduce summarizes every channel over the window w and returns the
// point. Each channel's mean is registered in set as a Type A source of
// random effect named "<tag>: <channel> mean", with standard uncertainty
// Stats.UMean and Stats.NEff − 1 degrees of freedom (the degrees of
// freedom of an autocorrelated mean; the samples are never counted as
// independent). A tag may be used once per set. The errors are those of
// Summarize, with the channel named, and those of the set.
func Reduce(set *uncertain.Set, tag string, chs []Channel, w Window) (Point, error) {
	const op = "reduce"
	if set == nil {
		return Point{}, invalid(op, "", -1, "no uncertainty set")
	}
	p := Point{Tag: tag, Window: w, Values: make([]Value, 0, len(chs))}
	for _, ch := range chs {
		lim := ch.DriftLimit
		if lim.Dim() != ch.Data.Dim() {
			return Point{}, &Error{Op: op, Channel: ch.Name, Row: -1, Reason: "drift limit",
				Err: &quantity.Error{Op: "check", Name: ch.Name + " drift limit", Dims: [2]quantity.Dim{lim.Dim(), ch.Data.Dim()}, Binary: true, Class: quantity.ErrDimension}}
		}
		if !(lim.Value() > 0) || math.IsInf(lim.Value(), 0) {
			return Point{}, invalid(op, ch.Name, -1, "drift limit %v: want a finite value > 0", lim)
		}
		st, err := summarize(ch.Name, ch.Data, w)
		if err != nil {
			return Point{}, err
		}
		src := uncertain.Source{
			Name: fmt.Sprintf("%s: %s mean", tag, ch.Name),
			U:    st.UMean, Type: uncertain.TypeA, DoF: st.NEff - 1, Effect: uncertain.Random,
		}
		id, err := set.Add(src)
		if err != nil {
			return Point{}, &Error{Op: op, Channel: ch.Name, Row: -1, Reason: "registering the mean's source", Err: err}
		}
		m, err := set.Measure(st.Mean, id)
		if err != nil {
			return Point{}, &Error{Op: op, Channel: ch.Name, Row: -1, Reason: "the mean", Err: err}
		}
		p.Values = append(p.Values, Value{
			Name: ch.Name, Stats: st, Mean: m,
			Drifting: math.Abs(st.Drift.Value()) > lim.Value(),
		})
	}
	return p, nil
}

// Points reduces the channels over each window in turn, tagging the
// points "point 1", "point 2", … (see Reduce). An empty list of windows
// is an *Error (class quantity.ErrInvalid): nothing was found to reduce —
// the runs of a text column, say, whose Series from chanfile is empty
// (use TextRuns on its labels), or runs all dropped by the caller.
func Points(set *uncertain.Set, chs []Channel, ws []Window) ([]Point, error) {
	if len(ws) == 0 {
		return nil, invalid("points", "", -1, "no windows to reduce (Runs of an empty or text channel finds none: a text run tag is read with TextRuns)")
	}
	out := make([]Point, 0, len(ws))
	for i, w := range ws {
		p, err := Reduce(set, fmt.Sprintf("point %d", i+1), chs, w)
		if err != nil {
			return nil, err
		}
		out = append(out, p)
	}
	return out, nil
}

// Tare returns p with the zero's mean subtracted from the channels
// named, or, when none is named, from each channel of p the zero holds:
// a zero window of the same history, or the whole of a zero file,
// reduced with Reduce. The result's uncertainty combines the point's and
// the zero's Type A sources (uncertain.Measured.Sub).
//
// Name the channels to tare — the force, torque and pressure channels
// whose transducers read an offset at rest — or reduce the zero with
// only those. A temperature must not be tared: an absolute temperature
// has no offset to remove, and a zero of the water temperature
// subtracted from the point's leaves a meaningless difference (0.17 K).
// So when no channel is named, a temperature channel (quantity.
// Temperature) that the zero holds is refused with an *Error naming it;
// naming it explicitly tares it (a temperature difference logged with
// an offset). A channel named that p or the zero does not hold, a
// channel named twice, a channel tared already and a zero channel of
// another dimension are refused. A channel of p not tared keeps its
// value and Tared false.
func Tare(p, zero Point, channels ...string) (Point, error) {
	const op = "tare"
	out := p
	out.Values = append([]Value(nil), p.Values...)
	for k, n := range channels {
		if slices.Contains(channels[:k], n) {
			return Point{}, invalid(op, n, -1, "channel named twice")
		}
		if _, ok := p.Value(n); !ok {
			return Point{}, invalid(op, n, -1, "point %q has no such channel", p.Tag)
		}
		if _, ok := zero.Value(n); !ok {
			return Point{}, invalid(op, n, -1, "the zero %q has no such channel: reduce the zero with every channel to tare", zero.Tag)
		}
	}
	for i, v := range out.Values {
		z, ok := zero.Value(v.Name)
		if !ok || len(channels) > 0 && !slices.Contains(channels, v.Name) {
			continue
		}
		if len(channels) == 0 && v.Mean.Dim() == quantity.Temperature {
			return Point{}, invalid(op, v.Name, -1, "a temperature is not tared: name the channels to tare (Tare(p, zero, \"F\")) or reduce the zero without %s", v.Name)
		}
		if v.Tared {
			return Point{}, invalid(op, v.Name, -1, "point %q is tared already", p.Tag)
		}
		if z.Mean.Dim() != v.Mean.Dim() {
			return Point{}, &Error{Op: op, Channel: v.Name, Row: -1, Reason: "the zero",
				Err: &quantity.Error{Op: "check", Name: v.Name + " zero", Dims: [2]quantity.Dim{z.Mean.Dim(), v.Mean.Dim()}, Binary: true, Class: quantity.ErrDimension}}
		}
		m, err := uncertain.Eval(func() uncertain.Measured { return v.Mean.Sub(z.Mean) })
		if err != nil {
			return Point{}, &Error{Op: op, Channel: v.Name, Row: -1, Reason: "subtracting the zero", Err: err}
		}
		out.Values[i].Mean = m
		out.Values[i].Tared = true
	}
	return out, nil
}
