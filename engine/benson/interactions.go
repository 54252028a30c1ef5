package benson

// Non-next-nearest-neighbour corrections, counted on the closed-shell graph.
//
// Gauche (Benson 1976): for every acyclic single
// bond x–y between two sp3 carbons, let a and b be the numbers of carbon
// neighbours of x and y other than each other. The most stable staggered
// rotamer then has g(a,b) gauche pairs: g = 0 if a or b is 0 or a = b = 1;
// g(1,2) = 1, g(1,3) = 2, g(2,2) = 2, g(2,3) = 4, g(3,3) = 6.
//
// 1,5 (syn-pentane) interaction (Benson 1976): for every sp3 carbon c with
// two acyclic sp3-carbon neighbours p and q carrying n_p and n_q further
// carbon neighbours, one interaction when {n_p, n_q} = {3, 2}, two when
// n_p = n_q = 3 (a quaternary carbon on both sides), none otherwise.
//
// Cis (Benson 1976): for every acyclic C=C bond, one per pair of carbon
// substituents on opposite ends that are cis. With / \ marks the geometry is
// read from the SMILES; without, the least strained isomer is assumed, i.e.
// max(0, n_x + n_y − 2) cis pairs (trans for 1,2-disubstituted alkenes).
// Ring double bonds get none (ring corrections include it).
//
// Ortho (Benson 1976): one per pair of adjacent Cb atoms of a benzene ring
// that both carry a non-H substituent, unless the two substituents close a
// ring with them (indane, tetralin: the ring correction covers it).

var gaucheCount = [4][4]int{
	{0, 0, 0, 0},
	{0, 0, 1, 2},
	{0, 1, 2, 4},
	{0, 2, 4, 6},
}

// carbonNeighbours counts carbon neighbours of x other than not.
func (g *graph) carbonNeighbours(x, not int) int {
	n := 0
	for _, y := range g.nbr[x] {
		if y != not && g.isCarbon(y) {
			n++
		}
	}
	return n
}

func addInteractions(g *graph, l lookup, est *Result) {
	m := g.m
	gauche, syn, cis, ortho := 0, 0, 0, 0
	var orthoHal [len(orthoHalogenKeys)]int // halogen pairs with their own correction (hetero_sx.go)
	for e, b := range m.Bonds {
		x, y := b.A, b.B
		if g.ringBond[e] || g.order(e) != 1 || g.typ[x] != "C" || g.typ[y] != "C" {
			continue
		}
		a, c := g.carbonNeighbours(x, y), g.carbonNeighbours(y, x)
		if a <= 3 && c <= 3 {
			gauche += gaucheCount[a][c]
		}
	}
	for c := range m.Atoms {
		if g.typ[c] != "C" {
			continue
		}
		var buf [8]int // the arms of one carbon: at most 4 in practice, kept on the stack
		arms := buf[:0]
		for k, p := range g.nbr[c] {
			if g.typ[p] == "C" && !g.ringBond[g.nbrBond[c][k]] {
				arms = append(arms, p)
			}
		}
		for i := 0; i < len(arms); i++ {
			for j := i + 1; j < len(arms); j++ {
				np, nq := g.carbonNeighbours(arms[i], c), g.carbonNeighbours(arms[j], c)
				switch {
				case np == 3 && nq == 3:
					syn += 2
				case np == 3 && nq == 2, np == 2 && nq == 3:
					syn++
				}
			}
		}
	}
	for e, b := range m.Bonds {
		if g.ringBond[e] || g.order(e) != 2 || g.typ[b.A] != "Cd" || g.typ[b.B] != "Cd" {
			continue
		}
		cis += g.cisPairs(e)
	}
	for ri, r := range g.rings {
		if !g.benzRing[ri] {
			continue
		}
		for k := range r {
			p, q := r[k], r[(k+1)%len(r)]
			sp, sq := g.substituent(p), g.substituent(q)
			if sp < 0 || sq < 0 {
				continue
			}
			if g.sameRing(p, q, sp, sq) {
				continue
			}
			if h, ok := g.orthoHalogen(sp, sq); ok { // hetero_sx.go
				orthoHal[h]++
				continue
			}
			ortho++
		}
	}
	for _, c := range [...]struct {
		key, name string
		n         int
	}{
		{"nni:gauche", "gauche interaction", gauche},
		{"nni:1,5", "1,5 interaction", syn},
		{"nni:cis", "cis interaction", cis},
		{"nni:ortho", "ortho interaction", ortho},
	} {
		if c.n == 0 {
			continue
		}
		t := term(l.corrections[c.key], c.n)
		t.Name = c.name
		est.Corrections = append(est.Corrections, t)
	}
	for h, n := range orthoHal {
		if n == 0 {
			continue
		}
		t := term(l.corrections[orthoHalogenKeys[h].key], n)
		t.Name = orthoHalogenKeys[h].name
		est.Corrections = append(est.Corrections, t)
	}
}

// substituent returns the heavy non-ring neighbour of a Cb atom, or -1.
func (g *graph) substituent(p int) int {
	if g.typ[p] != "Cb" {
		return -1
	}
	for k, s := range g.nbr[p] {
		if !g.benzBond[g.nbrBond[p][k]] {
			return s
		}
	}
	return -1
}

// ligands returns the heavy neighbours of end x of double bond e other than
// its partner y, in adjacency order.
func (g *graph) ligands(x, y int) []int {
	var out []int
	for _, z := range g.nbr[x] {
		if z != y {
			out = append(out, z)
		}
	}
	return out
}

// sides returns, for each heavy ligand of end x (partner y), whether it lies
// "above" the double bond as written with / and \ in the SMILES, and false
// when no ligand of x carries a mark. X/C=C/Y is trans; X/C=C\Y is cis.
func (g *graph) sides(x, y int) ([]bool, bool) {
	lig := g.ligands(x, y)
	out := make([]bool, len(lig))
	known := -1
	for k, z := range lig {
		b := g.bondBetween(x, z)
		s := g.m.Bonds[b].Stereo
		if s != '/' && s != '\\' {
			continue
		}
		zFirst := g.m.Atoms[z].Pos < g.m.Atoms[x].Pos
		out[k] = (s == '\\') == zFirst
		known = k
	}
	if known < 0 {
		return nil, false
	}
	for k := range lig {
		if k != known {
			b := g.bondBetween(x, lig[k])
			if s := g.m.Bonds[b].Stereo; s != '/' && s != '\\' {
				out[k] = !out[known]
			}
		}
	}
	return out, true
}

// cisPairs counts cis pairs of carbon substituents across double bond e.
func (g *graph) cisPairs(e int) int {
	x, y := g.m.Bonds[e].A, g.m.Bonds[e].B
	lx, ly := g.ligands(x, y), g.ligands(y, x)
	nx, ny := 0, 0
	for _, z := range lx {
		if g.isCarbon(z) {
			nx++
		}
	}
	for _, z := range ly {
		if g.isCarbon(z) {
			ny++
		}
	}
	if nx == 0 || ny == 0 {
		return 0
	}
	sx, okx := g.sides(x, y)
	sy, oky := g.sides(y, x)
	if !okx || !oky {
		if n := nx + ny - 2; n > 0 {
			return n
		}
		return 0
	}
	n := 0
	for i, a := range lx {
		for j, b := range ly {
			if g.isCarbon(a) && g.isCarbon(b) && sx[i] == sy[j] {
				n++
			}
		}
	}
	return n
}
