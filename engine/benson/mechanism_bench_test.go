package benson

import (
	"bytes"
	"syscall"
	"testing"
	"time"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/internal/mechgen"
)

// mechanismSMILES returns the SMILES of every species of the generated
// 10k-molecule mechanism (20,007 species), in file order.
func mechanismSMILES(tb testing.TB) []string {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	var out []string
	for _, line := range bytes.Split(src, []byte("\n")) {
		f := bytes.Fields(line)
		if len(f) == 3 && string(f[0]) == "species" {
			out = append(out, string(f[2]))
		}
	}
	if len(out) < 20000 {
		tb.Fatalf("%d species in the generated mechanism", len(out))
	}
	return out
}

// BenchmarkEstimateMechanism20k reads and estimates every species of the
// generated 10k-molecule mechanism (20,007 structures) on one goroutine:
// the engine's share of `kiln check` on that file (SMILES reading, groups,
// symmetry number, optical isomers), without the analysis around it.
func BenchmarkEstimateMechanism20k(b *testing.B) {
	list := mechanismSMILES(b)
	b.ReportAllocs()
	cpu0, n := cpuTime(), 0
	defer func() {
		b.ReportMetric(float64(cpuTime()-cpu0)/float64(time.Millisecond)/float64(max(n, 1)), "cpu-ms/op")
	}()
	for b.Loop() {
		n++
		for _, s := range list {
			m, err := molecule.ParseSMILES(s)
			if err != nil {
				b.Fatal(err)
			}
			_, _ = Estimate(m, Options{})
		}
	}
}

// cpuTime is the process's CPU time (user + system, garbage collection
// included): on a shared machine it moves less than wall time.
func cpuTime() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}
