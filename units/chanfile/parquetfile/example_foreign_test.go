package parquetfile_test

import (
	"bytes"
	"fmt"

	"github.com/parquet-go/parquet-go"

	"similis.dev/similis/units/chanfile/parquetfile"
)

// A lab's raw export (invented values), written by another program: a
// millisecond timestamp, the run's label, a force as DECIMAL(9,3) in
// newtons, and a JSON note the reduction does not need. The reader is
// given the three columns wanted; the note is never decoded.
func ExampleReader_Labels() {
	type row struct {
		T    int64  `parquet:"t,timestamp(millisecond)"`
		Run  string `parquet:"run"`
		F    int32  `parquet:"F [N],decimal(3:9)"`
		Note string `parquet:"note,json"`
	}
	var file bytes.Buffer
	w := parquet.NewGenericWriter[row](&file, parquet.Compression(&parquet.Gzip))
	w.Write([]row{
		{1_700_000_000_000, "R1", 12345, `{"ok":true}`},
		{1_700_000_000_250, "R1", 12400, `{}`},
		{1_700_000_001_500, "R2", -75, `{}`},
	})
	w.Close()

	rd, err := parquetfile.NewReader(bytes.NewReader(file.Bytes()), int64(file.Len()), "export.parquet",
		parquetfile.Options{Columns: []string{"t", "run", "F [N]"}})
	if err != nil {
		fmt.Println(err)
		return
	}
	dst, n, err := rd.Read(nil, 100)
	if err != nil {
		fmt.Println(err)
		return
	}
	origin, _ := rd.Origin(0)
	fmt.Println("first sample:", origin.Time.Format("2006-01-02 15:04:05.000"), "UTC:", origin.UTC)
	for i := range n {
		fmt.Printf("t = %5.3f s  run %s  F = %v N\n", dst[0].Values()[i], rd.Labels(1)[i], dst[2].Values()[i])
	}
	// Output:
	// first sample: 2023-11-14 22:13:20.000 UTC: true
	// t = 0.000 s  run R1  F = 12.345 N
	// t = 0.250 s  run R1  F = 12.4 N
	// t = 1.500 s  run R2  F = -0.075 N
}
