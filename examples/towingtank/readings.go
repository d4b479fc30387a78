package main

import (
	"math"

	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// The invented record (speeds, resistances, dbResistances, owRuns) was
// taken in fresh water at recordTemperature. Its hull has the invented
// form factor hullFormFactor, by which readingsAt re-makes the record
// for another tank temperature.
const (
	recordTemperature = 15.0 // °C
	hullFormFactor    = 1.13 // 1 + k of the invented hull
)

// readings are the invented tests' readings in the tank's water: the
// resistance test's R (N) at speeds, the double-body test's R (N) at
// dbSpeeds, and the open-water runs' V_A (m/s), T (N) and Q (N·m).
type readings struct {
	Resistances []float64
	DoubleBody  []float64
	OpenWater   [][3]float64
}

// readingsAt returns the invented readings as the tests would give them
// in the tank water tank, consistently with the record taken at
// recordTemperature:
//   - each resistance run holds its wave-making part C_W = C_TM −
//     (1 + k)·C_FM, with the hull's 1 + k = hullFormFactor and the
//     ITTC-1957 C_FM at the run's Reynolds number, so that at the new
//     kinematic viscosity C_TM = (1 + k)·C_FM(Re) + C_W and R =
//     C_TM·½ρV²S (Froude's hypothesis with a form factor);
//   - each double-body run holds its own viscous form factor
//     C_V/C_F, so R = (C_V/C_F)·C_F(Re)·½ρV²·2S;
//   - each open-water run holds its K_T and K_Q (the propeller's small
//     Reynolds-number effect neglected), so T and Q go with ρ.
//
// Readings are rounded to the resolution the record gives them in (1 mN
// for a resistance, 10 mN for a double-body resistance and a thrust,
// 0.1 mN·m for a torque), so that at recordTemperature they are the
// record itself.
func readingsAt(tank fluids.State) (readings, error) {
	ref, err := fluids.FreshWater().AtCelsius(recordTemperature)
	if err != nil {
		return readings{}, err
	}
	rho0, nu0 := ref.Density.Value(), ref.KinematicViscosity.Value()
	rho, nu := tank.Density.Value(), tank.KinematicViscosity.Value()
	cf := ship.LineITTC1957.CF
	round := func(x, per float64) float64 { return math.Round(x*per) / per }
	var out readings
	for i, v := range speeds {
		c0, err := cf(v * modelLength / nu0)
		if err != nil {
			return readings{}, err
		}
		c, err := cf(v * modelLength / nu)
		if err != nil {
			return readings{}, err
		}
		cw := resistances[i]/(0.5*rho0*v*v*modelArea) - hullFormFactor*c0
		out.Resistances = append(out.Resistances, round((hullFormFactor*c+cw)*0.5*rho*v*v*modelArea, 1e3))
	}
	for i, v := range dbSpeeds {
		c0, err := cf(v * modelLength / nu0)
		if err != nil {
			return readings{}, err
		}
		c, err := cf(v * modelLength / nu)
		if err != nil {
			return readings{}, err
		}
		k := dbResistances[i] / (0.5 * rho0 * v * v * 2 * modelArea) / c0
		out.DoubleBody = append(out.DoubleBody, round(k*c*0.5*rho*v*v*2*modelArea, 1e2))
	}
	for _, r := range owRuns {
		out.OpenWater = append(out.OpenWater, [3]float64{r[0], round(r[1]*rho/rho0, 1e2), round(r[2]*rho/rho0, 1e4)})
	}
	return out, nil
}
