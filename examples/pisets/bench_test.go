package main

import (
	"bufio"
	"bytes"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"testing"
)

// writeBenchFile writes 10⁶ rows × 8 channels of invented pump-loop data.
func writeBenchFile(b *testing.B) string {
	path := filepath.Join(b.TempDir(), "bench.csv")
	f, err := os.Create(path)
	if err != nil {
		b.Fatal(err)
	}
	w := bufio.NewWriter(f)
	w.WriteString("t [s],Q m3/h,P1 (kPa),P2 (kPa),n [rpm],T_in °C,Tq (N.m),mu (mPa.s)\n")
	var line []byte
	for i := range 1_000_000 {
		x := float64(i)
		line = line[:0]
		for j, v := range [8]float64{x * 0.01, 100 + 80*math.Sin(x/1e3), 20 + math.Cos(x), 250 + 10*math.Sin(x/7), 1450 + math.Sin(x), 18.2, 84 + math.Sin(x/3), 1.05} {
			if j > 0 {
				line = append(line, ',')
			}
			line = strconv.AppendFloat(line, v, 'g', 8, 64)
		}
		line = append(line, '\n')
		w.Write(line)
	}
	if err := w.Flush(); err != nil {
		b.Fatal(err)
	}
	f.Close()
	return path
}

// BenchmarkReduce reads a 10⁶-row, 8-channel file, evaluates 4 groups and
// writes them: the pisets data mode (pisets) against a plain loop that
// splits the same bytes, calls strconv.ParseFloat, converts the units by
// hand, computes the same 4 groups and formats them (float64).
func BenchmarkReduce(b *testing.B) {
	path := writeBenchFile(b)
	b.Run("float64", func(b *testing.B) {
		data, err := os.ReadFile(path)
		if err != nil {
			b.Fatal(err)
		}
		b.SetBytes(int64(len(data)))
		for range b.N {
			f, _ := os.Open(path)
			br := bufio.NewReaderSize(f, 1<<16)
			br.ReadSlice('\n')
			w := bufio.NewWriterSize(io.Discard, 1<<16)
			var v [8]float64
			var out []byte
			const d, rho = 0.25, 998.2
			for {
				line, err := br.ReadSlice('\n')
				if err == io.EOF {
					break
				}
				j, start := 0, 0
				for i, c := range line {
					if c == ',' || c == '\n' {
						x, err := strconv.ParseFloat(string(line[start:i]), 64)
						if err != nil {
							b.Fatal(err)
						}
						v[j] = x
						j++
						start = i + 1
					}
				}
				q, dp, n, tq, mu := v[1]/3600, (v[3]-v[2])*1e3, v[4]*2*math.Pi/60, v[6], v[7]*1e-3
				out = out[:0]
				out = strconv.AppendFloat(out, dp/(rho*n*n*d*d), 'g', -1, 64)
				out = append(out, ',')
				out = strconv.AppendFloat(out, q/(n*d*d*d), 'g', -1, 64)
				out = append(out, ',')
				out = strconv.AppendFloat(out, mu/(rho*n*d*d), 'g', -1, 64)
				out = append(out, ',')
				out = strconv.AppendFloat(out, tq/(rho*n*n*d*d*d*d*d), 'g', -1, 64)
				out = append(out, '\n')
				w.Write(out)
			}
			w.Flush()
			f.Close()
		}
	})
	b.Run("pisets", func(b *testing.B) {
		args := []string{"-data", path, "-derive", "dp = P2 - P1; D = 0.25 {m}; rho = 998.2 {kg/m^3}",
			"-dep", "dp", "-repeat", "n,D,rho", "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3", "mu=Pa*s", "Tq=N*m"}
		st, _ := os.Stat(path)
		b.SetBytes(st.Size())
		for range b.N {
			var errb bytes.Buffer
			if code := run(args, io.Discard, &errb); code != 0 {
				b.Fatalf("exit %d: %s", code, errb.String())
			}
		}
	})
}
