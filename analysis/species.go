package analysis

import (
	"errors"
	"fmt"
	"io/fs"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/speciesfile"
)

// species resolves every species declaration in scope: structure, given
// thermo, estimate, and the checks that compare them. The rules of each
// declaration (speciesRules) form one memoized unit; duplicate names and
// structures are checked across declarations on every analysis.
func (a *analysis) species() error {
	user := a.setUserGroups() // before the workers read userKey and userFlags
	nSpecies := 0
	for _, path := range a.order {
		nSpecies += len(a.res.Files[path].Species)
	}
	// Messages are written in the analysed file's display units.
	a.memo = a.w.startMemo(a.res.Path, a.set, a.userKey+"|"+a.res.Units().EnergyName())
	a.res.ByName = make(map[string]*Species, nSpecies)
	a.res.Species = make([]*Species, 0, nSpecies)
	a.spStart = make([]int, 0, nSpecies)

	type item = speciesItem
	sc := a.w.scratch()
	defer a.w.release(sc)
	items := slices.Grow(sc.items[:0], nSpecies)
	defer func() { sc.items = items }()
	var todo []int
	for _, path := range a.order {
		f := a.res.Files[path]
		for k, d := range f.Species {
			if err := a.ctx.Err(); err != nil {
				return err
			}
			if !speciesfile.ValidName(d.Name.Text) {
				// The reader reported the name (missing, a number, a
				// reserved word): input that failed to parse is not data.
				continue
			}
			name := d.Name.Text
			nameSpan := d.Name.Span.At(f.SpeciesStart(k))
			if first, dup := a.res.ByName[name]; dup {
				// An error: a simulator reading the file may take either
				// declaration.
				loc := a.res.SpeciesLoc(first)
				where := a.where(loc)
				a.reportNamingLine(path, speciesfile.Diagnostic{Span: nameSpan, Severity: speciesfile.SeverityError, Code: speciesfile.CodeDuplicateSpecies,
					Message: fmt.Sprintf("species %s is already declared (%s); a name may be declared once (kiln ignores this declaration, other programs may not)", name, where),
					Related: []speciesfile.Related{{File: first.File, Span: loc.Span, Message: "first declaration of " + name}}}, loc, where)
				continue
			}
			u := a.memo.species(path, f, k)
			sp := a.memo.oldSpecies(path, f, k, u)
			reused := sp != nil
			if !reused {
				sp = &Species{Name: name, File: path, Decl: d, Source: SourceNone}
			}
			a.res.ByName[name] = sp
			a.res.Species = append(a.res.Species, sp)
			a.spStart = append(a.spStart, f.SpeciesStart(k))
			if u == nil {
				todo = append(todo, len(items))
			}
			items = append(items, item{path: path, f: f, k: k, sp: sp, u: u, reused: reused})
		}
	}
	// The names whose unit is recomputed: every other declared name stands
	// for the same unit as in the last analysis (a declaration that kept its
	// unit was the first of its name then too: only first declarations
	// have units), so reaction units naming none of them stay valid.
	if a.memo != nil {
		a.memo.changed = make(map[string]bool, len(todo))
		for _, k := range todo {
			a.memo.changed[items[k].sp.Name] = true
		}
		if len(a.memo.changed) <= maxChangedList {
			a.memo.changedList = make([]string, 0, len(a.memo.changed))
			for name := range a.memo.changed {
				a.memo.changedList = append(a.memo.changedList, name)
			}
		}
		a.memo.namesKept = a.memo.sameNames(a.order, a.res.Files)
	}
	// Units not kept from the last analysis are computed on all cores: each
	// reads only its own declaration and the (concurrency-safe) caches.
	err := a.parallel(len(todo), 16, func(k int) {
		it := &items[todo[k]]
		var diags []speciesfile.Diagnostic
		unit := *a
		unit.sink = &diags
		unit.stmtStart = it.f.SpeciesStart(it.k)
		unit.stmtBase = unit.stmtStart
		if a.memo != nil {
			// the unit keeps spans relative to the statement's body
			unit.stmtBase = -it.sp.Decl.Body().From
		}
		unit.speciesRules(it.path, it.sp, user)
		if a.memo == nil {
			it.diags = diags
			return
		}
		it.u = newSpeciesUnit(it.f.EnergyUnit, it.sp, diags, unit.stmtStart+it.sp.Decl.Body().From)
	})
	if err != nil {
		return err
	}
	n := len(a.res.Diagnostics)
	for _, it := range items {
		if it.path == a.res.Path && it.u != nil {
			n += len(it.u.diags)
		}
		if it.path == a.res.Path {
			n += len(it.diags)
		}
	}
	a.res.Diagnostics = slices.Grow(a.res.Diagnostics, n-len(a.res.Diagnostics)+len(a.res.Species)/8)
	byStructure := &sc.structs
	spAt := func(i int32) *Species { return items[i].sp }
	for i, it := range items {
		sp := it.sp
		if it.u != nil {
			if !it.reused {
				it.u.apply(sp, a.memo != nil)
			}
			a.memo.keepSpecies(it.path, it.k, it.u, sp)
			if it.path == a.res.Path {
				a.res.Diagnostics = appendRelocated(a.res.Diagnostics, it.u.diags, it.path, it.f.SpeciesStart(it.k)+sp.Decl.Body().From)
			}
		} else if it.path == a.res.Path {
			a.res.Diagnostics = append(a.res.Diagnostics, it.diags...)
		}
		if sp.Mol != nil {
			if j := sameStructure(byStructure, spAt, int32(i)); j >= 0 {
				first := items[j]
				a.reportSameStructure(it.path, sp, first.sp, it.f.SpeciesStart(it.k),
					Location{File: first.path, Span: first.sp.Decl.Name.Span.At(first.f.SpeciesStart(first.k))})
			}
		}
	}
	for _, g := range a.res.Groups {
		for _, sp := range a.res.Species {
			if sp.Estimate != nil && sp.Estimate.Group != nil {
				for _, t := range sp.Estimate.Group.Groups {
					if t.Name == g.Name {
						g.UsedBy = append(g.UsedBy, sp.Name)
						break
					}
				}
			}
		}
	}
	return nil
}

// compositionOf returns the element counts of d's composition line, with
// the first symbol that is not a chemical element ("" when all are); nil
// without a (valid) composition line.
func compositionOf(d *speciesfile.Species) (comp map[string]int, notElement string) {
	if len(d.Formula) == 0 {
		return nil, ""
	}
	comp = make(map[string]int, len(d.Formula))
	for _, ec := range d.Formula {
		if _, ok := molecule.AtomicWeight(ec.Symbol); !ok {
			return nil, ec.Symbol
		}
		comp[ec.Symbol] += ec.Count
	}
	return comp, ""
}

// composition reads d's composition line: an error for a symbol that is not
// a chemical element (the line is then not data), a warning when the
// species also has a structure and the two formulas disagree (the structure
// is used), else the composition of a lumped species.
func (a *analysis) composition(path string, sp *Species) {
	d := sp.Decl
	comp, bad := compositionOf(d)
	switch {
	case bad != "":
		a.report(path, speciesfile.Diagnostic{Span: a.at(d.Composition.Span), Severity: speciesfile.SeverityError, Code: speciesfile.CodeSyntax,
			Message: fmt.Sprintf("composition %s: %q is not a chemical element symbol", d.Composition.Text, bad)})
	case comp == nil:
	case sp.Mol != nil:
		if got := molecule.HillFormula(comp); got != sp.Formula {
			a.report(path, speciesfile.Diagnostic{Span: a.at(d.Composition.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeCompositionMismatch,
				Message: fmt.Sprintf("composition %s disagrees with the SMILES, which gives %s; kiln uses the SMILES (balance, molar mass, thermo)", got, sp.Formula)})
		}
	default:
		sp.Composition = comp
		sp.Formula = molecule.HillFormula(comp)
		sp.MolarMass = MolarMassOf(comp)
	}
}

// speciesRules runs the rules of one species declaration that read nothing
// but the declaration (and the settings and user groups): structure,
// composition, estimate, given thermo and the checks comparing them.
func (a *analysis) speciesRules(path string, sp *Species, user []benson.GroupValue) {
	a.structure(path, sp)
	a.composition(path, sp) // the parser reports a malformed composition line
	if sp.Mol != nil {
		sp.structKey = sp.inv + "|m" + strconv.Itoa(effectiveMultiplicity(a.w.cache.lib, sp))
		a.estimateSpecies(path, sp, user)
		if e := sp.Estimate; e != nil && e.Group != nil && e.Group.Form != "" {
			// A radical with several resonance structures is one species
			// whichever is written: its key is the representative structure
			// the estimate chose (engine/benson/resonance.go), so that
			// propargyl written as [CH2]C#C and as C=C=[CH] are found to be
			// the same structure.
			sp.structKey = resonanceKeyPrefix + e.Group.Form + "|m" + strconv.Itoa(effectiveMultiplicity(a.w.cache.lib, sp))
		}
		if name := libraryEntry(a.w.cache.lib, sp); name != "" {
			// Spellings of one reference-library species are one species
			// (compare_include.go libraryEntry).
			sp.structKey = libraryKeyPrefix + name
		}
		sp.structHash = hashKey(sp.structKey)
	}
	a.given(path, sp)
	a.reportApproximations(path, sp)
	a.thermoChecks(path, sp)
}

// resonanceKeyPrefix marks a duplicate-search key made from a radical's
// representative resonance structure (a canonical SMILES) rather than from a
// graph invariant.
const resonanceKeyPrefix = "resonance|"

// libraryKeyPrefix marks a duplicate-search key made from the name of the
// reference-library entry a species takes its data from (an entry is one
// structure and multiplicity).
const libraryKeyPrefix = "library|"

// sameStructure returns the first species in seen with the structure and
// multiplicity of sp, and records sp. Species are bucketed by a cheap graph
// invariant first; canonical forms are computed only within a bucket, so
// most species never need one.
//
// The map is keyed by a hash of the bucket key made once per unit (hashing
// the long keys of every species on every analysis cost more than the rest
// of the search); species of other keys sharing a hash are skipped.
//
// Species are named by their index i in a list (spAt gives the species);
// the result is the index of the first, -1 when there is none.
func sameStructure(seen *structBuckets, spAt func(int32) *Species, i int32) int32 {
	sp := spAt(i)
	k := sp.structKey
	ends, hashed := seen.ends[sp.structHash]
	if hashed {
		resonance := strings.HasPrefix(k, resonanceKeyPrefix) || strings.HasPrefix(k, libraryKeyPrefix)
		for j := ends[0]; j >= 0; j = seen.next[j] {
			other := spAt(j)
			if other.structKey != k {
				continue
			}
			if resonance {
				return j // the key is the canonical representative itself
			}
			if identity(other.Mol) == identity(sp.Mol) {
				return j
			}
		}
	}
	for len(seen.next) <= int(i) {
		seen.next = append(seen.next, -1)
	}
	seen.next[i] = -1
	if hashed {
		seen.next[ends[1]] = i
		ends[1] = i
	} else {
		ends = [2]int32{i, i}
	}
	seen.ends[sp.structHash] = ends
	return -1
}

// structBuckets are the buckets of the duplicate-structure search: species
// indexes by structure hash, each bucket in the order the species were
// recorded (a chain through next; no slice per bucket).
type structBuckets struct {
	ends map[uint64][2]int32 // the first and last index of each bucket
	next []int32             // next[i]: the index after i in its bucket, -1 for none
}

// hashKey is the 64-bit FNV-1a hash of s.
func hashKey(s string) uint64 {
	h := uint64(14695981039346656037)
	for i := 0; i < len(s); i++ {
		h ^= uint64(s[i])
		h *= 1099511628211
	}
	return h
}

// invariant is a cheap fingerprint of a molecular graph that equal graphs
// share: a 128-bit hash of the multiset of atom labels after one round of
// neighbour refinement, where an atom's label is its (element, isotope,
// charge, radical electrons, H count, aromatic flag) and the refined label
// adds the multiset of (bond order, neighbour label) pairs. Equal graphs
// always share it; different graphs rarely do (a shared fingerprint only
// costs a comparison of canonical forms), so canonical forms are needed only
// when two species do. It starts with a zero byte, so it never begins like
// a resonance key.
func invariant(m *molecule.Molecule) string { return fingerprint(m, false) }

// fingerprint is invariant's hash; with sigmaOnly it leaves out what moves
// between resonance structures — aromatic flags, radical electrons and bond
// orders — and so fingerprints the σ skeleton (atoms, hydrogen counts,
// charges, connectivity).
func fingerprint(m *molecule.Molecule, sigmaOnly bool) string {
	n := len(m.Atoms)
	codes := make([]uint64, 2*n)
	base, refined := codes[:n:n], codes[n:]
	for i, a := range m.Atoms {
		h := uint64(len(a.Element))
		for k := 0; k < len(a.Element); k++ {
			h = invMix(h<<8 ^ uint64(a.Element[k]))
		}
		ar, rad := uint64(0), uint64(a.Radical)
		if a.Aromatic {
			ar = 1
		}
		if sigmaOnly {
			ar, rad = 0, 0
		}
		for _, v := range [...]uint64{ar, uint64(a.Isotope), uint64(a.Charge), rad, uint64(a.HCount)} {
			h = invMix(h ^ invMix(v))
		}
		base[i] = h
	}
	var nb []uint64
	for i := range m.Atoms {
		nb = nb[:0]
		for _, b := range m.Adj[i] {
			order := m.Bonds[b].Order
			switch {
			case sigmaOnly:
				order = 0
			case m.Bonds[b].Aromatic:
				order = 4 // Kekulé orders differ between spellings of one ring
			}
			nb = append(nb, invMix(uint64(order)^invMix(base[m.Other(b, i)])))
		}
		slices.Sort(nb)
		h := invMix(base[i] ^ uint64(len(nb)))
		for _, x := range nb {
			h = invMix(h ^ x)
		}
		refined[i] = h
	}
	slices.Sort(refined)
	// two independent running hashes of the sorted labels
	h1, h2 := uint64(n), ^uint64(n)
	for _, x := range refined {
		h1 = invMix(h1 ^ x)
		h2 = invMix(h2 + x*0x9e3779b97f4a7c15)
	}
	var key [17]byte
	for k := 0; k < 8; k++ {
		key[1+k], key[9+k] = byte(h1>>(8*k)), byte(h2>>(8*k))
	}
	return string(key[:])
}

// invMix is a 64-bit finaliser (splitmix64).
func invMix(x uint64) uint64 {
	x += 0x9e3779b97f4a7c15
	x = (x ^ (x >> 30)) * 0xbf58476d1ce4e5b9
	x = (x ^ (x >> 27)) * 0x94d049bb133111eb
	return x ^ (x >> 31)
}

// parsed is a species declaration's structure, read ahead of the
// sequential pass.
type parsed struct {
	mol *molecule.Molecule
	err error
	// Properties derived once per structure (the molecule is read-only).
	formula     string
	composition map[string]int
	charge      int
	molarMass   float64
	ident       string // estimate-cache key of the structure
	inv         string // invariant(mol)
}

func (a *analysis) estimateOptions(d *speciesfile.Species, user []benson.GroupValue) EstimateOptions {
	return EstimateOptions{
		userKey:        a.userKey,
		userFlags:      a.userFlags,
		Multiplicity:   intAttr(d.Multiplicity),
		Symmetry:       intAttr(d.Symmetry),
		OpticalIsomers: intAttr(d.OpticalIsomers),
		UserGroups:     user,
		TMid:           a.set.TMid,
		THigh:          a.set.THigh,
		ExplicitRange:  a.set.ExplicitFitRange,
	}
}

func intAttr(a *speciesfile.IntAttr) int {
	if a == nil {
		return 0
	}
	return a.Value
}

// where describes a location for messages: "line 12" in the analysed file,
// "common.kiln:12" elsewhere.
func (a *analysis) where(l Location) string {
	f := a.res.Files[l.File]
	if f == nil {
		return l.File
	}
	line := f.Lines.Position(l.Span.Start).Line + 1
	if l.File == a.res.Path {
		return fmt.Sprintf("line %d", line)
	}
	return fmt.Sprintf("%s:%d", shortPath(l.File), line)
}

func shortPath(p string) string {
	i := strings.LastIndexAny(p, `/\`)
	return p[i+1:]
}

func (a *analysis) estimateSpecies(path string, sp *Species, user []benson.GroupValue) {
	d := sp.Decl
	e, err := a.w.cache.get(sp.ident, sp.Mol, a.estimateOptions(d, user))
	if err != nil {
		sp.estimateErr = err
		var mg *benson.MissingGroupError
		if errors.As(err, &mg) {
			// The root cause, reported once: without a usable thermo block
			// the species has no thermo at all (an error, and no separate
			// missing-thermo); with one, only the comparison is lost.
			sev, then := speciesfile.SeverityWarning, "; define it with a `group` statement"
			if !a.hasUsableBlock(path, d) {
				sev, then = speciesfile.SeverityError, ", so its thermo cannot be estimated; define the group with a `group` statement or add a nasa7 or thermo-table block"
			}
			sp.rootReported = true
			a.report(path, speciesfile.Diagnostic{Span: a.at(d.SMILES.Span), Severity: sev, Code: speciesfile.CodeMissingGroup,
				Message: fmt.Sprintf("%s: no value for group %s and no group close enough to stand in%s%s", sp.Name, mg.Group, mg.Detail(), then)})
		}
		return
	}
	sp.Estimate = e
}

// reportApproximations reports the approximations of sp's estimate (after
// the given block is read): a warning, or information when the species has
// a usable block of its own that is not simply the estimate as `kiln fill`
// wrote it (givenIsEstimate) — such a block replaces the estimate, which
// then serves only the comparison with it.
func (a *analysis) reportApproximations(path string, sp *Species) {
	e, d := sp.Estimate, sp.Decl
	if e == nil {
		return
	}
	if miss := e.Flags(); len(miss) > 0 {
		// Group values the user can supply with a `group` statement, and
		// other approximations (radical sites, ring systems, delocalisation,
		// S° below its physical bound) that only a thermo block replaces.
		// Every approximation of the estimate is reported, worded as
		// estimate, summary and hover word it; what a validated model
		// computes (a radical site's S°/Cp change) is shown there, not here.
		var groups, kept, others, entropy, unsound []string
		for _, m := range miss {
			if m.Modelled() {
				continue // a validated model, shown with the estimate, not a warning
			}
			if isUserCpFlag(m.Missing) {
				continue // reported once, on the group's `cp` line
			}
			s := FlagText(m)
			switch _, err := benson.ParseGroupName(m.Group); {
			case BeyondBound(m.Missing):
				unsound = append(unsound, s)
			case err != nil && m.EntropyOnly():
				entropy = append(entropy, s)
			case err != nil:
				others = append(others, s)
			case UsedAsItStands(m.Missing):
				// The group's own value, used with a known shortcoming
				// (no interaction term, a biased published value).
				kept = append(kept, s)
			default:
				groups = append(groups, s)
			}
		}
		var msg []string
		if len(groups) > 0 {
			msg = append(msg, fmt.Sprintf("no value for group %s; define it with a `group` statement to replace the approximation", strings.Join(groups, ", ")))
		}
		if len(kept) > 0 {
			msg = append(msg, fmt.Sprintf("flagged group value: %s; a `group` statement replaces it", strings.Join(kept, ", ")))
		}
		if len(others) > 0 {
			msg = append(msg, fmt.Sprintf("estimated with an approximation kiln has no data for: %s; its uncertainty is widened (a thermo block with measured or computed values replaces the estimate)", strings.Join(others, ", ")))
		}
		if len(entropy) > 0 {
			// S°/Cp-only approximations leave ΔHf° and its uncertainty
			// as the groups give them; saying "widened" would overstate.
			msg = append(msg, fmt.Sprintf("S° and Cp estimated with an approximation kiln has no data for: %s; ΔHf° and its uncertainty are not affected (a thermo block with measured or computed values replaces the estimate)", strings.Join(entropy, ", ")))
		}
		if len(unsound) > 0 {
			// Beyond a physical bound: fill writes no block from it
			// (Estimate.NASA7 refuses), so check says so before fill.
			msg = append(msg, fmt.Sprintf("the estimate is beyond a physical bound: %s; kiln writes no NASA-7 block from it (a thermo block with measured or computed values replaces the estimate)", strings.Join(unsound, ", ")))
		}
		if len(msg) > 0 {
			// With a usable thermo block of its own (other than the
			// estimate itself, as fill writes it) the species' thermo is
			// the file's; the approximate estimate only serves the
			// comparison with the block, which is worth knowing, not a
			// warning.
			sev, used := speciesfile.SeverityWarning, ""
			if sp.Given != nil && !sp.givenIsEstimate() { // given has read the usable block
				sev, used = speciesfile.SeverityInformation, " (the file's thermo block is used; the estimate serves only the comparison with it)"
			}
			a.report(path, speciesfile.Diagnostic{Span: a.at(d.SMILES.Span), Severity: sev, Code: speciesfile.CodeMissingGroup,
				Message: sp.Name + ": " + strings.Join(msg, "; also ") + used})
		}
	}
}

// hasUsableBlock reports whether declaration d has a thermo block without
// syntax errors and without values that overflow (overflowSpan): a block the
// reader could not read completely, or that kiln cannot evaluate, is not data.
func (a *analysis) hasUsableBlock(path string, d *speciesfile.Species) bool {
	if d.NASA7 == nil && d.Table == nil {
		return false
	}
	_, _, finite := overflowSpan(d)
	return finite && !a.errorIn(path, blockSpan(d))
}

// blockSpan is the span of d's thermo block (d has one).
func blockSpan(d *speciesfile.Species) speciesfile.RelSpan {
	if d.NASA7 != nil {
		return d.NASA7.Span
	}
	return d.Table.Span
}

// given converts the species' own thermo block, if any. A block with a
// syntax error is ignored (the syntax error says what to fix); the species
// is then estimated like one without a block.
func (a *analysis) given(path string, sp *Species) {
	d := sp.Decl
	if (d.NASA7 != nil || d.Table != nil) && !a.hasUsableBlock(path, d) {
		sp.brokenBlock = true
		if tok, msg, ok := overflowSpan(d); !ok && !a.errorIn(path, blockSpan(d)) {
			a.report(path, speciesfile.Diagnostic{Span: a.at(tok.Span), Severity: speciesfile.SeverityError, Code: speciesfile.CodeNonphysicalThermo,
				Message: sp.Name + ": " + msg})
			sp.overflowBlock = true
		}
		return
	}
	switch {
	case d.NASA7 != nil:
		b := d.NASA7
		p := nasa.NASA7{TLow: b.TLow.Value, TMid: b.TMid.Value, THigh: b.THigh.Value}
		for i := 0; i < 7; i++ {
			p.Low[i] = b.Low[i].Value
			p.High[i] = b.High[i].Value
		}
		sp.Given = &GivenThermo{Poly: &p, Span: b.Span}
	case d.Table != nil:
		t := d.Table
		if t.Hf298 == nil || t.S298 == nil {
			return // the parser reports the missing line
		}
		tab := &Table{Hf298: t.Hf298.SI, S298: t.S298.SI}
		for _, p := range t.Cp {
			tab.T = append(tab.T, p.T.SI)
			tab.Cp = append(tab.Cp, p.Cp.SI)
		}
		g := &GivenThermo{Table: tab, Span: t.Span}
		if len(tab.T) > 0 {
			g.model = newGroupThermo(tab.Hf298, tab.S298, tab.T, tab.Cp)
		}
		sp.Given = g
	default:
		return
	}
	sp.Source = SourceFile
}

// shapeOf returns the atom count, linearity and rotor count of a species,
// from its structure or, failing that, its composition (taken as non-linear
// and without rotors).
func (a *analysis) shapeOf(sp *Species) (int, bool, int) {
	if sp.Mol != nil {
		return shape(sp.Mol)
	}
	n := 0
	for _, c := range sp.Composition {
		n += c
	}
	if n == 0 {
		n = 3
	}
	return n, n <= 2, 0
}

// thermoChecks compares given and estimated thermo and reports blocks that
// are unsound or missing.
func (a *analysis) thermoChecks(path string, sp *Species) {
	d := sp.Decl
	if sp.Given == nil {
		block := "no thermo block"
		if sp.brokenBlock {
			block = "its thermo block has " + sp.blockFault() + " and is ignored"
		}
		if sp.Estimate != nil {
			sp.Source = SourceEstimate
			a.report(path, speciesfile.Diagnostic{Span: a.at(d.Name.Span), Severity: speciesfile.SeverityInformation, Code: speciesfile.CodeMissingThermo,
				Message: fmt.Sprintf("%s: %s; %s %s", sp.Name, block, estimateWord(sp.Estimate), a.thermoSummary(sp.Estimate.Hf298, sp.Estimate.S298))})
			return
		}
		if sp.SMILESError != nil || sp.rootReported {
			return // bad-smiles or missing-group already says what to fix
		}
		if sp.Mol == nil && a.errorIn(path, d.Name.Span) {
			return // the reader's error on the declaration says what is missing
		}
		why := "it has no structure (SMILES) to estimate from"
		if sp.estimateErr != nil {
			why = sp.Refusal()
		}
		what := "has no thermo block"
		if sp.brokenBlock {
			what = "has no usable thermo block (" + sp.blockFault() + ", reported above)"
		}
		route := "; add a nasa7 or thermo-table block"
		if sp.estimateErr != nil && RefusalGivesRoute(RefusalReason(sp.estimateErr)) {
			route = "" // the reason already gives the route
		}
		a.report(path, speciesfile.Diagnostic{Span: a.at(d.Name.Span), Severity: speciesfile.SeverityError, Code: speciesfile.CodeMissingThermo,
			Message: fmt.Sprintf("%s %s and %s%s", sp.Name, what, why, route)})
		return
	}
	g := sp.Given
	before := a.reported()
	if g.Poly != nil {
		cpMax := 0.0
		if sp.Mol != nil || len(sp.Composition) > 0 {
			n, lin, _ := a.shapeOf(sp)
			cpMax = nasa.CpCeiling(n, lin)
		}
		for _, p := range nasa.Check(*g.Poly, nasa.Tolerances{}, cpMax) {
			code := speciesfile.CodeNonphysicalThermo
			if p.Kind == "discontinuity" {
				code = speciesfile.CodeThermoDiscontinuity
			}
			span := d.NASA7.Span
			switch p.Part {
			case "low":
				span = d.NASA7.LowSpan
			case "high":
				span = d.NASA7.HighSpan
			case "ranges":
				span = speciesfile.RelSpan{From: d.NASA7.TLow.Tok.Span.From, To: d.NASA7.THigh.Tok.Span.To}
			}
			a.report(path, speciesfile.Diagnostic{Span: a.at(span), Severity: speciesfile.SeverityWarning, Code: code, Message: sp.Name + ": " + a.problemMessage(p)})
		}
	}
	if g.Table != nil {
		a.tableChecks(path, sp)
	}
	a.cpFloor(path, sp)
	defects := a.reported() > before
	if sp.Estimate == nil {
		return
	}
	hf, s, ok := sp.givenAt298()
	if !ok {
		return
	}
	dh, ds := hf-sp.Estimate.Hf298, s-sp.Estimate.S298
	// A table's mismatch points at the hf298 or s298 line; a polynomial's
	// at the block header.
	hfSpan, sSpan := g.Span, g.Span
	if t := d.Table; t != nil {
		hfSpan, sSpan = t.Hf298.Tok.Span, t.S298.Tok.Span
	} else if d.NASA7 != nil {
		hfSpan = d.NASA7.Header.Span
		sSpan = hfSpan
	}
	// What the block is compared with: an estimate, or reference data
	// (whose source may state a ± wider than the threshold: a block within
	// it is not flagged).
	other, limit, why := "estimated", a.set.MismatchHf298, ""
	if lib := sp.Estimate.Library; lib != "" {
		other = "reference library " + lib
		if st := sp.Estimate.StatedUncertainty; st > limit {
			limit, why = st, ": the ± its source gives"
		}
	}
	if math.Abs(dh) > limit {
		a.report(path, speciesfile.Diagnostic{Span: a.at(hfSpan), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoMismatch,
			Message: fmt.Sprintf("%s: ΔHf°298 given %s vs %s %s (difference %s, threshold %s%s)",
				sp.Name, a.energy(hf), other, a.energy(sp.Estimate.Hf298), a.energy(dh), a.energy(limit), why)})
	}
	if math.Abs(ds) > a.set.MismatchS298 {
		a.report(path, speciesfile.Diagnostic{Span: a.at(sSpan), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoMismatch,
			Message: fmt.Sprintf("%s: S°298 given %s vs %s %s (difference %s, threshold %s)",
				sp.Name, a.entropy(s), other, a.entropy(sp.Estimate.S298), a.entropy(ds), a.entropy(a.set.MismatchS298))})
	}
	if !defects {
		// A block with a defect of its own (reported above) is not also
		// compared point by point: the defect is the root cause.
		a.compareOverRange(path, sp, hfSpan)
	}
}

// compareOverRange compares the given block with the estimate (or library
// value) over the temperatures both cover, and reports the worst point:
//
//   - Cp(T), threshold Settings.MismatchCp;
//   - H(T) − H(298.15 K), threshold Settings.MismatchHf298 (reported only
//     when Cp is within its threshold: a Cp difference is the root cause).
//
// The estimate covers its group values' temperatures (300–1500 K; beyond
// them it is an extrapolation, not data), a library species its polynomial's
// range. Temperatures: the estimate's points for group values, every 50 K
// for a library polynomial.
func (a *analysis) compareOverRange(path string, sp *Species, span speciesfile.RelSpan) {
	g, e := sp.Given, sp.Estimate
	lo, hi := g.Range()
	var temps []float64
	what := "estimated"
	if e.Library != "" {
		what = "reference"
		from, to := math.Max(lo, e.libPoly.TLow), math.Min(hi, e.libPoly.THigh)
		for t := math.Ceil(from/50) * 50; t <= to; t += 50 {
			temps = append(temps, t)
		}
	} else {
		for _, t := range benson.StdTemps {
			if t >= lo && t <= hi {
				temps = append(temps, t)
			}
		}
	}
	m := a.worstMismatch(g, e.curve(), temps)
	if !m.cpOver(a.set) && !m.hOver(a.set) {
		return
	}
	if e.Library == "" {
		// kiln's estimate exists in two evaluations: its group values
		// (above) and the NASA-7 polynomial it writes for them (`fill`, the
		// quick fix, `estimate --nasa`), which departs from them by the
		// fit's residual. A block within the thresholds of the polynomial
		// kiln itself writes is accepted: what fill writes, check accepts.
		if w, ok := e.written().(*nasa.NASA7); ok {
			if f := a.worstMismatch(g, w, temps); !f.cpOver(a.set) && !f.hOver(a.set) {
				return
			}
		}
	}
	if m.cpOver(a.set) {
		cpSpan := span
		if t := sp.Decl.Table; t != nil && len(t.Cp) > 0 {
			// A table's Cp mismatch points at the tabulated value nearest
			// the worst temperature.
			best := t.Cp[0]
			for _, p := range t.Cp {
				if math.Abs(p.T.SI-m.cpT) < math.Abs(best.T.SI-m.cpT) {
					best = p
				}
			}
			cpSpan = speciesfile.RelSpan{From: best.T.Tok.Span.From, To: best.Cp.Tok.Span.To}
		}
		a.report(path, speciesfile.Diagnostic{Span: a.at(cpSpan), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoMismatch,
			Message: fmt.Sprintf("%s: Cp at %g K given %s vs %s %s (difference %s, threshold %s)",
				sp.Name, m.cpT, a.entropy(m.cpGiven), what, a.entropy(m.cpRef), a.entropy(m.cp), a.entropy(a.set.MismatchCp))})
		return
	}
	a.report(path, speciesfile.Diagnostic{Span: a.at(span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoMismatch,
		Message: fmt.Sprintf("%s: H(%g K) − H(298 K) given %s vs %s %s (difference %s, threshold %s)",
			sp.Name, m.hT, a.energy(m.hGiven), what, a.energy(m.hRef), a.energy(m.h), a.energy(a.set.MismatchHf298))})
}

// mismatch is the worst difference between a given block and a reference
// curve over a set of temperatures: Cp, and H(T) − H(298.15 K).
type mismatch struct {
	cp, cpT, cpGiven, cpRef float64
	h, hT, hGiven, hRef     float64
}

// cpOver and hOver report whether the worst Cp or H difference is above its
// threshold (H is reported only when Cp is within its own: a Cp difference
// is the root cause).
func (m mismatch) cpOver(s Settings) bool { return math.Abs(m.cp) > s.MismatchCp }
func (m mismatch) hOver(s Settings) bool {
	return !m.cpOver(s) && math.Abs(m.h) > s.MismatchHf298
}

// worstMismatch compares given block g with ref at temps.
func (a *analysis) worstMismatch(g *GivenThermo, ref thermoCurve, temps []float64) mismatch {
	givenH := func(T float64) (float64, bool) {
		switch {
		case g.Poly != nil:
			return g.Poly.H(T) - g.Poly.H(T298), true
		case g.model != nil:
			return g.model.H(T) - g.model.H(T298), true
		}
		return 0, false
	}
	var m mismatch
	for _, T := range temps {
		if c, ok := g.CpAt(T); ok {
			if d := c - ref.Cp(T); math.Abs(d) > math.Abs(m.cp) {
				m.cp, m.cpT, m.cpGiven, m.cpRef = d, T, c, ref.Cp(T)
			}
		}
		if h, ok := givenH(T); ok && T > T298 {
			r := ref.H(T) - ref.H(T298)
			if d := h - r; math.Abs(d) > math.Abs(m.h) {
				m.h, m.hT, m.hGiven, m.hRef = d, T, h, r
			}
		}
	}
	return m
}

// problemMessage describes a defect of a polynomial in the display units,
// rounded for people.
func (a *analysis) problemMessage(p nasa.Problem) string {
	u := a.res.Units()
	switch p.Test {
	case "cp-jump":
		return fmt.Sprintf("Cp jumps by %s at %g K (low block %s, high block %s)", u.Entropy(p.Other-p.Value), p.T, u.Entropy(p.Value), u.Entropy(p.Other))
	case "h-jump":
		return fmt.Sprintf("H jumps by %s at %g K (low block %s, high block %s)", u.Energy(p.Other-p.Value), p.T, u.Energy(p.Value), u.Energy(p.Other))
	case "s-jump":
		return fmt.Sprintf("S jumps by %s at %g K (low block %s, high block %s)", u.Entropy(p.Other-p.Value), p.T, u.Entropy(p.Value), u.Entropy(p.Other))
	case "cp-falls":
		return fmt.Sprintf("Cp falls with temperature: %s at %.0f K, below the %s reached earlier", u.Entropy(p.Value), p.T, u.Entropy(p.Other))
	case "cp-nonpositive":
		return fmt.Sprintf("Cp is not positive: %s at %.0f K", u.Entropy(p.Value), p.T)
	case "cp-ceiling":
		return fmt.Sprintf("Cp = %s at %.0f K exceeds %s, the classical limit with the allowance for electronic states and anharmonicity", u.Entropy(p.Value), p.T, u.Entropy(p.Other))
	}
	return p.Message
}

// cpFloor reports given heat capacities below nasa.CpFloor, what every
// ideal-gas molecule of the species' shape has from translation and
// rotation alone (with its slack), from nasa.FloorFrom up: the first
// tabulated point below it, else the first sampled point of a polynomial
// (nasa.BelowFloor).
func (a *analysis) cpFloor(path string, sp *Species) {
	if sp.Mol == nil && len(sp.Composition) == 0 {
		return // shape unknown
	}
	n, lin, _ := a.shapeOf(sp)
	floor := nasa.CpFloor(n, lin)
	if floor <= 0 {
		return
	}
	d, g := sp.Decl, sp.Given
	report := func(span speciesfile.RelSpan, T, cp float64) {
		a.report(path, speciesfile.Diagnostic{Span: a.at(span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeNonphysicalThermo,
			Message: sp.Name + ": " + cpFloorMessage(a.res.Units(), T, cp, n, lin)})
	}
	if t := d.Table; t != nil && g.Table != nil {
		T, cp := make([]float64, len(t.Cp)), make([]float64, len(t.Cp))
		for i, p := range t.Cp {
			T[i], cp[i] = p.T.SI, p.Cp.SI
		}
		if i, ok := cpBelowFloor(n, lin, T, cp); ok {
			p := t.Cp[i]
			report(speciesfile.RelSpan{From: p.T.Tok.Span.From, To: p.Cp.Tok.Span.To}, p.T.SI, p.Cp.SI)
			return
		}
	}
	if b := d.NASA7; b != nil && g.Poly != nil {
		if part, T, c, ok := nasa.BelowFloor(*g.Poly, floor); ok {
			span := b.LowSpan
			if part == "high" {
				span = b.HighSpan
			}
			report(span, T, c)
		}
	}
}

// shapeWord names a molecular shape for messages.
func shapeWord(n int, linear bool) string {
	switch {
	case n == 1:
		return "atom"
	case linear:
		return "linear molecule"
	}
	return "non-linear molecule"
}

// tableChecks reports unsound tabulated Cp values.
func (a *analysis) tableChecks(path string, sp *Species) {
	t := sp.Decl.Table
	pts := append([]speciesfile.CpPoint(nil), t.Cp...)
	sort.SliceStable(pts, func(i, j int) bool { return pts[i].T.SI < pts[j].T.SI })
	for i, p := range pts {
		if p.Cp.SI <= 0 {
			a.report(path, speciesfile.Diagnostic{Span: a.at(p.Cp.Tok.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeNonphysicalThermo,
				Message: fmt.Sprintf("%s: Cp at %g K is not positive", sp.Name, p.T.SI)})
		}
		if p.T.SI <= 0 {
			a.report(path, speciesfile.Diagnostic{Span: a.at(p.T.Tok.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeNonphysicalThermo,
				Message: fmt.Sprintf("%s: temperature %g K is not positive", sp.Name, p.T.SI)})
		}
		// A fall is allowed within the polynomials' allowance
		// (nasa.DefaultTolerances().CpFall, 0.3 R): atoms and small radicals
		// with low electronic states (O, Cl, F) have Cp falling with T.
		if i > 0 && p.Cp.SI < pts[i-1].Cp.SI-nasa.DefaultTolerances().CpFall {
			a.report(path, speciesfile.Diagnostic{Span: a.at(p.Cp.Tok.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeNonphysicalThermo,
				Message: fmt.Sprintf("%s: Cp falls from %s at %g K to %s at %g K", sp.Name, a.entropy(pts[i-1].Cp.SI), pts[i-1].T.SI, a.entropy(p.Cp.SI), p.T.SI)})
		}
	}
	if t.S298 != nil && t.S298.SI <= 0 {
		a.report(path, speciesfile.Diagnostic{Span: a.at(t.S298.Tok.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeNonphysicalThermo,
			Message: fmt.Sprintf("%s: S°298 must be positive", sp.Name)})
	}
}

// givenAt298 returns ΔHf°298 and S°298 of the species' own block.
func (sp *Species) givenAt298() (hf, s float64, ok bool) {
	switch {
	case sp.Given == nil:
		return 0, 0, false
	case sp.Given.Table != nil:
		return sp.Given.Table.Hf298, sp.Given.Table.S298, true
	case sp.Given.Poly != nil:
		return sp.Given.Poly.H(T298), sp.Given.Poly.S(T298), true
	}
	return 0, 0, false
}

// T298 is the reference temperature, 298.15 K.
const T298 = 298.15

// Thermo returns the thermochemistry the analysis uses for the species: the
// file's polynomial where given, else the estimate's model; nil when there
// is none.
func (sp *Species) Thermo() kinetics.Thermo {
	switch sp.Source {
	case SourceFile:
		if sp.Given.Poly != nil {
			return sp.Given.Poly
		}
		if sp.Given.model != nil {
			return sp.Given.model
		}
	case SourceEstimate:
		return sp.Estimate.Thermo()
	}
	return nil
}

// Hf298S298 returns the 298 K values the analysis uses for the species.
func (sp *Species) Hf298S298() (hf, s float64, ok bool) {
	switch sp.Source {
	case SourceFile:
		return sp.givenAt298()
	case SourceEstimate:
		return sp.Estimate.Hf298, sp.Estimate.S298, true
	}
	return 0, 0, false
}

// CpAt returns Cp (J/(mol K)) at T (K) from the block: the polynomial
// inside [TLow, THigh], the table interpolated linearly between its
// temperatures. Outside them ok is false: no command shows a value a block
// does not give (one rule for summaries, hovers and plots).
func (g *GivenThermo) CpAt(T float64) (float64, bool) {
	switch {
	case g.Poly != nil:
		return g.Poly.Cp(T), g.Poly.InRange(T)
	case g.Table != nil && len(g.Table.T) > 0:
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, t := range g.Table.T {
			lo, hi = math.Min(lo, t), math.Max(hi, t)
		}
		if T < lo || T > hi {
			return 0, false
		}
		return interpolate(g.Table.T, g.Table.Cp, T), true
	}
	return 0, false
}

// Range returns the temperatures (K) the block covers.
func (g *GivenThermo) Range() (lo, hi float64) {
	switch {
	case g.Poly != nil:
		return g.Poly.TLow, g.Poly.THigh
	case g.Table != nil && len(g.Table.T) > 0:
		lo, hi = math.Inf(1), math.Inf(-1)
		for _, t := range g.Table.T {
			lo, hi = math.Min(lo, t), math.Max(hi, t)
		}
		return lo, hi
	}
	return 0, 0
}

// CpAt returns Cp at the standard temperatures (benson.StdTemps) from the
// thermo the analysis uses: the estimate's values, or the file's block where
// it covers the temperature (ok[i] false elsewhere, see GivenThermo.CpAt).
func (sp *Species) CpAt() (cp [7]float64, ok [7]bool) {
	switch sp.Source {
	case SourceEstimate:
		for i := range ok {
			ok[i] = true
		}
		return sp.Estimate.Cp, ok
	case SourceFile:
		for i, T := range benson.StdTemps {
			cp[i], ok[i] = sp.Given.CpAt(T)
		}
	}
	return cp, ok
}

// energy formats an energy (J/mol) in the display units.
func (a *analysis) energy(v float64) string { return a.res.Units().Energy(v) }

// entropy formats an entropy or heat capacity (J/(mol K)) in the display units.
func (a *analysis) entropy(v float64) string { return a.res.Units().Entropy(v) }

func (a *analysis) thermoSummary(hf, s float64) string {
	return fmt.Sprintf("ΔHf°298 = %s, S°298 = %s", a.energy(hf), a.entropy(s))
}

// MolarMassOf returns the molar mass (g/mol) of an element composition using
// the standard atomic weights of molecule.AtomicWeight (unknown elements count 0).
func MolarMassOf(comp map[string]int) float64 {
	m := 0.0
	for el, n := range comp {
		w, _ := molecule.AtomicWeight(el)
		m += float64(n) * w
	}
	return m
}

func unwrapPathError(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}

// estimateWord names where the thermo of an estimate without a block comes
// from: "estimated" from groups, or the reference-library entry it takes.
func estimateWord(e *Estimate) string {
	if e.Library != "" {
		return "reference library " + e.Library + ":"
	}
	return "estimated"
}
