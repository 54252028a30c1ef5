// Package benson estimates gas-phase thermochemistry of a molecular graph by
// Benson's second-order group additivity: ΔHf°(298.15 K), S°(298.15 K, 1 bar)
// and Cp°(T) at the temperatures in StdTemps.
//
// The estimate is
//
//	ΔHf° = Σ groups + Σ corrections
//	S°   = Σ groups + Σ corrections − R ln σ + R ln n (+ R ln multiplicity for radicals)
//	Cp°  = Σ groups + Σ corrections
//
// where the groups are polyvalent atoms with their first neighbours written in
// Benson notation (C-(C)(H)3, Cd-(C)(H), Cb-(H), O-(C)(H), CO-(C)2 …), the
// corrections are ring strain, gauche, 1,5, cis and ortho interactions and,
// for radicals, hydrogen-bond increments; σ is the total (external × internal)
// symmetry number and n the number of optical isomers. All values are in SI:
// J/mol for ΔHf°, J/(mol K) for S° and Cp°. Tables are in kcal and cal and are
// converted with 1 cal = 4.184 J.
//
// Scope and refusals: every heavy atom must be the centre of exactly one
// group of the loaded tables (built-in plus user groups) or a terminal atom
// that its neighbour's group names (the =O of CO, a halogen ligand); the
// supported elements and environments are exactly the centres and ligands
// the loaded tables hold, so new group files extend the scope with no code
// change (groups.tsv for C/H/O, groups_nsx.tsv for N, S, F, Cl and Br; see
// hetero.go). Anything else — an element or environment without groups, a
// molecule too small to have groups, a charged or isotope-labelled atom, a
// multiplicity other than the one the structure implies, a structure of
// several disconnected parts, an atom with two unpaired electrons or unpaired
// electrons on bonded atoms (spin states without increment data) — is refused with an *UnsupportedError
// (or a *MissingGroupError naming a group the user could supply); no atom is
// ever left out of the sum. Groups with a stand-in, ring systems without a
// correction (rings.go, ringsys.go) and radical sites without increments
// are reported in Result.Missing and widen Result.Uncertainty. The small
// non-additive species (H2, O2, H2O, CO …) belong to a reference library,
// not to this package. The method is valid for ideal-gas molecules at
// 298.15 K and Cp from 300 K to 1500 K; values outside that range need a
// polynomial fit elsewhere.
package benson

import (
	"cmp"
	"context"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/internal/wording"
)

// R is the molar gas constant in J/(mol K) (CODATA 2018, exact).
const R = 8.314462618

// calorie is the thermochemical calorie in J.
const calorie = 4.184

// StdTemps are the temperatures (K) at which Cp° is tabulated and estimated.
var StdTemps = [7]float64{300, 400, 500, 600, 800, 1000, 1500}

// GroupValue is one tabulated group (or a user-defined one): its ΔHf°298 in
// J/mol, intrinsic S°298 in J/(mol K) (symmetry removed) and Cp° in J/(mol K)
// at StdTemps, with the published source of the numbers.
type GroupValue struct {
	Name   string
	Hf298  float64 // J/mol
	S298   float64 // J/(mol K)
	Cp     [7]float64
	Source string
}

// Options adjust an estimate. Zero values mean "compute".
type Options struct {
	Multiplicity   int          // spin multiplicity 2S+1; 0 = unpaired electrons + 1
	Symmetry       int          // total symmetry number σ; 0 = SymmetryNumber(m)
	OpticalIsomers int          // n; 0 = stereoisomers of the structure (molecule.OpticalIsomers)
	UserGroups     []GroupValue // win over the built-in table; names are normalised
}

// Term is one line of an estimate: Count × the value of one group or
// correction, already multiplied (Hf298, S298 and Cp are the contribution).
type Term struct {
	Name   string
	Count  int
	Hf298  float64 // J/mol, contribution
	S298   float64 // J/(mol K), contribution
	Cp     [7]float64
	Source string
	// Atoms lists, for a group term, the atoms it accounts for (0-based
	// indices into the structure estimated): the Count centres and the
	// terminal atoms their group names imply (=O of CO, Cl of C-(Cl)(H)3).
	// Every heavy atom appears in exactly one group term. Empty for
	// corrections.
	Atoms []int
}

// Missing records a group (or ring correction) absent from the tables and
// the value used in its place.
type Missing struct {
	Group         string // trade notation
	Approximation string // the group used instead ("" when none, contribution 0)
	Note          string // how it approximates
}

// siteModel is the Approximation of a radical site whose S°/Cp increment is
// computed by the statistical-mechanics site model (radical.go).
const siteModel = "statistical-mechanics site model"

// Modelled reports whether m is not a missing value but a quantity kiln
// computes by a validated model in place of a tabulated increment: the S°
// and Cp change at a radical site (tested against published radical
// entropies and heat capacities, testdata/thermo/radicals.tsv). Such an
// entry is shown with the estimate but is not an approximation to warn about.
func (m Missing) Modelled() bool { return m.Approximation == siteModel }

// EntropyOnly reports whether m concerns S° and Cp only, leaving ΔHf°298 as
// the groups give it (and so not widening the estimate's ΔHf° uncertainty).
func (m Missing) EntropyOnly() bool { return entropyOnly(m) }

// Result is the outcome of Estimate. Hf298, S298 and every Cp equal exactly
// the sum of Groups and Corrections. (Go does not allow a type and a function
// of the same name in one package, so the result type is Result.)
type Result struct {
	Formula   string
	MolarMass float64 // g/mol

	Hf298 float64    // J/mol
	S298  float64    // J/(mol K)
	Cp    [7]float64 // J/(mol K) at StdTemps

	Groups      []Term
	Corrections []Term

	SymmetryNumber int    // σ; 0 when σ exceeds the int range (see SymmetryExact)
	SymmetryExact  string // σ in decimal, exact for any size
	OpticalIsomers int
	Multiplicity   int

	Missing []Missing

	// Class is the compound class whose validation error gives Uncertainty.
	Class string
	// Uncertainty is the standard uncertainty (1σ) of ΔHf° in J/mol: the
	// class's measured error, widened by every approximation in Missing
	// (see uncertainty in class.go); ±2σ covers ≥ 80 % of the validation
	// species (TestAccuracy reports the coverage).
	Uncertainty float64

	// Form is the canonical SMILES of the resonance structure that was
	// estimated, when the species has more than one (resonance.go); ""
	// otherwise. ResonanceForms counts its distinct structures (0 when
	// there is only one).
	Form           string
	ResonanceForms int

	// UncertaintyS298 is a lower bound on the standard uncertainty (1σ) of
	// S°298 in J/(mol K) from the approximations that change S° (ring
	// systems without a whole-system S°; see addRingCorrections); 0 when
	// none does. kiln has no measured class error for S°, so 0 is not a
	// claim of exactness.
	UncertaintyS298 float64

	// sFloor is the physical lower bound on S°298 (sfloor.go), J/(mol K).
	sFloor float64
}

// Sigma returns σ in decimal, exact for any size.
func (r *Result) Sigma() string {
	if r.SymmetryExact != "" {
		return r.SymmetryExact
	}
	return strconv.Itoa(r.SymmetryNumber)
}

// Estimate estimates the thermochemistry of m. It fails for structures
// outside the method's scope (see the package comment: *UnsupportedError,
// or *MissingGroupError for a group with neither a table value nor an
// approximation); missing groups with an approximation are reported in
// Result.Missing, never dropped. The result depends on the graph only, not
// on how m was spelled, except through SymmetryNumber and OpticalIsomers,
// which the molecule package computes.
func Estimate(m *molecule.Molecule, opts Options) (*Result, error) {
	if m == nil || len(m.Atoms) == 0 {
		return nil, fmt.Errorf("benson: empty molecule")
	}
	// Charged and isotope-labelled atoms: refused, naming the atom of lowest
	// canonical symmetry class so that the reason does not depend on the
	// atom order of the SMILES.
	if err := elementScope(m); err != nil {
		return nil, err
	}
	if err := valenceScope(m); err != nil {
		return nil, err
	}
	// Charge-separated nitro, nitrate and N-oxide units are read as N=O,
	// sulfoxide and sulfone units as S=O, first (hetero_n.go).
	m = neutralOxo(m)
	// Disconnected parts before charges: a salt ([Br-].[NH4+]) is two
	// species, not a charge-separated structure.
	if n := components(m); n > 1 {
		return nil, &UnsupportedError{Reason: fmt.Sprintf("the structure has %d disconnected parts ('.' in the SMILES): a species is one molecule — give each part its own species, or give this one a thermo block", n)}
	}
	var refusals []atomError
	for i, a := range m.Atoms {
		switch {
		case a.Charge != 0 && !neutralIsocyanide(m, i): // R–N⁺≡C⁻ has groups (hetero_n.go)
			refusals = append(refusals, atomError{i, chargeRefusal(m, i)})
		case a.Isotope != 0:
			// Group values are for natural isotopic composition; a label
			// changes zero-point energies, masses and symmetry, which no
			// table here covers.
			refusals = append(refusals, atomError{i, &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%d%s) is isotope-labelled: the reference library holds no labelled species and group values are for natural isotopic composition", a.Isotope, a.Element)}})
		}
	}
	if len(refusals) > 0 {
		return nil, canonicalRefusal(m, refusals)
	}
	if err := spinScope(m); err != nil {
		return nil, err
	}
	unpaired := 0
	for _, a := range m.Atoms {
		unpaired += a.Radical
	}
	if opts.Multiplicity != 0 && opts.Multiplicity != unpaired+1 {
		// The method (parent + HBI + R ln(2S+1)) describes the high-spin
		// state the structure's unpaired electrons imply; another spin state
		// has a different energy that no table here gives.
		return nil, &UnsupportedError{Reason: fmt.Sprintf("multiplicity %d is not the one the structure implies (%s: multiplicity %d); group additivity has no data for other spin states", opts.Multiplicity, wording.Count(unpaired, "unpaired electron"), unpaired+1)}
	}
	forms, bounded := kekuleForms(m)
	if len(forms) > 1 {
		return chooseKekule(forms, opts)
	}
	// Radicals with several resonance structures are estimated as their
	// most stable one (resonance.go).
	est, err := estimateResonance(m, opts)
	if err == nil && bounded {
		est.Missing = append(est.Missing, Missing{
			Group:         "Kekulé structure of a non-benzenoid aromatic ring",
			Approximation: "the Kekulé structure read from the SMILES",
			Note:          fmt.Sprintf("too many Kekulé structures to compare (bound %d): the reader's is used", maxKekuleForms),
		})
		est.finish()
	}
	return est, err
}

// estimateForm estimates m as written: one Kekulé structure (kekule.go) and
// one resonance structure (resonance.go); m has passed Estimate's checks of
// charge, isotopes, connectivity, spin and multiplicity.
func estimateForm(m *molecule.Molecule, opts Options) (*Result, error) {
	// A cumulated ketene is refused per structure, so that a radical
	// spelled as one (O=C=C=C1[CH]C=CC=C1, [CH]=C=C=C=O) is estimated
	// through its other resonance structures, as when spelled otherwise.
	if err := keteneRefusal(m); err != nil { // ketene.go
		return nil, err
	}
	unpaired := m.UnpairedElectrons()
	tab := lookupTable(opts.UserGroups)
	est := &Result{Formula: m.Formula(), MolarMass: m.MolarMass()}

	// Radicals are estimated through their closed-shell parent.
	parent := m
	if unpaired > 0 {
		parent = parentOf(m)
	}
	g := newGraph(parent)
	if err := ringTriple(g); err != nil { // rings.go
		return nil, err
	}

	if err := addGroups(g, tab, est); err != nil {
		return nil, err
	}
	addRingCorrections(g, tab, est)
	addRingEntropyFlags(tab, est) // rings.go
	addInteractions(g, tab, est)
	addPolarPairFlags(g, est) // bias.go
	addCrowdingFlags(g, est)  // bias.go
	addAzineRingFlags(g, est) // bias.go
	addHalogenFlags(g, tab, est)
	addAzineFlags(g, tab, est)     // hetero_n.go
	addCumulatedFlags(g, tab, est) // ketene.go
	if unpaired > 0 {
		if err := addHBI(m, g, tab, est); err != nil {
			return nil, err
		}
		addRingRadical(m, est) // small and cyclically conjugated rings (ringradical.go)
	}

	// Spin, symmetry and optical isomers, on the species itself.
	est.Multiplicity = opts.Multiplicity
	if est.Multiplicity == 0 {
		est.Multiplicity = unpaired + 1
	}
	var sy *sym // σ and n are properties of the species itself, not of its parent
	if opts.Symmetry == 0 || opts.OpticalIsomers == 0 {
		sy = symmetryOf(context.Background(), m)
	}
	est.SymmetryNumber, est.SymmetryExact = opts.Symmetry, strconv.Itoa(opts.Symmetry)
	lnSigma := math.Log(float64(opts.Symmetry))
	if opts.Symmetry == 0 {
		if sy.err != nil {
			return nil, sy.err
		}
		est.SymmetryNumber, est.SymmetryExact, lnSigma = sy.number(), sy.exact.String(), lnBig(sy.exact)
	}
	est.OpticalIsomers = opts.OpticalIsomers
	if est.OpticalIsomers == 0 {
		n, err := sy.opticalIsomers()
		if err != nil {
			return nil, err
		}
		est.OpticalIsomers = n
	}
	// the three terms, in this order, in one allocation
	k := 0
	for _, present := range []bool{est.Multiplicity > 1, lnSigma > 0, est.OpticalIsomers > 1} {
		if present {
			k++
		}
	}
	est.Corrections = slices.Grow(est.Corrections, k)
	if est.Multiplicity > 1 {
		est.Corrections = append(est.Corrections, Term{
			Name: statTermName(spinTermNames[:], "spin degeneracy R ln ", est.Multiplicity), Count: 1,
			S298: R * math.Log(float64(est.Multiplicity)), Source: "statistical mechanics",
		})
	}
	if lnSigma > 0 {
		est.Corrections = append(est.Corrections, Term{
			Name: symmetryTermName(est.SymmetryNumber, est.SymmetryExact), Count: 1,
			S298: -R * lnSigma, Source: "statistical mechanics",
		})
	}
	if est.OpticalIsomers > 1 {
		est.Corrections = append(est.Corrections, Term{
			Name: statTermName(opticalTermNames[:], "optical isomers R ln ", est.OpticalIsomers), Count: 1,
			S298: R * math.Log(float64(est.OpticalIsomers)), Source: "statistical mechanics",
		})
	}

	est.Class = classify(m, g)
	est.sFloor = entropyFloor(m, lnSigma, est.Multiplicity)
	est.finish()
	return est, nil
}

// Names of the statistical-mechanics terms for the common small values,
// made once and shared by every estimate (read only).
var (
	spinTermNames     = statTermNames("spin degeneracy R ln ")
	symmetryTermNames = statTermNames("symmetry -R ln ")
	opticalTermNames  = statTermNames("optical isomers R ln ")
)

func statTermNames(prefix string) (out [65]string) {
	for k := range out {
		out[k] = prefix + strconv.Itoa(k)
	}
	return out
}

// statTermName is prefix followed by n, from names when n is small.
func statTermName(names []string, prefix string, n int) string {
	if n >= 0 && n < len(names) {
		return names[n]
	}
	return prefix + strconv.Itoa(n)
}

// symmetryTermName names the symmetry term of σ (exact: σ in decimal).
func symmetryTermName(sigma int, exact string) string {
	if sigma > 0 && sigma < len(symmetryTermNames) && exact == strconv.Itoa(sigma) {
		return symmetryTermNames[sigma]
	}
	return "symmetry -R ln " + exact
}

// finish puts the groups and flags of e in their canonical order and sets
// the totals and the uncertainty from them. The order of every list of a
// Result depends on the graph only, never on the atom order of the SMILES:
// groups are sorted by name, flags by group, approximation and note, and
// every producer of corrections appends them in a fixed order (ring
// strain by name, interactions, HBI by site, spin, symmetry, optical
// isomers). The totals are summed in that order, so two spellings of one
// molecule agree to the last bit.
func (e *Result) finish() {
	slices.SortStableFunc(e.Groups, func(a, b Term) int { return strings.Compare(a.Name, b.Name) })
	slices.SortStableFunc(e.Missing, func(a, b Missing) int {
		return cmp.Or(strings.Compare(a.Group, b.Group), strings.Compare(a.Approximation, b.Approximation), strings.Compare(a.Note, b.Note))
	})
	e.Hf298, e.S298, e.Cp = 0, 0, [7]float64{}
	for _, t := range e.Groups {
		e.add(t)
	}
	for _, t := range e.Corrections {
		e.add(t)
	}
	added := false
	if f, ok := cpFalls(e); ok && !slices.ContainsFunc(e.Missing, func(m Missing) bool { return m.Group == cpFallsGroup }) {
		e.Missing, added = append(e.Missing, f), true
	}
	if f, ok := entropyFloorFlag(e); ok && !slices.ContainsFunc(e.Missing, func(m Missing) bool { return m.Group == entropyFloorGroup }) {
		e.Missing, added = append(e.Missing, f), true
	}
	if added {
		slices.SortStableFunc(e.Missing, func(a, b Missing) int {
			return cmp.Or(strings.Compare(a.Group, b.Group), strings.Compare(a.Approximation, b.Approximation), strings.Compare(a.Note, b.Note))
		})
	}
	e.setUncertainty()
}

// cpFallsGroup names the flag for a group sum whose Cp falls with T.
const cpFallsGroup = "Cp(T) of the group sum"

// cpFalls reports a group sum whose heat capacity falls by more than 0.2 %
// from one tabulated temperature to the next. The heat capacity of a
// molecule without low-lying electronic states rises with T (more
// vibrational modes excited); a falling sum means some group values, often
// the 1500 K entries of quaternary centres, do not add up for this
// structure, so the Cp (and the fits made from it) is flagged.
func cpFalls(e *Result) (Missing, bool) {
	for i := 1; i < len(e.Cp); i++ {
		if e.Cp[i] < 0.998*e.Cp[i-1] {
			return Missing{
				Group:         cpFallsGroup,
				Approximation: "the group sum as it stands",
				Note:          fmt.Sprintf("Cp falls from %.1f J/(mol K) at %g K to %.1f at %g K, which a molecule's heat capacity does not do; the group values do not add up for this structure", e.Cp[i-1], StdTemps[i-1], e.Cp[i], StdTemps[i]),
			}, true
		}
	}
	return Missing{}, false
}

// setUncertainty sets e.Uncertainty from its class and approximations.
func (e *Result) setUncertainty() {
	strain := 0.0 // kcal/mol, ring and ring-system strain applied
	for _, c := range e.Corrections {
		if strings.HasPrefix(c.Name, "ring") {
			strain += c.Hf298 / calorie / 1000
		}
	}
	e.Uncertainty = uncertainty(e.Class, e, strain)
}

func (e *Result) add(t Term) {
	e.Hf298 += t.Hf298
	e.S298 += t.S298
	for i := range e.Cp {
		e.Cp[i] += t.Cp[i]
	}
}

// term multiplies a table value by count.
func term(v GroupValue, count int) Term {
	t := Term{Name: v.Name, Count: count, Source: v.Source}
	c := float64(count)
	t.Hf298 = c * v.Hf298
	t.S298 = c * v.S298
	for i := range t.Cp {
		t.Cp[i] = c * v.Cp[i]
	}
	return t
}

// parentOf returns a copy of m with every unpaired electron replaced by a
// hydrogen: the closed-shell parent used by the HBI method.
func parentOf(m *molecule.Molecule) *molecule.Molecule { return m.ClosedShellParent() }

// components returns the number of connected parts of m.
func components(m *molecule.Molecule) int {
	seen := make([]bool, len(m.Atoms))
	n := 0
	for s := range m.Atoms {
		if seen[s] {
			continue
		}
		n++
		seen[s] = true
		stack := []int{s}
		for len(stack) > 0 {
			i := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			for _, b := range m.Adj[i] {
				if j := m.Other(b, i); !seen[j] {
					seen[j] = true
					stack = append(stack, j)
				}
			}
		}
	}
	return n
}

// spinScope refuses the spin states that hydrogen-bond increments do not
// describe. An increment is the energy of breaking one X–H bond to leave one
// unpaired electron on X, with the other electrons paired; it says nothing
// about
//
//   - an atom with two or more unpaired electrons (carbene, vinylidene,
//     nitrene or atom centres such as C=[C] and [CH2]): their singlet and
//     triplet states differ by up to tens of kcal/mol, and which is the
//     ground state depends on the substituents;
//   - unpaired electrons on bonded atoms ([C]#[C], [CH]=[CH]): the two
//     electrons couple to a (partial) bond, a state with no increment.
//
// Such species need a thermo block (or are in the reference library, which
// is consulted before this package).
// groupElement reports whether the group tables know element el: centres
// or ligands of tabulated groups, and I as a ligand a user can give values
// for (`group C-(I)(H)3`).
func groupElement(el string) bool {
	switch el {
	case "C", "H", "O", "N", "S", "F", "Cl", "Br", "I":
		return true
	}
	return false
}

// elementScope refuses a structure with an element no group can hold
// (Si, P, metals, noble gases not in the reference library …), naming the
// element before anything else is said about the atom: [Si] is not a
// carbene-type centre to kiln, it is an element without groups. The atom
// named is the first of the alphabetically first such element.
func elementScope(m *molecule.Molecule) error {
	best := -1
	for i, a := range m.Atoms {
		if !groupElement(a.Element) && (best < 0 || a.Element < m.Atoms[best].Element) {
			best = i
		}
	}
	if best < 0 {
		return nil
	}
	el := m.Atoms[best].Element
	return &UnsupportedError{Atom: best + 1, Element: el, Reason: fmt.Sprintf("(%s): unsupported element %s (kiln's group tables cover C, H, O, N, S, F, Cl and Br; I only with `group` values you supply)", el, el)}
}

// ordinaryValence returns the valence of a neutral atom of element el
// whose extended valences (allowed by SMILES: N 5, Cl 3, 5, 7 …) no group
// describes, with the one exception valenceScope allows; ok is false for
// other elements.
func ordinaryValence(el string) (valence int, ok bool) {
	switch el {
	case "N":
		return 3, true
	case "F", "Cl", "Br", "I":
		return 1, true
	}
	return 0, false
}

// valenceScope refuses a neutral atom written with more bonds than its
// ordinary valence (N#N=O: five bonds on the middle N), naming the atom and
// its bonds, before any group is looked for. The one extended valence the
// groups describe is the nitro/nitrate nitrogen N(=O)=O; charge-separated
// structures ([N+], [O-]) are read by neutralOxo and chargeRefusal, not here.
// It runs on the structure as written.
func valenceScope(m *molecule.Molecule) error {
	for i, a := range m.Atoms {
		max, ok := ordinaryValence(a.Element)
		if !ok || a.Charge != 0 {
			continue
		}
		total, doubleO := a.HCount, 0
		var bonds []string
		for _, b := range m.Adj[i] {
			j := m.Other(b, i)
			order := m.Bonds[b].Order
			total += order
			if order == 2 && m.Atoms[j].Element == "O" {
				doubleO++
			}
			bonds = append(bonds, fmt.Sprintf("%s bond to atom %d (%s)", bondWord(order), j+1, m.Atoms[j].Element))
		}
		if a.HCount > 0 {
			bonds = append(bonds, fmt.Sprintf("%d H", a.HCount))
		}
		if total <= max || a.Element == "N" && total == 5 && doubleO == 2 {
			continue
		}
		why := "no group describes a halogen with more than one bond"
		if a.Element == "N" {
			why = "the only five-bond N kiln's groups describe is the nitro/nitrate N(=O)=O (N-oxides are written with formal charges, e.g. N#[N+][O-])"
		}
		return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) exceeds its valence: %d bonds (%s) where a neutral %s has %d; %s",
			a.Element, total, strings.Join(bonds, ", "), a.Element, max, why)}
	}
	// Any other centre with more than four electron domains (SF4, SF6,
	// SF5Cl, (CH3)2SF2): the S groups describe two-coordinate sulfur and
	// the sulfoxide and sulfone units only, and a group statement cannot
	// name it (benson.ParseGroupName), so the refusal offers no group.
	if i, partners, other, ok := m.HypervalentCentre(); ok {
		return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) is a hypervalent centre: %d σ partners and %s (lone pairs or an odd electron), more than four electron domains in all (as in SF4 or SF6); no group describes it",
			m.Atoms[i].Element, partners, wording.Count(other, "other electron domain"))}
	}
	return nil
}

// bondWord names a bond order.
func bondWord(order int) string {
	switch order {
	case 1:
		return "single"
	case 2:
		return "double"
	case 3:
		return "triple"
	}
	return fmt.Sprintf("order-%d", order)
}

func spinScope(m *molecule.Molecule) error {
	// The atom named is chosen by element (then electron count), never by
	// atom order, so that every spelling gets the same message.
	best := -1
	for i, a := range m.Atoms {
		if a.Radical > 1 && (best < 0 || a.Element < m.Atoms[best].Element ||
			a.Element == m.Atoms[best].Element && a.Radical > m.Atoms[best].Radical) {
			best = i
		}
	}
	if best >= 0 {
		a := m.Atoms[best]
		reason := fmt.Sprintf("(%s) carries %d unpaired electrons (a carbene- or vinylidene-type centre): its spin states have no hydrogen-bond-increment data", a.Element, a.Radical)
		if isocyanideCarbene(m, best) {
			// R–N=C: is the carbene spelling of an isocyanide, which kiln
			// estimates written as R–N⁺≡C⁻.
			reason += "; an isocyanide is written with its charges, R–[N+]#[C-]"
		}
		return &UnsupportedError{Atom: best + 1, Reason: reason}
	}
	pair, at, first, second := "", 0, "", ""
	for _, b := range m.Bonds {
		x, y := m.Atoms[b.A], m.Atoms[b.B]
		if x.Radical == 0 || y.Radical == 0 {
			continue
		}
		i := b.A
		if y.Element < x.Element {
			x, y, i = y, x, b.B
		}
		if p := x.Element + "–" + y.Element; pair == "" || p < pair {
			pair, at, first, second = p, i+1, x.Element, y.Element
		}
	}
	if pair != "" {
		reason := fmt.Sprintf("(%s) and its %s neighbour both carry an unpaired electron: the coupled spin state has no hydrogen-bond-increment data", first, second)
		if p, ok := pairBonded(m); ok { // every electron here is single
			// The canonical SMILES of the structure with the pairs bonded:
			// the same for every spelling, and what the user most likely means.
			reason += fmt.Sprintf("; paired into a bond they give the molecule %s", p.Canonical())
		}
		return &UnsupportedError{Atom: at, Reason: reason}
	}
	return nil
}
