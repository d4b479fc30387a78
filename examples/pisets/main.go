// Command pisets prints the Buckingham Pi set of a problem given on its
// command line, for test harnesses and scripts: the groups with their
// names, the dimensional matrix and its rank, as text or JSON.
//
// Usage:
//
//	pisets [flags] symbol=unit[@kind] ...
//
// Each variable is a symbol, '=', a unit expression giving its dimension,
// and optionally '@' and a kind of quantity:
//
//	pisets -dep F -repeat rho,V,D 'F=N@force' rho=kg/m^3 V=m/s D=m mu=Pa*s
//
// Flags:
//
//	-dep SYMBOL        the dependent variable (its group comes first)
//	-repeat A,B,C      the repeating set; default: the documented rule
//	-format text|json  output format (default text)
//	-sets              also list every valid repeating set
//
// With -data it reduces a channel file instead: every variable is the
// channel of its name or a derived channel defined by -derive in the
// formula language of units/formula, and the groups of every row are
// written as CSV (comment lines # with each group's definition, then a
// header of the groups' columns, [1]: the trade's symbol where a group is
// exactly one, Re, Fr, K_T, else Π₁, Π₂, …) with a summary of the
// reading on standard error. Only the channels the variables and -derive
// use are parsed; a text or bad value in another column is never read:
//
//	pisets -data pumploop.csv -baro 1002hPa \
//	    -derive 'dp = P2 - P1; D = 0.25 {m}; rho = 998.2 {kg/m^3}' \
//	    -dep dp -repeat n,D,rho dp=Pa Q=m^3/s n=rad/s D=m rho=kg/m^3
//
//	-data FILE         a channel file to reduce (CSV; TSV if it ends in .tsv;
//	                   Parquet, units in its metadata, if it ends in .parquet)
//	-derive TEXT       derived channels, as 'dp = P2 - P1'
//	-baro P            the ambient pressure gauge channels were read against;
//	                   not needed where they enter only as differences
//	                   (dp = P2 - P1), where it cancels
//	-std-atm           use 101325 Pa for it, an explicit choice
//	-out FILE          write the groups there instead of standard output
//	-fit               fit the dependent group as a power law of the others
//	                   (intervals, R², range of validity, on standard error)
//	-plot FILE         with -fit and two groups: a .png or .svg of rows and fit
//	-plot-width, -plot-height IN, -dpi N
//	                   the plot's size in inches and a PNG's resolution
//	-nonfinite error|missing
//	                   a derived value that is not finite (0/0) where every
//	                   channel is present: an error with its line (the
//	                   default), or a missing value counted on standard error
//	-fluids            -derive may call nu_water(T), rho_water(T), … of
//	                   package fluids
//	-runs LABEL        steady points instead of rows: each run of the label
//	                   channel (0 is no run), reduced to each channel's mean
//	                   with the standard uncertainty of the mean (s/√n_eff)
//	                   and each group with its uncertainty; -min-run N
//	-zero FROM,TO      with -runs: the zero window on the time channel
//	                   (-time, default t), subtracted from the channels of
//	-tare A,B          (the dynamometer's)
//	-format csv|jsonl|json|text|parquet
//	                   the groups as CSV (the default; text is the same), JSON
//	                   lines ({"row":1,"Π₁":0.17,"Re":2.1e5}, keys as the CSV's
//	                   columns, null when missing; json is the same) or
//	                   Parquet (with -out; implied by -out x.parquet; the
//	                   definitions in its metadata, similis.group.<column>)
//
// A channel binds to a variable only when its unit converts to the
// variable's by the rules of units.ConvertUnits: rpm into rad/s or rev/s,
// never Hz into rad/s (write the channel as (Hz)*rev, or declare the
// variable in Hz). A variable declared in rev/s, rpm or Hz holds
// revolutions, and its groups are labelled accordingly (K_T, not
// K_T/(4π²)).
//
// On a terminal, a long file (over 4 MiB of text or 10⁵ Parquet rows)
// shows a progress bar on standard error, cleared when the file is done.
//
// With no variables it runs on a built-in invented problem (the bench test
// of a flow restrictor). It exits 0 on success, 1 with the file and line
// (the row for Parquet) for bad data, and 2 with a one-line message on
// standard error for bad usage.
package main

import (
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units"
)

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

// builtin is an invented problem: pressure drop across a flow restrictor.
var builtin = []string{"dp=kPa@pressure difference", "rho=kg/m^3", "V=m/s", "d=mm", "mu=mPa*s", "L=mm"}

type usageError struct{ msg string }

func (e *usageError) Error() string { return e.msg }

// usageText is what -h prints before the flags.
const usageText = `pisets finds the Buckingham Pi groups of a problem, or reduces a logged
channel file to those groups row by row.

usage: pisets [-dep symbol] [-repeat a,b,c] [-format text|json] [-sets] symbol=unit[@kind] ...
       pisets -data file [-derive text] [-baro p | -std-atm] [-out file] [-format csv|jsonl|json|parquet]
              [-fit [-plot fit.png]] [-dep symbol] [-repeat a,b,c] symbol=unit[@kind] ...

Each variable is symbol=unit, with an optional @kind ("dp=kPa@pressure difference");
the unit gives its dimension. A rotational speed declared in rad/s is held in
radians; one in rev/s or rpm, or a rotational frequency in Hz or 1/s (ISO 80000-3),
is held in revolutions, and a group's label says which: with n in rad/s
T/(ρ·n²·D⁴) is K_T/(4π²), with n in rev/s it is K_T itself. A speed declared
in turns (rpm, rev/s, rad/s) is a rotational speed n, so V/(n·D) is the advance
coefficient J; one in Hz or 1/s is a frequency f, so f·D/V is the Strouhal number
(add "@rotational speed" to read it as n). A force with no kind over ρ·V²·L² is
labelled ∝C_D (∝C_T for a hull's resistance): add @resistance for C_T, or @drag
for C_D alone. Every group with a rotational speed states its definition and n's
measure (ψ_p = Δp/(ρ·n²·D²), n in revolutions per second).

Output without -data:
  text  the variables, the dimensional matrix and its rank, the repeating set,
        and each group Π₁, Π₂, … with what it is (Re, 1/Re, K_T/(4π²), ∝C_D:
        only proportional, a length standing in for a reference area)
  json  the same as one JSON object (exponents exact, as fractions)

With -data (input kinds):
  CSV       a channel file, units in the header ("Q m3/h", "P1 psig", "n [rpm]")
  TSV       the same, tab-separated, when the name ends in .tsv
  Parquet   when the name ends in .parquet, each column's unit in the file's metadata
  derived   channels defined by -derive in the formula language, as
            'dp = P2 - P1; D = 0.25 {m}' (values in SI, angles in radians)
Each variable is the channel of its name or a derived channel; only those channels
and the ones -derive reads are parsed, so a text column or a bad value in a column
nobody uses does not stop the reduction. A channel binds to
a variable only when its unit converts to the variable's unit: rpm to rad/s or
rev/s is read, Hz to rad/s is refused (write the channel as (Hz)*rev, or declare
the variable in Hz). A gauge channel (psig, barg) is absolute only with -baro or
-std-atm; without either, gauge channels may enter only through derived channels
in which the ambient cancels (dp = P2 - P1, all read against the one ambient;
checked on the file's first rows and said on standard error), and such a derived
channel is a pressure difference.

Output with -data (formats), one line or record per data row, groups in order,
each group's column named by the trade's symbol where the group is exactly one
(Re, Fr, Eu, K_T, …), else Π₁, Π₂, …:
  csv      (the default) comment lines "# group<TAB>column<TAB>definition<TAB>label",
           a header such as Π₁ [1],Re [1], then the values; NaN where a value is
           missing (the channel files' missing marker)
  jsonl    one JSON object per row, {"row":1,"Π₁":0.17,"Re":2.1e5}, the same keys,
           null when missing
  json     the same as jsonl
  text     the same as csv (or Parquet with -out x.parquet)
  parquet  an Apache Parquet file (needs -out), unit 1 on every column, each
           definition in the file's metadata under similis.group.<column>
Standard error gets every reading of the header, each group's definition and
name, the missing values of each channel, and with -fit the power law
Π₁ = C·Π₂^a·… fitted by least squares on logarithms, with 95 % intervals that
allow for correlated rows (effective rows n_eff = n(1 − r₁)/(1 + r₁), r₁ the
lag-1 autocorrelation of the residuals, common practice), a runs test on the
residuals' signs for lack of fit, and a warning when Π₁ and another
group share a variable.

With -runs LABEL (steady points), one row per run of the label channel:
  point, label, first row, last row, drifting, then for each channel its mean,
  u(name), the standard uncertainty of the mean (s/√n_eff, n_eff from the
  samples' autocorrelation, plus the zero's with -zero/-tare), n_eff(name), then
  each group (Re, Fr, … where a group is exactly one) and u(group), all k = 1;
  comment lines (#) carry each point's rows and each group's definition.
-out writes its file whole or not at all (a temporary file renamed at the end).

Exit status: 0 done; 1 bad data (file:line, or file: row for Parquet); 2 usage.

Flags:
`

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("pisets", flag.ContinueOnError)
	dep := fs.String("dep", "", "the dependent variable (its group comes first)")
	rep := fs.String("repeat", "", "comma-separated repeating set; default: the documented rule")
	format := fs.String("format", "text", "output: text or json; with -data csv, jsonl, json or parquet")
	sets := fs.Bool("sets", false, "list every valid repeating set")
	var ro reduceOptions
	fs.StringVar(&ro.data, "data", "", "a channel file to reduce (CSV; TSV if .tsv; Parquet if .parquet)")
	fs.StringVar(&ro.derive, "derive", "", "formula text defining derived channels, as 'dp = P1 - P2; D = 0.25 {m}'")
	fs.StringVar(&ro.baro, "baro", "", "the absolute ambient pressure gauge channels were read against, as 1002hPa; not needed where gauge channels enter only as differences (dp = P2 - P1)")
	fs.BoolVar(&ro.stdAtm, "std-atm", false, "read gauge channels against the standard atmosphere (101325 Pa), an explicit choice")
	fs.BoolVar(&ro.fit, "fit", false, "with -data: fit the dependent group as a power law of the others, with 95 % intervals")
	fs.StringVar(&ro.plot, "plot", "", "with -data -fit and two groups: draw the rows and the fit to a .png or .svg file")
	fs.BoolVar(&ro.fluids, "fluids", false, "with -data: -derive may call the fluid properties, as nu = nu_water(T_w) (T in K or a channel in °C)")
	runs := fs.String("runs", "", "with -data: steady points are the runs of this label channel (label 0 is no run), each channel's mean with its uncertainty")
	minRun := cli.FloatVar(fs, "min-run", 100, 3, 1e9, "samples", "with -runs: the fewest samples of a run")
	zero := fs.String("zero", "", "with -runs: the zero window FROM,TO on the time channel, as 0.5s,2s")
	timeCh := fs.String("time", "t", "with -zero: the time channel")
	tare := fs.String("tare", "", "with -zero: comma-separated channels the zero is subtracted from")
	nonfinite := fs.String("nonfinite", "error", "with -data: a derived value that is not finite (0/0) is an error, or with 'missing' a counted missing value")
	ro.plotW = cli.FloatVar(fs, "plot-width", 6, 2, 40, "in", "-plot width")
	ro.plotH = cli.FloatVar(fs, "plot-height", 4, 2, 40, "in", "-plot height")
	ro.dpi = cli.FloatVar(fs, "dpi", 150, 36, 1200, "dots per inch", "-plot resolution of a .png")
	outPath := fs.String("out", "", "with -data: write the groups to this file instead of standard output")
	fs.Usage = func() {
		fmt.Fprint(fs.Output(), usageText)
		fs.PrintDefaults()
	}
	usage := func(msg string) int {
		fmt.Fprintln(stderr, "pisets:", clean(msg))
		return 2
	}
	if err := cli.Parse(fs, stdout, args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return 0
		}
		return usage(err.Error())
	}
	vars := fs.Args()
	for _, a := range vars {
		if strings.HasPrefix(a, "-") {
			return usage(fmt.Sprintf("%s after the variables: flags go before the variables (pisets -format json -dep F F=N ...)", cli.Quote(a)))
		}
	}
	demo := false
	if len(vars) == 0 && ro.data != "" {
		return usage("-data needs the variables of the problem (pisets -data loop.csv -dep dp dp=Pa Q=m^3/s ...)")
	}
	switch *nonfinite {
	case "error":
	case "missing":
		ro.nonfiniteMissing = true
	default:
		return usage(fmt.Sprintf("-nonfinite %s: want error or missing", cli.Quote(*nonfinite)))
	}
	if *runs != "" {
		p := reduction.Runs(*runs, int(*minRun), 0)
		ro.points = &p
		if ro.jsonl || *format == "json" || *format == "jsonl" {
			return usage("-runs writes a channel file (csv or parquet), not JSON")
		}
		if ro.fit || ro.plot != "" {
			return usage("-fit and -plot go with the row-by-row reduction, not -runs")
		}
	}
	if (*zero != "" || *tare != "") && *runs == "" {
		return usage("-zero and -tare go with -runs")
	}
	if (*zero == "") != (*tare == "") {
		return usage("-zero and -tare go together: the window and the channels it is subtracted from")
	}
	if *zero != "" {
		sp, err := parseSpan(*zero)
		if err != nil {
			return usage("-zero: " + err.Error())
		}
		z := reduction.Spans(*timeCh, sp)
		ro.zero = &z
		ro.tare = strings.Split(*tare, ",")
	}
	if ro.data == "" && (*runs != "" || ro.fluids || ro.derive != "" || ro.baro != "" || ro.stdAtm || *outPath != "" || ro.fit || ro.plot != "" || ro.nonfiniteMissing) {
		return usage("-derive, -baro, -std-atm, -out, -fit, -plot, -nonfinite, -fluids and -runs go with -data")
	}
	if ro.plot != "" {
		if !ro.fit {
			return usage("-plot draws the fit: give -fit too")
		}
		if ext := strings.ToLower(filepath.Ext(ro.plot)); ext != ".png" && ext != ".svg" {
			return usage(fmt.Sprintf("-plot %s: want a .png or .svg file", cli.Quote(ro.plot)))
		}
	}
	if len(vars) == 0 {
		vars, demo = builtin, true
		if *dep == "" {
			*dep = "dp"
		}
	}
	out, err := build(vars, *dep, *rep, *sets)
	if err != nil {
		return usage(err.Error())
	}
	out.Invented = demo
	if ro.data != "" {
		toParquet := strings.EqualFold(filepath.Ext(*outPath), ".parquet")
		switch *format {
		case "text":
			ro.parquet = toParquet
		case "csv":
		case "json", "jsonl":
			ro.jsonl = true
		case "parquet":
			ro.parquet = true
		default:
			return usage(fmt.Sprintf("-format %s with -data: want csv, jsonl, json, text or parquet", cli.Quote(*format)))
		}
		if ro.parquet && *outPath == "" {
			return usage("-format parquet writes a file: give -out groups.parquet")
		}
		if _, err := os.Stat(ro.data); err != nil {
			return usage(fmt.Sprintf("-data %s: %v", cli.Quote(ro.data), errors.Unwrap(err)))
		}
		var err error
		if *outPath != "" {
			// Whole or not at all: a failure leaves no partial output and
			// a file already there untouched.
			err = reduction.WriteFile(*outPath, func(w io.Writer) error { return reduce(out, ro, w, stderr) })
		} else {
			err = reduce(out, ro, stdout, stderr)
		}
		if err != nil {
			var re *reduction.Error
			if errors.As(err, &re) && re.Op == "" && re.File == *outPath {
				return usage(fmt.Sprintf("-out %s: %v", cli.Quote(*outPath), err))
			}
			fmt.Fprintln(stderr, "pisets:", clean(err.Error()))
			return exitCode(err)
		}
		return 0
	}
	switch *format {
	case "json":
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(out); err != nil {
			fmt.Fprintln(stderr, "pisets:", err)
			return 1
		}
	case "text":
		writeText(stdout, out)
	default:
		return usage(fmt.Sprintf("-format %s: want text or json (csv, jsonl and parquet go with -data)", cli.Quote(*format)))
	}
	return 0
}

// maxMessage bounds a message's length in runes.
const maxMessage = 600

// clean makes a message safe for a terminal or a log: control characters
// and invalid bytes escaped, and an overlong message cut with an
// ellipsis, so a hostile argument cannot flood or drive the screen.
func clean(msg string) string {
	var sb strings.Builder
	n := 0
	for i, r := range msg {
		if n == maxMessage {
			sb.WriteString("…")
			break
		}
		switch {
		case r == utf8.RuneError && len(msg[i:]) > 0 && !utf8.ValidString(msg[i:min(i+4, len(msg))]):
			fmt.Fprintf(&sb, `\x%02x`, msg[i])
		case r == '\n' || r == '\t':
			sb.WriteByte(' ')
		case unicode.IsControl(r) || !unicode.IsPrint(r) && r != ' ':
			q := strconv.QuoteRune(r)
			sb.WriteString(q[1 : len(q)-1])
		default:
			sb.WriteRune(r)
		}
		n++
	}
	return sb.String()
}

// Report is the JSON output.
type Report struct {
	Invented      bool          `json:"invented,omitempty"`
	Variables     []VariableOut `json:"variables"`
	Bases         []string      `json:"bases"`
	Matrix        [][]string    `json:"matrix"`
	Rank          int           `json:"rank"`
	RankNote      string        `json:"rank_note,omitempty"`
	Repeating     []string      `json:"repeating"`
	DefaultChosen bool          `json:"repeating_by_default_rule"`
	Groups        []GroupOut    `json:"groups"`
	ValidSets     [][]string    `json:"valid_repeating_sets,omitempty"`
	table         string        // the text matrix
	units         []units.Unit  // each variable's declared unit
	set           *pigroups.Set // for text output
	problem       *pigroups.Problem
}

// VariableOut describes one variable.
type VariableOut struct {
	Symbol    string   `json:"symbol"`
	Unit      string   `json:"unit"`
	Dimension string   `json:"dimension"`
	Kinds     []string `json:"kinds"`
	Dependent bool     `json:"dependent,omitempty"`
	// Angle is "rev" for a variable that holds a rotational speed in
	// revolutions (declared in rev/s, rpm or Hz); empty for radians.
	Angle string `json:"angle,omitempty"`
}

// GroupOut describes one group.
type GroupOut struct {
	Name      string            `json:"name"`
	Plain     string            `json:"plain"`
	Unicode   string            `json:"unicode"`
	LaTeX     string            `json:"latex"`
	Exponents map[string]string `json:"exponents"`
	Label     string            `json:"label"`
	Matches   []MatchOut        `json:"matches,omitempty"`
}

// MatchOut is one recognition of a group: the group is (Symbol/Factor)^Power
// when Exact, and only proportional to Symbol^Power otherwise; Equation
// gives the named group in terms of this one, and Definition the trade's
// definition with its conventions (n in rev/s for K_T).
type MatchOut struct {
	Name       string   `json:"name"`
	Symbol     string   `json:"symbol"`
	Label      string   `json:"label"`
	Power      string   `json:"power"`
	Factor     string   `json:"factor"`
	Exact      bool     `json:"exact"`
	Equation   string   `json:"equation"`
	Definition string   `json:"definition"`
	Assumed    []string `json:"assumed,omitempty"`
}

func build(specs []string, dep, rep string, listSets bool) (*Report, error) {
	var vars []pigroups.Variable
	r := &Report{}
	for _, spec := range specs {
		sym, rest, ok := strings.Cut(spec, "=")
		if !ok || sym == "" || rest == "" {
			return nil, &usageError{fmt.Sprintf("variable %s: want symbol=unit or symbol=unit@kind", cli.Quote(spec))}
		}
		unit, kind, _ := strings.Cut(rest, "@")
		u, err := units.Parse(unit)
		if err != nil {
			return nil, fmt.Errorf("variable %s: %w", cli.Quote(sym), err)
		}
		am, err := angleMeasure(u)
		if err != nil {
			return nil, &usageError{fmt.Sprintf("variable %s: %v", cli.Quote(spec), err)}
		}
		if plane, _ := u.Angle(); kind == "" && plane != 0 && u.Dim() == quantity.AngularVelocity {
			// A speed counted in rev, rpm or rad turns: a rotational
			// speed n (V/(n·D) is the advance coefficient J), where a
			// frequency in Hz or 1/s is a frequency f (f·L/V is St).
			kind = "rotational speed"
		}
		v := pigroups.Variable{Symbol: sym, Dim: u.Dim(), Kind: kind, Angle: am}
		r.units = append(r.units, u)
		if sym == dep {
			v.Role = pigroups.Dependent
		}
		vars = append(vars, v)
		vo := VariableOut{Symbol: sym, Unit: u.Format(quantity.Unicode), Dimension: u.Dim().String(), Dependent: sym == dep}
		if am == pigroups.Revolutions && (u.Dim() == quantity.Frequency) {
			vo.Angle = am.String()
		}
		r.Variables = append(r.Variables, vo)
	}
	if dep != "" && !slicesContains(r.Variables, dep) {
		return nil, &usageError{fmt.Sprintf("-dep %s is not among the variables", cli.Quote(dep))}
	}
	p, err := pigroups.NewProblem(vars...)
	var pe *pigroups.Error
	if errors.Is(err, pigroups.ErrUnknownKind) && errors.As(err, &pe) {
		// The fix in this command's syntax: the spec without its @kind.
		for i, v := range vars {
			if v.Symbol == pe.Symbol {
				unit, _, _ := strings.Cut(specs[i], "@")
				return nil, &usageError{fmt.Sprintf("%v: write %s, without the @kind", err, cli.Quote(unit))}
			}
		}
	}
	if err != nil {
		return nil, err
	}
	for i := range r.Variables {
		r.Variables[i].Kinds, _ = p.Kinds(i)
	}
	for _, b := range p.Bases() {
		r.Bases = append(r.Bases, b.String())
	}
	for _, row := range p.Matrix() {
		var cells []string
		for _, x := range row {
			cells = append(cells, x.String())
		}
		r.Matrix = append(r.Matrix, cells)
	}
	r.Rank, r.RankNote, r.table, r.problem = p.Rank(), p.RankNote(), p.MatrixTable(), p
	var repeating []string
	if rep == "" {
		if repeating, err = p.DefaultRepeating(); err != nil {
			return nil, err
		}
		r.DefaultChosen = true
	} else {
		repeating = strings.Split(rep, ",")
	}
	s, err := p.PiSet(repeating...)
	if err != nil {
		return nil, err
	}
	r.Repeating, r.set = s.Repeating(), s
	for _, g := range s.Groups() {
		go_ := GroupOut{Name: g.Name, Plain: g.Format(quantity.ASCII), Unicode: g.Format(quantity.Unicode),
			LaTeX: g.Format(quantity.LaTeX), Label: g.Label(), Exponents: map[string]string{}}
		for i, e := range g.Exponents() {
			if !e.IsZero() {
				go_.Exponents[vars[i].Symbol] = e.String()
			}
		}
		for _, m := range g.Matches {
			f := m.FactorText()
			if f == "" {
				f = "1"
			}
			go_.Matches = append(go_.Matches, MatchOut{Name: m.Name, Symbol: m.Symbol, Label: m.Label(), Power: m.Power.String(),
				Factor: f, Exact: m.Exact(), Equation: m.Equation(g.Name), Definition: m.Definition, Assumed: m.Assumed})
		}
		r.Groups = append(r.Groups, go_)
	}
	if listSets {
		// Enumeration visits up to C(n, r) subsets; refuse sizes a script
		// would wait on.
		if c := binomial(len(vars), p.Rank()); c > 1e6 {
			return nil, &usageError{fmt.Sprintf("-sets: %d variables of rank %d give up to %.3g candidate sets; too many to list", len(vars), p.Rank(), c)}
		}
		if r.ValidSets, err = p.RepeatingSets(); err != nil {
			return nil, err
		}
	}
	return r, nil
}

// angleMeasure says how a variable declared in u counts a plane angle: a
// unit spelled with rev or rpm counts revolutions, one spelled with rad
// radians, and a rotational frequency with no angle (Hz, 1/s) counts
// cycles, that is revolutions, as ISO 80000-3 writes a rotational
// frequency n. Degrees are refused: no named group takes them.
func angleMeasure(u units.Unit) (pigroups.AngleMeasure, error) {
	plane, _ := u.Angle()
	if plane == 0 {
		if u.Dim() == quantity.Frequency {
			return pigroups.Revolutions, nil
		}
		return pigroups.Radians, nil
	}
	rev, rad, other := false, false, false
	for _, tok := range strings.FieldsFunc(u.Format(quantity.ASCII), func(r rune) bool {
		return !unicode.IsLetter(r)
	}) {
		switch tok {
		case "rev", "rpm":
			rev = true
		case "rad", "mrad", "urad":
			rad = true
		case "deg", "arcmin", "arcsec":
			other = true
		}
	}
	switch {
	case rev && !rad && !other:
		return pigroups.Revolutions, nil
	case rad && !rev && !other:
		return pigroups.Radians, nil
	}
	return 0, fmt.Errorf("its angle is neither in radians nor in revolutions alone; declare a rotational speed in rad/s or rev/s")
}

func binomial(n, k int) float64 {
	c := 1.0
	for i := range k {
		c = c * float64(n-i) / float64(i+1)
	}
	return c
}

func slicesContains(vs []VariableOut, sym string) bool {
	for _, v := range vs {
		if v.Symbol == sym {
			return true
		}
	}
	return false
}

func writeText(w io.Writer, r *Report) {
	if r.Invented {
		fmt.Fprintln(w, "(no variables given: an invented flow-restrictor problem)")
	}
	fmt.Fprintln(w, "variables:")
	for _, v := range r.Variables {
		role := ""
		if v.Dependent {
			role = "  (dependent)"
		}
		fmt.Fprintf(w, "  %-6s %-12s %-14s %s%s\n", v.Symbol, v.Unit, v.Dimension, strings.Join(v.Kinds, " or "), role)
	}
	fmt.Fprintln(w, "dimensional matrix:")
	for _, line := range strings.Split(strings.TrimRight(r.table, "\n"), "\n") {
		fmt.Fprintln(w, "  "+line)
	}
	if r.RankNote != "" {
		fmt.Fprintln(w, "note:", r.RankNote)
	}
	how := "as given"
	if r.DefaultChosen {
		how = "by the default rule"
	}
	fmt.Fprintf(w, "repeating set (%s): %s\n", how, strings.Join(r.Repeating, ", "))
	fmt.Fprintln(w, "groups:")
	for _, line := range strings.Split(strings.TrimRight(r.set.Format(quantity.Unicode), "\n"), "\n") {
		fmt.Fprintln(w, "  "+line)
	}
	if len(r.ValidSets) > 0 {
		fmt.Fprintf(w, "valid repeating sets (%d):\n", len(r.ValidSets))
		for _, s := range r.ValidSets {
			fmt.Fprintln(w, "  "+strings.Join(s, ", "))
		}
	}
}
