package nasa

import (
	"fmt"
	"testing"
)

type dumpFam struct {
	ineqFamily
}

func (c *dumpFam) slacks(u, s []float64) {
	c.ineqFamily.slacks(u, s)
	fmt.Println("u", u)
	for i, v := range s {
		if v < -1e-8 {
			fmt.Printf("  viol %d %.3e\n", i, v)
		}
	}
}

func TestDebugNNLS(t *testing.T) {
	m := tenSpecies[8]
	cps := make([]float64, len(benson))
	for i, T := range benson {
		cps[i] = m.cp(T)
	}
	cp0, cpInf := ClassicalLimits(m.nAtoms, m.linear, m.rotors)
	ws := newWilhoitWork(7)
	_ = cp0
	_ = cpInf
	_ = ws
}
