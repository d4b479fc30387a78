package parquetfile

import (
	"bufio"
	"encoding/binary"
	"fmt"
	"io"

	"github.com/klauspost/compress/gzip"
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
	maxPageHeader  = 1 << 16
)

// readable lists the compressions read: the ones whose output size the
// pre-scan can bound before the decoder runs.
var readable = map[format.CompressionCodec]bool{
	format.Uncompressed: true,
	format.Snappy:       true,
	format.Zstd:         true,
	format.Gzip:         true,
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
	footer := make([]byte, n)
	if _, err := r.ReadAt(footer, size-8-n); err != nil {
		return err
	}
	if k, err := thriftCheck(footer, maxDecodedFooter); err != nil {
		return fmt.Errorf("the footer: %w", err)
	} else if k != len(footer) {
		return fmt.Errorf("the footer: %d bytes after its end", len(footer)-k)
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

// checkPages walks the page headers of the column chunks of f that use
// marks (by their index in a row group) and checks
// that each page fits in its chunk, the chunk in the file, and that no
// page decodes to more than MaxPageBytes; it reads headers and the first
// bytes of compressed data, never decompressing. A fault of one column
// is returned in bad, by the column's index, and first is the first such
// fault met (nil if none); the column is not looked at further. A fault
// of the file is err.
func checkPages(r io.ReaderAt, size int64, f *parquet.File, use, optional, boolean []bool) (bad []error, first, err error) {
	md := f.Metadata()
	if md.EncryptionAlgorithm.Value != nil {
		return nil, nil, fmt.Errorf("an encrypted file")
	}
	bad = make([]error, len(use))
	fail := func(c int, err error) {
		bad[c] = err
		if first == nil {
			first = err
		}
	}
	var rows int64
	for g, rg := range md.RowGroups {
		if rg.NumRows < 0 || rows+rg.NumRows < rows {
			return nil, nil, fmt.Errorf("row group %d: %d rows", g+1, rg.NumRows)
		}
		rows += rg.NumRows
		if len(rg.Columns) != len(use) {
			return nil, nil, fmt.Errorf("row group %d: %d column chunks, the schema has %d columns", g+1, len(rg.Columns), len(use))
		}
		for c, cc := range rg.Columns {
			if !use[c] || bad[c] != nil {
				continue // never read, or refused: not looked at
			}
			where := fmt.Sprintf("row group %d, column %d", g+1, c+1)
			m := cc.MetaData
			if cc.FilePath != "" {
				fail(c, fmt.Errorf("%s: data in another file (%q)", where, cc.FilePath))
				continue
			}
			if cc.CryptoMetadata.Value != nil || len(cc.EncryptedColumnMetadata) > 0 {
				fail(c, fmt.Errorf("%s: an encrypted column", where))
				continue
			}
			if !readable[m.Codec] {
				fail(c, fmt.Errorf("%s: compression %v is not read (write the file with ZSTD, SNAPPY, GZIP or none)", where, m.Codec))
				continue
			}
			start := m.DataPageOffset
			if m.DictionaryPageOffset > 0 && m.DictionaryPageOffset < start {
				start = m.DictionaryPageOffset
			}
			end := start + m.TotalCompressedSize
			if start < 4 || m.TotalCompressedSize <= 0 || end < start || end > size-8 {
				fail(c, fmt.Errorf("%s: a chunk of %d bytes at offset %d, outside the file", where, m.TotalCompressedSize, start))
				continue
			}
			values, err := checkChunk(io.NewSectionReader(r, start, end-start), m.Codec, optional[c], boolean[c])
			if err != nil {
				fail(c, fmt.Errorf("%s: %w", where, err))
				continue
			}
			// Every row has at least one entry in every column.
			if values < rg.NumRows {
				fail(c, fmt.Errorf("%s: %d rows declared, %d values in the pages", where, rg.NumRows, values))
				continue
			}
		}
	}
	if md.NumRows != rows {
		return nil, nil, fmt.Errorf("the footer declares %d rows, its row groups %d", md.NumRows, rows)
	}
	return bad, first, nil
}

// checkChunk walks the pages of one column chunk (of a flat column,
// optional or not) and returns the number of values its data pages
// declare.
func checkChunk(sr *io.SectionReader, codec format.CompressionCodec, optional, boolean bool) (int64, error) {
	size := sr.Size()
	cr := &countReader{r: bufio.NewReaderSize(sr, maxPageHeader)}
	var proto thrift.CompactProtocol
	var total int64
	for page := 1; cr.n < size; page++ {
		// The header is walked before it is decoded: at most 64 KiB,
		// no string or list longer than that.
		peek, _ := cr.r.Peek(int(min(size-cr.n, maxPageHeader)))
		if _, err := thriftCheck(peek, 1<<20); err != nil {
			return 0, fmt.Errorf("page %d: a damaged page header: %w", page, err)
		}
		var h format.PageHeader
		if err := thrift.NewDecoder(proto.NewReader(io.LimitReader(cr, maxPageHeader))).Decode(&h); err != nil {
			return 0, fmt.Errorf("page %d: a damaged page header: %w", page, err)
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
					return 0, fmt.Errorf("page %d: %w", page, err)
				}
				u, k := binary.Uvarint(head[:min(n, int64(len(head)))])
				if k <= 0 {
					return 0, fmt.Errorf("page %d: a damaged snappy block", page)
				}
				out = int64(min(u, 1<<62))
				if out > unc {
					return 0, fmt.Errorf("page %d: a snappy block that declares %d bytes, in a page of %d uncompressed", page, out, unc)
				}
			case format.Gzip:
				// A gzip stream declares no size before its end: it is
				// inflated here, into nothing, to the page's declared
				// size and one byte more, and refused if it reaches it.
				// The decoder then inflates the same stream to no more.
				limit := unc - (data - body)
				if limit < 0 {
					return 0, fmt.Errorf("page %d: levels longer than the page's %d uncompressed bytes", page, unc)
				}
				out, err = gzipSize(io.NewSectionReader(sr, data, n), limit)
				if err == nil && out > limit {
					return 0, fmt.Errorf("page %d: a gzip stream that inflates to more than the %d bytes the page declares", page, limit)
				}
			case format.Zstd:
				var declared int64
				out, declared, err = zstdBound(io.NewSectionReader(sr, data, n), n)
				if err == nil && declared > unc {
					return 0, fmt.Errorf("page %d: zstd frames that declare %d bytes, in a page of %d uncompressed", page, declared, unc)
				}
			}
			if err != nil {
				return 0, fmt.Errorf("page %d: %w", page, err)
			}
			if out > MaxPageBytes {
				return 0, fmt.Errorf("page %d: decompresses to as much as %d bytes (at most %d read)", page, out, int64(MaxPageBytes))
			}
		}
		if err := checkEncoded(sr, &h, codec, body, comp, values, optional, boolean); err != nil {
			return 0, fmt.Errorf("page %d: %w", page, err)
		}
		if _, err := cr.r.Discard(int(comp)); err != nil {
			return 0, fmt.Errorf("page %d: %w", page, err)
		}
		cr.n += comp
	}
	return total, nil
}

// checkEncoded checks what the decoder would allocate from the counts
// inside a page, once its size is known to be bounded: the runs of the
// definition levels and of dictionary indices (the RLE/bit-packed hybrid
// of the Parquet format), and the value count of a DELTA_BINARY_PACKED
// header, may not declare more than the page's values, so that a few
// bytes cannot declare 2³¹ values. Value encodings whose decoded size the
// page does not bound (RLE and BIT_PACKED for numbers, DELTA_BYTE_ARRAY)
// are refused. The page is decompressed here only when it holds such
// counts (levels, dictionary indices, delta encodings).
func checkEncoded(sr *io.SectionReader, h *format.PageHeader, codec format.CompressionCodec, body, comp, values int64, optional, boolean bool) error {
	var enc format.Encoding
	switch {
	case h.DictionaryPageHeader.Valid:
		//lint:ignore SA1019 files written by older writers still use the deprecated PLAIN_DICTIONARY code, and are read
		if e := h.DictionaryPageHeader.V.Encoding; e != format.Plain && e != format.PlainDictionary {
			return fmt.Errorf("a dictionary page of encoding %v", e)
		}
		return nil
	case h.DataPageHeader.Valid:
		enc = h.DataPageHeader.V.Encoding
	case h.DataPageHeaderV2.Valid:
		enc = h.DataPageHeaderV2.V.Encoding
	default:
		return nil
	}
	switch enc {
	case format.Plain, format.ByteStreamSplit:
	//lint:ignore SA1019 files written by older writers still use the deprecated PLAIN_DICTIONARY code, and are read
	case format.PlainDictionary, format.RLEDictionary, format.DeltaBinaryPacked, format.DeltaLengthByteArray:
	case format.RLE:
		if !boolean {
			return fmt.Errorf("values of encoding RLE are not read but for a BOOLEAN column")
		}
	default:
		return fmt.Errorf("values of encoding %v are not read (PLAIN, dictionary, DELTA_BINARY_PACKED, DELTA_LENGTH_BYTE_ARRAY and BYTE_STREAM_SPLIT are)", enc)
	}
	counted := enc != format.Plain && enc != format.ByteStreamSplit
	if !counted && !optional {
		return nil
	}
	limit := values + 64 // a last bit-packed group is padded to 8
	raw := make([]byte, comp)
	if _, err := sr.ReadAt(raw, body); err != nil {
		return err
	}
	decode := func(b []byte) ([]byte, error) {
		if codec == format.Uncompressed {
			return b, nil
		}
		return parquet.LookupCompressionCodec(codec).Decode(nil, b)
	}
	var data []byte
	if h.DataPageHeader.Valid {
		d, err := decode(raw)
		if err != nil {
			return fmt.Errorf("a damaged compressed page: %w", err)
		}
		if optional {
			if e := h.DataPageHeader.V.DefinitionLevelEncoding; e != format.RLE {
				return fmt.Errorf("definition levels of encoding %v (RLE is read)", e)
			}
			if len(d) < 4 {
				return fmt.Errorf("definition levels cut short")
			}
			n := int64(binary.LittleEndian.Uint32(d))
			if n > int64(len(d)-4) {
				return fmt.Errorf("definition levels of %d bytes in a page of %d", n, len(d))
			}
			if err := hybridRuns(d[4:4+n], 1, limit, "definition levels"); err != nil {
				return err
			}
			d = d[4+n:]
		}
		data = d
	} else {
		v := h.DataPageHeaderV2.V
		rl, dl := int64(v.RepetitionLevelsByteLength), int64(v.DefinitionLevelsByteLength)
		if optional {
			if err := hybridRuns(raw[rl:rl+dl], 1, limit, "definition levels"); err != nil {
				return err
			}
		}
		if !counted {
			return nil
		}
		data = raw[rl+dl:]
		if !v.IsCompressed.Valid || v.IsCompressed.V {
			d, err := decode(data)
			if err != nil {
				return fmt.Errorf("a damaged compressed page: %w", err)
			}
			data = d
		}
	}
	switch enc {
	//lint:ignore SA1019 files written by older writers still use the deprecated PLAIN_DICTIONARY code, and are read
	case format.PlainDictionary, format.RLEDictionary:
		if len(data) == 0 {
			return nil
		}
		if data[0] > 32 {
			return fmt.Errorf("dictionary indices of %d bits", data[0])
		}
		return hybridRuns(data[1:], int64(data[0]), limit, "dictionary indices")
	case format.RLE:
		// Booleans: a 4-byte length, then runs of 1-bit values.
		if len(data) < 4 {
			return fmt.Errorf("RLE booleans cut short")
		}
		n := int64(binary.LittleEndian.Uint32(data))
		if n > int64(len(data)-4) {
			return fmt.Errorf("RLE booleans of %d bytes in a page of %d", n, len(data))
		}
		return boolRuns(data[4:4+n], limit)
	case format.DeltaBinaryPacked, format.DeltaLengthByteArray:
		// Block size, miniblocks per block, then the value count.
		p := data
		for range 2 {
			if _, k := binary.Uvarint(p); k > 0 {
				p = p[k:]
			} else {
				return nil // the decoder refuses it
			}
		}
		if n, k := binary.Uvarint(p); k > 0 && n > uint64(limit) {
			return fmt.Errorf("a delta-encoded header declaring %d values in a page of %d", n, values)
		}
	}
	return nil
}

// runHeader reads the header of the run at b[*i] of an RLE/bit-packed
// hybrid stream, moving *i past it: the run's count n (of values, or of
// groups of 8 when packed, capped at 2⁴⁰ so sums cannot overflow) and
// whether it is bit-packed. It reports false for a header that does not
// decode.
func runHeader(b []byte, i *int) (n int64, packed bool, ok bool) {
	u, k := binary.Uvarint(b[*i:])
	if k <= 0 {
		return 0, false, false
	}
	*i += k
	return int64(min(u>>1, 1<<40)), u&1 != 0, true
}

// hybridRuns walks the runs of an RLE/bit-packed hybrid stream of
// width-bit values and refuses it if they declare more than limit values.
func hybridRuns(b []byte, width, limit int64, what string) error {
	var total int64
	for i := 0; i < len(b); {
		n, packed, ok := runHeader(b, &i)
		if !ok {
			return nil // the decoder refuses it
		}
		if packed { // n groups of 8 bit-packed values
			total += 8 * n
			i += int(min(n*width, int64(len(b))))
		} else { // n repeats of one value
			total += n
			i += int((width + 7) / 8)
		}
		if total > limit {
			return fmt.Errorf("%s whose runs declare more than the page's %d values", what, limit-64)
		}
	}
	return nil
}

// boolRuns walks the runs of RLE-encoded booleans and refuses them if
// they declare more than limit values, or if the decoder would misread
// them. The decoder expands a repeated run into whole bytes, each a copy
// of the run's value byte: that is the run's values only when the byte
// is 0x00 or 0xFF, or the run is of one value; and only a run that is
// the last, or of a multiple of 8 values, leaves the next run on the
// byte it starts on. A file whose runs are otherwise (a run of true
// written as the byte 1, as the format writes it) is refused rather than
// read wrong.
func boolRuns(b []byte, limit int64) error {
	var total int64
	for i := 0; i < len(b); {
		n, packed, ok := runHeader(b, &i)
		if !ok {
			return nil // the decoder refuses it
		}
		if packed { // n groups of 8 bit-packed values, n bytes
			total += 8 * n
			i += int(min(n, int64(len(b))))
		} else {
			total += n
			if total > limit {
				return fmt.Errorf("booleans whose runs declare more than the page's %d values", limit-64)
			}
			var w byte
			if i < len(b) {
				w = b[i]
				i++
			}
			last := i >= len(b)
			if w > 1 && w != 0xFF {
				return fmt.Errorf("a run of booleans of value byte 0x%02X: a damaged page", w)
			}
			if w == 1 && n > 1 || n%8 != 0 && !last {
				return fmt.Errorf("RLE booleans in runs the decoder would misread (a run of %d of value byte 0x%02X): write the column PLAIN", n, w)
			}
		}
		if total > limit {
			return fmt.Errorf("booleans whose runs declare more than the page's %d values", limit-64)
		}
	}
	return nil
}

// gzipSize inflates the gzip stream of r (all its members, as the
// decoder does) into nothing and returns the bytes it inflates to, at
// most limit+1: memory stays that of one inflater, whatever the stream.
func gzipSize(r io.Reader, limit int64) (int64, error) {
	z, err := gzip.NewReader(r)
	if err != nil {
		return 0, fmt.Errorf("a damaged gzip stream: %w", err)
	}
	n, err := io.Copy(io.Discard, io.LimitReader(z, limit+1))
	if err != nil {
		return n, fmt.Errorf("a damaged gzip stream: %w", err)
	}
	return n, nil
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

// maxDecodedFooter bounds what the footer may decode to, counting every
// element of a list at the size of the largest footer structure
// (structCost): about 250 000 column chunks.
const (
	maxDecodedFooter = 256 << 20
	structCost       = 1024 // the bytes a decoded struct may take (a column chunk takes 560)
	maxThriftDepth   = 32
)

// thriftCheck walks one Thrift compact-protocol struct at the start of b
// (the Apache Thrift compact protocol) without decoding it, and returns its length in bytes. It refuses a string,
// list, set or map that declares more elements or bytes than b has left
// (each element takes at least one byte), nesting deeper than
// maxThriftDepth, and lists whose elements, each counted at structCost
// bytes for a struct and 24 otherwise, come to more than budget bytes:
// the decoder allocates what a header declares before it reads it.
func thriftCheck(b []byte, budget int64) (int, error) {
	w := thriftWalker{b: b, budget: budget, limit: budget}
	if err := w.value(12, 0); err != nil {
		return 0, err
	}
	return w.pos, nil
}

type thriftWalker struct {
	b      []byte
	pos    int
	budget int64 // bytes left to decode to
	limit  int64 // the budget at the start
}

func (w *thriftWalker) byte() (byte, error) {
	if w.pos >= len(w.b) {
		return 0, fmt.Errorf("a truncated Thrift structure")
	}
	c := w.b[w.pos]
	w.pos++
	return c, nil
}

func (w *thriftWalker) uvarint() (uint64, error) {
	v, k := binary.Uvarint(w.b[w.pos:])
	if k <= 0 {
		return 0, fmt.Errorf("a damaged Thrift varint")
	}
	w.pos += k
	return v, nil
}

func (w *thriftWalker) skip(n uint64, what string) error {
	if n > uint64(len(w.b)-w.pos) {
		return fmt.Errorf("a %s of %d bytes, where %d are left", what, n, len(w.b)-w.pos)
	}
	w.pos += int(n)
	return nil
}

// elements checks a container of n elements of type t.
func (w *thriftWalker) elements(n uint64, t byte) error {
	if n > uint64(len(w.b)-w.pos) {
		return fmt.Errorf("a list of %d elements, where %d bytes are left", n, len(w.b)-w.pos)
	}
	cost := int64(24)
	if t == 12 {
		cost = structCost
	}
	w.budget -= int64(n) * cost
	if w.budget < 0 {
		return fmt.Errorf("lists whose elements would decode to more than %d bytes", w.limit)
	}
	return nil
}

// value walks one value of compact type t (a boolean element of a
// container, which takes a byte, is walked by the caller).
func (w *thriftWalker) value(t byte, depth int) error {
	if depth > maxThriftDepth {
		return fmt.Errorf("structures nested deeper than %d in Thrift", maxThriftDepth)
	}
	switch t {
	case 1, 2: // a boolean field: the value is in the type
		return nil
	case 3: // byte
		return w.skip(1, "byte")
	case 4, 5, 6: // i16, i32, i64: zigzag varints
		_, err := w.uvarint()
		return err
	case 7: // double
		return w.skip(8, "double")
	case 8: // binary
		n, err := w.uvarint()
		if err != nil {
			return err
		}
		return w.skip(n, "string")
	case 9, 10: // list, set
		h, err := w.byte()
		if err != nil {
			return err
		}
		n, et := uint64(h>>4), h&0x0f
		if n == 15 {
			if n, err = w.uvarint(); err != nil {
				return err
			}
		}
		if err := w.elements(n, et); err != nil {
			return err
		}
		for range n {
			if et == 1 || et == 2 { // a boolean element takes a byte
				if err := w.skip(1, "boolean"); err != nil {
					return err
				}
				continue
			}
			if err := w.value(et, depth+1); err != nil {
				return err
			}
		}
		return nil
	case 11: // map
		n, err := w.uvarint()
		if err != nil || n == 0 {
			return err
		}
		kv, err := w.byte()
		if err != nil {
			return err
		}
		if err := w.elements(2*n, 12); err != nil {
			return err
		}
		for range n {
			for _, et := range []byte{kv >> 4, kv & 0x0f} {
				if et == 1 || et == 2 {
					if err := w.skip(1, "boolean"); err != nil {
						return err
					}
					continue
				}
				if err := w.value(et, depth+1); err != nil {
					return err
				}
			}
		}
		return nil
	case 12: // struct: fields to a stop byte
		for {
			h, err := w.byte()
			if err != nil {
				return err
			}
			if h == 0 {
				return nil
			}
			if h>>4 == 0 { // a long-form field id follows
				if _, err := w.uvarint(); err != nil {
					return err
				}
			}
			if err := w.value(h&0x0f, depth+1); err != nil {
				return err
			}
		}
	}
	return fmt.Errorf("a Thrift value of unknown type %d", t)
}
