/** axe-core in the page: the serious and critical accessibility violations of what is on screen. */
import fs from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

const require_ = createRequire(__filename);
const AXE_PATH = require_.resolve('axe-core/axe.min.js');

export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: number;
  targets: string[];
}

export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  // evaluated through the debugging protocol, so the app's content security policy does not block it
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(fs.readFileSync(AXE_PATH, 'utf8'));
  const violations = await page.evaluate(async () => {
    const w = window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] }> } };
    const r = await w.axe.run(document, { resultTypes: ['violations'] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.length, targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}
