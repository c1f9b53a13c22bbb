import { requireNumber, TradeInputError } from './trade-input-error';

/**
 * Equivalent direct radiation (EDR, square feet) of old radiators, per section, by type and height.
 * Every row: from memory: Dan Holohan, "The Lost Art of Steam Heating" (radiator rating tables), which reprints the
 * cast-iron ratings of the I=B=R "Testing and Rating Code for Cast-Iron Radiators". Check against the book before
 * relying on a figure; a radiator not in the table is rated from its maker's literature.
 */
export const RADIATOR_TYPES = ['cast_iron_column', 'tube', 'wall', 'convector', 'baseboard'] as const;
export type RadiatorType = (typeof RADIATOR_TYPES)[number];

/** Column radiators: columns → height (in) → sq ft EDR per section. from memory: Holohan, The Lost Art of Steam Heating. */
export const COLUMN_EDR_SQFT_PER_SECTION: Record<number, Record<number, number>> = {
  1: { 20: 1.5, 23: 1.66, 26: 2, 32: 2.5, 38: 3, 45: 3.5 },
  2: { 20: 2, 23: 2.33, 26: 2.66, 32: 3.33, 38: 4, 45: 5 },
  3: { 18: 2.25, 22: 3, 26: 3.75, 32: 4.5, 38: 5, 45: 6 },
  4: { 18: 3, 22: 4, 26: 5, 32: 6.5, 38: 8, 45: 10 },
};

/** Tube radiators: tubes → height (in) → sq ft EDR per section. from memory: Holohan, The Lost Art of Steam Heating. */
export const TUBE_EDR_SQFT_PER_SECTION: Record<number, Record<number, number>> = {
  3: { 20: 1.75, 23: 2, 26: 2.33, 32: 3, 38: 3.5 },
  4: { 20: 2.25, 23: 2.5, 26: 2.75, 32: 3.5, 38: 4.25 },
  5: { 20: 2.67, 23: 3, 26: 3.5, 32: 4.33, 38: 5 },
  6: { 20: 3, 23: 3.5, 26: 4, 32: 5, 38: 6 },
};

/** Wall radiators are named for their EDR per section. from memory: Holohan, The Lost Art of Steam Heating. */
export const WALL_EDR_SQFT_PER_SECTION = { '5-A': 5, '7-A': 7, '9-A': 9 } as const;
export type WallRadiatorSize = keyof typeof WALL_EDR_SQFT_PER_SECTION;

export type Radiator =
  | { type: 'cast_iron_column'; columns: number; heightIn: number; sections: number }
  | { type: 'tube'; tubes: number; heightIn: number; sections: number }
  | { type: 'wall'; size: WallRadiatorSize; sections: number }
  /** Convectors: the EDR from the unit's rating tag or maker's literature; there is no general table. */
  | { type: 'convector'; ratedEdrSqFt: number }
  /** Baseboard: its length and the maker's rated EDR per foot. */
  | { type: 'baseboard'; lengthFt: number; ratedEdrSqFtPerFt: number };

const MAX_SECTIONS = 60; // common practice: a single radiator of more sections than this is a data-entry slip

function perSection(table: Record<number, Record<number, number>>, what: string, count: number, heightIn: number, field: string): number {
  const byHeight = table[count];
  if (!byHeight) throw new TradeInputError(`${field}.${what}`, `no table for ${count} ${what}; listed: ${Object.keys(table).join(', ')}`);
  const edr = byHeight[heightIn];
  if (edr === undefined) throw new TradeInputError(`${field}.heightIn`, `no rating for ${heightIn} in; listed heights: ${Object.keys(byHeight).join(', ')} in`);
  return edr;
}

const sectionsOf = (field: string, n: number) => {
  requireNumber(`${field}.sections`, n, { min: 1, max: MAX_SECTIONS });
  if (!Number.isInteger(n)) throw new TradeInputError(`${field}.sections`, 'must be a whole number of sections');
  return n;
};

/** The radiator's EDR in square feet. `field` prefixes the name of a bad input in the error. */
export function radiatorEdrSqFt(r: Radiator, field = 'radiator'): number {
  switch (r.type) {
    case 'cast_iron_column':
      return perSection(COLUMN_EDR_SQFT_PER_SECTION, 'columns', r.columns, r.heightIn, field) * sectionsOf(field, r.sections);
    case 'tube':
      return perSection(TUBE_EDR_SQFT_PER_SECTION, 'tubes', r.tubes, r.heightIn, field) * sectionsOf(field, r.sections);
    case 'wall': {
      const edr = WALL_EDR_SQFT_PER_SECTION[r.size];
      if (edr === undefined) throw new TradeInputError(`${field}.size`, `unknown wall radiator size ${String(r.size)}`);
      return edr * sectionsOf(field, r.sections);
    }
    case 'convector':
      return requireNumber(`${field}.ratedEdrSqFt`, r.ratedEdrSqFt, { minExclusive: 0, max: 500 });
    case 'baseboard':
      return requireNumber(`${field}.lengthFt`, r.lengthFt, { minExclusive: 0, max: 200 }) * requireNumber(`${field}.ratedEdrSqFtPerFt`, r.ratedEdrSqFtPerFt, { minExclusive: 0, max: 10 });
  }
}
