package tunnel

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/mat"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Component is one load an internal strain-gauge balance measures, in
// the model's body axes: x forward along the model's reference line, y
// to starboard (the right wing), z down. The signs are the trade's usual
// ones (common practice): normal force positive up (−Z), axial force
// positive aft (−X), side force positive to starboard (+Y); rolling
// moment positive right wing down, pitching moment positive nose up,
// yawing moment positive nose to starboard (right-handed about x, y, z).
// The loads are those the air and the model's weight put on the model,
// which the balance carries.
type Component uint8

// The six components, in the order Loads holds them. Their names in a
// calibration file are the two-letter abbreviations String returns.
const (
	NormalForce    Component = iota // NF, newtons, positive up
	AxialForce                      // AF, newtons, positive aft
	SideForce                       // SF, newtons, positive to starboard
	RollingMoment                   // RM, newton metres, right wing down
	PitchingMoment                  // PM, newton metres, nose up
	YawingMoment                    // YM, newton metres, nose to starboard
	numComponents
)

var componentNames = [numComponents]string{"NF", "AF", "SF", "RM", "PM", "YM"}

// String returns the component's abbreviation: NF, AF, SF, RM, PM or YM.
func (c Component) String() string {
	if c < numComponents {
		return componentNames[c]
	}
	return fmt.Sprintf("Component(%d)", uint8(c))
}

// Dim returns quantity.Force for the three forces and quantity.Torque
// for the three moments.
func (c Component) Dim() quantity.Dim {
	if c <= SideForce {
		return quantity.Force
	}
	return quantity.Torque
}

// Loads are the six body-axis loads on the model about one moment
// centre, forces in newtons and moments in newton metres, with the signs
// of Component. A balance of fewer components leaves the others 0.
type Loads [numComponents]float64

// Quantity returns component c as a Quantity (a force or a torque).
func (l Loads) Quantity(c Component) quantity.Quantity {
	if c >= numComponents {
		return quantity.Quantity{}
	}
	return quantity.New(l[c], c.Dim())
}

// Sub returns l − m, component by component.
func (l Loads) Sub(m Loads) Loads {
	for i := range l {
		l[i] -= m[i]
	}
	return l
}

// finite reports whether every load is finite.
func (l Loads) finite() bool {
	for _, v := range l {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// Form says which way a balance's calibration matrix runs.
type Form uint8

const (
	// LoadsFromReadings is the direct form: F = C₁·R + C₂·q(R), the
	// loads computed from the readings with no iteration.
	LoadsFromReadings Form = iota + 1
	// ReadingsFromLoads is the form the calibration fit produces when the
	// readings are regressed on the applied loads: R = C₁·F + C₂·q(F).
	// Loads are recovered by iteration,
	// F₀ = C₁⁻¹·R, F_{k+1} = C₁⁻¹·(R − C₂·q(F_k)).
	ReadingsFromLoads
)

// String returns the form's name as a calibration file writes it.
func (f Form) String() string {
	if f == LoadsFromReadings || f == ReadingsFromLoads {
		return [...]string{"loads-from-readings", "readings-from-loads"}[f-LoadsFromReadings]
	}
	return fmt.Sprintf("Form(%d)", uint8(f))
}

// MaxComponents is the most components a balance calibration has.
const MaxComponents = int(numComponents)

// MaxBalanceIterations bounds the iterations of a ReadingsFromLoads
// inversion (and of Readings for a LoadsFromReadings calibration); a
// calibration whose interactions are so large that the iteration has not
// settled by then is refused for those readings.
const MaxBalanceIterations = 100

// ComponentRange is one component of a calibration with its calibrated
// load range, in newtons or newton metres: the loads applied in the
// calibration spanned Min … Max, and loads outside it (by more than
// 10⁻⁹ of the span, the rounding of a load recovered at a limit) are
// refused.
type ComponentRange struct {
	// Component is the load component the range is for.
	Component Component
	// Min and Max bound the calibrated load (N for a force, N·m for a
	// moment).
	Min, Max float64
}

// holds reports whether the load v lies in the calibrated range, within
// 10⁻⁹ of its span (the rounding of a load recovered at its limit).
func (cr ComponentRange) holds(v float64) bool {
	tol := 1e-9 * (cr.Max - cr.Min)
	return v >= cr.Min-tol && v <= cr.Max+tol
}

// Calibration is an internal strain-gauge balance's calibration: its
// components, their calibrated ranges and the matrix of first- and
// second-order terms,
//
//	y_i = Σ_j C₁[i][j]·x_j + Σ_{j≤k} C₂[i][jk]·x_j·x_k,
//
// with x the readings and y the loads (LoadsFromReadings), or x the loads
// and y the readings (ReadingsFromLoads). The second-order columns run
// over the pairs j ≤ k in the order (1,1), (1,2), …, (1,n), (2,2), …,
// (n,n): n(n+1)/2 of them. This is the linear-plus-quadratic part of the
// calibration model of AIAA R-091-2003 (Recommended Practice:
// Calibration and Use of Internal Strain-Gage Balances with Application
// to Wind Tunnel Testing), §3.1.1, whose full model for six components
// has 96 terms, with absolute-value and third-order terms besides the
// linear and quadratic ones (its two-component worked example leaves
// them out just as this type does). The absolute-value and third-order
// terms are not modelled here. The practice's iterative method fits the
// readings as functions of the loads and recovers the loads from the
// readings by iteration during the test (the ReadingsFromLoads form; the
// method as NASA Ames' balance papers describe it, e.g. N. Ulbrich,
// Improved Regression Analysis of Temperature-Dependent Strain-Gage
// Balance Calibration Data).
//
// Loads are in SI (N, N·m) and readings in ReadingUnit (mV/V, say),
// as given; the readings are referred to the balance's unloaded zero.
// A Calibration is not changed by its methods and may be used from
// several goroutines.
type Calibration struct {
	name        string
	form        Form
	readingUnit string
	comps       []ComponentRange
	lin         [][]float64
	quad        [][]float64
	inv         [][]float64 // C₁⁻¹
}

// NewCalibration returns a calibration of the given form with the
// components (at most MaxComponents, each once), the n×n first-order
// matrix linear and the n×n(n+1)/2 second-order matrix quadratic (nil
// for none), in SI loads and the reading unit. It refuses a matrix of the
// wrong shape, a value that is not finite, a range that is empty, and a
// first-order matrix that is singular or so ill-conditioned (condition
// number above 10¹⁰) that the loads could not be resolved.
func NewCalibration(name string, form Form, readingUnit string, comps []ComponentRange, linear, quadratic [][]float64) (*Calibration, error) {
	const op = "balance calibration"
	if form != LoadsFromReadings && form != ReadingsFromLoads {
		return nil, &Error{Op: op, Fault: similarity.Invalid("form", "the form must be loads-from-readings or readings-from-loads")}
	}
	n := len(comps)
	if n < 1 || n > MaxComponents {
		return nil, &Error{Op: op, Fault: similarity.Invalid("components", fmt.Sprintf("%d components: a balance has 1 … %d", n, MaxComponents))}
	}
	var seen [numComponents]bool
	c := &Calibration{name: name, form: form, readingUnit: readingUnit, comps: append([]ComponentRange(nil), comps...)}
	for _, cr := range comps {
		if cr.Component >= numComponents || seen[cr.Component] {
			return nil, &Error{Op: op, Fault: similarity.Invalid(cr.Component.String(), "component "+cr.Component.String()+" is unknown or given twice")}
		}
		seen[cr.Component] = true
		if !(cr.Min < cr.Max) || math.IsInf(cr.Min, 0) || math.IsInf(cr.Max, 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(cr.Component.String(), fmt.Sprintf("the calibrated range of %v, %s … %s, must be finite with min < max", cr.Component, sig(cr.Min, 6), sig(cr.Max, 6)))}
		}
	}
	nq := n * (n + 1) / 2
	if quadratic == nil {
		quadratic = make([][]float64, n)
		for i := range quadratic {
			quadratic[i] = make([]float64, nq)
		}
	}
	if len(linear) != n || len(quadratic) != n {
		return nil, &Error{Op: op, Fault: similarity.Invalid("matrix", fmt.Sprintf("the matrix needs %d rows of first- and of second-order terms", n))}
	}
	c.lin, c.quad = make([][]float64, n), make([][]float64, n)
	for i := range n {
		if len(linear[i]) != n || len(quadratic[i]) != nq {
			return nil, &Error{Op: op, Fault: similarity.Invalid(comps[i].Component.String(), fmt.Sprintf("row %v: want %d first-order and %d second-order terms, have %d and %d",
				comps[i].Component, n, nq, len(linear[i]), len(quadratic[i])))}

		}
		for _, v := range append(append([]float64(nil), linear[i]...), quadratic[i]...) {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, &Error{Op: op, Fault: similarity.OutOfRange(comps[i].Component.String(), fmt.Sprintf("row %v: a term is not finite", comps[i].Component))}
			}
		}
		c.lin[i] = append([]float64(nil), linear[i]...)
		c.quad[i] = append([]float64(nil), quadratic[i]...)
	}
	a := mat.NewDense(n, n, nil)
	for i := range n {
		a.SetRow(i, c.lin[i])
	}
	var lu mat.LU
	lu.Factorize(a)
	if cond := lu.Cond(); !(cond <= 1e10) {
		return nil, &Error{Op: op, Fault: similarity.Invalid("matrix", fmt.Sprintf("the first-order matrix is singular or ill-conditioned (condition number %.3g): the components cannot be resolved", cond))}
	}
	var inv mat.Dense
	if err := inv.Inverse(a); err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("matrix", "the first-order matrix cannot be inverted", err)}
	}
	c.inv = make([][]float64, n)
	for i := range n {
		c.inv[i] = mat.Row(nil, i, &inv)
		for _, v := range c.inv[i] {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, &Error{Op: op, Fault: similarity.OutOfRange("matrix", "the inverse of the first-order matrix is not finite")}
			}
		}
	}
	return c, nil
}

// Name returns the calibration's name (free text from the file).
func (c *Calibration) Name() string { return c.name }

// Form returns the calibration's form.
func (c *Calibration) Form() Form { return c.form }

// ReadingUnit returns the unit the readings are given in.
func (c *Calibration) ReadingUnit() string { return c.readingUnit }

// Components returns the components with their calibrated ranges, in
// the order the readings are given.
func (c *Calibration) Components() []ComponentRange {
	return append([]ComponentRange(nil), c.comps...)
}

// evaluate returns y = C₁x + C₂q(x) into y.
func (c *Calibration) evaluate(x, y []float64) {
	n := len(c.comps)
	for i := range n {
		s := 0.0
		for j := range n {
			s += c.lin[i][j] * x[j]
		}
		k := 0
		for j := range n {
			for l := j; l < n; l++ {
				s += c.quad[i][k] * x[j] * x[l]
				k++
			}
		}
		y[i] = s
	}
}

// invert solves y = C₁x + C₂q(x) for x by the fixed-point iteration
// x ← C₁⁻¹(y − C₂q(x)), from x = C₁⁻¹y, to a change of at most 10⁻¹³ of
// |x| (largest component) or MaxBalanceIterations steps.
func (c *Calibration) invert(op string, y, x []float64) error {
	n := len(c.comps)
	var buf [2 * MaxComponents]float64
	r, nx := buf[:n], buf[n:2*n]
	for i := range n {
		x[i] = 0
	}
	for range MaxBalanceIterations + 1 {
		// r = y − C₂q(x): the quadratic part of evaluate.
		for i := range n {
			s := y[i]
			k := 0
			for j := range n {
				for l := j; l < n; l++ {
					s -= c.quad[i][k] * x[j] * x[l]
					k++
				}
			}
			r[i] = s
		}
		d, norm := 0.0, 0.0
		for i := range n {
			s := 0.0
			for j := range n {
				s += c.inv[i][j] * r[j]
			}
			nx[i] = s
			d = math.Max(d, math.Abs(s-x[i]))
			norm = math.Max(norm, math.Abs(s))
		}
		copy(x, nx)
		if math.IsNaN(d) || math.IsInf(norm, 0) {
			break
		}
		if d <= 1e-13*norm {
			return nil
		}
	}
	return &Error{Op: op, Fault: similarity.OutOfRange("readings", fmt.Sprintf("the iteration of the second-order terms did not settle in %d steps: the interactions are too large for these readings", MaxBalanceIterations))}
}

// Loads returns the loads at the balance's moment centre for the
// readings, one per component in the order of Components and in
// ReadingUnit, referred to the unloaded zero. The direct form evaluates
// the matrix; the readings-from-loads form inverts it by iteration. A
// load outside its calibrated range is refused (an *Error of class
// quantity.ErrRange naming the component): the calibration says nothing
// there, and the balance may be overloaded.
func (c *Calibration) Loads(readings []float64) (Loads, error) {
	const op = "balance reduction"
	n := len(c.comps)
	if len(readings) != n {
		return Loads{}, &Error{Op: op, Fault: similarity.Invalid("readings", fmt.Sprintf("%d readings for a %d-component balance", len(readings), n))}
	}
	for i, v := range readings {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return Loads{}, &Error{Op: op, Fault: similarity.OutOfRange(c.comps[i].Component.String(), fmt.Sprintf("the %v reading is not finite", c.comps[i].Component))}
		}
	}
	var buf [MaxComponents]float64
	f := buf[:n]
	if c.form == LoadsFromReadings {
		c.evaluate(readings, f)
	} else if err := c.invert(op, readings, f); err != nil {
		return Loads{}, err
	}
	var l Loads
	for i, cr := range c.comps {
		if !cr.holds(f[i]) {
			return Loads{}, &Error{Op: op, Fault: similarity.OutOfRange(cr.Component.String(), fmt.Sprintf("%v = %.6g %s is outside the calibrated range %s … %s: the calibration does not hold there and the balance may be overloaded",
				cr.Component, f[i], unitOf(cr.Component), sig(cr.Min, 6), sig(cr.Max, 6)))}

		}
		l[cr.Component] = f[i]
	}
	return l, nil
}

// Readings returns the readings the balance gives under the loads (the
// components not in the calibration are ignored): the inverse of Loads,
// for checking a calibration and for simulating a balance. Loads outside
// the calibrated range are refused as Loads refuses them.
func (c *Calibration) Readings(l Loads) ([]float64, error) {
	const op = "balance readings"
	n := len(c.comps)
	f := make([]float64, n)
	for i, cr := range c.comps {
		f[i] = l[cr.Component]
		if !cr.holds(f[i]) {
			return nil, &Error{Op: op, Fault: similarity.OutOfRange(cr.Component.String(), fmt.Sprintf("%v = %.6g %s is outside the calibrated range %s … %s", cr.Component, f[i], unitOf(cr.Component), sig(cr.Min, 6), sig(cr.Max, 6)))}
		}
	}
	r := make([]float64, n)
	if c.form == ReadingsFromLoads {
		c.evaluate(f, r)
	} else if err := c.invert(op, f, r); err != nil {
		return nil, err
	}
	for i, v := range r {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, &Error{Op: op, Fault: similarity.OutOfRange(c.comps[i].Component.String(), "a reading is not finite")}
		}
	}
	return r, nil
}

// unitOf returns the SI unit of a component's load.
func unitOf(c Component) string {
	if c <= SideForce {
		return "N"
	}
	return "N·m"
}

// String summarises the calibration in one line.
func (c *Calibration) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "%d-component balance", len(c.comps))
	if c.name != "" {
		fmt.Fprintf(&b, " %q", c.name)
	}
	fmt.Fprintf(&b, ", %v, readings in %s:", c.form, c.readingUnit)
	for _, cr := range c.comps {
		fmt.Fprintf(&b, " %v %g…%g %s", cr.Component, cr.Min, cr.Max, unitOf(cr.Component))
	}
	return b.String()
}
