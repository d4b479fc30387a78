package cli

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

func TestFloatRefuses(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{"NaN", "not a finite number"},
		{"+Inf", "not a finite number"},
		{"-inf", "not a finite number"},
		{"1e400", "overflows"},
		{"abc", "not a number"},
		{"-1", "outside"},
		{"1e9", "outside"},
	} {
		fs := flag.NewFlagSet("t", flag.ContinueOnError)
		FloatVar(fs, "v", 1, 0, 100, "m/s", "speed")
		err := Parse(fs, io.Discard, []string{"-v", tc.in})
		if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), "-v") {
			t.Errorf("-v %s: got %v, want an error naming -v with %q", tc.in, err, tc.want)
		}
	}
}

func TestFloatAccepts(t *testing.T) {
	fs := flag.NewFlagSet("t", flag.ContinueOnError)
	v := FloatVar(fs, "v", 1, 0, 100, "m/s", "speed")
	if err := Parse(fs, io.Discard, []string{"-v", "2.5"}); err != nil || *v != 2.5 {
		t.Fatalf("got %v, %v", *v, err)
	}
	if math.IsNaN(*v) {
		t.Fatal("NaN")
	}
}

func TestEchoBounded(t *testing.T) {
	fs := flag.NewFlagSet("t", flag.ContinueOnError)
	fs.String("format", "text", "")
	long := strings.Repeat("x", 100_000)
	err := Parse(fs, io.Discard, []string{"-" + long})
	if err == nil || len(err.Error()) > 600 {
		t.Fatalf("message of %d bytes", len(err.Error()))
	}
	err = Parse(flag.NewFlagSet("t", flag.ContinueOnError), io.Discard, []string{"-\x1b[2J"})
	if err == nil || strings.ContainsRune(err.Error(), 0x1b) {
		t.Fatalf("raw escape echoed: %q", err)
	}
	var ce *Error
	if !errors.As(err, &ce) {
		t.Fatalf("not a *cli.Error: %T", err)
	}
	if got := Quote(long); len(got) > 200 || !strings.Contains(got, "100000 bytes") {
		t.Fatalf("Quote: %q", got[:80])
	}
	if got := Quote("a\x1bb"); got != `"a\x1bb"` {
		t.Fatalf("Quote: %s", got)
	}
}

func TestHelp(t *testing.T) {
	fs := flag.NewFlagSet("t", flag.ContinueOnError)
	var b strings.Builder
	FloatVar(fs, "v", 1, 0, 100, "m/s", "speed")
	if err := Parse(fs, &b, []string{"-h"}); !errors.Is(err, flag.ErrHelp) || !strings.Contains(b.String(), "speed (0 … 100 m/s)") {
		t.Fatalf("help: %v\n%s", err, b.String())
	}
}

// TestExitCode checks the exit statuses: 0 for success and -h, 2 for a
// usage mistake (wrapped or not), 1 for a job failure; and that the
// message printed names the command and has its control bytes escaped.
func TestExitCode(t *testing.T) {
	for _, c := range []struct {
		err    error
		want   int
		stderr string
	}{
		{nil, 0, ""},
		{flag.ErrHelp, 0, ""},
		{&Error{Msg: "-scale 0: want 2 … 200"}, 2, "demo: -scale 0: want 2 … 200\n"},
		{fmt.Errorf("parsing: %w", &Error{Msg: "bad"}), 2, "demo: parsing: bad\n"},
		{errors.New("disk full\x1b[2J"), 1, "demo: disk full\\x1b[2J\n"},
	} {
		var sb strings.Builder
		if got := ExitCode(&sb, "demo", c.err); got != c.want || sb.String() != c.stderr {
			t.Errorf("ExitCode(%v) = %d, printed %q; want %d, %q", c.err, got, sb.String(), c.want, c.stderr)
		}
	}
}

// TestParseFlagsAndDir checks that a leftover argument and an -out that
// is not a directory are usage errors quoting the text, and that -h
// prints the about text before the flags.
func TestParseFlagsAndDir(t *testing.T) {
	fs := NewFlagSet("demo", "Usage: demo [flags]\n")
	FloatVar(fs, "scale", 2, 1, 10, "", "scale")
	var ce *Error
	if err := ParseFlags(fs, io.Discard, []string{"-scale", "3", "extra\x1b"}); !errors.As(err, &ce) || ce.Msg != `unexpected argument "extra\x1b": demo takes flags only` {
		t.Errorf("leftover argument: %v", err)
	}
	var sb strings.Builder
	if err := ParseFlags(NewFlagSet("demo", "Usage: demo [flags]\n"), &sb, []string{"-h"}); !errors.Is(err, flag.ErrHelp) || !strings.HasPrefix(sb.String(), "Usage: demo [flags]\n") {
		t.Errorf("-h: %v, printed %q", err, sb.String())
	}
	if err := Dir("out", t.TempDir()); err != nil {
		t.Errorf("a directory refused: %v", err)
	}
	if err := Dir("out", "/nonexistent/dir"); !errors.As(err, &ce) || ce.Msg != `-out "/nonexistent/dir": the directory does not exist; create it or pass another` {
		t.Errorf("no directory: %v", err)
	}
}

// TestDirSaysWhy: a missing directory is said not to exist (create it or
// pass another), a file is "not a directory", and an empty path is said
// to be no directory; each is a usage error naming the flag.
func TestDirSaysWhy(t *testing.T) {
	d := t.TempDir()
	file := filepath.Join(d, "plots.txt")
	if err := os.WriteFile(file, nil, 0o600); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ path, want, not string }{
		{filepath.Join(d, "missing"), "the directory does not exist; create it or pass another", "not a directory"},
		{filepath.Join(d, "missing", "deeper"), "the directory does not exist; create it or pass another", "not a directory"},
		{file, "not a directory (a file of that name exists)", "does not exist"},
		{"", "no directory given", "not a directory"},
	} {
		err := Dir("out", c.path)
		var ce *Error
		if !errors.As(err, &ce) || !strings.HasPrefix(ce.Msg, "-out "+Quote(c.path)+": ") || !strings.Contains(ce.Msg, c.want) || strings.Contains(ce.Msg, c.not) {
			t.Errorf("Dir(%q) = %v, want a usage error saying %q", c.path, err, c.want)
		}
	}
}

func TestSig(t *testing.T) {
	for _, tc := range []struct {
		x    float64
		n    int
		want string
	}{
		{0.39900, 2, "0.40"},           // 0.6 × 700 Pa × 0.00095 m² = 0.399 N
		{4.21875, 4, "4.219"},          // 84.375 mm × 50
		{31534.2, 4, "31534"},          // a pressure in Pa
		{0.1 / 4929.5, 3, "0.0000203"}, // 2.0286e-5 m³/s
		{0.00202860, 3, "0.00203"},
		{-1.6049, 3, "-1.60"},
		{2.4243, 3, "2.42"},
		{999.96, 3, "1000"},
		{0, 3, "0"},
		{1.23e-7, 3, "1.23e-07"},
		{6.02e23, 3, "6.02e+23"},
		{1, 1, "1"},
		{5768.4, 3, "5768"},
		{113.4, 2, "113"},
		{0.0100, 2, "0.010"},
		{9.96, 2, "10"},
	} {
		if got := Sig(tc.x, tc.n); got != tc.want {
			t.Errorf("Sig(%v, %d) = %q, want %q", tc.x, tc.n, got, tc.want)
		}
	}
}

func TestSigNeverZero(t *testing.T) {
	for _, x := range []float64{1e-5, 3e-5, 0.004, 0.049, 0.5} {
		for n := 1; n <= 4; n++ {
			if s := Sig(x, n); strings.Trim(s, "0.") == "" {
				t.Errorf("Sig(%v, %d) = %q: a non-zero value printed as zero", x, n, s)
			}
		}
	}
}

func TestDirRefuses(t *testing.T) {
	for _, p := range []string{"/nonexistent/dir", ""} {
		err := Dir("out", p)
		var ce *Error
		if !errors.As(err, &ce) || !strings.Contains(err.Error(), "-out") {
			t.Errorf("Dir(%q) = %v, want a usage error naming -out", p, err)
		}
	}
	if err := Dir("out", t.TempDir()); err != nil {
		t.Errorf("a temporary directory: %v", err)
	}
}

func TestDirNotWritable(t *testing.T) {
	d := t.TempDir()
	if err := os.Chmod(d, 0o500); err != nil {
		t.Skip(err)
	}
	defer os.Chmod(d, 0o700)
	if f, err := os.CreateTemp(d, "probe"); err == nil { // root writes anyway
		f.Close()
		os.Remove(f.Name())
		t.Skip("running with permission to write a read-only directory")
	}
	if err := Dir("out", d); err == nil || !strings.Contains(err.Error(), "not writable") {
		t.Errorf("read-only directory: %v, want not writable", err)
	}
}

func TestExitCodeNoDoubledPrefix(t *testing.T) {
	var sb strings.Builder
	if c := ExitCode(&sb, "tunnel", errors.New("tunnel: polar fit: 2 points")); c != 1 || sb.String() != "tunnel: polar fit: 2 points\n" {
		t.Errorf("got %d, %q; want 1 and the name once", c, sb.String())
	}
}

// FuzzSig: Sig's text reads back as x to within half a unit of its n-th
// significant figure, and a non-zero x never prints as zero.
func FuzzSig(f *testing.F) {
	f.Add(0.39904, 4)
	f.Add(31534.2, 4)
	f.Add(-2.0286e-5, 3)
	f.Add(9.96, 2)
	f.Fuzz(func(t *testing.T, x float64, n int) {
		if math.IsNaN(x) || math.IsInf(x, 0) || x == 0 || n < 1 || n > 17 {
			return
		}
		s := Sig(x, n)
		v, err := strconv.ParseFloat(s, 64)
		if err != nil || v == 0 {
			t.Fatalf("Sig(%v, %d) = %q: %v", x, n, s, err)
		}
		if rel := math.Abs(v/x - 1); rel > 0.5*math.Pow(10, float64(1-n))*1.000001+1e-15 {
			t.Fatalf("Sig(%v, %d) = %q, off by %g", x, n, s, rel)
		}
	})
}
