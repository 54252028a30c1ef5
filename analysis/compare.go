package analysis

import (
	"context"
	"fmt"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/speciesfile"
)

// CompareThermoTemps are the temperatures (K) at which Cp and G of matched
// species are compared, keyed as in the compare JSON.
var CompareThermoTemps = [3]struct {
	Key string
	T   float64
}{{"300", 300}, {"1000", 1000}, {"2000", 2000}}

// CompareRateTemps are the temperatures (K) of the rate ratios k_B/k_A.
var CompareRateTemps = [3]struct {
	Key string
	T   float64
}{{"500", 500}, {"1000", 1000}, {"2000", 2000}}

// CompareOptions adjust a comparison. Thermo differences are flagged with
// the workspace's mismatch thresholds (Settings.MismatchHf298 for ΔHf°298
// and G, Settings.MismatchS298 for S°298 and Cp).
type CompareOptions struct {
	// RateFactor flags a matched reaction whose k_B/k_A lies outside
	// [1/RateFactor, RateFactor] at any of CompareRateTemps (default 2).
	RateFactor float64
}

// Comparison is the result of comparing mechanism B with mechanism A.
type Comparison struct {
	A, B       CompareSide
	Settings   Settings
	RateFactor float64
	// Species matched by structure and multiplicity (lumped species: by name
	// and composition), in A's declaration order.
	Species []SpeciesPair
	// OnlyA and OnlyB are the species without a counterpart.
	OnlyA, OnlyB []SpeciesRef
	// NameClashes are names declared in both files for different structures.
	NameClashes []NameClash
	// Reactions matched by their species after mapping B's names to A's.
	Reactions                      []ReactionPair
	ReactionsOnlyA, ReactionsOnlyB []ReactionRef
}

// CompareSide describes one mechanism of a comparison.
type CompareSide struct {
	Path               string
	Species, Reactions int
	// Errors counts what a comparison finds while reading, without the
	// full checks (which would estimate every species of both files): the
	// syntax errors of the file and its includes, unreadable structures and
	// include errors. `kiln check` reports these and the analysis problems.
	Errors              int
	UnreadableStructure []string
}

// SpeciesRef is a species of one side.
type SpeciesRef struct {
	Name    string
	File    string
	Line    int // 1-based
	SMILES  string
	Formula string
}

// SpeciesPair is a species of A and its counterpart in B.
type SpeciesPair struct {
	A, B SpeciesRef
	// By is "structure" or, for lumped species, "name".
	By string
	// Thermo compares the two sides' thermochemistry; nil when either side
	// has none, or when SameEstimate.
	Thermo *ThermoDiff
	// SameEstimate is true when both sides estimate the species (no thermo
	// block on either side) from the same SMILES text with the same
	// options: the thermochemistry is identical (or, when kiln cannot
	// estimate the structure, missing on both sides) and is not computed.
	SameEstimate bool
}

// Renamed reports whether the two sides use different names.
func (p SpeciesPair) Renamed() bool { return p.A.Name != p.B.Name }

// Flagged reports whether the pair differs beyond a threshold.
func (p SpeciesPair) Flagged() bool { return p.Thermo != nil && len(p.Thermo.Flags) > 0 }

// ThermoDiff holds both sides' values (J/mol, J/(mol K)); the Cp and G
// arrays follow CompareThermoTemps.
type ThermoDiff struct {
	SourceA, SourceB ThermoSource
	// LibraryA and LibraryB refine an "estimate" source that is kiln's
	// reference-library data (Species.ReferenceLibrary; "" otherwise).
	LibraryA, LibraryB string
	Hf298A, Hf298B     float64
	S298A, S298B       float64
	CpA, CpB           [3]float64
	GA, GB             [3]float64
	// Flags lists what differs beyond its threshold: "hf298", "s298",
	// "cp300", "cp1000", "cp2000", "g300", "g1000", "g2000".
	Flags []string
}

// NameClash is one name given to different structures in A and B.
type NameClash struct {
	Name             string
	SMILESA, SMILESB string
}

// ReactionRef is a reaction of one side.
type ReactionRef struct {
	Equation string
	File     string
	Line     int
}

// Repeat says whether a matched reaction is written more than once on one
// side, and whether those reactions are declared `duplicate`.
type Repeat string

const (
	RepeatNone       Repeat = ""           // written once
	RepeatDeclared   Repeat = "declared"   // several reactions, each marked `duplicate`
	RepeatUndeclared Repeat = "undeclared" // several reactions, not all marked `duplicate` (check warns)
)

// ReactionPair is a reaction of A and its counterpart in B (reactions of
// one equation are summed on each side).
type ReactionPair struct {
	A, B ReactionRef // the first reaction of the equation on each side
	// AllA and AllB are every reaction of the equation on each side, in
	// file order (A and B are their first); RepeatA and RepeatB say whether
	// there are several and whether they are declared `duplicate`.
	AllA, AllB       []ReactionRef
	RepeatA, RepeatB Repeat
	// Reversed is true when B writes the reaction in the other direction;
	// B's rate is then converted with B's own equilibrium constant (or its
	// explicit reverse rate).
	Reversed bool
	// Ratio is k_B/k_A at CompareRateTemps (nil where a rate or the
	// thermochemistry to convert it is missing).
	Ratio [3]*float64
	// Note says what was compared when it is not the plain rate: falloff
	// rates at the settings' pressure with the N2 bath gas, pressure tables
	// read at that pressure.
	Note string
}

// Flagged reports whether a rate ratio lies outside the factor.
func (p ReactionPair) Flagged(factor float64) bool {
	for _, r := range p.Ratio {
		if r != nil && (*r > factor || *r < 1/factor) {
			return true
		}
	}
	return false
}

// compareSide is one mechanism read for a comparison: its species and
// reactions in every file in scope, without the reaction checks a full
// analysis makes.
type compareSide struct {
	a         *analysis
	user      []benson.GroupValue
	species   []*Species
	byName    map[string]*Species
	pos       map[string]int // name → index in species
	reactions []sideReaction
	fits      *fitShare // shared by both sides of a comparison
}

type sideReaction struct {
	d     *speciesfile.Reaction
	file  string
	start int // where d starts in file
}

// Compare reads mechanisms A and B (each with its includes) and matches
// their species by structure and their reactions by species. Like Analyze it
// is a pure function of the workspace's texts.
func (w *Workspace) Compare(ctx context.Context, pathA, pathB string, opts CompareOptions) (*Comparison, error) {
	if opts.RateFactor == 0 {
		opts.RateFactor = 2
	}
	if !(opts.RateFactor > 1) {
		return nil, fmt.Errorf("compare: rate factor must exceed 1, not %g", opts.RateFactor)
	}
	sa, err := w.loadSide(ctx, pathA)
	if err != nil {
		return nil, err
	}
	sb, err := w.loadSide(ctx, pathB)
	if err != nil {
		return nil, err
	}
	c := &Comparison{A: sa.summary(), B: sb.summary(), Settings: w.Settings(), RateFactor: opts.RateFactor}
	fits := &fitShare{rep: map[fitKey]*Estimate{}}
	sa.fits, sb.fits = fits, fits
	matchA, matchB := matchSpecies(sa, sb)
	matchResonance(sa, sb, matchA, matchB)
	matchLibrary(sa, sb, matchA, matchB)
	// Thermochemistry for the matched species, estimated where not given.
	// A pair that both sides estimate from the same structure text with
	// the same options has the same thermo by construction: not computed.
	// (Differently spelled pairs are estimated: an estimate's independence
	// of the spelling is tested, not assumed.)
	need := make([]*Species, 0, 2*len(sb.species))
	needSide := make([]*compareSide, 0, 2*len(sb.species))
	sameEstimate := map[int]bool{}
	for i, sp := range sa.species {
		j := matchA[i]
		if j < 0 {
			continue
		}
		if other := sb.species[j]; sp.Given == nil && other.Given == nil && sp.Mol != nil &&
			sa.a.estimateOptions(sp.Decl, sa.user).key(sp.ident) == sb.a.estimateOptions(other.Decl, sb.user).key(other.ident) {
			sameEstimate[i] = true
			continue
		}
		need = append(need, sp, sb.species[j])
		needSide = append(needSide, sa, sb)
	}
	if err := sa.a.parallel(len(need), 64, func(i int) { needSide[i].warm(need[i]) }); err != nil {
		return nil, err
	}
	for i, sp := range need {
		needSide[i].thermoOf(sp)
	}
	// The NASA-7 fits compareModel evaluates, on all cores: one per
	// distinct set of fit inputs (two spellings of a structure have the
	// same estimate values, and their fits are the same function of them).
	var reps []*Estimate
	for _, sp := range need {
		if sp.Source == SourceEstimate && sp.Estimate != nil {
			if e, fresh := fits.of(sp.Estimate); fresh {
				reps = append(reps, e)
			}
		}
	}
	if err := sa.a.parallel(len(reps), 16, func(i int) { _, _, _ = reps[i].NASA7() }); err != nil {
		return nil, err
	}
	for i, sp := range sa.species {
		j := matchA[i]
		if j < 0 {
			c.OnlyA = append(c.OnlyA, sa.ref(sp))
			continue
		}
		other := sb.species[j]
		by := "structure"
		if sp.Mol == nil {
			by = "name"
		}
		pair := SpeciesPair{A: sa.ref(sp), B: sb.ref(other), By: by, SameEstimate: sameEstimate[i]}
		if !pair.SameEstimate {
			pair.Thermo = fits.thermoDiff(sp, other, c.Settings)
		}
		c.Species = append(c.Species, pair)
	}
	for j, sp := range sb.species {
		if matchB[j] < 0 {
			c.OnlyB = append(c.OnlyB, sb.ref(sp))
		}
		if i, ok := sa.pos[sp.Name]; ok && matchB[j] != i {
			first := sa.species[i]
			if first.Mol == nil && sp.Mol == nil && smilesOf(first) == smilesOf(sp) && sp.Decl.SMILES != nil {
				continue // the same unreadable SMILES on both sides: not a clash
			}
			c.NameClashes = append(c.NameClashes, NameClash{Name: sp.Name, SMILESA: smilesOf(first), SMILESB: smilesOf(sp)})
		}
	}
	// Reactions: B's names mapped onto A's.
	mapB := map[string]string{}
	for j, sp := range sb.species {
		if i := matchB[j]; i >= 0 {
			mapB[sp.Name] = sa.species[i].Name
		} else {
			mapB[sp.Name] = "\x00B:" + sp.Name // never equal to a name of A
		}
	}
	c.Reactions, c.ReactionsOnlyA, c.ReactionsOnlyB = matchReactions(sa, sb, mapB)
	return c, nil
}

func smilesOf(sp *Species) string {
	if sp.Decl.SMILES != nil {
		return sp.Decl.SMILES.Text
	}
	return ""
}

// loadSide parses path and its includes and resolves every species
// declaration's structure and given thermo (first declaration of a name
// wins, as in Analyze).
func (w *Workspace) loadSide(ctx context.Context, path string) (*compareSide, error) {
	path = filepath.Clean(path)
	text, err := w.read(path)
	if err != nil {
		return nil, fmt.Errorf("reading %s: %w", path, err)
	}
	a, err := w.startAnalysis(ctx, w.Settings(), path, speciesfile.Parse(path, text))
	if err != nil {
		return nil, err
	}
	a.groups()
	s := &compareSide{a: a, user: a.setUserGroups(), byName: map[string]*Species{}, pos: map[string]int{}}
	nd := 0
	for _, p := range a.order {
		nd += len(a.res.Files[p].Species)
	}
	decls := make([]*speciesfile.Species, 0, nd)
	files := make([]string, 0, nd)
	starts := make([]int, 0, nd)
	s.species = make([]*Species, 0, nd)
	for _, p := range a.order {
		f := a.res.Files[p]
		for k, d := range f.Species {
			if _, dup := s.byName[d.Name.Text]; dup {
				continue
			}
			start := f.SpeciesStart(k)
			sp := &Species{Name: d.Name.Text, File: p, Decl: d, Source: SourceNone}
			s.byName[sp.Name] = sp
			s.pos[sp.Name] = len(s.species)
			s.species = append(s.species, sp)
			decls = append(decls, d)
			files = append(files, p)
			starts = append(starts, start)
		}
	}
	// Read the structures on all cores; structure() below finds them in
	// the workspace's molecule cache.
	if err := a.parallel(len(decls), 64, func(i int) {
		if d := decls[i]; d.SMILES != nil {
			a.w.mols.parse(d.SMILES.Text)
		}
	}); err != nil {
		return nil, err
	}
	for i, sp := range s.species {
		a.stmtBase, a.stmtStart = starts[i], starts[i]
		a.structure(files[i], sp)
		if sp.Mol == nil {
			sp.Composition, _ = compositionOf(sp.Decl) // nil when not a formula of elements
		}
		a.given(files[i], sp)
	}
	nr := 0
	for _, p := range a.order {
		nr += len(a.res.Files[p].Reactions)
	}
	s.reactions = make([]sideReaction, 0, nr)
	for _, p := range a.order {
		f := a.res.Files[p]
		for k, d := range f.Reactions {
			if f.ErrorIn(d.Body().At(f.ReactionStart(k))) {
				continue // a reaction the reader could not read is not data
			}
			s.reactions = append(s.reactions, sideReaction{d: d, file: p, start: f.ReactionStart(k)})
		}
	}
	return s, nil
}

func (s *compareSide) summary() CompareSide {
	out := CompareSide{Path: s.a.res.Path, Species: len(s.species), Reactions: len(s.reactions)}
	out.Errors = countErrors(s.a.res.Diagnostics) // the file's syntax errors and the structure/include errors found here
	for p, f := range s.a.res.Files {
		if p != s.a.res.Path {
			out.Errors += countErrors(f.Diags)
		}
	}
	for _, sp := range s.species {
		if sp.SMILESError != nil {
			out.UnreadableStructure = append(out.UnreadableStructure, sp.Name)
		}
	}
	return out
}

// rref describes a reaction of this side.
func (s *compareSide) rref(r sideReaction) ReactionRef {
	f := s.a.res.Files[r.file]
	return ReactionRef{Equation: equationText(f, r.d, r.start), File: r.file, Line: stmtLineAt(f, r.d, r.start)}
}

func (s *compareSide) ref(sp *Species) SpeciesRef {
	f := s.a.res.Files[sp.File]
	r := SpeciesRef{Name: sp.Name, File: sp.File, Line: f.Lines.Line(s.a.res.SpeciesLoc(sp).Span.Start) + 1, SMILES: smilesOf(sp), Formula: sp.Formula}
	return r
}

// warm computes the estimate of sp into the cache (safe on any goroutine).
func (s *compareSide) warm(sp *Species) {
	if sp.Given == nil && sp.Mol != nil {
		_, _ = s.a.w.cache.get(sp.ident, sp.Mol, s.a.estimateOptions(sp.Decl, s.user))
	}
}

// thermoOf settles the thermochemistry of sp: the file's block, else the
// estimate.
func (s *compareSide) thermoOf(sp *Species) {
	if sp.Given != nil || sp.Mol == nil || sp.Estimate != nil {
		return
	}
	start := s.a.res.declStart(sp)
	s.a.stmtBase, s.a.stmtStart = start, start
	s.a.estimateSpecies(sp.File, sp, s.user)
	if sp.Estimate != nil {
		sp.Source = SourceEstimate
	}
}

// matchKeys returns each species' bucket key for matching: its cheap graph
// invariant and effective multiplicity ("" without a structure).
func (s *compareSide) matchKeys() []string {
	keys := make([]string, len(s.species))
	for i, sp := range s.species {
		if sp.Mol != nil {
			keys[i] = sp.inv + "|m" + strconv.Itoa(effectiveMultiplicity(s.a.w.cache.lib, sp))
		}
	}
	return keys
}

// matchSpecies pairs species of a and b with the same structure (canonical
// form with stereo) and multiplicity, preferring a partner of the same name;
// lumped species pair by name when their compositions agree. matchA[i] is
// the index in b of a's species i (-1 when unmatched), matchB the converse.
func matchSpecies(a, b *compareSide) (matchA, matchB []int) {
	matchA = make([]int, len(a.species))
	matchB = make([]int, len(b.species))
	for i := range matchA {
		matchA[i] = -1
	}
	for j := range matchB {
		matchB[j] = -1
	}
	keysA, keysB := a.matchKeys(), b.matchKeys()
	buckets := map[string][]int{}
	for j, sp := range b.species {
		if sp.Mol != nil {
			buckets[keysB[j]] = append(buckets[keysB[j]], j)
		}
	}
	same := func(x, y *Species) bool {
		return x.Decl.SMILES.Text == y.Decl.SMILES.Text || identity(x.Mol) == identity(y.Mol)
	}
	// Canonical forms are needed only where a bucket holds species of both
	// sides spelled differently; compute those on all cores first (each
	// molecule caches its own).
	var mols []*Species
	seen := map[*Species]bool{}
	for i, sp := range a.species {
		if sp.Mol == nil {
			continue
		}
		for _, j := range buckets[keysA[i]] {
			if other := b.species[j]; other.Decl.SMILES.Text != sp.Decl.SMILES.Text {
				for _, x := range []*Species{sp, other} {
					if !seen[x] {
						seen[x] = true
						mols = append(mols, x)
					}
				}
			}
		}
	}
	_ = a.a.parallel(len(mols), 16, func(i int) { identity(mols[i].Mol) })
	for i, sp := range a.species {
		if sp.Mol == nil {
			if j, ok := b.pos[sp.Name]; ok && b.species[j].Mol == nil && len(sp.Composition) > 0 && sameComposition(sp.Composition, b.species[j].Composition) {
				if matchB[j] < 0 {
					matchA[i], matchB[j] = j, i
				}
			}
			continue
		}
		cands := buckets[keysA[i]]
		best := -1
		for _, j := range cands {
			if matchB[j] >= 0 {
				continue
			}
			if b.species[j].Name == sp.Name && same(sp, b.species[j]) {
				best = j
				break
			}
		}
		if best < 0 {
			for _, j := range cands {
				if matchB[j] < 0 && same(sp, b.species[j]) {
					best = j
					break
				}
			}
		}
		if best >= 0 {
			matchA[i], matchB[best] = best, i
		}
	}
	return matchA, matchB
}

func sameComposition(x, y map[string]int) bool {
	if len(x) != len(y) {
		return false
	}
	for k, v := range x {
		if y[k] != v {
			return false
		}
	}
	return true
}

// compareModel returns the thermochemistry compare evaluates for sp: the
// file's block, or for an estimate the NASA-7 polynomial kiln writes for it
// (`kiln fill`, `kiln estimate --nasa`, the quick fix: Estimate.NASA7, with
// its extrapolation past 1500 K), so that a file and the file `fill` makes
// of it compare equal at every temperature. Only when that fit fails (fill
// then writes nothing) is the estimate's group model used. nil when sp has
// no thermochemistry.
func (f *fitShare) compareModel(sp *Species) thermoCurve {
	if sp.Source == SourceEstimate && sp.Estimate != nil {
		e, _ := f.of(sp.Estimate)
		return e.written()
	}
	if th, ok := sp.Thermo().(thermoCurve); ok {
		return th
	}
	return nil
}

// fitKey is everything an estimate's NASA-7 fit depends on.
type fitKey struct {
	hf, s, cp0, cpInf, tMid, tHigh float64
	cp                             [7]float64
}

// fitShare maps estimates with the same fit inputs to one representative,
// whose fit (made once) stands for all of them. Used by one goroutine at a
// time; the representatives' fits may run in parallel.
type fitShare struct {
	rep map[fitKey]*Estimate
}

// of returns the representative of e (fresh: e itself, new in the share).
// A reference-library estimate represents itself (its polynomial is the
// library's, or refitted from it).
func (f *fitShare) of(e *Estimate) (rep *Estimate, fresh bool) {
	if e.Library != "" {
		return e, false
	}
	k := fitKey{hf: e.Hf298, s: e.S298, cp0: e.cp0, cpInf: e.cpInf, tMid: e.tMid, tHigh: e.tHigh, cp: e.Cp}
	if r, ok := f.rep[k]; ok {
		return r, false
	}
	f.rep[k] = e
	return e, true
}

// statedLibraryUncertainty is the ± the source of sp's values states for
// ΔHf°298 (J/mol) when they are reference-library data that carry one
// (reflib.Species.Hf298Unc), else 0.
func (sp *Species) statedLibraryUncertainty() float64 {
	if sp.Source != SourceEstimate || sp.Estimate == nil || sp.Estimate.Library == "" {
		return 0
	}
	return sp.Estimate.StatedUncertainty
}

// thermoDiff compares the thermochemistry of a matched pair.
func (f *fitShare) thermoDiff(a, b *Species, set Settings) *ThermoDiff {
	ta, tb := f.compareModel(a), f.compareModel(b)
	if ta == nil || tb == nil {
		return nil
	}
	d := &ThermoDiff{SourceA: a.Source, SourceB: b.Source, LibraryA: a.ReferenceLibrary(), LibraryB: b.ReferenceLibrary()}
	d.Hf298A, d.S298A, _ = a.Hf298S298()
	d.Hf298B, d.S298B, _ = b.Hf298S298()
	flag := func(name string, x, y, limit float64) {
		if math.Abs(y-x) > limit {
			d.Flags = append(d.Flags, name)
		}
	}
	// A side whose values are reference data with a stated ± wider than
	// the threshold is not flagged within that ±.
	hfLimit := max(set.MismatchHf298, a.statedLibraryUncertainty(), b.statedLibraryUncertainty())
	flag("hf298", d.Hf298A, d.Hf298B, hfLimit)
	flag("s298", d.S298A, d.S298B, set.MismatchS298)
	for k, t := range CompareThermoTemps {
		d.CpA[k] = ta.Cp(t.T)
		d.CpB[k] = tb.Cp(t.T)
		d.GA[k] = ta.H(t.T) - t.T*ta.S(t.T)
		d.GB[k] = tb.H(t.T) - t.T*tb.S(t.T)
	}
	for k, t := range CompareThermoTemps {
		flag("cp"+t.Key, d.CpA[k], d.CpB[k], set.MismatchS298)
	}
	for k, t := range CompareThermoTemps {
		flag("g"+t.Key, d.GA[k], d.GB[k], hfLimit)
	}
	return d
}

type reactionGroup struct {
	left, right string // directed sides of the first reaction of the key
	rs          []sideReaction
	lefts       []string // each reaction's own reactant side (mapped names)
}

// groupReactions collects reactions by their undirected key (duplicates of
// an equation fall into one group), in order of first appearance.
func groupReactions(s *compareSide, names func(string) string) (map[string]*reactionGroup, []string) {
	groups := make(map[string]*reactionGroup, len(s.reactions))
	order := make([]string, 0, len(s.reactions))
	for _, r := range s.reactions {
		k, l, rt := equationKey(r.d, names)
		g, ok := groups[k]
		if !ok {
			g = &reactionGroup{left: l, right: rt}
			groups[k] = g
			order = append(order, k)
		}
		g.rs = append(g.rs, r)
		g.lefts = append(g.lefts, l)
	}
	return groups, order
}

// matchReactions pairs the reactions of a and b by species.
func matchReactions(a, b *compareSide, mapB map[string]string) (pairs []ReactionPair, onlyA, onlyB []ReactionRef) {
	id := func(n string) string { return n }
	mapped := func(n string) string {
		if m, ok := mapB[n]; ok {
			return m
		}
		if _, ok := a.byName[n]; !ok {
			// Undeclared on both sides: the same text is the same name
			// (nothing is known about it to tell otherwise).
			return n
		}
		return "\x00B:" + n // undeclared in B, a declared species in A
	}
	ga, orderA := groupReactions(a, id)
	gb, orderB := groupReactions(b, mapped)
	for _, k := range orderA {
		x := ga[k]
		y, ok := gb[k]
		if !ok {
			onlyA = append(onlyA, a.rrefs(x)...)
			continue
		}
		allA, allB := a.rrefs(x), b.rrefs(y)
		p := ReactionPair{A: allA[0], B: allB[0], Reversed: x.left != y.left,
			AllA: allA, AllB: allB, RepeatA: x.repeat(), RepeatB: y.repeat()}
		for i, t := range CompareRateTemps {
			ka, noteA, okA := a.rateOf(x, x.left, t.T)
			kb, noteB, okB := b.rateOf(y, x.left, t.T)
			if okA && okB && ka > 0 && !math.IsInf(kb/ka, 0) && !math.IsNaN(kb/ka) {
				p.Ratio[i] = ptrTo(kb / ka)
			}
			if p.Note == "" {
				p.Note = noteA
				if p.Note == "" {
					p.Note = noteB
				}
			}
		}
		if n := efficiencyNote(x, y, mapped); n != "" {
			p.Note = strings.TrimPrefix(p.Note+"; "+n, "; ")
		}
		pairs = append(pairs, p)
	}
	for _, k := range orderB {
		if _, ok := ga[k]; !ok {
			onlyB = append(onlyB, b.rrefs(gb[k])...)
		}
	}
	return pairs, onlyA, onlyB
}

func ptrTo(v float64) *float64 { return &v }

// repeat says whether the group holds several reactions and whether each is
// declared `duplicate`.
func (g *reactionGroup) repeat() Repeat {
	if len(g.rs) < 2 {
		return RepeatNone
	}
	for _, r := range g.rs {
		if r.d.Duplicate == nil {
			return RepeatUndeclared
		}
	}
	return RepeatDeclared
}

// rrefs describes every reaction of a group, in file order.
func (s *compareSide) rrefs(g *reactionGroup) []ReactionRef {
	out := make([]ReactionRef, len(g.rs))
	for i, r := range g.rs {
		out[i] = s.rref(r)
	}
	return out
}

// RepeatNote says which side's rate is a sum of several reactions of the
// equation, and whether they are declared `duplicate`, e.g. "2 reactions
// declared duplicate in A (lines 6, 8), rates summed"; "" when each side
// writes the equation once.
func (p ReactionPair) RepeatNote() string {
	var parts []string
	for _, n := range []string{repeatNote("A", p.RepeatA, p.AllA), repeatNote("B", p.RepeatB, p.AllB)} {
		if n != "" {
			parts = append(parts, n)
		}
	}
	return strings.Join(parts, "; ")
}

// repeatNote says that a side's rate is the sum of several reactions, e.g.
// "2 reactions declared duplicate in A (lines 6, 8), rates summed".
func repeatNote(side string, rep Repeat, rs []ReactionRef) string {
	if rep == RepeatNone {
		return ""
	}
	lines := make([]string, len(rs))
	for i, r := range rs {
		lines[i] = strconv.Itoa(r.Line)
		if r.File != rs[0].File {
			lines[i] = filepath.Base(r.File) + ":" + lines[i]
		}
	}
	if rep == RepeatUndeclared {
		return fmt.Sprintf("%d reactions in %s repeat one equation without `duplicate` on each (lines %s), rates summed", len(rs), side, strings.Join(lines, ", "))
	}
	return fmt.Sprintf("%d reactions declared duplicate in %s (lines %s), rates summed", len(rs), side, strings.Join(lines, ", "))
}

// rateOf returns the summed rate constant (cm3, mol, s) at T of a group's
// reactions in the direction whose reactant side is `left` (keyed with the
// side's own names). A reaction written the other way is converted by its
// explicit reverse rate or by k_f/Kc from its own side's thermochemistry.
// Reactants are keyed with the group's name mapping.
func (s *compareSide) rateOf(g *reactionGroup, left string, T float64) (float64, string, bool) {
	total, contributed := 0.0, false
	note := ""
	for i, r := range g.rs {
		P := s.a.set.pressure()
		bath := 1.0
		if r.d.Falloff != nil {
			bath = bathEfficiency(r.d, func(name string) *Species { return s.byName[name] })
		}
		kf, ok := forwardAt(r.d, P, bath)
		if !ok {
			return 0, "", false
		}
		if r.d.Falloff != nil {
			note = fmt.Sprintf("falloff rates at %g bar, N2 bath gas with each side's efficiency", P/1e5)
		} else if len(r.d.Pressures) > 0 {
			note = fmt.Sprintf("rate tables read at %g bar", P/1e5)
		}
		if g.lefts[i] == left {
			total += kf(T)
			contributed = true
			continue
		}
		if !r.d.Reversible {
			continue // an irreversible step written the other way adds nothing in this direction
		}
		contributed = true
		if arr, ok := arrhenius(r.d.Reverse); ok {
			total += arr.Rate(T)
			continue
		}
		kc, ok := s.kc(r.d, T)
		if !ok || kc == 0 {
			return 0, "", false
		}
		total += kf(T) / kc
	}
	if !contributed {
		return 0, "", false // only irreversible steps written the other way
	}
	return total, note, true
}

// kc returns the equilibrium constant Kc (mol/cm3)^Δn of d in its written
// direction at T from this side's thermochemistry.
func (s *compareSide) kc(d *speciesfile.Reaction, T float64) (float64, bool) {
	side := func(ts []speciesfile.Term) (kinetics.Side, bool) {
		var out kinetics.Side
		for _, t := range ts {
			sp := s.byName[t.Name.Text]
			if sp == nil {
				return nil, false
			}
			s.thermoOf(sp)
			th := s.fits.compareModel(sp)
			if th == nil {
				return nil, false
			}
			out = append(out, kinetics.Term{Coeff: t.Coeff, Thermo: th})
		}
		return out, true
	}
	re, ok1 := side(d.Reactants)
	pr, ok2 := side(d.Products)
	if !ok1 || !ok2 {
		return 0, false
	}
	_, _, g := kinetics.Delta(re, pr, T)
	return kinetics.Kc(kinetics.Kp(g, T), kinetics.DeltaN(re, pr), T), true
}
