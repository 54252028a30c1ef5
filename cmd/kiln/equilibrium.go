package main

import (
	"context"
	"errors"
	"fmt"

	"kiln.dev/kiln/analysis"
)

// runEquilibrium is `kiln equilibrium`. The mixture syntax, the inputs, the
// computation, the JSON keys and the text are analysis.Equilibrium's, shared
// with the language server's kiln.equilibrium command.
func runEquilibrium(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"json": false, "mix": true, "temperature": true,
		"pressure": true, "adiabatic": false, "volume": false}))
	if err != nil {
		return 0, err
	}
	if len(files) != 1 {
		return 0, usagef("equilibrium needs exactly one FILE")
	}
	req := analysis.EquilibriumRequest{T: analysis.DefaultEquilibriumTemperature, P: analysis.DefaultEquilibriumPressure,
		Adiabatic: flags["adiabatic"] == "true", ConstantVolume: flags["volume"] == "true", Display: displayPath}
	if req.Mix, err = analysis.ParseMix(flags["mix"]); err != nil {
		return 0, inputUsage(err)
	}
	if v, ok := flags["temperature"]; ok {
		if req.T, err = analysis.ParseEquilibriumTemperature(v); err != nil {
			return 0, inputUsage(err)
		}
	}
	if v, ok := flags["pressure"]; ok {
		if req.P, err = analysis.ParseEquilibriumPressure(v); err != nil {
			return 0, inputUsage(err)
		}
	}
	results, _, err := analyzeFileScope(e, files[0], flags)
	if err != nil {
		return 0, err
	}
	res := results[0]
	out, err := res.Equilibrium(context.Background(), req)
	if err != nil {
		var ie *analysis.InputError
		if errors.As(err, &ie) {
			return 0, inputUsage(err)
		}
		fmt.Fprintf(e.stderr, "kiln equilibrium: %v\n", err)
		return exitProblems, nil
	}
	if n := scopeErrors(results); n > 0 {
		fmt.Fprintf(e.stderr, "kiln equilibrium: %s has %d error(s) (`kiln check` lists them); broken statements were left out\n", out.File, n)
	}
	if flags["json"] == "true" {
		if err := writeJSON(e.stdout, out); err != nil {
			return 0, err
		}
		return exitOK, nil
	}
	out.WriteText(e.stdout)
	return exitOK, nil
}

// inputUsage turns an *analysis.InputError into a usage error that names the
// flag (--mix …).
func inputUsage(err error) error {
	var ie *analysis.InputError
	if errors.As(err, &ie) {
		return usagef("--%s%s", ie.Input, ie.Msg)
	}
	return err
}
