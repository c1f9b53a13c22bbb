import crypto from 'node:crypto';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function mac(secret: string, customerId: string): Buffer {
  // The purpose is part of the signed text, so this token can never double as any other signed value.
  return crypto.createHmac('sha256', secret).update(`reminders-unsubscribe:${customerId.toLowerCase()}`).digest();
}

/** `<customer id>.<HMAC-SHA256>`: lets the customer stop reminders without signing in, and names nobody else. */
export function unsubscribeToken(secret: string, customerId: string): string {
  return `${customerId.toLowerCase()}.${mac(secret, customerId).toString('base64url')}`;
}

/** The customer id the token was made for, or null when it was not made with our secret. */
export function verifyUnsubscribeToken(secret: string, token: string): string | null {
  const [customerId, signature, ...rest] = token.split('.');
  if (rest.length || !customerId || !signature || !UUID.test(customerId)) return null;
  const given = Buffer.from(signature, 'base64url');
  const expected = mac(secret, customerId);
  if (given.length !== expected.length || !crypto.timingSafeEqual(given, expected)) return null;
  return customerId.toLowerCase();
}
