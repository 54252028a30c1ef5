// The editor side of the server's kiln.equilibrium command: the command's
// argument built from the `kiln.equilibrium.*` settings, and the text shown
// for its answer.
//
// This module must not import 'vscode' so that it can be unit-tested with
// plain node.

import type { SettingReader } from './settings';

/** The server command that computes an equilibrium. */
export const serverCommand = 'kiln.equilibrium';
/** The extension's command (and the code lens's): ask for the mixture, run, show. */
export const showCommand = 'kiln.showEquilibrium';

/** The argument of kiln.equilibrium (the inputs of `kiln equilibrium`). */
export interface EquilibriumArgs {
  uri: string;
  /** "CH4:1, O2:2, N2:7.52" */
  mix: string;
  /** Initial temperature, K. */
  temperature: number;
  /** Initial pressure with its unit, e.g. "1atm". */
  pressure: string;
  /** Find the adiabatic (flame) temperature; else hold the temperature. */
  adiabatic: boolean;
  /** Hold the volume instead of the pressure. */
  volume: boolean;
}

/** The answer of kiln.equilibrium. */
export interface EquilibriumAnswer {
  /** What `kiln equilibrium` prints. */
  text: string;
  /** The keys of `kiln equilibrium --json`. */
  result: Record<string, unknown>;
  /** About the file: errors in it, an analysis older than the text. */
  warnings: string[];
}

/**
 * Builds the command's argument. Temperature and pressure come from
 * `kiln.equilibrium.temperature` (default 298.15 K) and
 * `kiln.equilibrium.pressure` (default "1atm"); the server checks them and
 * answers with the CLI's message when they are wrong.
 */
export function equilibriumArgs(uri: string, mix: string, get: SettingReader): EquilibriumArgs {
  const t = get('equilibrium.temperature');
  const p = get('equilibrium.pressure');
  const adiabatic = get('equilibrium.adiabatic');
  const volume = get('equilibrium.volume');
  return {
    uri,
    mix: mix.trim(),
    temperature: typeof t === 'number' && Number.isFinite(t) ? t : 298.15,
    pressure: typeof p === 'string' && p.trim() !== '' ? p.trim() : '1atm',
    adiabatic: typeof adiabatic === 'boolean' ? adiabatic : true,
    volume: volume === true,
  };
}

/** The mixture offered in the input box: `kiln.equilibrium.mix`, else the last one typed. */
export function defaultMix(get: SettingReader, last: string | undefined): string {
  if (last && last.trim() !== '') {
    return last;
  }
  const m = get('equilibrium.mix');
  return typeof m === 'string' ? m : '';
}

/** The text shown for an answer: the mixture, the CLI's text, the warnings. */
export function formatEquilibrium(mix: string, answer: EquilibriumAnswer): string {
  let out = `mix: ${mix.trim()}\n${answer.text}`;
  if (!out.endsWith('\n')) {
    out += '\n';
  }
  for (const w of answer.warnings ?? []) {
    out += `note: ${w}\n`;
  }
  return out;
}
