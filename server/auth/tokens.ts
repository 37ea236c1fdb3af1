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

/** Verify a bearer token; null for anything forged, expired or malformed. */
export function verifyToken(token: string, secret: string): TokenClaims | null {
  try {
    const p = jwt.verify(token, secret, { issuer: ISSUER, algorithms: ['HS256'] });
    if (typeof p !== 'object' || !p.sub || typeof p.email !== 'string' || !ROLES.includes(p.role)) return null;
    // a token from before token versions counts as version 0
    const tv = p.tv === undefined ? 0 : p.tv;
    if (!Number.isInteger(tv) || tv < 0) return null;
    return { sub: p.sub, email: p.email, role: p.role, tv };
  } catch {
    return null;
  }
}
