import { AppShell } from './app-shell';
import { RequireSignIn } from './guards';
import { OfflineSession } from './offline/offline-session';

/** The header, navigation and sign-in check of every member and homeowner screen, loaded with the first of them. */
export function SignedInLayout() {
  return (
    <RequireSignIn>
      <OfflineSession />
      <AppShell />
    </RequireSignIn>
  );
}
