/**
 * Which lazy modules of src/app/router.tsx each client path loads, by their source path (the key of Vite's build
 * manifest). The server preloads them; the bundle budget (bench/client/bundle.ts) counts them. Keep in step with the router.
 */
export type ClientRoute = {
  name: string;
  path: string;
  pattern: RegExp;
  /** What the first screen needs: preloaded with the HTML and counted against the bundle budget. */
  modules: readonly string[];
  /** Sections below the first screen, loaded (React.lazy) once it has painted: reported, never preloaded. */
  deferred?: readonly string[];
};

const SIGNED_IN = ['src/app/signed-in-layout.tsx', 'src/app/guards.tsx'];

export const CLIENT_ROUTES: readonly ClientRoute[] = [
  { name: 'share', path: '/s/:token', pattern: /^\/s\/([^/]+)\/?$/, modules: ['src/features/homeowner/components/share-page.tsx'] },
  {
    name: 'unsubscribe',
    path: '/unsubscribe/:token',
    pattern: /^\/unsubscribe\/([^/]+)\/?$/,
    modules: ['src/features/reminders/components/unsubscribe-page.tsx'],
  },
  {
    name: 'booking-reply',
    path: '/booking-reply/:token',
    pattern: /^\/booking-reply\/([^/]+)\/?$/,
    modules: ['src/features/booking-reply/components/booking-reply-page.tsx'],
  },
  { name: 'tag', path: '/t/:code', pattern: /^\/t\/([^/]+)\/?$/, modules: ['src/features/tags/components/tag-landing-page.tsx'] },
  {
    name: 'welcome',
    path: '/welcome/:invitationId',
    pattern: /^\/welcome\/([^/]+)\/?$/,
    modules: ['src/features/invitations/components/welcome-page.tsx'],
  },
  {
    name: 'my-appliance',
    path: '/my/:id',
    pattern: /^\/my\/([^/]+)\/?$/,
    modules: [...SIGNED_IN, 'src/features/homeowner/components/my-appliances-page.tsx'],
  },
  {
    name: 'record',
    path: '/appliances/:id',
    pattern: /^\/appliances\/([0-9a-f-]{36})\/?$/i,
    modules: [...SIGNED_IN, 'src/features/appliance-record/components/appliance-record-page.tsx'],
    deferred: [
      'src/features/photos/components/appliance-photos.tsx',
      'src/features/tags/components/appliance-tag.tsx',
      'src/features/appliance-record/components/makeup-water-section.tsx',
      'src/features/appliance-record/components/share-links-section.tsx',
      'src/features/appliance-record/components/record-transfer-section.tsx',
      'src/features/change-history/components/change-history.tsx',
    ],
  },
  {
    name: 'radiation-survey',
    path: '/appliances/:id/radiation-survey',
    pattern: /^\/appliances\/([0-9a-f-]{36})\/radiation-survey\/?$/i,
    modules: [...SIGNED_IN, 'src/features/radiation-survey/components/survey-page.tsx'],
  },
  {
    name: 'replacement-proposal',
    path: '/appliances/:id/radiation-survey/proposal',
    pattern: /^\/appliances\/([0-9a-f-]{36})\/radiation-survey\/proposal\/?$/i,
    modules: [...SIGNED_IN, 'src/features/radiation-survey/components/proposal-page.tsx'],
  },
  { name: 'home', path: '/', pattern: /^\/$/, modules: [...SIGNED_IN, 'src/app/pages/home.tsx'] },
  { name: 'sign-in', path: '/sign-in', pattern: /^\/sign-in\/?$/, modules: ['src/features/auth/components/sign-in-page.tsx'] },
];

/** Office screens: each must be a chunk of its own, never in the entry. */
export const OFFICE_SCREENS: readonly string[] = [
  'src/features/customers/components/customers-page.tsx',
  'src/features/customers/components/customer-detail-page.tsx',
  'src/features/due/components/due-list-page.tsx',
  'src/features/bookings/components/week-board-page.tsx',
  'src/features/bookings/components/book-page.tsx',
  'src/features/catalog/components/catalog-page.tsx',
  'src/features/team/components/team-page.tsx',
  'src/features/company/components/company-settings-page.tsx',
  'src/features/tags/components/tag-batches-page.tsx',
  'src/features/reminders/components/outbox-page.tsx',
  'src/features/service-requests/components/service-requests-page.tsx',
  'src/features/record-transfers/components/receive-record-page.tsx',
];

export function matchClientRoute(pathname: string): { route: ClientRoute; param: string | null } | null {
  for (const route of CLIENT_ROUTES) {
    const m = route.pattern.exec(pathname);
    if (m) return { route, param: m[1] === undefined ? null : decodeURIComponent(m[1]) };
  }
  return null;
}
