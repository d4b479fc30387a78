// Package cli holds what every example command does with its flags and
// its exit: a numeric flag that refuses NaN, ±Inf and values outside the
// range that the program can use, naming the flag; an echo of user text
// that is truncated and has its control bytes escaped, so a pasted
// megabyte or a terminal escape sequence never comes back whole or raw;
// and Main, which runs the command and exits with status 2 after a usage
// mistake and 1 after a failure of the job itself.
package cli

import (
	"errors"
	"flag"
	"fmt"
	"io"
	iofs "io/fs"
	"math"
	"os"
	"strconv"
	"strings"
	"unicode/utf8"
)

// MaxEcho is the most runes of user text an error message repeats.
const MaxEcho = 64

// Quote returns s as a Go-quoted string with control bytes and invalid
// UTF-8 escaped, cut to MaxEcho runes with "…" and the full length
// appended when it is longer.
func Quote(s string) string {
	if utf8.RuneCountInString(s) <= MaxEcho {
		return strconv.Quote(s)
	}
	n, i := 0, 0
	for i = range s {
		if n == MaxEcho {
			break
		}
		n++
	}
	return strconv.Quote(s[:i]) + fmt.Sprintf("… (%d bytes)", len(s))
}

// Float is a float64 flag with a closed range [Min, Max]; Set refuses a
// value that does not parse, is NaN or ±Inf, or falls outside the range.
type Float struct {
	V        float64
	Min, Max float64
	Unit     string // how the value is read, for messages ("m/s", "°C")
}

// String returns the value as the flag package prints a default.
func (f *Float) String() string {
	if f == nil {
		return "0"
	}
	return strconv.FormatFloat(f.V, 'g', -1, 64)
}

// Set parses s and checks it.
func (f *Float) Set(s string) error {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil {
		var ne *strconv.NumError
		if errors.As(err, &ne) && errors.Is(ne.Err, strconv.ErrRange) {
			return fmt.Errorf("out of range: the value overflows a float64")
		}
		return fmt.Errorf("not a number")
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return fmt.Errorf("not a finite number")
	}
	if v < f.Min || v > f.Max {
		return fmt.Errorf("outside %s", f.rangeText())
	}
	f.V = v
	return nil
}

func (f *Float) rangeText() string {
	u := ""
	if f.Unit != "" {
		u = " " + f.Unit
	}
	return fmt.Sprintf("%g … %g%s", f.Min, f.Max, u)
}

// FloatVar defines a checked float flag on fs and returns its value's
// address. The usage text gets the accepted range appended.
func FloatVar(fs *flag.FlagSet, name string, def, min, max float64, unit, usage string) *float64 {
	f := &Float{V: def, Min: min, Max: max, Unit: unit}
	fs.Var(f, name, fmt.Sprintf("%s (%s)", usage, f.rangeText()))
	return &f.V
}

// NewFlagSet returns the flag set of the named command: it returns its
// errors (flag.ContinueOnError), and its -h prints about, what the
// program does and what its output means, then the flags.
func NewFlagSet(name, about string) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.Usage = func() {
		fmt.Fprint(fs.Output(), about)
		fs.PrintDefaults()
	}
	return fs
}

// ParseFlags parses args as Parse does and refuses an argument left after
// the flags with a usage error quoting it: the example commands take
// flags only.
func ParseFlags(fs *flag.FlagSet, w io.Writer, args []string) error {
	if err := Parse(fs, w, args); err != nil {
		return err
	}
	if fs.NArg() > 0 {
		return &Error{Program: fs.Name(), Msg: fmt.Sprintf("unexpected argument %s: %s takes flags only", Quote(fs.Arg(0)), fs.Name())}
	}
	return nil
}

// Dir returns a usage error naming the flag unless path is an existing
// directory that a file can be written in (it is checked by creating
// and removing an empty temporary file), so that a command can refuse
// its output directory before it prints its report. The message tells a
// missing directory (create it or pass another) from a path that names
// a file (not a directory) and from one that cannot be written in.
func Dir(flagName, path string) error {
	st, err := os.Stat(path)
	switch {
	case path == "":
		return &Error{Msg: fmt.Sprintf("-%s %s: no directory given; pass an existing directory", flagName, Quote(path))}
	case errors.Is(err, iofs.ErrNotExist):
		return &Error{Msg: fmt.Sprintf("-%s %s: the directory does not exist; create it or pass another", flagName, Quote(path))}
	case err != nil:
		var pe *iofs.PathError
		reason := err
		if errors.As(err, &pe) {
			reason = pe.Err // the path is quoted above, not repeated raw
		}
		return &Error{Msg: fmt.Sprintf("-%s %s: cannot be examined (%v); pass a directory you can read and write", flagName, Quote(path), reason)}
	case !st.IsDir():
		return &Error{Msg: fmt.Sprintf("-%s %s: not a directory (a file of that name exists); pass a directory", flagName, Quote(path))}
	}
	f, err := os.CreateTemp(path, ".write-check-*")
	if err != nil {
		return &Error{Msg: fmt.Sprintf("-%s %s: the directory is not writable; give a directory you can write in", flagName, Quote(path))}
	}
	name := f.Name()
	f.Close()
	os.Remove(name)
	return nil
}

// Sig formats x with n significant figures (n from 1 to 17), trailing
// zeros kept, in plain decimal notation for 1e-5 ≤ |x| < 1e9 and in
// e-notation outside it; the digits before the decimal point are never
// rounded away, so a whole number keeps them all: Sig(0.39904, 4) is
// "0.3990", Sig(4.21875, 4) "4.219", Sig(31534.2, 4) "31534",
// Sig(0.0020287, 3) "0.00203", Sig(113.4, 2) "113". A value never
// rounds to a printed zero unless it is zero; NaN and ±Inf print as
// strconv prints them.
func Sig(x float64, n int) string {
	n = max(1, min(n, 17))
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'g', -1, 64)
	}
	e := strconv.FormatFloat(x, 'e', n-1, 64)
	i := strings.LastIndexByte(e, 'e')
	exp, err := strconv.Atoi(e[i+1:])
	if err != nil || exp < -5 || exp >= 9 {
		return e
	}
	if exp >= n-1 {
		return strconv.FormatFloat(x, 'f', 0, 64)
	}
	v, _ := strconv.ParseFloat(e, 64) // x rounded to n figures
	return strconv.FormatFloat(v, 'f', max(0, n-1-exp), 64)
}

// Parse parses args with fs, which must use flag.ContinueOnError. Usage
// (for -h) goes to w; an error comes back with every piece of user text
// in it quoted by Quote, and the flag package's own echo suppressed.
// flag.ErrHelp is returned as it is.
func Parse(fs *flag.FlagSet, w io.Writer, args []string) error {
	fs.SetOutput(io.Discard)
	err := fs.Parse(args)
	if err == nil || errors.Is(err, flag.ErrHelp) {
		if err != nil {
			fs.SetOutput(w)
			fs.Usage()
		}
		fs.SetOutput(w)
		return err
	}
	fs.SetOutput(w)
	return &Error{Program: fs.Name(), Msg: sanitize(flagFirst(fs, err.Error()))}
}

// flagFirst rewrites the flag package's `invalid value "v" for flag -x:
// reason` as `flag -x: invalid value "v": reason` with v through Quote, so
// that the flag's name survives however long the value is.
func flagFirst(fs *flag.FlagSet, msg string) string {
	const pre = "invalid value "
	if !strings.HasPrefix(msg, pre) {
		return msg
	}
	out := msg
	at := -1
	fs.VisitAll(func(f *flag.Flag) {
		marker := " for flag -" + f.Name + ": "
		i := strings.LastIndex(msg, marker)
		if i < len(pre) || i <= at {
			return
		}
		v, err := strconv.Unquote(msg[len(pre):i])
		if err != nil {
			return
		}
		at = i
		out = "flag -" + f.Name + ": invalid value " + Quote(v) + ": " + msg[i+len(marker):]
	})
	return out
}

// Error is a command-line error: a usage mistake (exit status 2).
type Error struct {
	Program string
	Msg     string
}

func (e *Error) Error() string { return e.Msg }

// Sanitize escapes control bytes and truncates any over-long message
// built from user text; it is used for messages that quote a value
// without Quote.
func sanitize(s string) string {
	var b strings.Builder
	n := 0
	for _, r := range s {
		if n >= 4*MaxEcho {
			fmt.Fprintf(&b, "… (%d bytes)", len(s))
			break
		}
		if r < 0x20 || r == 0x7f || (r >= 0x80 && r < 0xa0) || r == utf8.RuneError {
			q := strconv.QuoteRune(r)
			b.WriteString(q[1 : len(q)-1])
		} else {
			b.WriteRune(r)
		}
		n++
	}
	return b.String()
}

// Sanitize returns s with control bytes escaped and cut to a bounded
// length, for a message that must repeat user text.
func Sanitize(s string) string { return sanitize(s) }

// ExitCode returns the exit status for err, the error of a command's run,
// and prints err, sanitized, to stderr after the command's name: 0 for
// no error or -h (flag.ErrHelp: the usage is printed), 2 for a usage
// mistake (an error that is or wraps a *Error), 1 for a failure of the
// job itself.
func ExitCode(stderr io.Writer, name string, err error) int {
	if err == nil || errors.Is(err, flag.ErrHelp) {
		return 0
	}
	// A library error that already starts with the command's name (the
	// tunnel package's errors in the tunnel command) is not prefixed twice.
	fmt.Fprintln(stderr, name+":", strings.TrimPrefix(Sanitize(err.Error()), name+": "))
	var ce *Error
	if errors.As(err, &ce) {
		return 2
	}
	return 1
}

// Main runs an example command: run with standard output and the
// command-line arguments, then exit with ExitCode's status.
func Main(name string, run func(w io.Writer, args []string) error) {
	os.Exit(ExitCode(os.Stderr, name, run(os.Stdout, os.Args[1:])))
}
