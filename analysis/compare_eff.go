package analysis

import (
	"fmt"
	"sort"
	"strconv"
	"strings"
)

// efficiencyNote compares the third-body efficiencies of two matched
// reactions with a third body or a (+M) falloff: "" when they agree, else
// the differences in A's names ("third-body efficiencies differ (A → B):
// H2O 12 → 6, CO2 (1) → 2"), an unlisted species counting 1. Rate ratios
// are per unit [M], so a merge that keeps one side's efficiencies changes
// the effective rate by these factors.
func efficiencyNote(x, y *reactionGroup, mapB func(string) string) string {
	dx, dy := x.rs[0].d, y.rs[0].d
	if !dx.ThirdBody && (dx.Falloff == nil || dx.FalloffCollider() != "M") {
		return ""
	}
	ea := map[string]float64{}
	for _, e := range dx.Efficiencies {
		ea[e.Name.Text] = e.Value.SI
	}
	eb := map[string]float64{}
	for _, e := range dy.Efficiencies {
		n := mapB(e.Name.Text)
		if strings.HasPrefix(n, "\x00B:") {
			n = e.Name.Text + " (B)"
		}
		eb[n] = e.Value.SI
	}
	names := map[string]bool{}
	for n := range ea {
		names[n] = true
	}
	for n := range eb {
		names[n] = true
	}
	sorted := make([]string, 0, len(names))
	for n := range names {
		sorted = append(sorted, n)
	}
	sort.Strings(sorted)
	show := func(m map[string]float64, n string) string {
		if v, ok := m[n]; ok {
			return strconv.FormatFloat(v, 'g', 4, 64)
		}
		return "(1)"
	}
	var diffs []string
	for _, n := range sorted {
		va, okA := ea[n]
		vb, okB := eb[n]
		if !okA {
			va = 1
		}
		if !okB {
			vb = 1
		}
		if va != vb {
			diffs = append(diffs, fmt.Sprintf("%s %s → %s", n, show(ea, n), show(eb, n)))
		}
	}
	if len(diffs) == 0 {
		return ""
	}
	return "third-body efficiencies differ (A → B): " + strings.Join(diffs, ", ")
}
