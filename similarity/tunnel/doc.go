// Package tunnel corrects wind-tunnel measurements and finds the tunnel
// condition a test needs, in the order of the test: set the condition,
// then correct what was measured. Every result that prints carries
// Caution, and AsphyxiantCaution and ColdCaution where they apply:
// the facility's certified envelope, its safety rules and its responsible
// engineer govern a pressurised, cryogenic or inert-gas tunnel.
//
//  1. Condition. FindCondition finds the total temperature and
//     pressure of an ideal-gas tunnel that hold the prototype's Mach and
//     Reynolds numbers for a model at a length ratio, within the
//     facility's Limits (total temperature and pressure, the largest
//     dynamic pressure and rated load, a condensation margin for
//     nitrogen). It returns the test section's static state by the
//     isentropic relations, the dynamic pressure q and the load it
//     brings, and the limit that binds; when none holds both numbers, the
//     closest with Achieved false.
//  2. Two-dimensional wall corrections. CorrectWalls2D corrects an
//     airfoil spanning a closed test section for solid and wake blockage
//     and streamline curvature, with the Prandtl–Glauert-type
//     compressibility factors (the classical closed-wall corrections of
//     low-speed wind-tunnel testing).
//  3. Three-dimensional wall corrections. CorrectWalls3D corrects a
//     wing or a complete model for solid and wake blockage and the
//     boundary (downwash) correction of angle and drag, with the wing's
//     and tail's streamline-curvature terms from chart factors.
//
// The corrections are linear and hold for a test-section Mach number up
// to MaxWallCorrectionMach and a blockage up to MaxBlockage; beyond them
// they are refused (class quantity.ErrRange) rather than extrapolated.
// Every error is a *Error naming the procedure and the input, with its
// class and cause.
package tunnel
