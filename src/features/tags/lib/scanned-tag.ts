import { checkTagCode } from '@shared/tags/tag-code';

export type ScannedText =
  | { kind: 'tag'; code: string }
  /** A tag-shaped link, but to another web address than this Lifeplate. */
  | { kind: 'other-site'; host: string }
  | { kind: 'not-a-tag' };

const TAG_PATH = /^\/t\/([^/]+)\/?$/;

/** Our tags' QR codes hold `<this site>/t/<code>`; anything else is not a tag we can open. */
export function readScannedText(text: string, origin: string): ScannedText {
  let url: URL;
  try {
    url = new URL(text.trim());
  } catch {
    return { kind: 'not-a-tag' };
  }
  const match = TAG_PATH.exec(url.pathname);
  const check = match ? checkTagCode(decodeURIComponent(match[1])) : null;
  if (!check?.ok) return { kind: 'not-a-tag' };
  if (url.origin !== origin) return { kind: 'other-site', host: url.host };
  return { kind: 'tag', code: check.code };
}
