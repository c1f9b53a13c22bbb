/**
 *   GET /fleet/annual-service-due?limit=   AnnualServiceDueDto   records:read
 *     In-service appliances whose last completed annual maintenance was more than a year ago (or never), oldest first.
 */
/**
 *   GET /fleet/replacement-prospects?nearYears=2&limit=   ReplacementProspectDto[]   records:read
 *     In-service appliances near or past their published median service life (ASHRAE), with their last combustion results.
 */
import { z } from 'zod';
import type { ApplianceKind, Fuel } from './enums';

export const annualServiceDueQuery = z.object({ limit: z.coerce.number().int().min(1).max(500).default(200) });

export type AnnualServiceDueItem = {
  applianceId: string;
  kind: ApplianceKind;
  fuel: Fuel;
  makeAndModel: string | null;
  street: string;
  town: string;
  lastAnnualOn: string | null;
  customer: { id: string; name: string; phone: string | null; email: string | null; remindersOptOut: boolean };
};
export type AnnualServiceDueDto = { asOf: string; items: AnnualServiceDueItem[]; total: number };

export const replacementProspectsQuery = z.object({
  nearYears: z.coerce.number().int().min(0).max(20).default(2),
  limit: z.coerce.number().int().min(1).max(500).default(200),
});

export type ReplacementProspectDto = {
  applianceId: string;
  kind: ApplianceKind;
  fuel: Fuel;
  makeAndModel: string | null;
  street: string;
  town: string;
  customerName: string;
  ageYears: number;
  medianYears: number;
  status: 'near' | 'past';
  lastCombustion: { on: string; efficiencyPct: number | null; coAirFreePpm: number | null } | null;
};
