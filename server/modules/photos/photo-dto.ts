import type { PhotoDto } from '../../../shared/schemas/photos';
import type { PhotoRowWithAuthor } from './photos.repository';

export const photoDto = (p: PhotoRowWithAuthor): PhotoDto => ({
  id: p.id,
  applianceId: p.applianceId,
  visitId: p.visitId,
  componentId: p.componentId,
  kind: p.kind,
  caption: p.caption,
  homeownerVisible: p.homeownerVisible,
  sha256: p.sha256,
  width: p.width,
  height: p.height,
  bytes: p.bytes,
  createdAt: p.createdAt.toISOString(),
  createdByName: p.createdByName,
  displayUrl: `/api/photos/${p.id}/display`,
  thumbUrl: `/api/photos/${p.id}/thumb`,
});
