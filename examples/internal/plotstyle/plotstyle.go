// Package plotstyle is the plot style of the example commands' figures:
// subscripts drawn as subscripts, tick labels on logarithmic axes of any
// span or on linear axes, axes padded so no marker is cut, distinct
// markers and colours readable in grey print, and a chosen size and
// resolution.
package plotstyle

import (
	"fmt"
	"image/color"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"unicode"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

// Subscripts is a text handler that draws "K_T" as K with a lowered,
// smaller T ("C_{m¼}" for a longer subscript): a name is never shown with
// its underscore. With BracedOnly set only "_{…}" makes a subscript, and
// a lone "_" (as in a file name) is drawn as written.
type Subscripts struct {
	text.Plain
	BracedOnly bool
}

// New returns the subscript handler over the default fonts, every "_"
// making a subscript.
func New() Subscripts { return Subscripts{Plain: text.Plain{Fonts: font.DefaultCache}} }

// Segment is a run of a label's text, drawn as a subscript or not.
type Segment struct {
	Text string
	Sub  bool
}

const (
	subScale = 0.7  // subscript size over the text's
	subDrop  = 0.25 // subscript baseline drop, in the text's size
)

// Segments splits txt at each '_', the subscript being {…} or the run of
// letters and digits after it; with bracedOnly set, at each "_{…}" only
// (an unclosed brace is text).
func Segments(txt string, bracedOnly bool) []Segment {
	var out []Segment
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
			if bracedOnly && k == len(rs) {
				cur.WriteRune(rs[i])
				continue
			}
			sub, i = string(rs[j+1:min(k, len(rs))]), k
		} else if bracedOnly {
			cur.WriteRune(rs[i])
			continue
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
			out = append(out, Segment{Text: cur.String()})
			cur.Reset()
		}
		out = append(out, Segment{Text: sub, Sub: true})
	}
	if cur.Len() > 0 {
		out = append(out, Segment{Text: cur.String()})
	}
	return out
}

func (h Subscripts) face(fnt font.Font, sub bool) font.Face {
	if sub {
		fnt.Size *= subScale
	}
	return h.Fonts.Lookup(fnt, fnt.Size)
}

// Box returns the extent of one line of txt with its subscripts.
func (h Subscripts) Box(txt string, fnt font.Font) (width, height, depth vg.Length) {
	mf := h.face(fnt, false)
	main := mf.Extents()
	height, depth = main.Ascent, main.Descent
	for _, s := range Segments(txt, h.BracedOnly) {
		f := h.face(fnt, s.Sub)
		width += f.Width(s.Text)
		if s.Sub {
			depth = max(depth, f.Extents().Descent+subDrop*fnt.Size)
		}
	}
	return width, height, depth
}

// Draw draws txt as text.Plain does, with its subscripts.
func (h Subscripts) Draw(c vg.Canvas, txt string, sty text.Style, pt vg.Point) {
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
		for _, s := range Segments(line, h.BracedOnly) {
			f := h.face(sty.Font, s.Sub)
			dy := vg.Length(0)
			if s.Sub {
				dy = -subDrop * sty.Font.Size
			}
			c.FillString(f, vg.Point{X: x, Y: y + dy}, s.Text)
			x += f.Width(s.Text)
		}
	}
	if sty.Rotation != 0 {
		c.Pop()
	}
}

// LogTicks labels a logarithmic axis of any span: 1, 2 and 5 times the
// powers of ten in range, with unlabelled minor ticks at the other
// multiples; a span too narrow for two such labels gets the plain
// decimal ticks, every one labelled.
type LogTicks struct{}

// Ticks implements plot.Ticker.
func (LogTicks) Ticks(lo, hi float64) []plot.Tick {
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

// StyleLog sets the subscript handler on every text of pl, the tick
// labelling of its log axes, and ranges padded by 6 % of the span in
// logarithms on each side of the data, so no marker is cut at a border.
func StyleLog(pl *plot.Plot, xs, ys []float64) {
	h := New()
	pl.Title.TextStyle.Handler = h
	pl.X.Label.TextStyle.Handler, pl.Y.Label.TextStyle.Handler = h, h
	pl.X.Tick.Label.Handler, pl.Y.Tick.Label.Handler = h, h
	pl.Legend.TextStyle.Handler = h
	pl.X.Scale, pl.Y.Scale = plot.LogScale{}, plot.LogScale{}
	pl.X.Tick.Marker, pl.Y.Tick.Marker = LogTicks{}, LogTicks{}
	pl.X.Min, pl.X.Max = PadLog(xs)
	pl.Y.Min, pl.Y.Max = PadLog(ys)
}

// PadLog returns a range around the positive values v, padded in
// logarithms.
func PadLog(v []float64) (lo, hi float64) {
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

// Marker returns the style of series k: a distinct shape and colour.
func Marker(k int) draw.GlyphStyle {
	shapes := []draw.GlyphDrawer{draw.CircleGlyph{}, draw.SquareGlyph{}, draw.TriangleGlyph{}, draw.RingGlyph{}, draw.BoxGlyph{}, draw.PyramidGlyph{}, draw.CrossGlyph{}, draw.PlusGlyph{}}
	colors := plotter.DefaultGlyphStyle
	colors.Shape = shapes[k%len(shapes)]
	colors.Color = SeriesColor(k)
	colors.Radius = vg.Points(3)
	return colors
}

// Save writes pl to a .png (at dpi) or .svg file of the given size in
// inches.
func Save(pl *plot.Plot, path string, wIn, hIn, dpi float64) error {
	return SaveStacked([]*plot.Plot{pl}, path, wIn, hIn, dpi)
}

// SaveStacked writes the plots one above the other, their axes aligned,
// to a .png (at dpi) or .svg file of the given size in inches.
func SaveStacked(pls []*plot.Plot, path string, wIn, hIn, dpi float64) error {
	w, h := vg.Length(wIn)*vg.Inch, vg.Length(hIn)*vg.Inch
	var c vg.CanvasWriterTo
	if strings.ToLower(filepath.Ext(path)) == ".png" {
		c = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(w, h), vgimg.UseDPI(int(math.Round(dpi))))}
	} else {
		c = vgsvg.New(w, h)
	}
	if len(pls) == 1 {
		pls[0].Draw(draw.New(c))
	} else {
		rows := make([][]*plot.Plot, len(pls))
		for i, pl := range pls {
			rows[i] = []*plot.Plot{pl}
		}
		cs := plot.Align(rows, draw.Tiles{Rows: len(pls), Cols: 1, PadY: vg.Points(4), PadTop: vg.Points(4), PadBottom: vg.Points(4)}, draw.New(c))
		for i, pl := range pls {
			pl.Draw(cs[i][0])
		}
	}
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	if _, err := c.WriteTo(f); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}

// SeriesColor is a palette readable in grey print.
func SeriesColor(k int) color.Color {
	p := []color.RGBA{{0, 0, 0, 255}, {0, 90, 180, 255}, {200, 80, 0, 255}, {0, 140, 70, 255}, {150, 0, 150, 255}}
	return p[k%len(p)]
}

// StyleLinear sets the subscript handler on every text of pl and linear
// ranges padded by 6 % of the data's span on each side, so no marker is
// cut at a border.
func StyleLinear(pl *plot.Plot, xs, ys []float64) {
	h := New()
	pl.Title.TextStyle.Handler = h
	pl.X.Label.TextStyle.Handler, pl.Y.Label.TextStyle.Handler = h, h
	pl.X.Tick.Label.Handler, pl.Y.Tick.Label.Handler = h, h
	pl.Legend.TextStyle.Handler = h
	pl.X.Min, pl.X.Max = PadLinear(xs)
	pl.Y.Min, pl.Y.Max = PadLinear(ys)
	pl.X.Tick.Marker, pl.Y.Tick.Marker = LinearTicks{}, LinearTicks{}
}

// LinearTicks labels every major tick of a linear axis, at steps of 1, 2
// or 5 times a power of ten giving at most 8 labels, with an unlabelled
// minor tick half-way between.
type LinearTicks struct{}

// Ticks implements plot.Ticker.
func (LinearTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) || math.IsInf(hi-lo, 0) {
		return plot.DefaultTicks{}.Ticks(lo, hi)
	}
	p := math.Pow(10, math.Floor(math.Log10((hi-lo)/8)))
	step := p
	for _, m := range []float64{1, 2, 5, 10} {
		if step = m * p; (hi-lo)/step <= 8 {
			break
		}
	}
	decimals := max(0, int(-math.Floor(math.Log10(step)+1e-9)))
	var ticks []plot.Tick
	for k := math.Ceil(lo/step - 0.5); len(ticks) < 40; k += 0.5 {
		v := k * step
		if v > hi+1e-9*step {
			break
		}
		if v < lo-1e-9*step {
			continue
		}
		t := plot.Tick{Value: v}
		if k == math.Trunc(k) {
			t.Label = strconv.FormatFloat(v, 'f', decimals, 64)
			if t.Label == "-"+strconv.FormatFloat(0, 'f', decimals, 64) {
				t.Label = t.Label[1:]
			}
		}
		ticks = append(ticks, t)
	}
	return ticks
}

// PadLinear returns a range around the finite values v, padded by 6 % of
// their span.
func PadLinear(v []float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, x := range v {
		if !math.IsNaN(x) && !math.IsInf(x, 0) {
			lo, hi = min(lo, x), max(hi, x)
		}
	}
	if lo > hi {
		return 0, 1
	}
	span := hi - lo
	if span == 0 {
		span = math.Max(math.Abs(lo), 1)
	}
	return lo - 0.06*span, hi + 0.06*span
}
