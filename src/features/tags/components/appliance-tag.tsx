// Placeholder until the tag screens land.
export function ApplianceTag(_props: { applianceId: string }) {
  return null;
}
