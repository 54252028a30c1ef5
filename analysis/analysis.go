// Package analysis turns the text of kiln files into everything the CLI and the
// language server report: resolved species with their thermochemistry (given in
// the file or estimated), reaction balance and thermochemistry, and diagnostics.
//
// Analysis is a pure function of text. A Workspace holds file contents in
// memory (path → bytes) and asks an injected Loader for files it does not hold
// (included files not open in an editor); it never touches the disk itself.
// Results carry byte offsets into the files; converting to lines and UTF-16
// columns is the caller's job (see speciesfile.LineIndex).
package analysis

import (
	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/speciesfile"
)

// Settings are the user-adjustable parameters of an analysis.
type Settings struct {
	// DisplayUnits is "kcal/mol" or "kJ/mol": how energies are shown to
	// people; "" shows them in the file's own unit (see Units).
	DisplayUnits string
	// TMid and THigh are the NASA-7 fit temperatures in K (T_low is 300 K).
	TMid, THigh float64
	// ExplicitFitRange says TMid and THigh were chosen by the user: they then
	// apply to every inserted block, reference-library species included.
	ExplicitFitRange bool
	// MismatchHf298 (J/mol) and MismatchS298 (J/(mol K)) are the thresholds of
	// the thermo-mismatch check between a given block and the estimate.
	MismatchHf298, MismatchS298 float64
	// MismatchCp (J/(mol K)) is the threshold of the comparison of Cp(T)
	// over a block's range; the comparison of H(T)−H(298 K) uses
	// MismatchHf298.
	MismatchCp float64
	// CollisionFactor multiplies the collision-limit bound (1 = the plain bound).
	CollisionFactor float64
	// Pressure (Pa) is where pressure-dependent rates are shown (k_f, k_r
	// in summaries and hovers); 0 means 1 atm. The collision-limit check
	// scans kinetics.CheckPressures whatever this is.
	Pressure float64
	// Stamp is written into the source line of blocks kiln inserts, e.g.
	// "kiln 0.1.0, 2026-12-01". The caller sets it; analysis reads no clock.
	Stamp string
}

// DefaultSettings returns the documented defaults: the file's units, fits at
// 1000/5000 K, mismatch thresholds 3 kcal/mol, 3 cal/(mol K) and (Cp)
// 1.5 cal/(mol K), collision factor 1, rates shown at 1 atm.
func DefaultSettings() Settings {
	return Settings{
		DisplayUnits:    "",
		TMid:            1000,
		THigh:           5000,
		MismatchHf298:   3 * 4184,
		MismatchS298:    3 * 4.184,
		MismatchCp:      1.5 * 4.184,
		CollisionFactor: 1,
	}
}

// pressure returns the pressure (Pa) at which rates are shown.
func (s Settings) pressure() float64 {
	if s.Pressure > 0 {
		return s.Pressure
	}
	return 101325
}

// ThermoSource says where the thermochemistry of a species comes from.
type ThermoSource string

// Thermo sources; the strings are part of the summary JSON contract
// (thermo_source: "file", "estimate" or "none", nothing else). Kiln's
// reference-library data are not a fourth value: such a species is
// SourceEstimate, refined by Species.ReferenceLibrary (the JSON key
// reference_library, the word "library" in text; ThermoWord).
const (
	SourceFile     ThermoSource = "file"
	SourceEstimate ThermoSource = "estimate"
	SourceNone     ThermoSource = "none"
)

// ReferenceLibrary names the reference-library entry whose tabulated data
// are the thermo the analysis uses for sp; "" when that is the file's
// block, a group-additivity estimate or nothing.
func (sp *Species) ReferenceLibrary() string {
	if sp.Source != SourceEstimate || sp.Estimate == nil {
		return ""
	}
	return sp.Estimate.Library
}

// ThermoWord is sp's thermo source as text shows it: the JSON value
// (Source), except "library" for reference-library data (ReferenceLibrary),
// which are tabulated, not estimated.
func (sp *Species) ThermoWord() string {
	if sp.ReferenceLibrary() != "" {
		return "library"
	}
	return string(sp.Source)
}

// Location is a span in a file of the workspace.
type Location struct {
	File string
	Span speciesfile.Span
}

// Species is a resolved species declaration.
type Species struct {
	Name string
	// File is the file declaring the species, Decl its declaration there.
	// A Species holds no position: a declaration moved by an edit
	// elsewhere keeps its value. Result.SpeciesLoc gives where it is.
	File string
	Decl *speciesfile.Species

	Mol         *molecule.Molecule // nil without a (valid) structure
	SMILESError error              // *molecule.SMILESError when the SMILES is bad
	Formula     string
	Composition map[string]int
	Charge      int
	MolarMass   float64 // g/mol, 0 when unknown

	// Estimate is the group-additivity (or reference-library) estimate, nil
	// when the structure cannot be estimated.
	Estimate *Estimate
	// Given is the file's own thermo block converted to a polynomial or a table.
	Given *GivenThermo
	// Source tells which of Given or Estimate the analysis uses.
	Source ThermoSource

	estimateErr   error        // why a structure could not be estimated
	rootReported  bool         // a diagnostic already names why there is no thermo
	brokenBlock   bool         // the declaration's thermo block has a syntax error or overflows
	overflowBlock bool         // … and the fault is values that overflow (see overflowSpan)
	ident         string       // estimate-cache key of the structure
	inv           string       // invariant(Mol): a cheap fingerprint for duplicate search
	structKey     string       // inv and multiplicity: the bucket of the duplicate-structure search
	structHash    uint64       // hashKey(structKey), made with the unit
	unit          *speciesUnit // the memoized unit the species was made from
}

// Estimate is the thermochemistry kiln computes for a structure.
type Estimate struct {
	// Group is the additivity breakdown; nil for reference-library species.
	Group *benson.Result
	// Library names the reference entry used instead of groups ("" if none).
	Library       string
	LibrarySource string
	Hf298, S298   float64    // J/mol, J/(mol K)
	Cp            [7]float64 // J/(mol K) at benson.StdTemps
	Uncertainty   float64    // J/mol, 1σ
	// StatedUncertainty is, for a reference-library species, the ± its
	// source states for ΔHf°298 (J/mol) where kiln carries one; Uncertainty
	// is half of it.
	StatedUncertainty float64
	// Multiplicity is the spin multiplicity 2S+1 of the data: the library
	// entry's ground state, or the estimate's.
	Multiplicity int
	// The NASA-7 polynomial comes from NASA7(), the model for reaction
	// thermochemistry from Thermo().
	libPoly    nasa.NASA7
	libFit     nasa.FitReport // the library's fit of libPoly to its source's Cp; zero when entered as published NASA-7 blocks
	model      *groupThermo
	fit        *fitResult
	cp0, cpInf float64 // classical limits for the fit (J/(mol K))
	tMid       float64
	tHigh      float64
	// flags are approximations analysis adds to the engine's (Group.Missing):
	// a Cp below the ideal-gas floor (cpfloor.go).
	flags []benson.Missing
	// cpFloor, when set, refuses the NASA-7 fit (Cp below the floor).
	cpFloor *cpFloorError
}

// GivenThermo is the thermochemistry written in the file for a species.
type GivenThermo struct {
	Poly  *nasa.NASA7 // from a nasa7 block
	Table *Table      // from a thermo-table block
	// Span is the block, relative to the start of the declaration
	// (Species.Decl) in its file.
	Span  speciesfile.RelSpan
	model *groupThermo // the table integrated, for reaction thermochemistry
}

// Table is a thermo-table block in SI units.
type Table struct {
	Hf298, S298 float64
	T, Cp       []float64
}

// Reaction is a resolved reaction with everything kiln can compute about it.
// Pointer fields are nil when the value cannot be computed.
type Reaction struct {
	Decl *speciesfile.Reaction
	File string
	// (A Reaction holds no position: a statement moved by an edit
	// elsewhere keeps its value. Result.ReactionLine gives its line.)
	Equation string
	// Resolved is false when a species of the equation is undeclared.
	Resolved bool
	Balance  *kinetics.Balance
	DH298    *float64 // J/mol
	DS298    *float64 // J/(mol K)
	DG298    *float64 // J/mol
	// Kp at 298.15, 1000 and 1500 K (dimensionless, 1 bar).
	Kp map[string]*float64
	// ForwardRate1000 and ReverseRate1000 are k_f and k_r at 1000 K and the
	// settings' pressure, in cm, mol, s units of ForwardOrder and
	// ReverseOrder (see RateUnits).
	ForwardRate1000, ReverseRate1000 *float64
	ForwardOrder, ReverseOrder       int
	Collision                        *kinetics.Violation
	// RateTableEdge is the tabulated pressure (Pa) whose rate stands for
	// the settings' pressure when that lies outside the reaction's
	// pressure table (no extrapolation); 0 otherwise.
	RateTableEdge float64

	model *rateModel // nil without usable rate parameters

	reactants, products kinetics.Side // thermo of each side, nil when unknown
	diags               []speciesfile.Diagnostic
	unit                *reactionUnit // the memoized unit the reaction was made from
	// declared: every name the reaction uses (terms, efficiencies, falloff
	// collider) was declared when it was resolved.
	declared bool
}
