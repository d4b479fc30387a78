package parquetfile_test

import (
	"bytes"
	"fmt"
	"io"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

// A towing-tank run (invented values) written with its units in the file
// and read back in SI: 2 kn is 1.0289 m/s; the missing resistance stays
// missing and is counted.
func ExampleNewWriter() {
	v, _ := chanfile.ParseHeaderField("V [kn]")
	r, _ := chanfile.ParseHeaderField("R_T [N]")
	var file bytes.Buffer
	w, err := parquetfile.NewWriter(&file, "run.parquet", []chanfile.Column{v, r}, parquetfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	w.Write([]quantity.Series{
		quantity.NewSeries([]float64{1.0288888888888889, 1.5433333333333332}, quantity.Velocity),
		quantity.NewSeries([]float64{21.4, math.NaN()}, quantity.Force), // the second run's reading lost
	})
	if err := w.Close(); err != nil {
		fmt.Println(err)
		return
	}

	rd, err := parquetfile.NewReader(bytes.NewReader(file.Bytes()), int64(file.Len()), "run7.parquet", parquetfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	s, n, err := rd.Read(nil, 0)
	for err == nil {
		for i := 0; i < n; i++ {
			fmt.Printf("V = %.4f m/s, R_T = %v N\n", s[0].Values()[i], s[1].Values()[i])
		}
		s, n, err = rd.Read(s, 0)
	}
	if err != io.EOF {
		fmt.Println(err)
	}
	for _, c := range rd.Columns() {
		fmt.Printf("%s in %v, %d missing\n", c.Name, c.Unit, c.Missing)
	}
	// Output:
	// V = 1.0289 m/s, R_T = 21.4 N
	// V = 1.5433 m/s, R_T = NaN N
	// V in kn, 0 missing
	// R_T in N, 1 missing
}
