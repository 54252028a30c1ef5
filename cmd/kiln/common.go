package main

import (
	"context"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"time"

	"kiln.dev/kiln/analysis"
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

// settingsFlags are the flags that adjust analysis settings, in every command.
var settingsFlags = flagSpec{"units": true, "tmid": true, "thigh": true, "root": true,
	"mismatch-hf": true, "mismatch-s": true, "collision-factor": true}

func withSettings(spec flagSpec) flagSpec {
	out := flagSpec{}
	for k, v := range settingsFlags {
		out[k] = v
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
	if u, ok := flags["units"]; ok {
		if u != "kcal/mol" && u != "kJ/mol" {
			return s, usagef("--units must be kcal/mol or kJ/mol, not %q", u)
		}
		s.DisplayUnits = u
	}
	for name, dst := range map[string]*float64{"tmid": &s.TMid, "thigh": &s.THigh} {
		if v, ok := flags[name]; ok {
			f, err := strconv.ParseFloat(v, 64)
			if err != nil || f <= 300 || f > 20000 {
				return s, usagef("--%s must be a temperature in K above 300, not %q", name, v)
			}
			*dst = f
		}
	}
	for name, dst := range map[string]struct {
		v     *float64
		scale float64
	}{
		"mismatch-hf":      {&s.MismatchHf298, 4184}, // kcal/mol → J/mol
		"mismatch-s":       {&s.MismatchS298, 4.184}, // cal/(mol K) → J/(mol K)
		"collision-factor": {&s.CollisionFactor, 1},
	} {
		if v, ok := flags[name]; ok {
			f, err := strconv.ParseFloat(v, 64)
			if err != nil || !(f > 0) || math.IsInf(f, 0) {
				return s, usagef("--%s must be a positive number, not %q", name, v)
			}
			*dst.v = f * dst.scale
		}
	}
	if s.TMid >= s.THigh {
		return s, usagef("--tmid (%g K) must be below --thigh (%g K)", s.TMid, s.THigh)
	}
	return s, nil
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
	return analysis.NewWorkspace(root, readFile, s), abs, nil
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
	set, err := settingsFrom(e, flags)
	if err != nil {
		return nil, set, err
	}
	ws, abs, err := newWorkspace(file, flags, set)
	if err != nil {
		return nil, set, err
	}
	res, err := ws.Analyze(context.Background(), abs)
	return res, set, err
}
