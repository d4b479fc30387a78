// Package hydraulic plans and checks Froude models of rivers, harbours
// and hydraulic structures and carries their measurements to full
// scale, in the order of the procedure. Every ratio is model/prototype;
// every result carries StructureCaution: a model indicates prototype
// behaviour subject to scale effects, and the structure is designed to
// the applicable local codes and checked by licensed engineers.
//
//  1. Scales. The core's similarity.Froude gives the ratios of an
//     undistorted model (λ_V = λ_L^(1/2), λ_Q = λ_L^(5/2));
//     DistortedFroude those of a distorted one from its horizontal and
//     vertical length ratios (DistortedScales), and DistortionCheck
//     checks its exaggeration against common practice
//     (MaxCommonDistortion).
//  2. Roughness. ManningRatio gives Manning's n of an undistorted model,
//     λ_n = λ_L^(1/6); ModelManningCheck checks the n the model needs
//     against the smoothest model materials (SmoothestModelManning).
//  3. Sediment, for a movable bed. Shields gives the Shields parameter
//     and particle Reynolds number of a bed (ShieldsInput); SedimentFor
//     the bed-shear, grain and Re* ratios (SedimentRatios);
//     ParticleReynoldsCheck whether a model grain stays out of the
//     viscous range (Re* ≥ ViscousParticleReynolds); GrainClass names a
//     grain's size class (sand, gravel, cobbles, boulders …).
//  4. Scale effects. FreeSurfaceChecks checks that viscosity and surface
//     tension stay negligible in the model (Reynolds and Weber numbers,
//     the head over a crest) against FreeSurfaceLimits, whose limits
//     carry their basis: DefaultFreeSurfaceLimits the trade's common
//     practice, WeirLimits the published criteria for weirs and
//     spillways; CrestRadiusCheck checks a round crest's radius.
//  5. Rating. FitRating takes a weir's or flume's measured model heads
//     and discharges (RatingInput), checks each head for scale effects
//     (the Reynolds and Weber numbers formed with the critical velocity
//     (g·q)^(1/3) of the measured unit discharge q = Q/b, and the head),
//     excludes the points that fail by the stated ExclusionRule, and fits
//     the rest: Q = C·h^n as a straight line in ln Q and ln h, and the
//     weir coefficient C_d of Q = C_d·(2/3)·√(2g)·b·h^(3/2) with n held
//     at 3/2, each with its confidence interval; outliers are flagged and
//     kept. The Rating's range of validity is the heads of the points it
//     used. Rating.Prototype carries it to full scale by Froude
//     similarity, h_p = h_m/λ_L and Q_p = Q_m/λ_L^(5/2), with the band
//     of the fit's uncertainty, refusing a head outside the range;
//     Rating.Extrapolate goes outside it deliberately and says so. The
//     band holds the fit's uncertainty alone, not the scale effects
//     (BandNote).
//
// Each check returns a ScaleCheck that states its value, limit, basis
// and verdict. Every error is a *Error naming the procedure and the
// input, of one class among quantity.ErrDimension, ErrRange and
// ErrInvalid, with its cause.
package hydraulic
