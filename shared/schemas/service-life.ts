/**
 * Service life learned from the company's own part swaps. Routes (under /api, tenant-filtered):
 *
 *   GET  /service-life?type=                    ServiceLifeDto[]  records:read   (one per part type with history)
 *   POST /due-rules/:id/adopt-learned-life      DueRuleDto        catalog:manage (no body; needs ≥ 30 events)
 */
import { z } from 'zod';
import { storableText } from './common';

export const MIN_EVENTS_TO_ADOPT = 30;

export const serviceLifeQuery = z.object({ type: storableText().trim().min(1).max(60).optional() });

export type ServiceLifePoint = { years: number; survival: number; lower95: number; upper95: number; atRisk: number; events: number };

export type ServiceLifeDto = {
  componentType: string;
  typeLabel: string;
  /** Parts with a known install date: all are at risk at age 0. */
  atRisk: number;
  /** Parts that came out worn or failed (the rest are censored). */
  events: number;
  medianYears: number | null;
  median95: { lowerYears: number | null; upperYears: number | null };
  /** Calendar years of the first and last wear-or-failure swap. */
  firstEventYear: number | null;
  lastEventYear: number | null;
  /** The curve, thinned to at most ~120 steps for drawing. */
  curve: ServiceLifePoint[];
  canAdopt: boolean;
};
