import crypto from 'node:crypto';

/** JSON with every object's keys sorted, so two bodies that differ only in key order have one fingerprint. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.keys(value)
      .sort()
      .filter((k) => (value as Record<string, unknown>)[k] !== undefined)
      .map((k) => `${JSON.stringify(k)}:${canonicalJson((value as Record<string, unknown>)[k])}`);
    return `{${entries.join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

export type UploadedFile = { fieldname: string; buffer: Buffer };

/**
 * SHA-256 (hex) of the method, the path and the canonical body; a multipart body is its fields plus each file's
 * SHA-256, in the order sent, so the fingerprint never holds the bytes themselves.
 */
export function requestFingerprint(request: { method: string; path: string; body: unknown; files?: readonly UploadedFile[] }): string {
  const files = request.files?.map((f) => ({ field: f.fieldname, sha256: crypto.createHash('sha256').update(f.buffer).digest('hex') }));
  const body = files ? { fields: request.body ?? {}, files } : (request.body ?? null);
  return crypto
    .createHash('sha256')
    .update(`${request.method.toUpperCase()}\n${request.path}\n${canonicalJson(body)}`)
    .digest('hex');
}
