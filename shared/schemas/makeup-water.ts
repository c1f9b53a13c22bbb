/**
 *   GET  /appliances/:id/makeup-water   MakeupWaterDto   records:read
 *   POST /appliances/:id/makeup-water   MakeupWaterDto   visits:record
 */
import { z } from 'zod';
import { isoDate, optionalText } from './common';
import type { MakeupWaterAnalysis } from '../trade/makeup-water';

export const makeupWaterEntryInput = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('meter_reading'),
    recordedOn: isoDate,
    gallons: z.number('Enter the meter reading in gallons.').min(0, 'A meter reading cannot be negative.').max(10_000_000),
    note: optionalText(500),
  }),
  z.object({
    kind: z.literal('added_by_hand'),
    recordedOn: isoDate,
    gallons: z.number().min(0.1, 'At least 0.1 gallon, or leave it empty if unknown.').max(1000).nullish(),
    note: optionalText(500),
  }),
]);
export type MakeupWaterEntryInput = z.input<typeof makeupWaterEntryInput>;

export type MakeupWaterEntryDto = { id: string; recordedOn: string; kind: 'meter_reading' | 'added_by_hand'; gallons: number | null; note: string | null };
export type MakeupWaterDto = { entries: MakeupWaterEntryDto[]; analysis: MakeupWaterAnalysis | null };
