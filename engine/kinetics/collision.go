package kinetics

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Collision-check defaults.
const (
	DefaultCollisionTMin = 300.0  // K
	DefaultCollisionTMax = 2500.0 // K
	CollisionGridPoints  = 20     // temperatures scanned, log-spaced over [TMin, TMax] (adjacent points 12 % apart: k(T)/limit(T) of an Arrhenius rate is smooth and has at most one maximum in between)

	// BathGasMass (amu) and BathGasHeavyAtoms describe the collision
	// partner assumed for a third body M: N2, 2 × 14.0067 (IUPAC standard
	// atomic weight of N), common practice for a bath gas.
	BathGasMass       = 28.0134
	BathGasHeavyAtoms = 2

	// DiameterPerHeavyAtom is the collision diameter (Å) DefaultDiameter
	// gives a molecule with one heavy atom (see DefaultDiameter).
	DiameterPerHeavyAtom = 4.0
)

// CollisionSettings tunes CollisionCheck. The zero value means the defaults.
type CollisionSettings struct {
	// Factor multiplies every bound; 0 means 1. Values above 1 allow for
	// capture rates that beat the hard-sphere estimate (e.g. ion–molecule
	// reactions).
	Factor float64
	// TMin and TMax (K) bound the scanned range; 0 means 300 and 2500 K.
	TMin, TMax float64
	// Diameter, when set, replaces DefaultDiameter: it receives a molecule's
	// mass (amu) and heavy-atom count and returns its collision diameter (Å).
	Diameter func(massAmu float64, heavyAtoms int) float64
}

// Violation is the worst point at which a rate exceeded its collision limit.
// Limit already includes CollisionSettings.Factor.
type Violation struct {
	T           float64 // K
	Rate, Limit float64 // mechanism units of the given order
	Reverse     bool    // set by the caller when the reverse direction was checked
	Order       int     // molecularity the bound was taken for
	// P is the pressure (Pa) of the worst point of a pressure-dependent
	// rate, 0 when the rate does not depend on pressure (set by the caller).
	P float64
	// Pair holds, for a termolecular bound, the indices (in the masses
	// checked) of the two molecules whose collision rate bounds it.
	Pair [2]int
}

// CheckPressures returns the pressures (Pa) at which a pressure-dependent
// rate is checked: 0.01 to 100 bar, two points per decade (1, 3.16, 10, …),
// the range combustion and pyrolysis models are run at (common practice).
func CheckPressures() []float64 {
	out := make([]float64, 0, 9)
	for i := 0; i <= 8; i++ {
		out = append(out, 1e3*math.Pow(10, float64(i)/2))
	}
	return out
}

// Ratio returns Rate/Limit (> 1 for a violation).
func (v Violation) Ratio() float64 { return v.Rate / v.Limit }

// Message describes the violation, e.g. "k(300 K) = 1e16 cm3/mol/s exceeds
// the bimolecular collision limit 2.47e14 cm3/mol/s by a factor of 40".
func (v Violation) Message() string {
	dir := "k"
	if v.Reverse {
		dir = "reverse k"
	}
	at := fmt.Sprintf("%.0f K", v.T)
	if v.P > 0 {
		at += fmt.Sprintf(", %s bar", strconv.FormatFloat(v.P/1e5, 'g', 3, 64))
	}
	msg := fmt.Sprintf("%s(%s) = %s %s exceeds the %s collision limit %s %s by a factor of %s",
		dir, at, sci(v.Rate), RateUnits(v.Order), molecularity(v.Order),
		sci(v.Limit), RateUnits(v.Order), strconv.FormatFloat(v.Ratio(), 'g', 3, 64))
	if v.Order == 3 {
		msg += " (" + TermolecularBasis("") + ")"
	}
	return msg
}

// DefaultDiameter estimates a collision diameter in Å from the heavy-atom
// count n alone, as a deliberately generous upper envelope:
//
//	d = 4.0 Å · max(n, 1)^(1/3)
//
// i.e. a sphere whose volume grows in proportion to the heavy atoms. The
// 4.0 Å anchor is kiln's own choice, set to lie above the Lennard-Jones σ
// of common small molecules (Reid, Prausnitz & Poling, The Properties of
// Gases and Liquids, 4th ed. 1987, App. B, from memory: H2 2.827, H2O 2.641,
// O2 3.467, N2 3.798, CH4 3.758, CO2 3.941, C2H6 4.443, C3H8 5.118,
// n-C4H10 4.687, C6H6 5.349, n-C6H14 5.949 Å). A generous diameter only
// raises the bound, so the check errs towards silence. mass is unused.
func DefaultDiameter(massAmu float64, heavyAtoms int) float64 {
	return DiameterPerHeavyAtom * math.Cbrt(float64(max(heavyAtoms, 1)))
}

// CollisionLimit returns the upper bound on a rate constant of the given
// molecularity at temperature T (K), times s.Factor, in mechanism units.
// ok is false when no bound applies. The bounds are common practice:
//
// Unimolecular (order 1), s⁻¹: the transition-state-theory frequency
//
//	k ≤ kB T / h        (6.25e12 s⁻¹ at 300 K, 5.21e13 s⁻¹ at 2500 K)
//
// which a rate can only exceed through a large positive activation entropy
// with a small barrier; masses are not used.
//
// Bimolecular (order 2), cm3/(mol s): the hard-sphere collision rate
//
//	k ≤ NA π d² sqrt(8 kB T/(π μ)) × 1e6
//
// with d = (d1 + d2)/2 (diameters from s.Diameter or DefaultDiameter, Å),
// μ = m1 m2/(m1 + m2) the reduced mass (masses in amu). masses and
// heavyAtoms hold one entry per molecule, coefficients expanded (2 A gives
// two entries). For identical partners the symmetry factor 1/2 is not
// applied, which keeps the bound generous. A reaction written with a third
// body M and one reactant (A + M, k in cm3/(mol s)) is bimolecular: when
// order is 2 and only one molecule is given, the other partner is taken to
// be the bath gas N2 (BathGasMass, BathGasHeavyAtoms). The order must be
// that of the rate constant checked: the high-pressure limit of a falloff
// reaction A (+M) is unimolecular, not bimolecular.
//
// Termolecular (order 3), cm6/(mol2 s): no collision rate bounds a
// three-body rate constant by itself (it is a capture rate times the
// lifetime of the energised complex times its stabilising collision rate,
// and that lifetime has no general ceiling). What does hold is that the
// effective second-order rate k·[M] of the two partners that form the
// complex cannot outrun their collisions. kiln applies it at one generous
// bath concentration, the ideal gas at TermolecularPressure (1 bar):
//
//	k ≤ k_coll(A, B) / [M],   [M] = P/(R T) × 1e-6 mol/cm3, P = 1e5 Pa
//
// (2.46e19 cm6/(mol2 s) for H + O2 at 300 K, growing as T^1.5). This is a
// sanity bound of common practice, not a physical limit of the rate
// constant: a sound low-pressure limit of a large molecule may exceed it,
// but then k·[M] outruns collisions at 1 bar and the reaction needs a
// falloff form. masses and heavyAtoms hold two molecules (A + B + M: A and
// B collide) or three (A + B + C, any of them may be the third body; the
// pair with the fastest collision rate is taken, which keeps the bound
// generous). Orders above 3 have no bound (ok = false).
func CollisionLimit(order int, masses []float64, heavyAtoms []int, T float64, s CollisionSettings) (limit float64, ok bool) {
	limit, _, ok = collisionLimit(order, masses, heavyAtoms, T, s)
	return limit, ok
}

// TermolecularBasis says in words what the termolecular bound is, for
// every message about it; pair names the colliding pair ("A + B"), or is
// empty when the names are not at hand.
func TermolecularBasis(pair string) string {
	if pair == "" {
		pair = "two partners'"
	}
	return "termolecular sanity bound: at 1 bar, k·[M] would outrun the " + pair + " collision rate"
}

// TermolecularPressure (Pa) is the bath pressure of the termolecular bound
// (see CollisionLimit): 1 bar, the standard-state pressure, low enough that
// a three-body rate expression is commonly still used there.
const TermolecularPressure = 1e5

// collisionLimit is CollisionLimit, also returning, for order 3, the
// indices in masses of the pair whose collision rate bounds the rate.
func collisionLimit(order int, masses []float64, heavyAtoms []int, T float64, s CollisionSettings) (limit float64, pair [2]int, ok bool) {
	factor := s.Factor
	if factor == 0 {
		factor = 1
	}
	switch order {
	case 1:
		return factor * Kb * T / H, pair, true
	case 2:
		if len(masses) == 1 && len(heavyAtoms) == 1 {
			masses = []float64{masses[0], BathGasMass}
			heavyAtoms = []int{heavyAtoms[0], BathGasHeavyAtoms}
		}
		if len(masses) != 2 || len(heavyAtoms) != 2 {
			return 0, pair, false
		}
		k, ok := hardSphere(masses[0], masses[1], heavyAtoms[0], heavyAtoms[1], T, s)
		return factor * k, [2]int{0, 1}, ok
	case 3:
		if len(masses) != len(heavyAtoms) || len(masses) < 2 || len(masses) > 3 {
			return 0, pair, false
		}
		best := 0.0
		for i := 0; i < len(masses); i++ {
			for j := i + 1; j < len(masses); j++ {
				k, ok := hardSphere(masses[i], masses[j], heavyAtoms[i], heavyAtoms[j], T, s)
				if !ok {
					return 0, pair, false
				}
				if k > best {
					best, pair = k, [2]int{i, j}
				}
			}
		}
		conc := TermolecularPressure / (R * T) * 1e-6 // mol/cm3
		return factor * best / conc, pair, true
	}
	return 0, pair, false
}

// hardSphere is the hard-sphere collision rate constant of two molecules
// (masses in amu, diameters from their heavy atoms), cm3/(mol s); ok is
// false for a mass that is not positive.
func hardSphere(m1, m2 float64, h1, h2 int, T float64, s CollisionSettings) (float64, bool) {
	if !(m1 > 0 && m2 > 0) {
		return 0, false
	}
	diam := s.Diameter
	if diam == nil {
		diam = DefaultDiameter
	}
	d := 0.5 * (diam(m1, h1) + diam(m2, h2)) * 1e-10 // m
	mu := m1 * m2 / (m1 + m2) * Amu                  // kg
	v := math.Sqrt(8 * Kb * T / (math.Pi * mu))      // m/s, mean relative speed
	return NA * math.Pi * d * d * v * 1e6, true      // cm3/(mol s)
}

// CollisionCheck evaluates rate on CollisionGridPoints temperatures spaced
// evenly in ln T over [s.TMin, s.TMax] and compares each with
// CollisionLimit. It returns the point with the largest rate/limit ratio
// above 1, or nil when the rate stays within the bound everywhere or no bound
// applies (see CollisionLimit). NaN rates are skipped. order is the number of
// molecules on the side being checked (reactants for the forward rate,
// products for the reverse, coefficients counted, third body included as one
// molecule); the returned Violation has Reverse false.
func CollisionCheck(order int, masses []float64, heavyAtoms []int, rate func(T float64) float64, s CollisionSettings) *Violation {
	grid := s.Temperatures()
	tmin := grid[0]
	// Evaluate the bound once and scale it along the grid.
	lim0, pair, ok := collisionLimit(order, masses, heavyAtoms, tmin, s)
	if !ok {
		return nil
	}
	// The bound scales as T (unimolecular), √T (bimolecular) or T^1.5
	// (termolecular: √T over a concentration ∝ 1/T).
	power := 0.5
	switch order {
	case 1:
		power = 1
	case 3:
		power = 1.5
	}
	var worst *Violation
	for _, T := range grid {
		lim := lim0 * math.Pow(T/tmin, power)
		if k := rate(T); k > lim { // also skips NaN
			if worst == nil || k/lim > worst.Rate/worst.Limit {
				worst = &Violation{T: T, Rate: k, Limit: lim, Order: order, Pair: pair}
			}
		}
	}
	return worst
}

// Temperatures returns the temperatures (K) CollisionCheck scans for s:
// CollisionGridPoints of them evenly spaced in ln T from TMin to TMax
// (defaults for zero values, swapped when out of order), the last exactly
// TMax. Other checks of a rate over the same range use the same grid.
func (s CollisionSettings) Temperatures() [CollisionGridPoints]float64 {
	tmin, tmax := s.TMin, s.TMax
	if tmin <= 0 {
		tmin = DefaultCollisionTMin
	}
	if tmax <= 0 {
		tmax = DefaultCollisionTMax
	}
	if tmin > tmax {
		tmin, tmax = tmax, tmin
	}
	var out [CollisionGridPoints]float64
	step := math.Pow(tmax/tmin, 1/float64(CollisionGridPoints-1))
	T := tmin
	for i := range out {
		if i == CollisionGridPoints-1 {
			T = tmax // no drift at the end of the grid
		}
		out[i] = T
		T *= step
	}
	return out
}

// RateUnits names the units of a rate constant of the given order in the
// mechanism's cm, mol, s system: "s⁻¹", "cm³/(mol·s)", "cm⁶/(mol²·s)", …
// (order n: cm^(3(n−1)) mol^(1−n) s⁻¹). Every message and table that shows
// a rate constant uses it.
func RateUnits(order int) string {
	switch {
	case order == 1:
		return "s⁻¹"
	case order == 2:
		return "cm³/(mol·s)"
	case order > 2:
		return "cm" + superscript(3*(order-1)) + "/(mol" + superscript(order-1) + "·s)"
	}
	return fmt.Sprintf("(order %d)", order)
}

// superscript writes n ≥ 0 in superscript digits.
func superscript(n int) string {
	const digits = "⁰¹²³⁴⁵⁶⁷⁸⁹"
	var b strings.Builder
	for _, c := range strconv.Itoa(n) {
		r := []rune(digits)[c-'0']
		b.WriteRune(r)
	}
	return b.String()
}

// molecularity names a reaction order in words.
func molecularity(order int) string {
	switch order {
	case 1:
		return "unimolecular"
	case 2:
		return "bimolecular"
	case 3:
		return "termolecular"
	}
	return fmt.Sprintf("order-%d", order)
}

// sci prints x with 3 significant digits and a compact exponent: 1e16,
// 2.47e14, 1.5e-5.
func sci(x float64) string {
	s := strconv.FormatFloat(x, 'g', 3, 64)
	mant, exp, found := strings.Cut(s, "e")
	if !found {
		return s
	}
	neg := strings.HasPrefix(exp, "-")
	exp = strings.TrimLeft(exp, "+-0")
	if exp == "" {
		return mant
	}
	if neg {
		exp = "-" + exp
	}
	return mant + "e" + exp
}
