package parquetfile

import (
	"bytes"
	"compress/gzip"
	"encoding/binary"
	"errors"
	"flag"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/format"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

var update = flag.Bool("update", false, "rewrite the crafted files under testdata")

// The crafted files: each is a valid file of the package's writer with
// one thing changed, and each must be refused with an *Error.
const (
	fileZstdContent = "zstd-declares-60GiB.parquet"      // a zstd frame declaring 60 GiB of content
	fileZstdWindow  = "zstd-window-512MiB.parquet"       // a zstd frame with a 512 MiB window
	fileSnappy      = "snappy-declares-3GiB.parquet"     // a snappy block declaring 3 GiB
	fileFooterRows  = "footer-declares-2e40rows.parquet" // a footer declaring 2⁴⁰ rows
	fileGroupRows   = "group-declares-2e40rows.parquet"  // a row group (and footer) declaring 2⁴⁰ rows
	fileFooterList  = "footer-list-2e31.parquet"         // a footer whose list of row groups declares 2³¹−1 of them
	fileFooterBytes = "footer-string-2GiB.parquet"       // a footer whose key-value string declares 2 GiB
	filePageBytes   = "page-header-string-2GiB.parquet"  // a page header whose statistics string declares 2 GiB
	fileGzipBomb    = "gzip-inflates-1MiB.parquet"       // a gzip page declaring its true size whose stream inflates to 1 MiB more
)

// toGzip marks every column chunk of a file GZIP-compressed.
func toGzip(md *format.FileMetaData) {
	for g := range md.RowGroups {
		for c := range md.RowGroups[g].Columns {
			md.RowGroups[g].Columns[c].MetaData.Codec = format.Gzip
		}
	}
}

// gzipPage returns d as one gzip member (parquet-go's codec).
func gzipPage(d []byte) []byte {
	g, err := parquet.Gzip.Encode(nil, d)
	if err != nil {
		panic(err)
	}
	return g
}

// gzipBomb returns d as one gzip member followed by members that each
// inflate to 1 MiB of zeros (about 1 KiB each), n of them.
func gzipBomb(d []byte, n int) []byte {
	out := gzipPage(d)
	var buf bytes.Buffer
	z, _ := gzip.NewWriterLevel(&buf, gzip.BestCompression)
	z.Write(make([]byte, 1<<20))
	z.Close()
	for range n {
		out = append(out, buf.Bytes()...)
	}
	return out
}

// bareFooter returns a file of nothing but the footer given (Thrift
// compact protocol bytes).
func bareFooter(footer []byte) []byte {
	b := append([]byte("PAR1"), footer...)
	b = binary.LittleEndian.AppendUint32(b, uint32(len(footer)))
	return append(b, "PAR1"...)
}

// validFile is the file the crafted ones start from: one column of four
// velocities, written by Writer.
func validFile(t tb) []byte {
	c := col("V", "m/s")
	return write(t, []chanfile.Column{c}, Options{}, quantity.NewSeries([]float64{1, 2, 3, 4}, quantity.Velocity))
}

// rawZstd returns content as one zstd frame of one raw block, whose
// header declares fcs bytes of content and a window of 2^(10+wexp) bytes
// (RFC 8878 §3.1.1).
func rawZstd(content []byte, fcs uint64, wexp byte) []byte {
	f := binary.LittleEndian.AppendUint32(nil, 0xFD2FB528)
	f = append(f, 0xC0, wexp<<3) // 8-byte content size, window descriptor
	f = binary.LittleEndian.AppendUint64(f, fcs)
	h := uint32(len(content))<<3 | 1 // a raw block, the last
	f = append(f, byte(h), byte(h>>8), byte(h>>16))
	return append(f, content...)
}

// levels returns the length of the levels that lead a data page v2,
// stored uncompressed before the compressed values.
func levels(p *page) int {
	if v := p.header.DataPageHeaderV2; v.Valid {
		return int(v.V.RepetitionLevelsByteLength + v.V.DefinitionLevelsByteLength)
	}
	return 0
}

// recompress replaces the compressed part of a page's body by what f
// makes of its uncompressed bytes.
func recompress(p *page, f func(data []byte) []byte) []byte {
	k := levels(p)
	d := decoded(p)
	return append(bytes.Clone(p.body[:k]), f(d)...)
}

// decoded returns the uncompressed values of a page (after its levels,
// for a data page v2).
func decoded(p *page) []byte {
	var codec interface {
		Decode(dst, src []byte) ([]byte, error)
	} = &parquet.Zstd
	if p.codec == format.Snappy {
		codec = &parquet.Snappy
	}
	out, err := codec.Decode(nil, p.body[levels(p):])
	if err != nil {
		panic(err)
	}
	return out
}

// hostileFiles builds the crafted files.
func hostileFiles(t *testing.T) map[string][]byte {
	b := validFile(t)
	files := map[string][]byte{}
	add := func(name string, edit func(p *page) []byte, meta func(md *format.FileMetaData)) {
		out, err := rewrite(b, edit, meta)
		if err != nil {
			t.Fatal(err)
		}
		files[name] = out
	}
	add(fileZstdContent, func(p *page) []byte {
		return recompress(p, func(d []byte) []byte { return rawZstd(d, 60<<30, 0) })
	}, nil)
	add(fileZstdWindow, func(p *page) []byte {
		return recompress(p, func(d []byte) []byte { return rawZstd(d, uint64(len(d)), 19) })
	}, nil)
	add(fileSnappy, func(p *page) []byte {
		return recompress(p, func(d []byte) []byte {
			s, _ := parquet.Snappy.Encode(nil, d) // the block starts with its length, a varint
			_, k := binary.Uvarint(s)
			return append(binary.AppendUvarint(nil, 3<<30), s[k:]...)
		})
	}, func(md *format.FileMetaData) {
		for g := range md.RowGroups {
			for c := range md.RowGroups[g].Columns {
				md.RowGroups[g].Columns[c].MetaData.Codec = format.Snappy
			}
		}
	})
	// Field 4 of FileMetaData, row_groups, a list (0x49); a list of
	// structs whose size follows as a varint (0xFC): 2³¹−1; no elements.
	files[fileFooterList] = bareFooter([]byte{0x49, 0xFC, 0xff, 0xff, 0xff, 0xff, 0x07})
	// Field 5, key_value_metadata, a list (0x59) of one struct (0x1C)
	// whose field 1, key, a binary (0x18), declares 2³¹−1 bytes.
	files[fileFooterBytes] = bareFooter([]byte{0x59, 0x1C, 0x18, 0xff, 0xff, 0xff, 0xff, 0x07})
	add(filePageBytes, func(p *page) []byte {
		h := &p.header
		if p.index == 0 && h.DataPageHeaderV2.Valid {
			// A marker string in the statistics, whose length (a
			// varint 8) becomes 2³¹−1.
			h.DataPageHeaderV2.V.Statistics.MaxValue = []byte("ZZZZZZZZ")
			p.patch = func(hb []byte) []byte {
				return bytes.Replace(hb, []byte("\x08ZZZZZZZZ"), []byte("\xff\xff\xff\xff\x07ZZZZZZZZ"), 1)
			}
		}
		return p.body
	}, nil)
	add(fileGzipBomb, func(p *page) []byte {
		return recompress(p, func(d []byte) []byte { return gzipBomb(d, 1) })
	}, toGzip)
	add(fileFooterRows, nil, func(md *format.FileMetaData) { md.NumRows = 1 << 40 })
	add(fileGroupRows, nil, func(md *format.FileMetaData) {
		md.NumRows = 1 << 40
		md.RowGroups[0].NumRows = 1 << 40
	})
	return files
}

// TestHostileFilesAreAsStated checks that each committed crafted file is
// small and says what its name says (run with -update to rewrite them).
func TestHostileFilesAreAsStated(t *testing.T) {
	if *update {
		for name, b := range hostileFiles(t) {
			if err := os.WriteFile(filepath.Join("testdata", name), b, 0o644); err != nil {
				t.Fatal(err)
			}
		}
	}
	for _, name := range []string{fileZstdContent, fileZstdWindow, fileSnappy, fileFooterRows, fileGroupRows, fileFooterList, fileFooterBytes, filePageBytes, fileGzipBomb} {
		b, err := os.ReadFile(filepath.Join("testdata", name))
		if err != nil {
			t.Fatal(err)
		}
		if len(b) > 2048 {
			t.Errorf("%s: %d bytes, want a small file", name, len(b))
		}
		var got uint64
		switch name {
		case fileZstdContent: // the frame content size follows the magic and two header bytes
			got = binary.LittleEndian.Uint64(b[bytes.Index(b, []byte{0x28, 0xB5, 0x2F, 0xFD})+6:])
			if got != 60<<30 {
				t.Errorf("%s declares %d bytes", name, got)
			}
		case fileZstdWindow:
			if wd := b[bytes.Index(b, []byte{0x28, 0xB5, 0x2F, 0xFD})+5]; wd>>3 != 19 {
				t.Errorf("%s: window descriptor %#x", name, wd)
			}
		case filePageBytes, fileFooterBytes, fileFooterList:
			if !bytes.Contains(b, []byte{0xff, 0xff, 0xff, 0xff, 0x07}) {
				t.Errorf("%s: no length 2³¹−1", name)
			}
		case fileGzipBomb:
			z, err := gzip.NewReader(bytes.NewReader(b[bytes.Index(b, []byte{0x1f, 0x8b}):]))
			if err != nil {
				t.Fatal(err)
			}
			if n, _ := io.Copy(io.Discard, z); n < 1<<20 {
				t.Errorf("%s: the gzip stream inflates to %d bytes", name, n)
			}
		case fileSnappy:
			if !bytes.Contains(b, binary.AppendUvarint(nil, 3<<30)) {
				t.Errorf("%s: no block declaring 3 GiB", name)
			}
		}
	}
}

// childEnv names the test a re-executed test binary is to run with its
// memory limited.
const childEnv = "SIMILIS_PARQUET_CHILD"

// inChild runs the calling test in a child process whose address space
// is limited to what it holds plus 1 GiB, so that a fatal out-of-memory
// (which no recover catches) fails this test only. It returns true in the
// child, where the test's body is to run, and false in the parent, after
// checking the child passed.
func inChild(t *testing.T) bool {
	t.Helper()
	if os.Getenv(childEnv) == t.Name() {
		limitMemory(t, 1<<30)
		return true
	}
	cmd := exec.Command(os.Args[0], "-test.run=^"+t.Name()+"$", "-test.v", "-test.count=1")
	cmd.Env = append(os.Environ(), childEnv+"="+t.Name())
	out, err := cmd.CombinedOutput()
	if err != nil || !bytes.Contains(out, []byte("--- PASS: "+t.Name())) {
		s := string(out)
		if len(s) > 4000 {
			s = s[:4000] + "…"
		}
		t.Fatalf("child process: %v\n%s", err, s)
	}
	return false
}

// refused opens a crafted file and reads it as a caller would, all its
// rows at once, and checks that it is refused with an *Error saying says.
func refused(t *testing.T, name, says string) {
	b, err := os.ReadFile(filepath.Join("testdata", name))
	if err != nil {
		t.Fatal(err)
	}
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), name, Options{})
	if err == nil {
		var dst []quantity.Series
		for err == nil {
			dst, _, err = r.Read(dst, int(r.NumRows()))
		}
		if err == io.EOF {
			t.Fatalf("%s: read without an error", name)
		}
	}
	var pe *Error
	if !errors.As(err, &pe) || pe.File != name || classCount(err) != 1 || !errors.Is(err, quantity.ErrParse) || !strings.Contains(err.Error(), says) {
		t.Fatalf("%s: error %v, want an *Error of the file saying %q", name, err, says)
	}
}

// TestRefusesZstdFrameDeclaringHugeContent: a 1 KB file whose zstd frame
// declares 60 GiB of content is refused before the decoder allocates it.
func TestRefusesZstdFrameDeclaringHugeContent(t *testing.T) {
	if inChild(t) {
		refused(t, fileZstdContent, "declares 64424509440 bytes")
	}
}

// TestRefusesZstdFrameWithHugeWindow: a zstd window larger than
// MaxPageBytes is refused.
func TestRefusesZstdFrameWithHugeWindow(t *testing.T) {
	if inChild(t) {
		refused(t, fileZstdWindow, "zstd window of 536870912 bytes")
	}
}

// TestRefusesSnappyBlockDeclaringHugeContent: a snappy block whose length
// varint declares 3 GiB is refused.
func TestRefusesSnappyBlockDeclaringHugeContent(t *testing.T) {
	if inChild(t) {
		refused(t, fileSnappy, "3221225472")
	}
}

// TestRefusesGzipStreamInflatingPastItsPage: a gzip page whose stream
// inflates beyond the size its header declares is refused, from the small
// committed file (1 MiB more) to a generated one whose stream inflates to
// 4 GiB: the pre-check inflates into nothing, to the declared size and
// one byte more, so the child process, limited to 1 GiB more than it
// holds, never holds what the stream would inflate to.
func TestRefusesGzipStreamInflatingPastItsPage(t *testing.T) {
	if !inChild(t) {
		return
	}
	refused(t, fileGzipBomb, "a gzip stream that inflates to more than the")
	bomb, err := rewrite(validFile(t), func(p *page) []byte {
		return recompress(p, func(d []byte) []byte { return gzipBomb(d, 4096) })
	}, toGzip)
	if err != nil {
		t.Fatal(err)
	}
	if len(bomb) > 8<<20 {
		t.Fatalf("the generated file has %d bytes", len(bomb))
	}
	_, _, err = readAll(t, bomb, Options{})
	if err == nil || !strings.Contains(err.Error(), "a gzip stream that inflates to more than the") || classCount(err) != 1 {
		t.Fatalf("a page inflating to 4 GiB: %v", err)
	}
}

// TestRefusesFooterDeclaringMoreRows: a footer declaring 2⁴⁰ rows, read
// with Read(dst, int(r.NumRows())), is refused, never allocated.
func TestRefusesFooterDeclaringMoreRows(t *testing.T) {
	if inChild(t) {
		refused(t, fileFooterRows, "the footer declares 1099511627776 rows, its row groups 4")
		refused(t, fileGroupRows, "1099511627776 rows declared, 4 values in the pages")
	}
}

// TestRefusesFooterDeclaringHugeList: a footer whose list of row groups
// declares 2³¹−1 of them is refused before it is decoded.
func TestRefusesFooterDeclaringHugeList(t *testing.T) {
	if inChild(t) {
		refused(t, fileFooterList, "a list of 2147483647 elements")
	}
}

// TestRefusesFooterDeclaringHugeString: a footer whose key-value string
// declares 2 GiB is refused before it is decoded.
func TestRefusesFooterDeclaringHugeString(t *testing.T) {
	if inChild(t) {
		refused(t, fileFooterBytes, "a string of 2147483647 bytes")
	}
}

// TestRefusesPageHeaderDeclaringHugeString: a page header whose
// statistics string declares 2 GiB is refused before it is decoded.
func TestRefusesPageHeaderDeclaringHugeString(t *testing.T) {
	if inChild(t) {
		refused(t, filePageBytes, "a string of 2147483647 bytes")
	}
}

// TestReadGrowsByRowsRead: Read asked for 2⁴⁰ rows of a valid file of
// four takes memory for four.
func TestReadGrowsByRowsRead(t *testing.T) {
	if !inChild(t) {
		return
	}
	b := validFile(t)
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
	if err != nil {
		t.Fatal(err)
	}
	dst, n, err := r.Read(nil, 1<<40)
	if err != nil || n != 4 || dst[0].Len() != 4 {
		t.Fatalf("Read(nil, 2⁴⁰) = %d rows, %v", n, err)
	}
	if _, _, err := r.Read(dst, 1<<40); err != io.EOF {
		t.Fatalf("second Read: %v, want io.EOF", err)
	}
}

// TestRewriteControl: the crafting is sound. The valid file rewritten
// with its pages as raw zstd frames that declare their true size, or as
// snappy blocks, reads back its four values, so each crafted file differs
// from a readable one only in what its name says.
func TestRewriteControl(t *testing.T) {
	b := validFile(t)
	snappy := func(md *format.FileMetaData) {
		for g := range md.RowGroups {
			for c := range md.RowGroups[g].Columns {
				md.RowGroups[g].Columns[c].MetaData.Codec = format.Snappy
			}
		}
	}
	for _, tc := range []struct {
		name string
		edit func(p *page) []byte
		meta func(md *format.FileMetaData)
	}{
		{"unchanged", nil, nil},
		{"raw zstd", func(p *page) []byte {
			return recompress(p, func(d []byte) []byte { return rawZstd(d, uint64(len(d)), 0) })
		}, nil},
		{"snappy", func(p *page) []byte {
			return recompress(p, func(d []byte) []byte { s, _ := parquet.Snappy.Encode(nil, d); return s })
		}, snappy},
		{"gzip", func(p *page) []byte { return recompress(p, gzipPage) }, toGzip},
	} {
		out, err := rewrite(b, tc.edit, tc.meta)
		if err != nil {
			t.Fatal(err)
		}
		_, vals, err := readAll(t, out, Options{})
		if err != nil || len(vals) != 1 || len(vals[0]) != 4 || vals[0][3] != 4 {
			t.Errorf("%s: %v, %v; want 1 2 3 4", tc.name, vals, err)
		}
	}
}
