/** Plain-English sentences for proposals and critical pairs (pure, unit-tested). */
import type { Element, Proposal } from '@/shared/schemas/analysis';
import { formatCount } from '@/shared/format';
import { formatBearing, formatFigure } from '@/shared/format';
import { elementWords, type ElementNamer } from './elementNames';

/** "site M-CORR (Corrant Beacon)" when a name is known, else "site M-CORR". */
export const named = (name: ElementNamer, e: Element) => {
  const n = name(e);
  return n ? `${elementWords(e)} (${n})` : elementWords(e);
};

export function proposalTitle(p: Proposal): string {
  return p.medium === 'off-air' ? `${p.carriage}: new off-air reserve from ${p.from}` : `${p.carriage}: new satellite or line reserve from origin ${p.from}`;
}

export function proposalDetail(p: Proposal): string {
  const removes = `Removes ${p.removes.map(elementWords).join(', ')}; protects ${formatCount(p.householdsProtected)} households.`;
  if (p.medium !== 'off-air') return `${removes} No receiver on the mast; ${formatFigure(p.distanceKm, 'km')} from the origin.`;
  const field = p.fieldStrengthDbuvm !== null && p.minimumDbuvm !== null ? ` ${formatFigure(p.fieldStrengthDbuvm, 'dBuV/m')} in free space against a planning minimum of ${formatFigure(p.minimumDbuvm, 'dBuV/m')}.` : '';
  const warn = p.warnings.length > 0 ? ` ${p.warnings.join(' ')}` : '';
  return `${removes} ${formatFigure(p.distanceKm, 'km')} away, receive antenna pointing ${formatBearing(p.bearingDeg)}.${field}${warn}`;
}

/** "site A (Name) and group G (Name) together take 40,000 more households off air than either alone." */
export function pairSentence(name: ElementNamer, elements: readonly [Element, Element], households: number, carriages: number): string {
  const both = `${named(name, elements[0])} and ${named(name, elements[1])}`;
  if (households === 0) return `${both} together take ${formatCount(carriages)} more carriage${carriages === 1 ? '' : 's'} off air than either alone, at sites that lose another service anyway.`;
  return `${both} together take ${formatCount(households)} more households off air than either alone.`;
}
