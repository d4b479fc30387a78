package chanfile_test

import (
	"errors"

	"similis.dev/similis/quantity"
)

// classes counts the error classes of package quantity that err matches.
func classes(err error) int {
	n := 0
	for _, c := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
		if errors.Is(err, c) {
			n++
		}
	}
	return n
}
