package main

import (
	"context"
	"fmt"
	"os"
	"runtime"
	"runtime/pprof"

	"kiln.dev/kiln/analysis"
)

func main() {
	src, _ := os.ReadFile("/tmp/gen10k.kiln")
	ws := analysis.NewWorkspace("", func(string) ([]byte, error) { return nil, os.ErrNotExist }, analysis.DefaultSettings())
	ws.SetOverlay("g.kiln", src)
	res, err := ws.Analyze(context.Background(), "g.kiln")
	if err != nil {
		panic(err)
	}
	runtime.GC()
	f, _ := os.Create("/tmp/heap.prof")
	pprof.WriteHeapProfile(f)
	f.Close()
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	fmt.Println(len(res.Species), ms.HeapInuse>>20, "MiB in use")
}
