import { Page } from '@/components/ui/page';

export function NoRolePage() {
  return (
    <Page title="Your account has no access yet">
      <p>You are signed in, but no company has given this account a role. Ask your service company to invite you, or sign out.</p>
    </Page>
  );
}
