import { createHash, randomBytes } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Role } from '@batchproof/shared';

export const JWT_ALGORITHM = 'HS256' as const;
export const JWT_ISSUER = 'batchproof';
export const JWT_AUDIENCE = 'batchproof-api';

/** Claims inside an access token; the user is re-read on every request, so these only identify. */
export interface AccessClaims {
  sub: string;
  wid: string;
  role: Role;
  /** The user's token version when it was signed; a later sign-out everywhere raises it. */
  ver?: number;
}

/** Signs a short-lived access token with the fixed algorithm, issuer and audience. */
export function signAccessToken(claims: AccessClaims, secret: string, seconds: number): string {
  return jwt.sign({ wid: claims.wid, role: claims.role, ver: claims.ver ?? 0 }, secret, {
    algorithm: JWT_ALGORITHM,
    issuer: JWT_ISSUER,
    audience: JWT_AUDIENCE,
    subject: claims.sub,
    expiresIn: seconds,
  });
}

/** A random opaque token for links and refresh cookies (256 bits, base64url). */
export function newOpaqueToken(): string {
  return randomBytes(32).toString('base64url');
}

/** What the database stores in place of an opaque token. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
