import crypto from 'node:crypto';
import type { AppContext } from '../../context';
import { forbidden, HttpError, notFound, validationFailed } from '../../lib/http-error';
import { can } from '../../../shared/policy';
import type { Principal } from '../../../shared/schemas/roles';
import { PHOTO_KIND_LABELS, type PhotoDto, type PhotoUploadDto, type PhotoUploadFields } from '../../../shared/schemas/photos';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { photoDto } from './photo-dto';
import { processImage, type ProcessedImage } from './process-image';
import { photosRepository as repo, type PhotoRowWithAuthor } from './photos.repository';
import { findAppliance } from '../../core/tenant-finders';

type Member = Extract<Principal, { kind: 'member' }>;
export type UploadedFile = { originalname: string; buffer: Buffer };
export type PhotoVariant = 'display' | 'thumb';

/** One variant of a stored photo: its ETag and a loader for its bytes (404 when the object is gone). */
export type PhotoImage = { etag: string; load: () => ReturnType<AppContext['storage']['get']> };

export function photosService(ctx: AppContext) {
  function imageOf(photo: { sha256: string; displayKey: string; thumbKey: string }, variant: PhotoVariant): PhotoImage {
    const key = variant === 'display' ? photo.displayKey : photo.thumbKey;
    return {
      etag: `"${photo.sha256}-${variant}"`,
      load: () =>
        ctx.storage.get(key).catch((err: unknown) => {
          if ((err as { name?: string }).name === 'NoSuchKey') throw notFound('Photo');
          throw err;
        }),
    };
  }
  /** The visit and part, when given, must be this company's and on this appliance. */
  async function checkSlot(actor: Member, fields: PhotoUploadFields) {
    if (!(await findAppliance(ctx.db, actor.companyId, fields.applianceId))) throw notFound('Appliance');
    if (fields.visitId) {
      const visit = await repo.findVisit(ctx.db, actor.companyId, fields.visitId);
      if (!visit) throw notFound('Visit');
      if (visit.applianceId !== fields.applianceId) throw validationFailed({ visitId: ['This visit is on another appliance.'] });
    }
    if (fields.componentId) {
      const part = await repo.findComponent(ctx.db, actor.companyId, fields.componentId);
      if (!part) throw notFound('Part');
      if (part.applianceId !== fields.applianceId) throw validationFailed({ componentId: ['This part is on another appliance.'] });
    }
    return { applianceId: fields.applianceId, visitId: fields.visitId ?? null, componentId: fields.componentId ?? null };
  }

  async function deleteQuietly(keys: string[]) {
    for (const key of keys) {
      try {
        await ctx.storage.delete(key);
      } catch (err) {
        // The orphan sweeper removes it later.
        ctx.logger.warn({ err, key }, 'could not delete an orphaned photo object');
      }
    }
  }

  async function store(actor: Member, fields: PhotoUploadFields, slot: Awaited<ReturnType<typeof checkSlot>>, image: ProcessedImage, bytes: number) {
    // Keys are made here, never from the file name, so an upload cannot choose where it lands.
    const base = `${actor.companyId}/${slot.applianceId}/${crypto.randomUUID()}`;
    const keys = { display: `${base}-display.jpg`, thumb: `${base}-thumb.jpg` };
    const written: string[] = [];
    try {
      await ctx.storage.put(keys.display, image.display.body, image.display.contentType);
      written.push(keys.display);
      await ctx.storage.put(keys.thumb, image.thumb.body, image.thumb.contentType);
      written.push(keys.thumb);
      const row = await ctx.db.transaction(async (tx) => {
        const inserted = await repo.insert(tx, {
          companyId: actor.companyId,
          ...slot,
          kind: fields.kind,
          caption: fields.caption ?? null,
          homeownerVisible: fields.homeownerVisible,
          sha256: image.sha256,
          width: image.width,
          height: image.height,
          displayKey: keys.display,
          thumbKey: keys.thumb,
          bytes,
          createdBy: actor.userId,
        });
        if (!inserted) return null;
        await appendTimelineEvent(tx, {
          companyId: actor.companyId,
          applianceId: slot.applianceId,
          occurredAt: inserted.createdAt,
          kind: 'photo',
          summary: `${PHOTO_KIND_LABELS[fields.kind]} photo added${fields.caption ? `: ${fields.caption}` : ''}`,
          refId: inserted.id,
          data: { photo: { kind: fields.kind, visitId: slot.visitId, componentId: slot.componentId } },
          homeownerVisible: fields.homeownerVisible,
          actorId: actor.userId,
        });
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'create',
          entity: 'photo',
          entityId: inserted.id,
          changes: { ...slot, kind: fields.kind, caption: fields.caption ?? null, homeownerVisible: fields.homeownerVisible, sha256: image.sha256 },
        });
        return inserted;
      });
      if (row) return { photo: photoDto({ ...row, createdByName: null }), duplicate: false };
    } catch (err) {
      await deleteQuietly(written);
      throw err;
    }
    // Another request stored the same file first: keep theirs, drop ours.
    await deleteQuietly(written);
    const existing = await repo.findSameFile(ctx.db, actor.companyId, slot, image.sha256);
    if (!existing) throw new HttpError(409, 'conflict', 'This photo was changed while it was being saved. Send it again.');
    return { photo: photoDto(existing), duplicate: true };
  }

  return {
    async upload(actor: Member, fields: PhotoUploadFields, files: UploadedFile[]): Promise<{ result: PhotoUploadDto; created: boolean }> {
      const slot = await checkSlot(actor, fields);
      if (!files.length) throw validationFailed({ files: ['Add at least one photo.'] });
      // Every file is proven an image before anything is stored, so a bad one in a batch stores nothing.
      const images: ProcessedImage[] = [];
      for (const file of files) {
        try {
          images.push(await processImage(file.buffer));
        } catch (err) {
          if (err instanceof HttpError) throw new HttpError(err.status, err.code, err.message, { files: [`${file.originalname}: ${err.message}`] }, [{ file: file.originalname, reason: err.message }]);
          throw err;
        }
      }
      const out: PhotoUploadDto['photos'] = [];
      for (const [i, image] of images.entries()) {
        const existing = await repo.findSameFile(ctx.db, actor.companyId, slot, image.sha256);
        const stored = existing ? { photo: photoDto(existing), duplicate: true } : await store(actor, fields, slot, image, files[i].buffer.length);
        out.push({ ...stored.photo, duplicate: stored.duplicate });
      }
      return { result: { photos: out }, created: out.some((p) => !p.duplicate) };
    },

    async list(actor: Member, applianceId: string): Promise<PhotoDto[]> {
      if (!(await findAppliance(ctx.db, actor.companyId, applianceId))) throw notFound('Appliance');
      return (await repo.list(ctx.db, actor.companyId, applianceId)).map(photoDto);
    },

    /** Members who may read records; a homeowner only their own appliance's photos marked for them. Otherwise 404. */
    async image(principal: Principal | null | undefined, id: string, variant: PhotoVariant) {
      if (!principal) throw notFound('Photo');
      if (principal.kind === 'member' && !can(principal, 'records:read')) throw forbidden();
      const photo = await repo.find(ctx.db, principal.companyId, id);
      if (!photo) throw notFound('Photo');
      if (principal.kind === 'homeowner' && !(photo.homeownerVisible && principal.customerIds.includes(photo.customerId))) throw notFound('Photo');
      return imageOf(photo, variant);
    },

    /** A photo of this appliance marked for the homeowner (share link or homeowner account); anything else is 404. */
    async homeownerImage(at: { companyId: string; applianceId: string }, id: string, variant: PhotoVariant) {
      const photo = await repo.find(ctx.db, at.companyId, id);
      if (!photo || photo.applianceId !== at.applianceId || !photo.homeownerVisible) throw notFound('Photo');
      return imageOf(photo, variant);
    },

    async update(actor: Member, id: string, patch: { caption?: string | null; homeownerVisible?: boolean }): Promise<PhotoDto> {
      const updated = await ctx.db.transaction(async (tx) => {
        const before = await repo.find(tx, actor.companyId, id);
        if (!before) throw notFound('Photo');
        const row = await repo.update(tx, actor.companyId, id, patch);
        if (!row) throw notFound('Photo');
        if (patch.homeownerVisible !== undefined) await repo.setTimelineVisibility(tx, actor.companyId, id, patch.homeownerVisible);
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'update',
          entity: 'photo',
          entityId: id,
          changes: { before: { caption: before.caption, homeownerVisible: before.homeownerVisible }, after: patch },
        });
        return { ...row, createdByName: before.createdByName } satisfies PhotoRowWithAuthor;
      });
      return photoDto(updated);
    },
  };
}
