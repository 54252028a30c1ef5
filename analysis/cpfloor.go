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
