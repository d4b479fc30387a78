package reduction

import (
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"sync"

	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

// Outcome is one file's reduction in a campaign: its result, or the
// error that stopped it.
type Outcome struct {
	Result *Result
	Err    error
}

// Campaign reduces every input with the spec, one file per worker, on
// workers goroutines (0 or less: runtime.GOMAXPROCS(0)), and returns the
// outcomes in the order of inputs, whatever the order they finish in.
// A file that fails does not stop the others. Each input should be
// opened by its Open (see File) so that at most workers files are open
// at once.
func (s *Spec) Campaign(inputs []Input, workers int) []Outcome {
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	workers = min(workers, len(inputs))
	out := make([]Outcome, len(inputs))
	next := make(chan int)
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				r, err := s.Reduce(inputs[i])
				out[i] = Outcome{r, err}
			}
		}()
	}
	for i := range inputs {
		next <- i
	}
	close(next)
	wg.Wait()
	return out
}

// FileOptions say how File reads a channel file.
type FileOptions struct {
	// CSV are the options of a text file (Comma is set to '\t' for a
	// name ending in .tsv when it is 0).
	CSV chanfile.Options
	// Parquet are the options of a Parquet file.
	Parquet parquetfile.Options
}

// File returns the input of the channel file at path: Parquet when the
// name ends in .parquet, TSV in .tsv, CSV otherwise. The file is opened
// when the reduction starts and closed when it ends, and messages about
// a text file name its line.
func File(path string, opt FileOptions) Input {
	in := Input{Name: path}
	ext := strings.ToLower(filepath.Ext(path))
	in.Open = func() (chanfile.Source, error) {
		f, err := os.Open(path)
		if err != nil {
			return nil, &Error{File: path, Reason: "open", Err: err}
		}
		if ext == ".parquet" {
			st, err := f.Stat()
			if err != nil {
				f.Close()
				return nil, &Error{File: path, Reason: "stat", Err: err}
			}
			pr, err := parquetfile.NewReader(f, st.Size(), path, opt.Parquet)
			if err != nil {
				f.Close()
				return nil, err
			}
			return &parquetSource{pr, f}, nil
		}
		o := opt.CSV
		if ext == ".tsv" && o.Comma == 0 {
			o.Comma = '\t'
		}
		cr, err := chanfile.NewReader(f, path, o)
		if err != nil {
			f.Close()
			return nil, err
		}
		return &csvSource{cr, f}, nil
	}
	if ext != ".parquet" {
		in.LineOf = func(row int) int { return LineOfRow(path, row) }
	}
	return in
}

// csvSource is a text channel file being read; Close closes the file.
type csvSource struct {
	*chanfile.Reader
	f *os.File
}

func (c *csvSource) Close() error { return c.f.Close() }

// parquetSource is a Parquet channel file being read.
type parquetSource struct {
	*parquetfile.Reader
	f *os.File
}

func (p *parquetSource) Close() error {
	err := p.Reader.Close()
	if ferr := p.f.Close(); err == nil {
		err = ferr
	}
	return err
}
