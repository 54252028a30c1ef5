import { test } from 'node:test';
import * as assert from 'node:assert/strict';
import { defaultServerSettings, serverCommand, toServerSettings } from '../../src/settings';

function reader(values: Record<string, unknown>): (key: string) => unknown {
  return (key) => values[key];
}

test('empty configuration yields the server defaults', () => {
  assert.deepEqual(toServerSettings(reader({})), { ...defaultServerSettings });
});

test('every kiln.* setting maps to its server key', () => {
  const s = toServerSettings(
    reader({
      units: 'kJ/mol',
      'fit.tMid': 1200,
      'fit.tHigh': 4000,
      'thresholds.hf298': 1.5,
      'thresholds.s298': 2.5,
      'thresholds.cp': 0.8,
      'thresholds.collisionFactor': 10,
      pressure: 10,
    }),
  );
  assert.deepEqual(s, {
    units: 'kJ/mol',
    tMid: 1200,
    tHigh: 4000,
    mismatchHf298: 1.5,
    mismatchS298: 2.5,
    mismatchCp: 0.8,
    collisionFactor: 10,
    pressure: 10,
  });
  // The server reads exactly these keys (analysis.SettingsInput); an extra or
  // renamed key would be ignored silently.
  assert.deepEqual(Object.keys(s).sort(), [
    'collisionFactor',
    'mismatchCp',
    'mismatchHf298',
    'mismatchS298',
    'pressure',
    'tHigh',
    'tMid',
    'units',
  ]);
});

test('units and pressure are sent only when set, so the file units statement applies', () => {
  assert.equal('units' in toServerSettings(reader({})), false);
  assert.equal('units' in toServerSettings(reader({ units: null })), false);
  assert.equal('pressure' in toServerSettings(reader({ pressure: null })), false);
  assert.equal('pressure' in toServerSettings(reader({ pressure: -1 })), false);
  assert.equal(toServerSettings(reader({ units: 'kcal/mol' })).units, 'kcal/mol');
});

test('estimateNotes is sent only when set, as a boolean', () => {
  assert.equal('estimateNotes' in toServerSettings(reader({})), false);
  assert.equal('estimateNotes' in toServerSettings(reader({ estimateNotes: null })), false);
  assert.equal('estimateNotes' in toServerSettings(reader({ estimateNotes: 'yes' })), false);
  assert.equal(toServerSettings(reader({ estimateNotes: false })).estimateNotes, false);
  assert.equal(toServerSettings(reader({ estimateNotes: true })).estimateNotes, true);
});

test('malformed values fall back to defaults', () => {
  const s = toServerSettings(
    reader({
      units: 'eV',
      'fit.tMid': 'hot',
      'fit.tHigh': Number.POSITIVE_INFINITY,
      'thresholds.hf298': 0,
      'thresholds.s298': Number.NaN,
      'thresholds.cp': -2,
      'thresholds.collisionFactor': null,
      pressure: 'high',
    }),
  );
  assert.deepEqual(s, { ...defaultServerSettings });
});

test('fit temperatures outside 300 K < tMid < tHigh <= 6000 K revert together', () => {
  const cases: Array<[number, number]> = [
    [300, 5000], // tMid must exceed 300 K
    [2000, 1500], // tMid must be below tHigh
    [1000, 6500], // tHigh at most 6000 K
  ];
  for (const [tMid, tHigh] of cases) {
    const s = toServerSettings(reader({ 'fit.tMid': tMid, 'fit.tHigh': tHigh }));
    assert.equal(s.tMid, 1000, `tMid for ${tMid}/${tHigh}`);
    assert.equal(s.tHigh, 5000, `tHigh for ${tMid}/${tHigh}`);
  }
  const ok = toServerSettings(reader({ 'fit.tMid': 1200, 'fit.tHigh': 6000 }));
  assert.equal(ok.tMid, 1200);
  assert.equal(ok.tHigh, 6000);
});

test('server command: path, serve, optional log file', () => {
  assert.deepEqual(serverCommand(reader({})), { command: 'kiln', args: ['serve'] });
  assert.deepEqual(serverCommand(reader({ 'server.path': ' /opt/kiln/bin/kiln ', 'server.logFile': '/tmp/k.log' })), {
    command: '/opt/kiln/bin/kiln',
    args: ['serve', '--log', '/tmp/k.log'],
  });
  assert.deepEqual(serverCommand(reader({ 'server.path': '' })), { command: 'kiln', args: ['serve'] });
});

test('package.json defaults agree with the server defaults', () => {
  // eslint-disable-next-line @typescript-eslint/no-var-requires
  const pkg = require('../../../package.json');
  const props = pkg.contributes.configuration.properties;
  const fromPackage = toServerSettings((key) => props[`kiln.${key}`]?.default);
  assert.deepEqual(fromPackage, { ...defaultServerSettings });
  assert.equal(props['kiln.server.path'].default, 'kiln');
  assert.equal(props['kiln.estimateNotes'].default, null);
  // The keyword re-indentation runs as on-type formatting.
  assert.equal(pkg.contributes.configurationDefaults['[kiln]']['editor.formatOnType'], true);
});
