package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

func runFill(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"dry-run": false}))
	if err != nil {
		return 0, err
	}
	if len(files) != 1 {
		return 0, usagef("fill needs exactly one FILE")
	}
	res, _, err := analyzeFile(e, files[0], flags)
	if err != nil {
		return 0, err
	}
	abs := res.Path
	edits, skips := res.FillPlan()
	src := res.File.Src
	out, err := analysis.ApplyEdits(src, edits)
	if err != nil {
		return 0, err
	}
	// Every species left without thermo is listed with its reason, and makes
	// the exit code 1 (documented in kiln help). Positions are those of the
	// file as fill writes it, with or without --dry-run (the + side of the
	// dry-run diff), where kiln check then reports the same species; when
	// insertions above it moved a species, its line before them follows.
	lines := speciesfile.NewLineIndex(out)
	code := exitOK
	for _, sk := range skips {
		off := res.ProblemLoc(sk.Species).Span.Start
		before := res.File.Lines.Position(off)
		pos := lines.Position(shiftedOffset(off, edits))
		moved := ""
		if pos.Line != before.Line {
			moved = fmt.Sprintf(" (line %d before fill)", before.Line+1)
		}
		fmt.Fprintf(e.stderr, "%s:%d:%d: skipped %s: %s%s\n", displayPath(abs), pos.Line+1, pos.Char+1, sk.Species.Name, sk.Reason, moved)
		code = exitProblems
	}
	// Species of included files are not filled (fill writes only the file
	// it is given); those without thermo are listed where they are declared.
	// They do not change the exit code: fill on their own file is the step
	// that fills them.
	included := res.IncludedWithoutThermo()
	for _, sk := range included {
		f := res.Files[sk.Species.File]
		pos := f.Lines.Position(res.ProblemLoc(sk.Species).Span.Start)
		fmt.Fprintf(e.stderr, "%s:%d:%d: not filled %s: %s\n", displayPath(sk.Species.File), pos.Line+1, pos.Char+1, sk.Species.Name, sk.Reason)
	}
	notFilled := ""
	if len(included) > 0 {
		notFilled = fmt.Sprintf(", %d species of included files not filled (listed above)", len(included))
	}
	if len(edits) == 0 {
		if len(skips) == 0 {
			fmt.Fprintf(e.stderr, "kiln fill: %s: every species of this file already has thermo%s\n", files[0], notFilled)
		} else {
			fmt.Fprintf(e.stderr, "kiln fill: %s: nothing inserted, %d species skipped%s\n", files[0], len(skips), notFilled)
		}
		return code, nil
	}
	if flags["dry-run"] == "true" {
		name := filepath.ToSlash(displayPath(abs))
		writeUnifiedDiff(e.stdout, name, src, edits)
		return code, nil
	}
	if err := writeAtomic(abs, out); err != nil {
		return 0, err
	}
	msg := fmt.Sprintf("inserted %d thermo block(s)", len(edits))
	if len(skips) > 0 {
		msg += fmt.Sprintf(", skipped %d species (listed above)", len(skips))
	}
	msg += notFilled
	fmt.Fprintf(e.stderr, "kiln fill: %s: %s\n", files[0], msg)
	return code, nil
}

// shiftedOffset maps byte offset off of the original text to the text with
// edits applied: every edit that ends at or before off moves it by the
// difference in length (fill's edits are insertions between statements, so
// none overlaps a statement's start).
func shiftedOffset(off int, edits []analysis.Edit) int {
	d := 0
	for _, ed := range edits {
		if ed.Span.End <= off {
			d += len(ed.NewText) - ed.Span.Len()
		}
	}
	return off + d
}

// writeAtomic replaces path by data: it writes a temporary file in the same
// directory, syncs it and renames it over path, so readers see the old or the
// new file and never a mixture. The temporary file is removed on failure and
// the original keeps its permissions. A symbolic link stays a link: the file
// it points to is replaced (the temporary file goes into that file's
// directory). A file its owner may not write is refused, not replaced.
func writeAtomic(path string, data []byte) (err error) {
	target, err := filepath.EvalSymlinks(path)
	if err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	st, err := os.Stat(target)
	if err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if !st.Mode().IsRegular() {
		return fmt.Errorf("writing %s: not a regular file", path)
	}
	if st.Mode().Perm()&0o200 == 0 {
		return fmt.Errorf("not writing %s: the file is read-only (its owner has no write permission); make it writable (chmod u+w %s) or use --dry-run", path, path)
	}
	path = target
	tmp, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".kiln-*")
	if err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if _, err = tmp.Write(data); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = tmp.Chmod(st.Mode().Perm()); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = os.Rename(tmp.Name(), path); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	return nil
}

// splitLines splits text into lines that keep their terminators.
func splitLines(b []byte) []string {
	var out []string
	for len(b) > 0 {
		i := bytes.IndexAny(b, "\r\n")
		if i < 0 {
			out = append(out, string(b))
			break
		}
		j := i + 1
		if b[i] == '\r' && j < len(b) && b[j] == '\n' {
			j++
		}
		out = append(out, string(b[:j]))
		b = b[j:]
	}
	return out
}

// lineOf returns the 0-based line holding byte offset off of src.
func lineOf(lines []string, off int) int {
	n := 0
	for i, l := range lines {
		if off < n+len(l) {
			return i
		}
		n += len(l)
	}
	return len(lines)
}

// writeUnifiedDiff prints the edits to src as a unified diff with three lines
// of context. Each edit replaces whole lines: the lines its span touches.
func writeUnifiedDiff(w io.Writer, name string, src []byte, edits []analysis.Edit) {
	old := splitLines(src)
	type hunk struct {
		from, to int      // old lines [from, to) replaced
		repl     []string // new lines
	}
	var hs []hunk
	for _, e := range edits {
		from := lineOf(old, e.Span.Start)
		to := from
		if e.Span.End > e.Span.Start {
			to = lineOf(old, e.Span.End-1) + 1
		}
		lineStart := 0
		for i := 0; i < from; i++ {
			lineStart += len(old[i])
		}
		var buf strings.Builder
		if from < len(old) {
			buf.WriteString(old[from][:e.Span.Start-lineStart])
		} else if e.Span.Start > lineStart {
			buf.WriteString(string(src[lineStart:e.Span.Start]))
		}
		buf.WriteString(e.NewText)
		endLine := to
		if to > from || (from < len(old) && e.Span.Start > lineStart) {
			if to == from {
				to = from + 1
				endLine = to
			}
			lastStart := 0
			for i := 0; i < endLine-1; i++ {
				lastStart += len(old[i])
			}
			buf.WriteString(old[endLine-1][e.Span.End-lastStart:])
		}
		hs = append(hs, hunk{from: from, to: to, repl: splitLines([]byte(buf.String()))})
	}
	fmt.Fprintf(w, "--- a/%s\n+++ b/%s\n", name, name)
	const ctx = 3
	delta := 0
	for i := 0; i < len(hs); {
		// Merge hunks whose context overlaps.
		j := i + 1
		for j < len(hs) && hs[j].from-hs[j-1].to <= 2*ctx {
			j++
		}
		start := max(hs[i].from-ctx, 0)
		end := min(hs[j-1].to+ctx, len(old))
		var body []string
		oldN, newN := 0, 0
		cur := start
		for k := i; k < j; k++ {
			for ; cur < hs[k].from; cur++ {
				body = append(body, " "+old[cur])
				oldN++
				newN++
			}
			for ; cur < hs[k].to; cur++ {
				body = append(body, "-"+old[cur])
				oldN++
			}
			for _, l := range hs[k].repl {
				body = append(body, "+"+l)
				newN++
			}
		}
		for ; cur < end; cur++ {
			body = append(body, " "+old[cur])
			oldN++
			newN++
		}
		fmt.Fprintf(w, "@@ -%d,%d +%d,%d @@\n", start+1, oldN, start+1+delta, newN)
		for _, l := range body {
			if !strings.HasSuffix(l, "\n") && !strings.HasSuffix(l, "\r") {
				l += "\n\\ No newline at end of file\n"
			}
			fmt.Fprint(w, l)
		}
		delta += newN - oldN
		i = j
	}
}

// createIfMissing creates an empty file at path when none exists, so that
// writeAtomic can take its permissions.
func createIfMissing(path string) error {
	f, err := os.OpenFile(path, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o644)
	if err != nil {
		if os.IsExist(err) {
			return nil
		}
		return fmt.Errorf("writing %s: %w", path, err)
	}
	return f.Close()
}
