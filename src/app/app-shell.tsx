import { NavLink, Outlet } from 'react-router-dom';
import { useEffect, useState } from 'react';
import { LogoMark } from '@/components/ui/logo-mark';
import { useMe } from '@/lib/auth';
import { ROLE_LABELS } from '@shared/schemas/roles';
import { can } from '@shared/policy';
import { useNewServiceRequestCount } from '@/features/service-requests/api/list-service-requests';
import { navFor } from './nav';
import { PhoneNav } from './phone-nav';
import { OfflineBanner } from './offline/offline-banner';
import { SignOutButton } from './sign-out-button';

/** Dim follows the device's colour scheme until the user presses the button; that choice is kept on the device. */
function useDimMode() {
  const [dim, setDimState] = useState(() => {
    const stored = localStorage.getItem('lifeplate:dim');
    if (stored === '1' || stored === '0') return stored === '1';
    return window.matchMedia?.('(prefers-color-scheme: dark)').matches ?? false;
  });
  useEffect(() => {
    document.documentElement.classList.toggle('dim', dim);
  }, [dim]);
  const setDim = (next: boolean) => {
    localStorage.setItem('lifeplate:dim', next ? '1' : '0');
    setDimState(next);
  };
  return [dim, setDim] as const;
}

export function AppShell() {
  const me = useMe();
  const [dim, setDim] = useDimMode();
  const principal = me.data?.principal;
  // The development outbox exists only beside the local mail fake, for the owner; /me says so.
  const outbox = Boolean(me.data?.devOutbox) && can(principal, 'dev:outbox');
  const newRequests = useNewServiceRequestCount(can(principal, 'records:read')).data ?? 0;
  const nav = navFor(principal);
  // The mail fake's outbox is a development tool: a small link by the user's name, never in the main navigation.
  const devLinks = outbox ? [{ to: '/outbox', label: 'Outbox (dev)' }] : [];
  // A homeowner has one place to go (their boilers), reached from the logo; the bar is for the team.
  const phoneNav = principal?.kind === 'member';
  const roleLabel = principal?.kind === 'member' ? ROLE_LABELS[principal.role] : principal?.kind === 'homeowner' ? 'Homeowner' : '';

  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="no-print sr-only rounded-plate bg-surface px-4 py-3 font-semibold text-iron focus:not-sr-only focus:fixed focus:left-2 focus:top-2 focus:z-50"
      >
        Skip to content
      </a>
      <header className="no-print sticky top-0 z-10 bg-header text-header-text">
        <div className="mx-auto flex max-w-5xl items-center gap-3 px-3 py-2 sm:px-6">
          <NavLink to="/" className="flex min-h-tap items-center gap-2 font-bold" aria-label="Lifeplate home">
            <LogoMark />
            <span className="text-lg">Lifeplate</span>
          </NavLink>
          <span className="hidden truncate text-sm text-header-text/70 sm:inline">{me.data?.company?.name}</span>
          <div className="ml-auto flex items-center gap-1">
            <button
              type="button"
              onClick={() => setDim(!dim)}
              aria-pressed={dim}
              className="min-h-tap min-w-tap rounded-plate px-2 text-sm hover:bg-header-soft"
              title="Basement mode: dark, high contrast"
            >
              {dim ? '☀ Light' : '◐ Dim'}
            </button>
            <SignOutButton className="min-h-tap rounded-plate px-3 text-sm font-semibold hover:bg-header-soft" />
          </div>
        </div>
        <nav aria-label="Main" className="mx-auto hidden max-w-5xl gap-1 overflow-x-auto px-2 pb-1 sm:flex sm:px-5">
          {nav.map((item) => (
            <NavLink
              key={item.to}
              to={item.to}
              end={item.to === '/'}
              className={({ isActive }) =>
                `flex min-h-tap items-center whitespace-nowrap rounded-t-plate px-3 font-semibold ${isActive ? 'bg-plate text-iron' : 'text-header-text/85 hover:bg-header-soft'}`
              }
            >
              {item.label}
              {item.to === '/service-requests' && newRequests > 0 && (
                <span className="ml-1.5 rounded-full bg-brass px-2 text-sm text-iron" aria-label={`${newRequests} new`}>
                  {newRequests}
                </span>
              )}
            </NavLink>
          ))}
          <span className="ml-auto hidden items-center gap-3 px-2 text-sm text-header-text/70 sm:flex">
            {devLinks.map((l) => (
              <NavLink key={l.to} to={l.to} className="underline">
                {l.label}
              </NavLink>
            ))}
            {me.data?.user.name} · {roleLabel}
          </span>
        </nav>
      </header>
      <main id="main" tabIndex={-1} className={`flex-1 focus:outline-none ${phoneNav ? 'pb-20 sm:pb-0' : ''}`}>
        <OfflineBanner />
        <Outlet />
      </main>
      {phoneNav && <PhoneNav items={nav} extra={devLinks} />}
    </div>
  );
}
