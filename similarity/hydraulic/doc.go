// Package hydraulic plans and checks Froude models of rivers, harbours
// and hydraulic structures, in the order of the procedure. Every ratio is
// model/prototype; every result carries StructureCaution: a
// model indicates prototype behaviour subject to scale effects, and the
// structure is designed to the applicable local codes and checked by
// licensed engineers.
//
//  1. Scales. DistortedFroude gives the ratios of a distorted Froude
//     model from its horizontal and vertical length ratios
//     (DistortedScales), and ManningRatio Manning's n of an undistorted
//     one, λ_n = λ_L^(1/6).
//  2. Scale effects. FreeSurfaceChecks checks that viscosity and surface
//     tension stay negligible in the model (Reynolds and Weber numbers,
//     the head over a crest) against FreeSurfaceLimits, whose limits
//     carry their basis: DefaultFreeSurfaceLimits the trade's common
//     practice, WeirLimits the published criteria for weirs and
//     spillways; CrestRadiusCheck checks a round crest's radius.
//     ModelManningCheck checks the model's Manning n against the
//     smoothest model materials (SmoothestModelManning).
//  3. Sediment. Shields gives the Shields parameter and particle Reynolds
//     number of a bed (ShieldsInput); SedimentFor the bed-shear, grain
//     and Re* ratios of a movable-bed model (SedimentRatios);
//     ParticleReynoldsCheck whether a model grain stays out of the
//     viscous range (Re* ≥ ViscousParticleReynolds).
//
// Each check returns a ScaleCheck that states its value, limit, basis
// and verdict. Every error is a *Error naming the procedure and the
// input, of one class among quantity.ErrDimension, ErrRange and
// ErrInvalid, with its cause.
package hydraulic
