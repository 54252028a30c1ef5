package benson

import (
	_ "embed"
	"fmt"
	"sort"
	"strconv"
	"strings"
	"sync"

	"kiln.dev/kiln/engine/molecule"
)

//go:embed groups.tsv
var groupsTSV string

//go:embed corrections.tsv
var correctionsTSV string

//go:embed hbi.tsv
var hbiTSV string

// hbiValue is one hydrogen-bond increment: the R–H bond dissociation
// enthalpy and the entropy and Cp changes on removing the H atom.
type hbiValue struct {
	site  string
	bde   float64 // J/mol
	value GroupValue
}

// tables holds the parsed built-in data. It is built once and never written
// afterwards.
type tables struct {
	groups      map[string]GroupValue // by normalised name
	order       []string              // file order, for GroupTable
	corrections map[string]GroupValue
	hbi         map[string]hbiValue
}

// hfH is ΔHf°298 of the H atom, 52.10 kcal/mol (NIST-JANAF, Chase 1998).
const hfH = 52.10 * calorie * 1000

var builtin = sync.OnceValue(func() *tables {
	t := &tables{groups: map[string]GroupValue{}, corrections: map[string]GroupValue{}, hbi: map[string]hbiValue{}}
	for _, v := range mustParse("groups.tsv", groupsTSV) {
		name, err := ParseGroupName(v.Name)
		if err != nil {
			panic(fmt.Sprintf("benson: built-in group %q: %v", v.Name, err))
		}
		v.Name = name
		if _, dup := t.groups[name]; dup {
			panic(fmt.Sprintf("benson: built-in group %q listed twice", name))
		}
		t.groups[name] = v
		t.order = append(t.order, name)
	}
	for _, v := range mustParse("corrections.tsv", correctionsTSV) {
		t.corrections[v.Name] = v
	}
	for _, v := range mustParse("hbi.tsv", hbiTSV) {
		// Column 2 holds D(R–H); the ΔHf increment is D − ΔHf(H).
		bde := v.Hf298
		v.Hf298 = bde - hfH
		t.hbi[v.Name] = hbiValue{site: v.Name, bde: bde, value: v}
	}
	return t
})

// mustParse reads an embedded table; a malformed built-in table is a
// programming error.
func mustParse(file, text string) []GroupValue {
	vs, err := parseTSV(text)
	if err != nil {
		panic(fmt.Sprintf("benson: %s: %v", file, err))
	}
	return vs
}

// parseTSV reads rows "name Hf S Cp×7 source" with Hf in kcal/mol and S, Cp
// in cal/(mol K), converting to J/mol and J/(mol K).
func parseTSV(text string) ([]GroupValue, error) {
	var out []GroupValue
	for n, line := range strings.Split(text, "\n") {
		if strings.TrimSpace(line) == "" || strings.HasPrefix(line, "#") {
			continue
		}
		f := strings.Split(line, "\t")
		if len(f) != 11 {
			return nil, fmt.Errorf("line %d: %d columns, want 11", n+1, len(f))
		}
		var x [9]float64
		for i := range x {
			v, err := strconv.ParseFloat(f[i+1], 64)
			if err != nil {
				return nil, fmt.Errorf("line %d column %d: %w", n+1, i+2, err)
			}
			x[i] = v * calorie
		}
		g := GroupValue{Name: f[0], Hf298: x[0] * 1000, S298: x[1], Source: f[10]}
		copy(g.Cp[:], x[2:])
		out = append(out, g)
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

func (l lookup) group(name string) (GroupValue, bool) {
	if v, ok := l.user[name]; ok {
		return v, true
	}
	v, ok := l.groups[name]
	return v, ok
}

// atomicWeight holds IUPAC 2021 standard atomic weights (abridged, g/mol).
var atomicWeight = map[string]float64{
	"H": 1.008, "C": 12.011, "N": 14.007, "O": 15.999, "F": 18.998, "Si": 28.085,
	"P": 30.974, "S": 32.06, "Cl": 35.45, "Br": 79.904, "I": 126.90, "Ar": 39.95, "He": 4.0026,
}

// formula returns the Hill formula and molar mass (g/mol) of m.
func formula(m *molecule.Molecule) (string, float64, error) {
	count := map[string]int{}
	for _, a := range m.Atoms {
		count[a.Element]++
		if a.HCount > 0 {
			count["H"] += a.HCount
		}
	}
	var mass float64
	for el, n := range count {
		w, ok := atomicWeight[el]
		if !ok {
			return "", 0, fmt.Errorf("no atomic weight for element %q", el)
		}
		mass += w * float64(n)
	}
	var els []string
	for el := range count {
		if el != "C" && el != "H" {
			els = append(els, el)
		}
	}
	sort.Strings(els)
	if count["C"] > 0 {
		els = append([]string{"C", "H"}, els...)
	} else {
		els = append(els, "H")
		sort.Strings(els)
	}
	var b strings.Builder
	for _, el := range els {
		n := count[el]
		if n == 0 {
			continue
		}
		b.WriteString(el)
		if n > 1 {
			b.WriteString(strconv.Itoa(n))
		}
	}
	return b.String(), mass, nil
}
