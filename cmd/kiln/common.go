package main

import (
	"context"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"time"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// maxFileBytes is the largest file kiln reads (FORMAT.md, limits).
const maxFileBytes = 64 << 20

func today() string { return time.Now().UTC().Format("2006-01-02") }

// readFile reads a file, refusing ones over the size limit.
func readFile(path string) ([]byte, error) {
	st, err := os.Stat(path)
	if err != nil {
		return nil, err
	}
	if st.IsDir() {
		return nil, fmt.Errorf("%s is a directory", path)
	}
	if st.Size() > maxFileBytes {
		return nil, fmt.Errorf("%s is larger than the %d MiB limit", path, maxFileBytes>>20)
	}
	return os.ReadFile(path)
}

// workspaceRoot returns the root that includes must stay in: the nearest
// directory above file that holds .git, else the file's directory.
func workspaceRoot(file string) string {
	abs, err := filepath.Abs(file)
	if err != nil {
		return filepath.Dir(file)
	}
	dir := filepath.Dir(abs)
	for d := dir; ; {
		if _, err := os.Stat(filepath.Join(d, ".git")); err == nil {
			return d
		}
		parent := filepath.Dir(d)
		if parent == d {
			return dir
		}
		d = parent
	}
}

// settingsFlags maps the flags that adjust analysis settings, in every
// command, to their keys in analysis.SettingsInput (the one validator the
// language server uses too).
var settingsFlags = map[string]string{
	"units": "units", "tmid": "tMid", "thigh": "tHigh",
	"mismatch-hf": "mismatchHf298", "mismatch-s": "mismatchS298", "mismatch-cp": "mismatchCp",
	"collision-factor": "collisionFactor", "pressure": "pressure",
}

func withSettings(spec flagSpec) flagSpec {
	out := flagSpec{"root": true}
	for k := range settingsFlags {
		out[k] = true
	}
	for k, v := range spec {
		out[k] = v
	}
	return out
}

// settingsFrom builds analysis settings from the command's flags.
func settingsFrom(e env, flags map[string]string) (analysis.Settings, error) {
	s := analysis.DefaultSettings()
	s.Stamp = fmt.Sprintf("kiln %s, %s", Version, e.now())
	var in analysis.SettingsInput
	if u, ok := flags["units"]; ok {
		in.Units = &u
	}
	num := func(flag string) (*float64, error) {
		v, ok := flags[flag]
		if !ok {
			return nil, nil
		}
		f, err := strconv.ParseFloat(v, 64)
		if err != nil {
			return nil, usagef("--%s must be a number, not %q", flag, v)
		}
		return &f, nil
	}
	var err error
	for flag, dst := range map[string]**float64{"tmid": &in.TMid, "thigh": &in.THigh, "mismatch-hf": &in.MismatchHf298,
		"mismatch-s": &in.MismatchS298, "mismatch-cp": &in.MismatchCp, "collision-factor": &in.CollisionFactor} {
		if *dst, err = num(flag); err != nil {
			return s, err
		}
	}
	if v, ok := flags["pressure"]; ok {
		pa, err := speciesfile.ParsePressure(v, "") // a unit is required, as in the file and kiln equilibrium
		if err != nil {
			return s, usagef("--pressure: %v", err)
		}
		in.Pressure = ptr(pa / 1e5)
	}
	out, err := in.Apply(s)
	if err != nil {
		var se *analysis.SettingError
		if errors.As(err, &se) {
			for flag, key := range settingsFlags {
				if key == se.Key {
					return s, usagef("--%s: %s", flag, se.Msg)
				}
			}
		}
		return s, usagef("%v", err)
	}
	return out, nil
}

// newWorkspace returns a workspace for file that reads the disk.
func newWorkspace(file string, flags map[string]string, s analysis.Settings) (*analysis.Workspace, string, error) {
	root := flags["root"]
	if root == "" {
		root = workspaceRoot(file)
	}
	root, err := filepath.Abs(root)
	if err != nil {
		return nil, "", fmt.Errorf("workspace root: %w", err)
	}
	abs, err := filepath.Abs(file)
	if err != nil {
		return nil, "", fmt.Errorf("%s: %w", file, err)
	}
	if flags["root"] != "" {
		if err := checkRoot(flags["root"], root, abs); err != nil {
			return nil, "", err
		}
	}
	return analysis.NewWorkspace(root, readFile, s), abs, nil
}

// checkRoot checks a --root given on the command line: an existing
// directory that holds each file (absolute paths). Anything else is a usage
// error, reported before any include is resolved against it.
func checkRoot(flag, root string, files ...string) error {
	st, err := os.Stat(root)
	switch {
	case err != nil && os.IsNotExist(err):
		return usagef("--root %s: no such directory", flag)
	case err != nil:
		return usagef("--root %s: %v", flag, err)
	case !st.IsDir():
		return usagef("--root %s is not a directory", flag)
	}
	for _, f := range files {
		rel, err := filepath.Rel(root, f)
		if err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
			return usagef("--root %s does not contain %s: the workspace root must be a directory above the files", flag, displayPath(f))
		}
	}
	return nil
}

// displayPath shows path relative to the working directory when it is below it.
func displayPath(path string) string {
	wd, err := os.Getwd()
	if err != nil {
		return path
	}
	rel, err := filepath.Rel(wd, path)
	if err != nil || len(rel) >= 2 && rel[:2] == ".." {
		return path
	}
	return rel
}

// analyzeFile analyses the one file a command operates on.
func analyzeFile(e env, file string, flags map[string]string) (*analysis.Result, analysis.Settings, error) {
	results, set, err := analyzeFileScope(e, file, flags)
	if err != nil {
		return nil, set, err
	}
	return results[0], set, nil
}

// analyzeFileScope analyses the file a command operates on and the files it
// includes (see analyzeScope); the first result is the file's.
func analyzeFileScope(e env, file string, flags map[string]string) ([]*analysis.Result, analysis.Settings, error) {
	set, err := settingsFrom(e, flags)
	if err != nil {
		return nil, set, err
	}
	ws, abs, err := newWorkspace(file, flags, set)
	if err != nil {
		return nil, set, err
	}
	results, err := analyzeScope(ws, abs, nil)
	return results, set, err
}

// analyzeScope analyses path and, depth first, every file it includes that
// done does not hold yet (each file once per run; done may be nil), path
// first. Each file is analysed as check reports it: in its own scope. An
// unreadable include is left out (its include line reports it). Every
// command that counts a file's errors or lists its reactions uses this, so
// that they agree with check.
func analyzeScope(ws *analysis.Workspace, path string, done map[string]bool) ([]*analysis.Result, error) {
	if done == nil {
		done = map[string]bool{}
	}
	if done[path] {
		return nil, nil
	}
	done[path] = true
	res, err := ws.Analyze(context.Background(), path)
	if err != nil {
		return nil, err
	}
	out := []*analysis.Result{res}
	for _, inc := range res.Includes {
		if inc.Path == "" || done[inc.Path] {
			continue
		}
		more, err := analyzeScope(ws, inc.Path, done)
		if err != nil {
			continue
		}
		out = append(out, more...)
	}
	return out, nil
}

// scopeErrors counts the errors of the analysed files, as check does.
func scopeErrors(results []*analysis.Result) int {
	n := 0
	for _, res := range results {
		n += res.ErrorCount()
	}
	return n
}
