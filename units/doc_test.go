package units_test

import (
	"go/doc/comment"
	"go/parser"
	"go/token"
	"testing"
)

// TestPackageDocSections: every heading of the package documentation has
// text under it before the next heading, so that go doc shows each
// section's text beneath its own heading (a heading directly followed by
// another one leaves the first empty and files its text under the second).
func TestPackageDocSections(t *testing.T) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "doc.go", nil, parser.ParseComments|parser.PackageClauseOnly)
	if err != nil {
		t.Fatal(err)
	}
	if f.Doc == nil {
		t.Fatal("doc.go has no package comment")
	}
	var p comment.Parser
	d := p.Parse(f.Doc.Text())
	headings := 0
	for i, b := range d.Content {
		h, ok := b.(*comment.Heading)
		if !ok {
			continue
		}
		headings++
		title := headingText(h)
		if i+1 == len(d.Content) {
			t.Errorf("heading %q ends the package comment with no text under it", title)
			continue
		}
		if next, ok := d.Content[i+1].(*comment.Heading); ok {
			t.Errorf("heading %q is empty: heading %q follows it directly", title, headingText(next))
		}
	}
	if headings == 0 {
		t.Error("the package comment has no headings; the test checks nothing")
	}
}

func headingText(h *comment.Heading) string {
	s := ""
	for _, t := range h.Text {
		if p, ok := t.(comment.Plain); ok {
			s += string(p)
		}
	}
	return s
}
