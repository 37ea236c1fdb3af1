/** "Offline — network version 12, fetched at 08:05" (with the date when it was not today), in the viewer's local time. */
function hhmm(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
}

function dayIfNotToday(iso: string): string {
  const d = new Date(iso);
  const today = new Date();
  if (Number.isNaN(d.getTime()) || d.toDateString() === today.toDateString()) return '';
  return ` on ${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' })}`;
}

export function offlineLine(networkVersion: number, fetchedAt: string): string {
  return `Offline — network version ${networkVersion}, fetched at ${hhmm(fetchedAt)}${dayIfNotToday(fetchedAt)}`;
}
