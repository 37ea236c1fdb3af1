/**
 * The mail for one event: a subject that says what happened in a few words,
 * and the same content as plain text and as simple HTML (no images, no
 * tracking, no remote content): what, when (UTC, named), what is off air and
 * on reserve by service, households, a link into the product and a link to
 * stop these mails.
 */
import type { OperationsEvent, OperationsEventKind } from '../operations/events';
import type { ResolvedReach } from './reach';
import { formatCount } from '@/shared/format';

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const HEADLINE: Record<OperationsEventKind, string> = {
  'incident-opened': 'Fault opened',
  'incident-updated': 'Fault changed',
  'incident-closed': 'Fault cleared',
  'work-approved': 'Planned work approved',
  'work-started': 'Planned work under way',
  'work-cancelled': 'Planned work cancelled',
  'work-clash': 'Planned work clash',
};

const n = formatCount;
const plural = (v: number, word: string) => `${n(v)} ${word}${v === 1 ? '' : 's'}`;

/** 2026-12-04 15:48 UTC */
export function utc(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function when(event: OperationsEvent): string {
  const isWork = event.kind.startsWith('work-');
  if (isWork) return event.end ? `from ${utc(event.start)} to ${utc(event.end)}` : `from ${utc(event.start)}, no end set`;
  return event.end ? `started ${utc(event.start)}, ended ${utc(event.end)}` : `started ${utc(event.start)}, still open`;
}

/** Where the event is seen in the product (the operations screens). */
export function eventLink(base: string, event: OperationsEvent): string {
  const area = event.kind.startsWith('work-') ? 'works' : 'incidents';
  return `${base.replace(/\/$/, '')}/${area}/${encodeURIComponent(event.code)}`;
}

export function subjectOf(event: OperationsEvent): string {
  const lost = event.reach.lost.length;
  const tail = event.kind === 'work-clash' && event.other ? ` with ${event.other}` : lost > 0 && event.kind !== 'incident-closed' && event.kind !== 'work-cancelled' ? `, ${plural(lost, 'carriage')} off air` : '';
  return `${HEADLINE[event.kind]}: ${event.code} ${event.title}${tail}`.slice(0, 200);
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function renderMail(event: OperationsEvent, reach: ResolvedReach, links: { event: string; unsubscribe: string }): RenderedMail {
  const subject = subjectOf(event);
  const { lost, fallback } = event.reach.households;
  const facts: Array<[string, string]> = [
    ['What', `${HEADLINE[event.kind]}: ${event.code} ${event.title}`],
    ['When', when(event)],
    ['Change', event.summary],
    ...(event.other ? ([['Clashes with', event.other]] as Array<[string, string]>) : []),
    ['Off air', `${plural(event.reach.lost.length, 'carriage')}, ${plural(lost, 'household')}`],
    ['On reserve', `${plural(event.reach.fallback.length, 'carriage')}, ${plural(fallback, 'household')}`],
  ];
  const serviceLines = reach.byService.map((s) => {
    const list = (items: typeof s.lost) => items.map((c) => `${c.code}${c.siteName ? ` at ${c.siteName}` : ''}`).join(', ');
    return {
      head: `${s.name} (${s.service})`,
      lost: s.lost.length ? `off air: ${list(s.lost)}` : '',
      fallback: s.fallback.length ? `on reserve: ${list(s.fallback)}` : '',
    };
  });
  const footer = 'Household figures are screening estimates from the network records.';

  const text = [
    ...facts.map(([k, v]) => `${k}: ${v}`),
    '',
    ...(serviceLines.length ? ['By service:', ...serviceLines.flatMap((l) => [`- ${l.head}`, ...[l.lost, l.fallback].filter(Boolean).map((x) => `    ${x}`)]), ''] : []),
    `Open in Headwater: ${links.event}`,
    '',
    footer,
    `Stop these mails: ${links.unsubscribe}`,
  ].join('\n');

  const html = `<!doctype html><html><body style="font-family:sans-serif;font-size:15px;line-height:1.4">
<h1 style="font-size:18px">${escape(subject)}</h1>
<table>${facts.map(([k, v]) => `<tr><th align="left" valign="top">${escape(k)}</th><td>${escape(v)}</td></tr>`).join('')}</table>
${serviceLines.length ? `<h2 style="font-size:16px">By service</h2><ul>${serviceLines.map((l) => `<li><strong>${escape(l.head)}</strong>${[l.lost, l.fallback].filter(Boolean).map((x) => `<br>${escape(x)}`).join('')}</li>`).join('')}</ul>` : ''}
<p><a href="${escape(links.event)}">Open in Headwater</a></p>
<p style="font-size:13px">${escape(footer)}<br><a href="${escape(links.unsubscribe)}">Stop these mails</a></p>
</body></html>`;
  return { subject, text, html };
}
