// Package fluids gives the fluid states a model test plan needs: fresh and
// sea water against temperature, air as an ideal gas with Sutherland's
// viscosity law, the ISO 2533 standard atmosphere, and fluids of the
// caller's own through the Fluid interface.
//
// Water: density of fresh water by the CIPM formula of Tanaka et al.
// (Metrologia 38, 301, 2001); viscosity of fresh water by the correlation
// of the CRC Handbook of Chemistry and Physics (Bingham form below 20 °C,
// Kestin's ratio form above); sea water by the correlations of Sharqawy,
// Lienhard and Zubair (Desalination and Water Treatment 16, 354, 2010),
// at a salinity of 35.16504 g/kg by default. These agree with the tables
// of ITTC Recommended Procedure 7.5-02-01-03 (2011) to better than 0.05 %
// in density and 0.5 % in kinematic viscosity over 0 … 30 °C; they are
// not the IAPWS formulations.
//
// Values are estimates for planning and data reduction. Where a result
// feeds the design of hulls, hydraulic structures or pressure vessels,
// use the properties the applicable code prescribes.
package fluids
