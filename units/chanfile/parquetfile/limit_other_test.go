//go:build !linux

package parquetfile

import "testing"

// limitMemory does nothing where RLIMIT_AS is not at hand: the tests
// still check the refusals, without the bound on the address space.
func limitMemory(t *testing.T, extra uint64) {}
