import type { CustomerDto } from '../../shared/schemas/records';
import type { CustomerRow } from './tenant-finders';

/** A customer as every screen reads it (the customer list, the customer page, the life record). */
export const toCustomerDto = (c: CustomerRow): CustomerDto => ({
  id: c.id,
  name: c.name,
  kind: c.kind,
  phone: c.phone,
  email: c.email,
  remindersOptOut: c.remindersOptOut,
  notes: c.notes,
});
