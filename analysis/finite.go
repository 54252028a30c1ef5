package analysis

import (
	"fmt"
	"math"

	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/speciesfile"
)

// Thermo blocks whose values overflow.
//
// The reader refuses a number that is not finite in SI units. A block of
// finite numbers can still evaluate to infinity or NaN (nasa7 coefficients
// of 1e300, a Cp of 1e307 J/(mol K) integrated over thousands of kelvin):
// such a block is an error at the number that overflows and is never used
// as data, so no infinity reaches a table, a message or JSON output.

// overflowSpan bounds the work of a thermo evaluation by magnitudes: a block
// is usable when a bound on |Cp|, |H|, |S| and |G| = |H − T S| over every
// temperature kiln evaluates it at (up to MaxTHigh, or the block's own top
// temperature when higher) is finite. It returns the token to blame (the
// number contributing most to the bound) and a message when the bound
// overflows, else ok.
func overflowSpan(d *speciesfile.Species) (tok speciesfile.Token, msg string, ok bool) {
	switch {
	case d.NASA7 != nil:
		return nasaOverflow(d.NASA7)
	case d.Table != nil:
		return tableOverflow(d.Table)
	}
	return speciesfile.Token{}, "", true
}

// nasaOverflow bounds one nasa7 block, part by part: with T_b the top of
// the part's range (TMID for low; THIGH, at least MaxTHigh, for high) and
// a1…a7 its coefficients, every Cp, H, S and G the part gives on (0, T_b]
// is at most R (Σ_k |a_k| T_b^k (1 + T_b) + |a1| T_b |ln T_b| + |a6| + T_b |a7|)
// in magnitude (k = 1…5, T_b ≥ 1 K).
func nasaOverflow(b *speciesfile.NASA7Block) (speciesfile.Token, string, bool) {
	top := [2]float64{b.TMid.Value, math.Max(b.THigh.Value, MaxTHigh)}
	for part, coeffs := range [2]*[7]speciesfile.Number{&b.Low, &b.High} {
		tb := math.Max(top[part], 1)
		terms := make([]float64, 7)
		pow := 1.0
		for k := 0; k < 5; k++ {
			terms[k] = product(coeffs[k].Value, pow*(1+tb))
			pow *= tb
		}
		terms[0] += product(coeffs[0].Value, tb*math.Abs(math.Log(tb)))
		terms[5] = math.Abs(coeffs[5].Value)
		terms[6] = product(coeffs[6].Value, tb)
		if i, bad := blame(terms, nasa.R); bad {
			name := [2]string{"low", "high"}[part]
			return coeffs[i].Tok, fmt.Sprintf("nasa7 %s coefficient a%d = %s makes Cp, H or S overflow (not a finite number) below %g K; the block is ignored",
				name, i+1, coeffs[i].Tok.Text, top[part]), false
		}
	}
	return speciesfile.Token{}, "", true
}

// tableOverflow bounds a thermo-table: H(T) = ΔHf°298 + ∫Cp dT and
// S(T) = S°298 + ∫Cp/T dT with Cp between its extreme values, up to T_b =
// max(last point, MaxTHigh), give |H|, T|S| ≤ |ΔHf°298| + T_b |S°298| +
// Σ |Cp_i| T_b (1 + |ln(T_b/T_min)|), T_min the lowest of 298.15 K and the
// first point.
func tableOverflow(t *speciesfile.ThermoTable) (speciesfile.Token, string, bool) {
	if t.Hf298 == nil || t.S298 == nil || len(t.Cp) == 0 {
		return speciesfile.Token{}, "", true
	}
	tb, tmin := float64(MaxTHigh), T298
	for _, p := range t.Cp {
		tb, tmin = math.Max(tb, p.T.SI), math.Min(tmin, p.T.SI)
	}
	span := tb * (1 + math.Abs(math.Log(tb/math.Max(tmin, 1e-3))))
	toks := []speciesfile.Token{t.Hf298.Tok, t.S298.Tok}
	terms := []float64{math.Abs(t.Hf298.SI), product(t.S298.SI, tb)}
	for _, p := range t.Cp {
		toks = append(toks, p.Cp.Tok)
		terms = append(terms, product(p.Cp.SI, span))
	}
	if i, bad := blame(terms, 1); bad {
		return toks[i], fmt.Sprintf("thermo-table value %s makes H, S or G overflow (not a finite number) up to %g K; the block is ignored", toks[i].Text, tb), false
	}
	return speciesfile.Token{}, "", true
}

// blame reports whether scale·Σ terms overflows (or is NaN) and, if so, the
// index of the largest term.
func blame(terms []float64, scale float64) (int, bool) {
	sum, worst := 0.0, 0
	for i, v := range terms {
		sum += v
		if !(v <= terms[worst]) {
			worst = i
		}
	}
	if sum *= scale; !math.IsInf(sum, 0) && !math.IsNaN(sum) {
		return 0, false
	}
	return worst, true
}

// product is |v|·f, 0 when v is 0 (whatever f is).
func product(v, f float64) float64 {
	if v == 0 {
		return 0
	}
	return math.Abs(v) * f
}

// blockFault says what makes the species' thermo block unusable.
func (sp *Species) blockFault() string {
	if sp.overflowBlock {
		return "a value that overflows"
	}
	return "a syntax error"
}
