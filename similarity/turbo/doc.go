// Package turbo scales pump, turbine and fan performance from a model
// test, in the order of the procedure. Every ratio is model/prototype;
// model and prototype values that could be swapped come in named pairs
// (ReynoldsNumbers, Diameters, AffinityScales). Every result carries
// PumpCaution: guaranteed performance comes from the acceptance test to
// the applicable standard, and the installation is designed to the local
// codes and checked by licensed engineers.
//
//  1. Affinity laws. AffinityLaws gives the flow, head, power, torque and
//     pressure ratios for a rotational-speed, diameter and density ratio,
//     solved exactly from the held flow, head and power coefficients;
//     efficiency is taken equal.
//  2. Efficiency step-up. The efficiency is not equal: IECStepUp and
//     IECCurve follow the scalable-loss formula of IEC 60193 (hydraulic
//     turbines, storage pumps and pump-turbines; 10⁵ ≤ Re_M ≤ Re_P);
//     AckeretStepUp Ackeret's formula; MoodyStepUp and MoodyCurve
//     Moody's diameter formula (exponent 1/5 unless chosen, 0 … 1), at
//     the best-efficiency point or at each point (StepUpMethod); FanStepUp
//     and FanCurve the fan standards' conversion between sizes (half
//     Ackeret's gain for a larger fan, the full loss for a smaller). Each
//     returns the prototype efficiency and the gain applied.
//  3. Specific speed. SpecificSpeedOf gives n_q (metric), N_s (US) and
//     the dimensionless Ω_s at the best-efficiency point;
//     SpecificSpeedMetric, SpecificSpeedUS and SpecificSpeedDimensionless
//     convert between them.
//  4. Cavitation. NPSH gives the net positive suction head at a section
//     (ISO 9906, IEC 60193), Thoma the cavitation number σ = NPSH/H (Heads) that
//     model and prototype share at similar points, and SuctionPressureFor
//     the suction pressure a prototype needs for a σ.
//
// Every error is a *Error naming the procedure and the input, of one
// class among quantity.ErrDimension, ErrRange and ErrInvalid, with its
// cause.
package turbo
