import { boolean, index, integer, pgEnum, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core';
import { PHOTO_KINDS } from '../../../shared/schemas/photos';
import { companies } from './companies';
import { appliances, components, recordTransfers, visits } from './records';
import { createdAt, createdBy, id } from './columns';

export const photoKind = pgEnum('photo_kind', PHOTO_KINDS);

/** Image bytes live in object storage under server-made keys; this row is what makes them part of a record. */
export const photos = pgTable(
  'photos',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    visitId: uuid('visit_id').references(() => visits.id, { onDelete: 'set null' }),
    componentId: uuid('component_id').references(() => components.id, { onDelete: 'set null' }),
    kind: photoKind('kind').notNull(),
    caption: text('caption'),
    homeownerVisible: boolean('homeowner_visible').notNull().default(false),
    /** Of the uploaded bytes, so the same file sent twice to the same record is stored once. */
    sha256: text('sha256').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    displayKey: text('display_key').notNull(),
    thumbKey: text('thumb_key').notNull(),
    bytes: integer('bytes').notNull(),
    /** Copied from another company's record with the homeowner's consent (record_transfers.id). */
    importedFromTransferId: uuid('imported_from_transfer_id').references(() => recordTransfers.id, { onDelete: 'set null' }),
    createdBy: createdBy(),
    createdAt: createdAt(),
  },
  (t) => [
    unique('photos_same_file_per_record_uq').on(t.applianceId, t.visitId, t.componentId, t.sha256).nullsNotDistinct(),
    index('photos_company_appliance_idx').on(t.companyId, t.applianceId, t.createdAt),
  ],
);
