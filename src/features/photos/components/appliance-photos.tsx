// Placeholder until the photo screens land.
export function AppliancePhotos(_props: { applianceId: string }) {
  return null;
}
