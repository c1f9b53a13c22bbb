import { PhotosPanel } from './photos-panel';

/** The photos section of an appliance's life record, folded below its first screen. */
export function AppliancePhotos({ applianceId }: { applianceId: string }) {
  return <PhotosPanel title="Photos" applianceId={applianceId} folded />;
}

/** The same section narrowed to one visit: uploads are filed under the visit, the grid shows only its photos. */
export function VisitPhotos({ applianceId, visitId }: { applianceId: string; visitId: string }) {
  return <PhotosPanel title="Photos from this visit" applianceId={applianceId} visitId={visitId} />;
}
