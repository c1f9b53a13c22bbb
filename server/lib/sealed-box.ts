import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';

const VERSION = 'v1';

/** A key of its own for each purpose, derived from the app secret (HKDF, RFC 5869), so no two uses share one. */
const keyFor = (secret: string, purpose: string) => Buffer.from(hkdfSync('sha256', secret, Buffer.alloc(0), `lifeplate:${purpose}`, 32));

/** AES-256-GCM: `v1.<iv>.<tag>.<ciphertext>`, base64url. Tampering or the wrong secret makes `open` throw. */
export function seal(secret: string, purpose: string, plaintext: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', keyFor(secret, purpose), iv);
  const body = Buffer.concat([cipher.update(plaintext, 'utf8'), cipher.final()]);
  return [VERSION, iv, cipher.getAuthTag(), body].map((p) => (typeof p === 'string' ? p : p.toString('base64url'))).join('.');
}

export function open(secret: string, purpose: string, sealed: string): string {
  const [version, iv, tag, body] = sealed.split('.');
  if (version !== VERSION || !iv || !tag || body === undefined) throw new Error('not a sealed value');
  const decipher = createDecipheriv('aes-256-gcm', keyFor(secret, purpose), Buffer.from(iv, 'base64url'));
  decipher.setAuthTag(Buffer.from(tag, 'base64url'));
  return Buffer.concat([decipher.update(Buffer.from(body, 'base64url')), decipher.final()]).toString('utf8');
}
