/**
 * Rules for a record typed in by hand (POST and PATCH of one record), on top
 * of the cross-entity rules an import shares (rules.ts):
 *
 * - A carriage's channel and frequency, and an off-air feed's receive
 *   channel, lie in the bands of the service's kind (shared/rf/channelRules.ts,
 *   the tables the feed checks read): 400 naming the field and the range.
 * - A second main feed into one carriage is allowed only when the request
 *   says it is meant (`?confirm=second-main-feed`): otherwise 409 with code
 *   `second-main-feed`, naming the feed already there. Two main feeds are
 *   legal in the model (either keeps the carriage on air), but a typed one
 *   is far more often a reserve entered with the wrong role.
 *
 * The stored records are read through the Sequelize models (records.ts).
 */
import { Op } from 'sequelize';
import { checkChannel, frequencyProblem } from '@/shared/rf/channelRules';
import type { EntityKind, ServiceKind } from '@/shared/schemas/network';
import { CarriageRow, FeedRow, ServiceRow } from '../../db/models/inventory';
import { ApiError, badRequest } from '../../http/errors';
import { NOUN, type Fields } from './shape';
import type { Tx } from './tables';

export const CONFIRM_SECOND_MAIN = 'second-main-feed';

/** The kind of the service with this code. */
async function kindOfService(tx: Tx, code: string): Promise<ServiceKind | undefined> {
  const row = (await ServiceRow.findOne({ where: { code }, attributes: ['kind'], raw: true, transaction: tx.transaction })) as unknown as { kind: ServiceKind } | null;
  return row?.kind;
}

/** The kind of the service the carriage with this code carries. */
async function kindOfCarriedService(tx: Tx, code: string): Promise<ServiceKind | undefined> {
  const row = (await CarriageRow.findOne({
    where: { code },
    attributes: [],
    include: [{ model: ServiceRow, as: 'service', attributes: ['kind'], required: true }],
    raw: true,
    transaction: tx.transaction,
  })) as unknown as { 'service.kind': ServiceKind } | null;
  return row?.['service.kind'];
}

/**
 * 400 naming each channel or frequency outside the bands of the service's
 * kind. On a change, a value stored before (say by an import) is refused only
 * when it or the service changes, so fixing another field is never blocked.
 */
export async function checkBands(tx: Tx, kind: EntityKind, entity: Fields, previous?: Fields): Promise<void> {
  const found: { field: string; message: string }[] = [];
  const anchor = kind === 'carriages' ? 'service' : 'to';
  const kept = (field: string) => !!previous && previous[field] === entity[field] && previous[anchor] === entity[anchor] && previous.medium === entity.medium;
  if (kind === 'carriages') {
    const serviceKind = await kindOfService(tx, entity.service as string);
    if (!serviceKind) return; // an unknown service is the cross-entity rules' 422
    const channel = checkChannel(serviceKind, entity.channel as string | undefined);
    if (!channel.ok) found.push({ field: 'channel', message: channel.message });
    const frequency = frequencyProblem(serviceKind, entity.frequencyMHz as number | undefined);
    if (frequency) found.push({ field: 'frequencyMHz', message: frequency });
  }
  if (kind === 'feeds' && entity.medium === 'off-air') {
    const serviceKind = await kindOfCarriedService(tx, entity.to as string);
    if (!serviceKind) return;
    const channel = checkChannel(serviceKind, entity.rxChannel as string | undefined);
    if (!channel.ok) found.push({ field: 'rxChannel', message: `receive ${channel.message}` });
  }
  const problems = found.filter((p) => !kept(p.field));
  if (problems.length === 0) return;
  const subject = `${NOUN[kind]} ${entity.code as string}`;
  throw badRequest(`${subject}: ${problems.map((p) => p.message).join('; ')}`, problems);
}

/** The other main feeds into the feed's target carriage (none when the feed is a reserve). */
export async function otherMainFeeds(tx: Tx, feed: Fields): Promise<string[]> {
  if (feed.role !== 'main') return [];
  const rows = (await FeedRow.findAll({
    where: { role: 'main', code: { [Op.ne]: feed.code as string } },
    attributes: ['code'],
    include: [{ model: CarriageRow, as: 'to', attributes: [], required: true, where: { code: feed.to as string } }],
    order: [['code', 'ASC']],
    raw: true,
    transaction: tx.transaction,
  })) as unknown as { code: string }[];
  return rows.map((r) => r.code);
}

/**
 * 409 unless confirmed, when the feed would be a second main feed into its
 * carriage. A change that keeps an existing pair as it was (same target,
 * still main) is not asked again.
 */
export async function checkSecondMain(tx: Tx, feed: Fields, confirmed: boolean, previous?: Fields): Promise<void> {
  if (confirmed || feed.role !== 'main') return;
  if (previous && previous.role === 'main' && previous.to === feed.to) return;
  const others = await otherMainFeeds(tx, feed);
  if (others.length === 0) return;
  const list = others.join(', ');
  throw new ApiError(
    409,
    'second-main-feed',
    `carriage ${feed.to as string} already has a main feed (${list}); a second main feed is unusual, and is often a reserve feed entered as main. ` +
      `Make it a reserve feed, or send it again with confirm=${CONFIRM_SECOND_MAIN} if both are meant to be main feeds`,
    { field: 'role', carriage: feed.to, mainFeeds: others, confirm: CONFIRM_SECOND_MAIN },
  );
}
