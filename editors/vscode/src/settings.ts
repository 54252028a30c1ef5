// Mapping from the VS Code `kiln.*` settings to the settings object the kiln
// language server reads from initializationOptions and from
// workspace/didChangeConfiguration ({"kiln": {...}}).
//
// This module must not import 'vscode' so that it can be unit-tested with
// plain node.

/** Settings understood by `kiln serve`, with the server's exact key names. */
export interface KilnServerSettings {
  /** Energy unit of hovers, hints and inserted blocks: "kcal/mol" or "kJ/mol". */
  units: 'kcal/mol' | 'kJ/mol';
  /** Common temperature of fitted NASA-7 polynomials, K. */
  tMid: number;
  /** Upper temperature of fitted NASA-7 polynomials, K. */
  tHigh: number;
  /** ΔHf°298 mismatch threshold, kcal/mol. */
  mismatchHf298: number;
  /** S°298 mismatch threshold, cal/(mol K). */
  mismatchS298: number;
  /** Multiple of the collision limit above which a rate is reported. */
  collisionFactor: number;
}

/** Defaults; they equal the server's own defaults and the package.json defaults. */
export const defaultServerSettings: Readonly<KilnServerSettings> = Object.freeze({
  units: 'kcal/mol',
  tMid: 1000,
  tHigh: 5000,
  mismatchHf298: 3,
  mismatchS298: 3,
  collisionFactor: 1,
});

/** Reads one setting below the `kiln` section, e.g. `fit.tMid`. */
export type SettingReader = (key: string) => unknown;

function finiteNumber(v: unknown, fallback: number, min: number): number {
  return typeof v === 'number' && Number.isFinite(v) && v >= min ? v : fallback;
}

/**
 * Builds the server settings from the `kiln.*` configuration. Values of the
 * wrong type, non-finite or below the allowed minimum fall back to the
 * defaults so the server never receives a malformed setting.
 */
export function toServerSettings(get: SettingReader): KilnServerSettings {
  const d = defaultServerSettings;
  const units = get('units');
  return {
    units: units === 'kJ/mol' || units === 'kcal/mol' ? units : d.units,
    tMid: finiteNumber(get('fit.tMid'), d.tMid, 0),
    tHigh: finiteNumber(get('fit.tHigh'), d.tHigh, 0),
    mismatchHf298: finiteNumber(get('thresholds.hf298'), d.mismatchHf298, 0),
    mismatchS298: finiteNumber(get('thresholds.s298'), d.mismatchS298, 0),
    collisionFactor: finiteNumber(get('thresholds.collisionFactor'), d.collisionFactor, 0),
  };
}

/** The command line that starts the server: `<path> serve [--log FILE]`. */
export function serverCommand(get: SettingReader): { command: string; args: string[] } {
  const p = get('server.path');
  const command = typeof p === 'string' && p.trim() !== '' ? p.trim() : 'kiln';
  const args = ['serve'];
  const log = get('server.logFile');
  if (typeof log === 'string' && log.trim() !== '') {
    args.push('--log', log.trim());
  }
  return { command, args };
}

/** Settings keys whose change requires restarting the server process. */
export const restartKeys: readonly string[] = ['kiln.server.path', 'kiln.server.logFile'];
