package analysis

import (
	"bytes"
	"context"
	"fmt"
	"os"
	"runtime/pprof"
	"slices"
	"testing"
	"time"

	"kiln.dev/kiln/internal/mechgen"
)

func TestDebugProfile(t *testing.T) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no") }, DefaultSettings())
	ws.SetIncremental(true)
	ws.SetOverlay("gen.kiln", src)
	ws.Analyze(context.Background(), "gen.kiln")
	f, _ := os.Create("/tmp/srv-loop.prof")
	pprof.StartCPUProfile(f)
	t0 := time.Now()
	for i := 0; i < 30; i++ {
		at := bytes.Index(src, []byte("species M5000 "))
		ws.SetOverlay("gen.kiln", slices.Concat(src[:at], []byte(fmt.Sprintf("# remark %d\n", i)), src[at:]))
		ws.Analyze(context.Background(), "gen.kiln")
	}
	pprof.StopCPUProfile()
	t.Logf("%v per edit", time.Since(t0)/30)
}
