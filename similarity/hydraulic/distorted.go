package hydraulic

import (
	"fmt"
	"math"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Distorted is a distorted Froude model of a river or harbour, with a
// horizontal length ratio and a larger vertical one.
type Distorted struct {
	Horizontal, Vertical float64 // λ_x, λ_z
	Distortion           float64 // λ_z/λ_x, the vertical exaggeration (4 for 1:200 across and 1:50 deep)
	Velocity             float64 // λ_V = λ_z^(1/2)
	Time                 float64 // λ_t = λ_x/λ_z^(1/2), along the flow
	Discharge            float64 // λ_Q = λ_x·λ_z^(3/2)
	Area                 float64 // plan area λ_x²
	Slope                float64 // λ_S = λ_z/λ_x
	Manning              float64 // λ_n = λ_z^(2/3)/λ_x^(1/2)
	solution             *similarity.Solution
}

// DistortedScales are the two length ratios of a distorted model,
// model/prototype, by name so that one cannot be given for the other.
// Each must be positive and finite.
type DistortedScales struct {
	Horizontal float64 // λ_x, along and across the flow (1/200 for 1:200)
	Vertical   float64 // λ_z, depths and heights (1/50 for 1:50)
}

// DistortedFroude returns the ratios of a distorted Froude model: the
// Froude number held on the vertical scale (V²/(g·z)), the same gravity,
// the horizontal scale fixed separately. Manning's n follows from holding
// friction slope equal to bed slope: n ∝ z^(2/3)·S^(1/2)/V.
//
// It takes DistortedScales.Horizontal and DistortedScales.Vertical. The
// plan behind it (Distorted.Solution) has the variables V (velocity), x
// (horizontal length), z (vertical length), g (gravitational
// acceleration), t (time) and Q (volume flow rate); the basis of
// DerivedRatio is V, x.
func DistortedFroude(sc DistortedScales) (Distorted, error) {
	if err := fail("distorted Froude scales", similarity.CheckRatios(
		similarity.Result{Name: "horizontal length", Value: sc.Horizontal},
		similarity.Result{Name: "vertical length", Value: sc.Vertical})); err != nil {
		return Distorted{}, err
	}
	horizontal, vertical := sc.Horizontal, sc.Vertical
	p := pigroups.MustProblem(
		pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("x", quantity.Length, "length"),
		pigroups.VarKind("z", quantity.Length, "length"), pigroups.VarKind("g", quantity.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("t", quantity.Time, "time"), pigroups.VarKind("Q", quantity.VolumeFlowRate, "volume flow rate"))
	s, err := similarity.NewPlan(p).
		HoldExps("the Froude number on depth", map[string]int{"V": 2, "g": -1, "z": -1}).
		HoldExps("the kinematics along the flow", map[string]int{"V": 1, "t": 1, "x": -1}).
		HoldExps("the discharge through a section", map[string]int{"Q": 1, "V": -1, "x": -1, "z": -1}).
		SameGravity("g").Fix("x", horizontal).Fix("z", vertical).Basis("V", "x").Solve()
	if err != nil {
		return Distorted{}, err
	}
	v, err := s.RatioValues("V", "t", "Q")
	if err != nil {
		return Distorted{}, err
	}
	d := Distorted{
		Horizontal: horizontal, Vertical: vertical, Distortion: vertical / horizontal,
		Velocity: v[0], Time: v[1], Discharge: v[2], Area: horizontal * horizontal,
		Slope: vertical / horizontal, Manning: math.Pow(vertical, 2.0/3) / math.Sqrt(horizontal),
		solution: s,
	}
	if err := fail("distorted Froude scales", similarity.CheckRatios(
		similarity.Result{Name: "area", Value: d.Area},
		similarity.Result{Name: "slope", Value: d.Slope},
		similarity.Result{Name: "Manning's n", Value: d.Manning},
		similarity.Result{Name: "distortion", Value: d.Distortion})); err != nil {
		return Distorted{}, err
	}
	return d, nil
}

// Solution returns the plan behind the distorted model, for its laws.
func (d Distorted) Solution() *similarity.Solution { return d.solution }

// ManningRatio is the ratio of Manning's roughness coefficient in an
// undistorted Froude model, λ_n = λ_L^(1/6): from V = R^(2/3)·S^(1/2)/n
// with λ_V = λ_L^(1/2), λ_R = λ_L and λ_S = 1.
func ManningRatio(lengthRatio float64) (float64, error) {
	if err := fail("Manning ratio", similarity.CheckRatios(similarity.Result{Name: "length", Value: lengthRatio})); err != nil {
		return 0, err
	}
	r := math.Pow(lengthRatio, 1.0/6)
	return r, fail("Manning ratio", similarity.CheckRatios(similarity.Result{Name: "Manning's n", Value: r}))
}

// MaxCommonDistortion is the largest vertical exaggeration λ_z/λ_x that
// common practice accepts for a distorted river model: river models are
// seldom distorted more than 5 to 10 times (common practice), since
// beyond it the flow's vertical structure (secondary currents,
// separation, the steepened side slopes of a movable bed) departs from
// the prototype's.
const MaxCommonDistortion = 10.0

// DistortionCheck checks a distorted model's vertical exaggeration
// (Distorted.Distortion) against MaxCommonDistortion, an upper limit: a
// model beyond it fails with a warning that its flow's vertical structure
// is not the prototype's. The exaggeration must be at least 1 and finite.
func DistortionCheck(d Distorted) (ScaleCheck, error) {
	x := d.Distortion
	if !(x >= 1) || math.IsInf(x, 0) {
		return ScaleCheck{}, &Error{Op: "distortion check", Fault: similarity.Invalid("", fmt.Sprintf("exaggeration %.4g: want at least 1 and finite (the vertical scale at most the horizontal's 1:x)", x))}
	}
	c := ScaleCheck{Name: "vertical exaggeration λ_z/λ_x", Value: x, Limit: MaxCommonDistortion, Unit: "1", Upper: true,
		Pass:  x <= MaxCommonDistortion,
		Basis: "common practice for river models, seldom distorted more than 5 to 10 times"}
	if !c.Pass {
		c.Warning = "distortion beyond common practice: secondary currents, separation and side slopes (steepened by the exaggeration) are not the prototype's, so velocities, scour and deposition read from this model are unreliable"
	}
	return c, nil
}
