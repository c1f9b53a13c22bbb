import type { AppContext } from '../../context';
import { notFound, validationFailed } from '../../lib/http-error';
import { analyzeMakeupWater, type MakeupWaterEntry } from '../../../shared/trade/makeup-water';
import { TradeInputError } from '../../../shared/trade/trade-input-error';
import type { MakeupWaterDto, MakeupWaterEntryDto, MakeupWaterEntryInput } from '../../../shared/schemas/makeup-water';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { companyToday } from '../../core/company-today';
import { occurredAtForDate } from '../appliances';
import { makeupWaterRepository as repo } from './makeup-water.repository';
import { findAppliance } from '../../core/tenant-finders';

const toTradeEntry = (e: MakeupWaterEntryDto): MakeupWaterEntry =>
  e.kind === 'meter_reading' ? { date: e.recordedOn, kind: 'meter_reading', gallons: e.gallons ?? 0 } : { date: e.recordedOn, kind: 'added_by_hand', ...(e.gallons === null ? {} : { gallons: e.gallons }) };

function analyze(entries: MakeupWaterEntryDto[]) {
  return entries.length >= 2 ? analyzeMakeupWater(entries.map(toTradeEntry)) : null;
}

export function makeupWaterService(ctx: AppContext) {
  return {
    async get(companyId: string, applianceId: string): Promise<MakeupWaterDto> {
      if (!(await findAppliance(ctx.db, companyId, applianceId))) throw notFound('Appliance');
      const entries = await repo.list(ctx.db, companyId, applianceId);
      return { entries, analysis: analyze(entries) };
    },

    async add(actor: { companyId: string; userId: string }, applianceId: string, input: MakeupWaterEntryInput): Promise<MakeupWaterDto> {
      return ctx.db.transaction(async (tx) => {
        if (!(await findAppliance(tx, actor.companyId, applianceId))) throw notFound('Appliance');
        const today = await companyToday(tx, actor.companyId);
        if (input.recordedOn > today) throw validationFailed({ recordedOn: ['A reading cannot be dated in the future.'] });
        const existing = await repo.list(tx, actor.companyId, applianceId);
        const candidate: MakeupWaterEntryDto = { id: 'new', recordedOn: input.recordedOn, kind: input.kind, gallons: input.gallons ?? null, note: input.note ?? null };
        try {
          // The whole log must still make sense with the new entry (e.g. a meter never runs backwards).
          analyze([...existing, candidate].sort((a, b) => a.recordedOn.localeCompare(b.recordedOn)));
        } catch (err) {
          if (err instanceof TradeInputError) throw validationFailed({ gallons: [err.message] });
          throw err;
        }
        const row = await repo.insert(tx, { companyId: actor.companyId, applianceId, recordedOn: input.recordedOn, kind: input.kind, gallons: input.gallons ?? null, note: input.note ?? null, createdBy: actor.userId });
        const summary =
          input.kind === 'meter_reading'
            ? `Makeup-water meter read ${input.gallons.toLocaleString('en-US')} gal`
            : `Water added by hand${input.gallons ? `: ${input.gallons} gal` : ''}`;
        await appendTimelineEvent(tx, {
          companyId: actor.companyId,
          applianceId,
          // Today's entry happened just now; noon UTC of today could still lie ahead.
          occurredAt: occurredAtForDate(input.recordedOn, today),
          kind: 'makeup_water',
          summary,
          refId: row.id,
          data: { makeupWater: { kind: input.kind, gallons: input.gallons ?? null } },
          actorId: actor.userId,
        });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'create', entity: 'makeup_water_entry', entityId: row.id, changes: input });
        const entries = await repo.list(tx, actor.companyId, applianceId);
        return { entries, analysis: analyze(entries) };
      });
    },
  };
}
