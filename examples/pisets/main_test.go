package main

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"
	"unicode/utf8"
)

func TestDemo(t *testing.T) {
	var out, errb bytes.Buffer
	if code := run(nil, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	// By hand: dp, rho, V, d, mu, L over L, M, T has rank 3, so 3 groups:
	// Δp/(ρV²), μ/(ρVd), L/d.
	for _, want := range []string{"invented", "rank 3, 6 variables, 3 groups", "Π₁ = dp/(rho·V²)", "Π₂ = mu/(rho·V·d)   1/Re", "Π₃ = L/d"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
}

func TestJSON(t *testing.T) {
	var out, errb bytes.Buffer
	args := []string{"-format", "json", "-dep", "F", "-repeat", "rho,V,D", "-sets", "F=N@force", "rho=kg/m^3", "V=m/s", "D=m", "mu=Pa*s"}
	if code := run(args, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	var r Report
	if err := json.Unmarshal(out.Bytes(), &r); err != nil {
		t.Fatal(err)
	}
	// F/(ρV²D²) is only proportional to C_D = F/(½ρV²A): D² stands in for
	// the reference area, and the output says so.
	if r.Rank != 3 || len(r.Groups) != 2 || r.Groups[0].Label != "∝C_D" || r.Groups[1].Label != "1/Re" {
		t.Errorf("report: %+v", r)
	}
	if m := r.Groups[0].Matches[0]; m.Exact || m.Factor != "2" || m.Equation != "C_D = 2·Π₁·D²/A" {
		t.Errorf("C_D match: %+v", m)
	}
	if r.Groups[1].Exponents["mu"] != "1" || r.Groups[1].Exponents["rho"] != "-1" {
		t.Errorf("exponents: %v", r.Groups[1].Exponents)
	}
	if len(r.ValidSets) == 0 || r.Invented {
		t.Errorf("valid sets %v, invented %v", r.ValidSets, r.Invented)
	}
}

func TestBadInput(t *testing.T) {
	cases := [][]string{
		{"x"},
		{"x=furlong"},
		{"-repeat", "a,d", "a=m", "b=s", "d=m"},
		{"-dep", "z", "a=m", "b=s"},
		{"-format", "xml", "a=m", "b=s"},
		{"-nosuchflag"},
		{"a=m", "a=s"},
		{"a=m@density"},
	}
	for _, args := range cases {
		var out, errb bytes.Buffer
		code := run(args, &out, &errb)
		if code != 2 || !strings.HasPrefix(errb.String(), "pisets: ") || strings.Count(errb.String(), "\n") != 1 {
			t.Errorf("%v: exit %d, stderr %q", args, code, errb.String())
		}
	}
}

// FuzzRun checks that no command line makes the program panic, and that
// it always either succeeds or exits 2 with a one-line message.
func FuzzRun(f *testing.F) {
	for _, s := range []string{"F=N@force rho=kg/m^3 V=m/s D=m mu=Pa*s", "x", "a=m b=s", "=", "a=m@", "a=(((m"} {
		f.Add(s, "", "")
	}
	f.Add("dp=kPa rho=kg/m^3 V=m/s d=mm", "dp", "rho,V,d")
	f.Fuzz(func(t *testing.T, vars, dep, rep string) {
		args := []string{"-format", "json"}
		if dep != "" {
			args = append(args, "-dep", dep)
		}
		if rep != "" {
			args = append(args, "-repeat", rep)
		}
		for _, a := range strings.Fields(vars) {
			if strings.HasPrefix(a, "-data") || strings.HasPrefix(a, "-out") || strings.HasPrefix(a, "--data") || strings.HasPrefix(a, "--out") {
				t.Skip("file flags are tested by TestReduceExitCodes; the fuzzer must not write files")
			}
		}
		args = append(args, strings.Fields(vars)...)
		var out, errb bytes.Buffer
		switch code := run(args, &out, &errb); code {
		case 0:
		case 2:
			if strings.Count(errb.String(), "\n") != 1 {
				t.Fatalf("exit 2 with %q", errb.String())
			}
		default:
			t.Fatalf("exit %d: %s", code, errb.String())
		}
	})
}

// TestHostileInput: the harness command answers hostile command lines
// with a usage error (exit 2) whose message is escaped and bounded, and
// -h with the usage (exit 0).
func TestHostileInput(t *testing.T) {
	var out, errb bytes.Buffer
	if code := run([]string{"-h"}, &out, &errb); code != 0 || !strings.Contains(out.String(), "usage: pisets") {
		t.Errorf("-h: exit %d, %q", code, out.String())
	}
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"F=N", "V=m/s", "-format", "json"}, "flags go before the variables"},
		{[]string{"a\x1b[31m=m", "b=s"}, `\x1b`},
		{[]string{"\xff=m", "\xfe=m"}, "not valid UTF-8"},
		{[]string{strings.Repeat("x", 5000) + "=m"}, "…"},
	}
	for _, c := range cases {
		errb.Reset()
		code := run(c.args, &bytes.Buffer{}, &errb)
		msg := errb.String()
		if code != 2 || !strings.Contains(msg, c.want) {
			t.Errorf("%.40q: exit %d, %q; want 2 and %q", c.args, code, msg, c.want)
		}
		if len(msg) > 2000 || strings.ContainsAny(msg, "\x1b\x00") || !utf8.ValidString(msg) {
			t.Errorf("%.40q: unsafe message %q", c.args, msg)
		}
	}
}

// TestUnknownKind: an unknown @kind is a usage error that lists the kinds
// known for the variable's dimension and shows the spec without it.
func TestUnknownKind(t *testing.T) {
	var out, errb bytes.Buffer
	code := run([]string{"-dep", "H", "H=m@head", "g=m/s^2", "n=rev/s", "D=m", "Q=m^3/s"}, &out, &errb)
	msg := errb.String()
	if code != 2 {
		t.Fatalf("exit %d, want 2: %s", code, msg)
	}
	for _, want := range []string{`kind "head"`, "the kinds known for dimension L are length, mean free path", `write "H=m", without the @kind`} {
		if !strings.Contains(msg, want) {
			t.Errorf("%q lacks %q", msg, want)
		}
	}
}
