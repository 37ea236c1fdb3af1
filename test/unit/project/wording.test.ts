/**
 * The project stands on its own: no file points to documents outside the
 * repository, and nothing a user can read calls a value recalled or
 * unconfirmed, or cites the team's notes (a value from memory is shown with
 * its source and "value not checked against the published text",
 * docs/checks.md).
 */
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(__dirname, '..', '..', '..');
const FOLDERS = ['app', 'src', 'server', 'shared', 'scripts', 'test'];

function walk(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    else if (/\.(tsx?|mjs|js|md|py|json|sql)$/.test(entry.name)) out.push(full);
  }
  return out;
}

const files = FOLDERS.flatMap((f) => walk(path.join(ROOT, f)));
const rel = (f: string) => path.relative(ROOT, f);
// Spelled in pieces so this file does not find itself.
const OUTSIDE = new RegExp(['hand' + 'book', 'moment [0-9]'].join('|'), 'i');
const UNSURE_WORDS = new RegExp(['\\brecall' + 'ed\\b', '\\bunconfirm' + 'ed\\b', 'hand' + 'book'].join('|'), 'i');

/** Every string literal and JSX text in a source file, with its line. */
function textsOf(file: string): { text: string; line: number }[] {
  const source = ts.createSourceFile(file, fs.readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true, file.endsWith('x') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const out: { text: string; line: number }[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isStringLiteralLike(node) || ts.isTemplateLiteralToken(node) || ts.isJsxText(node)) {
      out.push({ text: node.text, line: source.getLineAndCharacterOfPosition(node.getStart()).line + 1 });
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return out;
}

/**
 * Retired synonyms (docs/screens.md, "One word for each thing"), spelled in
 * pieces so this file does not find itself; test/e2e/wording.test.ts looks
 * for them in what the browser shows as well.
 */
const RETIRED = new RegExp(
  ['tar' + 'get carriage', 'from \\(par' + 'ent\\)', 'to \\(recei' + 'ving\\)', 'fail' + 'ed set', 'mark' + 'ed failed', 'feed ' + 'role', 'site ' + 'role', '(households|carriages) ' + 'lost', 'receive and transmit ' + 'channels apart'].join('|'),
  'i',
);

describe('the project stands on its own', () => {
  it('walks a real tree', () => {
    expect(files.length).toBeGreaterThan(200);
    expect(files.map(rel)).toContain('server/engine/engine.ts');
  });

  it('no file cites documents outside the repository; they point into docs/ instead', () => {
    const hits = files.filter((f) => OUTSIDE.test(fs.readFileSync(f, 'utf8'))).map(rel);
    expect(hits).toEqual([]);
  });

  it('no text a user can read calls a value recalled or unconfirmed', () => {
    const sources = files.filter((f) => /\.tsx?$/.test(f) && !/\.test\.tsx?$/.test(f) && !f.includes(`${path.sep}test${path.sep}`));
    const hits: string[] = [];
    for (const f of sources) {
      for (const { text, line } of textsOf(f)) {
        // 'recalled' alone is the confidence code the API carries, not words shown to anyone
        if (text !== 'recalled' && UNSURE_WORDS.test(text)) hits.push(`${rel(f)}:${line} ${JSON.stringify(text)}`);
      }
    }
    expect(hits).toEqual([]);
  });

  it('no text a user can read in the client or a server sentence uses a retired synonym', () => {
    const sources = files.filter((f) => /\.tsx?$/.test(f) && !/\.test\.tsx?$/.test(f) && !f.includes(`${path.sep}test${path.sep}`));
    const hits: string[] = [];
    for (const f of sources) {
      for (const { text, line } of textsOf(f)) if (RETIRED.test(text)) hits.push(`${rel(f)}:${line} ${JSON.stringify(text)}`);
    }
    expect(hits).toEqual([]);
  });
});
