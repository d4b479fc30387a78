package tunnel_test

import (
	"errors"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// TestCorrectWalls2DNamesBadInput: a zero test-section height is an
// ErrInvalid *Error whose Fault names the height.
func TestCorrectWalls2DNamesBadInput(t *testing.T) {
	_, err := tunnel.CorrectWalls2D(tunnel.Section2D{Chord: quantity.New(0.3, quantity.Length), Height: quantity.New(0, quantity.Length)})
	var e *tunnel.Error
	if !errors.As(err, &e) || e.Input != "test-section height" || !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("zero height: %v, want an ErrInvalid *tunnel.Error naming the test-section height", err)
	}
}
