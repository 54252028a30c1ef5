package analysis

import (
	"syscall"
	"testing"
	"time"
)

// cpuTime is the process's CPU time (user + system, garbage collection
// included): on a shared machine it moves less than wall time.
func cpuTime() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}

// reportCPU reports the CPU time per operation from cpu0 (a cpuTime taken
// before the loop) over n operations as cpu-ms/op.
func reportCPU(b *testing.B, cpu0 time.Duration, n int) {
	b.ReportMetric(float64(cpuTime()-cpu0)/float64(time.Millisecond)/float64(max(n, 1)), "cpu-ms/op")
}
