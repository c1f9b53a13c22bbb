/**
 *   POST /appliances/:id/radiation-surveys          RadiationSurveyDto     records:write
 *   GET  /appliances/:id/radiation-surveys          RadiationSurveySummaryDto[]   records:read
 *   GET  /appliances/:id/radiation-surveys/latest   LatestRadiationSurveyDto   records:read ({ survey: null } before the first)
 */
import { z } from 'zod';
import { isoDate, optionalText, requiredText } from './common';
import { radiatorEdrSqFt, RADIATOR_TYPES, WALL_EDR_SQFT_PER_SECTION, type Radiator, type RadiatorType } from '../trade/radiator-edr';
import { sizeBoilerFromEdr, type BoilerSizing, type HeatingMedium } from '../trade/boiler-sizing';
import { TradeInputError } from '../trade/trade-input-error';

export const HEATING_MEDIA = ['steam', 'hot_water'] as const satisfies readonly HeatingMedium[];
export const WALL_RADIATOR_SIZES = Object.keys(WALL_EDR_SQFT_PER_SECTION) as (keyof typeof WALL_EDR_SQFT_PER_SECTION)[];

export const RADIATOR_TYPE_LABELS: Record<RadiatorType, string> = {
  cast_iron_column: 'Cast-iron column',
  tube: 'Tube',
  wall: 'Wall',
  convector: 'Convector',
  baseboard: 'Baseboard',
};
export const HEATING_MEDIUM_LABELS: Record<HeatingMedium, string> = { steam: 'Steam', hot_water: 'Hot water' };

const whole = (what: string, min: number, max: number) =>
  z.number(`Enter the ${what}.`).int(`The ${what} is a whole number.`).min(min, `At least ${min}.`).max(max, `At most ${max}.`);
const positive = (what: string, max: number) =>
  z.number(`Enter the ${what}.`).gt(0, `The ${what} must be more than 0.`).max(max, `At most ${max}.`);

// Bounds are those of radiatorEdrSqFt; the tables themselves are checked below (a height not in the table).
const sections = whole('number of sections', 1, 60);
const heightIn = whole('height in inches', 10, 60);
const count = whole('number of identical radiators', 1, 20).default(1);

export const radiatorInput = z.discriminatedUnion('type', [
  z.object({ type: z.literal('cast_iron_column'), columns: whole('number of columns', 1, 4), heightIn, sections, count }),
  z.object({ type: z.literal('tube'), tubes: whole('number of tubes', 3, 6), heightIn, sections, count }),
  z.object({ type: z.literal('wall'), size: z.enum(WALL_RADIATOR_SIZES, 'Choose the wall radiator size.'), sections, count }),
  z.object({ type: z.literal('convector'), ratedEdrSqFt: positive('rated EDR from the tag', 500), count }),
  z.object({ type: z.literal('baseboard'), lengthFt: positive('length in feet', 200), ratedEdrSqFtPerFt: positive('rated EDR per foot', 10), count }),
], { error: () => `Choose the radiator type: ${RADIATOR_TYPES.join(', ')}.` });
export type RadiatorInput = z.input<typeof radiatorInput>;
export type RadiatorParsed = z.output<typeof radiatorInput>;

export const roomInput = z.object({
  name: requiredText('Room name', 80),
  radiators: z.array(radiatorInput).min(1, 'Add a radiator, or remove the room.').max(30, 'At most 30 radiators in a room.'),
});

/** The sizing function's upper bound (sizeBoilerFromEdr): a survey above it is a data-entry slip or a plant for an engineer. */
export const MAX_SURVEY_EDR_SQFT = 20_000;

/** The trade error's message without its field prefix, first letter capitalised. */
export function tradeMessage(err: TradeInputError): string {
  const text = err.message.startsWith(`${err.field}: `) ? err.message.slice(err.field.length + 2) : err.message;
  return text.charAt(0).toUpperCase() + text.slice(1) + '.';
}

export const radiationSurveyInput = z
  .object({
    surveyedOn: isoDate,
    system: z.enum(HEATING_MEDIA, 'Choose steam or hot water.'),
    /** Hot water only: the average water temperature at design conditions, which the EDR rating is read at. */
    designWaterF: z.number('Enter the design water temperature.').int('Whole degrees.').min(100, 'At least 100 °F.').max(210, 'At most 210 °F.').nullish(),
    notes: optionalText(2000),
    rooms: z.array(roomInput).min(1, 'Add at least one room with its radiators.').max(60, 'At most 60 rooms.'),
  })
  .superRefine((s, ctx) => {
    if (s.system === 'hot_water' && (s.designWaterF === null || s.designWaterF === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['designWaterF'], message: 'Enter the design water temperature for a hot-water system.' });
    }
    if (s.system === 'steam' && s.designWaterF !== null && s.designWaterF !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['designWaterF'], message: 'A steam system has no design water temperature.' });
    }
    s.rooms.forEach((room, i) =>
      room.radiators.forEach((r, j) => {
        try {
          radiatorEdrSqFt(toTradeRadiator(r), `rooms.${i}.radiators.${j}`);
        } catch (err) {
          if (!(err instanceof TradeInputError)) throw err;
          ctx.addIssue({ code: 'custom', path: err.field.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : p)), message: tradeMessage(err) });
        }
      }),
    );
    const total = runningTotalEdrSqFt(s.rooms);
    if (total > MAX_SURVEY_EDR_SQFT) {
      ctx.addIssue({ code: 'custom', path: ['rooms'], message: `${Math.round(total)} sq ft EDR is beyond what one boiler is sized for here (at most ${MAX_SURVEY_EDR_SQFT}); check the counts.` });
    }
  });
export type RadiationSurveyInput = z.input<typeof radiationSurveyInput>;
export type RadiationSurveyParsed = z.output<typeof radiationSurveyInput>;

/** The trade function's shape of one radiator (without the count of identical ones). */
export function toTradeRadiator(r: RadiatorParsed | RadiatorInput): Radiator {
  switch (r.type) {
    case 'cast_iron_column':
      return { type: r.type, columns: r.columns, heightIn: r.heightIn, sections: r.sections };
    case 'tube':
      return { type: r.type, tubes: r.tubes, heightIn: r.heightIn, sections: r.sections };
    case 'wall':
      return { type: r.type, size: r.size, sections: r.sections };
    case 'convector':
      return { type: r.type, ratedEdrSqFt: r.ratedEdrSqFt };
    case 'baseboard':
      return { type: r.type, lengthFt: r.lengthFt, ratedEdrSqFtPerFt: r.ratedEdrSqFtPerFt };
  }
}

/** EDR of one line of the survey (the radiator times the number of identical ones), or null if it cannot be rated yet. */
export function radiatorLineEdrSqFt(r: RadiatorInput): number | null {
  try {
    return radiatorEdrSqFt(toTradeRadiator(r)) * (r.count ?? 1);
  } catch (err) {
    if (err instanceof TradeInputError) return null;
    throw err;
  }
}

/** Total EDR of the radiators that can be rated so far: the running total while the survey is being taken. */
export function runningTotalEdrSqFt(rooms: { radiators: RadiatorInput[] }[]): number {
  return rooms.flatMap((room) => room.radiators).reduce((sum, r) => sum + (radiatorLineEdrSqFt(r) ?? 0), 0);
}

/** Sizing of a whole survey, the one computation the server stores and the form shows. */
export function sizeSurvey(s: { system: HeatingMedium; designWaterF: number | null; totalEdrSqFt: number }): BoilerSizing {
  return sizeBoilerFromEdr({ medium: s.system, totalEdrSqFt: s.totalEdrSqFt, ...(s.system === 'hot_water' && s.designWaterF !== null ? { averageWaterF: s.designWaterF } : {}) });
}

export type RadiatorDto = RadiatorParsed & { id: string; edrSqFt: number };
export type RoomDto = { id: string; name: string; edrSqFt: number; radiators: RadiatorDto[] };
export type RadiationSurveySummaryDto = {
  id: string;
  surveyedOn: string;
  surveyedBy: string | null;
  system: HeatingMedium;
  designWaterF: number | null;
  totalEdrSqFt: number;
  createdAt: string;
};
export type RadiationSurveyDto = RadiationSurveySummaryDto & {
  notes: string | null;
  rooms: RoomDto[];
  sizing: BoilerSizing & { btuhPerSqFtEdr: number };
  /** The boiler's nameplate, for the comparison beside the required rating. */
  nameplate: { inputBtuh: number | null; grossOutputBtuh: number | null };
};
export type LatestRadiationSurveyDto = { survey: RadiationSurveyDto | null };
