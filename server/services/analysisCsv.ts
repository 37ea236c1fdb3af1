/**
 * The resilience lists as spreadsheet files: exposure (one line per element,
 * grouped rows kept together), diversity gaps, unfed carriages and failing
 * feed checks. Quoting is csv-stringify (as every CSV the server writes);
 * text cells that a spreadsheet would read as a formula get a leading
 * apostrophe (guardCell); figures with units come from shared/format.ts.
 * Numbers stay plain numbers so a spreadsheet can sort and sum them.
 */
import { stringify } from 'csv-stringify/sync';
import type { DiversityAnswer, Element, ExposureAnswer, ExposureGroupsAnswer, UnfedAnswer } from '@/shared/schemas/analysis';
import type { ChecksListAnswer } from '@/shared/schemas/checks';
import { formatFigure, formatMargin, unitText } from '@/shared/format';
import { guardCell } from '../operations/availability';
import { Turns, nextTurn } from '../interchange/turns';
import type { ServedNetwork } from './servedNetwork';

/** What a person calls an element: a site's or group's name, "site name, service name" for a carriage, "from → to" for a feed. */
export function elementName(m: ServedNetwork, e: Element): string {
  if (e.kind === 'site') return m.sites.get(e.code)?.name ?? '';
  if (e.kind === 'group') return m.groups.get(e.code)?.name ?? '';
  if (e.kind === 'carriage') {
    const c = m.carriages.get(e.code);
    if (!c) return '';
    return `${m.sites.get(c.site)?.name ?? c.site}, ${m.services.get(c.service)?.name ?? c.service}`;
  }
  const f = m.feeds.get(e.code);
  return f ? `${f.from} → ${f.to}` : '';
}

const elementList = (elements: readonly Element[]) => elements.map((e) => `${e.kind} ${e.code}`).join('; ');
type Row = (string | number)[];
const BATCH_ROWS = 512;

/**
 * The rows as CSV text, written a batch at a time with a turn of the event
 * loop whenever a turn's length has passed: the exposure file at 20,000 sites
 * took 1.3 s in one piece. Each batch ends with a line break, so the batches
 * joined are the text of one `stringify` of all the rows.
 */
export async function csvInTurns(rows: Iterable<Row>): Promise<string> {
  const parts: string[] = [];
  const turns = new Turns();
  let batch: Row[] = [];
  for (const row of rows) {
    batch.push(row);
    if (batch.length === BATCH_ROWS) {
      parts.push(stringify(batch));
      batch = [];
    }
    if (turns.due()) {
      await nextTurn();
      turns.restart();
    }
  }
  if (batch.length > 0 || parts.length === 0) parts.push(stringify(batch));
  return parts.join('');
}

const EXPOSURE_HEADER: Row = ['rank', 'kind', 'code', 'name', 'same_loss_as', 'households_lost', 'carriages_lost'];

/** One line per element; the elements of one ranked row share its rank and name the row's first element in `same_loss_as`. */
export function exposureGroupsCsv(m: ServedNetwork, answer: ExposureGroupsAnswer): Promise<string> {
  function* rows(): Generator<Row> {
    yield EXPOSURE_HEADER;
    for (let i = 0; i < answer.groups.length; i++) {
      const g = answer.groups[i];
      const lead = g.elements[0];
      for (const e of g.elements) {
        const same = e === lead ? '' : `${lead.kind} ${lead.code}`;
        yield [i + 1, e.kind, guardCell(e.code), guardCell(elementName(m, e)), guardCell(same), g.households, g.carriages];
      }
    }
  }
  return csvInTurns(rows());
}

/** The ungrouped ranking in the same layout: each element its own rank, `same_loss_as` empty. */
export function exposureCsv(m: ServedNetwork, answer: ExposureAnswer): Promise<string> {
  function* rows(): Generator<Row> {
    yield EXPOSURE_HEADER;
    for (let i = 0; i < answer.elements.length; i++) {
      const { element: e, households, carriages } = answer.elements[i];
      yield [i + 1, e.kind, guardCell(e.code), guardCell(elementName(m, e)), '', households, carriages];
    }
  }
  return csvInTurns(rows());
}

export function diversityCsv(m: ServedNetwork, answer: DiversityAnswer): Promise<string> {
  function* rows(): Generator<Row> {
    yield ['carriage', 'site', 'site_name', 'service', 'avoidable_weak_points', 'all_weak_points'];
    for (const c of answer.carriages) {
      yield [guardCell(c.carriage), guardCell(c.site), guardCell(m.sites.get(c.site)?.name ?? ''), guardCell(c.service), guardCell(elementList(c.avoidable)), guardCell(elementList(c.spof))];
    }
  }
  return csvInTurns(rows());
}

export function unfedCsv(m: ServedNetwork, answer: UnfedAnswer): Promise<string> {
  const rows: Row[] = [['carriage', 'site', 'site_name', 'service']];
  for (const c of answer.carriages) rows.push([guardCell(c.carriage), guardCell(c.site), guardCell(m.sites.get(c.site)?.name ?? ''), guardCell(c.service)]);
  return csvInTurns(rows);
}

/** Failing checks, worst first as listed; `value_shown` and `margin_shown` as the screens write them. */
export function checksCsv(answer: ChecksListAnswer): Promise<string> {
  const rows: Row[] = [['feed', 'from', 'to', 'medium', 'check', 'severity', 'value', 'limit', 'unit', 'margin', 'value_shown', 'margin_shown', 'note']];
  for (const f of answer.failures) {
    const { check } = f;
    rows.push([
      guardCell(f.feed),
      guardCell(f.from),
      guardCell(f.to),
      f.medium,
      check.name,
      f.severity,
      check.value ?? '',
      check.limit ?? '',
      unitText(check.unit),
      f.margin ?? '',
      check.value === null ? '' : formatFigure(check.value, check.unit),
      f.margin === undefined ? '' : guardCell(formatMargin(f.margin, check.unit)),
      guardCell(check.note),
    ]);
  }
  return csvInTurns(rows);
}

/** A file name that sorts by date: headwater-diversity-gaps-v12-2026-12-04.csv */
export const csvFileName = (what: string, networkVersion: number | undefined, when = new Date()) =>
  `headwater-${what}${networkVersion === undefined ? '' : `-v${networkVersion}`}-${when.toISOString().slice(0, 10)}.csv`;
