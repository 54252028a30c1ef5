package main

import (
	"fmt"
	"slices"
	"sort"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// checkDiag is one diagnostic of `kiln check --format json`. Lines and
// columns are 1-based; columns count Unicode code points.
type checkDiag struct {
	File      string `json:"file"`
	Line      int    `json:"line"`
	Column    int    `json:"column"`
	EndLine   int    `json:"end_line"`
	EndColumn int    `json:"end_column"`
	Severity  string `json:"severity"`
	Code      string `json:"code"`
	Message   string `json:"message"`
}

func runCheck(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"format": true, "min-severity": true}))
	if err != nil {
		return 0, err
	}
	format := flags["format"]
	if format == "" {
		format = "text"
	}
	if format != "text" && format != "json" {
		return 0, usagef("--format must be text or json, not %q", format)
	}
	if len(files) == 0 {
		return 0, usagef("check needs at least one FILE")
	}
	minSev := speciesfile.SeverityHint
	if v, ok := flags["min-severity"]; ok {
		minSev = 0
		for sv := speciesfile.SeverityError; sv <= speciesfile.SeverityHint; sv++ {
			if sv.String() == v {
				minSev = sv
			}
		}
		if minSev == 0 {
			return 0, usagef("--min-severity must be error, warning, information or hint, not %q", v)
		}
	}
	set, err := settingsFrom(e, flags)
	if err != nil {
		return 0, err
	}
	var out []checkDiag
	done := map[string]bool{}
	for _, file := range files {
		ws, abs, err := newWorkspace(file, flags, set)
		if err != nil {
			return 0, err
		}
		ds, err := checkFile(ws, abs, done)
		if err != nil {
			return 0, err
		}
		out = slices.Grow(out, len(ds))
		for _, d := range ds {
			if severityRank(d.Severity) <= minSev {
				out = append(out, d)
			}
		}
	}
	sort.SliceStable(out, func(i, j int) bool {
		a, b := out[i], out[j]
		if a.File != b.File {
			return a.File < b.File
		}
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		if a.Column != b.Column {
			return a.Column < b.Column
		}
		return a.Code < b.Code
	})
	errors, counts := 0, map[string]int{}
	for _, d := range out {
		counts[d.Severity]++
		if d.Severity == speciesfile.SeverityError.String() {
			errors++
		}
	}
	if format == "json" {
		if out == nil {
			out = []checkDiag{}
		}
		if err := writeJSON(e.stdout, out); err != nil {
			return 0, err
		}
	} else {
		for _, d := range out {
			fmt.Fprintf(e.stdout, "%s:%d:%d: %s: %s [%s]\n", d.File, d.Line, d.Column, d.Severity, d.Message, d.Code)
		}
		// The count line is always written, also when nothing is shown.
		fmt.Fprintf(e.stderr, "kiln check: %d error(s), %d warning(s), %d information, %d hint(s)\n",
			counts["error"], counts["warning"], counts["information"], counts["hint"])
	}
	if errors > 0 {
		return exitProblems, nil
	}
	return exitOK, nil
}

// checkFile analyses path and every file it includes (each once per run) and
// returns their diagnostics.
func checkFile(ws *analysis.Workspace, path string, done map[string]bool) ([]checkDiag, error) {
	results, err := analyzeScope(ws, path, done)
	if err != nil {
		return nil, err
	}
	// includer[p] is the first analysed file that includes p.
	includer := map[string]*analysis.Result{}
	for _, res := range results {
		for _, inc := range res.Includes {
			if _, seen := includer[inc.Path]; inc.Path != "" && !seen {
				includer[inc.Path] = res
			}
		}
	}
	var out []checkDiag
	for _, res := range results {
		out = append(out, diagsOf(res, includer[res.Path])...)
	}
	return out, nil
}

// diagsOf lists the diagnostics of res. includer (nil for none) is a file
// including res's file: an undeclared name it declares gets a note saying
// that an included file does not see its includer's declarations.
func diagsOf(res *analysis.Result, includer *analysis.Result) []checkDiag {
	lines := res.File.Lines
	name := displayPath(res.Path)
	out := make([]checkDiag, 0, len(res.Diagnostics))
	for _, d := range res.Diagnostics {
		s, t := lines.Position(d.Span.Start), lines.Position(d.Span.End)
		msg := d.Message
		if loc, ok := analysis.DeclaredByIncluder(res, includer, d); ok {
			msg += fmt.Sprintf(" (%s:%d, which includes this file, declares it, but a file sees only its own declarations and those of the files it includes)",
				displayPath(loc.File), includer.Files[loc.File].Lines.Position(loc.Span.Start).Line+1)
		}
		out = append(out, checkDiag{
			File: name, Line: s.Line + 1, Column: s.Char + 1, EndLine: t.Line + 1, EndColumn: t.Char + 1,
			Severity: d.Severity.String(), Code: d.Code, Message: msg,
		})
	}
	return out
}

// severityRank maps a severity name back to its Severity (hint for unknown
// names, so that nothing is filtered by mistake).
func severityRank(name string) speciesfile.Severity {
	for sv := speciesfile.SeverityError; sv <= speciesfile.SeverityHint; sv++ {
		if sv.String() == name {
			return sv
		}
	}
	return speciesfile.SeverityHint
}
