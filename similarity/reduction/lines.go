package reduction

import (
	"bufio"
	"bytes"
	"os"

	"similis.dev/similis/units/chanfile"
)

// LineOfRow returns the line of the text channel file at path that holds
// data row row (from 1), reading the file as chanfile.Reader does: a
// byte-order mark skipped, empty lines and lines starting with '#'
// skipped (a line of spaces is a row, as it is to the reader), the first
// other line the header; 0 if the file cannot be read or is shorter.
// It reads the file again, so it is for messages, not for a loop.
func LineOfRow(path string, row int) int {
	f, err := os.Open(path)
	if err != nil {
		return 0
	}
	defer f.Close()
	br := bufio.NewReaderSize(f, chanfile.MaxLineLen)
	if b, err := br.Peek(3); err == nil && string(b) == "\xef\xbb\xbf" {
		br.Discard(3)
	}
	line, data := 0, -1 // data: rows seen, −1 before the header
	for {
		b, err := br.ReadSlice('\n')
		if len(b) == 0 && err != nil {
			return 0
		}
		line++
		b = bytes.TrimSuffix(bytes.TrimSuffix(b, []byte{'\n'}), []byte{'\r'})
		if len(b) > 0 && b[0] != '#' {
			if data++; data == row {
				return line
			}
		}
		if err != nil && err != bufio.ErrBufferFull {
			return 0
		}
	}
}
