package parquetfile

import (
	"bytes"
	"errors"
	"io"
	"math"
	"runtime"
	"testing"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/format"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

// pageBases are the valid files FuzzPages mutates: the writer's own
// (zstd, nulls, several row groups and columns), and the same pages as
// raw zstd frames and as snappy blocks.
func pageBases(t tb) [][]byte {
	cols := []chanfile.Column{col("V", "kn"), col("Re", "1"), col("T", "degC")}
	v := make([]float64, 40)
	re := make([]float64, 40)
	temp := make([]float64, 40)
	for i := range v {
		v[i], re[i], temp[i] = float64(i)/7, 1e5*float64(i+1), 280+float64(i%5)
		if i%9 == 4 {
			v[i] = math.NaN()
		}
	}
	b := write(t, cols, Options{RowGroupRows: 16}, quantity.NewSeries(v, quantity.Velocity), quantity.NewSeries(re, quantity.Dimensionless), quantity.NewSeries(temp, quantity.Temperature))
	raw, err := rewrite(b, func(p *page) []byte {
		return recompress(p, func(d []byte) []byte { return rawZstd(d, uint64(len(d)), 0) })
	}, nil)
	if err != nil {
		t.Fatal(err)
	}
	snappy, err := rewrite(b, func(p *page) []byte {
		return recompress(p, func(d []byte) []byte { s, _ := parquet.Snappy.Encode(nil, d); return s })
	}, func(md *format.FileMetaData) {
		for g := range md.RowGroups {
			for c := range md.RowGroups[g].Columns {
				md.RowGroups[g].Columns[c].MetaData.Codec = format.Snappy
			}
		}
	})
	if err != nil {
		t.Fatal(err)
	}
	gz, err := rewrite(b, func(p *page) []byte { return recompress(p, gzipPage) }, toGzip)
	if err != nil {
		t.Fatal(err)
	}
	return [][]byte{b, raw, snappy, validFile(t), gz, typedFile(t, parquet.Compression(&parquet.Gzip)), typedFile(t, parquet.Compression(&parquet.Zstd))}
}

// legacyBases are further files FuzzPages mutates, picked by a which of
// 0xE0 or more so that the saved inputs keep their base: BOOLEAN, TIME
// and INT96 columns in data pages of version 1 and 2 (the second zstd),
// and RLE booleans in pages of either version.
func legacyBases(t tb) [][]byte {
	return [][]byte{
		legacyFile(t, parquet.DataPageVersion(1)),
		legacyFile(t, parquet.DataPageVersion(2), parquet.Compression(&parquet.Zstd)),
		rleBoolFile(t, 1),
		rleBoolFile(t, 2),
	}
}

// mutate rewrites base with the bytes of data written over the body of
// one page (chosen by sel) from offset off, and one field of that page's
// header (chosen by field) set to val; the checksums are made to agree,
// so the mutation reaches the decompressor and the decoder.
func mutate(base []byte, sel, off uint16, data []byte, field uint8, val int32) []byte {
	k := 0
	out, err := rewrite(base, func(p *page) []byte {
		k++
		if uint16(k-1) != sel%64 || len(p.body) == 0 {
			return p.body
		}
		at := int(off) % len(p.body)
		copy(p.body[at:], data)
		h := &p.header
		switch field % 8 {
		case 1:
			h.UncompressedPageSize = val
		case 2:
			if h.DataPageHeaderV2.Valid {
				h.DataPageHeaderV2.V.NumValues = val
			} else if h.DataPageHeader.Valid {
				h.DataPageHeader.V.NumValues = val
			} else if h.DictionaryPageHeader.Valid {
				h.DictionaryPageHeader.V.NumValues = val
			}
		case 3:
			if h.DataPageHeaderV2.Valid {
				h.DataPageHeaderV2.V.DefinitionLevelsByteLength = val
			}
		case 4:
			if h.DataPageHeaderV2.Valid {
				h.DataPageHeaderV2.V.NumNulls = val
			}
		case 5:
			if h.DataPageHeaderV2.Valid {
				h.DataPageHeaderV2.V.Encoding = format.Encoding(val)
			} else if h.DataPageHeader.Valid {
				h.DataPageHeader.V.Encoding = format.Encoding(val)
			}
		case 6:
			if h.DataPageHeaderV2.Valid {
				h.DataPageHeaderV2.V.NumRows = val
			}
		}
		return p.body
	}, nil)
	if err != nil {
		panic(err) // the bases are valid
	}
	return out
}

// FuzzPages mutates the compressed frames and the page headers of valid
// files (not only truncations) and reads the result. The properties: no
// panic, memory bounded by the pre-check (what one execution allocates
// is at most a few times MaxPageBytes), and a nil error only with values
// that are finite or NaN (missing), and exactly the rows the file
// declares when read to its end.
func FuzzPages(f *testing.F) {
	bases, legacy := pageBases(f), legacyBases(f)
	f.Add(uint8(0), uint16(0), uint16(0), []byte{}, uint8(0), int32(0))
	f.Add(uint8(0), uint16(1), uint16(5), []byte{0xff, 0xff, 0xff, 0x7f}, uint8(0), int32(0))
	f.Add(uint8(1), uint16(2), uint16(6), []byte{0, 0, 0, 0, 0x0f, 0, 0, 0}, uint8(0), int32(0)) // a frame content size
	f.Add(uint8(1), uint16(0), uint16(5), []byte{0xf8}, uint8(0), int32(0))                      // a window descriptor
	f.Add(uint8(2), uint16(1), uint16(0), []byte{0xff, 0xff, 0xff, 0x0f}, uint8(0), int32(0))    // a snappy length
	f.Add(uint8(0), uint16(3), uint16(0), []byte{}, uint8(1), int32(1<<26))
	f.Add(uint8(0), uint16(3), uint16(0), []byte{}, uint8(2), int32(1<<24))
	f.Add(uint8(3), uint16(1), uint16(0), []byte{}, uint8(3), int32(-1))
	f.Add(uint8(2), uint16(4), uint16(9), []byte{1, 2, 3}, uint8(5), int32(8))
	f.Add(uint8(4), uint16(1), uint16(0), []byte{}, uint8(1), int32(4))                                // a gzip page declaring less than it inflates to
	f.Add(uint8(4), uint16(2), uint16(12), []byte{0xff, 0x00, 0x13}, uint8(0), int32(0))               // a damaged deflate stream
	f.Add(uint8(5), uint16(5), uint16(30), []byte{0x7f, 0xff}, uint8(0), int32(0))                     // a DECIMAL page (gzip)
	f.Add(uint8(6), uint16(9), uint16(20), []byte{0x80}, uint8(0), int32(0))                           // a timestamp page (zstd)
	f.Add(uint8(6), uint16(17), uint16(8), []byte{0xff, 0xfe}, uint8(2), int32(3))                     // a label page
	f.Add(uint8(5), uint16(3), uint16(0), []byte{}, uint8(1), int32(2))                                // a gzip page declaring less
	f.Add(uint8(0xE0), uint16(0), uint16(3), []byte{0x7f}, uint8(0), int32(0))                         // a BOOLEAN page
	f.Add(uint8(0xE1), uint16(1), uint16(2), []byte{0xff, 0xff}, uint8(0), int32(0))                   // a TIME page (zstd)
	f.Add(uint8(0xE0), uint16(4), uint16(7), []byte{0xff, 0xff, 0xff, 0x7f}, uint8(2), int32(9))       // an INT96 page
	f.Add(uint8(0xE2), uint16(0), uint16(5), []byte{0x01}, uint8(0), int32(0))                         // a run of true as the byte 1
	f.Add(uint8(0xE3), uint16(0), uint16(4), []byte{0xfe, 0xff, 0xff, 0xff, 0x0f}, uint8(0), int32(0)) // a huge run
	f.Add(uint8(0xE2), uint16(0), uint16(0), []byte{}, uint8(5), int32(3))                             // booleans BIT_PACKED
	f.Fuzz(func(t *testing.T, which uint8, sel, off uint16, data []byte, field uint8, val int32) {
		if len(data) > 64 {
			data = data[:64]
		}
		base := bases[int(which)%len(bases)]
		if which >= 0xE0 {
			base = legacy[int(which-0xE0)%len(legacy)]
		}
		b := mutate(base, sel, off, data, field, val)
		var before, after runtime.MemStats
		runtime.ReadMemStats(&before)
		r, err := NewReader(bytes.NewReader(b), int64(len(b)), "f.parquet", Options{})
		if err != nil {
			var pe *Error
			if !errors.As(err, &pe) || classCount(err) != 1 {
				t.Fatalf("error %v is not an *Error of one class", err)
			}
			return
		}
		var dst []quantity.Series
		var rows int64
		for range 1000 {
			var n int
			dst, n, err = r.Read(dst, 64)
			rows += int64(n)
			for j := range dst {
				if r.Kind(j) == Label {
					if len(r.Labels(j)) != n || dst[j].Len() != 0 {
						t.Fatalf("label column %d: %d labels and %d values for %d rows", j+1, len(r.Labels(j)), dst[j].Len(), n)
					}
					continue
				}
				if dst[j].Len() != n {
					t.Fatalf("column %d: %d values for %d rows", j+1, dst[j].Len(), n)
				}
				for _, x := range dst[j].Values()[:n] {
					if math.IsInf(x, 0) {
						t.Fatalf("column %d: %v with a nil error", j+1, x)
					}
				}
			}
			if err != nil {
				break
			}
		}
		runtime.ReadMemStats(&after)
		if grew := after.TotalAlloc - before.TotalAlloc; grew > 8*MaxPageBytes {
			t.Fatalf("one file of %d bytes allocated %d bytes", len(b), grew)
		}
		if rows > r.NumRows() || err == io.EOF && rows != r.NumRows() {
			t.Fatalf("%d rows read to %v, %d declared", rows, err, r.NumRows())
		}
		if err != nil && err != io.EOF && classCount(err) != 1 {
			t.Fatalf("error %v is not of one class", err)
		}
	})
}
