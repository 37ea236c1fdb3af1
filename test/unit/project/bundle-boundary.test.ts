/**
 * The web bundle takes from server/ only the code it shares with the client
 * (metro.config.js lets through server/engine, server/checks and the carriage
 * search). A file in that set that imports anything else from server/ fails
 * the web export, which only the browser tests and the benchmark build; this
 * finds it at once, by walking the relative and "@/server" imports.
 */
import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(__dirname, '../../..');
// the same rule as metro.config.js's block list
const config = createRequire(__filename)(path.join(ROOT, 'metro.config.js')) as { resolver: { blockList: RegExp[] } };
const blocked = (file: string) => config.resolver.blockList.some((re) => re.test(file));

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((d) => {
    const p = path.join(dir, d.name);
    if (d.isDirectory()) return sourceFiles(p);
    return /\.tsx?$/.test(d.name) && !/\.test\.tsx?$/.test(d.name) ? [p] : [];
  });
}

/** The file an import names, for relative and "@/" imports (others are packages). */
function resolveImport(from: string, spec: string): string | null {
  const base = spec.startsWith('@/') ? path.join(ROOT, spec.slice(2)) : spec.startsWith('.') ? path.resolve(path.dirname(from), spec) : null;
  if (!base) return null;
  for (const candidate of [base, `${base}.ts`, `${base}.tsx`, path.join(base, 'index.ts')]) if (fs.existsSync(candidate) && fs.statSync(candidate).isFile()) return candidate;
  return base;
}

describe('the web bundle boundary', () => {
  it('matches the rule it checks: the engine is let through, the HTTP layer is not', () => {
    expect(blocked(path.join(ROOT, 'server/engine/engine.ts'))).toBe(false);
    expect(blocked(path.join(ROOT, 'server/services/carriageSearch.ts'))).toBe(false);
    expect(blocked(path.join(ROOT, 'server/http/routes.ts'))).toBe(true);
    expect(blocked(path.join(ROOT, 'server/interchange/turns.ts'))).toBe(true);
  });

  it('no server file the web app reaches imports one it may not', () => {
    // from every client file, follow value imports (type imports are erased before bundling)
    const seen = new Set<string>();
    const queue = ['app', 'src', 'shared'].flatMap((d) => sourceFiles(path.join(ROOT, d)));
    const wrong: string[] = [];
    while (queue.length > 0) {
      const file = queue.pop()!;
      if (seen.has(file) || !fs.existsSync(file)) continue;
      seen.add(file);
      const text = fs.readFileSync(file, 'utf8');
      const specs = [...text.matchAll(/^(?:import|export)\s+(?!type\s)[^;]*?from\s+'([^']+)'/gms), ...text.matchAll(/(?<!typeof )\bimport\(\s*'([^']+)'\s*\)/g)];
      for (const m of specs) {
        const target = resolveImport(file, m[1]);
        if (!target || target.includes(`${path.sep}node_modules${path.sep}`)) continue;
        if (blocked(target)) wrong.push(`${path.relative(ROOT, file)} imports ${m[1]}`);
        else queue.push(target);
      }
    }
    expect([...seen].filter((f) => f.startsWith(path.join(ROOT, 'server'))).length).toBeGreaterThan(5);
    expect(wrong).toEqual([]);
  });
});
