package units

import (
	"math"

	"similis.dev/similis/quantity"
)

// prefix is an SI prefix (SI Brochure, 9th ed. (2019), Table 7, with
// ronna, quetta, ronto and quecto adopted by the 27th CGPM, 2022).
type prefix struct {
	ascii, uni, tex string
	factor          float64
	exp             int // the power of ten
}

// prefixes, longest spelling first so that "da" is tried before "d".
var prefixes = []prefix{
	{"da", "da", `\mathrm{da}`, 1e1, 1},
	{"Q", "Q", `\mathrm{Q}`, 1e30, 30},
	{"R", "R", `\mathrm{R}`, 1e27, 27},
	{"Y", "Y", `\mathrm{Y}`, 1e24, 24},
	{"Z", "Z", `\mathrm{Z}`, 1e21, 21},
	{"E", "E", `\mathrm{E}`, 1e18, 18},
	{"P", "P", `\mathrm{P}`, 1e15, 15},
	{"T", "T", `\mathrm{T}`, 1e12, 12},
	{"G", "G", `\mathrm{G}`, 1e9, 9},
	{"M", "M", `\mathrm{M}`, 1e6, 6},
	{"k", "k", `\mathrm{k}`, 1e3, 3},
	{"h", "h", `\mathrm{h}`, 1e2, 2},
	{"d", "d", `\mathrm{d}`, 1e-1, -1},
	{"c", "c", `\mathrm{c}`, 1e-2, -2},
	{"m", "m", `\mathrm{m}`, 1e-3, -3},
	{"u", "µ", `\mu`, 1e-6, -6},
	{"n", "n", `\mathrm{n}`, 1e-9, -9},
	{"p", "p", `\mathrm{p}`, 1e-12, -12},
	{"f", "f", `\mathrm{f}`, 1e-15, -15},
	{"a", "a", `\mathrm{a}`, 1e-18, -18},
	{"z", "z", `\mathrm{z}`, 1e-21, -21},
	{"y", "y", `\mathrm{y}`, 1e-24, -24},
	{"r", "r", `\mathrm{r}`, 1e-27, -27},
	{"q", "q", `\mathrm{q}`, 1e-30, -30},
}

// microSpellings are the accepted spellings of the micro prefix: ASCII u,
// the micro sign U+00B5 and the Greek letter mu U+03BC.
var microSpellings = []string{"u", "\u00b5", "\u03bc"}

// entry is one unit of the table.
type entry struct {
	u          Unit   // its spelling is sym
	sym        string // the canonical ASCII spelling
	uni, tex   string
	prefixable bool
	scaleSym   bool // a temperature scale symbol (°C, °F)
	// ambiguous, for an SI-prefixed form that data sheets use for another
	// unit, says both readings; such a symbol is refused unless a user
	// table defines it.
	ambiguous string
}

// ambiguousPrefixed are SI-prefixed symbols that collide with a common
// non-SI symbol of data sheets (common practice); each is refused with
// both readings rather than read by its prefix.
var ambiguousPrefixed = map[string]string{
	"PS": "petasiemens by its SI prefix, but data sheets use PS for the metric horsepower",
	"kt": "kilotonne by its SI prefix, but ship and tunnel data use kt for the knot (write kn)",
	"pt": "picotonne by its SI prefix, but pt is usually the pint",
	"Pt": "petatonne by its SI prefix, but Pt is usually the pint",
	"mt": "millitonne by its SI prefix, but mt is usually meant as the metric ton (write t)",
	"ct": "centitonne by its SI prefix, but ct is usually the carat",
	"at": "attotonne by its SI prefix, but at is usually the technical atmosphere (kgf/cm²)",
}

// Definitions from which the factors below are derived. Exact values are
// exact by definition; the source is given beside each.
const (
	gn      = 9.80665    // standard acceleration of gravity, m/s², exact (3rd CGPM, 1901)
	inch    = 0.0254     // international inch, m, exact (1959 agreement)
	pound   = 0.45359237 // international avoirdupois pound, kg, exact (1959 agreement)
	atmPa   = 101325     // standard atmosphere, Pa, exact (10th CGPM, 1954)
	btuIT   = 1055.05585262
	calTh   = 4.184  // thermochemical calorie, J, exact by definition
	calIT   = 4.1868 // International Table calorie, J, exact by definition (1956)
	eCharge = 1.602176634e-19
	// Conventional densities for manometer units, NIST SP 811 (2008),
	// App. B.8 footnotes: mercury 13 595.1 kg/m³ (about 0 °C), water
	// 1000 kg/m³ (about 4 °C), each under standard gravity.
	rhoHgConv  = 13595.1
	rhoH2OConv = 1000.0
	// The dalton (unified atomic mass unit), kg, CODATA 2018.
	dalton = 1.66053906660e-27
)

var (
	foot    = 12 * inch
	yard    = 3 * foot
	mile    = 5280 * foot
	lbf     = pound * gn
	usGal   = 231 * inch * inch * inch // US liquid gallon: 231 in³, exact
	ftLbfPS = foot * lbf               // ft·lbf/s in W
)

var dimOne = quantity.Dimensionless

// builtin lists the table. Spellings: canonical ASCII, Unicode, LaTeX.
// Aliases map further spellings to a canonical one.
var builtin = []entry{
	// SI base units, SI Brochure (2019), Table 2.
	{u: Unit{dim: quantity.Length, factor: 1}, sym: "m", uni: "m", tex: `\mathrm{m}`, prefixable: true},
	{u: Unit{dim: quantity.Mass, factor: 1}, sym: "kg", uni: "kg", tex: `\mathrm{kg}`},
	{u: Unit{dim: quantity.Mass, factor: 1e-3}, sym: "g", uni: "g", tex: `\mathrm{g}`, prefixable: true},
	{u: Unit{dim: quantity.Time, factor: 1}, sym: "s", uni: "s", tex: `\mathrm{s}`, prefixable: true},
	{u: Unit{dim: quantity.Current, factor: 1}, sym: "A", uni: "A", tex: `\mathrm{A}`, prefixable: true},
	{u: Unit{dim: quantity.Temperature, factor: 1}, sym: "K", uni: "K", tex: `\mathrm{K}`, prefixable: true},
	{u: Unit{dim: quantity.Amount, factor: 1}, sym: "mol", uni: "mol", tex: `\mathrm{mol}`, prefixable: true},
	{u: Unit{dim: quantity.LuminousIntensity, factor: 1}, sym: "cd", uni: "cd", tex: `\mathrm{cd}`, prefixable: true},

	// The 22 SI derived units with special names, SI Brochure (2019), Table 4.
	{u: Unit{dim: dimOne, factor: 1, angle: 1}, sym: "rad", uni: "rad", tex: `\mathrm{rad}`, prefixable: true},
	{u: Unit{dim: dimOne, factor: 1, solid: 1}, sym: "sr", uni: "sr", tex: `\mathrm{sr}`, prefixable: true},
	{u: Unit{dim: quantity.Frequency, factor: 1}, sym: "Hz", uni: "Hz", tex: `\mathrm{Hz}`, prefixable: true},
	{u: Unit{dim: quantity.Force, factor: 1}, sym: "N", uni: "N", tex: `\mathrm{N}`, prefixable: true},
	{u: Unit{dim: quantity.Pressure, factor: 1}, sym: "Pa", uni: "Pa", tex: `\mathrm{Pa}`, prefixable: true},
	{u: Unit{dim: quantity.Energy, factor: 1}, sym: "J", uni: "J", tex: `\mathrm{J}`, prefixable: true},
	{u: Unit{dim: quantity.Power, factor: 1}, sym: "W", uni: "W", tex: `\mathrm{W}`, prefixable: true},
	{u: Unit{dim: quantity.Charge, factor: 1}, sym: "C", uni: "C", tex: `\mathrm{C}`, prefixable: true},
	{u: Unit{dim: quantity.Voltage, factor: 1}, sym: "V", uni: "V", tex: `\mathrm{V}`, prefixable: true},
	{u: Unit{dim: quantity.Capacitance, factor: 1}, sym: "F", uni: "F", tex: `\mathrm{F}`, prefixable: true},
	{u: Unit{dim: quantity.Resistance, factor: 1}, sym: "ohm", uni: "Ω", tex: `\Omega`, prefixable: true},
	{u: Unit{dim: quantity.Conductance, factor: 1}, sym: "S", uni: "S", tex: `\mathrm{S}`, prefixable: true},
	{u: Unit{dim: quantity.MagneticFlux, factor: 1}, sym: "Wb", uni: "Wb", tex: `\mathrm{Wb}`, prefixable: true},
	{u: Unit{dim: quantity.MagneticFluxDensity, factor: 1}, sym: "T", uni: "T", tex: `\mathrm{T}`, prefixable: true},
	{u: Unit{dim: quantity.Inductance, factor: 1}, sym: "H", uni: "H", tex: `\mathrm{H}`, prefixable: true},
	{u: Unit{dim: quantity.Temperature, factor: 1, offset: 273.15, temp: tempScale}, sym: "degC", uni: "°C", tex: `{}^{\circ}\mathrm{C}`, scaleSym: true},
	{u: Unit{dim: quantity.LuminousIntensity, factor: 1, solid: 1}, sym: "lm", uni: "lm", tex: `\mathrm{lm}`, prefixable: true},
	{u: Unit{dim: quantity.Illuminance, factor: 1, solid: 1}, sym: "lx", uni: "lx", tex: `\mathrm{lx}`, prefixable: true},
	{u: Unit{dim: quantity.Frequency, factor: 1}, sym: "Bq", uni: "Bq", tex: `\mathrm{Bq}`, prefixable: true},
	{u: Unit{dim: quantity.AbsorbedDose, factor: 1}, sym: "Gy", uni: "Gy", tex: `\mathrm{Gy}`, prefixable: true},
	{u: Unit{dim: quantity.AbsorbedDose, factor: 1}, sym: "Sv", uni: "Sv", tex: `\mathrm{Sv}`, prefixable: true},
	{u: Unit{dim: quantity.CatalyticActivity, factor: 1}, sym: "kat", uni: "kat", tex: `\mathrm{kat}`, prefixable: true},

	// Non-SI units accepted for use with the SI, SI Brochure (2019), Table 8.
	{u: Unit{dim: quantity.Time, factor: 60}, sym: "min", uni: "min", tex: `\mathrm{min}`},
	{u: Unit{dim: quantity.Time, factor: 3600}, sym: "h", uni: "h", tex: `\mathrm{h}`},
	{u: Unit{dim: quantity.Time, factor: 86400}, sym: "d", uni: "d", tex: `\mathrm{d}`},
	{u: Unit{dim: dimOne, factor: math.Pi / 180, angle: 1}, sym: "deg", uni: "°", tex: `^{\circ}`},
	{u: Unit{dim: dimOne, factor: math.Pi / 180 / 60, angle: 1}, sym: "arcmin", uni: "′", tex: `'`},
	{u: Unit{dim: dimOne, factor: math.Pi / 180 / 3600, angle: 1}, sym: "arcsec", uni: "″", tex: `''`},
	{u: Unit{dim: quantity.Area, factor: 1e4}, sym: "ha", uni: "ha", tex: `\mathrm{ha}`},
	{u: Unit{dim: quantity.Volume, factor: 1e-3}, sym: "L", uni: "L", tex: `\mathrm{L}`, prefixable: true},
	{u: Unit{dim: quantity.Mass, factor: 1e3}, sym: "t", uni: "t", tex: `\mathrm{t}`, prefixable: true},
	{u: Unit{dim: quantity.Mass, factor: dalton}, sym: "Da", uni: "Da", tex: `\mathrm{Da}`, prefixable: true},
	{u: Unit{dim: quantity.Energy, factor: eCharge}, sym: "eV", uni: "eV", tex: `\mathrm{eV}`, prefixable: true},

	// Length, NIST SP 811 (2008), App. B.8 (exact from the inch).
	{u: Unit{dim: quantity.Length, factor: inch}, sym: "in", uni: "in", tex: `\mathrm{in}`},
	{u: Unit{dim: quantity.Length, factor: foot}, sym: "ft", uni: "ft", tex: `\mathrm{ft}`},
	{u: Unit{dim: quantity.Length, factor: yard}, sym: "yd", uni: "yd", tex: `\mathrm{yd}`},
	{u: Unit{dim: quantity.Length, factor: mile}, sym: "mi", uni: "mi", tex: `\mathrm{mi}`},
	{u: Unit{dim: quantity.Length, factor: 1852}, sym: "nmi", uni: "nmi", tex: `\mathrm{nmi}`}, // nautical mile, exact
	{u: Unit{dim: quantity.Length, factor: inch / 1000}, sym: "mil", uni: "mil", tex: `\mathrm{mil}`},
	// Area: the acre as 43 560 ft² of the international foot (the US
	// survey foot was retired at the end of 2022).
	{u: Unit{dim: quantity.Area, factor: 43560 * foot * foot}, sym: "acre", uni: "acre", tex: `\mathrm{acre}`},
	// Volume.
	{u: Unit{dim: quantity.Volume, factor: usGal}, sym: "gal", uni: "gal", tex: `\mathrm{gal}`},                    // US liquid gallon, 231 in³
	{u: Unit{dim: quantity.Volume, factor: 4.54609e-3}, sym: "gal_imp", uni: "gal_imp", tex: `\mathrm{gal_{imp}}`}, // imperial gallon, 4.546 09 L exact (UK Weights and Measures Act 1985)
	{u: Unit{dim: quantity.Volume, factor: 42 * usGal}, sym: "bbl", uni: "bbl", tex: `\mathrm{bbl}`},               // petroleum barrel, 42 US gal
	// Mass.
	{u: Unit{dim: quantity.Mass, factor: pound}, sym: "lb", uni: "lb", tex: `\mathrm{lb}`},
	{u: Unit{dim: quantity.Mass, factor: pound / 16}, sym: "oz", uni: "oz", tex: `\mathrm{oz}`},                   // avoirdupois ounce
	{u: Unit{dim: quantity.Mass, factor: lbf / foot}, sym: "slug", uni: "slug", tex: `\mathrm{slug}`},             // lbf·s²/ft
	{u: Unit{dim: quantity.Force, factor: lbf}, sym: "lbf", uni: "lbf", tex: `\mathrm{lbf}`},                      // lb × g_n
	{u: Unit{dim: quantity.Force, factor: 1000 * lbf}, sym: "kip", uni: "kip", tex: `\mathrm{kip}`},               // 1000 lbf
	{u: Unit{dim: quantity.Force, factor: gn}, sym: "kgf", uni: "kgf", tex: `\mathrm{kgf}`},                       // kg × g_n
	{u: Unit{dim: quantity.Force, factor: 1e-5}, sym: "dyn", uni: "dyn", tex: `\mathrm{dyn}`},                     // g·cm/s²
	{u: Unit{dim: quantity.Pressure, factor: 1e5}, sym: "bar", uni: "bar", tex: `\mathrm{bar}`, prefixable: true}, // exact
	{u: Unit{dim: quantity.Pressure, factor: atmPa}, sym: "atm", uni: "atm", tex: `\mathrm{atm}`},
	{u: Unit{dim: quantity.Pressure, factor: atmPa / 760.0}, sym: "Torr", uni: "Torr", tex: `\mathrm{Torr}`, prefixable: true}, // atm/760 exact
	{u: Unit{dim: quantity.Pressure, factor: rhoHgConv * 1e-3 * gn}, sym: "mmHg", uni: "mmHg", tex: `\mathrm{mmHg}`},           // conventional
	{u: Unit{dim: quantity.Pressure, factor: rhoHgConv * inch * gn}, sym: "inHg", uni: "inHg", tex: `\mathrm{inHg}`},           // conventional
	{u: Unit{dim: quantity.Pressure, factor: rhoH2OConv * inch * gn}, sym: "inH2O", uni: "inH2O", tex: `\mathrm{inH_2O}`},      // conventional
	{u: Unit{dim: quantity.Pressure, factor: rhoH2OConv * foot * gn}, sym: "ftH2O", uni: "ftH2O", tex: `\mathrm{ftH_2O}`},      // conventional
	{u: Unit{dim: quantity.Pressure, factor: rhoH2OConv * gn}, sym: "mH2O", uni: "mH2O", tex: `\mathrm{mH_2O}`},                // conventional
	{u: Unit{dim: quantity.Pressure, factor: lbf / (inch * inch)}, sym: "psi", uni: "psi", tex: `\mathrm{psi}`},
	{u: Unit{dim: quantity.Pressure, factor: lbf / (foot * foot)}, sym: "psf", uni: "psf", tex: `\mathrm{psf}`},
	{u: Unit{dim: quantity.Pressure, factor: 1000 * lbf / (inch * inch)}, sym: "ksi", uni: "ksi", tex: `\mathrm{ksi}`},
	// Energy and power.
	{u: Unit{dim: quantity.Energy, factor: 3600}, sym: "Wh", uni: "Wh", tex: `\mathrm{Wh}`, prefixable: true}, // W·h; kWh is k + Wh
	{u: Unit{dim: quantity.Energy, factor: btuIT}, sym: "BTU", uni: "BTU", tex: `\mathrm{BTU}`},               // International Table
	{u: Unit{dim: quantity.Energy, factor: calTh}, sym: "cal", uni: "cal", tex: `\mathrm{cal}`, prefixable: true},
	{u: Unit{dim: quantity.Energy, factor: calIT}, sym: "cal_IT", uni: "cal_IT", tex: `\mathrm{cal_{IT}}`, prefixable: true},
	{u: Unit{dim: quantity.Energy, factor: 1e-7}, sym: "erg", uni: "erg", tex: `\mathrm{erg}`},
	{u: Unit{dim: quantity.Power, factor: 550 * ftLbfPS}, sym: "hp", uni: "hp", tex: `\mathrm{hp}`}, // mechanical horsepower, 550 ft·lbf/s
	// Speed and flow.
	{u: Unit{dim: quantity.Velocity, factor: 1852.0 / 3600}, sym: "kn", uni: "kn", tex: `\mathrm{kn}`}, // knot, nmi/h
	{u: Unit{dim: quantity.Velocity, factor: mile / 3600}, sym: "mph", uni: "mph", tex: `\mathrm{mph}`},
	{u: Unit{dim: quantity.VolumeFlowRate, factor: usGal / 60}, sym: "gpm", uni: "gpm", tex: `\mathrm{gpm}`},              // US gal/min
	{u: Unit{dim: quantity.VolumeFlowRate, factor: foot * foot * foot / 60}, sym: "cfm", uni: "cfm", tex: `\mathrm{cfm}`}, // ft³/min
	// Viscosity (CGS): poise = 0.1 Pa·s, stokes = 1 cm²/s, exact.
	{u: Unit{dim: quantity.DynamicViscosity, factor: 0.1}, sym: "P", uni: "P", tex: `\mathrm{P}`, prefixable: true},
	{u: Unit{dim: quantity.KinematicViscosity, factor: 1e-4}, sym: "St", uni: "St", tex: `\mathrm{St}`, prefixable: true},
	// Temperature: scales and explicit differences. °F = 5/9 K with its
	// zero at 459.67 °R; °R = 5/9 K from absolute zero (exact, NIST SP
	// 811 (2008), App. B.9 and §4.2.1.1).
	{u: Unit{dim: quantity.Temperature, factor: 5.0 / 9, offset: 459.67 * 5 / 9, temp: tempScale}, sym: "degF", uni: "°F", tex: `{}^{\circ}\mathrm{F}`, scaleSym: true},
	{u: Unit{dim: quantity.Temperature, factor: 5.0 / 9}, sym: "degR", uni: "°R", tex: `{}^{\circ}\mathrm{R}`},
	{u: Unit{dim: quantity.Temperature, factor: 1, temp: tempInterval}, sym: "degC_diff", uni: "Δ°C", tex: `\Delta{}^{\circ}\mathrm{C}`},
	{u: Unit{dim: quantity.Temperature, factor: 5.0 / 9, temp: tempInterval}, sym: "degF_diff", uni: "Δ°F", tex: `\Delta{}^{\circ}\mathrm{F}`},
	{u: Unit{dim: quantity.Temperature, factor: 5.0 / 9, temp: tempInterval}, sym: "degR_diff", uni: "Δ°R", tex: `\Delta{}^{\circ}\mathrm{R}`},
	{u: Unit{dim: quantity.Temperature, factor: 1, temp: tempInterval}, sym: "K_diff", uni: "ΔK", tex: `\Delta\mathrm{K}`},
	// Rotation: a revolution is 2π rad; rpm is rev/min.
	{u: Unit{dim: dimOne, factor: 2 * math.Pi, angle: 1}, sym: "rev", uni: "rev", tex: `\mathrm{rev}`},
	{u: Unit{dim: quantity.Frequency, factor: 2 * math.Pi / 60, angle: 1}, sym: "rpm", uni: "rpm", tex: `\mathrm{rpm}`},
	// Ratios.
	{u: Unit{dim: dimOne, factor: 0.01}, sym: "%", uni: "%", tex: `\%`},
	{u: Unit{dim: dimOne, factor: 1e-6}, sym: "ppm", uni: "ppm", tex: `\mathrm{ppm}`},
}

// aliases maps further accepted spellings to canonical ones.
var aliases = map[string]string{
	"l":       "L",
	"°":       "deg",
	"′":       "arcmin",
	"″":       "arcsec",
	"Ω":       "ohm", // U+03A9 Greek capital omega
	"\u2126":  "ohm", // U+2126 ohm sign
	"°C":      "degC",
	"°F":      "degF",
	"°R":      "degR",
	"℃":       "degC",
	"℉":       "degF",
	"Δ°C":     "degC_diff",
	"ΔdegC":   "degC_diff",
	"Δ°F":     "degF_diff",
	"ΔdegF":   "degF_diff",
	"Δ°R":     "degR_diff",
	"ΔdegR":   "degR_diff",
	"ΔK":      "K_diff",
	"Btu":     "BTU",
	"lbm":     "lb",
	"knot":    "kn",
	"galUS":   "gal",
	"impgal":  "gal_imp",
	"inH₂O":   "inH2O",
	"cal_th":  "cal",
	"percent": "%",
}

// tableIndex is the built-in table, indexed by every accepted spelling.
type tableIndex struct {
	bySym    map[string]*entry // exact spellings and aliases
	prefixed map[string]*entry // every SI-prefixed form of a prefixable unit
}

var builtinIndex = func() *tableIndex {
	t := &tableIndex{bySym: make(map[string]*entry, 2*len(builtin))}
	for i := range builtin {
		e := &builtin[i]
		e.u = symbolUnit(e.u, e.sym) // the entry's spelling is its own symbol
		t.bySym[e.sym] = e
		t.bySym[e.uni] = e
	}
	for a, c := range aliases {
		if c == "" {
			continue
		}
		e, ok := t.bySym[c]
		if !ok {
			panic("units: alias " + a + " of unknown " + c)
		}
		t.bySym[a] = e
	}
	t.prefixed = make(map[string]*entry)
	for sym, base := range t.bySym {
		if !base.prefixable {
			continue
		}
		for _, p := range prefixes {
			for _, ps := range prefixSpellings(p) {
				name := ps + sym
				if _, ok := t.bySym[name]; ok {
					continue // an exact symbol wins: ft is the foot, not femto-tonne
				}
				if _, ok := t.prefixed[name]; !ok {
					e := prefixedEntry(p, base)
					e.ambiguous = ambiguousPrefixed[name]
					t.prefixed[name] = e
				}
			}
		}
	}
	return t
}()

// Symbols returns the canonical ASCII spelling of every unit in the
// built-in table, in table order.
func Symbols() []string {
	out := make([]string, len(builtin))
	for i, e := range builtin {
		out[i] = e.sym
	}
	return out
}

// Prefixable reports whether the built-in unit spelled sym takes SI
// prefixes.
func Prefixable(sym string) bool {
	e, ok := builtinIndex.bySym[sym]
	return ok && e.prefixable
}
