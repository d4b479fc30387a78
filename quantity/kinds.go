package quantity

import (
	"strings"
	"sync"
)

// Dimensions of kinds of quantity met in fluids and heat-transfer work,
// named as in ISO 80000-3 (space and time), -4 (mechanics), -5
// (thermodynamics) and -6 (electromagnetism). Several kinds share a
// dimension (energy and torque, frequency and angular velocity); the
// dimension alone cannot tell them apart.
var (
	Length            = MustDim(1, 0, 0, 0, 0, 0, 0)
	Mass              = MustDim(0, 1, 0, 0, 0, 0, 0)
	Time              = MustDim(0, 0, 1, 0, 0, 0, 0)
	Current           = MustDim(0, 0, 0, 1, 0, 0, 0)
	Temperature       = MustDim(0, 0, 0, 0, 1, 0, 0)
	Amount            = MustDim(0, 0, 0, 0, 0, 1, 0)
	LuminousIntensity = MustDim(0, 0, 0, 0, 0, 0, 1)

	Area                    = MustDim(2, 0, 0, 0, 0, 0, 0)
	Volume                  = MustDim(3, 0, 0, 0, 0, 0, 0)
	Wavenumber              = MustDim(-1, 0, 0, 0, 0, 0, 0)
	Velocity                = MustDim(1, 0, -1, 0, 0, 0, 0)
	Acceleration            = MustDim(1, 0, -2, 0, 0, 0, 0)
	Frequency               = MustDim(0, 0, -1, 0, 0, 0, 0)
	AngularVelocity         = Frequency
	AngularAcceleration     = MustDim(0, 0, -2, 0, 0, 0, 0)
	Force                   = MustDim(1, 1, -2, 0, 0, 0, 0)
	Pressure                = MustDim(-1, 1, -2, 0, 0, 0, 0)
	Energy                  = MustDim(2, 1, -2, 0, 0, 0, 0)
	Torque                  = Energy
	Power                   = MustDim(2, 1, -3, 0, 0, 0, 0)
	Momentum                = MustDim(1, 1, -1, 0, 0, 0, 0)
	AngularMomentum         = MustDim(2, 1, -1, 0, 0, 0, 0)
	MomentOfInertia         = MustDim(2, 1, 0, 0, 0, 0, 0)
	Density                 = MustDim(-3, 1, 0, 0, 0, 0, 0)
	SpecificVolume          = MustDim(3, -1, 0, 0, 0, 0, 0)
	SpecificWeight          = MustDim(-2, 1, -2, 0, 0, 0, 0)
	DynamicViscosity        = MustDim(-1, 1, -1, 0, 0, 0, 0)
	KinematicViscosity      = MustDim(2, 0, -1, 0, 0, 0, 0)
	ThermalDiffusivity      = KinematicViscosity
	SurfaceTension          = MustDim(0, 1, -2, 0, 0, 0, 0)
	MassFlowRate            = MustDim(0, 1, -1, 0, 0, 0, 0)
	VolumeFlowRate          = MustDim(3, 0, -1, 0, 0, 0, 0)
	MassFlux                = MustDim(-2, 1, -1, 0, 0, 0, 0)
	Compressibility         = MustDim(1, -1, 2, 0, 0, 0, 0)
	HeatFluxDensity         = MustDim(0, 1, -3, 0, 0, 0, 0)
	ThermalConductivity     = MustDim(1, 1, -3, 0, -1, 0, 0)
	HeatTransferCoefficient = MustDim(0, 1, -3, 0, -1, 0, 0)
	HeatCapacity            = MustDim(2, 1, -2, 0, -1, 0, 0)
	SpecificHeatCapacity    = MustDim(2, 0, -2, 0, -1, 0, 0)
	SpecificEnergy          = MustDim(2, 0, -2, 0, 0, 0, 0)
	ThermalExpansion        = MustDim(0, 0, 0, 0, -1, 0, 0)
	TemperatureGradient     = MustDim(-1, 0, 0, 0, 1, 0, 0)
	MolarMass               = MustDim(0, 1, 0, 0, 0, -1, 0)
	Concentration           = MustDim(-3, 0, 0, 0, 0, 1, 0)
	Charge                  = MustDim(0, 0, 1, 1, 0, 0, 0)
	Voltage                 = MustDim(2, 1, -3, -1, 0, 0, 0)
	Resistance              = MustDim(2, 1, -3, -2, 0, 0, 0)
	Conductance             = MustDim(-2, -1, 3, 2, 0, 0, 0)
	Capacitance             = MustDim(-2, -1, 4, 2, 0, 0, 0)
	Inductance              = MustDim(2, 1, -2, -2, 0, 0, 0)
	MagneticFlux            = MustDim(2, 1, -2, -1, 0, 0, 0)
	MagneticFluxDensity     = MustDim(0, 1, -2, -1, 0, 0, 0)
	CatalyticActivity       = MustDim(0, 0, -1, 0, 0, 1, 0)
	Illuminance             = MustDim(-2, 0, 0, 0, 0, 0, 1)
	AbsorbedDose            = MustDim(2, 0, -2, 0, 0, 0, 0)
	// StressIntensityFactor is the dimension of fracture toughness,
	// M L^(-1/2) T⁻² (MPa·√m).
	StressIntensityFactor = MustParseDim("L^(-1/2) M T^-2")
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
