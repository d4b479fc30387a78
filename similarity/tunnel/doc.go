// Package tunnel finds the tunnel condition a test needs and reduces what
// the balance measured to corrected coefficients and a fitted polar, in
// the order of the test. Every result that prints carries Caution, and
// AsphyxiantCaution and ColdCaution where they apply: the facility's
// certified envelope, its safety rules and its responsible engineer
// govern a pressurised, cryogenic or inert-gas tunnel, and the balance's
// rated loads govern every run.
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
//  2. Balance loads. ParseCalibration reads an internal strain-gauge
//     balance's calibration (a plain-text format of the package's own,
//     with units; NewCalibration builds one in code): the first- and
//     second-order terms of the matrix, in the direct
//     loads-from-readings form or the readings-from-loads form that is
//     inverted by iteration. Calibration.Loads turns a point's readings
//     into body-axis loads at the balance's moment centre and refuses a
//     load outside the calibrated range. Loads and Component state the
//     body axes and signs (x forward, y to starboard, z down; normal
//     force up, axial force aft).
//  3. Weight tare. FitWeightTare finds the model's weight and centre of
//     gravity from wind-off loads at several attitudes; WeightTare.Loads
//     gives the weight's loads at a run's Attitude, to be subtracted.
//  4. Moment transfer. Loads.About moves the moments from the balance's
//     moment centre to the model's moment reference point, given as an
//     Offset in body axes.
//  5. Axes. Attitude.Angles gives α and β from the model's pitch and
//     roll in a horizontal stream; Loads.ToStability and Loads.ToWind
//     resolve the loads in stability or wind axes as AxisLoads (drag,
//     side force, lift and the three moments).
//  6. Coefficients. AxisLoads.Coefficients forms C_D, C_Y, C_L, C_l,
//     C_m, C_n on the uncorrected dynamic pressure and the Reference
//     area, span and chord.
//  7. Wall corrections. CorrectWalls3D corrects a wing or a complete
//     model in a closed test section for solid and wake blockage, the
//     boundary (downwash) correction of angle and drag and the wing's and
//     tail's streamline curvature, onto the corrected dynamic pressure;
//     CorrectWalls2D does the same for an airfoil spanning the section.
//     Both take the Prandtl–Glauert-type compressibility factors (the
//     classical closed-wall corrections of low-speed wind-tunnel
//     testing).
//  8. Polar. FitPolar fits the corrected points with quantity/fit: the
//     lift slope and zero-lift angle from the linear range of C_L against
//     α, and C_D0 and K of the parabolic polar C_D = C_D0 + K·C_L², each
//     with its confidence interval.
//
// Reduction.Reduce takes one point through steps 2 to 7 and keeps every
// intermediate result in Reduced.
//
// The corrections are linear and hold for a test-section Mach number up
// to MaxWallCorrectionMach and a blockage up to MaxBlockage; beyond them
// they are refused (class quantity.ErrRange) rather than extrapolated,
// as are balance loads outside the calibration. Every error is a *Error
// naming the procedure and the input (and the line, for a calibration
// file), with its class and cause.
package tunnel
