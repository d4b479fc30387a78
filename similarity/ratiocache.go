package similarity

import (
	"maps"
	"sync"
	"sync/atomic"

	"similis.dev/similis/quantity"
)

// ratioCache holds the ratio values a Solution has derived, so that a
// transfer after the first of its dimension is a lookup and a multiply.
// It is safe for concurrent use: the map of dimensions is never written
// once published (a miss publishes a copy with one more entry), and the
// variables' ratios are computed once for all variables.
type ratioCache struct {
	dims atomic.Pointer[map[quantity.Dim]float64]

	varsOnce sync.Once
	vars     []varRatio // by variable index
}

// varRatio is a variable's ratio value, or ok false when Ratio refused it
// or it has no value (the slow path then says why).
type varRatio struct {
	value float64
	ok    bool
}

// dim returns the cached ratio of dimension d.
func (c *ratioCache) dim(d quantity.Dim) (float64, bool) {
	m := c.dims.Load()
	if m == nil {
		return 0, false
	}
	r, ok := (*m)[d]
	return r, ok
}

// storeDim publishes r as the ratio of dimension d.
func (c *ratioCache) storeDim(d quantity.Dim, r float64) {
	for {
		old := c.dims.Load()
		var next map[quantity.Dim]float64
		if old == nil {
			next = map[quantity.Dim]float64{d: r}
		} else {
			if _, ok := (*old)[d]; ok {
				return
			}
			next = maps.Clone(*old)
			next[d] = r
		}
		if c.dims.CompareAndSwap(old, &next) {
			return
		}
	}
}

// cachedRatio returns the ratio of dimension d, derived once per
// Solution. Solutions are built with a cache
// (Solve, With); a Solution assembled otherwise gets none and takes the
// slow path every call.
func (s *Solution) cachedRatio(d quantity.Dim) (float64, error) {
	if s.cache != nil {
		if r, ok := s.cache.dim(d); ok {
			return r, nil
		}
	}
	r, err := s.ratioFor(d)
	if err != nil {
		return 0, err
	}
	if s.cache != nil {
		s.cache.storeDim(d, r)
	}
	return r, nil
}

// variableRatio returns the cached value of variable i's ratio.
func (s *Solution) variableRatio(i int) (float64, bool) {
	if s.cache == nil {
		return 0, false
	}
	c := s.cache
	c.varsOnce.Do(func() {
		c.vars = make([]varRatio, len(s.plan.vars))
		for j, v := range s.plan.vars {
			r, err := s.Ratio(v.Symbol)
			if err == nil && r.Value == r.Value { // not NaN
				c.vars[j] = varRatio{value: r.Value, ok: true}
			}
		}
	})
	v := c.vars[i]
	return v.value, v.ok
}
