package analysis

import (
	"fmt"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/nasa"
)

// The heat-capacity floor, one rule for given blocks and estimates.
//
// Every ideal-gas molecule has at least its translational and rotational
// heat capacity; nasa.CpFloor (with its slack) is that bound, applied from
// nasa.FloorFrom up. A given block below it is nonphysical-thermo (cpFloor
// in species.go); an estimate below it — only user-supplied group values
// get there — carries the flag CpFloorGroup, which check reports as
// missing-group, and gets no NASA-7 polynomial (Estimate.NASA7), as an
// estimate below the S°298 bound does (benson.EntropyFloorGroup). So what
// fill writes, check accepts. A Cp at or above the classical limit, which
// nasa.Fit refuses, is flagged the same way (CpCeilingGroup), so that check
// says before fill what fill will refuse.

// CpFloorGroup is the Missing.Group of an estimate whose Cp lies below the
// translational and rotational heat capacity of its shape.
const CpFloorGroup = "Cp below the ideal-gas lower bound"

// cpBelowFloor returns the index of the first temperature T[i] ≥
// nasa.FloorFrom whose cp[i] (J/(mol K)) is positive but below
// nasa.CpFloor(n, linear); ok is false when there is none (or n < 1). A Cp
// that is not positive is reported by other checks.
func cpBelowFloor(n int, linear bool, T, cp []float64) (i int, ok bool) {
	floor := nasa.CpFloor(n, linear)
	if floor <= 0 {
		return 0, false
	}
	for i := range T {
		if T[i] >= nasa.FloorFrom && cp[i] > 0 && cp[i] < floor {
			return i, true
		}
	}
	return 0, false
}

// cpFloorMessage words a Cp below the floor in the units u: the value,
// and Cp0 of nasa.ClassicalLimits, the translational and rotational heat
// capacity of the shape (the floor is 95 % of it).
func cpFloorMessage(u Units, T, cp float64, n int, linear bool) string {
	cp0, _ := nasa.ClassicalLimits(n, linear, 0)
	return fmt.Sprintf("Cp at %g K is %s, below %s, the translational and rotational heat capacity of any %s of %d atoms",
		T, u.Entropy(cp), u.Entropy(cp0), shapeWord(n, linear), n)
}

// cpFloorError is the refusal of a NASA-7 fit to an estimate whose Cp lies
// below the floor; FitRefusal words it in the display units.
type cpFloorError struct {
	T, Cp  float64 // K, J/(mol K)
	N      int
	Linear bool
}

func (e *cpFloorError) Error() string { return e.words(Units{KJ: true}) }

func (e *cpFloorError) words(u Units) string {
	return "the estimated " + cpFloorMessage(u, e.T, e.Cp, e.N, e.Linear) +
		", so the group values do not add up for this structure (check any user-supplied `group` values); kiln writes no polynomial from it"
}

// cpFloorCheck tests an estimate's Cp at the group temperatures against
// the floor for a molecule of n atoms: the flag and the fit refusal, or ok
// false.
func cpFloorCheck(cp [7]float64, n int, linear, user bool) (benson.Missing, *cpFloorError, bool) {
	i, below := cpBelowFloor(n, linear, benson.StdTemps[:], cp[:])
	if !below {
		return benson.Missing{}, nil, false
	}
	e := &cpFloorError{T: benson.StdTemps[i], Cp: cp[i], N: n, Linear: linear}
	return benson.Missing{
		Group:         CpFloorGroup,
		Approximation: "the group sum as it stands",
		Note:          cpFloorMessage(flagUnits, e.T, e.Cp, n, linear) + doNotAddUp(user),
	}, e, true
}

// CpCeilingGroup is the Missing.Group of an estimate with a Cp at or above
// the classical all-vibration limit Cp∞ (internal rotors counted as free):
// nasa.Fit refuses such a curve (nasa.ShapeAboveLimit), so check flags it
// before fill, as it flags a Cp below the floor.
const CpCeilingGroup = "Cp at or above the classical limit"

// aboveLimitWords words a Cp at or above the classical limit cpInf in the
// units u (the fit refusal and the flag say the same).
func aboveLimitWords(u Units, T, cp, cpInf float64) string {
	return fmt.Sprintf("Cp at %.0f K, %s, is not below %s, the most a molecule of these atoms "+
		"can hold with every vibration excited (internal rotors counted as free)", T, u.Entropy(cp), u.Entropy(cpInf))
}

// cpCeilingCheck tests an estimate's Cp at the group temperatures up to
// tHigh (those nasa.Fit uses) against cpInf, as nasa.Fit does.
func cpCeilingCheck(cp [7]float64, cpInf, tHigh float64, user bool) (benson.Missing, bool) {
	for i, T := range benson.StdTemps {
		if T <= tHigh && cpInf > 0 && cp[i] >= cpInf {
			return benson.Missing{
				Group:         CpCeilingGroup,
				Approximation: "the group sum as it stands",
				Note:          aboveLimitWords(flagUnits, T, cp[i], cpInf) + doNotAddUp(user),
			}, true
		}
	}
	return benson.Missing{}, false
}

// flagUnits words the numbers of a flag's note, which is part of a cached
// estimate and so cannot follow the file's display units: J/(mol·K) with
// the cal/(mol·K) value beside it.
var flagUnits = Units{KJ: true, Both: true}

// doNotAddUp ends the note of an out-of-bounds Cp: what to check, naming
// the user's group values only when the estimate used some.
func doNotAddUp(user bool) string {
	if user {
		return "; the group values do not add up for this structure (check the user-supplied `group` values, or give it a thermo block)"
	}
	return "; the built-in group values do not add up for this structure (give it a thermo block)"
}

// Holding a high-temperature Cp below the classical limit (cpCeilingHold).
const (
	// ceilingHoldFrom: only an excess from this temperature up is held: a
	// group sum that saturates early (many low-frequency modes, as in
	// perfluoro compounds) overshoots the limit slightly at the top of the
	// table, which says nothing against its lower-temperature values.
	ceilingHoldFrom = 1000.0
	// ceilingHoldExcess: the largest excess, as a fraction of the limit,
	// that is held rather than refused; a larger one means the group
	// values themselves are wrong for this structure.
	ceilingHoldExcess = 0.05
	// ceilingHoldAt: the fraction of the limit the held values take.
	ceilingHoldAt = 0.99
)

// CpHeldGroup is the Missing.Group of an estimate whose Cp at the top of
// the table was held just below the classical limit (cpCeilingHold).
const CpHeldGroup = "Cp held below the classical limit"

// cpCeilingHold holds a Cp that reaches the classical limit cpInf only
// from ceilingHoldFrom up, by at most ceilingHoldExcess of it, at
// ceilingHoldAt × cpInf (values already below that are kept, so Cp stays
// non-decreasing), and returns the held values with their flag. ok is false
// when there is nothing to hold or the excess is not of that kind (then
// cpCeilingCheck flags it and the fit refuses it).
func cpCeilingHold(cp [7]float64, cpInf, tHigh float64) ([7]float64, benson.Missing, bool) {
	if cpInf <= 0 {
		return cp, benson.Missing{}, false
	}
	first, worst := -1, 0.0
	for i, T := range benson.StdTemps {
		if T <= tHigh && cp[i] >= cpInf {
			if first < 0 {
				first = i
			}
			worst = max(worst, cp[i])
		}
	}
	if first < 0 || benson.StdTemps[first] < ceilingHoldFrom || worst > cpInf*(1+ceilingHoldExcess) {
		return cp, benson.Missing{}, false
	}
	held := cp
	hold := ceilingHoldAt * cpInf
	for i := range held {
		held[i] = min(held[i], hold)
	}
	return held, benson.Missing{
		Group:         CpHeldGroup,
		Approximation: fmt.Sprintf("Cp held at %.0f %% of the classical limit", 100*ceilingHoldAt),
		Note: aboveLimitWords(flagUnits, benson.StdTemps[first], cp[first], cpInf) +
			fmt.Sprintf("; the group sum saturates early for this structure, so kiln holds Cp at %s from where it reaches that value (the tabulated Cp and the polynomial use the held values; the true Cp there is not known to better than a few per cent)", flagUnits.Entropy(hold)),
	}, true
}
