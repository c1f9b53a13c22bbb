import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { useMe } from '@/lib/auth';
import { Spinner } from '@/components/ui/page';
import { can, type Permission } from '@shared/policy';
import { NotAllowedPage } from './pages/not-allowed';

export function RequireSignIn({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending && me.fetchStatus === 'paused') {
    return (
      <p role="status" className="mx-auto max-w-md p-6 font-semibold">
        No signal. This phone has nothing saved for you yet: sign-in and the first look at your round need signal once.
      </p>
    );
  }
  if (me.isPending) return <Spinner />;
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  return children;
}

/** Hides what a role may not use; the server enforces the same table on every route. */
export function RequirePermission({ permission, children }: { permission: Permission; children: ReactNode }) {
  const me = useMe();
  if (!can(me.data?.principal, permission)) return <NotAllowedPage />;
  return children;
}

export function RequireHomeowner({ children }: { children: ReactNode }) {
  const me = useMe();
  if (me.data?.principal?.kind !== 'homeowner') return <NotAllowedPage />;
  return children;
}
