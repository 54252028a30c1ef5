package kinetics

import (
	"math"
	"sort"
	"strconv"
	"strings"
)

// ChargeKey is the key of Balance.Diff that holds the charge difference.
const ChargeKey = "charge"

// BalanceTolerance is the absolute difference in atoms (or charges) below
// which an element counts as balanced; it absorbs rounding of fractional
// coefficients such as 0.1 + 0.2.
const BalanceTolerance = 1e-9

// Weighted is one species of a reaction side for balance checks: its
// coefficient, its element counts (element symbol → atoms per molecule) and
// its net charge in elementary charges.
type Weighted struct {
	Coeff       float64
	Composition map[string]int
	Charge      int
}

// Balance is the result of CheckBalance. Diff holds products − reactants for
// every element (and ChargeKey) whose difference exceeds BalanceTolerance;
// it is empty (non-nil) when Balanced.
type Balance struct {
	Balanced bool
	Diff     map[string]float64
}

// CheckBalance sums Coeff × count for every element and Coeff × Charge on
// each side and reports products − reactants.
func CheckBalance(reactants, products []Weighted) Balance {
	sum := map[string]float64{}
	add := func(side []Weighted, sign float64) {
		for _, w := range side {
			for el, n := range w.Composition {
				sum[el] += sign * w.Coeff * float64(n)
			}
			if w.Charge != 0 {
				sum[ChargeKey] += sign * w.Coeff * float64(w.Charge)
			}
		}
	}
	add(products, 1)
	add(reactants, -1)
	diff := map[string]float64{}
	for k, v := range sum {
		if math.Abs(v) > BalanceTolerance {
			diff[k] = v
		}
	}
	return Balance{Balanced: len(diff) == 0, Diff: diff}
}

// Message describes the imbalance in words, e.g.
// "products have 1 more H and 1 fewer O than reactants", with elements in
// Hill order (C then H when C is among them, the rest alphabetically) and
// amounts printed without trailing zeros (at most 6 decimals). A charge
// difference is added as "products carry 1 more positive charge" (or
// negative). It returns "" when the reaction is balanced.
func (b Balance) Message() string {
	var els []string
	for k, v := range b.Diff {
		if k != ChargeKey && math.Abs(v) > BalanceTolerance {
			els = append(els, k)
		}
	}
	hillSort(els)
	var parts []string
	for _, el := range els {
		v := b.Diff[el]
		word := "more"
		if v < 0 {
			word = "fewer"
		}
		parts = append(parts, formatAmount(math.Abs(v))+" "+word+" "+el)
	}
	var msg string
	if len(parts) > 0 {
		msg = "products have " + joinAnd(parts) + " than reactants"
	}
	if q := b.Diff[ChargeKey]; math.Abs(q) > BalanceTolerance {
		sign := "positive"
		if q < 0 {
			sign = "negative"
		}
		noun := "charge"
		if math.Abs(q) != 1 {
			noun = "charges"
		}
		c := formatAmount(math.Abs(q)) + " more " + sign + " " + noun
		if msg == "" {
			msg = "products carry " + c
		} else {
			msg += " and carry " + c
		}
	}
	return msg
}

// hillSort orders element symbols in Hill order: C first and H second when
// C is present, everything else alphabetically.
func hillSort(els []string) {
	hasC := false
	for _, e := range els {
		if e == "C" {
			hasC = true
		}
	}
	rank := func(e string) int {
		switch {
		case hasC && e == "C":
			return 0
		case hasC && e == "H":
			return 1
		}
		return 2
	}
	sort.Slice(els, func(i, j int) bool {
		ri, rj := rank(els[i]), rank(els[j])
		if ri != rj {
			return ri < rj
		}
		return els[i] < els[j]
	})
}

// formatAmount prints x with at most 6 decimals and no trailing zeros.
func formatAmount(x float64) string {
	s := strconv.FormatFloat(x, 'f', 6, 64)
	s = strings.TrimRight(s, "0")
	return strings.TrimSuffix(s, ".")
}

// joinAnd joins "a", "a and b", "a, b and c".
func joinAnd(parts []string) string {
	if len(parts) == 1 {
		return parts[0]
	}
	return strings.Join(parts[:len(parts)-1], ", ") + " and " + parts[len(parts)-1]
}
