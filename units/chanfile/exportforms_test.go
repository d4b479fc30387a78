package chanfile

import (
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// TestCommonExportForms: forms real exports write that were refused or
// lost. A row-ending delimiter leaves an unnamed empty column, read as
// text rather than refused for want of a unit; a year-first slash date
// (not ambiguous: 2024/01/05) and an ISO date and time with a spaced zone
// offset are timestamps, not text. Expected values by hand: the samples
// are one second apart, so the time channel reads 0 and 1 s.
func TestCommonExportForms(t *testing.T) {
	for _, c := range []struct {
		name, text string
		want       map[string][]float64
	}{
		{"row-ending delimiter", "t [s];F [N];\n0;1,5;\n1;2,5;\n", map[string][]float64{"t": {0, 1}, "F": {1.5, 2.5}}},
		{"year-first slash date", "time,F [N]\n2024/01/05 12:00:00,1.5\n2024/01/05 12:00:01,2.5\n", map[string][]float64{"time": {0, 1}, "F": {1.5, 2.5}}},
		{"spaced zone offset", "time,F [N]\n2024-01-05 12:00:00 +0100,1.5\n2024-01-05 12:00:01 +0100,2.5\n", map[string][]float64{"time": {0, 1}, "F": {1.5, 2.5}}},
	} {
		r, err := NewReader(strings.NewReader(c.text), "export.csv", Options{})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		dst, n, err := r.Read(nil, 10)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		got := map[string][]float64{}
		for j, col := range r.Columns() {
			if col.Kind == Label {
				continue
			}
			got[col.Name] = dst[j].Values()[:n]
		}
		if d := cmp.Diff(c.want, got); d != "" {
			t.Errorf("%s (-want +got):\n%s", c.name, d)
		}
	}
}
