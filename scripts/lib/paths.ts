import crypto from 'node:crypto';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const PROJECT_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const CLIENT_DIST = path.join(PROJECT_ROOT, 'dist', 'client');
/** A stable short name for this checkout, used when the data folder must live outside it. */
export const CHECKOUT_ID = `${path.basename(PROJECT_ROOT)}-${crypto.createHash('sha1').update(PROJECT_ROOT).digest('hex').slice(0, 8)}`;
