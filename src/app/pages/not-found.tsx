import { Link } from 'react-router-dom';
import { Page } from '@/components/ui/page';

export function NotFoundPage() {
  return (
    <Page title="Page not found">
      <p>There is nothing at this address. The link may be mistyped, or the record may have been removed.</p>
      <Link className="font-semibold text-brass-dark underline" to="/">
        Go to your home page
      </Link>
    </Page>
  );
}
