package kinetics

import (
	"testing"

	"github.com/stretchr/testify/assert"
)

func w(coeff float64, comp map[string]int, charge int) Weighted {
	return Weighted{Coeff: coeff, Composition: comp, Charge: charge}
}

func TestBalance(t *testing.T) {
	H := map[string]int{"H": 1}
	O := map[string]int{"O": 1}
	O2 := map[string]int{"O": 2}
	OH := map[string]int{"O": 1, "H": 1}
	H2O := map[string]int{"H": 2, "O": 1}
	CH4 := map[string]int{"C": 1, "H": 4}
	CH3 := map[string]int{"C": 1, "H": 3}
	CO2 := map[string]int{"C": 1, "O": 2}
	HCl := map[string]int{"H": 1, "Cl": 1}
	tests := []struct {
		name      string
		reactants []Weighted
		products  []Weighted
		balanced  bool
		diff      map[string]float64
		message   string
	}{
		{"balanced", []Weighted{w(1, H, 0), w(1, O2, 0)}, []Weighted{w(1, OH, 0), w(1, O, 0)},
			true, map[string]float64{}, ""},
		{"more H fewer O", []Weighted{w(1, OH, 0)}, []Weighted{w(2, H, 0)},
			false, map[string]float64{"H": 1, "O": -1}, "products have 1 more H and 1 fewer O than reactants"},
		{"fractional coefficients balance", []Weighted{w(1, H2O, 0)}, []Weighted{w(1, map[string]int{"H": 2}, 0), w(0.5, O2, 0)},
			true, map[string]float64{}, ""},
		{"fractional imbalance", []Weighted{w(1, CH4, 0), w(1.5, O2, 0)}, []Weighted{w(1, CO2, 0), w(1.25, H2O, 0)},
			false, map[string]float64{"H": -1.5, "O": 0.25}, "products have 1.5 fewer H and 0.25 more O than reactants"},
		{"Hill order with carbon", []Weighted{w(1, CH4, 0)}, []Weighted{w(1, map[string]int{"O": 1}, 0)},
			false, map[string]float64{"C": -1, "H": -4, "O": 1}, "products have 1 fewer C, 4 fewer H and 1 more O than reactants"},
		{"alphabetical without carbon", []Weighted{w(1, HCl, 0)}, []Weighted{w(1, O, 0)},
			false, map[string]float64{"Cl": -1, "H": -1, "O": 1}, "products have 1 fewer Cl, 1 fewer H and 1 more O than reactants"},
		{"0.1+0.2 rounding", []Weighted{w(0.1, O2, 0), w(0.2, O2, 0)}, []Weighted{w(0.3, O2, 0)},
			true, map[string]float64{}, ""},
		{"charge only", []Weighted{w(1, CH4, 0)}, []Weighted{w(1, CH3, 1), w(1, H, 0)},
			false, map[string]float64{"charge": 1}, "products carry 1 more positive charge"},
		{"elements and negative charge", []Weighted{w(1, OH, 0)}, []Weighted{w(1, O, -2)},
			false, map[string]float64{"H": -1, "charge": -2}, "products have 1 fewer H than reactants and carry 2 more negative charges"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			b := CheckBalance(tc.reactants, tc.products)
			assert.Equal(t, tc.balanced, b.Balanced)
			assert.Len(t, b.Diff, len(tc.diff))
			for k, v := range tc.diff {
				// 1e-12: sums of a few binary fractions.
				assert.InDelta(t, v, b.Diff[k], 1e-12, k)
			}
			assert.Equal(t, tc.message, b.Message())
		})
	}
}

func TestFormatAmount(t *testing.T) {
	assert.Equal(t, "1", formatAmount(1))
	assert.Equal(t, "0.5", formatAmount(0.5))
	assert.Equal(t, "0.3", formatAmount(0.1+0.2))
	assert.Equal(t, "12.25", formatAmount(12.25))
	assert.Equal(t, "0.333333", formatAmount(1.0/3))
}
