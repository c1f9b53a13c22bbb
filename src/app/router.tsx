import type { ComponentType } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import type { Permission } from '@shared/policy';
import { AppShell } from './app-shell';
import { RequirePermission, RequireSignIn } from './guards';
import { NotFoundPage } from './pages/not-found';
import { HomePage } from './pages/home';
import { SignInPage } from '@/features/auth/components/sign-in-page';

/** A page in its own chunk, shown only to roles with the permission (the server enforces the same). */
function guardedPage(path: string, permission: Permission, load: () => Promise<ComponentType>): RouteObject {
  return {
    path,
    lazy: async () => {
      const Page = await load();
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
  return createBrowserRouter([
    { path: '/sign-in', element: <SignInPage /> },
    {
      element: (
        <RequireSignIn>
          <AppShell />
        </RequireSignIn>
      ),
      children: [
        { index: true, element: <HomePage /> },
        guardedPage('team', 'records:read', async () => (await import('@/features/team/components/team-page')).TeamPage),
        guardedPage('settings', 'company:settings', async () => (await import('@/features/company/components/company-settings-page')).CompanySettingsPage),
        guardedPage('appliances/new', 'records:write', async () => (await import('@/features/customers/components/new-appliance-page')).NewAppliancePage),
        guardedPage('appliances/:id', 'records:read', async () => (await import('@/features/appliance-record/components/appliance-record-page')).ApplianceRecordPage),
        guardedPage('visits/:id', 'records:read', async () => (await import('@/features/visits/components/visit-page')).VisitPage),
        guardedPage('customers', 'records:read', async () => (await import('@/features/customers/components/customers-page')).CustomersPage),
        guardedPage('customers/new', 'records:write', async () => (await import('@/features/customers/components/new-customer-page')).NewCustomerPage),
        guardedPage('customers/:id', 'records:read', async () => (await import('@/features/customers/components/customer-detail-page')).CustomerDetailPage),
        guardedPage('due', 'records:read', async () => (await import('@/features/due/components/due-list-page')).DueListPage),
        guardedPage('catalog', 'catalog:manage', async () => (await import('@/features/catalog/components/catalog-page')).CatalogPage),
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
