/**
 * The drawings' records (window.__headwaterDiagram, window.__headwaterSchematic)
 * for the browser tests and benchmark. They are written only when the page
 * was opened with window.__headwaterRecord set (an init script,
 * test/e2e/browser.ts), so a person's browser does no extra work per frame
 * and keeps no records.
 */
declare global {
  interface Window {
    __headwaterRecord?: boolean;
  }
}

/** The script that turns the records on, for a browser context's addInitScript. */
export const RECORD_DRAWINGS_SCRIPT = 'window.__headwaterRecord = true;';

export function recording(): boolean {
  return typeof window !== 'undefined' && window.__headwaterRecord === true;
}
