package main

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// includeMechanism writes a mechanism whose main file includes a file with
// species and a reaction of its own; it returns the main file's path.
func includeMechanism(t *testing.T) string {
	t.Helper()
	main := writeTemp(t, "main.kiln", "include sub/core.kiln\nspecies C3H8 CCC\nreaction C3H8 + H <=> nC3H7 + H2   A=1.3e6 n=2.54 Ea=6.76\n")
	dir := filepath.Join(filepath.Dir(main), "sub")
	require.NoError(t, os.MkdirAll(dir, 0o755))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "core.kiln"), []byte(`units kJ/mol
species H [H]
species H2 [H][H]
species nC3H7 [CH2]CC
  thermo-table
    hf298 100.0
    s298 290
    cp 300=75 400=95 500=112 600=126 800=148 1000=164 1500=188
reaction H + H <=> H2  A=1e13 n=0 Ea=0
`), 0o644))
	return main
}

// TestSummaryIncludedReactions: summary lists the reactions of included
// files (with their file) as well as their species, and counts agree with
// compare.
func TestSummaryIncludedReactions(t *testing.T) {
	main := includeMechanism(t)
	code, stdout, stderr := runKiln(t, "summary", "--json", main)
	require.Equal(t, exitOK, code, stderr)
	var s struct {
		Species   []map[string]any `json:"species"`
		Reactions []map[string]any `json:"reactions"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &s))
	require.Len(t, s.Species, 4)
	require.Len(t, s.Reactions, 2)
	assert.NotContains(t, s.Reactions[0], "file") // the summarised file's own
	assert.Equal(t, "H + H <=> H2", s.Reactions[1]["equation"])
	assert.EqualValues(t, 9, s.Reactions[1]["line"])
	assert.Equal(t, "core.kiln", filepath.Base(s.Reactions[1]["file"].(string)))
	assert.NotNil(t, s.Reactions[1]["dh298_kj_mol"])

	code, stdout, stderr = runKiln(t, "summary", main)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stdout, "Reactions (2)")
	assert.Contains(t, stdout, "core.kiln:9")

	c := compareJSONOf(t, exitOK, main, main)
	assert.Equal(t, len(s.Species), c.A.Species)
	assert.Equal(t, len(s.Reactions), c.A.Reactions)
}

// TestCheckCountLineAlways: the stderr count line is written also when no
// diagnostic is shown (an empty file; errors filtered out of a clean one).
func TestCheckCountLineAlways(t *testing.T) {
	empty := writeTemp(t, "empty.kiln", "")
	code, stdout, stderr := runKiln(t, "check", empty)
	assert.Equal(t, exitOK, code)
	assert.Empty(t, stdout)
	assert.Equal(t, "kiln check: 0 error(s), 0 warning(s), 0 information, 0 hint(s)\n", stderr)

	clean := writeTemp(t, "clean.kiln", "species C3H8 CCC\n")
	code, stdout, stderr = runKiln(t, "check", "--min-severity", "error", clean)
	assert.Equal(t, exitOK, code)
	assert.Empty(t, stdout)
	assert.Equal(t, "kiln check: 0 error(s), 0 warning(s), 0 information, 0 hint(s)\n", stderr)
}

// TestErrorCountsAgree: check, summary and equilibrium count a file's
// errors alike (structure, reaction and include errors, in the file and in
// what it includes); compare, which reads without the full checks, counts
// and names the syntax, structure and include errors among them.
func TestErrorCountsAgree(t *testing.T) {
	main := includeMechanism(t)
	require.NoError(t, os.WriteFile(main, []byte(`include sub/core.kiln
include sub/missing.kiln
species C3H8 CCC
species Q Si
species R C(C
reaction C3H8 + H <=> nC3H7 + H2   A=1.3e6 n=2.54 Ea=6.76
reaction C3H8 + H <=> nC3H7 + X   A=1.3e6 n=2.54 Ea=6.76
reaction C3H8 => nC3H7   A=1e13 n=0 Ea=80
reaction C3H8 + H <=> nC3H7 + H2   A=1.3e6 n=2.54 Ea=6.76 B=1
`), 0o644))
	sub := filepath.Join(filepath.Dir(main), "sub", "core.kiln")
	text, err := os.ReadFile(sub)
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(sub, append(text, "reaction H + H <=> OH  A=1e13 n=0 Ea=0\n"...), 0o644))

	code, stdout, _ := runKiln(t, "check", "--format", "json", main)
	require.Equal(t, exitProblems, code)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags))
	want, read := 0, 0
	for _, d := range diags {
		if d.Severity == "error" {
			want++
			switch d.Code {
			case "syntax", "bad-smiles", "bad-include":
				read++
			}
		}
	}
	require.Greater(t, want, read)
	require.Greater(t, read, 2)

	c := compareJSONOf(t, exitOK, main, main)
	assert.Equal(t, read, c.A.Errors, "compare")
	assert.Equal(t, read, c.B.Errors, "compare")
	_, cmpText, _ := runKiln(t, "compare", main, main)
	assert.Contains(t, cmpText, fmt.Sprintf("has %d syntax or structure error(s)", read))

	code, _, stderr := runKiln(t, "summary", main)
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stderr, fmt.Sprintf("has %d error(s)", want), "summary")

	_, _, stderr = runKiln(t, "equilibrium", "--mix", "C3H8:1", main)
	assert.Contains(t, stderr, fmt.Sprintf("has %d error(s)", want), "equilibrium")
}

// TestCompareFillOutputEqual: a file and what `kiln fill` makes of it
// compare equal: compare evaluates an estimate by the NASA-7 polynomial fill
// writes (also past 1500 K), and rates converted by Kc agree.
func TestCompareFillOutputEqual(t *testing.T) {
	furnace, err := os.ReadFile(filepath.Join("..", "..", "examples", "furnace.kiln"))
	require.NoError(t, err)
	for name, text := range map[string]string{
		"furnace.kiln": string(furnace),
		"ethanol.kiln": `species ethanol CCO
species H [H]
species ethoxy CC[O]
species H2 [H][H]
species propene C=CC
reaction ethanol + H <=> ethoxy + H2  A=1e13 n=0 Ea=5
reaction ethoxy + H2 => ethanol + H  A=1e12 n=0 Ea=5
`,
	} {
		t.Run(name, func(t *testing.T) {
			a := writeTemp(t, name, text)
			b := filepath.Join(filepath.Dir(a), "filled-"+name)
			require.NoError(t, os.WriteFile(b, []byte(text), 0o644))
			code, _, stderr := runKiln(t, "fill", b)
			require.Equal(t, exitOK, code, stderr)
			c := compareJSONOf(t, exitOK, a, b)
			require.NotEmpty(t, c.Species)
			compared := 0
			for _, p := range c.Species {
				require.NotNil(t, p.Thermo, p.A)
				if p.Thermo.SameEstimate {
					continue // a species fill could not fill
				}
				compared++
				assert.Empty(t, p.Flags, p.A)
				for k, v := range p.Thermo.Cp {
					assert.InDelta(t, 0, v.Diff, 1e-4, "%s Cp%s", p.A, k)
				}
				for k, v := range p.Thermo.G {
					assert.InDelta(t, 0, v.Diff, 1e-4, "%s G%s", p.A, k)
				}
			}
			assert.Greater(t, compared, 3)
			for _, r := range c.Reactions {
				for k, v := range r.Ratio {
					if v != nil {
						assert.InDelta(t, 1, *v, 1e-6, "%s at %s K", r.EquationA, k)
					}
				}
			}
		})
	}
}

// TestFillSkipWording: fill words a refusal exactly as check and estimate
// do (atom and reason, no engine package prefix).
func TestFillSkipWording(t *testing.T) {
	path := writeTemp(t, "r.kiln", "species silane C[SiH3]\nspecies ion C[NH3+]\nspecies ethane CC\n")
	_, checkOut, _ := runKiln(t, "check", path)
	_, estOut, _ := runKiln(t, "estimate", "C[SiH3]", "C[NH3+]")
	code, _, stderr := runKiln(t, "fill", "--dry-run", path)
	assert.Equal(t, exitProblems, code)
	assert.NotContains(t, stderr, "benson")
	re := regexp.MustCompile(`(\w+) has no thermo block and kiln cannot estimate it: (.*); add a nasa7`)
	ms := re.FindAllStringSubmatch(checkOut, -1)
	require.Len(t, ms, 2, checkOut)
	for _, m := range ms {
		assert.Contains(t, stderr, "skipped "+m[1]+": kiln cannot estimate it: "+m[2]+"\n")
		assert.Contains(t, estOut, "kiln cannot estimate it: "+m[2]+"\n")
	}
}

// TestBlockSourceOneWording: `estimate --nasa` and fill write the same
// source line for a species; a reference-library species is named as
// tabulated data, not as an estimate; no Go identifiers in either.
func TestBlockSourceOneWording(t *testing.T) {
	for _, tc := range []struct{ smiles, want string }{
		{"C", "source reference library CH4 (tabulated data): "},
		{"CCO", "source estimate, kiln 0.1.0, 2026-12-01; Benson group additivity"},
	} {
		_, est, _ := runKiln(t, "estimate", "--nasa", tc.smiles)
		path := writeTemp(t, "s.kiln", "species X "+tc.smiles+"\n")
		code, _, stderr := runKiln(t, "fill", path)
		require.Equal(t, exitOK, code, stderr)
		filled, err := os.ReadFile(path)
		require.NoError(t, err)
		src := regexp.MustCompile(`(?m)^\s*(source .*)$`)
		fromFill := src.FindStringSubmatch(string(filled))
		fromEst := src.FindStringSubmatch(est)
		require.NotNil(t, fromFill, string(filled))
		require.NotNil(t, fromEst, est)
		assert.Equal(t, fromFill[1], fromEst[1])
		assert.Contains(t, fromFill[1], tc.want)
		_, js, _ := runKiln(t, "estimate", "--nasa", "--json", tc.smiles)
		var arr []map[string]any
		require.NoError(t, json.Unmarshal([]byte(js), &arr))
		assert.Equal(t, "source "+arr[0]["nasa7"].(map[string]any)["source"].(string), fromFill[1])
		assert.NotRegexp(t, `\b(nasa|benson|reflib)\.[A-Z]`, fromFill[1])
		if tc.smiles == "C" {
			assert.NotContains(t, fromFill[1], "estimate")
		}
		code, out, _ := runKiln(t, "check", "--min-severity", "warning", path)
		assert.Equal(t, exitOK, code, out)
		assert.Empty(t, out)
	}
}

// TestFillSymlinkAndReadOnly: fill writes through a symbolic link (the link
// stays a link, its target gets the blocks and keeps its mode) and refuses a
// file its owner may not write, leaving it unchanged.
func TestFillSymlinkAndReadOnly(t *testing.T) {
	target := writeTemp(t, "real.kiln", "species ethane CC\n")
	require.NoError(t, os.Chmod(target, 0o640))
	link := filepath.Join(t.TempDir(), "link.kiln")
	require.NoError(t, os.Symlink(target, link))
	code, _, stderr := runKiln(t, "fill", link)
	require.Equal(t, exitOK, code, stderr)
	fi, err := os.Lstat(link)
	require.NoError(t, err)
	assert.NotZero(t, fi.Mode()&os.ModeSymlink, "the link is still a link")
	got, err := os.ReadFile(target)
	require.NoError(t, err)
	assert.Contains(t, string(got), "nasa7")
	st, err := os.Stat(target)
	require.NoError(t, err)
	assert.Equal(t, os.FileMode(0o640), st.Mode().Perm())
	entries, err := os.ReadDir(filepath.Dir(target))
	require.NoError(t, err)
	for _, e := range entries {
		assert.NotContains(t, e.Name(), ".kiln-", "no temporary file left behind")
	}

	ro := writeTemp(t, "ro.kiln", "species ethane CC\n")
	require.NoError(t, os.Chmod(ro, 0o444))
	code, _, stderr = runKiln(t, "fill", ro)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "read-only")
	got, err = os.ReadFile(ro)
	require.NoError(t, err)
	assert.Equal(t, "species ethane CC\n", string(got))
}

// TestRootUsage: a --root that does not exist, is not a directory or does
// not hold the file is a usage error that says so.
func TestRootUsage(t *testing.T) {
	main := includeMechanism(t)
	dir := filepath.Dir(main)
	for _, tc := range []struct {
		root, want string
	}{
		{filepath.Join(dir, "nowhere"), "no such directory"},
		{main, "is not a directory"},
		{filepath.Join(dir, "sub"), "does not contain"},
	} {
		for _, args := range [][]string{
			{"check", "--root", tc.root, main},
			{"summary", "--root", tc.root, main},
			{"compare", "--root", tc.root, main, main},
		} {
			code, _, stderr := runKiln(t, args...)
			assert.Equal(t, exitUsage, code, args)
			assert.Contains(t, stderr, "--root", args)
			assert.Contains(t, stderr, tc.want, args)
			assert.NotContains(t, stderr, "leaves the workspace", args)
		}
	}
	code, _, stderr := runKiln(t, "check", "--root", dir, main)
	assert.Equal(t, exitOK, code, stderr)
}

// TestEquilibriumFillOutputEqual: an equilibrium among estimated species
// above 1500 K (C3H6 isomers at 2500 K, where only their own thermo
// decides) gives the same composition for a file and for what `kiln fill`
// makes of it: both use the NASA-7 polynomial fill writes (the group model
// alone holds Cp at its 1500 K value).
func TestEquilibriumFillOutputEqual(t *testing.T) {
	const text = "species propene C=CC\nspecies cyclopropane C1CC1\nspecies allene C=C=C\nspecies H2 [H][H]\n"
	a := writeTemp(t, "eq.kiln", text)
	b := filepath.Join(filepath.Dir(a), "filled-eq.kiln")
	require.NoError(t, os.WriteFile(b, []byte(text), 0o644))
	code, _, stderr := runKiln(t, "fill", b)
	require.Equal(t, exitOK, code, stderr)
	fractions := func(path string) map[string]float64 {
		code, stdout, stderr := runKiln(t, "equilibrium", "--json", "--temperature", "2500", "--mix", "propene:1", path)
		require.Equal(t, exitOK, code, stderr)
		var o struct {
			Species []struct {
				Name string  `json:"name"`
				X    float64 `json:"mole_fraction"`
			} `json:"species"`
		}
		require.NoError(t, json.Unmarshal([]byte(stdout), &o), stdout)
		out := map[string]float64{}
		for _, sp := range o.Species {
			out[sp.Name] = sp.X
		}
		return out
	}
	xa, xb := fractions(a), fractions(b)
	require.Greater(t, xa["cyclopropane"], 1e-7)
	for _, name := range []string{"propene", "cyclopropane", "allene", "H2"} {
		assert.InEpsilon(t, xb[name], xa[name], 1e-3, name)
	}
}

// TestCheckIncluderDeclares: a reaction of an included file naming a
// species only its includer declares is undeclared there (a file sees only
// itself and what it includes), and check says where the includer declares
// it; a name nobody declares gets no such note.
func TestCheckIncluderDeclares(t *testing.T) {
	main := writeTemp(t, "main.kiln", "species O2 O=O\ninclude sub/nox.kiln\n")
	dir := filepath.Join(filepath.Dir(main), "sub")
	require.NoError(t, os.MkdirAll(dir, 0o755))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "nox.kiln"), []byte(`species NO2 [O]N=O
species NO [N]=O
species O [O]
reaction NO2 + O <=> NO + O2   A=1e13 n=0 Ea=0
reaction NO + O <=> NO2 + X   A=1e13 n=0 Ea=0
`), 0o644))
	_, stdout, _ := runKiln(t, "check", main)
	o2 := regexp.MustCompile(`nox\.kiln:4:\d+: error: species O2 is not declared.*main\.kiln:1, which includes this file, declares it`)
	assert.Regexp(t, o2, stdout)
	x := regexp.MustCompile(`nox\.kiln:5:\d+: error: species X is not declared[^\n]*\[undeclared-species\]`)
	if assert.Regexp(t, x, stdout) {
		assert.NotContains(t, x.FindString(stdout), "which includes this file")
	}
}

// TestEstimateRefusalRoute: a refusal whose reason does not say how to go on
// gets the route on the next line, as check gives it.
func TestEstimateRefusalRoute(t *testing.T) {
	_, out, _ := runKiln(t, "estimate", "c1nnn[nH]1")
	assert.Contains(t, out, "kiln cannot estimate it: atom 3 (N) has no group: no group in the tables has a centre of type NazN")
	assert.Contains(t, out, "give the species a nasa7 or thermo-table block in its .kiln file")
}
