/** Visit drafts are kept in localStorage under this prefix (src/features/visits/draft/draft-storage.ts). */
export const draftStorageKeyPrefix = 'lifeplate:visit-draft:';
