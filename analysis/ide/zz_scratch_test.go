package ide

import (
	"context"
	"fmt"
	"os"
	"testing"

	"kiln.dev/kiln/analysis"
)

func TestZZScratch(t *testing.T) {
	src, _ := os.ReadFile(os.Getenv("SCR"))
	ws := analysis.NewWorkspace("/tmp/scr", os.ReadFile, analysis.DefaultSettings())
	ws.SetOverlay("/tmp/scr/a.kiln", src)
	r, err := ws.Analyze(context.Background(), "/tmp/scr/a.kiln")
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range r.Diagnostics {
		p := r.File.Lines.Position(d.Span.Start)
		fmt.Printf("%d:%d %s %s: %s\n", p.Line+1, p.Col, d.Severity, d.Code, d.Message)
	}
	x := NewIndex(r)
	if w := os.Getenv("HOVER"); w != "" {
		var off int
		fmt.Sscan(w, &off)
		h, _ := Hover(x, r.Path, off, analysis.DefaultSettings(), true)
		fmt.Println(h.Text)
	}
	for _, h := range InlayHints(x, r.Path, 0, len(src)+1, analysis.DefaultSettings()) {
		fmt.Println("hint", r.File.Lines.Position(h.Offset).Line+1, h.Label)
	}
}
