import { and, eq, isNull, sql } from 'drizzle-orm';
import { components } from '../../db/schema/index';

/** What a booking card and the load list need of a part, read from the stored due state the due list reads. */
export const duePartColumns = {
  applianceId: components.applianceId,
  typeCode: components.typeCode,
  specKey: components.specKey,
  dueOn: components.dueOn,
  dueKind: components.dueKind,
  conditionFailed: components.conditionFailed,
};

/** Parts in place that are failed at the last check or due by `through`. */
export const partsDueBy = (companyId: string, through: string) =>
  and(eq(components.companyId, companyId), isNull(components.removedOn), sql`(${components.conditionFailed} or ${components.dueOn} <= ${through})`);
