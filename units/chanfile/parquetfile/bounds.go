package parquetfile

import (
	"bufio"
	"encoding/binary"
	"fmt"
	"io"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/encoding/thrift"
	"github.com/parquet-go/parquet-go/format"
)

// MaxPageBytes bounds the size of one page of a file read, compressed or
// not, and MaxFooterBytes the size of its footer. A file is checked
// against them before a page is decoded, so a damaged or hostile file
// cannot make the reader allocate without bound.
const (
	MaxPageBytes   = 64 << 20
	MaxFooterBytes = 16 << 20
	maxPageValues  = 1 << 24
)

// readable lists the compressions read: the ones whose output size the
// pre-scan can bound before the decoder runs.
var readable = map[format.CompressionCodec]bool{
	format.Uncompressed: true,
	format.Snappy:       true,
	format.Zstd:         true,
}

// checkFooter checks the file's trailer before the footer is decoded.
func checkFooter(r io.ReaderAt, size int64) error {
	if size < 12 {
		return fmt.Errorf("%d bytes, too short for a Parquet file", size)
	}
	var b [8]byte
	if _, err := r.ReadAt(b[:4], 0); err != nil {
		return err
	}
	if string(b[:4]) != "PAR1" {
		return fmt.Errorf("no Parquet magic number at the start (an encrypted file, PARE, is not read)")
	}
	if _, err := r.ReadAt(b[:], size-8); err != nil {
		return err
	}
	if string(b[4:]) != "PAR1" {
		return fmt.Errorf("no Parquet magic number at the end: a truncated file")
	}
	n := int64(binary.LittleEndian.Uint32(b[:4]))
	if n > size-12 || n > MaxFooterBytes {
		return fmt.Errorf("a footer of %d bytes in a file of %d (at most %d read)", n, size, int64(MaxFooterBytes))
	}
	return nil
}

// countReader counts the bytes read through it.
type countReader struct {
	r *bufio.Reader
	n int64
}

func (c *countReader) Read(p []byte) (int, error) {
	n, err := c.r.Read(p)
	c.n += int64(n)
	return n, err
}

func (c *countReader) ReadByte() (byte, error) {
	b, err := c.r.ReadByte()
	if err == nil {
		c.n++
	}
	return b, err
}

// checkPages walks the page headers of every column chunk of f and checks
// that each page fits in its chunk, the chunk in the file, and that no
// page decodes to more than MaxPageBytes; it reads headers and the first
// bytes of compressed data, never decompressing.
func checkPages(r io.ReaderAt, size int64, f *parquet.File) error {
	md := f.Metadata()
	if md.EncryptionAlgorithm.Value != nil {
		return fmt.Errorf("an encrypted file")
	}
	var rows int64
	for g, rg := range md.RowGroups {
		if rg.NumRows < 0 || rows+rg.NumRows < rows {
			return fmt.Errorf("row group %d: %d rows", g+1, rg.NumRows)
		}
		rows += rg.NumRows
		for c, cc := range rg.Columns {
			where := fmt.Sprintf("row group %d, column %d", g+1, c+1)
			m := cc.MetaData
			if cc.FilePath != "" {
				return fmt.Errorf("%s: data in another file (%q)", where, cc.FilePath)
			}
			if cc.CryptoMetadata.Value != nil || len(cc.EncryptedColumnMetadata) > 0 {
				return fmt.Errorf("%s: an encrypted column", where)
			}
			if !readable[m.Codec] {
				return fmt.Errorf("%s: compression %v is not read (write the file with ZSTD, SNAPPY or none)", where, m.Codec)
			}
			start := m.DataPageOffset
			if m.DictionaryPageOffset > 0 && m.DictionaryPageOffset < start {
				start = m.DictionaryPageOffset
			}
			end := start + m.TotalCompressedSize
			if start < 4 || m.TotalCompressedSize <= 0 || end < start || end > size-8 {
				return fmt.Errorf("%s: a chunk of %d bytes at offset %d, outside the file", where, m.TotalCompressedSize, start)
			}
			values, err := checkChunk(io.NewSectionReader(r, start, end-start), m.Codec)
			if err != nil {
				return fmt.Errorf("%s: %w", where, err)
			}
			// Every row has at least one entry in every column.
			if values < rg.NumRows {
				return fmt.Errorf("%s: %d rows declared, %d values in the pages", where, rg.NumRows, values)
			}
		}
	}
	if md.NumRows != rows {
		return fmt.Errorf("the footer declares %d rows, its row groups %d", md.NumRows, rows)
	}
	return nil
}

// checkChunk walks the pages of one column chunk and returns the number
// of values its data pages declare.
func checkChunk(sr *io.SectionReader, codec format.CompressionCodec) (int64, error) {
	size := sr.Size()
	cr := &countReader{r: bufio.NewReaderSize(sr, 4096)}
	var proto thrift.CompactProtocol
	var total int64
	for page := 1; cr.n < size; page++ {
		var h format.PageHeader
		if err := thrift.NewDecoder(proto.NewReader(io.LimitReader(cr, 1<<16))).Decode(&h); err != nil {
			return 0, fmt.Errorf("page %d: a damaged page header: %v", page, err)
		}
		comp, unc := int64(h.CompressedPageSize), int64(h.UncompressedPageSize)
		if comp < 0 || unc < 0 || comp > MaxPageBytes || unc > MaxPageBytes {
			return 0, fmt.Errorf("page %d: %d bytes compressed, %d uncompressed (at most %d read)", page, comp, unc, int64(MaxPageBytes))
		}
		body := cr.n
		if body+comp > size {
			return 0, fmt.Errorf("page %d: %d bytes that run past the chunk's end", page, comp)
		}
		var values int64
		data := body // where the compressed data start
		compressed := codec != format.Uncompressed
		switch {
		case h.DataPageHeader.Valid:
			values = int64(h.DataPageHeader.V.NumValues)
			total += max(values, 0)
		case h.DictionaryPageHeader.Valid:
			values = int64(h.DictionaryPageHeader.V.NumValues)
		case h.DataPageHeaderV2.Valid:
			v := h.DataPageHeaderV2.V
			values = int64(v.NumValues)
			total += max(values, 0)
			lv := int64(v.DefinitionLevelsByteLength) + int64(v.RepetitionLevelsByteLength)
			if v.DefinitionLevelsByteLength < 0 || v.RepetitionLevelsByteLength < 0 || lv > comp {
				return 0, fmt.Errorf("page %d: level lengths outside the page", page)
			}
			data += lv
			if v.IsCompressed.Valid && !v.IsCompressed.V {
				compressed = false
			}
		}
		if values < 0 || values > maxPageValues {
			return 0, fmt.Errorf("page %d: %d values (at most %d read)", page, values, maxPageValues)
		}
		if compressed && data < body+comp {
			n := body + comp - data
			var out int64
			var err error
			switch codec {
			case format.Snappy:
				// The block starts with its decoded length, a varint.
				var head [binary.MaxVarintLen64]byte
				if _, err := sr.ReadAt(head[:min(n, int64(len(head)))], data); err != nil {
					return 0, fmt.Errorf("page %d: %v", page, err)
				}
				u, k := binary.Uvarint(head[:min(n, int64(len(head)))])
				if k <= 0 {
					return 0, fmt.Errorf("page %d: a damaged snappy block", page)
				}
				out = int64(min(u, 1<<62))
				if out > unc {
					return 0, fmt.Errorf("page %d: a snappy block that declares %d bytes, in a page of %d uncompressed", page, out, unc)
				}
			case format.Zstd:
				var declared int64
				out, declared, err = zstdBound(io.NewSectionReader(sr, data, n), n)
				if err == nil && declared > unc {
					return 0, fmt.Errorf("page %d: zstd frames that declare %d bytes, in a page of %d uncompressed", page, declared, unc)
				}
			}
			if err != nil {
				return 0, fmt.Errorf("page %d: %v", page, err)
			}
			if out > MaxPageBytes {
				return 0, fmt.Errorf("page %d: decompresses to as much as %d bytes (at most %d read)", page, out, int64(MaxPageBytes))
			}
		}
		if _, err := cr.r.Discard(int(comp)); err != nil {
			return 0, fmt.Errorf("page %d: %v", page, err)
		}
		cr.n += comp
	}
	return total, nil
}

// zstdBound returns an upper bound on the bytes that the zstd frames in r
// (n bytes) decode to, from the frame and block headers (RFC 8878 §3.1):
// a raw or RLE block gives its size, a compressed block at most 128 KiB.
// It also returns the content size the frame headers declare, which the
// decoder allocates at once, and refuses a frame whose declared content
// or window is larger than MaxPageBytes, or that needs a dictionary.
func zstdBound(r *io.SectionReader, n int64) (out, declared int64, err error) {
	var pos int64
	var b [18]byte
	read := func(k int) ([]byte, error) {
		if pos+int64(k) > n {
			return nil, fmt.Errorf("a truncated zstd frame")
		}
		if _, err := r.ReadAt(b[:k], pos); err != nil {
			return nil, err
		}
		pos += int64(k)
		return b[:k], nil
	}
	for frames := 0; pos < n; frames++ {
		if frames > 1<<16 {
			return 0, 0, fmt.Errorf("too many zstd frames")
		}
		m, err := read(4)
		if err != nil {
			return 0, 0, err
		}
		magic := binary.LittleEndian.Uint32(m)
		if magic&0xFFFFFFF0 == 0x184D2A50 { // a skippable frame
			s, err := read(4)
			if err != nil {
				return 0, 0, err
			}
			pos += int64(binary.LittleEndian.Uint32(s))
			continue
		}
		if magic != 0xFD2FB528 {
			return 0, 0, fmt.Errorf("not a zstd frame")
		}
		d, err := read(1)
		if err != nil {
			return 0, 0, err
		}
		fd := d[0]
		single := fd&0x20 != 0
		checksum := fd&0x04 != 0
		if fd&3 != 0 {
			return 0, 0, fmt.Errorf("a zstd frame that needs a dictionary")
		}
		if !single {
			w, err := read(1)
			if err != nil {
				return 0, 0, err
			}
			// Window_Descriptor: 2^(10+exponent) plus mantissa eighths.
			base := int64(1) << (10 + w[0]>>3)
			if window := base + base/8*int64(w[0]&7); window > MaxPageBytes {
				return 0, 0, fmt.Errorf("a zstd window of %d bytes (at most %d read)", window, int64(MaxPageBytes))
			}
		}
		var fcs uint64
		switch fd >> 6 { // Frame_Content_Size
		case 0:
			if single {
				c, err := read(1)
				if err != nil {
					return 0, 0, err
				}
				fcs = uint64(c[0])
			}
		case 1:
			c, err := read(2)
			if err != nil {
				return 0, 0, err
			}
			fcs = uint64(binary.LittleEndian.Uint16(c)) + 256
		case 2:
			c, err := read(4)
			if err != nil {
				return 0, 0, err
			}
			fcs = uint64(binary.LittleEndian.Uint32(c))
		case 3:
			c, err := read(8)
			if err != nil {
				return 0, 0, err
			}
			fcs = binary.LittleEndian.Uint64(c)
		}
		if fcs > MaxPageBytes || declared+int64(fcs) > MaxPageBytes {
			return 0, 0, fmt.Errorf("a zstd frame that declares %d bytes of content (at most %d read)", fcs, int64(MaxPageBytes))
		}
		declared += int64(fcs)
		for last := false; !last; {
			h, err := read(3)
			if err != nil {
				return 0, 0, err
			}
			v := uint32(h[0]) | uint32(h[1])<<8 | uint32(h[2])<<16
			last = v&1 != 0
			size := int64(v >> 3)
			switch (v >> 1) & 3 {
			case 0: // raw
				out += size
				pos += size
			case 1: // RLE
				out += size
				pos++
			case 2: // compressed
				out += 128 << 10
				pos += size
			default:
				return 0, 0, fmt.Errorf("a reserved zstd block type")
			}
			if out > MaxPageBytes {
				return out, declared, nil
			}
		}
		if checksum {
			pos += 4
		}
	}
	return out, declared, nil
}
