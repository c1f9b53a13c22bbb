import { createBrowserRouter } from 'react-router-dom';
import { AppShell } from './app-shell';
import { RequirePermission, RequireSignIn } from './guards';
import { NotFoundPage } from './pages/not-found';
import { HomePage } from './pages/home';
import { SignInPage } from '@/features/auth/components/sign-in-page';

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
        {
          path: 'team',
          lazy: async () => {
            const { TeamPage } = await import('@/features/team/components/team-page');
            return { element: <RequirePermission permission="records:read"><TeamPage /></RequirePermission> };
          },
        },
        {
          path: 'settings',
          lazy: async () => {
            const { CompanySettingsPage } = await import('@/features/company/components/company-settings-page');
            return { element: <RequirePermission permission="company:settings"><CompanySettingsPage /></RequirePermission> };
          },
        },
        {
          path: 'appliances/new',
          lazy: async () => {
            const { NewAppliancePage } = await import('@/features/customers/components/new-appliance-page');
            return { element: <RequirePermission permission="records:write"><NewAppliancePage /></RequirePermission> };
          },
        },
        {
          path: 'appliances/:id',
          lazy: async () => {
            const { ApplianceRecordPage } = await import('@/features/appliance-record/components/appliance-record-page');
            return { element: <RequirePermission permission="records:read"><ApplianceRecordPage /></RequirePermission> };
          },
        },
        {
          path: 'visits/:id',
          lazy: async () => {
            const { VisitPage } = await import('@/features/visits/components/visit-page');
            return { element: <RequirePermission permission="records:read"><VisitPage /></RequirePermission> };
          },
        },
        {
          path: 'customers',
          lazy: async () => {
            const { CustomersPage } = await import('@/features/customers/components/customers-page');
            return { element: <RequirePermission permission="records:read"><CustomersPage /></RequirePermission> };
          },
        },
        {
          path: 'customers/new',
          lazy: async () => {
            const { NewCustomerPage } = await import('@/features/customers/components/new-customer-page');
            return { element: <RequirePermission permission="records:write"><NewCustomerPage /></RequirePermission> };
          },
        },
        {
          path: 'customers/:id',
          lazy: async () => {
            const { CustomerDetailPage } = await import('@/features/customers/components/customer-detail-page');
            return { element: <RequirePermission permission="records:read"><CustomerDetailPage /></RequirePermission> };
          },
        },
        {
          path: 'catalog',
          lazy: async () => {
            const { CatalogPage } = await import('@/features/catalog/components/catalog-page');
            return { element: <RequirePermission permission="catalog:manage"><CatalogPage /></RequirePermission> };
          },
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
