import type { DbOrTx } from '../client';
import { appliances, components, customers, sites } from '../schema/index';
import { formatSpec, type ComponentType } from '../../../shared/trade/component-types';
import { fakerFor } from './faker';
import { INVENTED_MAKES, INVENTED_NEIGHBOUR_TOWNS, pickInvented } from './invented-names';

export async function insertCustomer(db: DbOrTx, overrides: Partial<typeof customers.$inferInsert> & { companyId: string }) {
  const f = fakerFor();
  const [row] = await db
    .insert(customers)
    .values({
      name: f.person.fullName(),
      phone: `555-${f.string.numeric(4)}`,
      email: f.internet.email({ provider: 'example.test' }).toLowerCase(),
      ...overrides,
    })
    .returning();
  return row;
}

export async function insertSite(db: DbOrTx, overrides: Partial<typeof sites.$inferInsert> & { companyId: string; customerId: string }) {
  const f = fakerFor();
  const [row] = await db
    .insert(sites)
    .values({ street: f.location.streetAddress(), town: pickInvented(f, INVENTED_NEIGHBOUR_TOWNS), ...overrides })
    .returning();
  return row;
}

type ComponentOverrides = Partial<Omit<typeof components.$inferInsert, 'typeCode'>> & { typeCode: ComponentType };

export async function insertComponent(db: DbOrTx, overrides: ComponentOverrides & { companyId: string; applianceId: string }) {
  const spec = overrides.spec ?? {};
  const [row] = await db
    .insert(components)
    .values({ originalWithAppliance: !overrides.installedOn, specKey: formatSpec(overrides.typeCode, spec), ...overrides, spec })
    .returning();
  return row;
}

/** A gas-fired cast-iron steam boiler with a standing pilot unless overridden; `components` adds parts to it. */
export async function insertAppliance(
  db: DbOrTx,
  overrides: Partial<typeof appliances.$inferInsert> & { companyId: string; siteId: string; components?: ComponentOverrides[] },
) {
  const f = fakerFor();
  const { components: parts = [], ...fields } = overrides;
  const [appliance] = await db
    .insert(appliances)
    .values({
      kind: 'steam_boiler',
      fuel: 'natural_gas',
      construction: 'cast_iron',
      manufacturer: pickInvented(f, INVENTED_MAKES),
      model: `${f.string.alpha({ length: 2, casing: 'upper' })}-${f.number.int({ min: 2, max: 9 })}`,
      serial: f.string.alphanumeric({ length: 10, casing: 'upper' }),
      inputBtuh: f.helpers.arrayElement([75_000, 105_000, 140_000, 175_000]),
      installedOn: f.date.past({ years: 20 }).toISOString().slice(0, 10),
      ignitionType: 'standing_pilot',
      ventType: 'draft_hood',
      location: 'Basement',
      ...fields,
    })
    .returning();
  const inserted = [];
  for (const part of parts) inserted.push(await insertComponent(db, { companyId: appliance.companyId, applianceId: appliance.id, ...part }));
  return { ...appliance, components: inserted };
}
