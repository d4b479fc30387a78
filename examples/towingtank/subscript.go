package main

import (
	"math"
	"strings"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
)

// subText is a plot text handler that sets "_{…}" as a subscript (a
// smaller font, lowered) and everything else as plain text: the plot's
// fonts have no subscript capitals, so C_{TM} cannot be written in
// Unicode. A lone "_" without a brace is kept as it is.
type subText struct{ text.Plain }

// subScale and subDrop are the subscript's size and its drop below the
// baseline, as fractions of the font size.
const (
	subScale = 0.7
	subDrop  = 0.22
)

// segment is a run of text, subscript or not.
type segment struct {
	s   string
	sub bool
}

// segments splits a line at "_{…}".
func segments(line string) []segment {
	var out []segment
	for {
		i := strings.Index(line, "_{")
		if i < 0 {
			break
		}
		j := strings.IndexByte(line[i:], '}')
		if j < 0 {
			break
		}
		if i > 0 {
			out = append(out, segment{line[:i], false})
		}
		out = append(out, segment{line[i+2 : i+j], true})
		line = line[i+j+1:]
	}
	if line != "" {
		out = append(out, segment{line, false})
	}
	return out
}

func (h subText) face(fnt font.Font, sub bool) *font.Face {
	if sub {
		fnt.Size *= subScale
	}
	f := h.Fonts.Lookup(fnt, fnt.Size)
	return &f
}

func (h subText) width(line string, fnt font.Font) vg.Length {
	var w vg.Length
	for _, s := range segments(line) {
		w += h.face(fnt, s.sub).Width(s.s)
	}
	return w
}

// Box returns the line's width, height above and depth below the
// baseline, the subscripts' drop included.
func (h subText) Box(txt string, fnt font.Font) (width, height, depth vg.Length) {
	ext := h.face(fnt, false).Extents()
	depth = ext.Descent
	for _, s := range segments(txt) {
		if s.sub {
			depth = max(depth, subDrop*fnt.Size+h.face(fnt, true).Extents().Descent)
		}
	}
	return h.width(txt, fnt), ext.Ascent, depth
}

// Draw renders the text as text.Plain does, segment by segment.
func (h subText) Draw(c vg.Canvas, txt string, sty text.Style, pt vg.Point) {
	txt = strings.TrimRight(txt, "\n")
	if len(txt) == 0 {
		return
	}
	main := h.face(sty.Font, false)
	c.SetColor(sty.Color)
	if sty.Rotation != 0 {
		c.Push()
		c.Rotate(sty.Rotation)
	}
	sin64, cos64 := math.Sincos(sty.Rotation)
	cos, sin := vg.Length(cos64), vg.Length(sin64)
	pt.X, pt.Y = pt.Y*sin+pt.X*cos, pt.Y*cos-pt.X*sin
	lines := h.Lines(txt)
	ht := sty.Height(txt)
	pt.Y += ht*vg.Length(sty.YAlign) - main.Extents().Ascent
	for i, line := range lines {
		x := pt.X + vg.Length(sty.XAlign)*h.width(line, sty.Font)
		y := pt.Y + vg.Length(len(lines)-i)*sty.Font.Size
		for _, s := range segments(line) {
			f := h.face(sty.Font, s.sub)
			dy := vg.Length(0)
			if s.sub {
				dy = -subDrop * sty.Font.Size
			}
			c.FillString(*f, vg.Point{X: x, Y: y + dy}, s.s)
			x += f.Width(s.s)
		}
	}
	if sty.Rotation != 0 {
		c.Pop()
	}
}
