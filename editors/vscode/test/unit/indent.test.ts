import { test } from 'node:test';
import * as assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { desiredIndent, reindentAfterKeyword } from '../../src/indent';

// The compiled test runs from out/test/unit; the package root is three up.
const root = path.resolve(__dirname, '../../..');
const langConfig = JSON.parse(fs.readFileSync(path.join(root, 'language-configuration.json'), 'utf8'));

/** Types text line by line: each new line gets what Enter would give (the
 * previous line's indent, one level more after a statement or block header),
 * then the keyword rule is applied as on-type formatting would. */
function typeLines(typed: string[]): string[] {
  const lines: string[] = [];
  const incr = new RegExp(langConfig.indentationRules.increaseIndentPattern);
  for (const t of typed) {
    const prev = lines.length ? lines[lines.length - 1] : '';
    let indent = /^\s*/.exec(prev)![0].length;
    if (lines.length && incr.test(prev)) indent += 2;
    lines.push(' '.repeat(indent) + t);
    const edit = reindentAfterKeyword(lines, lines.length - 1);
    if (edit) {
      const l = lines[lines.length - 1];
      lines[lines.length - 1] = edit.text + l.slice(edit.length);
    }
  }
  return lines;
}

test('a statement typed under an indented line goes to column 0', () => {
  assert.deepEqual(typeLines(['species ethanol CCO', 'nasa7 300 1000 5000', 'low 1 2 3', 'species ethane CC']), [
    'species ethanol CCO',
    '  nasa7 300 1000 5000',
    '    low 1 2 3',
    'species ethane CC',
  ]);
  assert.deepEqual(typeLines(['species ethanol CCO', 'multiplicity 1', 'reaction ethanol => ethane']), [
    'species ethanol CCO',
    '  multiplicity 1',
    'reaction ethanol => ethane',
  ]);
});

test('attributes by 2, block lines by 4, back to 2 after a block', () => {
  assert.deepEqual(
    typeLines(['species ethanol CCO', 'nasa7 300 1000 5000', 'low 1 2', 'high 1 2', 'symmetry 3', 'group C-(C)(H)3', 'hf298 -10.2']),
    ['species ethanol CCO', '  nasa7 300 1000 5000', '    low 1 2', '    high 1 2', '  symmetry 3', 'group C-(C)(H)3', '  hf298 -10.2'],
  );
  const tt = ['species tar-lump', '  thermo-table', '    hf298 35.0', '    cp 300=32.0', '    source handbook', '  note after'];
  assert.deepEqual(tt.map((_, i) => desiredIndent(tt, i)), [0, 2, 4, 4, 4, 2]);
});

test('no edit for a correctly indented line or a non-keyword', () => {
  assert.equal(reindentAfterKeyword(['species a C', '  multiplicity 2'], 1), undefined);
  assert.equal(reindentAfterKeyword(['species a C', '  foo 2'], 1), undefined);
  assert.equal(reindentAfterKeyword(['# c', '  # only a comment'], 1), undefined);
});

test('language configuration: Enter indents after statements and block headers, outdents statements', () => {
  const enter = langConfig.onEnterRules as Array<{ beforeText: string; action: { indent: string } }>;
  const rule = (line: string) => enter.find((r) => new RegExp(r.beforeText).test(line))?.action.indent;
  assert.equal(rule('species ethanol CCO'), 'indent');
  assert.equal(rule('reaction A => B   A=1 n=0 Ea=0'), 'indent');
  assert.equal(rule('  nasa7 300 1000 5000'), 'indent');
  assert.equal(rule('units kJ/mol'), 'none');
  assert.equal(rule('  multiplicity 1'), undefined);
  const decr = new RegExp(langConfig.indentationRules.decreaseIndentPattern);
  assert.ok(decr.test('  species x C'));
  assert.ok(decr.test('    reaction'));
  assert.ok(!decr.test('species x C'));
  assert.ok(!decr.test('  speciesfoo'));
});
