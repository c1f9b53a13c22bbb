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
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
