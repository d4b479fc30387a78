package main

// The plot style shared by the example commands' figures (as in
// examples/pisets and examples/restrictor, less the one-panel save:
// saveStacked in rating.go writes this figure's two panels): subscripts
// drawn as subscripts, tick labels on logarithmic axes of any span, and
// axes padded so no marker is cut.

import (
	"fmt"
	"image/color"
	"math"
	"strings"
	"unicode"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// subscripts is a text handler that draws "K_T" as K with a lowered,
// smaller T ("C_{m¼}" for a longer subscript): a name is never shown with
// its underscore.
type subscripts struct{ text.Plain }

type segment struct {
	s   string
	sub bool
}

const (
	subScale = 0.7  // subscript size over the text's
	subDrop  = 0.25 // subscript baseline drop, in the text's size
)

// segments splits txt at each '_', the subscript being {…} or the run of
// letters and digits after it.
func segments(txt string) []segment {
	var out []segment
	var cur strings.Builder
	rs := []rune(txt)
	for i := 0; i < len(rs); i++ {
		if rs[i] != '_' || i+1 == len(rs) {
			cur.WriteRune(rs[i])
			continue
		}
		j := i + 1
		var sub string
		if rs[j] == '{' {
			k := j + 1
			for k < len(rs) && rs[k] != '}' {
				k++
			}
			sub, i = string(rs[j+1:min(k, len(rs))]), k
		} else {
			k := j
			for k < len(rs) && (unicode.IsLetter(rs[k]) || unicode.IsDigit(rs[k])) {
				k++
			}
			if k == j {
				cur.WriteRune(rs[i])
				continue
			}
			sub, i = string(rs[j:k]), k-1
		}
		if cur.Len() > 0 {
			out = append(out, segment{s: cur.String()})
			cur.Reset()
		}
		out = append(out, segment{s: sub, sub: true})
	}
	if cur.Len() > 0 {
		out = append(out, segment{s: cur.String()})
	}
	return out
}

func (h subscripts) face(fnt font.Font, sub bool) font.Face {
	if sub {
		fnt.Size *= subScale
	}
	return h.Fonts.Lookup(fnt, fnt.Size)
}

// Box returns the extent of one line of txt with its subscripts.
func (h subscripts) Box(txt string, fnt font.Font) (width, height, depth vg.Length) {
	mf := h.face(fnt, false)
	main := mf.Extents()
	height, depth = main.Ascent, main.Descent
	for _, s := range segments(txt) {
		f := h.face(fnt, s.sub)
		width += f.Width(s.s)
		if s.sub {
			depth = max(depth, f.Extents().Descent+subDrop*fnt.Size)
		}
	}
	return width, height, depth
}

// Draw draws txt as text.Plain does, with its subscripts.
func (h subscripts) Draw(c vg.Canvas, txt string, sty text.Style, pt vg.Point) {
	txt = strings.TrimRight(txt, "\n")
	if txt == "" {
		return
	}
	c.SetColor(sty.Color)
	if sty.Rotation != 0 {
		c.Push()
		c.Rotate(sty.Rotation)
	}
	sin64, cos64 := math.Sincos(sty.Rotation)
	cos, sin := vg.Length(cos64), vg.Length(sin64)
	pt.X, pt.Y = pt.Y*sin+pt.X*cos, pt.Y*cos-pt.X*sin
	lines := h.Lines(txt)
	mf := h.face(sty.Font, false)
	pt.Y += sty.Height(txt)*vg.Length(sty.YAlign) - mf.Extents().Ascent
	for i, line := range lines {
		w, _, _ := h.Box(line, sty.Font)
		x := pt.X + vg.Length(sty.XAlign)*w
		y := pt.Y + vg.Length(len(lines)-i)*sty.Font.Size
		for _, s := range segments(line) {
			f := h.face(sty.Font, s.sub)
			dy := vg.Length(0)
			if s.sub {
				dy = -subDrop * sty.Font.Size
			}
			c.FillString(f, vg.Point{X: x, Y: y + dy}, s.s)
			x += f.Width(s.s)
		}
	}
	if sty.Rotation != 0 {
		c.Pop()
	}
}

// logTicks labels a logarithmic axis of any span: 1, 2 and 5 times the
// powers of ten in range, with unlabelled minor ticks at the other
// multiples; a span too narrow for two such labels gets the plain
// decimal ticks, every one labelled.
type logTicks struct{}

// Ticks implements plot.Ticker.
func (logTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(lo > 0) || !(hi > lo) || math.IsInf(hi, 0) {
		return plot.DefaultTicks{}.Ticks(lo, hi)
	}
	var ticks []plot.Tick
	labelled := 0
	for e := math.Floor(math.Log10(lo)); e <= math.Ceil(math.Log10(hi)) && len(ticks) < 400; e++ {
		p := math.Pow(10, e)
		for m := 1; m <= 9; m++ {
			v := float64(m) * p
			if v < lo*(1-1e-12) || v > hi*(1+1e-12) {
				continue
			}
			t := plot.Tick{Value: v}
			if m == 1 || m == 2 || m == 5 {
				t.Label = fmt.Sprintf("%g", v)
				labelled++
			}
			ticks = append(ticks, t)
		}
	}
	if labelled < 2 {
		return plot.DefaultTicks{}.Ticks(lo, hi)
	}
	return ticks
}

// styleAxes sets the subscript handler on every text of pl, the tick
// labelling of its log axes, and ranges padded by 6 % of the span in
// logarithms on each side of the data, so no marker is cut at a border.
func styleAxes(pl *plot.Plot, xs, ys []float64) {
	h := subscripts{text.Plain{Fonts: font.DefaultCache}}
	pl.Title.TextStyle.Handler = h
	pl.X.Label.TextStyle.Handler, pl.Y.Label.TextStyle.Handler = h, h
	pl.X.Tick.Label.Handler, pl.Y.Tick.Label.Handler = h, h
	pl.Legend.TextStyle.Handler = h
	pl.X.Scale, pl.Y.Scale = plot.LogScale{}, plot.LogScale{}
	pl.X.Tick.Marker, pl.Y.Tick.Marker = logTicks{}, logTicks{}
	pl.X.Min, pl.X.Max = padLog(xs)
	pl.Y.Min, pl.Y.Max = padLog(ys)
}

// padLog returns a range around the positive values v, padded in
// logarithms.
func padLog(v []float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, x := range v {
		if x > 0 && !math.IsInf(x, 0) {
			lo, hi = min(lo, x), max(hi, x)
		}
	}
	if lo > hi {
		return 1, 10
	}
	span := math.Log10(hi / lo)
	if span == 0 {
		span = 0.2
	}
	return lo * math.Pow(10, -0.06*span), hi * math.Pow(10, 0.06*span)
}

// marker returns the style of series k: a distinct shape and colour.
func marker(k int) draw.GlyphStyle {
	shapes := []draw.GlyphDrawer{draw.CircleGlyph{}, draw.SquareGlyph{}, draw.TriangleGlyph{}, draw.RingGlyph{}, draw.BoxGlyph{}, draw.PyramidGlyph{}, draw.CrossGlyph{}, draw.PlusGlyph{}}
	colors := plotter.DefaultGlyphStyle
	colors.Shape = shapes[k%len(shapes)]
	colors.Color = seriesColor(k)
	colors.Radius = vg.Points(3)
	return colors
}

// seriesColor is a palette readable in grey print.
func seriesColor(k int) color.Color {
	p := []color.RGBA{{0, 0, 0, 255}, {0, 90, 180, 255}, {200, 80, 0, 255}, {0, 140, 70, 255}, {150, 0, 150, 255}}
	return p[k%len(p)]
}
