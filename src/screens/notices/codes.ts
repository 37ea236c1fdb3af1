/** Codes typed as a list: commas, spaces or new lines between them. */
export function parseCodes(text: string): string[] {
  return [...new Set(text.split(/[\s,;]+/).map((c) => c.trim()).filter(Boolean))];
}

/** "Everything", or what was chosen, in words. */
export function choiceText(c: { everything: boolean; services: string[]; sites: string[] }): string {
  if (c.everything) return 'Everything';
  const parts = [c.services.length ? `services ${c.services.join(', ')}` : '', c.sites.length ? `sites ${c.sites.join(', ')}` : ''].filter(Boolean);
  return parts.length ? parts.join('; ') : 'Nothing';
}
