import { createHash, randomBytes } from 'node:crypto';

/** 256 random bits, URL-safe so the token can sit in a link path. */
export function newOpaqueToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Tokens are random, not passwords, so a fast unsalted hash is enough to make a stolen table useless. */
export function sha256Hex(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
