import { isRouteErrorResponse, Link, useRouteError, type RouteObject } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Page } from '@/components/ui/page';

/** A chunk that did not arrive (no signal) reads differently from a bug in a screen. */
const isLoadFailure = (e: unknown) => e instanceof Error && /dynamically imported module|Importing a module script failed|error loading/i.test(e.message);

/** Shown instead of a screen that failed to load or draw: what happened in plain words, and a way back. */
export function RouteError() {
  const error = useRouteError();
  const missing = isRouteErrorResponse(error) && error.status === 404;
  const title = missing ? 'Page not found' : isLoadFailure(error) ? 'This screen did not load' : 'This screen could not be shown';
  const text = missing
    ? 'There is nothing at this address. The link may be mistyped, or the record may have been removed.'
    : isLoadFailure(error)
      ? 'Part of the app could not be fetched, perhaps for lack of signal. Try again once you have a connection.'
      : 'Something went wrong while drawing this screen. What was already saved is kept. Try again, or go back to your home page.';
  return (
    <Page title={title}>
      <p>{text}</p>
      <div className="flex flex-wrap items-center gap-3">
        {!missing && <Button onClick={() => window.location.reload()}>Try again</Button>}
        <Link className="font-semibold text-brass-dark underline" to="/">
          Go to your home page
        </Link>
      </div>
    </Page>
  );
}

/** Every route gets the error screen, so an error in one page shows there (inside the shell) instead of a blank screen. */
export function withErrorScreens(routes: RouteObject[]): RouteObject[] {
  return routes.map((r) => {
    const children = r.children ? withErrorScreens(r.children) : undefined;
    return { ...r, errorElement: r.errorElement ?? <RouteError />, ...(children ? { children } : {}) } as RouteObject;
  });
}
