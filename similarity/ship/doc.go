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
//  6. Powering. ITTC1978 predicts the ship's delivered power and
//     revolutions from the resistance, the open-water curve and the
//     self-propulsion factors by the ITTC-1978 performance prediction
//     method (7.5-02-03-01.4), with CorrelationAllowanceITTC; it refuses
//     a model propeller Reynolds number at or below MinBladeReynolds and
//     warns below UsualBladeReynolds. PoweringTable prints the results.
//
// Every error is a *Error naming the procedure (Op) and the input, of
// one class among quantity.ErrDimension, ErrRange and ErrInvalid, with
// its cause.
package ship
