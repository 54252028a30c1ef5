package analysis

import (
	"cmp"
	"context"
	"errors"
	"fmt"
	"path/filepath"
	"runtime"
	"slices"
	"sort"
	"strings"
	"sync"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/speciesfile"
)

// Limits on includes (documented in FORMAT.md).
const (
	maxIncludeDepth = 16
	maxFileSize     = 64 << 20
)

// CodeBadInclude and CodeDuplicateGroup are kept for callers of this
// package; the one list of codes is in speciesfile (speciesfile.Codes).
const (
	CodeBadInclude     = speciesfile.CodeBadInclude
	CodeDuplicateGroup = speciesfile.CodeDuplicateGroup
)

// analysis is the state of one Analyze call.
type analysis struct {
	w   *Workspace
	ctx context.Context
	set Settings
	res *Result
	// order is the files in resolution order: includes before the statements
	// that follow them, depth first.
	order []string
	// userKey identifies the user-defined groups in estimate cache keys.
	userKey string
	// userFlags are the approximations of user-defined groups (a Cp not
	// given at every group temperature, groupcp.go), one per group.
	userFlags []benson.Missing
	// memo holds the per-statement units kept between analyses (nil when
	// the workspace is not incremental).
	memo *memo
	// sink, when set, receives every reported diagnostic instead of the
	// result: the rules of one statement run with their own sink so that
	// their diagnostics can be kept with the statement's unit.
	sink *[]speciesfile.Diagnostic
	// stmtBase is where the statement whose rules run starts: the rules
	// report the spans of their statement at stmtBase (a.at). Rules whose
	// diagnostics are kept in a unit run with stmtBase 0, so that the unit
	// holds spans relative to the statement (see memo.go).
	stmtBase int
	// stmtStart is where that statement starts in its file (stmtBase
	// when the rules report absolute spans).
	stmtStart int
	// spStart holds where the declaration of each species of res.Species
	// starts in its file.
	spStart []int
	// via maps each included file to the include statement of the analysed
	// file through which it is reached (where its problems are reported).
	via map[string]*speciesfile.Include
	// viaDups counts the same-structure reports made on each include.
	viaDups map[*speciesfile.Include]int
}

func (w *Workspace) analyze(ctx context.Context, path string) (*Result, error) {
	path = filepath.Clean(path)
	text, err := w.read(path)
	if err != nil {
		return nil, fmt.Errorf("analysing %s: %w", path, err)
	}
	set := w.Settings()
	f := w.parse(path, text)
	if r := w.movedResult(path, f, set); r != nil {
		return r, nil
	}
	a, err := w.startAnalysis(ctx, set, path, f)
	if err != nil {
		return nil, err
	}
	a.res.order = a.order
	a.groups()
	if err := a.species(); err != nil {
		return nil, err
	}
	if err := a.reactions(); err != nil {
		return nil, err
	}
	sortDiagnostics(a.res.Diagnostics)
	w.finishMemo(path, a.memo, a.res)
	return a.res, nil
}

// parallel calls fn(i) for i in [0, n) on up to GOMAXPROCS goroutines, one
// goroutine per grain items at most (small inputs stay on one), and returns
// ctx's error if the analysis was cancelled meanwhile. fn must only touch
// index i's own data.
func (a *analysis) parallel(n, grain int, fn func(i int)) error {
	workers := min(runtime.GOMAXPROCS(0), n/grain+1)
	next := make(chan int, n)
	for i := range n {
		next <- i
	}
	close(next)
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				if a.ctx.Err() != nil {
					return
				}
				fn(i)
			}
		}()
	}
	wg.Wait()
	return a.ctx.Err()
}

// at returns the span of the statement whose rules run for r, one of its
// relative spans.
func (a *analysis) at(r speciesfile.RelSpan) speciesfile.Span { return r.At(a.stmtBase) }

// errorIn reports whether the reader found an error in r, a span of the
// statement (of the file at path) whose rules run.
func (a *analysis) errorIn(path string, r speciesfile.RelSpan) bool {
	return a.res.Files[path].ErrorIn(r.At(a.stmtStart))
}

// reported returns the number of diagnostics reported so far (to the sink
// while one is set): a rule compares counts to learn whether an earlier
// check of the same declaration found something.
func (a *analysis) reported() int {
	if a.sink != nil {
		return len(*a.sink)
	}
	return len(a.res.Diagnostics)
}

// report adds a diagnostic when it belongs to the analysed file (or to the
// sink of the statement whose rules are running).
func (a *analysis) report(file string, d speciesfile.Diagnostic) {
	if a.sink != nil {
		*a.sink = append(*a.sink, d)
		return
	}
	if file != a.res.Path {
		return
	}
	a.res.Diagnostics = append(a.res.Diagnostics, d)
}

// startAnalysis starts an analysis of f, the file at path, with settings
// set: its result holds f, f's diagnostics and the files f includes, read
// depth first (a.order lists them). Analyze and compare both start so.
func (w *Workspace) startAnalysis(ctx context.Context, set Settings, path string, f *speciesfile.File) (*analysis, error) {
	a := &analysis{w: w, ctx: ctx, set: set, res: &Result{
		Path:     path,
		Settings: set,
		File:     f,
		Files:    map[string]*speciesfile.File{path: f},
		ByName:   map[string]*Species{},
	}}
	a.res.Diagnostics = append(a.res.Diagnostics, f.Diags...)
	a.includes(path, f, []string{path}, 0, nil)
	return a, ctx.Err()
}

// includes resolves the include statements of f (a file at path), parsing
// included files depth first. stack holds the chain of including files; top
// is the include statement of the analysed file through which path was
// reached (nil for the analysed file itself).
func (a *analysis) includes(path string, f *speciesfile.File, stack []string, depth int, top *speciesfile.Include) {
	a.order = append(a.order, path)
	for k, inc := range f.Includes {
		incSpan := inc.Path.Span.At(f.IncludeStart(k))
		target, msg := a.resolveInclude(path, inc, stack, depth)
		if path == a.res.Path {
			a.res.Includes = append(a.res.Includes, ResolvedInclude{Decl: inc, Path: target})
		}
		if msg != "" {
			a.report(path, speciesfile.Diagnostic{Span: incSpan, Severity: speciesfile.SeverityError, Code: CodeBadInclude, Message: msg})
			if top != nil {
				// A problem further down (a cycle, nesting too deep, a
				// path outside the workspace) is otherwise reported only in
				// files that may never be analysed on their own: say it on
				// the analysed file's include too.
				a.report(a.res.Path, speciesfile.Diagnostic{Span: a.res.File.Abs(top, top.Path.Span), Severity: speciesfile.SeverityError, Code: CodeBadInclude,
					Message: fmt.Sprintf("%s, in %s (through %s)", msg, shortPath(path), top.Path.Text)})
			}
			continue
		}
		if _, seen := a.res.Files[target]; seen {
			continue // included twice through different routes: one copy suffices
		}
		text, err := a.w.read(target)
		if err != nil {
			a.report(path, speciesfile.Diagnostic{Span: incSpan, Severity: speciesfile.SeverityError, Code: CodeBadInclude,
				Message: fmt.Sprintf("cannot read included file %q: %v", inc.Path.Text, unwrapPathError(err))})
			continue
		}
		if len(text) > maxFileSize {
			a.report(path, speciesfile.Diagnostic{Span: incSpan, Severity: speciesfile.SeverityError, Code: CodeBadInclude,
				Message: fmt.Sprintf("included file %q is larger than the 64 MiB limit", inc.Path.Text)})
			continue
		}
		g := a.w.parse(target, text)
		a.res.Files[target] = g
		if n := countErrors(g.Diags); n > 0 {
			a.report(path, speciesfile.Diagnostic{Span: incSpan, Severity: speciesfile.SeverityWarning, Code: CodeBadInclude,
				Message: fmt.Sprintf("included file %q has %d syntax error(s); its broken statements are ignored", inc.Path.Text, n)})
		}
		next := top
		if next == nil {
			next = inc
		}
		if a.via == nil {
			a.via = map[string]*speciesfile.Include{}
		}
		a.via[target] = next
		a.includes(target, g, append(stack[:len(stack):len(stack)], target), depth+1, next)
	}
}

// resolveInclude returns the cleaned target path of inc, or a message saying
// why it cannot be followed.
func (a *analysis) resolveInclude(from string, inc *speciesfile.Include, stack []string, depth int) (string, string) {
	raw := strings.TrimSpace(inc.Path.Text)
	if raw == "" {
		return "", "include needs a file path"
	}
	if filepath.IsAbs(raw) {
		return "", fmt.Sprintf("include path %q must be relative to the including file", raw)
	}
	target := filepath.Clean(filepath.Join(filepath.Dir(from), filepath.FromSlash(raw)))
	if root := a.w.root; root != "" {
		rel, err := filepath.Rel(root, target)
		if err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
			return "", fmt.Sprintf("include path %q leaves the workspace %s", raw, root)
		}
	}
	for _, s := range stack {
		if s == target {
			return "", fmt.Sprintf("include cycle: %s", cycleText(stack, target))
		}
	}
	if depth+1 > maxIncludeDepth {
		return "", fmt.Sprintf("includes nested deeper than %d files", maxIncludeDepth)
	}
	return target, ""
}

func cycleText(stack []string, target string) string {
	var parts []string
	for _, s := range stack {
		parts = append(parts, filepath.Base(s))
	}
	return strings.Join(append(parts, filepath.Base(target)), " → ")
}

// groups collects user-defined group values from every file in scope.
func (a *analysis) groups() {
	seen := map[string]*Group{}
	for _, path := range a.order {
		f := a.res.Files[path]
		for k, g := range f.Groups {
			nameSpan := g.Name.Span.At(f.GroupStart(k))
			name, err := benson.ParseGroupName(g.Name.Text)
			if err != nil {
				a.report(path, speciesfile.Diagnostic{Span: nameSpan, Severity: speciesfile.SeverityError, Code: speciesfile.CodeSyntax,
					Message: fmt.Sprintf("group name %q is not Benson notation: %v", g.Name.Text, err)})
				continue
			}
			if first, dup := seen[name]; dup {
				a.report(path, speciesfile.Diagnostic{Span: nameSpan, Severity: speciesfile.SeverityWarning, Code: CodeDuplicateGroup,
					Message: fmt.Sprintf("group %s is already defined; this definition is ignored", name),
					Related: []speciesfile.Related{{File: first.Loc.File, Span: first.Loc.Span, Message: "first definition"}}})
				continue
			}
			if b, ok := builtinGroup(name); ok && g.Hf298 != nil && g.S298 != nil && len(g.Cp) > 0 {
				// Only a complete statement replaces the value (userGroups
				// skips the others; the reader names what is missing).
				a.report(path, speciesfile.Diagnostic{Span: nameSpan, Severity: speciesfile.SeverityInformation, Code: speciesfile.CodeGroupOverride,
					Message: overrideMessage(name, a.thermoSummary(b.Hf298, b.S298), b.Source)})
			}
			if g.Hf298 != nil && g.S298 != nil && len(g.Cp) > 0 {
				if gap := groupCpGap(g.Cp); gap != "" {
					span := nameSpan
					for _, at := range g.Attrs {
						if at.Key.Text == "cp" {
							span = at.Span.At(f.GroupStart(k))
						}
					}
					a.report(path, speciesfile.Diagnostic{Span: span, Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeMissingGroup,
						Message: fmt.Sprintf("group %s: %s, and estimates that use the group are flagged; %s", name, gap, giveAllSeven())})
				}
			}
			gr := &Group{Name: name, Loc: Location{File: path, Span: nameSpan}, Decl: g}
			seen[name] = gr
			a.res.Groups = append(a.res.Groups, gr)
		}
	}
}

// builtinGroup returns kiln's own value of a group (canonical name).
func builtinGroup(name string) (benson.GroupValue, bool) {
	for _, g := range benson.GroupTable() {
		if g.Name == name {
			return g, true
		}
	}
	return benson.GroupValue{}, false
}

// setUserGroups converts the visible group statements to engine values
// (userGroups), and sets what estimates need besides them: the flags of
// their approximations and the cache key of both.
func (a *analysis) setUserGroups() []benson.GroupValue {
	user := a.userGroups()
	a.userFlags = nil
	for _, g := range a.res.Groups {
		if d := g.Decl; d.Hf298 != nil && d.S298 != nil && len(d.Cp) > 0 {
			if gap := groupCpGap(d.Cp); gap != "" {
				a.userFlags = append(a.userFlags, userCpFlag(g.Name, gap))
			}
		}
	}
	if len(user) > 0 {
		a.userKey = groupsKey(user)
		for _, f := range a.userFlags {
			a.userKey += "|" + f.Group + ":" + f.Note
		}
	}
	return user
}

// userGroups converts the visible group statements to engine values. Groups
// missing a value are skipped (the parser reports the missing line).
func (a *analysis) userGroups() []benson.GroupValue {
	var out []benson.GroupValue
	for _, g := range a.res.Groups {
		d := g.Decl
		if d.Hf298 == nil || d.S298 == nil || len(d.Cp) == 0 {
			continue
		}
		v := benson.GroupValue{Name: g.Name, Hf298: d.Hf298.SI, S298: d.S298.SI}
		src := ""
		if d.Source != nil {
			src = d.Source.Text
		}
		v.Source = "user-defined (" + filepath.Base(g.Loc.File) + ")"
		if src != "" {
			v.Source = src + " (user-defined)"
		}
		T := make([]float64, len(d.Cp))
		cp := make([]float64, len(d.Cp))
		for i, p := range d.Cp {
			T[i], cp[i] = p.T.SI, p.Cp.SI
		}
		for i, t := range benson.StdTemps {
			v.Cp[i] = interpolate(T, cp, t)
		}
		out = append(out, v)
	}
	return out
}

// interpolate returns y(x) by linear interpolation in the points (xs, ys),
// sorted or not, holding the end values outside their range.
func interpolate(xs, ys []float64, x float64) float64 {
	type pt struct{ x, y float64 }
	pts := make([]pt, len(xs))
	for i := range xs {
		pts[i] = pt{xs[i], ys[i]}
	}
	sort.Slice(pts, func(i, j int) bool { return pts[i].x < pts[j].x })
	if len(pts) == 0 {
		return 0
	}
	if x <= pts[0].x {
		return pts[0].y
	}
	for i := 1; i < len(pts); i++ {
		if x <= pts[i].x {
			f := (x - pts[i-1].x) / (pts[i].x - pts[i-1].x)
			return pts[i-1].y + f*(pts[i].y-pts[i-1].y)
		}
	}
	return pts[len(pts)-1].y
}

func countErrors(ds []speciesfile.Diagnostic) int {
	n := 0
	for _, d := range ds {
		if d.Severity == speciesfile.SeverityError {
			n++
		}
	}
	return n
}

func sortDiagnostics(ds []speciesfile.Diagnostic) {
	slices.SortStableFunc(ds, func(x, y speciesfile.Diagnostic) int {
		if x.Span.Start != y.Span.Start {
			return cmp.Compare(x.Span.Start, y.Span.Start)
		}
		return strings.Compare(x.Code, y.Code)
	})
}

// structure reads the species' SMILES, reporting bad-smiles at the exact
// position inside the token.
func (a *analysis) structure(path string, sp *Species) {
	tok := sp.Decl.SMILES
	if tok == nil {
		return
	}
	if tok.Text == StructurePlaceholder {
		// "Declare species NAME" wrote `?` for a structure it could not
		// know: not a SMILES error, a structure still to be written.
		sp.SMILESError = ErrStructurePending
		a.report(path, speciesfile.Diagnostic{Span: a.at(tok.Span), Severity: speciesfile.SeverityError,
			Code: speciesfile.CodeBadSMILES, Message: sp.Name + ": " + ErrStructurePending.Error()})
		return
	}
	p := a.w.mols.parse(tok.Text)
	m, err := p.mol, p.err
	if err != nil {
		sp.SMILESError = err
		a.report(path, speciesfile.Diagnostic{Span: smilesErrorSpan(a.at(tok.Span), tok.Text, err), Severity: speciesfile.SeverityError,
			Code: speciesfile.CodeBadSMILES, Message: fmt.Sprintf("bad SMILES for %s: %s", sp.Name, smilesReason(err))})
		return
	}
	sp.Mol = m
	sp.Formula = p.formula
	sp.Composition = p.composition
	sp.Charge = p.charge
	sp.MolarMass = p.molarMass
	sp.ident = p.ident
	sp.inv = p.inv
}

// smilesErrorSpan returns the span a SMILES error marks in the SMILES
// token at ts (text its text): the offending character of a
// *molecule.SMILESError, the whole token otherwise. It is the one home of
// that position: check's bad-smiles diagnostic and fill's list of skipped
// species (Result.ProblemLoc) both take it from here.
func smilesErrorSpan(ts speciesfile.Span, text string, err error) speciesfile.Span {
	se, ok := err.(*molecule.SMILESError)
	if !ok {
		return ts
	}
	start := ts.Start + min(max(se.Pos, 0), len(text))
	end := start + 1
	if end > ts.End {
		end = ts.End
		if start == end && start > ts.Start {
			start--
		}
	}
	return speciesfile.Span{Start: start, End: end}
}

// StructurePlaceholder is the structure "Declare species NAME" writes for a
// name kiln does not know (ide.Placeholder): `?` is not SMILES, and a species
// holding it is reported as ErrStructurePending until the user replaces it.
const StructurePlaceholder = "?"

// ErrStructurePending is the SMILES error of a species whose structure is
// StructurePlaceholder.
var ErrStructurePending = errors.New("structure not given yet: replace ? with the species' SMILES (a lumped species has none: delete the ? and give a composition line and a thermo block)")

// smilesReason strips the position prefix of a SMILES error (the diagnostic
// carries the position).
func smilesReason(err error) string {
	if se, ok := err.(*molecule.SMILESError); ok {
		return se.Msg
	}
	return err.Error()
}

// overrideMessage is the group-override information on a group statement
// replacing built-in group name (value and source as shown). Species of the
// reference library never take group values, so the statement does not
// change them; when the built-in value was derived from a library species
// (its source names the library), estimates from the new value — that
// species' radicals among them — no longer agree with the species itself.
func overrideMessage(name, value, source string) string {
	msg := fmt.Sprintf("group %s replaces kiln's built-in value (%s; %s) for every species in scope estimated from groups; reference-library species keep the library's data", name, value, source)
	if strings.Contains(source, "(library") {
		msg += "; the built-in value was derived from a library species, which this statement does not change: species estimated from the new value (its radicals among them) no longer agree with it"
	}
	return msg
}
