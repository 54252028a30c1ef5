// Command kiln checks, estimates and fills thermochemistry in kiln mechanism
// files, and serves the same analysis to editors over the Language Server
// Protocol.
//
//	kiln check FILE... [--format text|json]
//	kiln estimate SMILES... [--json] [--nasa] [--sources]
//	kiln summary FILE [--json] [--pressure P]
//	kiln fill FILE [--dry-run]
//	kiln plot SPECIES --file FILE -o OUT.svg
//	kiln compare A.kiln B.kiln [--json] [--all] [--rate-factor F]
//	kiln equilibrium FILE --mix "NAME:AMOUNT, …" [--temperature K] [--pressure P] [--adiabatic] [--volume] [--json]
//	kiln serve [--log FILE] [--memory-limit SIZE]
//	kiln version | help
package main

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
)

// Version is the kiln release.
const Version = "0.1.0"

// Exit codes shared by every command.
const (
	exitOK       = 0
	exitProblems = 1 // errors found in the input (check, estimate)
	exitUsage    = 2 // bad command line or I/O failure
)

// env is what a command runs against: its streams and working directory.
type env struct {
	stdin          io.Reader
	stdout, stderr io.Writer
	now            func() string // today's date, for stamps in inserted blocks
}

func main() {
	e := env{stdin: os.Stdin, stdout: os.Stdout, stderr: os.Stderr, now: today}
	if len(os.Args) > 1 && os.Args[1] == "serve" {
		os.Exit(run(e, os.Args[1:]))
	}
	// One-shot commands write their reports through a buffer (a check of a
	// large file prints tens of thousands of lines; one write each was
	// ~1 s of system time). Anything written to stderr flushes stdout
	// first, so the two streams keep their order on a terminal.
	out := bufio.NewWriterSize(os.Stdout, 64<<10)
	e.stdout, e.stderr = out, flushFirst{out, os.Stderr}
	code := run(e, os.Args[1:])
	if err := out.Flush(); err != nil && code == exitOK {
		fmt.Fprintf(os.Stderr, "kiln: writing output: %v\n", err)
		code = exitUsage
	}
	os.Exit(code)
}

// flushFirst is a writer (stderr) that flushes a buffered writer (stdout)
// before each write.
type flushFirst struct {
	buf *bufio.Writer
	w   io.Writer
}

func (f flushFirst) Write(p []byte) (int, error) {
	_ = f.buf.Flush() // a failed flush is reported when main flushes at exit
	return f.w.Write(p)
}

// usageError is a command-line mistake: reported with a hint to `kiln help`.
type usageError struct{ msg string }

func (u usageError) Error() string { return u.msg }

func usagef(format string, args ...any) error { return usageError{fmt.Sprintf(format, args...)} }

// run executes one kiln command and returns its exit code.
func run(e env, args []string) int {
	if len(args) == 0 {
		fmt.Fprint(e.stderr, helpText)
		return exitUsage
	}
	cmd, rest := args[0], args[1:]
	var (
		code int
		err  error
	)
	switch cmd {
	case "check":
		code, err = runCheck(e, rest)
	case "estimate":
		code, err = runEstimate(e, rest)
	case "summary":
		code, err = runSummary(e, rest)
	case "fill":
		code, err = runFill(e, rest)
	case "plot":
		code, err = runPlot(e, rest)
	case "compare":
		code, err = runCompare(e, rest)
	case "equilibrium":
		code, err = runEquilibrium(e, rest)
	case "serve":
		code, err = runServe(e, rest)
	case "version", "--version", "-v":
		fmt.Fprintf(e.stdout, "kiln %s\n", Version)
		return exitOK
	case "help", "--help", "-h":
		fmt.Fprint(e.stdout, helpText)
		return exitOK
	default:
		err = usagef("unknown command %q", cmd)
	}
	if errors.Is(err, errHelp) {
		fmt.Fprint(e.stdout, commandHelp(cmd))
		return exitOK
	}
	if err != nil {
		var u usageError
		if errors.As(err, &u) {
			fmt.Fprintf(e.stderr, "kiln %s: %v\nRun 'kiln help' for usage.\n", cmd, err)
		} else {
			fmt.Fprintf(e.stderr, "kiln %s: %v\n", cmd, err)
		}
		return exitUsage
	}
	return code
}

const helpText = `kiln — thermochemistry and consistency checks for kinetic mechanism files

Usage:
  kiln check FILE... [--format text|json] [--min-severity error|warning|information|hint]
        Report problems as file:line:col: severity: message [code] (a count
        goes to stderr). --min-severity warning hides the information lines
        that say which species kiln estimates.
        Exit 0 without errors, 1 with errors, 2 on usage or I/O problems.
  kiln estimate SMILES... [--json] [--nasa] [--sources] [--multiplicity N] [--symmetry N]
                [--optical-isomers N]
        Estimate ΔHf°298, S°298 and Cp(T) by group additivity, with the breakdown.
        --nasa adds a fitted NASA 7-coefficient polynomial; --sources lists the
        source of each group (--json always has them). JSON errors give the
        1-based character position in the SMILES. Exit 1 if any input fails.
  kiln summary FILE [--json] [--pressure P] [--uncertain]
        Tabulate species thermo, reaction thermochemistry (ΔH°r, ΔG°r, Kp) and
        k_f, k_r at 1000 K with their units. --pressure sets where falloff and
        pressure-table rates are taken (with a unit: 10bar, 0.1atm, 50kPa;
        default 1atm). Values that need a reaction to
        balance are left out when it does not. Species and reactions of included
        files are listed too (a reaction with its FILE:LINE). Exit 1 when the
        file or what it includes has errors.
        The k_r ×/÷ column is the factor exp(σ(ΔG°r)/RT) that k_r(1000 K)
        inherits from estimated thermo; --uncertain lists the largest first.
  kiln fill FILE [--dry-run] [--tmid K] [--thigh K]
        Insert an estimated nasa7 block under every species that lacks thermo.
        --tmid/--thigh apply to every block, reference-library species included
        (refitted; a THIGH beyond the reference data is refused). Species that
        get no block are listed on stderr with the reason, and the exit code is
        then 1; positions are those of the filled file, with or without
        --dry-run. Species of included files without thermo are listed as not
        filled (fill only writes FILE). --dry-run prints a unified diff
        instead of writing the file.
        The file is replaced atomically (through a symbolic link, its target),
        keeping its permissions; a file its owner may not write is refused.
  kiln plot SPECIES --file FILE -o OUT.svg
        Draw Cp/R, H/RT and S/R against T: estimate, fit and the file's own block
        (drawn only over the block's temperature range).
  kiln compare A.kiln B.kiln [--json] [--all] [--rate-factor F]
        Match species by structure and multiplicity (not by name) and report
        species only in A or B, one structure under two names (with a rename
        suggestion), one name for two structures, thermo differences B − A
        (ΔHf°298, S°298, Cp and G at 300/1000/2000 K, an estimate evaluated
        by the NASA-7 polynomial fill writes; flagged beyond
        --mismatch-hf / --mismatch-s), and reactions matched by their species
        with k_B/k_A at 500/1000/2000 K (flagged outside 1/F–F, default F = 2).
        Exit 0 when nothing is flagged, 1 when a thermo or rate difference,
        a second name or a name clash is found, 2 on usage or I/O problems.
  kiln equilibrium FILE --mix "NAME:AMOUNT, ..." [--temperature K] [--pressure P]
                   [--adiabatic] [--volume] [--json]
        Equilibrium composition over the file's species by Gibbs-energy
        minimisation, from the file's own thermo. --mix lists species and
        amounts (mol, any scale), items separated by commas or blanks:
        "CH4:1, O2:2, N2:7.52" or "CH4:1 O2:2 N2:7.52". --temperature (default
        298.15 K) and --pressure (default 1atm; units atm, bar, Pa, kPa, Torr)
        give the state of the mix; --adiabatic finds the flame temperature
        (constant enthalpy, or constant internal energy with --volume);
        --volume holds the mix's volume instead of the pressure.
        Exit 0 when computed, 1 when the file cannot give an equilibrium
        (a mix species without thermo, no convergence), 2 on usage or I/O.
  kiln serve [--log FILE] [--memory-limit SIZE]
        Run the language server on stdin/stdout. --memory-limit sets a soft
        limit on the server's Go heap (600MiB, 1GiB, 800MB; off for none;
        default: none, GOGC and GOMEMLIMIT apply as for any Go program);
        near the limit the garbage collector runs more often, which costs
        CPU time per edit.
  kiln version
  kiln help          (or --help / -h after any command)

Common flags (every command; flags may stand before or after the operands):
  --units kcal/mol|kJ/mol   energies in messages and tables (default: the file's unit)
  --tmid K --thigh K        NASA-7 fit temperatures (default 1000 and 5000 K; 300 < tmid
                            < thigh ≤ 6000)
  --mismatch-hf X           thermo-mismatch threshold on ΔHf°298 and H(T)−H(298 K),
                            kcal/mol (default 3)
  --mismatch-s X            thermo-mismatch threshold on S°298, cal/(mol·K) (default 3)
  --mismatch-cp X           thermo-mismatch threshold on Cp(T), cal/(mol·K) (default 1.5)
  --collision-factor F      multiply the collision limit by F (default 1)
  --pressure P              pressure for displayed rates (see summary)
  --root DIR                workspace root that includes must stay in: an existing
                            directory above the file (default: the nearest
                            directory above the file holding .git, else the
                            file's directory)

Estimates are group-additivity estimates: they typically err by 1–3 kcal/mol.
Check them against measured data, licensed engineering practice and local
codes before relying on a result.
`

// errHelp is returned by parseArgs for --help (or -h) anywhere on a
// command line: the command's help is printed and kiln exits 0.
var errHelp = errors.New("help requested")

// commandHelp returns the part of helpText about cmd (its usage lines) and
// the common flags.
func commandHelp(cmd string) string {
	lines := strings.Split(helpText, "\n")
	var b strings.Builder
	in := false
	for _, l := range lines {
		switch {
		case strings.HasPrefix(l, "  kiln "):
			in = strings.HasPrefix(l, "  kiln "+cmd+" ") || l == "  kiln "+cmd
		case strings.HasPrefix(l, "Common flags"):
			in = cmd != "serve"
			if in {
				b.WriteString("\n")
			}
		case l == "" || !strings.HasPrefix(l, " "):
			if !strings.HasPrefix(l, "Common flags") {
				in = in && strings.HasPrefix(l, " ")
			}
		}
		if in {
			b.WriteString(l + "\n")
		}
	}
	if b.Len() == 0 {
		return helpText
	}
	return "Usage:\n" + b.String()
}

// flagSpec describes the flags a command accepts: name → takes a value.
type flagSpec map[string]bool

// parseArgs splits args into flags and operands. Flags may appear anywhere;
// "--" ends flag parsing. Both "--name value" and "--name=value" are accepted,
// and a single leading dash works too.
func parseArgs(args []string, spec flagSpec) (flags map[string]string, operands []string, err error) {
	flags = map[string]string{}
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "--" {
			operands = append(operands, args[i+1:]...)
			break
		}
		if len(a) < 2 || a[0] != '-' || isNumber(a) {
			operands = append(operands, a)
			continue
		}
		name := strings.TrimLeft(a, "-")
		if name == "help" || name == "h" {
			return nil, nil, errHelp
		}
		value, hasValue := "", false
		if k := strings.IndexByte(name, '='); k >= 0 {
			name, value, hasValue = name[:k], name[k+1:], true
		}
		takes, ok := spec[name]
		if !ok {
			return nil, nil, usagef("unknown flag %s", a)
		}
		if takes && !hasValue {
			if i+1 >= len(args) {
				return nil, nil, usagef("flag --%s needs a value", name)
			}
			i++
			value = args[i]
		} else if !takes && hasValue {
			return nil, nil, usagef("flag --%s takes no value", name)
		}
		if !takes {
			value = "true"
		}
		flags[name] = value
	}
	return flags, operands, nil
}

func isNumber(s string) bool {
	var f float64
	_, err := fmt.Sscanf(s, "%g", &f)
	return err == nil
}
