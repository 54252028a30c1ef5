package nasa

import (
	"fmt"
	"math"
	"testing"
)

func TestDebugWilhoitScan(t *testing.T) {
	for _, m := range tenSpecies {
		cps := make([]float64, len(benson))
		for i, T := range benson {
			cps[i] = m.cp(T)
		}
		cp0, cpInf := ClassicalLimits(m.nAtoms, m.linear, m.rotors)
		ws := newWilhoitWork(len(benson))
		line := m.name + ": "
		for i := range 25 {
			B := 30 * math.Exp(float64(i)*math.Log(1000)/24)
			_, sse, ok := wilhoitAtB(benson, cps, cp0, cpInf, B, 4, ws)
			_, sse2, ok2 := refWilhoitAtB(benson, cps, cp0, cpInf, B, 4)
			if ok != ok2 || math.Abs(sse-sse2) > 1e-6*sse2 {
				line += fmt.Sprintf("[%.0f: new %v %.6e ref %v %.6e] ", B, ok, sse, ok2, sse2)
			}
		}
		fmt.Println(line)
		wf, _ := FitWilhoit(benson, cps, cp0, cpInf)
		wr, _ := refFitWilhoit(benson, cps, cp0, cpInf)
		fmt.Printf("  new B=%.2f A=%v\n  ref B=%.2f A=%v\n", wf.B, wf.A, wr.B, wr.A)
	}
}
