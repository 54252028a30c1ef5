// Package mechgen generates large, valid kiln mechanisms for tests and
// benchmarks: random C/H/O molecules (chains, branches, rings, double bonds),
// one radical of each, and balanced hydrogen-abstraction reactions with
// plausible rate parameters. Output is deterministic for a seed.
package mechgen

import (
	"bytes"
	"fmt"
	"math/rand"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// Options control the generated mechanism.
type Options struct {
	Seed      int64
	Molecules int // number of distinct stable molecules; each brings a radical and three reactions
	MaxHeavy  int // largest molecule in heavy atoms (default 12)
}

// atom and bond of the generator's own small graph.
type gatom struct {
	el    string // "C" or "O"
	rad   bool   // radical centre (written as a bracket atom)
	bonds []int  // indices into graph.bonds
}

type gbond struct{ a, b, order int }

type graph struct {
	atoms []gatom
	bonds []gbond
}

func valence(el string) int {
	if el == "O" {
		return 2
	}
	return 4
}

func (g *graph) used(i int) int {
	n := 0
	for _, b := range g.atoms[i].bonds {
		n += g.bonds[b].order
	}
	return n
}

func (g *graph) bonded(i, j int) bool {
	for _, b := range g.atoms[i].bonds {
		if g.bonds[b].a == j || g.bonds[b].b == j {
			return true
		}
	}
	return false
}

func (g *graph) addBond(i, j, order int) {
	g.bonds = append(g.bonds, gbond{i, j, order})
	k := len(g.bonds) - 1
	g.atoms[i].bonds = append(g.atoms[i].bonds, k)
	g.atoms[j].bonds = append(g.atoms[j].bonds, k)
}

// randomMolecule builds a connected C/H/O graph of n heavy atoms.
func randomMolecule(r *rand.Rand, n int) *graph {
	g := &graph{}
	g.atoms = append(g.atoms, gatom{el: "C"})
	for len(g.atoms) < n {
		el := "C"
		if r.Intn(6) == 0 {
			el = "O"
		}
		// Attach to a random atom with free valence; O–O bonds are avoided.
		var cands []int
		for i := range g.atoms {
			if g.used(i) < valence(g.atoms[i].el) && !(el == "O" && g.atoms[i].el == "O") {
				cands = append(cands, i)
			}
		}
		if len(cands) == 0 {
			break
		}
		p := cands[r.Intn(len(cands))]
		g.atoms = append(g.atoms, gatom{el: el})
		g.addBond(p, len(g.atoms)-1, 1)
	}
	// Maybe close a ring of 5 to 7 atoms.
	if n >= 5 && r.Intn(3) == 0 {
		for try := 0; try < 20; try++ {
			i, j := r.Intn(len(g.atoms)), r.Intn(len(g.atoms))
			if i == j || g.bonded(i, j) || g.atoms[i].el == "O" && g.atoms[j].el == "O" {
				continue
			}
			if d := g.distance(i, j); d < 4 || d > 6 {
				continue
			}
			if g.used(i) < valence(g.atoms[i].el) && g.used(j) < valence(g.atoms[j].el) {
				g.addBond(i, j, 1)
				break
			}
		}
	}
	// Maybe one C=C double bond.
	if r.Intn(2) == 0 {
		for _, k := range r.Perm(len(g.bonds)) {
			b := &g.bonds[k]
			if g.atoms[b.a].el == "C" && g.atoms[b.b].el == "C" && g.used(b.a) < 4 && g.used(b.b) < 4 && !g.hasDouble(b.a) && !g.hasDouble(b.b) {
				b.order = 2
				break
			}
		}
	}
	return g
}

func (g *graph) hasDouble(i int) bool {
	for _, b := range g.atoms[i].bonds {
		if g.bonds[b].order > 1 {
			return true
		}
	}
	return false
}

// distance is the bond count of the shortest path from i to j.
func (g *graph) distance(i, j int) int {
	dist := map[int]int{i: 0}
	queue := []int{i}
	for len(queue) > 0 {
		x := queue[0]
		queue = queue[1:]
		if x == j {
			return dist[x]
		}
		for _, b := range g.atoms[x].bonds {
			y := g.bonds[b].a
			if y == x {
				y = g.bonds[b].b
			}
			if _, ok := dist[y]; !ok {
				dist[y] = dist[x] + 1
				queue = append(queue, y)
			}
		}
	}
	return -1
}

// smiles writes the graph as SMILES by depth-first search with ring closures.
func (g *graph) smiles() string {
	var sb strings.Builder
	visited := make([]bool, len(g.atoms))
	usedBond := make([]bool, len(g.bonds))
	// ring closures: bond index → digit, assigned when first seen.
	openRing := map[int]int{}
	closeAt := map[int][]int{} // atom → ring bonds that close there
	nextDigit := 1
	// First pass: find ring-closure bonds (non-tree edges of a DFS).
	var dfs1 func(x int)
	parent := make([]int, len(g.atoms))
	for i := range parent {
		parent[i] = -1
	}
	tree := make([]bool, len(g.bonds))
	seen := make([]bool, len(g.atoms))
	dfs1 = func(x int) {
		seen[x] = true
		for _, b := range g.atoms[x].bonds {
			y := g.bonds[b].a
			if y == x {
				y = g.bonds[b].b
			}
			if !seen[y] {
				tree[b] = true
				dfs1(y)
			}
		}
	}
	dfs1(0)
	for k := range g.bonds {
		if !tree[k] {
			closeAt[g.bonds[k].a] = append(closeAt[g.bonds[k].a], k)
			closeAt[g.bonds[k].b] = append(closeAt[g.bonds[k].b], k)
		}
	}
	bondSym := func(order int) string {
		switch order {
		case 2:
			return "="
		case 3:
			return "#"
		}
		return ""
	}
	var write func(x int)
	write = func(x int) {
		visited[x] = true
		a := g.atoms[x]
		if a.rad {
			h := valence(a.el) - g.used(x) - 1
			sb.WriteString("[" + a.el)
			if h > 0 {
				sb.WriteString("H")
				if h > 1 {
					sb.WriteString(strconv.Itoa(h))
				}
			}
			sb.WriteString("]")
		} else {
			sb.WriteString(a.el)
		}
		for _, k := range closeAt[x] {
			if d, ok := openRing[k]; ok {
				sb.WriteString(bondSym(g.bonds[k].order) + strconv.Itoa(d))
				delete(openRing, k)
			} else {
				openRing[k] = nextDigit
				sb.WriteString(bondSym(g.bonds[k].order) + strconv.Itoa(nextDigit))
				nextDigit++
			}
		}
		var children []int
		for _, b := range g.atoms[x].bonds {
			y := g.bonds[b].a
			if y == x {
				y = g.bonds[b].b
			}
			if tree[b] && !usedBond[b] && !visited[y] {
				children = append(children, b)
			}
		}
		for i, b := range children {
			usedBond[b] = true
			y := g.bonds[b].a
			if y == x {
				y = g.bonds[b].b
			}
			if i < len(children)-1 {
				sb.WriteString("(" + bondSym(g.bonds[b].order))
				write(y)
				sb.WriteString(")")
			} else {
				sb.WriteString(bondSym(g.bonds[b].order))
				write(y)
			}
		}
	}
	write(0)
	return sb.String()
}

// radicalSite picks a carbon that carries a hydrogen, or -1.
func (g *graph) radicalSite(r *rand.Rand) int {
	var cands []int
	for i, a := range g.atoms {
		if a.el == "C" && g.used(i) < 4 {
			cands = append(cands, i)
		}
	}
	if len(cands) == 0 {
		return -1
	}
	return cands[r.Intn(len(cands))]
}

// core species every generated mechanism declares.
const core = `species H [H]
species H2 [H][H]
species OH [OH]
species H2O O
species HO2 O[O]
species H2O2 OO
species O2 O=O
`

// Generate returns the text of a mechanism with opts.Molecules molecules.
func Generate(opts Options) []byte {
	if opts.MaxHeavy <= 0 {
		opts.MaxHeavy = 12
	}
	r := rand.New(rand.NewSource(opts.Seed))
	var buf bytes.Buffer
	fmt.Fprintf(&buf, "# generated mechanism: %d molecules, seed %d (test data, not chemistry)\n", opts.Molecules, opts.Seed)
	buf.WriteString("units kcal/mol\n\n")
	buf.WriteString(core)
	seen := map[string]bool{}
	var reactions bytes.Buffer
	count := 0
	for attempts := 0; count < opts.Molecules && attempts < opts.Molecules*50; attempts++ {
		n := 2 + r.Intn(opts.MaxHeavy-1)
		g := randomMolecule(r, n)
		smi := g.smiles()
		m, err := molecule.ParseSMILES(smi)
		if err != nil {
			continue
		}
		key := m.Canonical()
		if seen[key] {
			continue
		}
		site := g.radicalSite(r)
		if site < 0 {
			continue
		}
		g.atoms[site].rad = true
		rsmi := g.smiles()
		g.atoms[site].rad = false
		if _, err := molecule.ParseSMILES(rsmi); err != nil {
			continue
		}
		seen[key] = true
		count++
		name := fmt.Sprintf("M%d", count)
		rname := fmt.Sprintf("R%d", count)
		fmt.Fprintf(&buf, "species %s %s\n", name, smi)
		fmt.Fprintf(&buf, "species %s %s\n", rname, rsmi)
		a := 1e12 * (1 + r.Float64()*9)
		fmt.Fprintf(&reactions, "reaction %s + OH <=> %s + H2O  A=%.3e n=0 Ea=%.2f\n", name, rname, a, 0.5+r.Float64()*2)
		fmt.Fprintf(&reactions, "reaction %s + H <=> %s + H2  A=%.3e n=2 Ea=%.2f\n", name, rname, a/1e6, 4+r.Float64()*4)
		fmt.Fprintf(&reactions, "reaction %s + HO2 <=> %s + H2O2  A=%.3e n=0 Ea=%.2f\n", name, rname, a/10, 15+r.Float64()*5)
	}
	buf.WriteString("\n")
	buf.Write(reactions.Bytes())
	return buf.Bytes()
}
