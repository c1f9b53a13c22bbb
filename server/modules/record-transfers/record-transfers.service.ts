import crypto from 'node:crypto';
import type { AppContext } from '../../context';
import { conflict, HttpError, notFound } from '../../lib/http-error';
import type { Principal } from '../../../shared/schemas/roles';
import {
  TRANSFER_CODE_DAYS,
  type CreatedTransferDto,
  type ReceivedTransferDto,
  type TransferDto,
  type TransferPreviewDto,
  type TransferRedeemInput,
} from '../../../shared/schemas/record-transfers';
import { groupTransferCode, transferCodeFromBytes } from '../../../shared/transfers/transfer-code';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { applianceLabel } from '../appliances';
import { companyToday } from '../../core/company-today';
import { requireOwnAppliance } from '../homeowner';
import { findSite } from '../../core/tenant-finders';
import { copyRecord } from './copy-record';
import { countsOf, readTransferableRecord } from './read-transferable-record';
import { recordTransfersRepository as repo, type TransferRow } from './record-transfers.repository';

type Member = Extract<Principal, { kind: 'member' }>;
type Homeowner = Extract<Principal, { kind: 'homeowner' }>;

/** Of the normalised code (shared/transfers/transfer-code.ts); the code itself is never stored. */
export const hashTransferCode = (code: string) => crypto.createHash('sha256').update(code).digest('hex');

const statusOf = (r: TransferRow, now: Date): TransferDto['status'] =>
  r.redeemedAt ? 'used' : r.withdrawnAt ? 'withdrawn' : r.expiresAt <= now ? 'expired' : 'open';
const toDto = (r: TransferRow, now = new Date()): TransferDto => ({
  id: r.id,
  status: statusOf(r, now),
  expiresAt: r.expiresAt.toISOString(),
  createdAt: r.createdAt.toISOString(),
});

const codeError = (status: 400 | 404, message: string) =>
  new HttpError(status, status === 404 ? 'not_found' : 'validation_failed', status === 404 ? 'No record transfer has this code.' : 'Some fields need attention.', { code: [message] });

/** Why a code cannot be used by this company, or nothing when it can. Field-level, naming the code. */
function refusal(row: TransferRow | null, receiverId: string, now: Date): HttpError | null {
  if (!row) return codeError(404, 'No record transfer has this code. Check it with the person who gave it to you.');
  if (row.companyId === receiverId) return codeError(400, 'This code was made by your own company: the record is already yours.');
  if (row.redeemedAt) return codeError(400, 'This code has already been used. Ask for a new one.');
  if (row.withdrawnAt) return codeError(400, 'This code was withdrawn. Ask for a new one.');
  if (row.expiresAt <= now) return codeError(400, `This code has expired (codes last ${TRANSFER_CODE_DAYS} days). Ask for a new one.`);
  return null;
}

export function recordTransfersService(ctx: AppContext) {
  async function create(companyId: string, applianceId: string, made: { by: 'office' | 'homeowner'; userId: string }): Promise<CreatedTransferDto> {
    return ctx.db.transaction(async (tx) => {
      const code = transferCodeFromBytes(crypto.randomBytes(16));
      const now = new Date();
      const row = await repo.insert(tx, {
        companyId,
        applianceId,
        codeHash: hashTransferCode(code),
        madeBy: made.by,
        expiresAt: new Date(now.getTime() + TRANSFER_CODE_DAYS * 86_400_000),
        createdBy: made.userId,
      });
      await appendTimelineEvent(tx, {
        companyId,
        applianceId,
        occurredAt: row.createdAt,
        kind: 'note',
        summary: made.by === 'homeowner' ? 'The homeowner made a code to move this record to another company' : 'A code was made to move this record to another company',
        refId: row.id,
        homeownerVisible: true,
        actorId: made.userId,
      });
      await recordAudit(tx, { companyId, actorId: made.userId, action: 'create', entity: 'record_transfer', entityId: row.id, changes: { applianceId, madeBy: made.by, expiresAt: row.expiresAt } });
      return { ...toDto(row, now), code: groupTransferCode(code) };
    });
  }

  async function withdraw(companyId: string, actorId: string, row: TransferRow): Promise<TransferDto> {
    if (row.redeemedAt) throw conflict('This code has already been used: the other company has its copy.');
    return ctx.db.transaction(async (tx) => {
      const updated = (await repo.withdraw(tx, companyId, row.id, new Date())) ?? (await repo.find(tx, companyId, row.id))!;
      if (updated.redeemedAt) throw conflict('This code has already been used: the other company has its copy.');
      await recordAudit(tx, { companyId, actorId, action: 'withdraw', entity: 'record_transfer', entityId: row.id });
      return toDto(updated);
    });
  }

  return {
    async createAsOffice(actor: Member, applianceId: string) {
      if (!(await repo.applianceExists(ctx.db, actor.companyId, applianceId))) throw notFound('Appliance');
      return create(actor.companyId, applianceId, { by: 'office', userId: actor.userId });
    },
    async createAsHomeowner(me: Homeowner, applianceId: string) {
      await requireOwnAppliance(ctx, me, applianceId);
      return create(me.companyId, applianceId, { by: 'homeowner', userId: me.userId });
    },
    async list(actor: Member, applianceId: string) {
      if (!(await repo.applianceExists(ctx.db, actor.companyId, applianceId))) throw notFound('Appliance');
      const now = new Date();
      return (await repo.list(ctx.db, actor.companyId, applianceId)).map((r) => toDto(r, now));
    },
    async withdrawAsOffice(actor: Member, id: string) {
      const row = await repo.find(ctx.db, actor.companyId, id);
      if (!row) throw notFound('Record transfer');
      return withdraw(actor.companyId, actor.userId, row);
    },
    async withdrawAsHomeowner(me: Homeowner, id: string) {
      const row = await repo.find(ctx.db, me.companyId, id);
      if (!row) throw notFound('Record transfer');
      await requireOwnAppliance(ctx, me, row.applianceId).catch(() => {
        throw notFound('Record transfer');
      });
      return withdraw(me.companyId, me.userId, row);
    },

    async preview(actor: Member, code: string): Promise<TransferPreviewDto> {
      const row = await repo.findByHash(ctx.db, hashTransferCode(code));
      const refused = refusal(row, actor.companyId, new Date());
      if (refused) throw refused;
      const record = (await readTransferableRecord(ctx.db, row!.companyId, row!.applianceId))!;
      const a = record.appliance;
      return {
        senderName: await repo.companyName(ctx.db, row!.companyId),
        appliance: { kind: a.kind, label: applianceLabel(a), manufacturer: a.manufacturer, model: a.model, installedOn: a.installedOn },
        homeownerName: record.place.homeownerName,
        address: { street: record.place.street, town: record.place.town, postalCode: record.place.postalCode },
        counts: countsOf(record),
        expiresAt: row!.expiresAt.toISOString(),
      };
    },

    async redeem(actor: Member, input: Omit<TransferRedeemInput, 'code'> & { code: string }): Promise<ReceivedTransferDto> {
      const site = input.siteId ? await findSite(ctx.db, actor.companyId, input.siteId) : null;
      if (input.siteId && !site) throw notFound('Site');
      const today = await companyToday(ctx.db, actor.companyId);
      const written: string[] = [];
      try {
        return await ctx.db.transaction(async (tx) => {
          const now = new Date();
          // Locked to the end: a second redemption, even at the same moment, waits here and then finds it used.
          const row = await repo.findByHash(tx, hashTransferCode(input.code), true);
          const refused = refusal(row, actor.companyId, now);
          if (refused) throw refused;
          const senderName = await repo.companyName(tx, row!.companyId);
          const claimed = await repo.markRedeemed(tx, row!.id, { redeemedAt: now, redeemedByCompanyId: actor.companyId, senderName });
          if (!claimed) throw codeError(400, 'This code has already been used. Ask for a new one.');
          const record = await readTransferableRecord(tx, row!.companyId, row!.applianceId);
          if (!record) throw codeError(404, 'No record transfer has this code. Check it with the person who gave it to you.');
          const copy = await copyRecord(
            tx,
            ctx.storage,
            record,
            { companyId: actor.companyId, actorId: actor.userId, transferId: row!.id, senderName, receivedAt: now, today, site: site && { id: site.id, customerId: site.customerId } },
            written,
          );
          await appendTimelineEvent(tx, {
            companyId: row!.companyId,
            applianceId: row!.applianceId,
            occurredAt: now,
            kind: 'note',
            summary: 'A copy of this record went to another company with the homeowner’s consent; this company keeps its own',
            refId: row!.id,
            homeownerVisible: true,
            actorId: null,
          });
          // The sender learns that its code was used, not who used it or what became of the copy.
          await recordAudit(tx, { companyId: row!.companyId, actorId: null, action: 'transfer_sent', entity: 'record_transfer', entityId: row!.id, changes: { applianceId: row!.applianceId, counts: copy.counts } });
          return copy;
        });
      } catch (err) {
        for (const key of written) await ctx.storage.delete(key).catch((e: unknown) => ctx.logger.warn({ err: e, key }, 'could not delete a copied photo object'));
        throw err;
      }
    },
  };
}
