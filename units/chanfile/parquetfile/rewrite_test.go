package parquetfile

import (
	"bytes"
	"encoding/binary"
	"fmt"
	"hash/crc32"

	"github.com/parquet-go/parquet-go/encoding/thrift"
	"github.com/parquet-go/parquet-go/format"
)

// page is one page of a column chunk as rewrite hands it to an edit.
type page struct {
	group, column, index int // from 0
	codec                format.CompressionCodec
	header               format.PageHeader
	body                 []byte // as stored (compressed)
	// patch, if an edit sets it, changes the page header's bytes after
	// they are encoded.
	patch func(header []byte) []byte
}

// rewrite rebuilds the Parquet file b page by page: edit may change each
// page's header and body (it returns the new body); the page sizes, the
// checksums of pages that have one, the chunk offsets and sizes are made
// to agree again, and the page index, which the reader skips, is dropped.
// meta, if not nil, edits the footer last. The file b must be valid.
func rewrite(b []byte, edit func(p *page) []byte, meta func(md *format.FileMetaData)) ([]byte, error) {
	var proto thrift.CompactProtocol
	n := int(binary.LittleEndian.Uint32(b[len(b)-8:]))
	var md format.FileMetaData
	if err := thrift.Unmarshal(&proto, b[len(b)-8-n:len(b)-8], &md); err != nil {
		return nil, err
	}
	out := []byte("PAR1")
	for g := range md.RowGroups {
		rg := &md.RowGroups[g]
		rgStart := int64(len(out))
		for c := range rg.Columns {
			cc := &rg.Columns[c]
			m := &cc.MetaData
			start := m.DataPageOffset
			if m.DictionaryPageOffset > 0 && m.DictionaryPageOffset < start {
				start = m.DictionaryPageOffset
			}
			chunk := b[start : start+m.TotalCompressedSize]
			newStart := int64(len(out))
			m.DictionaryPageOffset, m.DataPageOffset = 0, 0
			m.IndexPageOffset, m.BloomFilterOffset, m.BloomFilterLength = 0, 0, 0
			cc.ColumnIndexOffset, cc.ColumnIndexLength, cc.OffsetIndexOffset, cc.OffsetIndexLength = 0, 0, 0, 0
			r := bytes.NewReader(chunk)
			for i := 0; r.Len() > 0; i++ {
				p := &page{group: g, column: c, index: i, codec: m.Codec}
				if err := thrift.NewDecoder(proto.NewReader(r)).Decode(&p.header); err != nil {
					return nil, fmt.Errorf("page %d: %v", i, err)
				}
				at := len(chunk) - r.Len()
				p.body = bytes.Clone(chunk[at : at+int(p.header.CompressedPageSize)])
				r.Seek(int64(p.header.CompressedPageSize), 1)
				body := p.body
				if edit != nil {
					body = edit(p)
				}
				h := p.header
				h.CompressedPageSize = int32(len(body))
				if h.CRC != 0 {
					h.CRC = int32(crc32.ChecksumIEEE(body))
				}
				hb, err := thrift.Marshal(&proto, &h)
				if err != nil {
					return nil, err
				}
				if p.patch != nil {
					hb = p.patch(hb)
				}
				pos := int64(len(out))
				if h.DictionaryPageHeader.Valid {
					m.DictionaryPageOffset = pos
				} else if m.DataPageOffset == 0 {
					m.DataPageOffset = pos
				}
				out = append(out, hb...)
				out = append(out, body...)
			}
			m.TotalCompressedSize = int64(len(out)) - newStart
			cc.FileOffset = newStart
		}
		rg.FileOffset = rgStart
		rg.TotalCompressedSize = int64(len(out)) - rgStart
	}
	if meta != nil {
		meta(&md)
	}
	fb, err := thrift.Marshal(&proto, &md)
	if err != nil {
		return nil, err
	}
	out = append(out, fb...)
	out = binary.LittleEndian.AppendUint32(out, uint32(len(fb)))
	return append(out, "PAR1"...), nil
}
