package nasa

import (
	"fmt"
	"math"
	"testing"
)

type countFam struct {
	ineqFamily
	calls int
}

func (c *countFam) slacks(u, s []float64) { c.calls++; c.ineqFamily.slacks(u, s) }

func TestDebugRounds(t *testing.T) {
	m := tenSpecies[8]
	cps := make([]float64, len(benson))
	for i, T := range benson {
		cps[i] = m.cp(T)
	}
	cp0, cpInf := ClassicalLimits(m.nAtoms, m.linear, m.rotors)
	d := cpInf - cp0
	for i := range 25 {
		B := 30 * math.Exp(float64(i)*math.Log(1000)/24)
		nA := 4
		n := len(benson)
		a := make([]float64, n*nA)
		b := make([]float64, n)
		cs := make([]float64, nA)
		for i, T := range benson {
			y := T / (T + B)
			base := d * y * y * (y - 1) / cps[i]
			yk := 1.0
			for k := range nA {
				a[i*nA+k] = base * yk
				cs[k] += a[i*nA+k] * a[i*nA+k]
				yk *= y
			}
			b[i] = (cps[i] - cp0 - d*y*y) / cps[i]
		}
		for k := range cs {
			cs[k] = 1 / math.Sqrt(cs[k])
		}
		for i := range n {
			for k := range nA {
				a[i*nA+k] *= cs[k]
			}
		}
		householderQR(a, n, nA, b)
		cf := &countFam{ineqFamily: &scaledFamily{inner: &wilhoitIneq{nA: 4}, scale: cs}}
		u := make([]float64, 4)
		backSolve(a, nA, nA, b, u)
		w0 := Wilhoit{A: [4]float64(u)}
		for k := range u {
			w0.A[k] *= cs[k]
		}
		err := lsi(a, nA, nA, b[:nA], cf, 1e-8, u)
		w := Wilhoit{A: [4]float64(u)}
		for k := range u {
			w.A[k] *= cs[k]
		}
		fmt.Printf("B=%.0f diag=%.1e %.1e %.1e %.1e uncon-mono=%v rounds=%d err=%v exact=%v mono=%v\n", B, a[0], a[5], a[10], a[15], w0.monotone(), cf.calls, err, w.exactlyMonotone(4), w.monotone())
	}
}
