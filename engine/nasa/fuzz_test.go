package nasa

import (
	"encoding/binary"
	"math"
	"testing"
)

// decodePoints reads (T, Cp) pairs as little-endian float64s, at most 40.
func decodePoints(data []byte) (T, Cp []float64) {
	for len(data) >= 16 && len(T) < 40 {
		T = append(T, math.Float64frombits(binary.LittleEndian.Uint64(data)))
		Cp = append(Cp, math.Float64frombits(binary.LittleEndian.Uint64(data[8:])))
		data = data[16:]
	}
	return T, Cp
}

// FuzzFit feeds arbitrary values to Fit: it must never panic, and a
// successful result must have finite coefficients, reproduce hf298 and s298
// and be monotone (the properties Fit promises). The seed corpus lives in
// testdata/fuzz/FuzzFit.
func FuzzFit(f *testing.F) {
	f.Fuzz(func(t *testing.T, hf, s, cp0, cpInf float64, data []byte) {
		T, Cp := decodePoints(data)
		p, rep, err := Fit(hf, s, T, Cp, cp0, cpInf, FitOptions{})
		if err != nil {
			return
		}
		if !finite(&p.Low) || !finite(&p.High) {
			t.Fatalf("non-finite coefficients %v %v", p.Low, p.High)
		}
		if math.IsNaN(rep.MaxCpResidual) || math.IsNaN(rep.MaxCpRelResidual) {
			t.Fatalf("NaN in report %+v", rep)
		}
		// Exact up to rounding in a6/a7 (relative to the magnitudes involved).
		if d := math.Abs(p.H(298.15) - hf); d > 1e-6*(1+math.Abs(hf)) {
			t.Fatalf("H(298.15) = %g, want %g", p.H(298.15), hf)
		}
		if d := math.Abs(p.S(298.15) - s); d > 1e-6*(1+math.Abs(s)) {
			t.Fatalf("S(298.15) = %g, want %g", p.S(298.15), s)
		}
		for _, x := range []float64{300, 1000, 2000, 5000} {
			if c := p.Cp(x); math.IsNaN(c) || math.IsInf(c, 0) {
				t.Fatalf("Cp(%v) = %v", x, c)
			}
		}
	})
}
