package hydraulic_test

import (
	"errors"
	"go/ast"
	"go/parser"
	"go/token"
	"math"
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

// TestDistortionCheck: the exaggeration λ_z/λ_x against the 10 of common
// practice for river models, an upper limit: 1:120 across and 1:30 deep
// is 4 (passes), 1:5000 and 1:2 is 2500 (fails, with the warning), and
// exactly 10 passes.
func TestDistortionCheck(t *testing.T) {
	for _, c := range []struct {
		h, v float64
		pass bool
		want string
	}{
		{120, 30, true, "vertical exaggeration λ_z/λ_x = 4.00 (limit ≤ 10, common practice for river models, seldom distorted more than 5 to 10 times): passes"},
		{1000, 100, true, "= 10.0 (limit ≤ 10"},
		{5000, 2, false, "= 2500 (limit ≤ 10, common practice for river models, seldom distorted more than 5 to 10 times): FAILS: distortion beyond common practice"},
	} {
		d, err := hydraulic.DistortedFroude(hydraulic.DistortedScales{Horizontal: 1 / c.h, Vertical: 1 / c.v})
		if err != nil {
			t.Fatal(err)
		}
		ck, err := hydraulic.DistortionCheck(d)
		if err != nil || ck.Pass != c.pass || !ck.Upper || !strings.Contains(ck.String(), c.want) {
			t.Errorf("1:%g, 1:%g: %v, %v; want %q", c.h, c.v, ck, err, c.want)
		}
	}
	if _, err := hydraulic.DistortionCheck(hydraulic.Distorted{Distortion: 0.5}); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("exaggeration 0.5: %v", err)
	}
}

// TestGrainClass: the ISO 14688-1 size bands (from memory), a boundary in
// the coarser class: 0.133 mm sand, 1250 mm boulders.
func TestGrainClass(t *testing.T) {
	for _, c := range []struct {
		mm   float64
		want string
	}{
		{0.001, "clay"}, {0.002, "silt"}, {0.0083, "silt"}, {0.063, "sand"}, {0.133, "sand"}, {1, "sand"}, {2, "gravel"},
		{62.9, "gravel"}, {63, "cobbles"}, {199, "cobbles"}, {200, "boulders"}, {1250, "boulders"}, {0, ""}, {math.Inf(1), ""}, {math.NaN(), ""},
	} {
		if got := hydraulic.GrainClass(c.mm / 1000); got != c.want {
			t.Errorf("%v mm: %q, want %q", c.mm, got, c.want)
		}
	}
}
