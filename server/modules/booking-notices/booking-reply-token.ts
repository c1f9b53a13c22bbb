import crypto from 'node:crypto';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function mac(secret: string, bookingId: string): Buffer {
  // The purpose is part of the signed text, so this token can never double as any other signed value.
  return crypto.createHmac('sha256', secret).update(`booking-reply:${bookingId.toLowerCase()}`).digest();
}

/**
 * `<booking id>.<HMAC-SHA256>`: opens the "this time does not suit me" page for one booking without signing in.
 * 256 bits of signature, so it cannot be guessed; it lasts as long as the booking is ahead and not cancelled.
 */
export function bookingReplyToken(secret: string, bookingId: string): string {
  return `${bookingId.toLowerCase()}.${mac(secret, bookingId).toString('base64url')}`;
}

/** The booking id the token was made for, or null when it was not made with our secret. */
export function verifyBookingReplyToken(secret: string, token: string): string | null {
  const [bookingId, signature, ...rest] = token.split('.');
  if (rest.length || !bookingId || !signature || !UUID.test(bookingId)) return null;
  const given = Buffer.from(signature, 'base64url');
  const expected = mac(secret, bookingId);
  if (given.length !== expected.length || !crypto.timingSafeEqual(given, expected)) return null;
  return bookingId.toLowerCase();
}
