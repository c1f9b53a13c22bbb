import { Link } from 'react-router-dom';
import { Page } from '@/components/ui/page';

export function NotAllowedPage() {
  return (
    <Page title="Not available to your role">
      <p>Your account can't open this page. If you need it, ask your company's owner or service manager.</p>
      <Link className="font-semibold text-brass-dark underline" to="/">
        Go to your home page
      </Link>
    </Page>
  );
}
