import type { Faker } from '@faker-js/faker';

/**
 * Pools of person and street names drawn from faker's generic lists (as the demo seed's customers are), so the SQL
 * can pick from them by hash. Companies and makes come from server/db/factories/invented-names.ts instead.
 */
export function buildNameLists(f: Faker) {
  const unique = (make: () => string, count: number) => {
    const out = new Set<string>();
    for (let i = 0; i < count * 4 && out.size < count; i++) out.add(make());
    return [...out];
  };
  return {
    firstNames: unique(() => f.person.firstName(), 400),
    lastNames: unique(() => f.person.lastName(), 600),
    streets: unique(() => f.location.street(), 900),
  };
}
