/**
 * The import's cross-entity rules (docs/format.md), applied
 * to one entity about to be created or changed, against the stored network:
 * references must exist, a feed joins two different carriages of one
 * service and no via-site is one of its ends, a site radiates each service
 * once; and a carriage that moves must not break the feeds it has. The
 * messages read like the import's ("feed F12: source carriage C99 does not
 * exist").
 */
import type { EntityKind } from '@/shared/schemas/network';
import { NOUN, type Fields } from './shape';
import { TABLE, type Tx } from './tables';

export interface RuleIssue {
  field: string;
  rule: string;
  message: string;
}

export interface RuleFindings {
  /** 422: the entity refers to what does not exist, or breaks a rule between entities */
  unprocessable: RuleIssue[];
  /** 409: the entity clashes with another stored one */
  conflicts: RuleIssue[];
}

interface CarriageEnds {
  code: string;
  site: string;
  service: string;
}

async function existing(tx: Tx, kind: EntityKind, codes: string[]): Promise<Set<string>> {
  if (codes.length === 0) return new Set();
  const [rows] = await tx.sequelize.query(`SELECT code FROM ${TABLE[kind]} WHERE code = ANY($1::text[])`, { bind: [codes], transaction: tx.transaction });
  return new Set((rows as { code: string }[]).map((r) => r.code));
}

async function carriageEnds(tx: Tx, codes: string[]): Promise<Map<string, CarriageEnds>> {
  const [rows] = await tx.sequelize.query(
    `SELECT c.code, si.code AS site, sv.code AS service FROM carriages c
     JOIN sites si ON si.id = c.site_id JOIN services sv ON sv.id = c.service_id WHERE c.code = ANY($1::text[])`,
    { bind: [codes], transaction: tx.transaction },
  );
  return new Map((rows as CarriageEnds[]).map((r) => [r.code, r]));
}

export async function checkRules(tx: Tx, kind: EntityKind, entity: Fields, previous?: Fields): Promise<RuleFindings> {
  const found: RuleFindings = { unprocessable: [], conflicts: [] };
  const code = entity.code as string;
  const subject = `${NOUN[kind]} ${code}`;
  const refuse = (field: string, rule: string, detail: string) => found.unprocessable.push({ field, rule, message: `${subject}: ${detail}` });

  const checkList = async (field: 'groups' | 'via', target: EntityKind, label: string) => {
    const list = (entity[field] as string[] | undefined) ?? [];
    const known = await existing(tx, target, list);
    list.forEach((ref, i) => {
      if (!known.has(ref)) refuse(`${field}[${i}]`, 'unknown-reference', `${label} ${ref} does not exist`);
    });
  };

  if (kind === 'sites') await checkList('groups', 'groups', 'group');

  if (kind === 'carriages') {
    const site = entity.site as string;
    const service = entity.service as string;
    if (!(await existing(tx, 'sites', [site])).has(site)) refuse('site', 'unknown-reference', `site ${site} does not exist`);
    if (!(await existing(tx, 'services', [service])).has(service)) refuse('service', 'unknown-reference', `service ${service} does not exist`);
    const [rows] = await tx.sequelize.query(
      `SELECT c.code FROM carriages c JOIN sites si ON si.id = c.site_id JOIN services sv ON sv.id = c.service_id
       WHERE si.code = $1 AND sv.code = $2 AND c.code <> $3`,
      { bind: [site, service, code], transaction: tx.transaction },
    );
    const other = (rows as { code: string }[])[0];
    if (other) {
      found.conflicts.push({ field: 'service', rule: 'duplicate-carriage',
        message: `${subject}: site ${site} already has carriage ${other.code} for service ${service}; a site radiates each service once` });
    }
    if (previous && (previous.site !== site || previous.service !== service)) await checkFeedsOfMovedCarriage(tx, code, site, service, refuse);
  }

  if (kind === 'feeds') {
    const from = entity.from as string;
    const to = entity.to as string;
    const ends = await carriageEnds(tx, [from, to]);
    const source = ends.get(from);
    const target = ends.get(to);
    if (!source) refuse('from', 'unknown-reference', `source carriage ${from} does not exist`);
    if (!target) refuse('to', 'unknown-reference', `receiving carriage ${to} does not exist`);
    if (from === to) refuse('to', 'self-feed', `source and target are the same carriage ${from}; a feed joins two different carriages`);
    if (source && target && from !== to && source.service !== target.service) {
      refuse('to', 'service-mismatch',
        `source carriage ${from} carries service ${source.service} but receiving carriage ${to} carries ${target.service}; both ends of a feed carry the same service`);
    }
    await checkList('via', 'sites', 'via-site');
    ((entity.via as string[] | undefined) ?? []).forEach((site, i) => {
      const end = site === source?.site ? `the source site (of carriage ${from})` : site === target?.site ? `the target site (of carriage ${to})` : undefined;
      if (end) refuse(`via[${i}]`, 'via-endpoint', `via-site ${site} is ${end}; a via-site is a hop between the two ends`);
    });
    await checkList('groups', 'groups', 'group');
  }
  return found;
}

/** A carriage moving to another site or service takes its feeds along: each must still hold. */
async function checkFeedsOfMovedCarriage(
  tx: Tx,
  code: string,
  site: string,
  service: string,
  refuse: (field: string, rule: string, detail: string) => void,
): Promise<void> {
  const [rows] = await tx.sequelize.query(
    `SELECT f.code, o.code AS other, sv.code AS "otherService",
            ARRAY(SELECT s.code FROM feed_via_sites v JOIN sites s ON s.id = v.site_id WHERE v.feed_id = f.id) AS via
     FROM feeds f JOIN carriages a ON a.id = f.from_carriage_id JOIN carriages b ON b.id = f.to_carriage_id
     JOIN carriages o ON o.id = CASE WHEN a.code = $1 THEN b.id ELSE a.id END
     JOIN services sv ON sv.id = o.service_id
     WHERE a.code = $1 OR b.code = $1 ORDER BY f.code`,
    { bind: [code], transaction: tx.transaction },
  );
  for (const r of rows as Array<{ code: string; other: string; otherService: string; via: string[] }>) {
    if (r.otherService !== service) {
      refuse('service', 'service-mismatch', `feed ${r.code} joins it to carriage ${r.other}, which carries ${r.otherService}, not ${service}; change or delete the feed first`);
    }
    if (r.via.includes(site)) {
      refuse('site', 'via-endpoint', `feed ${r.code} into or out of it passes via site ${site}, which would become one of its ends; change the feed first`);
    }
  }
}
