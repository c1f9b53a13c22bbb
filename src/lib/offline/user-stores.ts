import { clear, createStore, type UseStore } from 'idb-keyval';
import { draftStorageKeyPrefix } from './draft-keys';

/*
 * Everything a signed-in person's phone keeps for offline use lives in IndexedDB databases named for that person, so
 * one technician's saved records and unsent work are never read while another is signed in, and signing out clears
 * them. API answers never go to the service worker's Cache Storage.
 */

const LAST_USER_KEY = 'lifeplate:offline-user';

export type UserStores = { userId: string; cache: UseStore; outbox: UseStore };

const opened = new Map<string, UserStores>();

export function userStores(userId: string): UserStores {
  let stores = opened.get(userId);
  if (!stores) {
    stores = { userId, cache: createStore(`lifeplate-cache-${userId}`, 'queries'), outbox: createStore(`lifeplate-outbox-${userId}`, 'entries') };
    opened.set(userId, stores);
  }
  return stores;
}

/** Whose saved data to open before the server has said who is signed in (a reload with no signal). */
export function lastSignedInUser(): string | null {
  try {
    return localStorage.getItem(LAST_USER_KEY);
  } catch {
    return null;
  }
}

export function rememberSignedInUser(userId: string) {
  try {
    localStorage.setItem(LAST_USER_KEY, userId);
  } catch {
    // Storage blocked: the phone will simply not open saved data before the server answers.
  }
}

/** Sign-out: the saved records, the unsent work and the visit drafts typed on this phone are all removed. */
export async function forgetSignedInUser(userId: string) {
  const stores = userStores(userId);
  await Promise.all([clear(stores.cache), clear(stores.outbox)]);
  try {
    for (const key of Object.keys(localStorage)) {
      if (key.startsWith(draftStorageKeyPrefix) || key === LAST_USER_KEY) localStorage.removeItem(key);
    }
  } catch {
    // ignore: see rememberSignedInUser
  }
}
