import type { HomeownerPhotoVariant } from '@shared/schemas/homeowner';

/** Where the homeowner's record came from: a share link (no sign-in) or their own sign-in. */
export type RecordSource = { kind: 'share'; token: string } | { kind: 'account'; applianceId: string };

const base = (source: RecordSource) =>
  source.kind === 'share' ? `/share/${encodeURIComponent(source.token)}` : `/homeowner/appliances/${encodeURIComponent(source.applianceId)}`;

export const photoPath = (source: RecordSource, photoId: string, variant: HomeownerPhotoVariant) => `/api${base(source)}/photos/${photoId}/${variant}`;
export const serviceRequestPath = (source: RecordSource) => `${base(source)}/service-requests`;
export const visitReportPath = (source: RecordSource, visitId: string) => `/api${base(source)}/visits/${encodeURIComponent(visitId)}/report`;
export const lifeRecordPath = (source: RecordSource, format: 'pdf' | 'json') => `/api${base(source)}/life-record.${format}`;
