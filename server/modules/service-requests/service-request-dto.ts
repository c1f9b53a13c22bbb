import { LABELS } from '../../../shared/schemas/enums';
import type { ServiceRequestDto } from '../../../shared/schemas/service-requests';
import { mailDelivery } from '../../../shared/schemas/mail';
import { validationFailed } from '../../lib/http-error';
import type { ListedServiceRequest } from './service-requests.repository';

export function serviceRequestDto(r: ListedServiceRequest): ServiceRequestDto {
  const q = r.request;
  return {
    id: q.id,
    status: q.status,
    via: q.via,
    createdAt: q.createdAt.toISOString(),
    contactName: q.contactName,
    contactPhone: q.contactPhone,
    contactEmail: q.contactEmail,
    preferredTimes: q.preferredTimes,
    message: q.message,
    officeNotifiedAt: q.officeNotifiedAt?.toISOString() ?? null,
    officeMail: r.officeMailStatus ? mailDelivery(r.officeMailStatus) : null,
    handledAt: q.handledAt?.toISOString() ?? null,
    handledByName: r.handledByName,
    customerName: r.customerName,
    booking: r.booking ? { id: r.booking.split('|')[0], startsAt: r.booking.split('|')[1] } : null,
    appliance: {
      id: q.applianceId,
      title: `${LABELS.applianceKind[r.applianceKind]}, ${LABELS.fuel[r.applianceFuel].toLowerCase()}`,
      address: `${r.street}, ${r.town}`,
    },
  };
}

// As PostgreSQL prints a timestamptz: 2026-12-02 00:56:01.123456+00
const PG_TIMESTAMPTZ = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2})?$/;

/** Opaque to the client: the last row's created_at (as PostgreSQL wrote it) and id. */
export const encodeRequestCursor = (createdAt: string, id: string) => Buffer.from(JSON.stringify([createdAt, id])).toString('base64url');

export function decodeRequestCursor(cursor: string): { createdAt: string; id: string } {
  try {
    const parsed: unknown = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
    if (Array.isArray(parsed) && parsed.length === 2 && parsed.every((v) => typeof v === 'string')) {
      const [createdAt, id] = parsed as [string, string];
      if (PG_TIMESTAMPTZ.test(createdAt) && /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) return { createdAt, id };
    }
  } catch {
    // fall through to the field error
  }
  throw validationFailed({ after: ['This page link is out of date; start again from the first page.'] });
}
