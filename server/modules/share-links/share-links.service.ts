import crypto from 'node:crypto';
import type { AppContext } from '../../context';
import { notFound } from '../../lib/http-error';
import type { CreatedShareLinkDto, ShareLinkDto } from '../../../shared/schemas/homeowner';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { buildHomeownerView } from '../homeowner';
import { shareLinksRepository as repo } from './share-links.repository';
import { hashShareToken as hash, resolveShareToken } from './resolve-share-token';

type Row = NonNullable<Awaited<ReturnType<typeof repo.find>>>;
type Member = { companyId: string; userId: string };

/** 32 random bytes (256 bits), base64url: far past the 128 bits a capability URL needs. Only its hash is stored. */
const newToken = () => crypto.randomBytes(32).toString('base64url');

const statusOf = (r: Row, now = new Date()): ShareLinkDto['status'] => (r.revokedAt ? 'revoked' : r.expiresAt <= now ? 'expired' : 'active');
const toDto = (r: Row): ShareLinkDto => ({
  id: r.id,
  label: r.label,
  createdAt: r.createdAt.toISOString(),
  expiresAt: r.expiresAt.toISOString(),
  revokedAt: r.revokedAt?.toISOString() ?? null,
  status: statusOf(r),
});

export function shareLinksService(ctx: AppContext) {
  return {
    async create(actor: Member, applianceId: string, input: { expiresInDays: number; label?: string | null }): Promise<CreatedShareLinkDto> {
      return ctx.db.transaction(async (tx) => {
        if (!(await repo.applianceExists(tx, actor.companyId, applianceId))) throw notFound('Appliance');
        const token = newToken();
        const row = await repo.insert(tx, {
          companyId: actor.companyId,
          applianceId,
          tokenHash: hash(token),
          label: input.label ?? null,
          expiresAt: new Date(Date.now() + input.expiresInDays * 86_400_000),
          createdBy: actor.userId,
        });
        await appendTimelineEvent(tx, {
          companyId: actor.companyId,
          applianceId,
          occurredAt: row.createdAt,
          kind: 'note',
          summary: `Share link made for the homeowner${input.label ? ` (${input.label})` : ''}`,
          refId: row.id,
          homeownerVisible: false,
          actorId: actor.userId,
        });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'create', entity: 'share_link', entityId: row.id, changes: { applianceId, expiresAt: row.expiresAt } });
        return { ...toDto(row), url: `${ctx.config.BASE_URL}/s/${token}` };
      });
    },
    async list(actor: Member, applianceId: string) {
      if (!(await repo.applianceExists(ctx.db, actor.companyId, applianceId))) throw notFound('Appliance');
      return (await repo.list(ctx.db, actor.companyId, applianceId)).map(toDto);
    },
    async revoke(actor: Member, id: string) {
      return ctx.db.transaction(async (tx) => {
        const existing = await repo.find(tx, actor.companyId, id);
        if (!existing) throw notFound('Share link');
        const row = existing.revokedAt ? existing : (await repo.revoke(tx, actor.companyId, id, actor.userId))!;
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'revoke', entity: 'share_link', entityId: id });
        return toDto(row);
      });
    },
    /** Unknown tokens answer 404; expired or revoked ones 410, and neither says anything about the appliance. */
    async open(token: string) {
      const row = await resolveShareToken(ctx.db, token);
      return buildHomeownerView(ctx.db, row.companyId, row.applianceId);
    },
  };
}
