package analysis

import (
	"context"
	"sync"

	"kiln.dev/kiln/speciesfile"
)

// Loader reads a file the workspace does not hold in memory (an included
// file that no editor has open). The CLI and the server pass a function that
// reads the disk; tests pass a map.
type Loader func(path string) ([]byte, error)

// Workspace holds the text of the files being analysed and a cache of
// estimates keyed by canonical structure. It is safe for concurrent use.
type Workspace struct {
	root string
	load Loader

	mu       sync.Mutex
	settings Settings
	overlay  map[string][]byte // open documents: path → text
	cache    *estimateCache
	mols     *moleculeCache

	incremental bool
	memos       map[string]*memoTables       // by analysed path: units of its last finished analysis
	results     map[string]*Result           // by analysed path: its last finished analysis (with memos)
	moved       int                          // results made by movedResult (read by tests)
	scratches   sync.Pool                    // of *passScratch
	parses      map[string]*speciesfile.File // by path: the latest parse, read again incrementally
}

// Result is the analysis of one file together with the files it includes.
type Result struct {
	Path     string
	Settings Settings
	File     *speciesfile.File
	// Files holds the parsed file and every file it includes, by path.
	Files map[string]*speciesfile.File
	// Diagnostics of Path only, sorted by offset.
	Diagnostics []speciesfile.Diagnostic
	// Species declared in Path and its includes, in declaration order; the
	// first declaration of a name wins in ByName.
	Species []*Species
	ByName  map[string]*Species
	// Reactions declared in Path.
	Reactions []*Reaction
	// Groups are the user-defined group values visible from Path.
	Groups []*Group
	// Includes lists the include statements of Path with their resolved path
	// ("" when unresolved).
	Includes []ResolvedInclude

	order []string // files in resolution order
	// lineNames are the diagnostics whose message names a line of the
	// analysed file (such as the first declaration of a repeated name),
	// which an edit adding or removing lines renumbers (movedResult);
	// namesLines is set when a message names a line some other way (of
	// another file). Both are written by reportNamingLine only, from the
	// serial passes.
	lineNames  []lineName
	namesLines bool
	usesOnce   sync.Once
	uses       map[string][]Location
}

// Uses lists, per species name, every place a name is used in a reaction
// (terms, efficiencies, falloff collider) in Path and its includes, in
// resolution order. It is built on first use.
func (r *Result) Uses() map[string][]Location {
	r.usesOnce.Do(func() {
		r.uses = map[string][]Location{}
		for _, path := range r.order {
			f := r.Files[path]
			for k, d := range f.Reactions {
				recordUses(r.uses, path, d, f.ReactionStart(k))
			}
		}
	})
	return r.uses
}

// declStart returns where the declaration of sp starts in its file.
func (r *Result) declStart(sp *Species) int {
	return r.Files[sp.File].Start(sp.Decl)
}

// SpeciesLoc returns the location of the name in the declaration of sp (a
// species of r).
func (r *Result) SpeciesLoc(sp *Species) Location {
	return Location{File: sp.File, Span: sp.Decl.Name.Span.At(r.declStart(sp))}
}

// ProblemLoc returns where the reason sp (a species of r) has no thermo is
// reported: for a species whose SMILES cannot be read, the offending
// character (or the token), as check's bad-smiles diagnostic marks it;
// otherwise the name, as SpeciesLoc. fill lists skipped species there.
func (r *Result) ProblemLoc(sp *Species) Location {
	if sp.SMILESError != nil && sp.Decl.SMILES != nil {
		ts := sp.Decl.SMILES.Span.At(r.declStart(sp))
		return Location{File: sp.File, Span: smilesErrorSpan(ts, sp.Decl.SMILES.Text, sp.SMILESError)}
	}
	return r.SpeciesLoc(sp)
}

// ReactionLine returns the 1-based line of reaction rx (a reaction of r), as
// StmtLine.
func (r *Result) ReactionLine(rx *Reaction) int {
	return StmtLine(r.Files[rx.File], rx.Decl)
}

// ResolvedInclude is an include statement and the path it resolved to.
type ResolvedInclude struct {
	Decl *speciesfile.Include
	Path string
}

// Group is a user-defined Benson group value from a `group` statement.
type Group struct {
	Name   string // normalised Benson notation
	Loc    Location
	Decl   *speciesfile.Group
	UsedBy []string // species names whose estimate uses this group
}

// NewWorkspace returns a workspace rooted at root (includes must stay inside
// it) that reads files it does not hold through load.
func NewWorkspace(root string, load Loader, s Settings) *Workspace {
	return &Workspace{root: root, load: load, settings: s, overlay: map[string][]byte{}, cache: newEstimateCache(), mols: newMoleculeCache()}
}

// Root returns the workspace root directory.
func (w *Workspace) Root() string { return w.root }

// Settings returns the current settings.
func (w *Workspace) Settings() Settings {
	w.mu.Lock()
	defer w.mu.Unlock()
	return w.settings
}

// SetSettings replaces the settings; later analyses use them.
func (w *Workspace) SetSettings(s Settings) {
	w.mu.Lock()
	defer w.mu.Unlock()
	w.settings = s
}

// SetOverlay records the in-memory text of a file (an open document).
func (w *Workspace) SetOverlay(path string, text []byte) {
	w.mu.Lock()
	defer w.mu.Unlock()
	w.overlay[path] = text
}

// CloseOverlay forgets the in-memory text of a file; later reads go to the Loader.
func (w *Workspace) CloseOverlay(path string) {
	w.mu.Lock()
	defer w.mu.Unlock()
	delete(w.overlay, path)
}

// Overlays returns the paths of the files held in memory.
func (w *Workspace) Overlays() []string {
	w.mu.Lock()
	defer w.mu.Unlock()
	out := make([]string, 0, len(w.overlay))
	for p := range w.overlay {
		out = append(out, p)
	}
	return out
}

// read returns the text of path from the overlay or the loader.
func (w *Workspace) read(path string) ([]byte, error) {
	w.mu.Lock()
	text, ok := w.overlay[path]
	w.mu.Unlock()
	if ok {
		return text, nil
	}
	return w.load(path)
}

// Analyze parses path and its includes and computes everything about it.
// It returns an error only when path itself cannot be read or ctx is done.
func (w *Workspace) Analyze(ctx context.Context, path string) (*Result, error) {
	return w.analyze(ctx, path)
}

// passScratch holds the temporary tables of the species and reaction passes
// of one analysis. They are recycled between analyses (each one takes its
// own, emptied) so that an edit of a large file does not allocate them
// again: garbage is what costs an edit most.
type passScratch struct {
	items   []speciesItem
	structs structBuckets
	seen    map[uint64]int32
	occs    []dupOccurrence
}

// speciesItem is a species declaration in the species pass.
type speciesItem struct {
	path string
	f    *speciesfile.File
	k    int // index in f.Species
	sp   *Species
	u    *speciesUnit
	// reused: sp is the last analysis's value for the same unit
	reused bool
	// diags of the species' rules when there is no memo (no unit is
	// made: nothing would reuse it).
	diags []speciesfile.Diagnostic
}

// dupOccurrence is the first occurrence of a reaction's duplicate key in the
// reaction pass.
type dupOccurrence struct {
	key   string
	d     *speciesfile.Reaction
	start int // where d starts in file
	file  string
	next  int32 // index of the next occurrence with the same hash, -1 for none
}

// scratch returns empty tables for a pass.
func (w *Workspace) scratch() *passScratch {
	if sc, ok := w.scratches.Get().(*passScratch); ok {
		return sc
	}
	return &passScratch{structs: structBuckets{ends: map[uint64][2]int32{}}, seen: map[uint64]int32{}}
}

// release empties sc (it holds no value of the analysis any more) and
// keeps it for the next analysis.
func (w *Workspace) release(sc *passScratch) {
	clear(sc.items[:cap(sc.items)])
	clear(sc.occs[:cap(sc.occs)])
	clear(sc.structs.ends)
	sc.structs.next = sc.structs.next[:0]
	clear(sc.seen)
	w.scratches.Put(sc)
}
