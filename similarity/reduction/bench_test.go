package reduction_test

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"testing"
	"time"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile"
)

// wideLog is the invented carriage log repeated to rows rows, with three
// more channels (sinkage fore and aft, trim), 8 channels in all.
func wideLog(rows int) []byte {
	var b bytes.Buffer
	b.WriteString("# INVENTED towing-carriage log for benchmarks\n")
	b.WriteString("t [s],run [1],V [m/s],F [N],T_w [°C],z_f [mm],z_a [mm],trim [deg]\n")
	for i, r := range carriageRows(3, rows) {
		zf, za := -2-3*r[2]*r[2]+0.01*math.Sin(float64(i)), -3-4*r[2]*r[2]+0.01*math.Cos(float64(i))
		b.WriteString(strconv.FormatFloat(r[0], 'f', 3, 64))
		b.WriteByte(',')
		b.WriteString(strconv.FormatFloat(r[1], 'g', -1, 64))
		for _, x := range []float64{r[2], r[3], r[4], zf, za, (za - zf) * 0.02} {
			b.WriteByte(',')
			b.WriteString(strconv.FormatFloat(x, 'f', 5, 64))
		}
		b.WriteByte('\n')
	}
	return b.Bytes()
}

// baseline is the plainest reading of the same bytes: split each line at
// commas and strconv.ParseFloat every field, summing them.
func baseline(data []byte) float64 {
	sum := 0.0
	header := false
	for len(data) > 0 {
		i := bytes.IndexByte(data, '\n')
		line := data[:i]
		data = data[i+1:]
		if len(line) == 0 || line[0] == '#' {
			continue
		}
		if !header {
			header = true
			continue
		}
		for len(line) > 0 {
			j := bytes.IndexByte(line, ',')
			var f []byte
			if j < 0 {
				f, line = line, nil
			} else {
				f, line = line[:j], line[j+1:]
			}
			x, _ := strconv.ParseFloat(string(f), 64)
			sum += x
		}
	}
	return sum
}

// BenchmarkCSVToPoints reduces 2·10⁵ rows × 8 channels of CSV to steady
// points with uncertainty (runs, zero, tare, derived ρ and ν, groups),
// and reports the time against the baseline split-and-ParseFloat loop
// over the same bytes (x-baseline), the heap in use at the end of a
// reduction (heap-MB, the largest seen) and the memory the process
// obtained from the system (sys-MB, an upper bound of the peak).
func BenchmarkCSVToPoints(b *testing.B) {
	spec := carriageSpec(b)
	spec.Also = []string{"T_w", "z_f", "z_a", "trim"}
	benchPoints(b, spec)
}

// BenchmarkCSVToPointsPlain is BenchmarkCSVToPoints without the fluid
// functions: ρ and ν are constants of the derived text instead of
// rho_water(T_w) and nu_water(T_w), whose exp and log per row are not the
// pipeline's cost. This is the headline figure against the baseline.
func BenchmarkCSVToPointsPlain(b *testing.B) {
	spec := carriageSpec(b)
	spec.Derive = "rho = 998.6 {kg/m^3}; nu = 1.0547e-6 {m^2/s}; L = 2 {m}"
	spec.Funcs = nil
	spec.Also = []string{"T_w", "z_f", "z_a", "trim"}
	benchPoints(b, spec)
}

func benchPoints(b *testing.B, spec *reduction.Spec) {
	const rows = 200_000
	data := wideLog(rows)
	// The baseline's time per pass, the best of 3.
	base := time.Duration(math.MaxInt64)
	for range 3 {
		t0 := time.Now()
		baseline(data)
		base = min(base, time.Since(t0))
	}
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	b.ResetTimer()
	t0 := time.Now()
	n := 0
	var ms runtime.MemStats
	peak := uint64(0)
	for b.Loop() {
		src, err := chanfile.NewReader(bytes.NewReader(data), "bench.csv", chanfile.Options{})
		if err != nil {
			b.Fatal(err)
		}
		res, err := spec.Reduce(reduction.Input{Name: "bench.csv", Source: src})
		if err != nil {
			b.Fatal(err)
		}
		if len(res.Points) != 3*rows/fxRows {
			b.Fatalf("%d points", len(res.Points))
		}
		// The heap in use with the history and the result still live.
		runtime.ReadMemStats(&ms)
		peak = max(peak, ms.HeapInuse)
		n++
	}
	per := time.Since(t0) / time.Duration(n)
	runtime.ReadMemStats(&ms)
	b.ReportMetric(float64(peak)/(1<<20), "heap-MB")
	b.ReportMetric(float64(per)/float64(base), "x-baseline")
	b.ReportMetric(float64(ms.Sys)/(1<<20), "sys-MB")
	b.ReportMetric(float64(len(data))/(1<<20), "input-MB")
}

// BenchmarkBaselineParse is the baseline alone.
func BenchmarkBaselineParse(b *testing.B) {
	data := wideLog(200_000)
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		baseline(data)
	}
}

// BenchmarkCampaign reduces 32 small files of the invented log on one
// worker and on GOMAXPROCS workers.
func BenchmarkCampaign(b *testing.B) {
	dir := b.TempDir()
	var ins []reduction.Input
	for i := range 32 {
		p := filepath.Join(dir, fmt.Sprintf("run%02d.csv", i))
		if err := os.WriteFile(p, carriageCSV(uint64(i+1), fxRows), 0o644); err != nil {
			b.Fatal(err)
		}
		ins = append(ins, reduction.File(p, reduction.FileOptions{}))
	}
	spec := carriageSpec(b)
	for _, w := range []int{1, runtime.GOMAXPROCS(0)} {
		b.Run(fmt.Sprintf("workers=%d", w), func(b *testing.B) {
			for b.Loop() {
				for _, o := range spec.Campaign(ins, w) {
					if o.Err != nil {
						b.Fatal(o.Err)
					}
				}
			}
		})
	}
}

var _ = quantity.ErrRange
