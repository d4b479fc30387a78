package fluids

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
)

// ISO 2533:1975 standard atmosphere constants.
const (
	g0       = 9.80665   // m/s²
	rAir     = 287.05287 // J/(kg·K)
	earthR   = 6356766.0 // m, nominal radius for geopotential altitude
	p0       = 101325.0  // Pa
	t0       = 288.15    // K
	maxAltGP = 32000.0   // m geopotential, top of the third layer
)

// layers of ISO 2533 up to 32 km geopotential: base altitude (m), base
// temperature (K), lapse rate (K/m).
var layers = []struct{ h, t, beta float64 }{
	{0, 288.15, -0.0065},
	{11000, 216.65, 0},
	{20000, 216.65, 0.001},
}

// Altitude says how an altitude is measured.
type Altitude uint8

// Kinds of altitude.
const (
	// Geometric is the height above mean sea level, as a map or a GPS
	// gives it.
	Geometric Altitude = iota + 1
	// GeopotentialAlt is the geopotential altitude H = r·z/(r + z),
	// r = 6 356 766 m, the argument of the ISO 2533 tables.
	GeopotentialAlt
)

// String names the kind of altitude.
func (a Altitude) String() string {
	switch a {
	case Geometric:
		return "geometric"
	case GeopotentialAlt:
		return "geopotential"
	}
	return fmt.Sprintf("Altitude(%d)", uint8(a))
}

// Geopotential returns the geopotential altitude for a geometric altitude
// z: H = r·z/(r + z), r = 6 356 766 m.
func Geopotential(z quantity.Quantity) (quantity.Quantity, error) {
	if err := z.CheckNamed("geometric altitude", quantity.Length); err != nil {
		return quantity.Quantity{}, err
	}
	if v := z.Value(); !(v > -earthR/2 && v < 10*earthR) {
		return quantity.Quantity{}, &RangeError{Fluid: "ISO 2533 atmosphere", What: "geometric altitude", Value: v, Lo: -earthR / 2, Hi: 10 * earthR, Unit: "m"}
	}
	return quantity.New(geopotential(z.Value()), quantity.Length), nil
}

func geopotential(z float64) float64 { return earthR * z / (earthR + z) }

// StandardAtmosphere returns the state of the ISO 2533 standard
// atmosphere at an altitude h of the kind given, from −2 km to 32 km
// geopotential: temperature, pressure, density, speed of sound, dynamic
// and kinematic viscosity (Sutherland's law).
func StandardAtmosphere(h quantity.Quantity, kind Altitude) (State, error) {
	if err := h.CheckNamed("altitude", quantity.Length); err != nil {
		return State{}, err
	}
	var H float64
	switch kind {
	case Geometric:
		gp, err := Geopotential(h)
		if err != nil {
			return State{}, err
		}
		H = gp.Value()
	case GeopotentialAlt:
		H = h.Value()
	default:
		return State{}, &RangeError{Fluid: "ISO 2533 atmosphere", What: "kind of altitude (Geometric or GeopotentialAlt)", Value: float64(kind), Lo: 1, Hi: 2, Unit: unitOne}
	}
	return standardAtmosphere(H)
}

func standardAtmosphere(H float64) (State, error) {
	if !(H >= -2000 && H <= maxAltGP) {
		return State{}, &RangeError{Fluid: "ISO 2533 atmosphere", What: "geopotential altitude", Value: H, Lo: -2000, Hi: maxAltGP, Unit: "m"}
	}
	p := p0
	var T float64
	for i, l := range layers {
		top := maxAltGP
		if i+1 < len(layers) {
			top = layers[i+1].h
		}
		hh := math.Min(H, top)
		if i == 0 {
			hh = math.Min(H, top) // layer 0 also extends below sea level
		}
		dh := hh - l.h
		if l.beta == 0 {
			T = l.t
			p *= math.Exp(-g0 * dh / (rAir * l.t))
		} else {
			T = l.t + l.beta*dh
			p *= math.Pow(T/l.t, -g0/(l.beta*rAir))
		}
		if H <= top {
			break
		}
	}
	return isoAir.At(quantity.New(T, quantity.Temperature), quantity.New(p, quantity.Pressure))
}
