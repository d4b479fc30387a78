package reduction_test

import (
	"bytes"
	"fmt"
	"io"
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
	b.WriteString(wideHeader)
	g := newCarriage(3)
	for i := range rows {
		b.Write(wideRow(nil, i, g.next()))
	}
	return b.Bytes()
}

const wideHeader = "# INVENTED towing-carriage log for benchmarks\n" +
	"t [s],run [1],V [m/s],F [N],T_w [°C],z_f [mm],z_a [mm],trim [deg]\n"

// wideRow appends row i of the wide log to b.
func wideRow(b []byte, i int, r [5]float64) []byte {
	zf, za := -2-3*r[2]*r[2]+0.01*math.Sin(float64(i)), -3-4*r[2]*r[2]+0.01*math.Cos(float64(i))
	b = strconv.AppendFloat(b, r[0], 'f', 5, 64) // to 10 µs: a 20 kHz log's times stay distinct
	b = append(b, ',')
	b = strconv.AppendFloat(b, r[1], 'g', -1, 64)
	for _, x := range [...]float64{r[2], r[3], r[4], zf, za, (za - zf) * 0.02} {
		b = append(b, ',')
		b = strconv.AppendFloat(b, x, 'f', 5, 64)
	}
	return append(b, '\n')
}

// wideReader generates the wide log as it is read, for a log too long
// to hold in memory.
type wideReader struct {
	rows, i int
	rate    float64 // samples per second
	g       *carriage
	buf     []byte
	started bool
}

func (w *wideReader) Read(p []byte) (int, error) {
	if !w.started {
		w.started, w.g = true, newCarriage(3)
		w.g.rate = w.rate
		w.buf = append(w.buf[:0], wideHeader...)
	}
	for len(w.buf) < len(p) && w.i < w.rows {
		w.buf = wideRow(w.buf, w.i, w.g.next())
		w.i++
	}
	if len(w.buf) == 0 {
		return 0, io.EOF
	}
	n := copy(p, w.buf)
	w.buf = w.buf[:copy(w.buf, w.buf[n:])]
	return n, nil
}

// sampled is a Source that samples the runtime's memory counters every
// 64 reads: the peak of MemStats.Sys (what the process took from the
// system, which never falls) and of HeapInuse.
type sampled struct {
	chanfile.Source
	reads          int
	sys, heapInuse uint64
}

func (s *sampled) Read(dst []quantity.Series, rows int) ([]quantity.Series, int, error) {
	if s.reads%64 == 0 {
		var ms runtime.MemStats
		runtime.ReadMemStats(&ms)
		s.sys, s.heapInuse = max(s.sys, ms.Sys), max(s.heapInuse, ms.HeapInuse)
	}
	s.reads++
	return s.Source.Read(dst, rows)
}

// BenchmarkCSVToPointsMemory reduces 10⁷ rows × 8 channels of CSV
// (generated as they are read, never held) to steady points with
// uncertainty as BenchmarkCSVToPoints does, and reports the peak of
// MemStats.Sys (peak-MiB, run it alone: Sys never falls) and of the heap
// in use (heap-MiB), both sampled every 64 chunks and at the end, with
// the result live. The log is the carriage's at 20 kHz: 107 runs of
// 5·10⁴ samples and a zero of 3·10⁴, so that the rows kept, those of the
// window still open, are 5·10⁴ × 10 channels × 8 B = 4 MB at most.
func BenchmarkCSVToPointsMemory(b *testing.B) {
	const rows, rate = 10_000_000, 100 * fxRate
	spec := carriageSpec(b)
	spec.Points = reduction.Runs("run", 200*rate/fxRate, 0)
	spec.Also = []string{"T_w", "z_f", "z_a", "trim"}
	var s *sampled
	for b.Loop() {
		src, err := chanfile.NewReader(&wideReader{rows: rows, rate: rate}, "gen.csv", chanfile.Options{})
		if err != nil {
			b.Fatal(err)
		}
		s = &sampled{Source: src}
		res, err := spec.Reduce(reduction.Input{Name: "gen.csv", Source: s})
		if err != nil {
			b.Fatal(err)
		}
		if res.Rows != rows || len(res.Points) != 107 /* 3 runs in each 14 s cycle: 35.7 cycles, the last cut in its third run */ {
			b.Fatalf("%d rows, %d points", res.Rows, len(res.Points))
		}
		var ms runtime.MemStats
		runtime.ReadMemStats(&ms)
		s.sys, s.heapInuse = max(s.sys, ms.Sys), max(s.heapInuse, ms.HeapInuse)
	}
	b.ReportMetric(float64(s.sys)/(1<<20), "peak-MiB")
	b.ReportMetric(float64(s.heapInuse)/(1<<20), "heap-MiB")
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
// points with uncertainty (runs, zero, tare, derived ρ and ν from the
// water temperature, groups), and reports the time against the baseline
// split-and-ParseFloat loop over the same bytes, run beside each
// reduction (x-baseline, the ratio of the sums), the heap in use at the
// end of a reduction (heap-MB, the largest seen, with the 12 MB input
// and the result live) and the memory the process obtained from the
// system (sys-MB, an upper bound of the peak).
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
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	var ms runtime.MemStats
	peak := uint64(0)
	// The baseline runs beside each reduction, untimed by the benchmark
	// but timed here, so that both see the same load on a shared machine.
	var base, red time.Duration
	for b.Loop() {
		b.StopTimer()
		t0 := time.Now()
		baseline(data)
		base += time.Since(t0)
		b.StartTimer()
		t1 := time.Now()
		src, err := chanfile.NewReader(bytes.NewReader(data), "bench.csv", chanfile.Options{})
		if err != nil {
			b.Fatal(err)
		}
		res, err := spec.Reduce(reduction.Input{Name: "bench.csv", Source: src})
		if err != nil {
			b.Fatal(err)
		}
		red += time.Since(t1)
		if len(res.Points) != 3*rows/fxRows {
			b.Fatalf("%d points", len(res.Points))
		}
		// The heap in use with the result still live.
		runtime.ReadMemStats(&ms)
		peak = max(peak, ms.HeapInuse)
	}
	runtime.ReadMemStats(&ms)
	b.ReportMetric(float64(peak)/(1<<20), "heap-MB")
	b.ReportMetric(float64(red)/float64(base), "x-baseline")
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

// BenchmarkCampaignScaling reduces a campaign of 100 files of the
// invented log (2800 rows each) on one core (GOMAXPROCS 1, one worker)
// and on two (GOMAXPROCS 2, two workers), alternately, five times each
// per op, and reports the best time of each (one-core-ms, two-core-ms)
// and their ratio (speedup): the machine may be shared, and the best of
// alternating runs is the least disturbed. cores-used is the process's
// CPU time over the wall time in the best two-core run: the speedup can
// not exceed it, and on a machine whose other core is busy it is near 1.
func BenchmarkCampaignScaling(b *testing.B) {
	dir := b.TempDir()
	var ins []reduction.Input
	for i := range 100 {
		p := filepath.Join(dir, fmt.Sprintf("run%03d.csv", i))
		if err := os.WriteFile(p, carriageCSV(uint64(i+1), fxRows), 0o644); err != nil {
			b.Fatal(err)
		}
		ins = append(ins, reduction.File(p, reduction.FileOptions{}))
	}
	spec := carriageSpec(b)
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(0))
	best := [3]time.Duration{0, time.Duration(math.MaxInt64), time.Duration(math.MaxInt64)}
	var par float64 // the CPU time over the wall time of the best two-core run
	for b.Loop() {
		for range 5 {
			for _, cores := range []int{1, 2} {
				runtime.GOMAXPROCS(cores)
				runtime.GC()
				t0, c0 := time.Now(), cpuTime()
				for _, o := range spec.Campaign(ins, cores) {
					if o.Err != nil {
						b.Fatal(o.Err)
					}
				}
				wall := time.Since(t0)
				if wall < best[cores] {
					best[cores] = wall
					if cores == 2 {
						par = float64(cpuTime()-c0) / float64(wall)
					}
				}
			}
		}
	}
	b.ReportMetric(float64(best[1])/1e6, "one-core-ms")
	b.ReportMetric(float64(best[2])/1e6, "two-core-ms")
	b.ReportMetric(float64(best[1])/float64(best[2]), "speedup")
	// The cores the two-core run got: near 2 on an idle machine, near 1
	// when other work holds a core (then speedup cannot pass it).
	b.ReportMetric(par, "cores-used")
}
