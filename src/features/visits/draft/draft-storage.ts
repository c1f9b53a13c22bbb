import type { DraftFields } from './draft-fields';
import { draftStorageKeyPrefix } from '@/lib/offline/draft-keys';

/** What this phone keeps per visit, so nothing typed is lost to a dead battery, a reload or a basement with no signal. */
export type StoredDraft = {
  v: 1;
  /** The server state this draft builds on, and its revision. */
  base: DraftFields;
  baseRevision: number;
  fields: DraftFields;
  /** True while the phone holds changes the server has not acknowledged. */
  dirty: boolean;
  editedAt: number;
};

export const draftStorageKey = (visitId: string) => `${draftStorageKeyPrefix}${visitId}`;

export function loadDraft(visitId: string): StoredDraft | null {
  try {
    const raw = localStorage.getItem(draftStorageKey(visitId));
    const parsed = raw ? (JSON.parse(raw) as StoredDraft) : null;
    if (!(parsed?.v === 1 && parsed.fields && parsed.base)) return null;
    // Drafts kept before reading skips existed.
    parsed.fields.readingSkips ??= {};
    parsed.base.readingSkips ??= {};
    return parsed;
  } catch {
    return null;
  }
}

export function saveDraft(visitId: string, draft: StoredDraft) {
  try {
    localStorage.setItem(draftStorageKey(visitId), JSON.stringify(draft));
  } catch {
    // Storage full or blocked: the server copy is still the fallback; nothing else to do here.
  }
}

export function clearDraft(visitId: string) {
  try {
    localStorage.removeItem(draftStorageKey(visitId));
  } catch {
    // ignore: see saveDraft
  }
}
