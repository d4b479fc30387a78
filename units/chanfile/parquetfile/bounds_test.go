package parquetfile

import (
	"bytes"
	"strings"
	"testing"
)

// TestThriftCheck: the walk of a Thrift compact-protocol struct measures
// what is well formed and refuses what declares more than it holds.
func TestThriftCheck(t *testing.T) {
	deep := append(bytes.Repeat([]byte{0x1C}, 40), bytes.Repeat([]byte{0}, 41)...) // struct in struct, 40 deep
	for _, tc := range []struct {
		name string
		b    []byte
		n    int    // the length walked, if well formed
		says string // the refusal, if not
	}{
		{"empty struct", []byte{0}, 1, ""},
		{"i32 and string", []byte{0x15, 0x04, 0x18, 0x02, 'h', 'i', 0}, 7, ""},
		{"long field id", []byte{0x05, 0x0A, 0x04, 0}, 4, ""},
		{"bools", []byte{0x11, 0x12, 0x19, 0x21, 0x01, 0x02, 0}, 7, ""},
		{"list of i32", []byte{0x19, 0x35, 0x02, 0x04, 0x06, 0}, 6, ""},
		{"map", []byte{0x1B, 0x01, 0x85, 0x01, 'k', 0x02, 0}, 7, ""},
		{"string too long", []byte{0x18, 0x05, 'h', 'i', 0}, 0, "a string of 5 bytes"},
		{"list too long", []byte{0x19, 0xF5, 0x10, 0}, 0, "a list of 16 elements"},
		{"map too long", []byte{0x1B, 0x40, 0x55, 0}, 0, "a list of 128 elements"},
		{"truncated", []byte{0x15, 0x04}, 0, "truncated"},
		{"bad type", []byte{0x1F, 0}, 0, "unknown type 15"},
		{"deep", deep, 0, "nested deeper than 32"},
	} {
		n, err := thriftCheck(tc.b, 1<<20)
		if tc.says == "" && (err != nil || n != tc.n) || tc.says != "" && (err == nil || !strings.Contains(err.Error(), tc.says)) {
			t.Errorf("%s: %d, %v; want %d or an error saying %q", tc.name, n, err, tc.n, tc.says)
		}
	}
	// The budget counts a struct element at structCost bytes.
	list := append([]byte{0x19, 0xFC, 0x80, 0x01}, bytes.Repeat([]byte{0}, 129)...) // 128 empty structs
	if _, err := thriftCheck(list, 127*structCost); err == nil || !strings.Contains(err.Error(), "would decode to more than") {
		t.Errorf("128 structs in a budget of 127: %v", err)
	}
	if n, err := thriftCheck(list, 128*structCost); err != nil || n != len(list) {
		t.Errorf("128 structs in a budget of 128: %d, %v", n, err)
	}
}
