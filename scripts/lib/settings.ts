import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

export const DEFAULT_APP_DATABASE = 'lifeplate';
const settingsSchema = z.object({ database: z.string().regex(/^[a-z_][a-z0-9_]{0,62}$/).optional() });
export type DataSettings = z.infer<typeof settingsSchema>;

const fileIn = (dataRoot: string) => path.join(dataRoot, 'settings.json');

/** The data folder's own settings (settings.json): which database of the local cluster the app uses. */
export function readSettings(dataRoot: string): DataSettings {
  const file = fileIn(dataRoot);
  if (!fs.existsSync(file)) return {};
  const parsed = settingsSchema.safeParse(JSON.parse(fs.readFileSync(file, 'utf8')));
  if (!parsed.success) throw new Error(`${file} is not valid: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  return parsed.data;
}

export function writeSettings(dataRoot: string, patch: DataSettings) {
  const next = settingsSchema.parse({ ...readSettings(dataRoot), ...patch });
  fs.writeFileSync(fileIn(dataRoot), `${JSON.stringify(next, null, 2)}\n`);
  return next;
}

export const appDatabaseName = (dataRoot: string) => readSettings(dataRoot).database ?? DEFAULT_APP_DATABASE;
