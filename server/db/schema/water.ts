import { date, index, numeric, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { companies } from './companies';
import { appliances } from './records';
import { createdAt, createdBy, id } from './columns';

export const makeupWaterKind = pgEnum('makeup_water_kind', ['meter_reading', 'added_by_hand']);

/** A steam boiler's makeup-water log: feeder-meter readings (cumulative gallons) or water added by hand. */
export const makeupWaterEntries = pgTable(
  'makeup_water_entries',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    recordedOn: date('recorded_on').notNull(),
    kind: makeupWaterKind('kind').notNull(),
    gallons: numeric('gallons', { precision: 10, scale: 2, mode: 'number' }),
    note: text('note'),
    createdAt: createdAt(),
    createdBy: createdBy(),
  },
  (t) => [index('makeup_water_appliance_day_idx').on(t.applianceId, t.recordedOn)],
);
