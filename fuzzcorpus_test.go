package similis_test

import (
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// savedInputs states, for every input a fuzz target once failed on and
// that is kept under testdata/fuzz, the property it broke. Each is
// replayed as a seed of its target by `go test`, and the target's body
// checks that property; this table keeps the reason written down. A new
// saved input fails TestSavedFuzzInputsStated until it is added here.
var savedInputs = map[string]string{
	"examples/pumpscale/testdata/fuzz/FuzzPumpscaleFlags/7d62c83879cb5d9e": "a comparison the IEC formula refuses for a small model is reported, not fatal to the run",
	"examples/spillway/testdata/fuzz/FuzzSpillwayFlags/a9bec5c399384224":   "a tiny positive -q (7e-300 m³/s) is a usage error naming -q, not a scale-effect check's range error from a Weber number that underflows",
	"examples/spillway/testdata/fuzz/FuzzSpillwayFlags/8fbc240f9e9877f4":   "a refused flag's message names the flag even when its value is long (the echo is cut, the name is kept)",
	"pigroups/testdata/fuzz/FuzzMatrix/8ed01f8052430226":                   "the rank and every group's dimensionlessness agree with exact math/big elimination",
	"quantity/fit/testdata/fuzz/FuzzFitPoly/3c7571c2fe27f701":              "a fairing evaluated where steps in x overflow gives a finite value or an error, never NaN",
	"quantity/fit/testdata/fuzz/FuzzFitPoly/48021651a2fc1c46":              "a lack-of-fit test whose pure-error sum of squares overflows is not reported (a note says why), never SSPure = +Inf",
	"quantity/fit/testdata/fuzz/FuzzFitPoly/7925a30dfc29b6f7":              "a lack-of-fit F ratio that overflows (pure error negligible) is reported as the largest F with P = 0, never P = NaN",
	"quantity/uncertain/testdata/fuzz/FuzzBudget/561507c236f80ccf":         "a source's share of u_c² that overflows is refused, not printed as NaN or Inf",
	"similarity/hydraulic/testdata/fuzz/FuzzRules/1a31e76e95560a35":        "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/hydraulic/testdata/fuzz/FuzzRules/5836e5544a6fd379":        "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/ship/testdata/fuzz/FuzzRules/1a31e76e95560a35":             "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/ship/testdata/fuzz/FuzzRules/5836e5544a6fd379":             "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/testdata/fuzz/FuzzRules/1a31e76e95560a35":                  "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/testdata/fuzz/FuzzRules/5836e5544a6fd379":                  "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/tunnel/testdata/fuzz/FuzzReduce/55426ab99bc00a1d":          "loads near the float64 limit that overflow when resolved in wind axes are refused (ErrRange), never returned as ±Inf",
	"similarity/turbo/testdata/fuzz/FuzzRules/1a31e76e95560a35":            "a rule's derived ratios are finite and positive, or the rule refuses",
	"similarity/turbo/testdata/fuzz/FuzzRules/5836e5544a6fd379":            "a rule's derived ratios are finite and positive, or the rule refuses",
	"units/chanfile/parquetfile/testdata/fuzz/FuzzPages/1c971a4d8bb8a8d6":  "a row group whose pages hold more rows than it declares is refused before the extra row is counted",
	"units/chanfile/parquetfile/testdata/fuzz/FuzzPages/ac975b373eb98d2a":  "a column short of values in a row group is refused, never shifted against the other columns",
	"units/chanfile/parquetfile/testdata/fuzz/FuzzPages/e6455657736ba30f":  "a run of levels, dictionary indices or delta-encoded values declaring more values than its page holds is refused before it is allocated",
	"units/testdata/fuzz/FuzzParse/20e65aa6af615f41":                       "an accepted unit's ASCII and Unicode spellings parse back to the same unit",
	"units/testdata/fuzz/FuzzParse/8ab0bf988a76eea9":                       "an accepted unit's ASCII and Unicode spellings parse back to the same unit",
	"units/testdata/fuzz/FuzzUnmarshal/aa3c35cd2dfa17d6":                   "a unit or value decoded from text encodes to text that decodes back to the same unit and number",
	"units/testdata/fuzz/FuzzUnmarshal/efbc667994c9bd88":                   "a unit or value decoded from text encodes to text that decodes back to the same unit and number",
}

// TestSavedFuzzInputsStated: every saved fuzz input has its property
// stated in savedInputs, its target exists in the package's tests, and
// no stated input has gone missing.
func TestSavedFuzzInputsStated(t *testing.T) {
	found := map[string]bool{}
	err := filepath.WalkDir(".", func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && strings.HasPrefix(d.Name(), ".") && path != "." {
			return filepath.SkipDir
		}
		p := filepath.ToSlash(path)
		if !d.IsDir() && strings.Contains(p, "/testdata/fuzz/") {
			found[p] = true
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	for p := range found {
		if savedInputs[p] == "" {
			t.Errorf("%s: a saved fuzz input with no property stated in savedInputs", p)
			continue
		}
		dir, _, _ := strings.Cut(p, "/testdata/fuzz/")
		target := filepath.Base(filepath.Dir(p))
		if !targetDefined(t, dir, target) {
			t.Errorf("%s: no func %s(f *testing.F) in %s", p, target, dir)
		}
	}
	for p := range savedInputs {
		if !found[p] {
			t.Errorf("%s: stated but not in the tree", p)
		}
	}
}

func targetDefined(t *testing.T, dir, target string) bool {
	t.Helper()
	files, err := filepath.Glob(filepath.Join(dir, "*_test.go"))
	if err != nil {
		t.Fatal(err)
	}
	re := regexp.MustCompile(`(?m)^func ` + regexp.QuoteMeta(target) + `\(f \*testing\.F\)`)
	for _, f := range files {
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		if re.Match(b) {
			return true
		}
	}
	return false
}
