package chanfile_test

import (
	"bytes"
	"io"
	"math"
	"runtime"
	"strconv"
	"sync"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

const benchRows = 1_000_000

var benchFile = sync.OnceValue(func() []byte {
	b, err := io.ReadAll(&genReader{rows: benchRows})
	if err != nil {
		panic(err)
	}
	return b
})

// BenchmarkReadCSV reads 10⁶ rows × 8 channels into Series in chunks of
// 4096 rows (chanfile), against a plain loop that splits the same bytes
// at commas and newlines and calls strconv.ParseFloat (float64).
func BenchmarkReadCSV(b *testing.B) {
	data := benchFile()
	b.Run("float64", func(b *testing.B) {
		b.SetBytes(int64(len(data)))
		cols := make([][]float64, 8)
		for range b.N {
			body := data[bytes.IndexByte(data, '\n')+1:]
			for j := range cols {
				cols[j] = cols[j][:0]
			}
			j, start := 0, 0
			for i, c := range body {
				if c == ',' || c == '\n' {
					x, err := strconv.ParseFloat(string(body[start:i]), 64)
					if err != nil {
						b.Fatal(err)
					}
					cols[j] = append(cols[j], x)
					if len(cols[j]) == 4096 {
						cols[j] = cols[j][:0]
					}
					j = (j + 1) % 8
					start = i + 1
				}
			}
		}
	})
	b.Run("chanfile", func(b *testing.B) {
		b.SetBytes(int64(len(data)))
		var dst []quantity.Series
		for range b.N {
			r, err := chanfile.NewReader(bytes.NewReader(data), "bench.csv", chanfile.Options{})
			if err != nil {
				b.Fatal(err)
			}
			rows := 0
			for {
				var n int
				dst, n, err = r.Read(dst, 4096)
				if err == io.EOF {
					break
				}
				if err != nil {
					b.Fatal(err)
				}
				rows += n
			}
			if rows != benchRows {
				b.Fatalf("%d rows", rows)
			}
		}
	})
}

// genReader produces the rows of the benchmark files on the fly, so a
// file of 10⁷ rows is read without being held in memory.
type genReader struct {
	rows, i int
	buf     []byte
	head    bool
}

func (g *genReader) Read(p []byte) (int, error) {
	if !g.head {
		g.head = true
		g.buf = append(g.buf, "t [s],V [kn],Q m3/h,P1 (kPa),P2 (kPa),T_in °C,Torque (N.m),n [rpm]\n"...)
	}
	for len(g.buf) < len(p) && g.i < g.rows {
		x := float64(g.i)
		for j, v := range [8]float64{x * 0.01, 4 + math.Sin(x)/10, 41.2 + math.Cos(x), 212.5 + x/1e5, 180 - x/1e6, 15.2, 84.1 + math.Sin(x/7), 1450} {
			if j > 0 {
				g.buf = append(g.buf, ',')
			}
			g.buf = strconv.AppendFloat(g.buf, v, 'g', 8, 64)
		}
		g.buf = append(g.buf, '\n')
		g.i++
	}
	if len(g.buf) == 0 {
		return 0, io.EOF
	}
	n := copy(p, g.buf)
	g.buf = g.buf[:copy(g.buf, g.buf[n:])]
	return n, nil
}

// BenchmarkReadCSVMemory reads 10⁷ rows × 8 channels in chunks of 4096
// rows and reports the peak of the runtime's own memory counters
// (runtime.MemStats.Sys, sampled every 64 chunks) as peak-MiB. Sys is
// what the process has taken from the system and never falls, so run
// this benchmark alone (-bench 'ReadCSVMemory$'): after BenchmarkReadCSV
// it also counts that benchmark's 60 MB file.
func BenchmarkReadCSVMemory(b *testing.B) {
	const rows = 10_000_000
	var peak uint64
	var ms runtime.MemStats
	for range b.N {
		r, err := chanfile.NewReader(&genReader{rows: rows}, "gen.csv", chanfile.Options{})
		if err != nil {
			b.Fatal(err)
		}
		var dst []quantity.Series
		total := 0
		for {
			var n int
			dst, n, err = r.Read(dst, 4096)
			if err == io.EOF {
				break
			}
			if err != nil {
				b.Fatal(err)
			}
			total += n
			if total%(4096*64) == 0 {
				runtime.ReadMemStats(&ms)
				peak = max(peak, ms.Sys)
			}
		}
		if total != rows {
			b.Fatalf("%d rows", total)
		}
	}
	runtime.ReadMemStats(&ms)
	peak = max(peak, ms.Sys)
	b.ReportMetric(float64(peak)/(1<<20), "peak-MiB")
}
