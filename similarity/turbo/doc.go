// Package turbo analyses pump, turbine and fan tests and scales their
// performance from a model to a prototype, in the order of the procedure.
// Every ratio is model/prototype; model and prototype values that could
// be swapped come in named pairs (ReynoldsNumbers, Diameters,
// AffinityScales). PumpCaution goes with every result: guaranteed
// performance comes from the acceptance test to the applicable standard,
// and the installation is designed to the local codes and checked by
// licensed engineers. PrototypePoint and Verdict carry it in their
// Caution field (and Verdict.Table prints it); the other results (the
// ratios of Affinity, the efficiencies of the step-up functions and of
// StepUp, SpecificSpeeds, NPSH, the Thoma number, ReducedPoint,
// PumpCurves, NPSH3Result) are bare values: print PumpCaution with them.
//
//  1. Reduce the test points. ReducePoints translates each measured
//     point (flow, head, power input, speed: TestPoint) to the specified
//     speed by the affinity laws, Q ∝ n, H ∝ n², P ∝ n³, with the
//     efficiency ρgQH/P unchanged, for test speeds within 50 % to 120 %
//     of the specified (ISO 9906, from memory: check the band against
//     ISO 9906:2012 and the contract before a pump is accepted).
//  2. Fit the curves. FitPumpCurves fits the Q–H, Q–P and Q–η curves by
//     least squares (quantity/fit), each of the order a stated criterion
//     selects (TopTerm up to order 3 unless chosen), with the intervals
//     of its coefficients and predictions.
//  3. Find NPSH3. FindNPSH3 takes a suction series at constant flow (head
//     against NPSH available), takes the mean head of the points of
//     highest NPSHA as the reference, makes the series monotone and fairs
//     it (fit.Fair), and finds the NPSHA at which the faired head is 97 %
//     of the reference, with its standard uncertainty from the NPSHA and
//     head readings.
//  4. Carry to the prototype: affinity laws. AffinityLaws gives the flow,
//     head, power, torque and pressure ratios for a rotational-speed,
//     diameter and density ratio, solved exactly from the held flow, head
//     and power coefficients; efficiency is taken equal (so the power
//     ratio holds at equal efficiency only).
//  5. Efficiency step-up. The efficiency is not equal: IECStepUp and
//     IECCurve follow the scalable-loss formula of IEC 60193 (its scope,
//     from memory: the hydraulic efficiency of turbines, storage pumps
//     and pump-turbines, 10⁵ ≤ Re_M ≤ Re_P; applied to another pump's
//     overall efficiency, taken as the hydraulic one, it is an indication
//     only);
//     AckeretStepUp Ackeret's formula; MoodyStepUp and MoodyCurve
//     Moody's diameter formula (exponent 1/5 unless chosen, 0 … 1), at
//     the best-efficiency point or at each point (StepUpMethod); FanStepUp
//     and FanCurve the fan standards' conversion between sizes (half
//     Ackeret's gain for a larger fan, the full loss for a smaller). Each
//     returns the prototype efficiency and the gain applied. The
//     prototype point is then: Q_P = Q_M/λ_Q and H_P = H_M/λ_H (the
//     affinity values, unchanged by the step-up), η_P from the step-up,
//     and P_P = ρ_P·g·Q_P·H_P/η_P; PrototypePointOf returns the four with
//     the step-up named.
//  6. Specific speed. SpecificSpeedOf gives n_q (metric), N_s (US) and
//     the dimensionless Ω_s at the best-efficiency point;
//     SpecificSpeedMetric, SpecificSpeedUS and SpecificSpeedDimensionless
//     convert between them.
//  7. Cavitation at the prototype. NPSH gives the net positive suction
//     head at a section (ISO 9906, IEC 60193), Thoma the cavitation number
//     σ = NPSH/H (Heads) that model and prototype share at similar points,
//     and SuctionPressureFor the suction pressure a prototype needs for a
//     σ.
//  8. Acceptance. The pump as built is tested to ISO 9906 and its test
//     analysed by steps 1 to 3; CheckGuarantee then judges the guarantee
//     point (Guarantee) against an acceptance grade (Grade: 1U, 1E, 1B,
//     2B, 2U, 3B, with the tolerance factors t_Q, t_H, t_P and t_η of
//     Grade.Tolerance, quoted from memory): the fitted Q–H curve must meet
//     the tolerance cross through the guarantee point, and the efficiency
//     (and power, where guaranteed) read from the fitted curves where the
//     straight line through the origin and the guarantee point meets the
//     Q–H curve must be within its tolerance. The factors and the speed
//     band are quoted from memory, so a verdict is provisional: check them
//     against ISO 9906:2012 Table 8 and the contract before a pump is
//     accepted or rejected on it. Every Verdict says so itself, its first
//     note being ProvisionalNote, and Verdict.Table prints the checks,
//     the notes and the caution.
//
// Every error is a *Error naming the procedure and the input, of one
// class among quantity.ErrDimension, ErrRange and ErrInvalid, with its
// cause; a fit's error is kept as the cause.
package turbo
