/**
 * Unsubscribe tokens: a signed statement "this subscriber, this address",
 * put in every notice so a reader can stop the mail without signing in.
 * Signed with a key derived from JWT_SECRET for this purpose only, so such
 * a token can never pass as a session token (and the reverse).
 */
import crypto from 'node:crypto';
import jwt from 'jsonwebtoken';

export interface Subscriber {
  kind: 'user' | 'contact';
  id: number;
  email: string;
}

const AUDIENCE = 'headwater-unsubscribe';
const keyOf = (secret: string) => crypto.createHmac('sha256', secret).update('unsubscribe-links').digest();

export function unsubscribeToken(who: Subscriber, secret: string): string {
  return jwt.sign({ email: who.email }, keyOf(secret), { subject: `${who.kind}:${who.id}`, audience: AUDIENCE, algorithm: 'HS256', expiresIn: '400d' });
}

/** The subscriber a token names, or null for anything forged, expired or malformed. */
export function readUnsubscribeToken(token: string, secret: string): Subscriber | null {
  if (token.length > 2000) return null;
  try {
    const p = jwt.verify(token, keyOf(secret), { audience: AUDIENCE, algorithms: ['HS256'] });
    if (typeof p !== 'object' || typeof p.sub !== 'string' || typeof p.email !== 'string') return null;
    const m = /^(user|contact):(\d{1,10})$/.exec(p.sub);
    return m ? { kind: m[1] as Subscriber['kind'], id: Number(m[2]), email: p.email } : null;
  } catch {
    return null;
  }
}
