package analysis

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/speciesfile"
)

// A `group` statement's Cp is used at the seven temperatures group values
// are tabulated at (benson.StdTemps): between the temperatures its `cp`
// line gives, linearly interpolated; outside them, held at the nearest
// given value (userGroups). Either is an approximation the user may not
// know kiln makes, so it is reported on the `cp` line (missing-group,
// warning) and every estimate that uses the group carries it as a flag
// (userCpFlag), shown by estimate, summary and hover and named in the
// source line fill writes.

// userCpApprox ends the Approximation of the flag of a group whose Cp is
// filled in from fewer than the seven temperatures.
const userCpApprox = " with Cp filled in from the temperatures its `group` statement gives"

// groupCpGap describes the standard temperatures pts does not give, or ""
// when it gives all seven (a point within rangeSlack of one counts: Cp at
// 298.15 K stands for 300 K, as a block from 300 K covers 298.15 K).
func groupCpGap(pts []speciesfile.CpPoint) string {
	if len(pts) == 0 {
		return ""
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	var given []float64
	for _, p := range pts {
		given = append(given, p.T.SI)
		lo, hi = math.Min(lo, p.T.SI), math.Max(hi, p.T.SI)
	}
	var below, between, above []float64
	for _, T := range benson.StdTemps {
		has := false
		for _, g := range given {
			has = has || math.Abs(g-T) <= rangeSlack
		}
		switch {
		case has:
		case T < lo:
			below = append(below, T)
		case T > hi:
			above = append(above, T)
		default:
			between = append(between, T)
		}
	}
	if len(below)+len(between)+len(above) == 0 {
		return ""
	}
	only := ""
	if len(below)+len(above) > 0 {
		only = " only"
	}
	var parts []string
	if lo == hi { // one temperature: every other one is held at it
		below, above = append(below, above...), nil
	}
	if len(below) > 0 {
		parts = append(parts, fmt.Sprintf("%s held at the %s K value", tempList(below), tempNum(lo)))
	}
	if len(between) > 0 {
		parts = append(parts, tempList(between)+" interpolated linearly")
	}
	if len(above) > 0 {
		parts = append(parts, fmt.Sprintf("%s held at the %s K value", tempList(above), tempNum(hi)))
	}
	return fmt.Sprintf("Cp given at %s%s; %s", tempList(slices.Sorted(slices.Values(given))), only, andList(parts))
}

// giveAllSeven is the remedy for a groupCpGap.
func giveAllSeven() string {
	var std []string
	for _, T := range benson.StdTemps {
		std = append(std, tempNum(T))
	}
	return "give all seven temperatures " + strings.Join(std, " ") + " K"
}

// userCpFlag is the flag of estimates that use group name, whose Cp is
// filled in as gap says.
func userCpFlag(name, gap string) benson.Missing {
	return benson.Missing{Group: name, Approximation: name + userCpApprox, Note: gap + "; " + giveAllSeven()}
}

// isUserCpFlag reports whether m is a userCpFlag (reported on the group's
// `cp` line, not again on every species that uses the group).
func isUserCpFlag(m benson.Missing) bool {
	return m.Approximation == m.Group+userCpApprox
}

// tempList words temperatures (K, ascending): "300 K", "300 and 1000 K",
// "400–1500 K" for three or more consecutive group temperatures, else
// "400, 600 and 800 K".
func tempList(ts []float64) string {
	if len(ts) >= 3 {
		first := -1
		for i, T := range benson.StdTemps {
			if T == ts[0] {
				first = i
			}
		}
		run := first >= 0 && first+len(ts) <= len(benson.StdTemps)
		for k := 0; run && k < len(ts); k++ {
			run = benson.StdTemps[first+k] == ts[k]
		}
		if run {
			return tempNum(ts[0]) + "–" + tempNum(ts[len(ts)-1]) + " K"
		}
	}
	s := make([]string, len(ts))
	for i, T := range ts {
		s[i] = tempNum(T)
	}
	return andList(s) + " K"
}

// andList joins "a", "a and b", "a, b and c".
func andList(s []string) string {
	if len(s) <= 1 {
		return strings.Join(s, "")
	}
	return strings.Join(s[:len(s)-1], ", ") + " and " + s[len(s)-1]
}

func tempNum(T float64) string { return strconv.FormatFloat(T, 'g', -1, 64) }
