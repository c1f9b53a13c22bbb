import { writeFileSync } from 'node:fs';
import { lifeRecordJsonSchema } from '../shared/schemas/life-record-export';

/** Writes docs/schemas/life-record-export.v1.json from the zod schema (tests/unit/life-record-export-schema.test.ts checks it). */
writeFileSync('docs/schemas/life-record-export.v1.json', `${JSON.stringify(lifeRecordJsonSchema(), null, 2)}\n`);
