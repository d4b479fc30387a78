package reduction

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

// WriteOptions adjust how results are written.
type WriteOptions struct {
	// BOM starts a text file with a UTF-8 byte-order mark, so that a
	// spreadsheet reads its units (°C, Π₁) as UTF-8; chanfile reads it.
	BOM bool
	// Comma is the field delimiter of a text file; 0 means ','.
	Comma rune
	// Notes are further comment lines written first ("invented data").
	Notes []string
}

// WriteFile writes a file as a whole or not at all: write fills a
// temporary file in path's directory, which is synced and renamed to
// path only when write returns nil. On any failure the temporary file is
// removed and a file already at path is left untouched; write's own error
// is returned as it is, the others as an *Error.
func WriteFile(path string, write func(io.Writer) error) (err error) {
	f, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".*.tmp")
	if err != nil {
		return &Error{File: path, Reason: "create", Err: err}
	}
	tmp := f.Name()
	defer func() {
		if err != nil {
			f.Close()
			os.Remove(tmp)
		}
	}()
	if err = write(f); err != nil {
		return err // as write gave it
	}
	if err = f.Sync(); err != nil {
		return &Error{File: path, Reason: "sync", Err: err}
	}
	if err = f.Close(); err != nil {
		return &Error{File: path, Reason: "close", Err: err}
	}
	if err = os.Rename(tmp, path); err != nil {
		return &Error{File: path, Reason: "rename", Err: err}
	}
	return nil
}

// DefinitionPrefix starts the comment line that carries a group's
// definition in a text file: "# group<TAB>Re<TAB>Π₂ = V·L/ν<TAB>Re
// (Reynolds number)"; ReadDefinitions reads them back.
const DefinitionPrefix = "# group\t"

// ParquetKey is the prefix of the Parquet key-value metadata entry that
// carries a group's definition: the key is ParquetKey + column, the value
// the definition and the label separated by a tab ("Π₂ = V·L/ν<TAB>Re
// (Reynolds number)"); ReadDefinitionsParquet reads them back.
const ParquetKey = "similis.group."

// ParquetMetadata returns the key-value metadata entries that carry the
// groups' definitions in a Parquet file (see ParquetKey), for
// parquetfile.Options.Metadata.
func ParquetMetadata(groups []Group) map[string]string {
	if len(groups) == 0 {
		return nil
	}
	m := make(map[string]string, len(groups))
	for _, g := range groups {
		m[ParquetKey+g.Column] = oneLine(g.Definition) + "\t" + oneLine(g.Label)
	}
	return m
}

// ReadDefinitionsParquet reads the group definitions a Parquet file of
// results carries in its key-value metadata (see ParquetKey), in the
// order of the file's columns (a definition whose column the file lacks
// last, by name); size is the file's size and name names it in
// messages. A file that is not Parquet is the parquetfile reader's
// error; a definition entry that is not well formed is an *Error of
// class quantity.ErrParse naming its key.
func ReadDefinitionsParquet(r io.ReaderAt, size int64, name string) ([]Group, error) {
	pr, err := parquetfile.NewReader(r, size, name, parquetfile.Options{})
	if err != nil {
		return nil, wrap(name, err)
	}
	defer pr.Close()
	at := map[string]int{}
	for i, c := range pr.Columns() {
		at[c.Name] = i
	}
	var out []Group
	for k, v := range pr.Metadata() {
		col, ok := strings.CutPrefix(k, ParquetKey)
		if !ok {
			continue
		}
		def, label, ok := strings.Cut(v, "\t")
		if !ok || col == "" || def == "" || strings.Contains(label, "\t") {
			return nil, &Error{File: name, Reason: fmt.Sprintf("group definition %q: want the definition and the label separated by a tab", k), Err: quantity.ErrParse}
		}
		out = append(out, Group{Column: col, Name: strings.TrimSpace(strings.SplitN(def, "=", 2)[0]), Definition: def, Label: label})
	}
	slices.SortFunc(out, func(a, b Group) int {
		i, ai := at[a.Column]
		j, bj := at[b.Column]
		switch {
		case ai && bj:
			return i - j
		case ai != bj:
			if ai {
				return -1
			}
			return 1
		}
		return strings.Compare(a.Column, b.Column)
	})
	return out, nil
}

func writeHeader(w io.Writer, opt WriteOptions, res *Result, extra []string) error {
	bw := bufio.NewWriter(w)
	if opt.BOM {
		bw.WriteString("\ufeff")
	}
	for _, n := range opt.Notes {
		fmt.Fprintf(bw, "# %s\n", oneLine(n))
	}
	for _, n := range extra {
		fmt.Fprintf(bw, "# %s\n", oneLine(n))
	}
	for _, g := range res.Groups {
		fmt.Fprintf(bw, "%s%s\t%s\t%s\n", DefinitionPrefix, oneLine(g.Column), oneLine(g.Definition), oneLine(g.Label))
	}
	return bw.Flush()
}

// oneLine keeps a comment on one line with no tab inside a field.
func oneLine(s string) string {
	return strings.NewReplacer("\n", " ", "\r", " ", "\t", " ").Replace(s)
}

// ReadDefinitions reads the group definitions a text file of results
// carries in its comment lines (see DefinitionPrefix), up to its header
// row; a byte-order mark is skipped. It reads at most
// chanfile.MaxLineLen bytes a line and 4096 definitions. A definition
// line that is not well formed is an *Error of class quantity.ErrParse
// with its line.
func ReadDefinitions(r io.Reader, name string) ([]Group, error) {
	br := bufio.NewReaderSize(r, chanfile.MaxLineLen)
	var out []Group
	for line := 1; ; line++ {
		b, err := br.ReadSlice('\n')
		if errors.Is(err, bufio.ErrBufferFull) {
			return nil, &Error{File: name, Line: line, Reason: "line too long", Err: quantity.ErrParse}
		}
		s := strings.TrimRight(string(b), "\r\n")
		if line == 1 {
			s = strings.TrimPrefix(s, "\ufeff")
		}
		switch {
		case strings.HasPrefix(s, DefinitionPrefix):
			f := strings.Split(s[len(DefinitionPrefix):], "\t")
			if len(f) != 3 || f[0] == "" || f[1] == "" {
				return nil, &Error{File: name, Line: line, Reason: "group definition: want column, definition and label separated by tabs", Err: quantity.ErrParse}
			}
			if len(out) == 4096 {
				return nil, &Error{File: name, Line: line, Reason: "too many group definitions", Err: quantity.ErrParse}
			}
			out = append(out, Group{Column: f[0], Name: strings.TrimSpace(strings.SplitN(f[1], "=", 2)[0]), Definition: f[1], Label: f[2]})
		case strings.HasPrefix(s, "#") || strings.TrimSpace(s) == "":
		default:
			return out, nil // the header
		}
		if err == io.EOF {
			return out, nil
		}
		if err != nil {
			return nil, &Error{File: name, Line: line, Reason: "read", Err: err}
		}
	}
}

// unitFor returns the unit a channel's values are written in: its unit
// as read when that is a source column, the SI unit otherwise; and the
// unit of its uncertainty, the same unless that is a temperature scale
// (°C), whose differences are written in kelvins.
func unitFor(res *Result, name string, d quantity.Dim) (mean, u units.Unit) {
	mean = units.BaseUnit(d)
	if du, ok := units.DerivedUnit(d); ok {
		mean = du
	}
	for _, c := range res.Columns {
		if c.Name == name && c.Unit.Dim() == d && !c.Gauge {
			mean = c.Unit
		}
	}
	u = mean
	if u.IsScale() {
		u = units.BaseUnit(d)
	}
	return mean, u
}

// pointTable lays out the points as columns: point, label, first and
// last row, drifting; then each channel's mean and standard uncertainty
// of the mean, and its effective number of samples; then each group and
// its standard uncertainty.
func pointTable(res *Result) ([]chanfile.Column, []quantity.Series) {
	n := len(res.Points)
	var cols []chanfile.Column
	var data []quantity.Series
	add := func(name string, u units.Unit, d quantity.Dim, f func(p Point) float64) {
		v := make([]float64, n)
		for i, p := range res.Points {
			v[i] = f(p)
		}
		cols = append(cols, chanfile.Column{Name: name, Unit: u})
		data = append(data, quantity.NewSeries(v, d))
	}
	one := units.One()
	add("point", one, 0, func(p Point) float64 { return float64(indexOf(res.Points, p.Tag) + 1) })
	add("label", one, 0, func(p Point) float64 {
		if p.HasLabel {
			return p.Label
		}
		return math.NaN()
	})
	add("first row", one, 0, func(p Point) float64 { return float64(p.Window.Start + 1) })
	add("last row", one, 0, func(p Point) float64 { return float64(p.Window.End) })
	add("drifting", one, 0, func(p Point) float64 {
		if p.Drifting() {
			return 1
		}
		return 0
	})
	if n > 0 {
		for k, v := range res.Points[0].Channels {
			d := v.Mean.Dim()
			mu, uu := unitFor(res, v.Name, d)
			add(v.Name, mu, d, func(p Point) float64 { return p.Channels[k].Mean.Value() })
			add("u("+v.Name+")", uu, d, func(p Point) float64 { return p.Channels[k].Mean.U().Value() })
			add("n_eff("+v.Name+")", one, 0, func(p Point) float64 { return p.Channels[k].Stats.NEff })
		}
	}
	for g, gr := range res.Groups {
		add(gr.Column, one, 0, func(p Point) float64 { return p.Groups[g].Value() })
		add("u("+gr.Column+")", one, 0, func(p Point) float64 { return p.Groups[g].U().Value() })
	}
	return cols, data
}

func indexOf(ps []Point, tag string) int {
	for i, p := range ps {
		if p.Tag == tag {
			return i
		}
	}
	return -1
}

// WritePoints writes a result's points as a channel file: CSV (TSV with
// Comma '\t') whose comment lines carry each point's tag and each
// group's definition, then one row per point. Columns: point, label (the
// run's label, NaN for none), first row and last row (from 1), drifting
// (1 when a channel drifted beyond its limit), then for each channel its
// mean, u(name), the standard uncertainty of the mean, and n_eff(name),
// the effective number of independent samples; then each group, named
// by the trade's symbol where it is one, and u(group). Means are in the
// unit the channel was read in (SI for a derived channel). Numbers are
// written with the shortest digits that read back to the same float64
// (20.228875000000016, say), on purpose: a file loses nothing, and a
// report rounds when it prints (uncertain.Measured.String, or %.4g of a
// units.Value). What it writes, chanfile.Reader reads back.
func WritePoints(w io.Writer, res *Result, opt WriteOptions) error {
	var extra []string
	extra = append(extra, fmt.Sprintf("reduced from %s: %d steady points, each channel's mean with the standard uncertainty of the mean, u = s/sqrt(n_eff)", res.File, len(res.Points)))
	for i, p := range res.Points {
		extra = append(extra, fmt.Sprintf("point %d: %s, rows %d to %d", i+1, p.Tag, p.Window.Start+1, p.Window.End))
	}
	if err := writeHeader(w, opt, res, extra); err != nil {
		return err
	}
	cols, data := pointTable(res)
	cw, err := chanfile.NewWriter(w, res.File, cols, chanfile.Options{Comma: opt.Comma})
	if err != nil {
		return err
	}
	if err := cw.Write(data); err != nil {
		return err
	}
	return cw.Flush()
}

// WritePointsParquet writes a result's points as a Parquet file with the
// columns of WritePoints; the groups' definitions travel in the file's
// key-value metadata (ParquetKey), which ReadDefinitionsParquet reads.
func WritePointsParquet(w io.Writer, res *Result) error {
	cols, data := pointTable(res)
	pw, err := parquetfile.NewWriter(w, res.File, cols, parquetfile.Options{Metadata: ParquetMetadata(res.Groups)})
	if err != nil {
		return err
	}
	if err := pw.Write(data); err != nil {
		pw.Close()
		return err
	}
	return pw.Close()
}

// SavePoints writes a result's points to path, whole or not at all (see
// WriteFile): Parquet when path ends in .parquet, TSV in .tsv, CSV
// otherwise.
func SavePoints(path string, res *Result, opt WriteOptions) error {
	return WriteFile(path, func(w io.Writer) error {
		switch strings.ToLower(filepath.Ext(path)) {
		case ".parquet":
			return WritePointsParquet(w, res)
		case ".tsv":
			opt.Comma = '\t'
		}
		return WritePoints(w, res, opt)
	})
}

// RowsWriter writes the groups of every row (the all-rows mode) as a
// channel file whose comment lines carry the groups' definitions, one
// column per group named as in Result.Groups; give it as Input.Rows.
type RowsWriter struct {
	cw *chanfile.Writer
}

// NewRowsWriter writes the comment lines and header for groups to w.
func NewRowsWriter(w io.Writer, name string, groups []Group, opt WriteOptions) (*RowsWriter, error) {
	if err := writeHeader(w, opt, &Result{Groups: groups}, nil); err != nil {
		return nil, err
	}
	cols := make([]chanfile.Column, len(groups))
	for g, gr := range groups {
		cols[g] = chanfile.Column{Name: gr.Column, Unit: units.One()}
	}
	cw, err := chanfile.NewWriter(w, name, cols, chanfile.Options{Comma: opt.Comma})
	if err != nil {
		return nil, err
	}
	return &RowsWriter{cw}, nil
}

// Write writes the groups of a chunk of rows.
func (r *RowsWriter) Write(groups []quantity.Series) error { return r.cw.Write(groups) }

// Flush writes any buffered rows.
func (r *RowsWriter) Flush() error { return r.cw.Flush() }

// Groups returns the groups a spec's Pi set gives, with their column
// names, as Result.Groups will hold them, so that a RowsWriter can be
// made before the reduction.
func (s *Spec) Groups() []Group {
	if s.Set == nil {
		return nil
	}
	return groupsOf(s.Set)
}
