import { lazy, Suspense, type ComponentType } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import type { Permission } from '@shared/policy';
import { withErrorScreens } from './route-error';

/*
 * Everything but the router itself is lazy, so a page opened from a tag or a share link on a weak signal loads only the
 * shared vendor chunk, this file and its own chunk: no sign-in form, no shell, no office screens.
 * server/spa/route-chunks.ts names the chunks each path needs (for modulepreload and the bundle budget): keep it in step.
 */

// The record's tag and photo sections sit below its first screen: their chunks load once the record has painted.
const ApplianceChanges = lazy(async () => ({ default: (await import('@/features/change-history/components/change-history')).ApplianceChanges }));
const VisitChanges = lazy(async () => ({ default: (await import('@/features/change-history/components/change-history')).VisitChanges }));
const AppliancePhotos = lazy(async () => ({ default: (await import('@/features/photos/components/appliance-photos')).AppliancePhotos }));
const ApplianceTag = lazy(async () => ({ default: (await import('@/features/tags/components/appliance-tag')).ApplianceTag }));

/** A page in its own chunk, shown only to roles with the permission (the server enforces the same). */
function guardedPage(path: string, permission: Permission, load: () => Promise<ComponentType>): RouteObject {
  return {
    path,
    lazy: async () => {
      const [{ RequirePermission }, Page] = await Promise.all([import('./guards'), load()]);
      return {
        element: (
          <RequirePermission permission={permission}>
            <Page />
          </RequirePermission>
        ),
      };
    },
  };
}

export function createAppRouter() {
  return createBrowserRouter(withErrorScreens(appRoutes()));
}

export function appRoutes(): RouteObject[] {
  return [
    {
      path: '/sign-in',
      lazy: async () => {
        const { SignInPage } = await import('@/features/auth/components/sign-in-page');
        return { element: <SignInPage /> };
      },
    },
    // A homeowner's share link: no sign-in, its own small chunk.
    {
      path: '/s/:token',
      lazy: async () => {
        const { SharePage } = await import('@/features/homeowner/components/share-page');
        return { element: <SharePage /> };
      },
    },
    // From a reminder e-mail: no sign-in, outside the shell, its own small chunk.
    {
      path: '/unsubscribe/:token',
      lazy: async () => {
        const { UnsubscribePage } = await import('@/features/reminders/components/unsubscribe-page');
        return { element: <UnsubscribePage /> };
      },
    },
    // From a booking e-mail: "this time does not suit me", no sign-in, outside the shell, its own small chunk.
    {
      path: '/booking-reply/:token',
      lazy: async () => {
        const { BookingReplyPage } = await import('@/features/booking-reply/components/booking-reply-page');
        return { element: <BookingReplyPage /> };
      },
    },
    // Opened by anyone who scans a tag, signed in or not: the page itself decides what each person sees.
    {
      path: '/t/:code',
      lazy: async () => {
        const { TagLandingPage } = await import('@/features/tags/components/tag-landing-page');
        return { element: <TagLandingPage /> };
      },
    },
    // Where an invitation's e-mailed sign-in link lands: small, outside the office shell.
    {
      path: '/welcome/:invitationId',
      lazy: async () => {
        const { WelcomePage } = await import('@/features/invitations/components/welcome-page');
        return { element: <WelcomePage /> };
      },
    },
    {
      lazy: async () => {
        const { SignedInLayout } = await import('./signed-in-layout');
        return { element: <SignedInLayout /> };
      },
      children: [
        {
          index: true,
          lazy: async () => {
            const { HomePage } = await import('./pages/home');
            return { element: <HomePage /> };
          },
        },
        {
          path: 'waiting',
          lazy: async () => {
            const { WaitingPage } = await import('./pages/waiting');
            return { element: <WaitingPage /> };
          },
        },
        guardedPage('team', 'records:read', async () => (await import('@/features/team/components/team-page')).TeamPage),
        guardedPage('settings', 'company:settings', async () => (await import('@/features/company/components/company-settings-page')).CompanySettingsPage),
        guardedPage('appliances/new', 'records:write', async () => (await import('@/features/customers/components/new-appliance-page')).NewAppliancePage),
        guardedPage('appliances/:id', 'records:read', async () => {
          const { ApplianceRecordPage } = await import('@/features/appliance-record/components/appliance-record-page');
          return function ApplianceRecordWithSections() {
            return (
              <ApplianceRecordPage
                slots={{
                  photos: (id) => (
                    <Suspense fallback={null}>
                      <AppliancePhotos applianceId={id} />
                    </Suspense>
                  ),
                  tag: (id) => (
                    <Suspense fallback={null}>
                      <ApplianceTag applianceId={id} />
                    </Suspense>
                  ),
                  changes: (id) => (
                    <Suspense fallback={null}>
                      <ApplianceChanges applianceId={id} />
                    </Suspense>
                  ),
                }}
              />
            );
          };
        }),
        guardedPage('appliances/:id/radiation-survey', 'records:read', async () => (await import('@/features/radiation-survey/components/survey-page')).RadiationSurveyPage),
        guardedPage('appliances/:id/radiation-survey/proposal', 'records:read', async () => (await import('@/features/radiation-survey/components/proposal-page')).ProposalPage),
        guardedPage('visits/:id', 'records:read', async () => {
          const [{ VisitPage }, { VisitPhotos }] = await Promise.all([
            import('@/features/visits/components/visit-page'),
            import('@/features/photos/components/appliance-photos'),
          ]);
          return function VisitWithPhotos() {
            return (
              <VisitPage
                slots={{
                  photos: (applianceId, visitId) => <VisitPhotos applianceId={applianceId} visitId={visitId} />,
                  changes: (applianceId, visitId) => (
                    <Suspense fallback={null}>
                      <VisitChanges applianceId={applianceId} visitId={visitId} />
                    </Suspense>
                  ),
                }}
              />
            );
          };
        }),
        guardedPage('customers', 'records:read', async () => (await import('@/features/customers/components/customers-page')).CustomersPage),
        guardedPage('customers/new', 'records:write', async () => (await import('@/features/customers/components/new-customer-page')).NewCustomerPage),
        guardedPage('customers/:id', 'records:read', async () => (await import('@/features/customers/components/customer-detail-page')).CustomerDetailPage),
        guardedPage('week', 'bookings:plan', async () => (await import('@/features/bookings/components/week-board-page')).WeekBoardPage),
        guardedPage('book', 'bookings:book', async () => (await import('@/features/bookings/components/book-page')).BookPage),
        guardedPage('round', 'bookings:read', async () => (await import('@/features/bookings/components/round-page')).RoundPage),
        guardedPage('due', 'records:read', async () => (await import('@/features/due/components/due-list-page')).DueListPage),
        guardedPage('scan', 'records:read', async () => (await import('@/features/tags/components/scan-page')).ScanPage),
        guardedPage('tags', 'catalog:manage', async () => (await import('@/features/tags/components/tag-batches-page')).TagBatchesPage),
        guardedPage('service-requests', 'records:read', async () => (await import('@/features/service-requests/components/service-requests-page')).ServiceRequestsPage),
        guardedPage('outbox', 'dev:outbox', async () => (await import('@/features/reminders/components/outbox-page')).OutboxPage),
        guardedPage('receive', 'records:transfer', async () => (await import('@/features/record-transfers/components/receive-record-page')).ReceiveRecordPage),
        guardedPage('imports', 'records:import', async () => (await import('@/features/imports/components/imports-page')).ImportsPage),
        guardedPage('catalog', 'catalog:manage', async () => (await import('@/features/catalog/components/catalog-page')).CatalogPage),
        {
          path: 'my/:id',
          lazy: async () => {
            const [{ RequireHomeowner }, { MyAppliancePage }] = await Promise.all([
              import('./guards'),
              import('@/features/homeowner/components/my-appliances-page'),
            ]);
            return { element: <RequireHomeowner><MyAppliancePage /></RequireHomeowner> };
          },
        },
        {
          path: '*',
          lazy: async () => {
            const { NotFoundPage } = await import('./pages/not-found');
            return { element: <NotFoundPage /> };
          },
        },
      ],
    },
  ];
}

export type AppRouter = ReturnType<typeof createAppRouter>;
