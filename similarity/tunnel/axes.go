package tunnel

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

const deg = math.Pi / 180

// maxAngleDeg bounds an angle of attitude or of the flow: ±180°.
const maxAngleDeg = 180.0

// Axes names a set of axes loads are resolved in.
type Axes uint8

const (
	// StabilityAxes are the body axes turned about y by the angle of
	// attack α: x along the projection of the wind on the model's plane
	// of symmetry.
	StabilityAxes Axes = iota + 1
	// WindAxes are the stability axes turned about their z by the
	// sideslip β: x along the wind.
	WindAxes
)

// String returns "stability axes" or "wind axes".
func (a Axes) String() string {
	if a == StabilityAxes || a == WindAxes {
		return [...]string{"stability axes", "wind axes"}[a-StabilityAxes]
	}
	return fmt.Sprintf("Axes(%d)", uint8(a))
}

// AxisLoads are loads resolved in stability or wind axes, with the
// trade's names and signs (common practice): drag positive downstream
// (−x), lift positive up (−z), side force positive along +y (to
// starboard), and the moments right-handed about x, y, z (rolling
// moment right wing down, pitching moment nose up, yawing moment nose
// to starboard). Forces in newtons, moments in newton metres.
type AxisLoads struct {
	// Axes names the axis system the loads are resolved in.
	Axes Axes
	// Drag, Side and Lift are the forces (N).
	Drag, Side, Lift float64
	// Roll, Pitch and Yaw are the moments (N·m).
	Roll, Pitch, Yaw float64
}

// checkAngle refuses an angle that is not finite or beyond ±180°.
func checkAngle(op, name string, v float64) error {
	if !(v >= -maxAngleDeg && v <= maxAngleDeg) {
		return rangeError(op, name, v, -maxAngleDeg, maxAngleDeg, "")
	}
	return nil
}

// ToStability resolves body-axis loads in stability axes at the angle of
// attack alphaDeg (degrees): a rotation about y by α,
//
//	D = A·cos α + N·sin α,  L = N·cos α − A·sin α,  Y_s = Y,
//	l_s = l·cos α + n·sin α,  m_s = m,  n_s = n·cos α − l·sin α,
//
// with A, N, Y the axial, normal and side forces and l, m, n the body
// moments (signs of Component).
func (l Loads) ToStability(alphaDeg float64) (AxisLoads, error) {
	if err := checkAngle("axis transfer", "angle of attack (°)", alphaDeg); err != nil {
		return AxisLoads{}, err
	}
	if !l.finite() {
		return AxisLoads{}, &Error{Op: "axis transfer", Fault: similarity.OutOfRange("loads", "a load is not finite")}
	}
	s, c := math.Sincos(alphaDeg * deg)
	return resolved(AxisLoads{Axes: StabilityAxes,
		Drag: l[AxialForce]*c + l[NormalForce]*s, Lift: l[NormalForce]*c - l[AxialForce]*s, Side: l[SideForce],
		Roll: l[RollingMoment]*c + l[YawingMoment]*s, Pitch: l[PitchingMoment], Yaw: l[YawingMoment]*c - l[RollingMoment]*s,
	})
}

// resolved returns a, or an *Error of class quantity.ErrRange when a
// component overflowed in the rotation (loads near the float64 limit).
func resolved(a AxisLoads) (AxisLoads, error) {
	for _, v := range [...]float64{a.Drag, a.Side, a.Lift, a.Roll, a.Pitch, a.Yaw} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return AxisLoads{}, &Error{Op: "axis transfer", Fault: similarity.OutOfRange("loads", "a load overflows a float64 when resolved in "+a.Axes.String())}
		}
	}
	return a, nil
}

// ToWind resolves body-axis loads in wind axes at the angle of attack
// alphaDeg and sideslip betaDeg (degrees), the wind meeting the model from
// ahead and from starboard for positive α and β (the wind's components
// in body axes are V·(cos α·cos β, sin β, sin α·cos β)): the stability
// axes turned about z by β,
//
//	D = D_s·cos β − Y·sin β,  Y_w = Y·cos β + D_s·sin β,  L = L_s,
//	l_w = l_s·cos β + m·sin β,  m_w = m·cos β − l_s·sin β,  n_w = n_s.
func (l Loads) ToWind(alphaDeg, betaDeg float64) (AxisLoads, error) {
	s, err := l.ToStability(alphaDeg)
	if err != nil {
		return AxisLoads{}, err
	}
	if err := checkAngle("axis transfer", "sideslip (°)", betaDeg); err != nil {
		return AxisLoads{}, err
	}
	sb, cb := math.Sincos(betaDeg * deg)
	return resolved(AxisLoads{Axes: WindAxes,
		Drag: s.Drag*cb - s.Side*sb, Side: s.Side*cb + s.Drag*sb, Lift: s.Lift,
		Roll: s.Roll*cb + s.Pitch*sb, Pitch: s.Pitch*cb - s.Roll*sb, Yaw: s.Yaw,
	})
}

// Offset is the position of the model's moment reference point relative
// to the balance's moment centre, in body axes (x forward, y to
// starboard, z down).
type Offset struct {
	X, Y, Z quantity.Quantity
}

// maxOffset bounds an offset's components: 100 m.
const maxOffset = 100.0

// About returns the loads about the moment reference point at offset o
// from the balance's moment centre. The forces are unchanged; the
// moments are M' = M − r × F with F = (−A, Y, −N) in body axes:
//
//	l' = l + Δy·N + Δz·Y,  m' = m + Δz·A − Δx·N,  n' = n − Δx·Y − Δy·A.
//
// A zero Offset leaves the loads as they are.
func (l Loads) About(o Offset) (Loads, error) {
	const op = "moment transfer"
	var d [3]float64
	for i, c := range []struct {
		n string
		q quantity.Quantity
	}{{"offset x", o.X}, {"offset y", o.Y}, {"offset z", o.Z}} {
		if c.q == (quantity.Quantity{}) {
			continue
		}
		if err := c.q.CheckNamed(c.n, quantity.Length); err != nil {
			return Loads{}, err
		}
		if !(math.Abs(c.q.Value()) <= maxOffset) {
			return Loads{}, rangeError(op, c.n+" (m)", c.q.Value(), -maxOffset, maxOffset, "")
		}
		d[i] = c.q.Value()
	}
	if !l.finite() {
		return Loads{}, &Error{Op: op, Fault: similarity.OutOfRange("loads", "a load is not finite")}
	}
	dx, dy, dz := d[0], d[1], d[2]
	N, A, Y := l[NormalForce], l[AxialForce], l[SideForce]
	l[RollingMoment] += dy*N + dz*Y
	l[PitchingMoment] += dz*A - dx*N
	l[YawingMoment] += -dx*Y - dy*A
	if !l.finite() {
		return Loads{}, &Error{Op: op, Fault: similarity.OutOfRange("moments", "a transferred moment is out of the range of a float64")}
	}
	return l, nil
}

// Attitude is the model's attitude in the test section: the pitch θ and
// roll φ of its body axes from the horizontal (Euler angles in the order
// yaw, pitch, roll with no yaw), the tunnel's flow horizontal along the
// test section's axis.
type Attitude struct {
	// PitchDeg is the pitch θ (degrees).
	PitchDeg float64
	// RollDeg is the roll φ (degrees).
	RollDeg float64
}

// Angles returns the angle of attack α and sideslip β (degrees) the
// attitude gives in a horizontal stream, from the wind's components in
// body axes V·(cos θ, sin φ·sin θ, cos φ·sin θ):
// tan α = cos φ·tan θ and sin β = sin φ·sin θ. Any flow angularity of
// the tunnel (upflow, crossflow) is to be added by the caller.
func (a Attitude) Angles() (alphaDeg, betaDeg float64, err error) {
	if err := checkAngle("attitude", "pitch (°)", a.PitchDeg); err != nil {
		return 0, 0, err
	}
	if err := checkAngle("attitude", "roll (°)", a.RollDeg); err != nil {
		return 0, 0, err
	}
	st, ct := math.Sincos(a.PitchDeg * deg)
	sp, cp := math.Sincos(a.RollDeg * deg)
	return math.Atan2(cp*st, ct) / deg, math.Asin(math.Max(-1, math.Min(1, sp*st))) / deg, nil
}

// gravity returns the unit weight vector in body axes at the attitude:
// (−sin θ, sin φ·cos θ, cos φ·cos θ).
func (a Attitude) gravity() (gx, gy, gz float64) {
	st, ct := math.Sincos(a.PitchDeg * deg)
	sp, cp := math.Sincos(a.RollDeg * deg)
	return -st, sp * ct, cp * ct
}

// WeightTare is the model's weight and centre of gravity as the balance
// sees them, found from wind-off readings at several attitudes: the
// loads the weight alone puts on the balance at an attitude are Loads,
// to be subtracted from each wind-on point at its attitude.
type WeightTare struct {
	// Weight is the weight carried by the balance (model and any parts
	// ahead of the balance's gauges) (N).
	Weight float64
	// CG is the centre of gravity's position from the balance's moment
	// centre in body axes (x forward, y to starboard, z down) (m);
	// a coordinate the wind-off attitudes cannot resolve (see
	// FitWeightTare) is 0 and listed in Unresolved.
	CG [3]float64
	// Unresolved names the CG coordinates the points could not fix.
	Unresolved []string
	// Points is the number of wind-off attitudes fitted.
	Points int
	// ForceRMS is the root-mean-square residual of the forces about the
	// fitted weight (N).
	ForceRMS float64
	// MomentRMS is the root-mean-square residual of the moments about
	// the fitted weight (N·m).
	MomentRMS float64
}

// TarePoint is one wind-off reading: the attitude and the loads the
// balance reduced from its readings there.
type TarePoint struct {
	Attitude Attitude
	Loads    Loads
}

// MaxTarePoints is the most wind-off points FitWeightTare takes.
const MaxTarePoints = 1 << 12

// Loads returns the loads the weight puts on the balance at the attitude:
// F = W·(−sin θ, sin φ·cos θ, cos φ·cos θ) in body axes (so a normal
// force −W·cos φ·cos θ and an axial force W·sin θ) and the moments
// r_cg × F about the balance's moment centre.
func (t WeightTare) Loads(a Attitude) Loads {
	gx, gy, gz := a.gravity()
	W := t.Weight
	x, y, z := t.CG[0], t.CG[1], t.CG[2]
	Fx, Fy, Fz := W*gx, W*gy, W*gz
	var l Loads
	l[AxialForce], l[SideForce], l[NormalForce] = -Fx, Fy, -Fz
	l[RollingMoment] = y*Fz - z*Fy
	l[PitchingMoment] = z*Fx - x*Fz
	l[YawingMoment] = x*Fy - y*Fx
	return l
}

// FitWeightTare finds the weight and centre of gravity from wind-off
// loads at several attitudes, by least squares over the components the
// balance measures (comps; the others are left out of the fit): first
// the weight W from the forces, F = W·g(θ, φ), then W·r_cg from the
// moments, M = W·r_cg × g, both linear in the unknowns (common practice
// for weight tares; the model is rigid and the balance's deflection under
// the weight is neglected). A CG coordinate the attitudes and measured
// components cannot fix (the design matrix's column is zero or the
// columns dependent, as z_cg is with one pitch angle only) is left 0 and
// named in Unresolved; its contribution to the tares at the fitted
// attitudes is then also 0 wherever the fit could not see it. It
// refuses fewer than two points, a measured-force set that cannot give
// the weight, and a weight that is not positive.
func FitWeightTare(points []TarePoint, comps []Component) (WeightTare, error) {
	const op = "weight tare"
	if len(points) < 2 || len(points) > MaxTarePoints {
		return WeightTare{}, &Error{Op: op, Fault: similarity.Invalid("points", fmt.Sprintf("%d wind-off points: want 2 … %d", len(points), MaxTarePoints))}
	}
	var has [numComponents]bool
	for _, c := range comps {
		if c >= numComponents {
			return WeightTare{}, &Error{Op: op, Fault: similarity.Invalid("components", "unknown component "+c.String())}
		}
		has[c] = true
	}
	// Weight: Σ F·g / Σ g·g over the measured forces.
	num, den := 0.0, 0.0
	for i, p := range points {
		if _, _, err := p.Attitude.Angles(); err != nil {
			return WeightTare{}, &Error{Op: op, Fault: similarity.Caused(fmt.Sprintf("point %d", i+1), fmt.Sprintf("wind-off point %d", i+1), err)}
		}
		if !p.Loads.finite() {
			return WeightTare{}, &Error{Op: op, Fault: similarity.OutOfRange(fmt.Sprintf("point %d", i+1), fmt.Sprintf("wind-off point %d: a load is not finite", i+1))}
		}
		gx, gy, gz := p.Attitude.gravity()
		for _, t := range [][3]float64{{float64(AxialForce), -gx, 0}, {float64(SideForce), gy, 0}, {float64(NormalForce), -gz, 0}} {
			c := Component(t[0])
			if has[c] {
				num += p.Loads[c] * t[1]
				den += t[1] * t[1]
			}
		}
	}
	if !(den > 1e-6) {
		return WeightTare{}, &Error{Op: op, Fault: similarity.Invalid("components", "the measured forces do not see the weight at these attitudes")}
	}
	w := num / den
	if !(w > 0) || math.IsInf(w, 0) {
		return WeightTare{}, &Error{Op: op, Fault: similarity.Invalid("weight", fmt.Sprintf("the fitted weight %.4g N is not positive: check the signs of the wind-off loads", w))}
	}
	t := WeightTare{Weight: w, Points: len(points)}
	var fss float64
	var nf int
	for _, p := range points {
		pred := WeightTare{Weight: w}.Loads(p.Attitude)
		for _, c := range []Component{NormalForce, AxialForce, SideForce} {
			if has[c] {
				d := p.Loads[c] - pred[c]
				fss += d * d
				nf++
			}
		}
	}
	t.ForceRMS = math.Sqrt(fss / float64(nf))
	// Moments: rows M_c = Σ_k a_ck·(W·r_k); unknowns u = W·(x, y, z).
	//   l = y·Fz − z·Fy, m = z·Fx − x·Fz, n = x·Fy − y·Fx, F = W·g.
	var rows [][3]float64
	var rhs []float64
	for _, p := range points {
		gx, gy, gz := p.Attitude.gravity()
		if has[RollingMoment] {
			rows, rhs = append(rows, [3]float64{0, gz, -gy}), append(rhs, p.Loads[RollingMoment])
		}
		if has[PitchingMoment] {
			rows, rhs = append(rows, [3]float64{-gz, 0, gx}), append(rhs, p.Loads[PitchingMoment])
		}
		if has[YawingMoment] {
			rows, rhs = append(rows, [3]float64{gy, -gx, 0}), append(rhs, p.Loads[YawingMoment])
		}
	}
	names := [3]string{"x", "y", "z"}
	// Keep the columns that the rows resolve, by a greedy rank test.
	var keep []int
	for k := range 3 {
		try := append(append([]int(nil), keep...), k)
		if len(rows) >= len(try) && fullRank(rows, try) {
			keep = try
		} else {
			t.Unresolved = append(t.Unresolved, names[k]+"_cg")
		}
	}
	if len(keep) > 0 {
		a := mat.NewDense(len(rows), len(keep), nil)
		for i, r := range rows {
			for j, k := range keep {
				a.Set(i, j, r[k])
			}
		}
		var u mat.Dense
		if err := u.Solve(a, mat.NewVecDense(len(rhs), rhs)); err != nil {
			return WeightTare{}, &Error{Op: op, Fault: similarity.Caused("centre of gravity", "the moments cannot give the centre of gravity", err)}
		}
		for j, k := range keep {
			t.CG[k] = u.At(j, 0) / w
		}
	}
	for _, v := range t.CG {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return WeightTare{}, &Error{Op: op, Fault: similarity.OutOfRange("centre of gravity", "the centre of gravity is out of the range of a float64")}
		}
	}
	if len(rows) > 0 {
		var mss float64
		for _, p := range points {
			pred := t.Loads(p.Attitude)
			for _, c := range []Component{RollingMoment, PitchingMoment, YawingMoment} {
				if has[c] {
					d := p.Loads[c] - pred[c]
					mss += d * d
				}
			}
		}
		t.MomentRMS = math.Sqrt(mss / float64(len(rows)))
	}
	if !allFinite(t.ForceRMS, t.MomentRMS) {
		return WeightTare{}, &Error{Op: op, Fault: similarity.OutOfRange("residuals", "the residuals of the fit are out of the range of a float64")}
	}
	return t, nil
}

// fullRank reports whether the columns cols of rows are independent:
// the smallest singular value is above 10⁻⁶ of the largest (and the
// largest above 10⁻⁹, the columns not all zero).
func fullRank(rows [][3]float64, cols []int) bool {
	a := mat.NewDense(len(rows), len(cols), nil)
	for i, r := range rows {
		for j, k := range cols {
			a.Set(i, j, r[k])
		}
	}
	var svd mat.SVD
	if !svd.Factorize(a, mat.SVDNone) {
		return false
	}
	s := svd.Values(nil)
	return s[0] > 1e-9 && s[len(s)-1] > 1e-6*s[0]
}
