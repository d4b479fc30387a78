package tunnel_test

import (
	"reflect"
	"strings"
	"testing"

	"similis.dev/similis/similarity/tunnel"
)

// TestAngleFieldsSayDegrees: every exported angle field (an α, a β, a
// tail angle, an attitude) and every slope per degree states its unit in
// its name, so that a caller cannot pass radians where degrees are meant.
func TestAngleFieldsSayDegrees(t *testing.T) {
	angleWords := []string{"Alpha", "Angle", "Pitch", "Roll", "Slope"}
	for _, v := range []any{tunnel.Section2D{}, tunnel.Corrected2D{}, tunnel.Model3D{}, tunnel.Corrected3D{},
		tunnel.Reduced{}, tunnel.Attitude{}, tunnel.Polar{}} {
		typ := reflect.TypeOf(v)
		for i := range typ.NumField() {
			f := typ.Field(i)
			isAngle := false
			for _, w := range angleWords {
				isAngle = isAngle || strings.Contains(f.Name, w)
			}
			if typ.Name() == "Reduced" && f.Name == "BetaDeg" {
				continue
			}
			if isAngle && !strings.HasSuffix(f.Name, "Deg") {
				t.Errorf("%s.%s: an angle (or a slope per angle) without Deg in its name", typ.Name(), f.Name)
			}
		}
	}
	if _, ok := reflect.TypeOf(tunnel.Reduced{}).FieldByName("BetaDeg"); !ok {
		t.Error("Reduced has no BetaDeg: the sideslip does not state its unit")
	}
}
