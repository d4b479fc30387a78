// Package ship carries towing-tank results to the full-scale ship, in the
// order of the tank's procedure. Every ratio is model/prototype, every
// coefficient is on the wetted surface, and every result that prints
// carries HullCaution or PoweringCaution: predictions are estimates, and
// hulls and their machinery are designed to the applicable rules and
// checked by licensed engineers.
//
//  1. Friction line. FrictionLine.CF gives C_F(Re) by the ITTC-1957
//     model–ship correlation line (the default; ITTC1957), Schoenherr
//     (ATTC-1947), Hughes (1954) or Katsui (2005), for 10⁶ ≤ Re ≤ 10¹⁰;
//     below 10⁶ (LaminarReynolds) a model is not in turbulent flow and
//     the line is refused.
//  2. Form factor. FormFactorDoubleBody from a double-body (wind-tunnel
//     or deeply submerged) test, or Prohaska's plot of C_T/C_F against
//     Fnⁿ/C_F at low Froude numbers (Prohaska, ProhaskaWith,
//     ProhaskaFromTest; Fn ≤ 0.2 and n = 4 unless chosen, at least three
//     runs), as ITTC Recommended Procedure 7.5-02-02-01 (resistance test)
//     describes. WaveResistance gives C_W = C_T − (1 + k)C_F.
//  3. Temperature. TemperatureCorrection brings a run's C_T from the
//     tank's water to the standard 15 °C through the friction line, the
//     wave part unchanged (as 7.5-02-02-01 does; from memory);
//     1 ≤ 1 + k ≤ 2.
//  4. Blockage. TankBlockage corrects the speed for the tank's section by
//     the one-dimensional mean-flow theory, m = A_x/(b·h) ≤ 0.1 and below
//     the choking speed, which it returns; HullTest.WithBlockage applies
//     it to every run (7.5-02-02-01 §3.6.3 defines m the same way).
//  5. Extrapolation. ExtrapolateHull carries a resistance test to full
//     scale by Froude's hypothesis with the ITTC-1957 line, the form
//     factor and a correlation allowance, flagging a model below
//     LaminarReynolds or a C_T above MaxPlausibleCT; HullResult.Table
//     prints it. ExtrapolateHullRun carries one run with the uncertainty
//     of every input (GUM first order, exact slopes), the budget that
//     the ITTC's uncertainty analysis of the resistance test
//     (7.5-02-02-02; from memory) asks.
//  6. Resistance curve. FairResistance fairs the runs' C_TM against the
//     model speed by a polynomial (order given, or chosen by the
//     corrected Akaike criterion), with the fit's intervals;
//     ResistanceFit.At gives R_TM at any speed within the runs.
//  7. Open-water test. ReduceOpenWater reduces each run of the model
//     propeller (V_A, n in rev/s, T, Q) to J = V_A/(nD), K_T = T/(ρn²D⁴),
//     K_Q = Q/(ρn²D⁵) and η₀ = J·K_T/(2π·K_Q), with the blade Reynolds
//     number Re_0.7 = c_0.7·√(V_A² + (0.7πnD)²)/ν (PropellerReynolds),
//     flagged below UsualOpenWaterReynolds, 2×10⁵, as ITTC Recommended
//     Procedure 7.5-02-03-02.1 (open water test) defines them (from
//     memory); it fairs K_T and K_Q by polynomials in J (order given, or
//     chosen by a stated criterion) with their intervals, and refuses a
//     faired K_T that is not decreasing. OpenWaterFit.At, Eta0, JForKT
//     and Table read the faired curve, within the measured J only.
//  8. Self-propulsion test. SkinFrictionCorrection gives the towing
//     force F_D = ½ρ_M·V_M²·S_M·[(1 + k)(C_FM − C_FS) − ΔC_F − C_A] of the
//     ship's self-propulsion point, with the ΔC_F and C_A the prediction
//     uses. AnalyseSelfPropulsion analyses each run (V_M, n, T, Q, F_D)
//     by thrust identity with the faired open-water and resistance
//     curves: J_TM from K_TM on the open-water K_T, w_TM = 1 − J_TM·nD/V_M,
//     t = (T + F_D − R_TM)/T (T of all propellers), η_R = K_Q0/K_QM, η_H, η_O
//     and η_D
//     (7.5-02-03-01.1 and 01.4; from memory), and each run's blade
//     Reynolds number Re_0.7 with a warning below UsualOpenWaterReynolds
//     (a laminar model propeller flatters K_Q and η_R).
//  9. Powering. ITTC1978 predicts the ship's delivered power and
//     revolutions at one speed from the resistance, the open-water curve
//     (faired, PoweringInput.Faired, or a table interpolated linearly)
//     and the self-propulsion factors by the ITTC-1978 performance
//     prediction method (7.5-02-03-01.4), with CorrelationAllowanceITTC;
//     it refuses a model propeller Reynolds number at or below
//     MinBladeReynolds and warns below UsualBladeReynolds.
//     PoweringTable prints the results.
//  10. Speed–power curve. PredictSpeedPower runs steps 8 and 9 over a
//     range of ship speeds from the faired tests, fairing w_TM, t and η_R
//     against speed, and puts about P_D and n the band the fits give
//     (SpeedPowerMethod: first order through the whole chain, the fits'
//     covariances, Welch–Satterthwaite degrees of freedom); nothing is
//     extrapolated beyond the tests' speeds. SpeedPower.Table prints it.
//
// K_T and K_Q take n in revolutions per second throughout, never rad/s
// or rpm, and K_Q is the coefficient itself: reports print 10K_Q and say
// so.
//
// Every error is a *Error naming the procedure (Op) and the input, of
// one class among quantity.ErrDimension, ErrRange and ErrInvalid, with
// its cause.
package ship
