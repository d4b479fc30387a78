package fluids

import (
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

// Geopotential returns the geopotential altitude for a geometric altitude
// z (m): H = r·z/(r + z), r = 6 356 766 m.
func Geopotential(z float64) float64 { return earthR * z / (earthR + z) }

// StandardAtmosphere returns the state of the ISO 2533 standard
// atmosphere at geopotential altitude H (m), from −2 km to 32 km:
// temperature, pressure, density, speed of sound, dynamic and kinematic
// viscosity (Sutherland's law).
func StandardAtmosphere(H float64) (State, error) {
	if !(H >= -2000 && H <= maxAltGP) {
		return State{}, &RangeError{Fluid: "ISO 2533 atmosphere", What: "geopotential altitude (m)", Value: H, Lo: -2000, Hi: maxAltGP}
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
