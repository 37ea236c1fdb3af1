/**
 * Records for the browser tests and benchmarks: the drawings'
 * (window.__headwaterDiagram, window.__headwaterSchematic, in
 * src/screens/network) and the offline engine's (window.__headwaterOffline,
 * src/offline/localEngine.ts). They are written only when the page was
 * opened with window.__headwaterRecord set (an init script,
 * test/e2e/browser.ts), so a person's browser does no extra work and keeps
 * no records.
 */
declare global {
  interface Window {
    __headwaterRecord?: boolean;
  }
}

/** The script that turns the records on, for a browser context's addInitScript. */
export const RECORD_SCRIPT = 'window.__headwaterRecord = true;';

export function recording(): boolean {
  return typeof window !== 'undefined' && window.__headwaterRecord === true;
}
