package chanfile

import (
	"fmt"
	"io"
	"unicode/utf16"
	"unicode/utf8"

	"similis.dev/similis/quantity"
)

// Encoding is the character encoding of a channel file.
type Encoding uint8

// The encodings a Reader reads. The zero value, DetectEncoding, reads
// UTF-8 (with or without a byte-order mark) and UTF-16 with a byte-order
// mark, and refuses a file that is neither, naming the option that reads
// it.
const (
	DetectEncoding Encoding = iota // UTF-8, or UTF-16 by its byte-order mark
	UTF8                           // UTF-8, with or without a byte-order mark
	UTF16LE                        // UTF-16 little-endian, with or without a byte-order mark
	UTF16BE                        // UTF-16 big-endian, with or without a byte-order mark
	Latin1                         // ISO 8859-1: each byte is the code point of the same number
	Windows1252                    // Windows code page 1252: Latin-1 with printable characters in 0x80–0x9F
)

var encodingNames = [...]string{"detect", "UTF-8", "UTF-16LE", "UTF-16BE", "Latin-1", "Windows-1252"}

// String returns the encoding's name: "UTF-16LE", "Windows-1252".
func (e Encoding) String() string {
	if int(e) < len(encodingNames) {
		return encodingNames[e]
	}
	return fmt.Sprintf("Encoding(%d)", uint8(e))
}

// cp1252 maps the bytes 0x80–0x9F of Windows-1252 to their code points
// (0 where the code page leaves the byte undefined); the other bytes are
// those of Latin-1. Source: the Unicode Consortium's vendor mapping table
// for the code page, CP1252.TXT (from memory; each entry checked by
// machine against an independent decoder).
var cp1252 = [32]rune{
	0x20AC, 0, 0x201A, 0x0192, 0x201E, 0x2026, 0x2020, 0x2021,
	0x02C6, 0x2030, 0x0160, 0x2039, 0x0152, 0, 0x017D, 0,
	0, 0x2018, 0x2019, 0x201C, 0x201D, 0x2022, 0x2013, 0x2014,
	0x02DC, 0x2122, 0x0161, 0x203A, 0x0153, 0, 0x017E, 0x0178,
}

// decoder turns a file in UTF-16, Latin-1 or Windows-1252 into UTF-8.
// Its output for n input bytes is at most 3n/2 (UTF-16) or 3n
// (Windows-1252) bytes, produced a block at a time.
type decoder struct {
	src  io.Reader
	enc  Encoding
	name string
	raw  [4096]byte
	keep int    // bytes of raw held from the last read (half a UTF-16 unit)
	out  []byte // decoded bytes not yet returned
	pos  int
	hi   rune  // a high surrogate waiting for its low half, or 0
	in   int64 // input bytes consumed
	err  error
}

func (d *decoder) Read(p []byte) (int, error) {
	for d.pos == len(d.out) {
		if d.err != nil {
			return 0, d.err
		}
		d.fill()
	}
	n := copy(p, d.out[d.pos:])
	d.pos += n
	return n, nil
}

// fill decodes the next block of input into d.out.
func (d *decoder) fill() {
	d.out, d.pos = d.out[:0], 0
	n, err := d.src.Read(d.raw[d.keep:])
	d.in += int64(n)
	b := d.raw[:d.keep+n]
	d.keep = 0
	switch d.enc {
	case Latin1, Windows1252:
		for i, c := range b {
			r := rune(c)
			if c >= 0x80 && c < 0xA0 && d.enc == Windows1252 {
				r = cp1252[c-0x80]
				if r == 0 {
					d.err = &Error{File: d.name, Reason: fmt.Sprintf("byte 0x%02X at byte %d is not a character of Windows-1252 (try Options.Encoding = chanfile.Latin1)", c, d.in-int64(len(b)-i)+1)}
					return
				}
			}
			d.out = utf8.AppendRune(d.out, r)
		}
	case UTF16LE, UTF16BE:
		for len(b) >= 2 {
			var u rune
			if d.enc == UTF16LE {
				u = rune(b[0]) | rune(b[1])<<8
			} else {
				u = rune(b[0])<<8 | rune(b[1])
			}
			b = b[2:]
			switch {
			case d.hi != 0:
				r := utf16.DecodeRune(d.hi, u)
				if r == utf8.RuneError {
					d.err = &Error{File: d.name, Reason: fmt.Sprintf("invalid %v: a high surrogate not followed by a low one, near byte %d", d.enc, d.in-int64(len(b)))}
					return
				}
				d.hi = 0
				d.out = utf8.AppendRune(d.out, r)
			case utf16.IsSurrogate(u) && u < 0xDC00:
				d.hi = u
			case utf16.IsSurrogate(u):
				d.err = &Error{File: d.name, Reason: fmt.Sprintf("invalid %v: a lone low surrogate near byte %d", d.enc, d.in-int64(len(b)))}
				return
			default:
				d.out = utf8.AppendRune(d.out, u)
			}
		}
		if len(b) == 1 {
			d.raw[0] = b[0]
			d.keep = 1
		}
	}
	if err != nil {
		if err == io.EOF && (d.keep != 0 || d.hi != 0) {
			err = &Error{File: d.name, Reason: fmt.Sprintf("invalid %v: the file ends in the middle of a character", d.enc)}
		}
		d.err = err
	}
}

// utf16Hint reports whether a file without a byte-order mark looks like
// UTF-16: many zero bytes in its first bytes, which a text file in UTF-8
// or a code page does not have.
func utf16Hint(b []byte) (Encoding, bool) {
	if len(b) < 4 {
		return 0, false
	}
	even, odd := 0, 0
	for i, c := range b {
		if c == 0 {
			if i%2 == 0 {
				even++
			} else {
				odd++
			}
		}
	}
	switch {
	case odd > len(b)/4 && even == 0:
		return UTF16LE, true
	case even > len(b)/4 && odd == 0:
		return UTF16BE, true
	}
	return 0, false
}

// checkUTF8 refuses a sniffed window that is not valid UTF-8, naming the
// line and the option that reads a file in an 8-bit code page. eof says
// whether the window ends the file (otherwise a character cut at its end
// is not an error).
func checkUTF8(name string, b []byte, eof bool) error {
	if utf8.Valid(b) {
		return nil
	}
	line, off := 1, 0
	for off < len(b) {
		r, n := utf8.DecodeRune(b[off:])
		if r == utf8.RuneError && n == 1 {
			if !eof && len(b)-off < utf8.UTFMax && !utf8.FullRune(b[off:]) {
				return nil
			}
			return &Error{File: name, Line: line, Reason: fmt.Sprintf("byte 0x%02X is not UTF-8: the file is probably in an 8-bit code page (0xB0 is ° in Latin-1 and Windows-1252); read it with Options.Encoding = chanfile.Windows1252 (or chanfile.Latin1)", b[off])}
		}
		if b[off] == '\n' {
			line++
		}
		off += n
	}
	return nil
}

// sourceError keeps the class of a decoding error (ErrParse) and that of
// an I/O error (ErrInvalid).
func sourceError(name string, line int, err error) *Error {
	if e, ok := err.(*Error); ok {
		e.File, e.Line = name, line
		return e
	}
	return &Error{File: name, Line: line, Reason: "read failed", Err: err, class: quantity.ErrInvalid}
}
