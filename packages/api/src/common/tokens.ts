import { createHash, randomBytes } from 'node:crypto';

/** 256 random bits, URL-safe so the token can sit in a link path. */
export function newOpaqueToken(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * SHA-256 in hex of a UTF-8 text: stored tokens (random, not passwords, so a fast unsalted hash is enough
 * to make a stolen table useless), fit inputs and event data.
 */
export function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}
