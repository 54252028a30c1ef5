import { test } from 'node:test';
import * as assert from 'node:assert/strict';
import { defaultMix, equilibriumArgs, formatEquilibrium } from '../../src/equilibrium';

function reader(values: Record<string, unknown>): (key: string) => unknown {
  return (key) => values[key];
}

test('equilibrium: defaults are the flame temperature from 298.15 K and 1 atm', () => {
  assert.deepEqual(equilibriumArgs('file:///w/a.kiln', ' CH4:1, O2:2 ', reader({})), {
    uri: 'file:///w/a.kiln',
    mix: 'CH4:1, O2:2',
    temperature: 298.15,
    pressure: '1atm',
    adiabatic: true,
    volume: false,
  });
});

test('equilibrium: settings map to the command argument', () => {
  const a = equilibriumArgs(
    'file:///w/a.kiln',
    'H2O:1',
    reader({
      'equilibrium.temperature': 2500,
      'equilibrium.pressure': ' 10bar ',
      'equilibrium.adiabatic': false,
      'equilibrium.volume': true,
    }),
  );
  assert.equal(a.temperature, 2500);
  assert.equal(a.pressure, '10bar');
  assert.equal(a.adiabatic, false);
  assert.equal(a.volume, true);
  // The server's argument keys, exactly.
  assert.deepEqual(Object.keys(a).sort(), ['adiabatic', 'mix', 'pressure', 'temperature', 'uri', 'volume']);
  // Wrong types fall back to the defaults (the server checks values).
  const b = equilibriumArgs('u', 'X:1', reader({ 'equilibrium.temperature': 'hot', 'equilibrium.pressure': 3 }));
  assert.equal(b.temperature, 298.15);
  assert.equal(b.pressure, '1atm');
});

test('equilibrium: the input box offers the last mixture, else the setting', () => {
  assert.equal(defaultMix(reader({ 'equilibrium.mix': 'CH4:1, O2:2, N2:7.52' }), undefined), 'CH4:1, O2:2, N2:7.52');
  assert.equal(defaultMix(reader({ 'equilibrium.mix': 'CH4:1' }), 'H2:2, O2:1'), 'H2:2, O2:1');
  assert.equal(defaultMix(reader({}), undefined), '');
});

test('equilibrium: the shown text is the mixture, the CLI text and the notes', () => {
  const text = 'Equilibrium of a.kiln, adiabatic at constant pressure (enthalpy of the mix)\nfinal    T = 2223.40 K\n';
  assert.equal(
    formatEquilibrium('CH4:1', { text, result: {}, warnings: ['a.kiln has 1 error(s)'] }),
    `mix: CH4:1\n${text}note: a.kiln has 1 error(s)\n`,
  );
  assert.equal(formatEquilibrium('CH4:1', { text: 'x', result: {}, warnings: [] }), 'mix: CH4:1\nx\n');
});
