import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { ROLES, type Role } from '@/shared/api';

/**
 * What a token says. The role in it is only a hint for the client: the server
 * takes the role from the user's row on every request (server/auth/authenticate.ts).
 * `tv` is the user's token version when it was issued; a bump revokes it.
 */
export interface TokenClaims {
  sub: string;
  email: string;
  role: Role;
  tv: number;
}

const ISSUER = 'headwater';

export function signToken(claims: Omit<TokenClaims, 'tv'> & { tv?: number }, secret: string, ttl: string): string {
  return jwt.sign({ email: claims.email, role: claims.role, tv: claims.tv ?? 0 }, secret, {
    subject: claims.sub,
    issuer: ISSUER,
    algorithm: 'HS256',
    expiresIn: ttl as jwt.SignOptions['expiresIn'],
  });
}

/**
 * The secret as a key object, made once. Handed a string, jsonwebtoken first
 * tries to parse it as a PEM public key (and throws) on every call: under load
 * that failed parse was the largest single cost of a request.
 */
const keys = new Map<string, KeyObject>();
function keyOf(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret));
    keys.set(secret, key);
  }
  return key;
}

/**
 * Tokens whose signature was checked, with their claims, until they expire.
 * A token is the same bytes on every request of a session, so its signature
 * needs checking once; whether the session still counts is the user row's
 * business (authenticate.ts), not the token's: a sign-out, password change,
 * role change or disable refuses the next request whatever this holds.
 * Bounded: at most MAX_VERIFIED tokens of at most MAX_CACHED_TOKEN
 * characters each (ours are a few hundred), the oldest half dropped when
 * full; a longer one is checked on every request instead.
 */
const MAX_VERIFIED = 10_000;
const MAX_CACHED_TOKEN = 2048;
const verified = new Map<string, { secret: string; claims: TokenClaims; expiresAtMs: number }>();

/** Verify a bearer token; null for anything forged, expired or malformed. */
export function verifyToken(token: string, secret: string): TokenClaims | null {
  const hit = verified.get(token);
  // a hit counts only for the secret it was checked with (tests run apps with different secrets)
  if (hit && hit.secret === secret) {
    if (Date.now() < hit.expiresAtMs) return hit.claims;
    verified.delete(token);
    return null;
  }
  const checked = verifyOnce(token, secret);
  if (checked && token.length <= MAX_CACHED_TOKEN) {
    if (verified.size >= MAX_VERIFIED) {
      let drop = MAX_VERIFIED / 2;
      for (const key of verified.keys()) {
        verified.delete(key);
        if (--drop === 0) break;
      }
    }
    verified.set(token, { secret, ...checked });
  }
  return checked?.claims ?? null;
}

function verifyOnce(token: string, secret: string): { claims: TokenClaims; expiresAtMs: number } | null {
  try {
    const p = jwt.verify(token, keyOf(secret), { issuer: ISSUER, algorithms: ['HS256'] });
    if (typeof p !== 'object' || !p.sub || typeof p.email !== 'string' || !ROLES.includes(p.role)) return null;
    // a token from before token versions counts as version 0
    const tv = p.tv === undefined ? 0 : p.tv;
    if (!Number.isInteger(tv) || tv < 0) return null;
    // jsonwebtoken refuses a token at its exp second; so does the cache
    const expiresAtMs = typeof p.exp === 'number' ? p.exp * 1000 : Date.now() + 60_000;
    return { claims: { sub: p.sub, email: p.email, role: p.role, tv }, expiresAtMs };
  } catch {
    return null;
  }
}
