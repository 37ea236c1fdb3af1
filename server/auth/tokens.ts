import jwt from 'jsonwebtoken';
import { ROLES, type Role } from '@/shared/api';

export interface TokenClaims {
  sub: string;
  email: string;
  role: Role;
}

const ISSUER = 'headwater';

export function signToken(claims: TokenClaims, secret: string, ttl: string): string {
  return jwt.sign({ email: claims.email, role: claims.role }, secret, {
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
    return { sub: p.sub, email: p.email, role: p.role };
  } catch {
    return null;
  }
}
