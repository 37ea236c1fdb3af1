/**
 * Who is told about an event: signed-in people (active accounts) and
 * outside contacts whose chosen services or sites are in its reach, and
 * everyone who chose "everything". One address once, even when a person and
 * a contact share it.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { ResolvedReach } from './reach';
import type { Subscriber } from './unsubscribe';

export async function recipientsFor(sequelize: Sequelize, transaction: Transaction, reach: ResolvedReach): Promise<Subscriber[]> {
  const [rows] = await sequelize.query(
    `SELECT 'user' AS kind, u.id, u.email FROM subscriptions s JOIN users u ON u.id = s.user_id
      WHERE NOT u.disabled AND (s.everything OR s.services && $1::text[] OR s.sites && $2::text[])
     UNION ALL
     SELECT 'contact', c.id, c.email FROM contacts c
      WHERE c.everything OR c.services && $1::text[] OR c.sites && $2::text[]
     ORDER BY 1 DESC, 2`,
    { bind: [reach.services, reach.sites], transaction },
  );
  const seen = new Set<string>();
  const out: Subscriber[] = [];
  for (const r of rows as Array<{ kind: Subscriber['kind']; id: number; email: string }>) {
    const key = r.email.toLowerCase();
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ kind: r.kind, id: Number(r.id), email: r.email });
  }
  return out;
}
