/**
 * The homeowner's read-only view of one appliance, in plain words, and the share links that open it.
 *
 *   POST /appliances/:id/share-links      CreatedShareLinkDto  share:create   (the URL is shown once)
 *   GET  /appliances/:id/share-links      ShareLinkDto[]       records:read
 *   POST /share-links/:id/revoke          ShareLinkDto         share:revoke
 *   GET  /share/:token                    HomeownerViewDto     public (410 once expired or revoked)
 *   GET  /homeowner/appliances            HomeownerApplianceSummary[]  homeowner
 *   GET  /homeowner/appliances/:id        HomeownerViewDto     homeowner (own appliances only)
 *   GET  /share/:token/photos/:photoId/:variant                 image/jpeg  public (the link's appliance, homeowner-visible only)
 *   GET  /homeowner/appliances/:id/photos/:photoId/:variant     image/jpeg  homeowner (own appliance, homeowner-visible only)
 *        variant: thumb | display; anything else, a hidden photo or another appliance's answers 404.
 */
import { z } from 'zod';
import { optionalText, storableText } from './common';
import type { HomeownerBookingDto } from './booking-notices';

export const shareLinkInput = z.object({
  expiresInDays: z.number('Give a number of days.').int('Whole days.').min(1, 'At least 1 day.').max(1825, 'At most 5 years.').default(365),
  label: optionalText(120),
});
export type ShareLinkInput = z.input<typeof shareLinkInput>;
export const shareTokenParam = z.object({ token: storableText().regex(/^[A-Za-z0-9_-]{43}$/, 'Not a share link.') });
export const HOMEOWNER_PHOTO_VARIANTS = ['thumb', 'display'] as const;
export type HomeownerPhotoVariant = (typeof HOMEOWNER_PHOTO_VARIANTS)[number];
const photoParams = { photoId: z.uuid('Not a valid id.'), variant: storableText().max(20) };
export const sharePhotoParams = shareTokenParam.extend(photoParams);
export const homeownerPhotoParams = z.object({ id: z.uuid('Not a valid id.'), ...photoParams });

export type ShareLinkDto = {
  id: string;
  label: string | null;
  createdAt: string;
  expiresAt: string;
  revokedAt: string | null;
  status: 'active' | 'expired' | 'revoked';
};
export type CreatedShareLinkDto = ShareLinkDto & { url: string };

export type HomeownerVisitDto = {
  /** Names the visit's report: /share/:token/visits/:id/report. */
  id: string;
  visitedOn: string;
  what: string;
  outcome: 'left_operating' | 'shut_down_unsafe' | null;
  outcomeWords: string | null;
  checked: string[];
  replaced: { part: string; reason: string | null }[];
  findings: string;
  recommendations: string;
  readingsInWords: string[];
  readings: Record<string, number>;
};

export type HomeownerViewDto = {
  company: { name: string; phone: string };
  appliance: {
    title: string;
    makeAndModel: string | null;
    location: string | null;
    address: string;
    installedOn: string | null;
    ageYears: number | null;
    kind: string;
    fuel: string;
  };
  unsafe: { visitedOn: string; reason: string | null } | null;
  /** The next booked or confirmed visit for this appliance, on the company's clocks; null when none is booked. */
  nextBooking: HomeownerBookingDto | null;
  nextAnnualServiceDue: string | null;
  comingDue: { part: string; what: 'inspect' | 'replace'; dueOn: string; meaning: string }[];
  lifeExpectancy: string | null;
  visits: HomeownerVisitDto[];
  photos: { id: string; caption: string | null; kind: string; takenOn: string }[];
};

export type HomeownerApplianceSummary = { id: string; title: string; address: string };

/** A visit of the appliance behind a share link, or of one of the homeowner's own appliances. */
export const shareVisitParams = shareTokenParam.extend({ visitId: z.uuid('Not a valid id.') });
export const homeownerVisitParams = z.object({ id: z.uuid('Not a valid id.'), visitId: z.uuid('Not a valid id.') });
