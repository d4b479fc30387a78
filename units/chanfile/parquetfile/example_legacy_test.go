package parquetfile_test

import (
	"bytes"
	"fmt"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/deprecated"

	"similis.dev/similis/units/chanfile/parquetfile"
)

// A rig's logger export (invented values) with a valve state as a
// BOOLEAN, the clock time as a TIME in milliseconds, and the legacy
// INT96 timestamp older writers use: 8 bytes of nanoseconds in the day
// and 4 of the Julian day (2460000 is 2023-02-24). The valve reads as
// 1 and 0; the clock as seconds since midnight (10:00 is 36000 s); the
// timestamp as seconds from its first sample; P in Pa.
func ExampleReader_Kind() {
	int96 := func(day uint32, ns uint64) deprecated.Int96 {
		return deprecated.Int96{uint32(ns), uint32(ns >> 32), day}
	}
	type row struct {
		Valve bool             `parquet:"valve [1]"`
		Clock int32            `parquet:"clock,time(millisecond)"`
		Stamp deprecated.Int96 `parquet:"stamp"`
		P     float64          `parquet:"P [kPa]"`
	}
	var file bytes.Buffer
	w := parquet.NewGenericWriter[row](&file)
	w.Write([]row{
		{true, 36000000, int96(2460000, 36000000000000), 101.2},  // 10:00:00.000
		{false, 36000250, int96(2460000, 36000250000000), 101.4}, // 10:00:00.250
		{true, 36001500, int96(2460000, 36001500000000), 101.3},  // 10:00:01.500
	})
	w.Close()

	rd, err := parquetfile.NewReader(bytes.NewReader(file.Bytes()), int64(file.Len()), "logger.parquet", parquetfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	dst, _, err := rd.Read(nil, 100)
	if err != nil {
		fmt.Println(err)
		return
	}
	for j, c := range rd.Columns() {
		fmt.Printf("%-5s %-11s in %-3v read in SI: %v\n", c.Name, rd.Kind(j), c.Unit, dst[j].Values())
	}
	origin, _ := rd.Origin(2)
	fmt.Println("stamp from", origin.Time.Format("2006-01-02 15:04:05"), "of no stated zone:", !origin.UTC)
	// Output:
	// valve number      in 1   read in SI: [1 0 1]
	// clock time of day in s   read in SI: [36000 36000.25 36001.5]
	// stamp time        in s   read in SI: [0 0.25 1.5]
	// P     number      in kPa read in SI: [101200 101400 101300]
	// stamp from 2023-02-24 10:00:00 of no stated zone: true
}
