package quantity

import (
	"strings"
	"sync"
)

// The kinds are constants: the encoding of Dim (see Dim) is linear, so a
// dimension is the sum of its base dimensions' encodings times their
// exponents, modulo 2⁶⁴ (wrap adds 2⁶⁴ to a negative sum).
const (
	dimL  = 6 << (9 * iota) // L, in sixths
	dimM                    // M
	dimT                    // T
	dimI                    // I
	dimTh                   // Θ
	dimN                    // N
	dimJ                    // J
	wrap  = 1 << 64
)

// Dimensions of kinds of quantity met in fluids and heat-transfer work,
// named as in ISO 80000-3 (space and time), -4 (mechanics), -5
// (thermodynamics) and -6 (electromagnetism). Several kinds share a
// dimension (energy and torque, frequency and angular velocity); the
// dimension alone cannot tell them apart.
// They are constants, so no caller can change another's.
const (
	Length            Dim = dimL
	Mass              Dim = dimM
	Time              Dim = dimT
	Current           Dim = dimI
	Temperature       Dim = dimTh
	Amount            Dim = dimN
	LuminousIntensity Dim = dimJ

	Area                    Dim = 2 * dimL
	Volume                  Dim = 3 * dimL
	Wavenumber              Dim = wrap - dimL
	Velocity                Dim = wrap + dimL - dimT
	Acceleration            Dim = wrap + dimL - 2*dimT
	Frequency               Dim = wrap - dimT
	AngularVelocity         Dim = Frequency
	AngularAcceleration     Dim = wrap - 2*dimT
	Force                   Dim = wrap + dimL + dimM - 2*dimT
	Pressure                Dim = wrap - dimL + dimM - 2*dimT
	Energy                  Dim = wrap + 2*dimL + dimM - 2*dimT
	Torque                  Dim = Energy
	Power                   Dim = wrap + 2*dimL + dimM - 3*dimT
	Momentum                Dim = wrap + dimL + dimM - dimT
	AngularMomentum         Dim = wrap + 2*dimL + dimM - dimT
	MomentOfInertia         Dim = 2*dimL + dimM
	Density                 Dim = -3*dimL + dimM
	SpecificVolume          Dim = wrap + 3*dimL - dimM
	SpecificWeight          Dim = wrap - 2*dimL + dimM - 2*dimT
	DynamicViscosity        Dim = wrap - dimL + dimM - dimT
	KinematicViscosity      Dim = wrap + 2*dimL - dimT
	ThermalDiffusivity      Dim = KinematicViscosity
	SurfaceTension          Dim = wrap + dimM - 2*dimT
	MassFlowRate            Dim = wrap + dimM - dimT
	VolumeFlowRate          Dim = wrap + 3*dimL - dimT
	MassFlux                Dim = wrap - 2*dimL + dimM - dimT
	Compressibility         Dim = dimL - dimM + 2*dimT
	HeatFluxDensity         Dim = wrap + dimM - 3*dimT
	ThermalConductivity     Dim = wrap + dimL + dimM - 3*dimT - dimTh
	HeatTransferCoefficient Dim = wrap + dimM - 3*dimT - dimTh
	HeatCapacity            Dim = wrap + 2*dimL + dimM - 2*dimT - dimTh
	SpecificHeatCapacity    Dim = wrap + 2*dimL - 2*dimT - dimTh
	SpecificEnergy          Dim = wrap + 2*dimL - 2*dimT
	ThermalExpansion        Dim = wrap - dimTh
	TemperatureGradient     Dim = -dimL + dimTh
	MolarMass               Dim = wrap + dimM - dimN
	Concentration           Dim = -3*dimL + dimN
	Charge                  Dim = dimT + dimI
	Voltage                 Dim = wrap + 2*dimL + dimM - 3*dimT - dimI
	Resistance              Dim = wrap + 2*dimL + dimM - 3*dimT - 2*dimI
	Conductance             Dim = -2*dimL - dimM + 3*dimT + 2*dimI
	Capacitance             Dim = -2*dimL - dimM + 4*dimT + 2*dimI
	Inductance              Dim = wrap + 2*dimL + dimM - 2*dimT - 2*dimI
	MagneticFlux            Dim = wrap + 2*dimL + dimM - 2*dimT - dimI
	MagneticFluxDensity     Dim = wrap + dimM - 2*dimT - dimI
	CatalyticActivity       Dim = -dimT + dimN
	Illuminance             Dim = -2*dimL + dimJ
	AbsorbedDose            Dim = wrap + 2*dimL - 2*dimT
	// StressIntensityFactor is the dimension of fracture toughness,
	// M L^(-1/2) T⁻² (MPa·√m).
	StressIntensityFactor Dim = wrap - dimL/2 + dimM - 2*dimT
)

// Kind is a named kind of quantity with its dimension.
type Kind struct {
	Name string // the ISO 80000 name, lower case: "dynamic viscosity"
	Dim  Dim
}

// kinds lists the named kinds; where several share a dimension, the first
// listed is the one a bare dimension most often means in fluids work.
var kinds = []Kind{
	{"dimensionless", Dimensionless},
	{"length", Length},
	{"mass", Mass},
	{"time", Time},
	{"electric current", Current},
	{"thermodynamic temperature", Temperature},
	{"amount of substance", Amount},
	{"luminous intensity", LuminousIntensity},
	{"area", Area},
	{"volume", Volume},
	{"wavenumber", Wavenumber},
	{"velocity", Velocity},
	{"acceleration", Acceleration},
	{"frequency", Frequency},
	{"angular velocity", AngularVelocity},
	{"angular acceleration", AngularAcceleration},
	{"force", Force},
	{"pressure", Pressure},
	{"stress", Pressure},
	{"energy", Energy},
	{"work", Energy},
	{"torque", Torque},
	{"power", Power},
	{"momentum", Momentum},
	{"angular momentum", AngularMomentum},
	{"moment of inertia", MomentOfInertia},
	{"density", Density},
	{"specific volume", SpecificVolume},
	{"specific weight", SpecificWeight},
	{"dynamic viscosity", DynamicViscosity},
	{"kinematic viscosity", KinematicViscosity},
	{"thermal diffusivity", ThermalDiffusivity},
	{"diffusion coefficient", KinematicViscosity},
	{"surface tension", SurfaceTension},
	{"mass flow rate", MassFlowRate},
	{"volume flow rate", VolumeFlowRate},
	{"mass flux", MassFlux},
	{"compressibility", Compressibility},
	{"heat flux density", HeatFluxDensity},
	{"thermal conductivity", ThermalConductivity},
	{"heat transfer coefficient", HeatTransferCoefficient},
	{"heat capacity", HeatCapacity},
	{"entropy", HeatCapacity},
	{"specific heat capacity", SpecificHeatCapacity},
	{"specific energy", SpecificEnergy},
	{"cubic expansion coefficient", ThermalExpansion},
	{"temperature gradient", TemperatureGradient},
	{"molar mass", MolarMass},
	{"amount concentration", Concentration},
	{"electric charge", Charge},
	{"voltage", Voltage},
	{"resistance", Resistance},
	{"conductance", Conductance},
	{"capacitance", Capacitance},
	{"inductance", Inductance},
	{"magnetic flux", MagneticFlux},
	{"magnetic flux density", MagneticFluxDensity},
	{"catalytic activity", CatalyticActivity},
	{"illuminance", Illuminance},
	{"stress intensity factor", StressIntensityFactor},
}

var kindIndex = sync.OnceValues(func() (map[Dim][]string, map[string]Dim) {
	byDim := make(map[Dim][]string)
	byName := make(map[string]Dim)
	for _, k := range kinds {
		byDim[k.Dim] = append(byDim[k.Dim], k.Name)
		byName[k.Name] = k.Dim
	}
	return byDim, byName
})

// Kinds returns a copy of the table of named kinds of quantity.
func Kinds() []Kind { return append([]Kind(nil), kinds...) }

// KindNames returns the names of the kinds of quantity with dimension d,
// most common first, or nil if none is known.
func KindNames(d Dim) []string {
	byDim, _ := kindIndex()
	return append([]string(nil), byDim[d]...)
}

// KindName names d by the kinds of quantity it is the dimension of,
// joined by commas ("pressure, stress"), or returns "" if none is known.
func KindName(d Dim) string {
	byDim, _ := kindIndex()
	return strings.Join(byDim[d], ", ")
}

// KindDim returns the dimension of the named kind of quantity (the names
// of KindNames, case-insensitive) and whether it is known.
func KindDim(name string) (Dim, bool) {
	_, byName := kindIndex()
	d, ok := byName[strings.ToLower(strings.TrimSpace(name))]
	return d, ok
}
