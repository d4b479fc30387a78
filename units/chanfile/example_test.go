package chanfile_test

import (
	"fmt"
	"os"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// A towing-tank log (invented data) is read in SI with every lenient
// reading of its header reported, and written back in chosen units.
func Example() {
	const log = `# towing tank, run 7 (invented data)
t [s], V [kn], R_T (N), T_w °C, Torque (in-lb)
0.0, 4.0, 41.8, 15.2, 12
0.5, 4.1, , 15.2, 12.5
`
	r, err := chanfile.NewReader(strings.NewReader(log), "run7.csv", chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	s, n, err := r.Read(nil, 0)
	if err != nil {
		fmt.Println(err)
		return
	}
	for j, c := range r.Columns() {
		fmt.Printf("%-7s %-6s → SI %.6g, missing %d", c.Name, c.Text, s[j].Values(), c.Missing)
		for _, rd := range c.Readings {
			fmt.Printf("; %v", rd)
		}
		fmt.Println()
	}
	w, err := chanfile.NewWriter(os.Stdout, "stdout", []chanfile.Column{
		{Name: "V", Unit: units.MustParse("m/s")},
		{Name: "R_T", Unit: units.MustParse("N")},
	}, chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	if err := w.Write([]quantity.Series{s[1], s[2]}); err != nil {
		fmt.Println(err)
	}
	w.Flush()
	fmt.Println(n, "rows")
	// Output:
	// t       s      → SI [0 0.5], missing 0
	// V       kn     → SI [2.05778 2.10922], missing 0
	// R_T     N      → SI [41.8 NaN], missing 1
	// T_w     °C     → SI [288.35 288.35], missing 0
	// Torque  in-lb  → SI [1.35582 1.41231], missing 0; in-lb read as in*lbf (a torque: the pound is the pound-force)
	// V [m/s],R_T [N]
	// 2.057777777777778,41.8
	// 2.1092222222222223,NaN
	// 2 rows
}

// An export as a European data system writes it (invented data): ';'
// between fields, decimal commas, units in a row under the names, ISO
// 8601 timestamps and a run tag. The Reader detects the format and says
// so; only the columns asked for are read, one of them renamed.
func ExampleReader_export() {
	const export = `# invented data
Zeit;Pump speed;Q;Tag;Comment
;[U/min];[m3/h];;
2026-03-04 10:15:30,0;1450;41,2;run 12;ok
2026-03-04 10:15:30,5;1452;41,4;run 12;pump warm?!
`
	r, err := chanfile.NewReader(strings.NewReader(export), "loop.csv", chanfile.Options{
		Columns: []string{"Zeit", "n", "Q", "Tag"},
		Aliases: map[string]string{"Pump speed": "n"},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, rd := range r.Format().Readings {
		fmt.Println(rd)
	}
	s, _, err := r.Read(nil, 0)
	if err != nil {
		fmt.Println(err)
		return
	}
	for j, c := range r.Columns() {
		switch c.Kind {
		case chanfile.Label:
			fmt.Printf("%-4s %v %q\n", c.Name, c.Kind, r.Labels(j))
		case chanfile.Timestamp:
			fmt.Printf("%-4s %v from %s: %.6g s\n", c.Name, c.Kind, c.Start.Format("2006-01-02 15:04:05"), s[j].Values())
		default:
			fmt.Printf("%-4s %v in %s: SI %.6g\n", c.Name, c.Kind, c.Text, s[j].Values())
		}
	}
	// Output:
	// delimiter read as ';' (5 fields on each line in the first 4 lines; set Options.Comma to choose)
	// decimal mark read as ',' (2 numbers of the first lines written with a decimal comma; set Options.Decimal to choose)
	// line 3 read as the units of the columns (no field is a number or a time and some are units)
	// Zeit timestamp from 2026-03-04 10:15:30: [0 0.5] s
	// n    number in U/min: SI [151.844 152.053]
	// Q    number in m3/h: SI [0.0114444 0.0115]
	// Tag  label ["run 12" "run 12"]
}

// A harness learns from the header which columns it needs, then asks
// the reader for those alone: the spare channel's bad value (invented
// data) is never parsed.
func ExampleSelect() {
	const log = `t [s],V [m/s],Spare [V],Operator
0.0,1.50,0.1,A
0.5,1.52,ERR,A
`
	r, err := chanfile.NewReader(strings.NewReader(log), "run8.csv", chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	var idx []int
	for k, c := range r.Columns() {
		if c.Name == "V" || c.Name == "t" {
			idx = append(idx, k)
		}
	}
	src, err := chanfile.Select(r, idx...) // the reader is a Selector
	if err != nil {
		fmt.Println(err)
		return
	}
	s, n, err := src.Read(nil, 0)
	fmt.Println(n, err, s[0].Values(), s[1].Values())
	// Output:
	// 2 <nil> [0 0.5] [1.5 1.52]
}

// A logger export (invented data) whose spare channel has a unit the
// dialect does not read: the file still opens, the column is listed with
// its fault, and the harness reads the others.
func ExampleReader_Select() {
	const log = `t [s];V [m/s];Temp [degF?]
0;1,50;68
0,5;1,52;69
`
	r, err := chanfile.NewReader(strings.NewReader(log), "run9.csv", chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	var idx []int
	for k, c := range r.Columns() {
		if c.Fault != nil {
			fmt.Printf("not read: column %d %q\n", c.Index, c.Header)
			continue
		}
		idx = append(idx, k)
	}
	if err := r.Select(idx); err != nil {
		fmt.Println(err)
		return
	}
	s, n, err := r.Read(nil, 0)
	fmt.Println(n, err, s[0].Values(), s[1].Values())
	// Selected, the column is refused with its fault.
	fmt.Println(r.Select([]int{2}))
	// Output:
	// not read: column 3 "Temp [degF?]"
	// 2 <nil> [0 0.5] [1.5 1.52]
	// chanfile: run9.csv:1:3: "Temp [degF?]": not a unit: units: "degF?": at offset 0: syntax error: not a unit even as a data sheet writes it (read as "degF?"): units: "degF?": at offset 4: syntax error: unexpected '?' (missing operator?)
}

// A short file read whole: every channel as one Series in SI, with the
// text of its label column (36 m3/h is 0.01 m3/s), ready for package steady (see the fromFile
// example of package steady). The bound refuses a file longer than
// expected instead of filling memory.
func ExampleReadAll() {
	const log = `# invented pump-loop log
t;tag;Q;H
s;-;m3/h;m
0;A;36,0;12,5
1;A;36,0;
2;B;72,0;12,1
`
	r, err := chanfile.NewReader(strings.NewReader(log), "loop.csv", chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	w, err := chanfile.ReadAll(r, 1000)
	if err != nil {
		fmt.Println(err)
		return
	}
	for k, c := range w.Columns {
		fmt.Printf("%-3s %-9v %.4g %q (missing %d)\n", c.Name, c.Kind, w.Series[k].Values(), w.Labels[k], c.Missing)
	}
	r, _ = chanfile.NewReader(strings.NewReader(log), "loop.csv", chanfile.Options{})
	_, err = chanfile.ReadAll(r, 2)
	fmt.Println(err)
	// Output:
	// t   number    [0 1 2] [] (missing 0)
	// tag label     [] ["A" "A" "B"] (missing 0)
	// Q   number    [0.01 0.01 0.02] [] (missing 0)
	// H   number    [12.5 NaN 12.1] [] (missing 1)
	// chanfile: loop.csv:6: ReadAll: more than 2 rows, the bound given: read a longer file chunk by chunk with Read, or reduce it with package similarity/reduction, which works in bounded memory
}
