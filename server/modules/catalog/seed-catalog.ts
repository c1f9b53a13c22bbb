import type { DbOrTx } from '../../db/client';
import { componentCatalog, type SpecFieldDef } from '../../db/schema/index';
import { COMPONENT_TYPES, type SpecField } from '../../../shared/trade/component-types';

const toSpecFieldDef = (f: SpecField): SpecFieldDef =>
  f.kind === 'number' ? { key: f.key, label: f.label, unit: f.unit, kind: 'number' } : { key: f.key, label: f.label, kind: 'choice', options: Object.keys(f.options) };

/** Every company starts with the full list of part types; managers may rename or retire them, never add codes. */
export async function seedCompanyCatalog(db: DbOrTx, companyId: string) {
  await db
    .insert(componentCatalog)
    .values(
      Object.entries(COMPONENT_TYPES).map(([code, def]) => ({
        companyId,
        code,
        group: def.group,
        label: def.label,
        specFields: def.specFields.map(toSpecFieldDef),
      })),
    )
    .onConflictDoNothing();
}
