import { encodeBase32LowerCaseNoPadding, encodeBase64urlNoPadding } from '@oslojs/encoding';
import { sha256 } from '@oslojs/crypto/sha2';

function randomBytes(n: number): Uint8Array {
  const bytes = new Uint8Array(n);
  crypto.getRandomValues(bytes);
  return bytes;
}

/** Opaque ids for rows: 80 random bits, lower-case base32 (16 characters). */
export function newId(): string {
  return encodeBase32LowerCaseNoPadding(randomBytes(10));
}

/** A secret for links in e-mails: 160 random bits, URL-safe (27 characters). */
export function newToken(): string {
  return encodeBase64urlNoPadding(randomBytes(20));
}

/** Tokens are stored only as this hash, so a leaked database does not leak usable links. */
export function hashToken(token: string): string {
  return Array.from(sha256(new TextEncoder().encode(token)), (b) => b.toString(16).padStart(2, '0')).join('');
}
