package tunnel_test

import (
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

func loads(N, A, Y, l, m, n float64) tunnel.Loads {
	var L tunnel.Loads
	L[tunnel.NormalForce], L[tunnel.AxialForce], L[tunnel.SideForce] = N, A, Y
	L[tunnel.RollingMoment], L[tunnel.PitchingMoment], L[tunnel.YawingMoment] = l, m, n
	return L
}

// TestAxisTransferByHand: N = 100 N, A = 10 N, Y = 5 N, l = 1, m = 2,
// n = 3 N·m at α = 30°, β = 20° (sin 30° = 0.5, cos 30° = 0.8660254038,
// sin 20° = 0.3420201433, cos 20° = 0.9396926208):
//
//	stability: D_s = 10·0.8660254 + 100·0.5 = 58.660254
//	           L   = 100·0.8660254 − 10·0.5 = 81.602540
//	           l_s = 1·0.8660254 + 3·0.5 = 2.3660254, n_s = 3·0.8660254 − 1·0.5 = 2.0980762
//	wind:      D   = 58.660254·0.9396926 − 5·0.3420201 = 55.122608 − 1.710101 = 53.412507
//	           Y_w = 5·0.9396926 + 58.660254·0.3420201 = 4.698463 + 20.062988 = 24.761451
//	           l_w = 2.3660254·0.9396926 + 2·0.3420201 = 2.223337 + 0.684040 = 2.907377
//	           m_w = 2·0.9396926 − 2.3660254·0.3420201 = 1.879385 − 0.809228 = 1.070158
func TestAxisTransferByHand(t *testing.T) {
	L := loads(100, 10, 5, 1, 2, 3)
	s, err := L.ToStability(30)
	if err != nil {
		t.Fatal(err)
	}
	want := tunnel.AxisLoads{Axes: tunnel.StabilityAxes, Drag: 58.660254, Side: 5, Lift: 81.602540, Roll: 2.3660254, Pitch: 2, Yaw: 2.0980762}
	if d := cmp.Diff(want, s, cmpopts.EquateApprox(0, 1e-6)); d != "" {
		t.Errorf("stability (-hand +got):\n%s", d)
	}
	w, err := L.ToWind(30, 20)
	if err != nil {
		t.Fatal(err)
	}
	want = tunnel.AxisLoads{Axes: tunnel.WindAxes, Drag: 53.412507, Side: 24.761451, Lift: 81.602540, Roll: 2.907377, Pitch: 1.070158, Yaw: 2.0980762}
	if d := cmp.Diff(want, w, cmpopts.EquateApprox(0, 2e-6)); d != "" {
		t.Errorf("wind (-hand +got):\n%s", d)
	}
}

// TestPureDragIsDrag: a force D₀ straight downstream, written in body
// axes from the wind's direction V·(cos α cos β, sin β, sin α cos β) as
// A = D₀ cos α cos β, Y = −D₀ sin β, N = D₀ sin α cos β, resolves in
// wind axes as drag D₀ and nothing else, at any α and β (property).
func TestPureDragIsDrag(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		a := rapid.Float64Range(-90, 90).Draw(rt, "alpha")
		b := rapid.Float64Range(-90, 90).Draw(rt, "beta")
		d0 := rapid.Float64Range(-1e3, 1e3).Draw(rt, "D0")
		ca, sa := math.Cos(a*math.Pi/180), math.Sin(a*math.Pi/180)
		cb, sb := math.Cos(b*math.Pi/180), math.Sin(b*math.Pi/180)
		w, err := loads(d0*sa*cb, d0*ca*cb, -d0*sb, 0, 0, 0).ToWind(a, b)
		if err != nil {
			rt.Fatal(err)
		}
		if math.Abs(w.Drag-d0) > 1e-9*(1+math.Abs(d0)) || math.Abs(w.Lift) > 1e-9*(1+math.Abs(d0)) || math.Abs(w.Side) > 1e-9*(1+math.Abs(d0)) {
			rt.Fatalf("D = %v, L = %v, Y = %v; want %v, 0, 0", w.Drag, w.Lift, w.Side, d0)
		}
	})
}

// TestMomentTransferByHand: N = 100 N, A = 10 N, Y = 5 N, l = 1, m = 2,
// n = 3 N·m at the balance centre; the reference point 0.1 m ahead,
// 0.02 m to starboard and 0.03 m up (z = −0.03 m):
//
//	l' = 1 + 0.02·100 + (−0.03)·5 = 1 + 2 − 0.15 = 2.85
//	m' = 2 + (−0.03)·10 − 0.1·100 = 2 − 0.3 − 10 = −8.3
//	n' = 3 − 0.1·5 − 0.02·10 = 3 − 0.5 − 0.2 = 2.3
//
// — the normal force behind the reference point pitches the nose down
// about it. The same by the cross product M' = M − r × F with
// F = (−A, Y, −N).
func TestMomentTransferByHand(t *testing.T) {
	L := loads(100, 10, 5, 1, 2, 3)
	o := tunnel.Offset{X: q.New(0.1, q.Length), Y: q.New(0.02, q.Length), Z: q.New(-0.03, q.Length)}
	got, err := L.About(o)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(loads(100, 10, 5, 2.85, -8.3, 2.3), got, cmpopts.EquateApprox(0, 1e-12)); d != "" {
		t.Errorf("(-hand +got):\n%s", d)
	}
	r, F := [3]float64{0.1, 0.02, -0.03}, [3]float64{-10, 5, -100}
	cross := [3]float64{r[1]*F[2] - r[2]*F[1], r[2]*F[0] - r[0]*F[2], r[0]*F[1] - r[1]*F[0]}
	for i, c := range []tunnel.Component{tunnel.RollingMoment, tunnel.PitchingMoment, tunnel.YawingMoment} {
		if m := L[c] - cross[i]; math.Abs(got[c]-m) > 1e-12 {
			t.Errorf("%v = %v, by the cross product %v", c, got[c], m)
		}
	}
	if _, err := L.About(tunnel.Offset{X: q.New(0.1, q.Time)}); err == nil {
		t.Error("an offset in seconds accepted")
	} else {
		oneClass(t, err)
	}
}

// TestAttitudeAngles: pitch θ with no roll is α = θ, β = 0; rolled 90°,
// the pitch becomes sideslip: α = 0, β = θ; at θ = 10°, φ = 45°,
// tan α = cos 45°·tan 10° = 0.7071068·0.1763270 = 0.1246822, α = 7.1071°,
// sin β = sin 45°·sin 10° = 0.7071068·0.1736482 = 0.1227878, β = 7.0530°.
func TestAttitudeAngles(t *testing.T) {
	for _, tc := range []struct{ pitch, roll, a, b float64 }{
		{12, 0, 12, 0}, {10, 90, 0, 10}, {10, 45, 7.1071, 7.0530}, {-5, 0, -5, 0},
	} {
		a, b, err := tunnel.Attitude{PitchDeg: tc.pitch, RollDeg: tc.roll}.Angles()
		if err != nil || math.Abs(a-tc.a) > 1e-4 || math.Abs(b-tc.b) > 1e-4 {
			t.Errorf("θ %v, φ %v: α %v, β %v, %v; want %v, %v", tc.pitch, tc.roll, a, b, err, tc.a, tc.b)
		}
	}
	if _, _, err := (tunnel.Attitude{PitchDeg: 200}).Angles(); err == nil {
		t.Error("pitch 200° accepted")
	} else {
		oneClass(t, err)
	}
}

// TestWeightTareByHand: a model of W = 50 N with its CG 0.05 m ahead of
// the balance centre, 0.002 m to starboard and 0.01 m above it
// (z = −0.01 m), pitched −10° … 20° and rolled 0° and 30°. The wind-off
// loads are written out from the weight vector in body axes,
// W·(−sin θ, sin φ cos θ, cos φ cos θ), as N = −W cos φ cos θ,
// A = W sin θ, Y = W sin φ cos θ, l = y·F_z − z·F_y,
// m = z·F_x − x·F_z, n = x·F_y − y·F_x; the fit returns W and the CG,
// and the tare at 7° pitch is the same loads there: level, N = −50 N
// and m = −x·W = −2.5 N·m (the CG ahead pitches the nose down).
func TestWeightTareByHand(t *testing.T) {
	const W, x, y, z = 50.0, 0.05, 0.002, -0.01
	wind := func(th, ph float64) tunnel.Loads {
		st, ct := math.Sin(th*math.Pi/180), math.Cos(th*math.Pi/180)
		sp, cp := math.Sin(ph*math.Pi/180), math.Cos(ph*math.Pi/180)
		Fx, Fy, Fz := -W*st, W*sp*ct, W*cp*ct
		return loads(-Fz, -Fx, Fy, y*Fz-z*Fy, z*Fx-x*Fz, x*Fy-y*Fx)
	}
	var pts []tunnel.TarePoint
	for _, ph := range []float64{0, 30} {
		for th := -10.0; th <= 20; th += 5 {
			pts = append(pts, tunnel.TarePoint{Attitude: tunnel.Attitude{PitchDeg: th, RollDeg: ph}, Loads: wind(th, ph)})
		}
	}
	all := []tunnel.Component{tunnel.NormalForce, tunnel.AxialForce, tunnel.SideForce, tunnel.RollingMoment, tunnel.PitchingMoment, tunnel.YawingMoment}
	tare, err := tunnel.FitWeightTare(pts, all)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(tare.Weight-W) > 1e-12 || math.Abs(tare.CG[0]-x) > 1e-12 || math.Abs(tare.CG[1]-y) > 1e-12 || math.Abs(tare.CG[2]-z) > 1e-12 || len(tare.Unresolved) != 0 {
		t.Errorf("tare %+v; want W 50 N, CG (0.05, 0.002, −0.01) m", tare)
	}
	if d := cmp.Diff(wind(7, 0), tare.Loads(tunnel.Attitude{PitchDeg: 7}), cmpopts.EquateApprox(0, 1e-12)); d != "" {
		t.Errorf("tare at 7° (-hand +got):\n%s", d)
	}
	if l := tare.Loads(tunnel.Attitude{}); math.Abs(l[tunnel.NormalForce]+50) > 1e-12 || math.Abs(l[tunnel.PitchingMoment]+2.5) > 1e-12 {
		t.Errorf("level tare %v: want N = −50 N, m = −2.5 N·m", l)
	}
	// A three-component balance (NF, AF, PM) in pitch only sees x and z
	// of the CG, not y: y is named unresolved.
	var pitchOnly []tunnel.TarePoint
	for _, p := range pts[:7] {
		var l tunnel.Loads
		for _, c := range []tunnel.Component{tunnel.NormalForce, tunnel.AxialForce, tunnel.PitchingMoment} {
			l[c] = p.Loads[c]
		}
		pitchOnly = append(pitchOnly, tunnel.TarePoint{Attitude: p.Attitude, Loads: l})
	}
	tare3, err := tunnel.FitWeightTare(pitchOnly, []tunnel.Component{tunnel.NormalForce, tunnel.AxialForce, tunnel.PitchingMoment})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(tare3.CG[0]-x) > 1e-12 || math.Abs(tare3.CG[2]-z) > 1e-12 || tare3.CG[1] != 0 || !cmp.Equal(tare3.Unresolved, []string{"y_cg"}) {
		t.Errorf("3-component tare %+v", tare3)
	}
	// One attitude cannot separate x from z.
	if _, err := tunnel.FitWeightTare(pts[:1], all); err == nil {
		t.Error("one point accepted")
	} else {
		oneClass(t, err)
	}
}
