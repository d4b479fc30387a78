package reduction_test

import (
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/similarity/reduction"
)

// TestChunkAndWorkersIndependence: a file's reduction is a pure function
// of its input — the chunk size it is read in and the number of workers
// of a campaign change nothing in the result.
func TestChunkAndWorkersIndependence(t *testing.T) {
	spec := carriageSpec(t)
	ref, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	rapid.Check(t, func(t *rapid.T) {
		s := *spec
		s.ChunkRows = rapid.IntRange(1, 5000).Draw(t, "chunk")
		workers := rapid.IntRange(1, 4).Draw(t, "workers")
		ins := []reduction.Input{reduction.File("testdata/carriage.csv", reduction.FileOptions{}), reduction.File("testdata/carriage.csv", reduction.FileOptions{})}
		for _, o := range s.Campaign(ins, workers) {
			if o.Err != nil {
				t.Fatal(o.Err)
			}
			for i, p := range o.Result.Points {
				q := ref.Points[i]
				if p.Window != q.Window {
					t.Fatalf("point %d window %v, want %v", i, p.Window, q.Window)
				}
				for g := range p.Groups {
					if p.Groups[g].Value() != q.Groups[g].Value() || p.Groups[g].U() != q.Groups[g].U() {
						t.Fatalf("point %d group %d: %v, want %v", i, g, p.Groups[g], q.Groups[g])
					}
				}
			}
		}
	})
}
