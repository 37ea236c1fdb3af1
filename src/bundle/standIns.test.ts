/**
 * The web bundle's stand-ins (standIns.js, wired in metro.config.js) still
 * match what they replace: every import they swap is still written where they
 * expect it (a package upgrade that moves it shows up here, not as a larger
 * bundle or a blank page), and the app's own 'expo-router' imports all have a
 * name in the smaller entry point.
 */
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const { standIns, standInFor } = require('./standIns.js') as {
  standIns: { from: string[]; request: RegExp; file: string }[];
  standInFor: (origin: string, request: string) => string | null;
};

const ROOT = path.resolve(__dirname, '..', '..');

function walk(dir: string, pattern: RegExp, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, pattern, out);
    else if (pattern.test(entry.name)) out.push(full);
  }
  return out;
}

function parse(file: string): ts.SourceFile {
  return ts.createSourceFile(file, fs.readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true, file.endsWith('x') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
}

/** Module specifiers a file imports, requires or re-exports. */
function specifiersOf(file: string): string[] {
  const out: string[] = [];
  const visit = (node: ts.Node) => {
    if ((ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier)) out.push(node.moduleSpecifier.text);
    if (ts.isCallExpression(node) && node.arguments.length === 1 && ts.isStringLiteral(node.arguments[0]) && (node.expression.getText() === 'require' || node.expression.kind === ts.SyntaxKind.ImportKeyword)) {
      out.push(node.arguments[0].text);
    }
    ts.forEachChild(node, visit);
  };
  visit(parse(file));
  return out;
}

/** Names imported as values (not types) from `module` in `file`. */
function valueImports(file: string, module: string): string[] {
  const out: string[] = [];
  for (const st of parse(file).statements) {
    if (!ts.isImportDeclaration(st) || !ts.isStringLiteral(st.moduleSpecifier) || st.moduleSpecifier.text !== module) continue;
    const clause = st.importClause;
    if (!clause || clause.isTypeOnly) continue;
    if (clause.name) out.push('default');
    const bindings = clause.namedBindings;
    if (bindings && ts.isNamespaceImport(bindings)) out.push('*');
    if (bindings && ts.isNamedImports(bindings)) for (const el of bindings.elements) if (!el.isTypeOnly) out.push((el.propertyName ?? el.name).text);
  }
  return out;
}

describe('web bundle stand-ins', () => {
  it('every swapped import is still written where the stand-in expects it', () => {
    for (const rule of standIns) {
      expect(fs.existsSync(rule.file), rule.file).toBe(true);
      // a named file must still make the import; of folders, one at least
      const writes = (f: string) => specifiersOf(f).some((s) => rule.request.test(s));
      const folders = rule.from.filter((f) => f.endsWith(path.sep));
      for (const from of rule.from.filter((f) => !f.endsWith(path.sep))) expect(writes(from), `${path.relative(ROOT, from)} no longer imports ${rule.request}`).toBe(true);
      if (folders.length) expect(folders.some((d) => walk(d, /\.(c?js|mjs|tsx?)$/).some(writes)), `nothing in ${folders.map((d) => path.relative(ROOT, d)).join(', ')} imports ${rule.request}`).toBe(true);
    }
  });

  it("answers the app's 'expo-router' with the smaller entry point, and nothing else", () => {
    const facade = path.join(ROOT, 'src', 'bundle', 'expoRouter.js');
    expect(standInFor(path.join(ROOT, 'app', '_layout.tsx'), 'expo-router')).toBe(facade);
    expect(standInFor(path.join(ROOT, 'src', 'screens', 'home', 'HomeScreen.tsx'), 'expo-router')).toBe(facade);
    expect(standInFor(path.join(ROOT, 'src', 'screens', 'home', 'HomeScreen.tsx'), 'expo-router/head')).toBeNull();
    expect(standInFor(facade, 'expo-router/build/hooks')).toBeNull();
    expect(standInFor(path.join(ROOT, 'node_modules', 'expo-router', 'build', 'index.js'), 'expo-router')).toBeNull();
    expect(standInFor(path.join(ROOT, 'node_modules', 'expo-router', 'build', 'views', 'Toast.js'), './Toast')).toBeNull();
  });

  it("has every name the app imports from 'expo-router', taken from a file that defines it", () => {
    const facade = parse(path.join(ROOT, 'src', 'bundle', 'expoRouter.js'));
    const provided = new Map<string, string>();
    for (const st of facade.statements) {
      if (ts.isExportDeclaration(st) && st.moduleSpecifier && ts.isStringLiteral(st.moduleSpecifier) && st.exportClause && ts.isNamedExports(st.exportClause)) {
        for (const el of st.exportClause.elements) provided.set(el.name.text, st.moduleSpecifier.text);
      }
    }
    const used = new Set(['app', 'src', 'shared'].flatMap((d) => walk(path.join(ROOT, d), /\.tsx?$/)).flatMap((f) => valueImports(f, 'expo-router')));
    expect(used.size).toBeGreaterThan(3);
    for (const name of used) expect(provided.has(name), `'${name}' is imported from expo-router but src/bundle/expoRouter.js does not export it`).toBe(true);
    for (const [name, from] of provided) {
      const built = fs.readFileSync(require.resolve(from, { paths: [ROOT] }), 'utf8');
      expect(built, `${from} does not define ${name}`).toMatch(new RegExp(`exports\\.${name}\\b|exports, "${name}"`));
    }
  });

  it("gives expo-router every react-native-web part its files read from 'react-native'", () => {
    const exportsOf = (file: string) => [...fs.readFileSync(file, 'utf8').matchAll(/export \{ default as (\w+) \}/g)].map((m) => m[1]);
    const web = new Set(exportsOf(path.join(ROOT, 'node_modules', 'react-native-web', 'dist', 'index.js')));
    const given = new Set(exportsOf(path.join(__dirname, 'reactNativeForRouter.js')));
    const read = new Set<string>();
    for (const f of walk(path.join(ROOT, 'node_modules', 'expo-router', 'build'), /\.js$/)) {
      const text = fs.readFileSync(f, 'utf8');
      const requires = text.match(/require\(["']react-native["']\)/g)?.length ?? 0;
      // one form only, so the names below are all it reads
      expect(text.match(/const react_native_1 = require\("react-native"\);/g)?.length ?? 0, path.relative(ROOT, f)).toBe(requires);
      for (const m of text.matchAll(/react_native_1\.(\w+)/g)) read.add(m[1]);
    }
    expect(read.has('View')).toBe(true);
    for (const name of read) if (web.has(name)) expect(given.has(name), `expo-router reads react-native's ${name}`).toBe(true);
    for (const name of given) expect(web.has(name), `${name} is not a react-native-web export`).toBe(true);
  });
});
