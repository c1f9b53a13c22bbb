import type { z } from 'zod';
import type { DbOrTx } from '../../db/client';
import { validationFailed } from '../../lib/http-error';
import type { componentInput } from '../../../shared/schemas/records';
import { formatSpec, TradeInputError, type ComponentType } from '../../../shared/trade/index';
import { catalogLabels } from '../catalog';
import type { NewComponent } from './appliances.repository';
import { RECORD_WORDS } from '../../../shared/glossary/words';

type ComponentInput = z.output<typeof componentInput>;

/**
 * Checks parts against the company's catalog and turns them into rows with their stock-count key, collecting every
 * field error at once under `<prefix>N.<field>` so the form can point at each bad part.
 */
export async function componentRows(
  db: DbOrTx,
  scope: { companyId: string; actorId: string; today: string },
  inputs: ComponentInput[],
  fieldPrefix: (index: number) => string,
): Promise<{ rows: Omit<NewComponent, 'applianceId'>[]; errors: Record<string, string[]> }> {
  const catalog = await catalogLabels(db, scope.companyId);
  const errors: Record<string, string[]> = {};
  const rows: Omit<NewComponent, 'applianceId'>[] = [];
  inputs.forEach((c, i) => {
    const entry = catalog.get(c.typeCode);
    if (!entry || !entry.active) {
      errors[`${fieldPrefix(i)}typeCode`] = [`Pick one of your part types (see ${RECORD_WORDS.catalogPage}).`];
      return;
    }
    if (c.installedOn && c.installedOn > scope.today) {
      errors[`${fieldPrefix(i)}installedOn`] = ['The install date cannot be in the future.'];
      return;
    }
    let specKey: string;
    try {
      specKey = formatSpec(c.typeCode as ComponentType, c.spec);
    } catch (err) {
      if (!(err instanceof TradeInputError)) throw err;
      errors[`${fieldPrefix(i)}${err.field}`] = [err.message];
      return;
    }
    rows.push({
      companyId: scope.companyId,
      typeCode: c.typeCode,
      description: c.description ?? null,
      spec: c.spec,
      specKey,
      installedOn: c.installedOn ?? null,
      originalWithAppliance: c.originalWithAppliance,
      note: c.note ?? null,
      createdBy: scope.actorId,
      updatedBy: scope.actorId,
    });
  });
  return { rows, errors };
}

export function throwIfErrors(errors: Record<string, string[]>) {
  if (Object.keys(errors).length) throw validationFailed(errors);
}
