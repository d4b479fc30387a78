package similarity

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
)

// FreeSurfaceLimits are the smallest Reynolds and Weber numbers and the
// smallest head a free-surface Froude model should keep so that viscosity
// and surface tension stay negligible, each with the basis it rests on,
// which its check prints. A laboratory or guideline that names other
// criteria sets them here.
type FreeSurfaceLimits struct {
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
	Name         string
	Value, Limit float64
	Unit         string // of Value and Limit, "1" for a number
	Pass         bool
	Basis        string // where the limit comes from
}

// String writes "Re = V·h/ν = 4.2e+04 (limit ≥ 1e+04, common practice):
// passes" or "… FAILS: scale effects likely".
func (c ScaleCheck) String() string {
	verdict := "passes"
	if !c.Pass {
		verdict = "FAILS: scale effects likely"
	}
	unit := ""
	if c.Unit != "1" && c.Unit != "" {
		unit = " " + c.Unit
	}
	basis := ""
	if c.Basis != "" {
		basis = ", " + c.Basis
	}
	return fmt.Sprintf("%s = %.3g%s (limit ≥ %.3g%s%s): %s", c.Name, c.Value, unit, c.Limit, unit, basis, verdict)
}

// FreeSurfaceChecks checks a free-surface model at a characteristic
// velocity V and depth or head h in water of kinematic viscosity nu,
// density rho and surface tension sigma against the limits.
func FreeSurfaceChecks(v, h, nu, rho, sigma quantity.Quantity, lim FreeSurfaceLimits) ([]ScaleCheck, error) {
	if err := checkInputs("scale-effect check", true,
		input{"velocity", v, quantity.Velocity}, input{"head", h, quantity.Length}, input{"kinematic viscosity", nu, quantity.KinematicViscosity},
		input{"density", rho, quantity.Density}, input{"surface tension", sigma, quantity.SurfaceTension}, input{"minimum head", lim.MinHead, quantity.Length},
	); err != nil {
		return nil, err
	}
	re := v.Value() * h.Value() / nu.Value()
	we := rho.Value() * v.Value() * v.Value() * h.Value() / sigma.Value()
	return []ScaleCheck{
		{Name: "Re = V·h/ν", Value: re, Limit: lim.MinReynolds, Unit: "1", Pass: re >= lim.MinReynolds, Basis: lim.ReynoldsBasis},
		{Name: "We = ρV²h/σ", Value: we, Limit: lim.MinWeber, Unit: "1", Pass: we >= lim.MinWeber, Basis: lim.WeberBasis},
		{Name: "head h", Value: h.Value(), Limit: lim.MinHead.Value(), Unit: "m", Pass: h.Value() >= lim.MinHead.Value(), Basis: lim.HeadBasis},
	}, nil
}

// CrestRadiusCheck checks a model's round-crest radius against the
// limits' MinCrestRadius (zero: any positive radius passes).
func CrestRadiusCheck(radius quantity.Quantity, lim FreeSurfaceLimits) (ScaleCheck, error) {
	if err := checkInputs("crest radius check", true, input{"crest radius", radius, quantity.Length}); err != nil {
		return ScaleCheck{}, err
	}
	lo := 0.0
	if lim.MinCrestRadius != (quantity.Quantity{}) {
		if err := checkInputs("crest radius check", false, input{"minimum crest radius", lim.MinCrestRadius, quantity.Length}); err != nil {
			return ScaleCheck{}, err
		}
		lo = lim.MinCrestRadius.Value()
	}
	return ScaleCheck{Name: "crest radius R", Value: radius.Value(), Limit: lo, Unit: "m", Pass: radius.Value() >= lo, Basis: lim.CrestRadiusBasis}, nil
}

// Shields returns the Shields parameter θ = τ_b/((ρ_s − ρ)·g·d) and the
// particle (shear) Reynolds number Re* = u*·d/ν, u* = √(τ_b/ρ), of grains
// of diameter d and density rhoS under the bed shear stress tau in water
// of density rho and kinematic viscosity nu: the two groups that govern
// the start of sediment motion (Shields, 1936).
func Shields(tau, rhoS, rho, d, nu, g quantity.Quantity) (theta, reStar float64, err error) {
	if err := checkInputs("Shields parameter", true,
		input{"bed shear stress", tau, quantity.Pressure}, input{"grain density", rhoS, quantity.Density}, input{"water density", rho, quantity.Density},
		input{"grain diameter", d, quantity.Length}, input{"kinematic viscosity", nu, quantity.KinematicViscosity}, input{"gravity", g, quantity.Acceleration},
	); err != nil {
		return 0, 0, err
	}
	if !(rhoS.Value() > rho.Value()) {
		return 0, 0, &ExtrapolationError{Method: "Shields parameter", Reason: "grains no denser than the water do not settle"}
	}
	theta = tau.Value() / ((rhoS.Value() - rho.Value()) * g.Value() * d.Value())
	reStar = math.Sqrt(tau.Value()/rho.Value()) * d.Value() / nu.Value()
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

// SedimentFor returns the sediment scales of a Froude model with
// horizontal length ratio lengthH and vertical ratio lengthV (equal for an
// undistorted model), for a submerged relative density ratio deltaRatio
// (λ_Δ, Δ = (ρ_s − ρ)/ρ: 1 for the prototype's sand, about 0.16/1.65 for
// a light plastic) and viscosity ratio nuRatio (1 in the same water). The
// bed shear follows from τ = ρgRS with the depth scaled by λ_h and the
// slope by λ_h/λ_L; Shields similarity (λ_θ = 1) then fixes the grain.
func SedimentFor(lengthH, lengthV, deltaRatio, nuRatio float64) (SedimentScales, error) {
	for _, r := range []float64{lengthH, lengthV, deltaRatio, nuRatio} {
		if !(r > 0) || math.IsInf(r, 0) {
			return SedimentScales{}, &ExtrapolationError{Method: "sediment scales", Reason: fmt.Sprintf("ratio %v is not positive and finite", r)}
		}
	}
	var s SedimentScales
	s.Shear = lengthV * lengthV / lengthH
	s.Grain = s.Shear / deltaRatio
	s.ReStar = math.Sqrt(s.Shear) * s.Grain / nuRatio
	s.Exaggerated = lengthH != lengthV
	return s, nil
}
