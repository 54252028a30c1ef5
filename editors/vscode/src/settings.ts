// Mapping from the VS Code `kiln.*` settings to the settings object the kiln
// language server reads from initializationOptions and from
// workspace/didChangeConfiguration ({"kiln": {...}}).
//
// This module must not import 'vscode' so that it can be unit-tested with
// plain node.

/** Settings understood by `kiln serve`, with the server's exact key names. */
export interface KilnServerSettings {
  /**
   * Energy unit of hovers, hints and inserted blocks: "kcal/mol" or "kJ/mol".
   * Absent: each file's own `units` statement decides (the server's rule).
   */
  units?: 'kcal/mol' | 'kJ/mol';
  /** Common temperature of fitted NASA-7 polynomials, K. */
  tMid: number;
  /** Upper temperature of fitted NASA-7 polynomials, K. */
  tHigh: number;
  /** ΔHf°298 mismatch threshold, kcal/mol. */
  mismatchHf298: number;
  /** S°298 mismatch threshold, cal/(mol K). */
  mismatchS298: number;
  /** Cp(T) mismatch threshold, cal/(mol K). */
  mismatchCp: number;
  /** Multiple of the collision limit above which a rate is reported. */
  collisionFactor: number;
  /** Pressure (bar) of pressure-dependent rates. Absent: 1 atm. */
  pressure?: number;
  /**
   * Send the per-species "estimated …" information diagnostics. Absent: the
   * server decides (off for clients that show inlay hints).
   */
  estimateNotes?: boolean;
}

/** Defaults; they equal the server's own defaults and the package.json defaults. */
export const defaultServerSettings: Readonly<KilnServerSettings> = Object.freeze({
  tMid: 1000,
  tHigh: 5000,
  mismatchHf298: 3,
  mismatchS298: 3,
  mismatchCp: 1.5,
  collisionFactor: 1,
});

/** Reads one setting below the `kiln` section, e.g. `fit.tMid`. */
export type SettingReader = (key: string) => unknown;

function positive(v: unknown, fallback: number): number {
  return typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : fallback;
}

/**
 * Builds the server settings from the `kiln.*` configuration.
 *
 * The server rejects the whole settings object if any value is invalid, so
 * invalid values are replaced by the defaults here: thresholds and the
 * collision factor must be finite and > 0, and the fit temperatures must
 * satisfy 300 K < tMid < tHigh ≤ 6000 K (otherwise both revert to 1000 K
 * and 5000 K).
 */
export function toServerSettings(get: SettingReader): KilnServerSettings {
  const d = defaultServerSettings;
  const units = get('units');
  let tMid = positive(get('fit.tMid'), d.tMid);
  let tHigh = positive(get('fit.tHigh'), d.tHigh);
  if (!(tMid > 300 && tMid < tHigh && tHigh <= 6000)) {
    tMid = d.tMid;
    tHigh = d.tHigh;
  }
  const out: KilnServerSettings = {
    tMid,
    tHigh,
    mismatchHf298: positive(get('thresholds.hf298'), d.mismatchHf298),
    mismatchS298: positive(get('thresholds.s298'), d.mismatchS298),
    mismatchCp: positive(get('thresholds.cp'), d.mismatchCp),
    collisionFactor: positive(get('thresholds.collisionFactor'), d.collisionFactor),
  };
  if (units === 'kJ/mol' || units === 'kcal/mol') {
    out.units = units;
  }
  const pressure = get('pressure');
  if (typeof pressure === 'number' && Number.isFinite(pressure) && pressure > 0) {
    out.pressure = pressure;
  }
  const notes = get('estimateNotes');
  if (typeof notes === 'boolean') {
    out.estimateNotes = notes;
  }
  return out;
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
