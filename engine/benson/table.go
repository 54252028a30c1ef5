package benson

import (
	_ "embed"
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"
)

//go:embed groups.tsv
var groupsTSV string

//go:embed corrections.tsv
var correctionsTSV string

//go:embed hbi.tsv
var hbiTSV string

// hbiValue is one hydrogen-bond increment: the R–H bond dissociation
// enthalpy and, when published values are at hand (hasSCp), the entropy and
// Cp changes on removing the H atom.
type hbiValue struct {
	site   string
	bde    float64 // J/mol
	hasSCp bool    // value.S298 and value.Cp are published increments
	value  GroupValue
}

// tables holds the parsed built-in data. It is built once and never written
// afterwards.
type tables struct {
	groups      map[string]GroupValue // by normalised name
	order       []string              // file order, for GroupTable
	corrections map[string]GroupValue
	hbi         map[string]hbiValue
	centres     map[string]bool // centre types with at least one group
	systems     []systemValue   // whole ring systems (systems.tsv)
}

// hfH is ΔHf°298 of the H atom, 52.10 kcal/mol (NIST-JANAF, Chase 1998).
const hfH = 52.10 * calorie * 1000

var builtin = sync.OnceValue(func() *tables {
	t := &tables{groups: map[string]GroupValue{}, corrections: map[string]GroupValue{}, hbi: map[string]hbiValue{}, centres: map[string]bool{}}
	groups := mustParse("groups.tsv", groupsTSV)
	for _, x := range extraGroupTables {
		groups = append(groups, mustParse(x.file, x.text)...)
	}
	for i := range groups {
		name, err := ParseGroupName(groups[i].Name)
		if err != nil {
			panic(fmt.Sprintf("benson: built-in group %q: %v", groups[i].Name, err))
		}
		groups[i].Name = name
	}
	for _, r := range mustFill("groups.tsv", groups) {
		if _, dup := t.groups[r.Name]; dup {
			panic(fmt.Sprintf("benson: built-in group %q listed twice", r.Name))
		}
		t.groups[r.Name] = r
		t.order = append(t.order, r.Name)
	}
	corr := mustParse("corrections.tsv", correctionsTSV)
	for _, x := range extraCorrectionTables { // hetero_sx.go
		corr = append(corr, mustParse(x.file, x.text)...)
	}
	corr = append(corr, mustParse("corrections_n.tsv", correctionsNTSV)...) // hetero_n.go
	for _, v := range mustFill("corrections.tsv", corr) {
		t.corrections[v.Name] = v
	}
	sys, err := parseSystems(systemsTSV)
	if err != nil {
		panic(fmt.Sprintf("benson: systems.tsv: %v", err))
	}
	t.systems = sys
	for _, r := range append(append(mustParse("hbi.tsv", hbiTSV), mustParse("hbi_nsx.tsv", hbiNSXTSV)...), mustParse("hbi_n.tsv", hbiNTSV)...) {
		// Column 2 holds D(R–H); the ΔHf increment is D − ΔHf(H).
		v := r.GroupValue
		bde := v.Hf298
		v.Hf298 = bde - hfH
		has := !math.IsNaN(v.S298)
		if !has {
			v.S298 = 0
			v.Cp = [7]float64{}
		}
		t.hbi[v.Name] = hbiValue{site: v.Name, bde: bde, hasSCp: has, value: v}
	}
	// The supported centres are read off the finished group table, so any
	// group file loaded above (or added later) extends them.
	for name := range t.groups {
		t.centres[centreOf(name)] = true
	}
	return t
})

// row is one parsed table line. Missing numbers ("-") are NaN; analog names
// the row whose 1000 → 1500 K increment gives this row's 1500 K value
// ("~name" in the 1500 K column), or is empty.
type row struct {
	GroupValue
	analog string
}

func mustParse(file, text string) []row {
	rs, err := parseTSV(text)
	if err != nil {
		panic(fmt.Sprintf("benson: %s: %v", file, err))
	}
	return rs
}

// mustFill resolves the "~analog" 1500 K entries of rows (see fill1500) and
// checks that every number is present; a malformed built-in table is a
// programming error.
func mustFill(file string, rs []row) []GroupValue {
	out, err := fill1500(rs)
	if err != nil {
		panic(fmt.Sprintf("benson: %s: %v", file, err))
	}
	return out
}

// fill1500 returns the rows as GroupValues, with the 1500 K Cp of each row
// marked "~analog" set to
//
//	Cp(1500) = Cp(1000) + [Cp_analog(1500) − Cp_analog(1000)]
//
// where the analog is another row of the same table whose 1500 K value is
// published (not itself by analogy). The source gains "1500 K by analogy with
// <analog>".
func fill1500(rs []row) ([]GroupValue, error) {
	byName := make(map[string]row, len(rs))
	for _, r := range rs {
		byName[r.Name] = r
	}
	out := make([]GroupValue, 0, len(rs))
	for _, r := range rs {
		v := r.GroupValue
		if r.analog != "" {
			a, ok := byName[r.analog]
			if !ok {
				return nil, fmt.Errorf("%s: 1500 K analog %q is not in the table", r.Name, r.analog)
			}
			if a.analog != "" {
				return nil, fmt.Errorf("%s: 1500 K analog %s has no published 1500 K value itself", r.Name, r.analog)
			}
			v.Cp[6] = v.Cp[5] + a.Cp[6] - a.Cp[5]
			v.Source += "; 1500 K by analogy with " + r.analog
		}
		if math.IsNaN(v.Hf298) || math.IsNaN(v.S298) {
			return nil, fmt.Errorf("%s: Hf and S are required", r.Name)
		}
		for i, c := range v.Cp {
			if math.IsNaN(c) {
				return nil, fmt.Errorf("%s: Cp at %g K is required", r.Name, StdTemps[i])
			}
		}
		out = append(out, v)
	}
	return out, nil
}

// parseTSV reads rows "name Hf S Cp×7 source" with Hf in kcal/mol and S, Cp
// in cal/(mol K), converting to J/mol and J/(mol K). A number written "-" is
// not known (NaN); the 1500 K column may instead name an analog, "~name".
func parseTSV(text string) ([]row, error) {
	var out []row
	for n, line := range strings.Split(text, "\n") {
		if strings.TrimSpace(line) == "" || strings.HasPrefix(line, "#") {
			continue
		}
		f := strings.Split(line, "\t")
		if len(f) != 11 {
			return nil, fmt.Errorf("line %d: %d columns, want 11", n+1, len(f))
		}
		var r row
		var x [9]float64
		for i := range x {
			s := f[i+1]
			switch {
			case s == "-":
				x[i] = math.NaN()
				continue
			case i == 8 && strings.HasPrefix(s, "~"):
				r.analog = s[1:]
				x[i] = math.NaN()
				continue
			}
			v, err := strconv.ParseFloat(s, 64)
			if err != nil {
				return nil, fmt.Errorf("line %d column %d: %w", n+1, i+2, err)
			}
			x[i] = v * calorie
		}
		r.GroupValue = GroupValue{Name: f[0], Hf298: x[0] * 1000, S298: x[1], Source: f[10]}
		copy(r.Cp[:], x[2:])
		out = append(out, r)
	}
	return out, nil
}

// GroupTable returns a copy of the built-in group table in file order.
func GroupTable() []GroupValue {
	t := builtin()
	out := make([]GroupValue, 0, len(t.order))
	for _, n := range t.order {
		out = append(out, t.groups[n])
	}
	return out
}

// lookup resolves group names: user groups first, then the built-in table.
type lookup struct {
	user map[string]GroupValue
	*tables
}

func lookupTable(user []GroupValue) lookup {
	l := lookup{tables: builtin()}
	if len(user) > 0 {
		l.user = make(map[string]GroupValue, len(user))
		for _, u := range user {
			name, err := ParseGroupName(u.Name)
			if err != nil {
				name = u.Name // an invalid name can never match; keep as given
			}
			u.Name = name
			l.user[name] = u
		}
	}
	return l
}

// centreOf returns the centre type of a normalised group name ("C" for
// "C-(C)(H)3", "Ca" for "Ca").
func centreOf(name string) string {
	c, _, _ := strings.Cut(name, "-")
	return c
}

// hasCentre reports whether any loaded group (user or built-in) has centre
// type c: the single gate deciding which elements and atom environments
// group additivity supports.
func (l lookup) hasCentre(c string) bool {
	if l.centres[c] {
		return true
	}
	for name := range l.user {
		if centreOf(name) == c {
			return true
		}
	}
	return false
}

func (l lookup) group(name string) (GroupValue, bool) {
	if v, ok := l.user[name]; ok {
		return v, true
	}
	v, ok := l.groups[name]
	return v, ok
}
