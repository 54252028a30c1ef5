package analysis

import (
	"context"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"
	"sync"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/engine/reflib"
)

// EstimateOptions are the per-species inputs of an estimate besides the structure.
type EstimateOptions struct {
	Multiplicity, Symmetry, OpticalIsomers int // 0 = computed from the structure
	UserGroups                             []benson.GroupValue
	TMid, THigh                            float64
	// ExplicitRange makes TMid and THigh apply to reference-library species
	// too (refitted to the library polynomial); otherwise those keep the
	// library's own ranges.
	ExplicitRange bool

	userKey string // groupsKey(UserGroups), computed once per analysis
	// userFlags are the approximations of the user groups (groupcp.go): an
	// estimate that uses one carries it. userKey covers them.
	userFlags []benson.Missing
}

// key identifies an estimate in the cache: the canonical structure and every
// option that changes the numbers.
func (o EstimateOptions) key(ident string) string {
	var b strings.Builder
	b.Grow(len(ident) + 32)
	b.WriteString(ident)
	for _, n := range []int{o.Multiplicity, o.Symmetry, o.OpticalIsomers} {
		b.WriteByte('|')
		b.WriteString(strconv.Itoa(n))
	}
	for _, f := range []float64{o.TMid, o.THigh} {
		b.WriteByte('|')
		b.WriteString(strconv.FormatFloat(f, 'g', -1, 64))
	}
	if o.ExplicitRange {
		b.WriteString("|x")
	}
	if len(o.UserGroups) > 0 {
		if o.userKey == "" {
			o.userKey = groupsKey(o.UserGroups)
		}
		b.WriteString(o.userKey)
	}
	return b.String()
}

// identity is a structure's canonical form with its stereo: two molecules
// with the same identity have the same estimate. When the canonical search
// runs out of its work bound the form would depend on the spelling, so the
// identity is the spelling itself (marked so it never equals a canonical
// form): two such spellings are not recognised as one structure, but two
// structures are never merged.
func identity(m *molecule.Molecule) string {
	c, err := m.CanonicalContext(context.Background())
	if err != nil {
		return "\x00uncanonical|" + m.SMILES
	}
	return c + "|" + m.CanonicalStereo()
}

// groupsKey identifies a set of user-defined group values.
func groupsKey(gs []benson.GroupValue) string {
	var b strings.Builder
	for _, g := range gs {
		fmt.Fprintf(&b, "|%s:%g:%g:%v", g.Name, g.Hf298, g.S298, g.Cp)
	}
	return b.String()
}

// estimateCache remembers estimates by canonical structure and options so
// that editing one species re-estimates only that species.
type estimateCache struct {
	lib *reflib.Library

	mu sync.Mutex
	m  map[string]*cacheEntry
}

type cacheEntry struct {
	once   sync.Once
	est    *Estimate
	err    error
	smiles string // the spelling the entry was computed from
}

func newEstimateCache() *estimateCache {
	return &estimateCache{lib: reflib.New(), m: map[string]*cacheEntry{}}
}

// maxCacheEntries bounds the cache; past it the cache is cleared (estimates
// are cheap to recompute, memory is not free).
const maxCacheEntries = 200000

// get returns the estimate of m (whose identity(m) is ident) with options o.
func (c *estimateCache) get(ident string, m *molecule.Molecule, o EstimateOptions) (*Estimate, error) {
	k := o.key(ident)
	c.mu.Lock()
	e, ok := c.m[k]
	if !ok {
		if len(c.m) >= maxCacheEntries {
			c.m = map[string]*cacheEntry{}
		}
		e = &cacheEntry{}
		c.m[k] = e
	}
	c.mu.Unlock()
	e.once.Do(func() { e.est, e.err = estimate(c.lib, m, o); e.smiles = m.SMILES })
	if e.err != nil && m.SMILES != e.smiles {
		// The numbers are the structure's, but a refusal quotes atom
		// numbers (and text) of the spelling it was made for: another
		// spelling gets its own message, not the first one's.
		return estimate(c.lib, m, o)
	}
	return e.est, e.err
}

// EstimateMolecule estimates the thermochemistry of m: a reference-library
// entry when the structure (and multiplicity) is one of the small species that
// are not group additive, else Benson group additivity; then a NASA-7 fit.
func (w *Workspace) EstimateMolecule(m *molecule.Molecule, o EstimateOptions) (*Estimate, error) {
	return w.cache.get(identity(m), m, o)
}

func estimate(lib *reflib.Library, m *molecule.Molecule, o EstimateOptions) (*Estimate, error) {
	if o.TMid == 0 {
		o.TMid = 1000
	}
	if o.THigh == 0 {
		o.THigh = 5000
	}
	if sp, ok := lib.Lookup(m, o.Multiplicity); ok {
		e := &Estimate{
			Library:       sp.Name,
			LibrarySource: sp.Source,
			Hf298:         sp.Hf298,
			S298:          sp.S298,
			Multiplicity:  sp.Multiplicity,
			// 1σ: half the ± the source states, read as a 95 % bound
			// (common practice); 0 (exact) where it states less than
			// 4 kJ/mol or none (reflib.Species.Hf298Unc).
			Uncertainty:       sp.Hf298Unc / 2,
			StatedUncertainty: sp.Hf298Unc,
			libPoly:           sp.Poly,
			libFit:            sp.Fit,
		}
		for i, T := range benson.StdTemps {
			e.Cp[i] = sp.Poly.Cp(T)
		}
		if o.ExplicitRange && (o.TMid != sp.Poly.TMid || o.THigh != sp.Poly.THigh) {
			e.fit, e.tMid, e.tHigh = &fitResult{}, o.TMid, o.THigh
		}
		return e, nil
	}
	if o.Multiplicity > 0 {
		if sp, ok := lib.Lookup(m, 0); ok {
			// A small species of the library in another spin state: the
			// groups have no data for it either (engine/benson refuses
			// non-ground multiplicities), so say what the library holds.
			return nil, fmt.Errorf("multiplicity %d has no data: the reference library holds this structure only as %s, multiplicity %d, and group additivity has no data for other spin states", o.Multiplicity, sp.Name, sp.Multiplicity)
		}
	}
	bo := benson.Options{
		Multiplicity:   o.Multiplicity,
		Symmetry:       o.Symmetry,
		OpticalIsomers: o.OpticalIsomers,
		UserGroups:     o.UserGroups,
	}
	// Estimates depend only on the structure: benson.Estimate is a function
	// of the graph (engine/benson TestRandomSpellingsOneAnswer, acyclic,
	// cyclic and radical structures). As a second guard, a polycyclic
	// structure is estimated from its canonical spelling (with stereo);
	// acyclic and monocyclic ones skip the extra canonical form.
	cm := m
	if len(m.Rings()) >= 2 {
		if c, err := molecule.ParseSMILES(m.CanonicalStereo()); err == nil {
			cm = c
		}
	}
	g, err := benson.Estimate(cm, bo)
	if err != nil {
		if cm != m {
			// Report the refusal with the atom numbers of the user's SMILES.
			if _, e2 := benson.Estimate(m, bo); e2 != nil {
				err = e2
			}
		}
		return nil, withReading(lib, m, err)
	}
	if err := physical(g); err != nil {
		return nil, err
	}
	e := &Estimate{Group: g, Hf298: g.Hf298, S298: g.S298, Cp: g.Cp, Uncertainty: g.Uncertainty,
		Multiplicity: g.Multiplicity, fit: &fitResult{}, tMid: o.TMid, tHigh: o.THigh}
	nAtoms, linear, rotors := shape(m)
	e.cp0, e.cpInf = nasa.ClassicalLimits(nAtoms, linear, rotors)
	for _, f := range o.userFlags {
		if usesGroup(g, f.Group) {
			e.flags = append(e.flags, f)
		}
	}
	if f, refuse, below := cpFloorCheck(g.Cp, nAtoms, linear, usesUserGroup(g, o.UserGroups)); below {
		e.flags, e.cpFloor = append(e.flags, f), refuse
	}
	if held, f, ok := cpCeilingHold(g.Cp, e.cpInf, o.THigh); ok {
		e.Cp = held
		e.flags = append(e.flags, f)
	} else if f, above := cpCeilingCheck(g.Cp, e.cpInf, o.THigh, usesUserGroup(g, o.UserGroups)); above {
		e.flags = append(e.flags, f) // nasa.Fit refuses it (ShapeAboveLimit)
	}
	e.model = newGroupThermo(g.Hf298, g.S298, benson.StdTemps[:], e.Cp[:])
	e.model.continueAlongTail(e.cp0, e.cpInf)
	return e, nil
}

// physical refuses a group-additivity result no gas can have: S°298 ≤ 0 or
// Cp ≤ 0 at a tabulated temperature. Group values alone do not produce one;
// an override such as `symmetry 99999999999999` (S falls by R ln σ) does,
// and a number that cannot be true is not reported as an estimate.
func physical(g *benson.Result) error {
	finite := !math.IsInf(g.Hf298, 0) && !math.IsNaN(g.Hf298) && !math.IsInf(g.S298, 0)
	for _, cp := range g.Cp {
		finite = finite && !math.IsInf(cp, 0)
	}
	if !finite {
		// Only a `group` statement with an enormous value gets here: the
		// sum overflows, and an infinity is never reported as a value.
		return fmt.Errorf("the estimate is not a finite number (its group values add up to more than a float64 holds: check the `group` statements it uses)")
	}
	if !(g.S298 > 0) {
		return fmt.Errorf("the estimate is not physical: S°298 = %.2f J/(mol K) ≤ 0 (symmetry number %s, optical isomers %d: check any symmetry or optical-isomers override)", g.S298, g.Sigma(), g.OpticalIsomers)
	}
	for i, cp := range g.Cp {
		if !(cp > 0) {
			return fmt.Errorf("the estimate is not physical: Cp(%g K) = %.2f J/(mol K) ≤ 0", benson.StdTemps[i], cp)
		}
	}
	return nil
}

// shape returns the total atom count (with hydrogens), whether the molecule
// is linear and its number of internal rotors, as the classical Cp limit
// needs, for the species of m.
//
// Linear: one or two atoms, or every heavy atom sp-hybridised in a chain
// (X≡C–H, O=C=O, HC≡C–C≡CH) — common practice. Internal rotors: single,
// non-ring bonds between two heavy atoms that each carry at least one other
// substituent (a methyl top counts; a bond to a terminal atom without
// substituents does not).
//
// A radical with several resonance structures is one species, whichever
// structure was written: shape looks at all of its Lewis structures
// (benson.ResonanceStructures, a set that does not depend on the spelling). It is linear only if every structure is, and a bond is
// a rotor only if it is single in every structure: a bond that is double in
// some structure has partial double-bond character and a torsion barrier of
// 10–16 kcal/mol (allyl about 15–16, benzyl about 11–14; from memory), a
// stiff torsional vibration, not a free rotor, at the temperatures the
// classical limit governs. Taken from the written structure instead, vinoxy
// [CH2]C=O got a C–C rotor that C=C[O] lacks, and benzyl [CH2]c1ccccc1 a
// ring–CH2 rotor that C=C1C=CC=C[CH]1 lacks: different limits, Wilhoit
// tails and NASA-7 fits for one species.
func shape(m *molecule.Molecule) (nAtoms int, linear bool, rotors int) {
	forms, _ := benson.ResonanceStructures(m) // just m for a closed shell
	heavy := len(m.Atoms)
	h := 0
	for _, a := range m.Atoms {
		h += a.HCount
	}
	nAtoms = heavy + h
	degree := func(i int) int { return len(m.Adj[i]) + m.Atoms[i].HCount }
	linear = true
	if nAtoms > 2 {
		for _, f := range forms {
			linear = linear && chainLinear(f)
		}
	}
	inRing := ringBonds(m)
	for bi, b := range m.Bonds {
		if inRing[bi] || degree(b.A) <= 1 || degree(b.B) <= 1 {
			continue
		}
		single := true
		for _, f := range forms {
			if fb := f.Bonds[bi]; fb.Order != 1 || fb.Aromatic {
				single = false
				break
			}
		}
		if single {
			rotors++
		}
	}
	return nAtoms, linear, rotors
}

// chainLinear reports whether every inner atom of m (two or more
// neighbours, hydrogens counted) has exactly two, joined through a triple
// bond or two double bonds (an sp centre).
func chainLinear(m *molecule.Molecule) bool {
	for i := range m.Atoms {
		d := len(m.Adj[i]) + m.Atoms[i].HCount
		if d <= 1 {
			continue
		}
		if d != 2 {
			return false
		}
		orders := m.Atoms[i].HCount
		for _, b := range m.Adj[i] {
			orders += m.Bonds[b].Order
		}
		if orders < 4 {
			return false
		}
	}
	return true
}

// usesGroup reports whether the estimate g has a term for group name, or
// a term approximated by it ("X ≈ name").
func usesGroup(g *benson.Result, name string) bool {
	for _, t := range g.Groups {
		own, by, _ := strings.Cut(t.Name, " ≈ ")
		if own == name || by == name {
			return true
		}
	}
	return false
}

// Flag is one distinct approximation of an estimate and the number of
// times the estimate makes it (a group flagged on two atoms is one Flag
// with Count 2).
type Flag struct {
	benson.Missing
	Count int
}

// Flags returns the approximations an estimate carries (missing groups,
// radical-site increments without S°/Cp data, ring systems without
// whole-system values, sums below the physical S° bound …), sorted by name,
// each distinct approximation once with its count: the one list that check,
// estimate, summary and hover show, each entry worded by FlagText. A
// reference-library species has none.
func (e *Estimate) Flags() []Flag {
	if e == nil {
		return nil
	}
	ms := sortedMissing(e.Group)
	if len(e.flags) > 0 {
		ms = append(ms, e.flags...)
		sort.SliceStable(ms, func(i, j int) bool { return ms[i].Group < ms[j].Group })
	}
	return distinctFlags(ms)
}

// distinctFlags merges identical entries of ms (the engine lists a flag
// once per atom it applies to), keeping the order of first appearance.
func distinctFlags(ms []benson.Missing) []Flag {
	if len(ms) == 0 {
		return nil
	}
	out := make([]Flag, 0, len(ms))
	at := make(map[benson.Missing]int, len(ms))
	for _, m := range ms {
		if i, ok := at[m]; ok {
			out[i].Count++
			continue
		}
		at[m] = len(out)
		out = append(out, Flag{Missing: m, Count: 1})
	}
	return out
}

// UsedAsItStands reports whether m flags a group kiln has and uses as it
// stands, with a known shortcoming (no interaction term, a value resting on
// one molecule), rather than a group approximated by another: its
// Approximation is the group itself followed by what it lacks.
func UsedAsItStands(m benson.Missing) bool {
	return m.Approximation == m.Group || strings.HasPrefix(m.Approximation, m.Group+" ")
}

// BeyondBound reports whether m flags an estimate beyond a physical bound
// (S°298 or Cp below what any molecule of the structure has, Cp at or above
// the classical limit): not an approximation but a sum that cannot be
// true, from which kiln writes no NASA-7 block.
func BeyondBound(m benson.Missing) bool {
	return m.Group == benson.EntropyFloorGroup || m.Group == CpFloorGroup || m.Group == CpCeilingGroup
}

// FlagHeading is the word every command and the hover put before
// FlagText: "MISSING" for an approximation, "FLAGGED" for a group used as
// it stands with a known shortcoming (UsedAsItStands), "UNPHYSICAL" for a
// sum beyond a physical bound (BeyondBound), "APPROXIMATED" for a Cp kiln
// held below the classical limit (CpHeldGroup), "MODELLED" for a quantity
// computed by a validated model instead of a table
// (benson.Missing.Modelled), which check does not warn about. MISSING and
// FLAGGED are followed by "group" when the flag names a Benson group
// ("MISSING group C-(Cl)(C)(H)2"), not when it names an effect, a ring, a
// site increment or an interaction ("MISSING steric crowding across O").
func FlagHeading(f Flag) string {
	h := map[string]string{
		FlagModelled:     "MODELLED",
		FlagUnphysical:   "UNPHYSICAL",
		FlagApproximated: "APPROXIMATED",
		FlagFlagged:      "FLAGGED",
		FlagMissing:      "MISSING",
	}[FlagKind(f)]
	if k := FlagKind(f); (k == FlagFlagged || k == FlagMissing) && IsGroupName(f.Missing.Group) {
		h += " group"
	}
	return h
}

// IsGroupName reports whether s is a Benson group name kiln can read
// (centre, then its neighbours: "C-(C)(H)3", "Ck", "Nb").
func IsGroupName(s string) bool {
	_, err := benson.ParseGroupName(s)
	return err == nil
}

// The kinds of flag, as FlagKind names them (the JSON `flag_kinds` of
// estimate and summary); FlagHeading is the word each is shown with.
const (
	FlagModelled     = "modelled"     // a validated model's quantity: not warned about
	FlagUnphysical   = "unphysical"   // beyond a physical bound: fill writes no block
	FlagApproximated = "approximated" // Cp held below the classical limit
	FlagFlagged      = "flagged"      // a group used as it stands with a known shortcoming
	FlagMissing      = "missing"      // no value: an approximation stands in
)

// FlagKind classifies f: one of the Flag* constants.
func FlagKind(f Flag) string {
	switch {
	case f.Modelled():
		return FlagModelled
	case BeyondBound(f.Missing):
		return FlagUnphysical
	case f.Missing.Group == CpHeldGroup:
		return FlagApproximated
	case UsedAsItStands(f.Missing):
		return FlagFlagged
	}
	return FlagMissing
}

// FlagLine is a flag as a line of text: FlagHeading, a blank, FlagText
// ("MISSING group C-(Cl)(C)(H)2 (approximated by …)"). A surface that
// styles the parts (hover's Markdown) puts the same two together.
func FlagLine(f Flag) string { return FlagHeading(f) + " " + FlagText(f) }

// FlagText words one approximation the same way in every command: the
// group or quantity, "×N" when the estimate makes it N > 1 times, what
// stands in for it and why. A group used as it stands is not "approximated
// by" itself: the text says what its value lacks.
func FlagText(f Flag) string {
	m := f.Missing
	s := m.Group
	if f.Count > 1 {
		s += fmt.Sprintf(" ×%d", f.Count)
	}
	if BeyondBound(m) && m.Note != "" {
		return s + " (" + m.Note + ")" // nothing stands in: the sum as it is
	}
	if m.Group == CpHeldGroup {
		return s + " (" + m.Approximation + ": " + m.Note + ")" // not a group: a value kiln held
	}
	if UsedAsItStands(m) {
		s += " (used as it stands"
		if rest := unparenthesise(strings.TrimSpace(strings.TrimPrefix(m.Approximation, m.Group))); rest != "" {
			s += ", " + rest
		}
		if m.Note != "" {
			s += ": " + m.Note
		}
		return s + ")"
	}
	if m.Approximation != "" {
		verb := " (approximated by "
		if m.Modelled() {
			verb = " (computed by the "
		}
		s += verb + m.Approximation
		if m.Note != "" {
			s += ": " + m.Note
		}
		return s + ")"
	}
	if m.Note != "" {
		s += " (" + m.Note + ")"
	}
	return s
}

// unparenthesise turns a leading parenthesised remark into a clause of
// its own: "(value from X) without Y" → "value from X, without Y",
// "(derived from one molecule)" → "derived from one molecule".
func unparenthesise(s string) string {
	if !strings.HasPrefix(s, "(") {
		return s
	}
	depth := 0
	for i, r := range s {
		switch r {
		case '(':
			depth++
		case ')':
			depth--
			if depth == 0 {
				inner, rest := s[1:i], strings.TrimSpace(s[i+1:])
				if rest == "" {
					return inner
				}
				return inner + ", " + rest
			}
		}
	}
	return s
}

// sortedMissing lists the missing groups of an estimate by name.
func sortedMissing(g *benson.Result) []benson.Missing {
	if g == nil || len(g.Missing) == 0 {
		return nil
	}
	out := append([]benson.Missing(nil), g.Missing...)
	sort.Slice(out, func(i, j int) bool { return out[i].Group < out[j].Group })
	return out
}

// ringBonds marks the bonds (by index) that lie in a ring of the smallest set
// of smallest rings.
func ringBonds(m *molecule.Molecule) []bool {
	out := make([]bool, len(m.Bonds))
	for _, ring := range m.Rings() {
		for k := range ring {
			a, b := ring[k], ring[(k+1)%len(ring)]
			if bi := m.BondBetween(a, b); bi >= 0 {
				out[bi] = true
			}
		}
	}
	return out
}

// moleculeCache remembers structures by SMILES text: a molecule is read-only
// once parsed and caches its own canonical form and symmetry, so a
// re-analysis after an edit reads and canonicalises only new structures.
type moleculeCache struct {
	mu sync.Mutex
	m  map[string]parsed
}

func newMoleculeCache() *moleculeCache { return &moleculeCache{m: map[string]parsed{}} }

// maxCachedMolecules bounds the cache; past it the cache starts afresh.
const maxCachedMolecules = 200000

// parse returns the structure of smiles, from the cache when it was read before.
func (c *moleculeCache) parse(smiles string) parsed {
	c.mu.Lock()
	p, ok := c.m[smiles]
	c.mu.Unlock()
	if ok {
		return p
	}
	m, err := molecule.ParseSMILES(smiles)
	if err == nil {
		// One structure for the charge-separated and the pentavalent
		// spellings of a nitro or nitrate group (C[N+](=O)[O-], CN(=O)=O) or of
		// a sulfoxide or sulfone (C[S+](C)[O-], CS(C)=O):
		// duplicates, compare and estimates see the same molecule.
		m = m.NeutralOxo()
	}
	p = parsed{mol: m, err: err}
	if err == nil {
		p.formula, p.composition, p.charge, p.molarMass = m.Formula(), m.Composition(), m.Charge(), m.MolarMass()
		// Estimates are cached by the text: the same text is the same
		// structure, and no canonical form is needed to find it again.
		p.ident = "smiles:" + smiles
		p.inv = invariant(m)
	}
	c.mu.Lock()
	if len(c.m) >= maxCachedMolecules {
		c.m = map[string]parsed{}
	}
	// The text is a token of a file's source: a copy keeps the source of
	// a superseded version from being held by the cache.
	c.m[strings.Clone(smiles)] = p
	c.mu.Unlock()
	return p
}

// usesUserGroup reports whether the estimate g took a term from the user's
// group values (by name).
func usesUserGroup(g *benson.Result, user []benson.GroupValue) bool {
	for _, u := range user {
		if usesGroup(g, u.Name) {
			return true
		}
	}
	return false
}
