package analysis

import (
	"sort"
	"strconv"
	"strings"

	"kiln.dev/kiln/speciesfile"
)

// This file is the one home of reaction identity: duplicate detection
// (reactions) and `compare` (matchReactions) both key reactions here, so
// `2 OH <=> H2O2`, `OH + OH <=> H2O2` and `H2O2 <=> OH + OH` are one
// reaction to both.

// normalSide writes one side of an equation in normal form: each species
// once with its coefficients summed (`OH + OH` and `2 OH` are both
// "2 OH"), in name order, names passed through names (the identity, or
// compare's mapping of B's names to A's).
func normalSide(ts []speciesfile.Term, names func(string) string) string {
	coeff := make(map[string]float64, len(ts))
	order := make([]string, 0, len(ts))
	for _, t := range ts {
		n := names(t.Name.Text)
		if _, ok := coeff[n]; !ok {
			order = append(order, n)
		}
		coeff[n] += t.Coeff
	}
	sort.Strings(order)
	parts := make([]string, len(order))
	for i, n := range order {
		// 12 significant digits: sums of decimal coefficients written
		// differently (0.1 + 0.2 and 0.3) compare equal; coefficients
		// are at most 1000, so no two a user can mean differently merge.
		parts[i] = strconv.FormatFloat(coeff[n], 'g', 12, 64) + " " + n
	}
	return strings.Join(parts, " + ")
}

// thirdBodyKey names the third body of a reaction with mapped names: "+M",
// "(+M)", "(+NAME)" or "".
func thirdBodyKey(d *speciesfile.Reaction, names func(string) string) string {
	switch {
	case d.Falloff != nil:
		c := d.FalloffCollider()
		if c != "M" {
			c = names(c)
		}
		return "(+" + c + ")"
	case d.ThirdBody:
		return "+M"
	}
	return ""
}

// equationKey identifies a reaction regardless of direction, term order,
// repeated species and how coefficients are written. left and right are
// its reactant and product sides in normal form (left is used to tell the
// direction a reaction is written in).
func equationKey(d *speciesfile.Reaction, names func(string) string) (key, left, right string) {
	left, right = normalSide(d.Reactants, names), normalSide(d.Products, names)
	a, b := left, right
	if b < a {
		a, b = b, a
	}
	return a + " = " + b + " " + thirdBodyKey(d, names), left, right
}

func sameName(n string) string { return n }

// reactionKey identifies a reaction regardless of direction and how its
// sides are written (see equationKey).
func reactionKey(d *speciesfile.Reaction) string {
	k, _, _ := equationKey(d, sameName)
	return k
}
