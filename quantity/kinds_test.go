package quantity_test

import (
	"testing"

	q "similis.dev/similis/quantity"
)

// TestKindConstants checks every kind constant, written as a sum of base
// encodings, against the dimension built from its exponents.
func TestKindConstants(t *testing.T) {
	cases := []struct {
		name      string
		got, want q.Dim
	}{
		{"Length", q.Length, q.MustDim(1, 0, 0, 0, 0, 0, 0)},
		{"Mass", q.Mass, q.MustDim(0, 1, 0, 0, 0, 0, 0)},
		{"Time", q.Time, q.MustDim(0, 0, 1, 0, 0, 0, 0)},
		{"Current", q.Current, q.MustDim(0, 0, 0, 1, 0, 0, 0)},
		{"Temperature", q.Temperature, q.MustDim(0, 0, 0, 0, 1, 0, 0)},
		{"Amount", q.Amount, q.MustDim(0, 0, 0, 0, 0, 1, 0)},
		{"LuminousIntensity", q.LuminousIntensity, q.MustDim(0, 0, 0, 0, 0, 0, 1)},
		{"Area", q.Area, q.MustDim(2, 0, 0, 0, 0, 0, 0)},
		{"Volume", q.Volume, q.MustDim(3, 0, 0, 0, 0, 0, 0)},
		{"Wavenumber", q.Wavenumber, q.MustDim(-1, 0, 0, 0, 0, 0, 0)},
		{"Velocity", q.Velocity, q.MustDim(1, 0, -1, 0, 0, 0, 0)},
		{"Acceleration", q.Acceleration, q.MustDim(1, 0, -2, 0, 0, 0, 0)},
		{"Frequency", q.Frequency, q.MustDim(0, 0, -1, 0, 0, 0, 0)},
		{"AngularAcceleration", q.AngularAcceleration, q.MustDim(0, 0, -2, 0, 0, 0, 0)},
		{"Force", q.Force, q.MustDim(1, 1, -2, 0, 0, 0, 0)},
		{"Pressure", q.Pressure, q.MustDim(-1, 1, -2, 0, 0, 0, 0)},
		{"Energy", q.Energy, q.MustDim(2, 1, -2, 0, 0, 0, 0)},
		{"Power", q.Power, q.MustDim(2, 1, -3, 0, 0, 0, 0)},
		{"Momentum", q.Momentum, q.MustDim(1, 1, -1, 0, 0, 0, 0)},
		{"AngularMomentum", q.AngularMomentum, q.MustDim(2, 1, -1, 0, 0, 0, 0)},
		{"MomentOfInertia", q.MomentOfInertia, q.MustDim(2, 1, 0, 0, 0, 0, 0)},
		{"Density", q.Density, q.MustDim(-3, 1, 0, 0, 0, 0, 0)},
		{"SpecificVolume", q.SpecificVolume, q.MustDim(3, -1, 0, 0, 0, 0, 0)},
		{"SpecificWeight", q.SpecificWeight, q.MustDim(-2, 1, -2, 0, 0, 0, 0)},
		{"DynamicViscosity", q.DynamicViscosity, q.MustDim(-1, 1, -1, 0, 0, 0, 0)},
		{"KinematicViscosity", q.KinematicViscosity, q.MustDim(2, 0, -1, 0, 0, 0, 0)},
		{"SurfaceTension", q.SurfaceTension, q.MustDim(0, 1, -2, 0, 0, 0, 0)},
		{"MassFlowRate", q.MassFlowRate, q.MustDim(0, 1, -1, 0, 0, 0, 0)},
		{"VolumeFlowRate", q.VolumeFlowRate, q.MustDim(3, 0, -1, 0, 0, 0, 0)},
		{"MassFlux", q.MassFlux, q.MustDim(-2, 1, -1, 0, 0, 0, 0)},
		{"Compressibility", q.Compressibility, q.MustDim(1, -1, 2, 0, 0, 0, 0)},
		{"HeatFluxDensity", q.HeatFluxDensity, q.MustDim(0, 1, -3, 0, 0, 0, 0)},
		{"ThermalConductivity", q.ThermalConductivity, q.MustDim(1, 1, -3, 0, -1, 0, 0)},
		{"HeatTransferCoefficient", q.HeatTransferCoefficient, q.MustDim(0, 1, -3, 0, -1, 0, 0)},
		{"HeatCapacity", q.HeatCapacity, q.MustDim(2, 1, -2, 0, -1, 0, 0)},
		{"SpecificHeatCapacity", q.SpecificHeatCapacity, q.MustDim(2, 0, -2, 0, -1, 0, 0)},
		{"SpecificEnergy", q.SpecificEnergy, q.MustDim(2, 0, -2, 0, 0, 0, 0)},
		{"ThermalExpansion", q.ThermalExpansion, q.MustDim(0, 0, 0, 0, -1, 0, 0)},
		{"TemperatureGradient", q.TemperatureGradient, q.MustDim(-1, 0, 0, 0, 1, 0, 0)},
		{"MolarMass", q.MolarMass, q.MustDim(0, 1, 0, 0, 0, -1, 0)},
		{"Concentration", q.Concentration, q.MustDim(-3, 0, 0, 0, 0, 1, 0)},
		{"Charge", q.Charge, q.MustDim(0, 0, 1, 1, 0, 0, 0)},
		{"Voltage", q.Voltage, q.MustDim(2, 1, -3, -1, 0, 0, 0)},
		{"Resistance", q.Resistance, q.MustDim(2, 1, -3, -2, 0, 0, 0)},
		{"Conductance", q.Conductance, q.MustDim(-2, -1, 3, 2, 0, 0, 0)},
		{"Capacitance", q.Capacitance, q.MustDim(-2, -1, 4, 2, 0, 0, 0)},
		{"Inductance", q.Inductance, q.MustDim(2, 1, -2, -2, 0, 0, 0)},
		{"MagneticFlux", q.MagneticFlux, q.MustDim(2, 1, -2, -1, 0, 0, 0)},
		{"MagneticFluxDensity", q.MagneticFluxDensity, q.MustDim(0, 1, -2, -1, 0, 0, 0)},
		{"CatalyticActivity", q.CatalyticActivity, q.MustDim(0, 0, -1, 0, 0, 1, 0)},
		{"Illuminance", q.Illuminance, q.MustDim(-2, 0, 0, 0, 0, 0, 1)},
		{"AbsorbedDose", q.AbsorbedDose, q.MustDim(2, 0, -2, 0, 0, 0, 0)},
		{"StressIntensityFactor", q.StressIntensityFactor, q.MustParseDim("L^(-1/2) M T^-2")},
	}
	for _, c := range cases {
		if c.got != c.want {
			t.Errorf("%s = %v, want %v", c.name, c.got, c.want)
		}
	}
	if q.Dimensionless != (q.Dim(0)) || !q.Dimensionless.IsDimensionless() {
		t.Error("Dimensionless")
	}
}
