/**
 * Times on the operations screens: shown in the viewer's local time with the
 * zone named; typed as "YYYY-MM-DD HH:MM" in local time and sent as ISO 8601
 * with the local offset.
 */
export function zoneName(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'local time';
  } catch {
    return 'local time';
  }
}

/** "Mon 1 Mar 2027, 08:00 (Europe/…)" style, in local time with the zone. */
export function localText(iso: string | null, withZone = true): string {
  if (!iso) return 'still open';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const text = d.toLocaleString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
  return withZone ? `${text} (${zoneName()})` : text;
}

const two = (n: number) => String(n).padStart(2, '0');

/** The local "YYYY-MM-DD HH:MM" of an instant, for a form field. */
export function toLocalInput(d: Date): string {
  return `${d.getFullYear()}-${two(d.getMonth() + 1)}-${two(d.getDate())} ${two(d.getHours())}:${two(d.getMinutes())}`;
}

/** "YYYY-MM-DD HH:MM" in local time -> ISO 8601 with the local offset, or null when it is not such a time. */
export function fromLocalInput(text: string): string | null {
  const m = /^\s*(\d{4})-(\d{2})-(\d{2})[ T](\d{2}):(\d{2})\s*$/.exec(text);
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  const date = new Date(y, mo - 1, d, h, mi);
  if (date.getFullYear() !== y || date.getMonth() !== mo - 1 || date.getDate() !== d || date.getHours() !== h) return null;
  const off = -date.getTimezoneOffset();
  const sign = off >= 0 ? '+' : '-';
  return `${y}-${two(mo)}-${two(d)}T${two(h)}:${two(mi)}:00${sign}${two(Math.floor(Math.abs(off) / 60))}:${two(Math.abs(off) % 60)}`;
}

/** "1 h 30 min", "2 days 3 h" */
export function durationText(minutes: number): string {
  const m = Math.round(minutes);
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  if (h < 48) return `${h} h${m % 60 ? ` ${m % 60} min` : ''}`;
  return `${Math.floor(h / 24)} days${h % 24 ? ` ${h % 24} h` : ''}`;
}
