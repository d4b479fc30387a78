package hydraulic

import (
	"fmt"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// StructureCaution accompanies every scale-effect check, roughness
// and sediment scale of a hydraulic model: print it with them.
const StructureCaution = "A hydraulic model indicates prototype behaviour subject to scale effects (viscosity, surface tension, " +
	"air entrainment, roughness, sediment); spillways, intakes and other hydraulic structures are designed to the applicable " +
	"local codes and dam-safety regulations and checked and approved by licensed engineers."

// FreeSurfaceLimits are the smallest Reynolds and Weber numbers and the
// smallest head a free-surface Froude model should keep so that viscosity
// and surface tension stay negligible, each with the basis it rests on,
// which its check prints. A laboratory or guideline that names other
// criteria sets them here.
type FreeSurfaceLimits struct {
	// MinReynolds and MinWeber are the smallest Reynolds and Weber
	// numbers (dimensionless).
	MinReynolds, MinWeber float64
	MinHead               quantity.Quantity
	// MinCrestRadius is the smallest radius of a round crest, for
	// CrestRadiusCheck; zero leaves the check unlimited.
	MinCrestRadius quantity.Quantity
	// The bases of the limits, printed with each check.
	ReynoldsBasis, WeberBasis, HeadBasis, CrestRadiusBasis string
}

// CommonPractice is the basis of limits that are the trade's rules of
// thumb rather than one publication's criterion.
const CommonPractice = "common practice"

// DefaultFreeSurfaceLimits returns common-practice limits: Re = V·h/ν ≥
// 10⁴ for fully turbulent flow, We = ρV²h/σ ≥ 100 for negligible surface
// tension, and a head of at least 5 cm over a crest.
func DefaultFreeSurfaceLimits() FreeSurfaceLimits {
	return FreeSurfaceLimits{MinReynolds: 1e4, MinWeber: 100, MinHead: quantity.New(0.05, quantity.Length),
		ReynoldsBasis: CommonPractice, WeberBasis: CommonPractice, HeadBasis: CommonPractice}
}

// WeirLimits returns limits for free flow over a weir or spillway crest
// that rest on published criteria where a criterion was found: a head of
// at least 0.07 m, the upper end of the 0.02–0.07 m that published
// criteria for free flow over linear weirs ask independently of the
// model's size, as summarised by Erpicum et al. (2016, Scale effects in
// physical piano key weirs models, J. Hydraulic Research 54(6)); and a
// round crest's radius of at least 0.01 m (Castro-Orgaz and Hager, 2014,
// Scale effects of round-crested weir flow, J. Hydraulic Research
// 52(5)). The Reynolds and Weber limits stay the common-practice ones of
// DefaultFreeSurfaceLimits.
func WeirLimits() FreeSurfaceLimits {
	l := DefaultFreeSurfaceLimits()
	l.MinHead = quantity.New(0.07, quantity.Length)
	l.HeadBasis = "Erpicum et al. 2016: published criteria for linear weirs ask 0.02–0.07 m; the upper value"
	l.MinCrestRadius = quantity.New(0.01, quantity.Length)
	l.CrestRadiusBasis = "Castro-Orgaz and Hager 2014, round crests"
	return l
}

// ScaleCheck is one scale-effect check of a model: a value, its limit,
// whether it passes, and the limit's basis.
type ScaleCheck struct {
	Name string
	// Value and Limit are in Unit.
	Value, Limit float64
	Unit         string // of Value and Limit, "1" for a number
	Pass         bool
	Basis        string // where the limit comes from
	// Upper says the limit is a maximum: the check passes at Value ≤
	// Limit (an exaggeration, say) rather than Value ≥ Limit.
	Upper bool
	// Warning says what a failed check means for the model; empty for a
	// check that passes, or when the general "scale effects likely" says it.
	Warning string
}

// String writes "Re = V·h/ν = 4.20e+04 (limit ≥ 1e+04, common practice):
// passes" or "… FAILS: scale effects likely" (or the check's Warning),
// "limit ≤" for an Upper limit;
// the value has three significant figures, trailing zeros kept, plain
// from 0.001 to 10⁴ and with an exponent outside it.
func (c ScaleCheck) String() string {
	verdict := "passes"
	if !c.Pass {
		verdict = "FAILS: scale effects likely"
		if c.Warning != "" {
			verdict = "FAILS: " + c.Warning
		}
	}
	unit := ""
	if c.Unit != "1" && c.Unit != "" {
		unit = " " + c.Unit
	}
	basis := ""
	if c.Basis != "" {
		basis = ", " + c.Basis
	}
	rel := "≥"
	if c.Upper {
		rel = "≤"
	}
	return fmt.Sprintf("%s = %s%s (limit %s %.3g%s%s): %s", c.Name, sig3(c.Value), unit, rel, c.Limit, unit, basis, verdict)
}

// sig3 writes x to three significant figures, trailing zeros kept: in
// plain notation from 0.001 up to 10⁴ (0.0300, 85.1, 1170), with an
// exponent outside it (1.20e+04), so that a column of one quantity reads
// alike.
func sig3(x float64) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'g', 3, 64)
	}
	e := int(math.Floor(math.Log10(math.Abs(x))))
	p := math.Pow(10, float64(e-2))
	r := math.Round(x/p) * p   // 1172.6 → 1170: three figures also left of the point
	if math.Abs(r) >= 1000*p { // 999.6 rounds to 1000: one decade up
		e++
	}
	if e < -3 || e >= 4 {
		return strconv.FormatFloat(x, 'e', 2, 64)
	}
	return strconv.FormatFloat(r, 'f', max(0, 2-e), 64)
}

// FreeSurfaceChecks checks a free-surface model at a characteristic
// velocity V and depth or head h in water of kinematic viscosity nu,
// density rho and surface tension sigma against the limits. Both groups
// are formed with the same V and h: Re = V·h/ν and We = ρV²h/σ. The
// limits' MinReynolds and MinWeber must be finite and not negative; a
// group out of the range of a float64 is a *Error of class quantity.ErrRange. See
// StructureCaution.
func FreeSurfaceChecks(v, h, nu, rho, sigma quantity.Quantity, lim FreeSurfaceLimits) ([]ScaleCheck, error) {
	if err := fail("scale-effect check", similarity.CheckInputs(true,
		similarity.Input{Name: "velocity", Value: v, Dim: quantity.Velocity},
		similarity.Input{Name: "head", Value: h, Dim: quantity.Length},
		similarity.Input{Name: "kinematic viscosity", Value: nu, Dim: quantity.KinematicViscosity},
		similarity.Input{Name: "density", Value: rho, Dim: quantity.Density},
		similarity.Input{Name: "surface tension", Value: sigma, Dim: quantity.SurfaceTension},
		similarity.Input{Name: "minimum head", Value: lim.MinHead, Dim: quantity.Length})); err != nil {
		return nil, err
	}
	for _, l := range []struct {
		name string
		v    float64
	}{{"minimum Reynolds number", lim.MinReynolds}, {"minimum Weber number", lim.MinWeber}} {
		if !(l.v >= 0) || math.IsInf(l.v, 0) {
			return nil, &Error{Op: "scale-effect check", Fault: similarity.Invalid("", fmt.Sprintf("%s %v: want finite and not negative", l.name, l.v))}
		}
	}
	re := v.Value() * h.Value() / nu.Value()
	we := rho.Value() * v.Value() * v.Value() * h.Value() / sigma.Value()
	if err := fail("scale-effect check", similarity.CheckResults(true,
		similarity.Result{Name: "Reynolds number V·h/ν", Value: re},
		similarity.Result{Name: "Weber number ρV²h/σ", Value: we})); err != nil {
		return nil, err
	}
	return []ScaleCheck{
		{Name: "Re = V·h/ν", Value: re, Limit: lim.MinReynolds, Unit: "1", Pass: re >= lim.MinReynolds, Basis: lim.ReynoldsBasis},
		{Name: "We = ρV²h/σ", Value: we, Limit: lim.MinWeber, Unit: "1", Pass: we >= lim.MinWeber, Basis: lim.WeberBasis},
		{Name: "head h", Value: h.Value(), Limit: lim.MinHead.Value(), Unit: "m", Pass: h.Value() >= lim.MinHead.Value(), Basis: lim.HeadBasis},
	}, nil
}

// CrestRadiusCheck checks a model's round-crest radius against the
// limits' MinCrestRadius (zero: any positive radius passes).
func CrestRadiusCheck(radius quantity.Quantity, lim FreeSurfaceLimits) (ScaleCheck, error) {
	if err := fail("crest radius check", similarity.CheckInputs(true, similarity.Input{Name: "crest radius", Value: radius, Dim: quantity.Length})); err != nil {
		return ScaleCheck{}, err
	}
	lo := 0.0
	if lim.MinCrestRadius != (quantity.Quantity{}) {
		if err := fail("crest radius check", similarity.CheckInputs(false, similarity.Input{Name: "minimum crest radius", Value: lim.MinCrestRadius, Dim: quantity.Length})); err != nil {
			return ScaleCheck{}, err
		}
		lo = lim.MinCrestRadius.Value()
	}
	return ScaleCheck{Name: "crest radius R", Value: radius.Value(), Limit: lo, Unit: "m", Pass: radius.Value() >= lo, Basis: lim.CrestRadiusBasis}, nil
}

// ShieldsInput is a bed of grains under flowing water, each value named so
// that the two densities cannot be swapped.
type ShieldsInput struct {
	BedShearStress     quantity.Quantity // τ_b
	GrainDensity       quantity.Quantity // ρ_s
	WaterDensity       quantity.Quantity // ρ
	GrainDiameter      quantity.Quantity // d
	KinematicViscosity quantity.Quantity // ν of the water
	Gravity            quantity.Quantity // g; g_n when unset
}

// Shields returns the Shields parameter θ = τ_b/((ρ_s − ρ)·g·d) and the
// particle (shear) Reynolds number Re* = u*·d/ν, u* = √(τ_b/ρ), of the
// grains of in under its bed shear stress: the two groups that govern
// the start of sediment motion (Shields, 1936). A group out of the range
// of a float64 is a *Error of class quantity.ErrRange; ParticleReynoldsCheck says whether
// a model grain's Re* is in the viscous range.
func Shields(in ShieldsInput) (theta, reStar float64, err error) {
	tau, rhoS, rho, d, nu := in.BedShearStress, in.GrainDensity, in.WaterDensity, in.GrainDiameter, in.KinematicViscosity
	g, bad := similarity.GravityOr(in.Gravity)
	if bad != nil {
		return 0, 0, fail("Shields parameter", bad)
	}
	if err := fail("Shields parameter", similarity.CheckInputs(true,
		similarity.Input{Name: "bed shear stress", Value: tau, Dim: quantity.Pressure},
		similarity.Input{Name: "grain density", Value: rhoS, Dim: quantity.Density},
		similarity.Input{Name: "water density", Value: rho, Dim: quantity.Density},
		similarity.Input{Name: "grain diameter", Value: d, Dim: quantity.Length},
		similarity.Input{Name: "kinematic viscosity", Value: nu, Dim: quantity.KinematicViscosity},
		similarity.Input{Name: "gravity", Value: g, Dim: quantity.Acceleration})); err != nil {
		return 0, 0, err
	}
	if !(rhoS.Value() > rho.Value()) {
		return 0, 0, &Error{Op: "Shields parameter", Fault: similarity.Invalid("", "grains no denser than the water do not settle")}
	}
	theta = tau.Value() / ((rhoS.Value() - rho.Value()) * g.Value() * d.Value())
	reStar = math.Sqrt(tau.Value()/rho.Value()) * d.Value() / nu.Value()
	if err := fail("Shields parameter", similarity.CheckResults(true,
		similarity.Result{Name: "Shields parameter θ", Value: theta},
		similarity.Result{Name: "particle Reynolds number Re*", Value: reStar})); err != nil {
		return 0, 0, err
	}
	return theta, reStar, nil
}

// SedimentScales are the consequences of Shields similarity in a Froude
// model of a movable bed, as ratios model/prototype.
type SedimentScales struct {
	Shear       float64 // bed shear stress over water density, u*²: λ_h²/λ_L
	Grain       float64 // the grain diameter that keeps θ: λ_h²/(λ_L·λ_Δ)
	ReStar      float64 // the particle Reynolds number that follows: √(λ_h²/λ_L)·λ_d/λ_ν
	Exaggerated bool    // a distorted model (λ_h ≠ λ_L)
}

// SedimentRatios are the model/prototype ratios a movable-bed Froude
// model is built to, named so that none can be given for another.
type SedimentRatios struct {
	Horizontal      float64 // λ_L, lengths in plan
	Vertical        float64 // λ_h, depths (equal to Horizontal for an undistorted model)
	RelativeDensity float64 // λ_Δ, Δ = (ρ_s − ρ)/ρ: 1 for the prototype's sand, about 0.16/1.65 for a light plastic
	Viscosity       float64 // λ_ν, 1 in the same water
}

// SedimentFor returns the sediment scales of a Froude model built to the
// ratios r. The
// bed shear follows from τ = ρgRS with the depth scaled by λ_h and the
// slope by λ_h/λ_L; Shields similarity (λ_θ = 1) then fixes the grain.
// A scale out of the range of a float64 is a *Error of class quantity.ErrRange. The
// model grain's own Re* (the prototype's times ReStar) should be checked
// with ParticleReynoldsCheck.
func SedimentFor(r SedimentRatios) (SedimentScales, error) {
	lengthH, lengthV, deltaRatio, nuRatio := r.Horizontal, r.Vertical, r.RelativeDensity, r.Viscosity
	for _, c := range []struct {
		name string
		v    float64
	}{{"Horizontal", lengthH}, {"Vertical", lengthV}, {"RelativeDensity", deltaRatio}, {"Viscosity", nuRatio}} {
		if !(c.v > 0) || math.IsInf(c.v, 0) {
			return SedimentScales{}, &Error{Op: "sediment scales", Fault: similarity.Invalid(c.name, fmt.Sprintf("SedimentRatios.%s = %v is not positive and finite", c.name, c.v))}
		}
	}
	var s SedimentScales
	s.Shear = lengthV * lengthV / lengthH
	s.Grain = s.Shear / deltaRatio
	s.ReStar = math.Sqrt(s.Shear) * s.Grain / nuRatio
	s.Exaggerated = lengthH != lengthV
	if err := fail("sediment scales", similarity.CheckResults(true,
		similarity.Result{Name: "bed shear ratio", Value: s.Shear},
		similarity.Result{Name: "grain ratio", Value: s.Grain},
		similarity.Result{Name: "particle Reynolds ratio", Value: s.ReStar})); err != nil {
		return SedimentScales{}, err
	}
	return s, nil
}

// ViscousParticleReynolds is the particle Reynolds number Re* = u*·d/ν
// below which a grain lies within the viscous sublayer of the bed: the
// hydraulically smooth regime, k_s·u*/ν < 5 for sand roughness k_s
// (Nikuradse's pipe experiments as the open-channel texts quote them;
// from memory). There the critical Shields parameter depends on Re* and
// rises as Re* falls, where the prototype's sand is in the transitional
// or rough regime, so a model grain below it no longer starts moving at
// the prototype's θ.
const ViscousParticleReynolds = 5.0

// ParticleReynoldsCheck checks a movable-bed model grain's particle
// Reynolds number reStar (u*·d/ν, from Shields, or the prototype's times
// SedimentScales.ReStar) against ViscousParticleReynolds. A failing check
// carries the warning that the grain is in the viscous range.
func ParticleReynoldsCheck(reStar float64) (ScaleCheck, error) {
	if !(reStar > 0) || math.IsInf(reStar, 0) {
		return ScaleCheck{}, &Error{Op: "particle Reynolds check", Fault: similarity.Invalid("", fmt.Sprintf("Re* = %v: want positive and finite", reStar))}
	}
	c := ScaleCheck{Name: "model grain Re* = u*·d/ν", Value: reStar, Limit: ViscousParticleReynolds, Unit: "1",
		Pass:  reStar >= ViscousParticleReynolds,
		Basis: "hydraulically smooth below it, the grain within the viscous sublayer; from memory"}
	if !c.Pass {
		c.Warning = "the grain is in the viscous range; its threshold of motion departs from the prototype's (a coarser, lighter grain raises Re*)"
	}
	return c, nil
}

// GrainClass names the size class of a grain of diameter d (m) by the
// bands of ISO 14688-1 (from memory): clay below 0.002 mm, silt 0.002 to
// 0.063 mm, sand 0.063 to 2 mm, gravel 2 to 63 mm, cobbles 63 to 200 mm,
// boulders above 200 mm (a grain on a boundary is in the coarser class).
// A d that is not positive and finite gives "".
func GrainClass(d float64) string {
	switch {
	case !(d > 0) || math.IsInf(d, 0):
		return ""
	case d < 0.002e-3:
		return "clay"
	case d < 0.063e-3:
		return "silt"
	case d < 2e-3:
		return "sand"
	case d < 63e-3:
		return "gravel"
	case d < 200e-3:
		return "cobbles"
	}
	return "boulders"
}

// SmoothestModelManning is about the smallest Manning n, in s·m^(−1/3),
// that the smooth materials of hydraulic models reach: 0.009 for plastic
// (a published table of Manning coefficients, space4water.org, gives
// plastic 0.009, PVC with smooth inner walls 0.009–0.011 and glass 0.010;
// Chow's Open-Channel Hydraulics, 1959, Table 5-6, gives normal values of
// 0.009 for lucite and 0.010 for glass, from memory).
const SmoothestModelManning = 0.009

// ManningDim is the dimension of Manning's n, L^(−1/3)·T (s·m^(−1/3) in
// SI), the dimension ModelManningCheck requires of the prototype's n.
var ManningDim = func() quantity.Dim {
	d, err := quantity.ParseDim("T L^(-1/3)")
	if err != nil {
		panic(err)
	}
	return d
}()

// ModelManningCheck returns the Manning n a model needs, the prototype's
// protoN (a Quantity of dimension ManningDim, s·m^(−1/3)) times the
// dimensionless roughness ratio nRatio (ManningRatio, or
// Distorted.Manning), checked against SmoothestModelManning: a model that
// needs a smoother surface than model materials reach fails, with a
// warning that its friction will be too large. A protoN of another
// dimension is an ErrDimension.
func ModelManningCheck(protoN quantity.Quantity, nRatio float64) (ScaleCheck, error) {
	m := func(r string) error {
		return &Error{Op: "model roughness check", Fault: similarity.Invalid("", r)}
	}
	if err := fail("model roughness check", similarity.CheckInputs(true,
		similarity.Input{Name: "prototype Manning n", Value: protoN, Dim: ManningDim})); err != nil {
		return ScaleCheck{}, err
	}
	if !(nRatio > 0) || math.IsInf(nRatio, 0) {
		return ScaleCheck{}, m(fmt.Sprintf("Manning ratio %v: want positive and finite", nRatio))
	}
	n := protoN.Value() * nRatio
	if err := fail("model roughness check", similarity.CheckResults(true, similarity.Result{Name: "model Manning n", Value: n})); err != nil {
		return ScaleCheck{}, err
	}
	c := ScaleCheck{Name: "model Manning n", Value: n, Limit: SmoothestModelManning, Unit: "s·m^(−1/3)",
		Pass:  n >= SmoothestModelManning,
		Basis: "the smoothest model materials in published Manning tables: plastic 0.009, glass 0.010"}
	if !c.Pass {
		c.Warning = "no model material is this smooth, so the model's friction will be too large (common remedies: tilt the model, or distort it)"
	}
	return c, nil
}
