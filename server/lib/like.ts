/** Escapes LIKE/ILIKE wildcards so a user's "%" or "_" matches itself. */
export const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);
