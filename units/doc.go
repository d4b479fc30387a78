// Package units reads, converts and prints the units engineers write on
// data sheets: psi, gpm, ft, °F, cSt, kn, BTU/(h·ft²·°F).
//
// A Unit is a dimension, a factor to the coherent SI unit, an offset for a
// temperature scale, and a spelling. Parse reads unit expressions; Convert
// converts numbers between them; Unit.Of and Unit.ValueOf carry values to
// and from quantity.Quantity; ParseValue and ParseQuantity read "12.5 kn";
// Printer writes quantities in chosen or conventional units, with SI
// prefixes on request, in Unicode, ASCII or LaTeX; a Value prints through
// fmt with a precision applied to its number and its unit kept
// (fmt.Sprintf("%.4g", v) is "1.7 m/s"). By default a dimension prints in
// the unit DerivedUnit gives — the same as quantity.Quantity.String
// names (Pa·s, N·m, J/(kg·K), …) and the electrical units besides — or in
// SI base units.
//
// # Grammar
//
// A unit expression is a sequence of factors: unit symbols, positive
// numbers, or parenthesised expressions, each optionally raised to a
// power. A space, '*', '·' or '⋅' is a product; '/' divides by the next
// factor, left to right (kg/m/s is kg/(m·s)). A product after a division
// without parentheses (W/m·K) is refused as ambiguous. Exponents are
// integers (m^2, s^-1, m**2), superscripts (m², s⁻¹), fractions in
// parentheses (m^(1/2)) or decimals equal to simple fractions (in^0.5).
// SI prefixes attach where the SI allows: to SI units with special names
// and base units (mass prefixes to g, never kg), to L, t, eV, Da, bar,
// Torr, cal, P, St and Wh; never to min, h, d, ° or the customary units.
// µ, μ and u all mean micro. See Parse for the limits that bound its work.
//
// # Temperature
//
// A temperature scale written alone (°C, degF, ℃) is a scale: 20 °C
// converts to 293.15 K and 68 °F. Inside a compound unit (W/(m·°C),
// BTU/(lb·°F)) a scale symbol denotes its degree as an interval, as
// engineering data sheets mean it; this is common practice, and the
// reason K and °R, whose zeros are absolute, need no distinction.
// Temperature differences have their own spellings, Δ°C, Δ°F, Δ°R and ΔK
// (ASCII degC_diff, degF_diff, degR_diff, K_diff). Converting a level
// on a scale to a difference, or back, is refused as ambiguous.
//
// # Angle and rotation
//
// Plane angle is dimensionless in the SI, and a Quantity carries none:
// rotational speeds are held in rad/s. But a Unit keeps the exponent of
// the angle it was written with, and a conversion between units must keep
// it too, so that no factor 2π is silently applied or dropped: 1 rpm =
// 2π/60 rad/s = 1/60 rev/s, while rpm to Hz (a cycle frequency) is refused
// with an error that says how to write what was meant — rev/s, or
// (rpm)/rev to count revolutions as cycles. Solid angle (sr, and so lm) is
// kept the same way.
//
// # Tables
//
// The built-in table is fixed and safe for concurrent readers. A Table
// the caller owns adds definitions at run time (Define("TR",
// "12000 BTU/h")) and is safe for concurrent use.
//
// # Bounds
//
// Parsing reads at most MaxExprLen (512) bytes and MaxDepth (16) nested
// parentheses, in one pass; the caches hold at most 8192 expressions
// each (past that, Parse still parses, without caching). Units of one
// spelling share one interned record, held only while some unit uses it,
// so a long-running program that reads ever new spellings keeps only
// those in use and never meets a limit. Conversions and unit algebra
// return a finite result or an error wrapping ErrRange.
//
// # Data-sheet spellings
//
// Parse is strict and stays so. ParseDialect is the opt-in reader for
// channel headers and data sheets: hr, sec, mins, m3, ft3, kg/m3, m3/h,
// Pa.s, N.m, ft-lbf, in-lb, GPM, bhp, BTU/hr-ft2-F. It returns, with the
// unit, a Reading for each lenient step (what was read as what), so that
// a reduced data set can record its interpretation. Spellings with more
// than one meaning (ton, PS) or that need a reference (psig, barg, SCFM)
// are refused with the candidates or with how to supply the reference.
//
// # Gauge pressure
//
// A gauge level (40 kPa(g), 12.5 psig, 0.8 barg) is a Gauge, not a
// Quantity, so it cannot reach a computation that needs an absolute
// pressure; ParseValue refuses it with ErrGauge. Gauge.Absolute makes it
// absolute with a reference given explicitly — the day's barometer
// reading, or StandardReference as a stated choice — and Gauge.Sub gives
// the pressure difference of two levels read on one ambient.
//
// # Sources
//
// Each table entry's source is given in the code: the SI Brochure, 9th
// ed. (2019), Tables 2, 4, 7 and 8 with the CGPM 2022 prefixes; NIST SP
// 811 (2008), Appendix B, for customary units; exact definitions (the
// international inch and pound of 1959, g_n, the International Table BTU)
// from which factors are derived in code rather than typed as rounded
// decimals. Manometer units (mmHg, inHg, inH2O, ftH2O, mH2O) are the conventional ones,
// defined from mercury at 13 595.1 kg/m³ and water at 1000 kg/m³ under
// standard gravity.
package units
