// Indentation of kiln files, the same rules as the Neovim (lua/kiln/indent.lua)
// and Emacs (kiln-indent-line) plugins: statements in column 0, attribute
// lines by 2, the lines of a nasa7 or thermo-table block by 4; an attribute
// keyword inside a block that does not belong to it goes back to 2.
//
// This module must not import 'vscode' so that it can be unit-tested with
// plain node.

export const attributeIndent = 2;
export const blockIndent = 4;

export const statementKeywords: readonly string[] = ['species', 'reaction', 'units', 'include', 'group'];

export const attributeKeywords: readonly string[] = [
  'multiplicity', 'symmetry', 'optical-isomers', 'composition', 'note',
  'nasa7', 'thermo-table', 'low-pressure', 'troe', 'efficiencies', 'pressure',
  'duplicate', 'reverse', 'hf298', 's298', 'cp', 'source',
];

const blockKeywords: Readonly<Record<string, readonly string[]>> = {
  nasa7: ['low', 'high', 'source'],
  'thermo-table': ['hf298', 's298', 'cp', 'source'],
};

/** First token of a line, or undefined for a blank or comment-only line. */
export function keyword(text: string): string | undefined {
  const m = /^\s*([^\s#]\S*)/.exec(text);
  return m ? m[1] : undefined;
}

function indentOf(text: string): number {
  let n = 0;
  for (const c of text) {
    if (c === ' ') n++;
    else if (c === '\t') n += 8 - (n % 8);
    else break;
  }
  return n;
}

function previousCode(lines: readonly string[], l: number): number | undefined {
  for (let i = l - 1; i >= 0; i--) {
    if (keyword(lines[i]) !== undefined) return i;
  }
  return undefined;
}

/** What line l continues: 'top', 'statement', or a block header keyword. */
function context(lines: readonly string[], l: number): string {
  const p = previousCode(lines, l);
  if (p === undefined) return 'top';
  const kw = keyword(lines[p]) as string;
  const ind = indentOf(lines[p]);
  if (kw in blockKeywords) return kw;
  if (ind === 0) return statementKeywords.includes(kw) ? 'statement' : 'top';
  for (let q = previousCode(lines, p); q !== undefined; q = previousCode(lines, q)) {
    if (indentOf(lines[q]) < ind) {
      const k = keyword(lines[q]) as string;
      return k in blockKeywords ? k : 'statement';
    }
  }
  return 'statement';
}

/** The indentation (columns) line l (0-based) of lines should have. */
export function desiredIndent(lines: readonly string[], l: number): number {
  const text = lines[l];
  if (text.startsWith('#')) return 0;
  const kw = keyword(text);
  if (kw !== undefined && statementKeywords.includes(kw)) return 0;
  const ctx = context(lines, l);
  if (ctx === 'top') return 0;
  if (ctx === 'statement') return attributeIndent;
  if (kw !== undefined && attributeKeywords.includes(kw) && !blockKeywords[ctx].includes(kw)) {
    return attributeIndent;
  }
  return blockIndent;
}

/**
 * The re-indentation of line l after a blank was typed on it: when its first
 * word is a keyword that just ended and its indentation is wrong, the
 * replacement of the leading whitespace (its length and the new text);
 * otherwise undefined.
 */
export function reindentAfterKeyword(
  lines: readonly string[],
  l: number,
): { length: number; text: string } | undefined {
  const text = lines[l];
  const kw = keyword(text);
  if (kw === undefined || !(statementKeywords.includes(kw) || attributeKeywords.includes(kw))) {
    return undefined;
  }
  const lead = /^\s*/.exec(text)![0];
  const want = desiredIndent(lines, l);
  if (indentOf(lead) === want && !lead.includes('\t')) return undefined;
  return { length: lead.length, text: ' '.repeat(want) };
}
