package parquetfile

import (
	"bytes"
	"os"
	"strconv"
	"syscall"
	"testing"
)

// limitMemory limits the address space of the process to what it maps
// now plus extra bytes (RLIMIT_AS), so that an allocation beyond that
// fails. The race detector maps terabytes of shadow memory, so a race
// build is left unlimited.
func limitMemory(t *testing.T, extra uint64) {
	if raceEnabled {
		return
	}
	status, err := os.ReadFile("/proc/self/status")
	if err != nil {
		t.Fatal(err)
	}
	i := bytes.Index(status, []byte("VmSize:"))
	if i < 0 {
		t.Fatal("no VmSize in /proc/self/status")
	}
	f := bytes.Fields(status[i+len("VmSize:"):])
	kb, err := strconv.ParseUint(string(f[0]), 10, 64)
	if err != nil {
		t.Fatal(err)
	}
	lim := kb<<10 + extra
	if err := syscall.Setrlimit(syscall.RLIMIT_AS, &syscall.Rlimit{Cur: lim, Max: lim}); err != nil {
		t.Fatal(err)
	}
}
