package hydraulic_test

import (
	"errors"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// TestModelManningCheckNamesBadInput: a negative prototype n is an
// ErrInvalid *Error whose Fault names it.
func TestModelManningCheckNamesBadInput(t *testing.T) {
	_, err := hydraulic.ModelManningCheck(q.New(-0.014, hydraulic.ManningDim), 0.6)
	var e *hydraulic.Error
	if !errors.As(err, &e) || e.Input != "prototype Manning n" || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("negative n: %v, want an ErrInvalid *hydraulic.Error naming the prototype Manning n", err)
	}
}
