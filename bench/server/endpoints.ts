import { pick } from './load';
import type { Samples } from './samples';

export const DUE_WINDOW_DAYS = 90;

/** The request paths the figures load, each with fresh random parameters per call. */
export function endpoints(samples: Samples) {
  return {
    timeline: () => `/api/appliances/${pick(samples.applianceIds)}/timeline?limit=50`,
    search: () => `/api/search?q=${encodeURIComponent(pick(samples.searchTexts))}`,
    due: () => `/api/due?withinDays=${DUE_WINDOW_DAYS}&limit=100`,
    stock: () => `/api/due/stock?withinDays=${DUE_WINDOW_DAYS}`,
    tag: () => `/api/public/tags/${pick(samples.tagCodes)}`,
  };
}
