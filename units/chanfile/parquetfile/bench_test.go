package parquetfile

import (
	"bytes"
	"io"
	"math/rand/v2"
	"testing"

	"github.com/parquet-go/parquet-go"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

// benchFile is 10⁵ rows × 8 channels in mixed units, written once.
func benchFile(b *testing.B) []byte {
	b.Helper()
	names := []string{"t [s]", "Q m3/h", "P1 (kPa)", "P2 (kPa)", "T_in [°C]", "Torque (N.m)", "n [rpm]", "V [kn]"}
	cols := make([]chanfile.Column, len(names))
	series := make([]quantity.Series, len(names))
	rng := rand.New(rand.NewPCG(7, 7))
	for j, h := range names {
		c, err := chanfile.ParseHeaderField(h)
		if err != nil {
			b.Fatal(err)
		}
		cols[j] = c
		v := make([]float64, 100_000)
		for i := range v {
			v[i] = c.Unit.Factor()*(1+rng.Float64()) + c.Unit.Offset()
		}
		series[j] = quantity.NewSeries(v, c.Unit.Dim())
	}
	var buf bytes.Buffer
	w, err := NewWriter(&buf, "t.parquet", cols, Options{})
	if err != nil {
		b.Fatal(err)
	}
	if err := w.Write(series); err != nil {
		b.Fatal(err)
	}
	if err := w.Close(); err != nil {
		b.Fatal(err)
	}
	return buf.Bytes()
}

// BenchmarkReadParquet reads the file in chunks of 4096 rows: float64 is
// the Parquet library's own row reader into plain slices (the baseline),
// parquetfile the same plus units, SI conversion and the checks.
func BenchmarkReadParquet(b *testing.B) {
	data := benchFile(b)
	b.Run("float64", func(b *testing.B) {
		b.SetBytes(int64(len(data)))
		rows := make([]parquet.Row, 4096)
		vals := make([][]float64, 8)
		for b.Loop() {
			f, err := parquet.OpenFile(bytes.NewReader(data), int64(len(data)))
			if err != nil {
				b.Fatal(err)
			}
			r := parquet.NewGenericReader[any](f)
			for {
				n, err := r.ReadRows(rows)
				for j := range vals {
					vals[j] = vals[j][:0]
				}
				for _, row := range rows[:n] {
					for _, v := range row {
						vals[v.Column()] = append(vals[v.Column()], v.Double())
					}
				}
				if err == io.EOF {
					break
				}
				if err != nil {
					b.Fatal(err)
				}
			}
		}
	})
	b.Run("parquetfile", func(b *testing.B) {
		b.SetBytes(int64(len(data)))
		var dst []quantity.Series
		for b.Loop() {
			r, err := NewReader(bytes.NewReader(data), int64(len(data)), "bench", Options{})
			if err != nil {
				b.Fatal(err)
			}
			for {
				dst, _, err = r.Read(dst, 4096)
				if err == io.EOF {
					break
				}
				if err != nil {
					b.Fatal(err)
				}
			}
		}
	})
}
