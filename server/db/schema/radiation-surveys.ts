import { date, index, integer, numeric, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { companies } from './companies';
import { appliances } from './records';
import { createdAt, id } from './columns';

export const heatingMedium = pgEnum('heating_medium', ['steam', 'hot_water']);
export const radiatorType = pgEnum('radiator_type', ['cast_iron_column', 'tube', 'wall', 'convector', 'baseboard']);

const edr = (name: string) => numeric(name, { precision: 10, scale: 2, mode: 'number' });

/** A radiation survey of a boiler's system: the connected radiation a replacement is sized to. A new one supersedes the last. */
export const radiationSurveys = pgTable(
  'radiation_surveys',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    surveyedOn: date('surveyed_on').notNull(),
    surveyedBy: uuid('surveyed_by').references(() => users.id, { onDelete: 'set null' }),
    system: heatingMedium('system').notNull(),
    /** Hot water only: average water temperature at design conditions, °F. */
    designWaterF: integer('design_water_f'),
    notes: text('notes'),
    totalEdrSqFt: edr('total_edr_sq_ft').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('radiation_surveys_appliance_idx').on(t.applianceId, t.createdAt)],
);

export const radiationSurveyRooms = pgTable(
  'radiation_survey_rooms',
  {
    id: id(),
    surveyId: uuid('survey_id')
      .notNull()
      .references(() => radiationSurveys.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    name: text('name').notNull(),
  },
  (t) => [index('radiation_survey_rooms_survey_idx').on(t.surveyId, t.position)],
);

/** One line of the survey: a radiator (size fields by type, the rest null) and how many identical ones the room has. */
export const radiationSurveyRadiators = pgTable(
  'radiation_survey_radiators',
  {
    id: id(),
    roomId: uuid('room_id')
      .notNull()
      .references(() => radiationSurveyRooms.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    type: radiatorType('type').notNull(),
    columns: integer('columns'),
    tubes: integer('tubes'),
    heightIn: integer('height_in'),
    sections: integer('sections'),
    wallSize: text('wall_size'),
    ratedEdrSqFt: edr('rated_edr_sq_ft'),
    lengthFt: numeric('length_ft', { precision: 6, scale: 2, mode: 'number' }),
    ratedEdrSqFtPerFt: numeric('rated_edr_sq_ft_per_ft', { precision: 6, scale: 3, mode: 'number' }),
    count: integer('count').notNull().default(1),
    /** EDR of the whole line (count included), as rated when the survey was stored. */
    edrSqFt: edr('edr_sq_ft').notNull(),
  },
  (t) => [index('radiation_survey_radiators_room_idx').on(t.roomId, t.position)],
);
