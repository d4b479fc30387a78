package hydraulic_test

import (
	"errors"
	"go/ast"
	"go/parser"
	"go/token"
	"slices"
	"strings"
	"testing"
	"unicode"

	"github.com/google/go-cmp/cmp"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/hydraulic"
)

// TestDistortedFroudeDocumentsVariables checks that DistortedFroude names,
// in its doc comment, every variable of the plan behind it, that Ratio
// reads each of them, and that Ratio of a name that is not a variable
// returns the zero Ratio beside an error matching quantity.ErrUnknown.
func TestDistortedFroudeDocumentsVariables(t *testing.T) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "distorted.go", nil, parser.ParseComments)
	if err != nil {
		t.Fatal(err)
	}
	doc := ""
	for _, d := range f.Decls {
		if fd, ok := d.(*ast.FuncDecl); ok && fd.Recv == nil && fd.Name.Name == "DistortedFroude" && fd.Doc != nil {
			doc = strings.Join(strings.Fields(fd.Doc.Text()), " ")
		}
	}
	d, err := hydraulic.DistortedFroude(hydraulic.DistortedScales{Horizontal: 0.005, Vertical: 0.02})
	if err != nil {
		t.Fatal(err)
	}
	s := d.Solution()
	_, list, _ := strings.Cut(doc, "variables")
	words := strings.FieldsFunc(list, func(r rune) bool { return !unicode.IsLetter(r) && !unicode.IsDigit(r) && r != '_' })
	for _, v := range []string{"V", "x", "z", "g", "t", "Q"} {
		if !slices.Contains(words, v) {
			t.Errorf("the doc comment of DistortedFroude does not name the variable %s: %q", v, doc)
		}
		if r, err := s.Ratio(v); err != nil || r.Value <= 0 {
			t.Errorf("Ratio(%q) = %v, %v", v, r, err)
		}
	}
	r, err := s.Ratio("nope")
	if !errors.Is(err, q.ErrUnknown) {
		t.Errorf("Ratio(\"nope\") error %v, want one matching ErrUnknown", err)
	}
	if !cmp.Equal(r, similarity.Ratio{}) {
		t.Errorf("Ratio(\"nope\") = %+v beside its error, want the zero Ratio", r)
	}
}
