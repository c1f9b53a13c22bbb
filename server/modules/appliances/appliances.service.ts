import type { z } from 'zod';
import type { AppContext } from '../../context';
import { conflict, notFound } from '../../lib/http-error';
import type { appliancePatch, applianceInput, componentInput, replaceApplianceInput, timelineQuery } from '../../../shared/schemas/records';
import { LABELS } from '../../../shared/schemas/enums';
import type { Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { companyDueClock, companyToday } from '../../core/company-today';
import { recomputeDueForAppliance } from '../due';
import { findSite } from '../../core/tenant-finders';
import { appendTimelineEvent, listTimeline } from '../../core/timeline';
import { applianceLabel } from './appliance-label';
import { loadApplianceRecord } from './appliance-record';
import { appliancesRepository } from './appliances.repository';
import { componentRows, throwIfErrors } from './component-rows';
import { toComponentDto } from './component-dto';
import { occurredAtForDate } from './occurred-at';

type Member = Extract<Principal, { kind: 'member' }>;

export function appliancesService(ctx: AppContext) {
  return {
    get: (companyId: string, id: string) => loadApplianceRecord(ctx.db, companyId, id),

    async timeline(companyId: string, id: string, q: z.output<typeof timelineQuery>) {
      if (!(await appliancesRepository.find(ctx.db, companyId, id))) throw notFound('Appliance');
      return listTimeline(ctx.db, { companyId, applianceId: id, kind: q.kind, before: q.before, limit: q.limit });
    },

    /** The appliance, its parts, the install event and audit rows in one transaction; due dates follow. */
    async create(actor: Member, input: z.output<typeof applianceInput>) {
      const { companyId, userId } = actor;
      const id = await ctx.db.transaction(async (tx) => {
        const today = await companyToday(tx, companyId);
        const errors: Record<string, string[]> = {};
        if (!(await findSite(tx, companyId, input.siteId))) errors.siteId = ['Pick a site of your company.'];
        if (input.installedOn && input.installedOn > today) errors.installedOn = ['The install date cannot be in the future.'];
        const parts = await componentRows(tx, { companyId, actorId: userId, today }, input.components, (i) => `components.${i}.`);
        throwIfErrors({ ...errors, ...parts.errors });

        const { components: _components, ...fields } = input;
        const appliance = await appliancesRepository.insert(tx, { ...fields, companyId, createdBy: userId, updatedBy: userId });
        const inserted = await appliancesRepository.insertComponents(tx, parts.rows.map((r) => ({ ...r, applianceId: appliance.id })));
        await appendTimelineEvent(tx, {
          companyId,
          applianceId: appliance.id,
          occurredAt: occurredAtForDate(input.installedOn, today),
          kind: 'install',
          summary: `Installed: ${applianceLabel(appliance)}${inserted.length ? `, with ${inserted.length} part${inserted.length === 1 ? '' : 's'} on record` : ''}`,
          data: { componentIds: inserted.map((c) => c.id) },
          actorId: userId,
        });
        await recordAudit(tx, { companyId, actorId: userId, action: 'create', entity: 'appliance', entityId: appliance.id, changes: fields });
        for (const c of inserted) {
          await recordAudit(tx, { companyId, actorId: userId, action: 'create', entity: 'component', entityId: c.id, changes: { typeCode: c.typeCode, spec: c.spec } });
        }
        await recomputeDueForAppliance(tx, companyId, appliance.id);
        return appliance.id;
      });
      return loadApplianceRecord(ctx.db, companyId, id);
    },

    async update(actor: Member, id: string, input: z.output<typeof appliancePatch>) {
      const { companyId, userId } = actor;
      await ctx.db.transaction(async (tx) => {
        const before = await appliancesRepository.find(tx, companyId, id, { forUpdate: true });
        if (!before) throw notFound('Appliance');
        if (input.installedOn && input.installedOn > (await companyToday(tx, companyId))) {
          throwIfErrors({ installedOn: ['The install date cannot be in the future.'] });
        }
        await appliancesRepository.update(tx, companyId, id, { ...input, updatedBy: userId });
        if (input.status && input.status !== before.status) {
          await appendTimelineEvent(tx, {
            companyId,
            applianceId: id,
            occurredAt: new Date(),
            kind: 'status',
            summary: `Status changed: ${LABELS.applianceStatus[before.status]} → ${LABELS.applianceStatus[input.status]}`,
            data: { from: before.status, to: input.status },
            actorId: userId,
          });
        }
        await recordAudit(tx, { companyId, actorId: userId, action: 'update', entity: 'appliance', entityId: id, changes: input });
        await recomputeDueForAppliance(tx, companyId, id);
      });
      return loadApplianceRecord(ctx.db, companyId, id);
    },

    /** Marks the old appliance removed and links its successor; the old record stays readable. */
    async replace(actor: Member, id: string, input: z.output<typeof replaceApplianceInput>) {
      const { companyId, userId } = actor;
      await ctx.db.transaction(async (tx) => {
        const old = await appliancesRepository.find(tx, companyId, id, { forUpdate: true });
        if (!old) throw notFound('Appliance');
        if (old.status === 'removed') throw conflict('This appliance is already marked removed.');
        const today = await companyToday(tx, companyId);
        const successor = input.newApplianceId === id ? null : await appliancesRepository.find(tx, companyId, input.newApplianceId);
        const errors: Record<string, string[]> = {};
        if (!successor) errors.newApplianceId = [input.newApplianceId === id ? 'An appliance cannot replace itself.' : 'Pick an appliance of your company.'];
        else if (successor.status === 'removed') errors.newApplianceId = ['That appliance is itself marked removed.'];
        if (input.removedOn > today) errors.removedOn = ['The removal date cannot be in the future.'];
        throwIfErrors(errors);

        await appliancesRepository.update(tx, companyId, id, { status: 'removed', replacedById: successor!.id, updatedBy: userId });
        await appliancesRepository.removeComponentsOf(tx, companyId, id, input.removedOn, 'Removed with the appliance', userId);
        const occurredAt = occurredAtForDate(input.removedOn, today);
        const reason = input.reason ? `: ${input.reason}` : '';
        await appendTimelineEvent(tx, {
          companyId,
          applianceId: id,
          occurredAt,
          kind: 'status',
          summary: `Removed; replaced by ${applianceLabel(successor!)}${reason}`,
          refId: successor!.id,
          data: { from: old.status, to: 'removed', replacedById: successor!.id, removedOn: input.removedOn, reason: input.reason ?? null },
          actorId: userId,
        });
        await appendTimelineEvent(tx, {
          companyId,
          applianceId: successor!.id,
          occurredAt,
          kind: 'status',
          summary: `Replaced ${applianceLabel(old)}${reason}`,
          refId: id,
          data: { replaces: id, removedOn: input.removedOn, reason: input.reason ?? null },
          actorId: userId,
        });
        await recordAudit(tx, { companyId, actorId: userId, action: 'replace', entity: 'appliance', entityId: id, changes: input });
      });
      return loadApplianceRecord(ctx.db, companyId, id);
    },

    async addComponent(actor: Member, id: string, input: z.output<typeof componentInput>) {
      const { companyId, userId } = actor;
      return ctx.db.transaction(async (tx) => {
        const appliance = await appliancesRepository.find(tx, companyId, id, { forUpdate: true });
        if (!appliance) throw notFound('Appliance');
        if (appliance.status === 'removed') throw conflict('This appliance was removed; its record is kept as it was.');
        const { today, dueSoonDays } = await companyDueClock(tx, companyId);
        const parts = await componentRows(tx, { companyId, actorId: userId, today }, [input], () => '');
        throwIfErrors(parts.errors);
        const [component] = await appliancesRepository.insertComponents(tx, [{ ...parts.rows[0], applianceId: id }]);
        await recomputeDueForAppliance(tx, companyId, id);
        const row = (await appliancesRepository.components(tx, companyId, id)).find((r) => r.component.id === component.id)!;
        const added = toComponentDto(row.component, row.catalogLabel, today, dueSoonDays);
        await appendTimelineEvent(tx, {
          companyId,
          applianceId: id,
          occurredAt: new Date(),
          kind: 'note',
          summary: `Part added to the record: ${[added.typeLabel, added.specKey].filter(Boolean).join(', ')}`,
          refId: component.id,
          data: { componentId: component.id, typeCode: component.typeCode, specKey: component.specKey },
          actorId: userId,
        });
        await recordAudit(tx, { companyId, actorId: userId, action: 'create', entity: 'component', entityId: component.id, changes: input });
        return added;
      });
    },
  };
}
