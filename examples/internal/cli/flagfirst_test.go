package cli

import (
	"flag"
	"io"
	"strings"
	"testing"
)

// TestLongValueKeepsFlagName: a refused value of any length leaves the
// flag's name in the message (the name used to follow the echoed value
// and was cut with it), and the value is echoed through Quote.
func TestLongValueKeepsFlagName(t *testing.T) {
	fs := flag.NewFlagSet("t", flag.ContinueOnError)
	FloatVar(fs, "scale", 30, 2, 500, "", "scale")
	long := "1w" + strings.Repeat("(", 300) + "\x1b"
	err := Parse(fs, io.Discard, []string{"-scale", long})
	if err == nil || !strings.HasPrefix(err.Error(), "flag -scale: invalid value ") || !strings.Contains(err.Error(), "not a number") ||
		strings.ContainsRune(err.Error(), 0x1b) || len(err.Error()) > 300 {
		t.Errorf("%q", err)
	}
}
