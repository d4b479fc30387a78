// Package fluids gives the fluid states a model test plan needs: fresh and
// sea water against temperature, air as an ideal gas with Sutherland's
// viscosity law, the ISO 2533 standard atmosphere, and fluids of the
// caller's own through the Fluid interface.
//
// Water: density of fresh water by the CIPM formula of Tanaka et al.
// (Metrologia 38, 301, 2001); viscosity of fresh water by the correlation
// of the CRC Handbook of Chemistry and Physics (Bingham form below 20 °C,
// Kestin's ratio form above). Sea-water density by the one-atmosphere
// equation of state EOS-80 (Millero and Poisson, 1981; UNESCO Technical
// Papers in Marine Science 44, 1983) as published, its practical salinity
// taken from the absolute salinity (Water.Salinity, a mass fraction in
// kg/kg, as in FormulaFuncs) by the TEOS-10 reference ratio
// 35/35.16504; sea-water viscosity by the salinity factor of Sharqawy,
// Lienhard and Zubair (Desalination and Water Treatment 16, 354, 2010) on
// the fresh-water value. Sea water is at 35.16504 g/kg by default. Tests
// check the densities against IAPWS-08 (sea water) and IAPWS-95 (fresh
// water) to 0.01 % over 0 … 40 °C, and viscosities to 0.5 %; the
// formulations themselves are not the IAPWS ones.
//
// Gases: air and nitrogen are ideal gases with Sutherland's viscosity law,
// each with a stated temperature range (IdealGas.MinTemperature,
// MaxTemperature); nitrogen is checked against its saturation curve (Span
// et al., 2000), so a state at or below the condensation temperature at
// its pressure, below the triple point, or above the range, is a
// *RangeError rather than a density (IdealGas.LowestTemperature). A
// gas's dimensional constants (the specific gas constant R, Sutherland's
// β and S, the conductivity constants, the temperature bounds) are
// quantity.Quantity values, so a caller's own gas states each in its
// dimension; a constant of the wrong dimension is refused wherever the
// gas is used, with an ErrDimension naming the field (IdealGas.R, …) and
// both dimensions. Only the ratio of specific heats γ, a pure number, is
// a float64.
//
// Near saturation a real gas departs from the ideal one:
// NitrogenCompressibility estimates nitrogen's compressibility factor Z
// and its speed of sound from a generalized second-virial correlation,
// within the correlation's range (T/T_c ≥ 0.7, up to 600 K, a gas at
// most half as dense as at the critical point, Z ≥ 0.9), so that a cryogenic
// tunnel's plan can say how far its ideal-gas density and Reynolds
// number are off.
//
// Every *RangeError states the unit of its value and bounds (Unit), or
// none for a dimensionless value (a Mach number, a ratio, a fraction).
//
// Formulas: FormulaFuncs gives the water, sea-water, air and humid-air
// properties as functions for package formula (nu_water(T),
// rho_sea(T, S), rho_air(T, p), …), with their ranges and exact
// derivatives, so that a derived channel of a data reduction reads
// nu = nu_water(T_w); the caller passes them to formula.Options.
//
// Values are estimates for planning and data reduction. Where a result
// feeds the design of hulls, hydraulic structures or pressure vessels,
// use the properties the applicable code prescribes. A cryogenic
// nitrogen tunnel is a pressure vessel full of an asphyxiant at
// cold-burn temperatures: its operation is governed by the facility's
// safety rules and its responsible engineer, not by these figures.
package fluids
