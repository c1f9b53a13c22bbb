import { act, cleanup, render, screen } from '@testing-library/react';
import { createMemoryRouter, Outlet, RouterProvider, type RouteObject } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { appRoutes } from '@/app/router';
import { withErrorScreens } from '@/app/route-error';

afterEach(cleanup);

function Boom(): never {
  throw new Error('a screen that cannot draw');
}

const everyRoute = (routes: RouteObject[]): RouteObject[] => routes.flatMap((r) => [r, ...everyRoute(r.children ?? [])]);

describe('error screens', () => {
  it('every route of the app has one', () => {
    const routes = everyRoute(withErrorScreens(appRoutes()));
    expect(routes.length).toBeGreaterThan(10);
    expect(routes.filter((r) => !r.errorElement).map((r) => r.path)).toEqual([]);
  });

  it('shows a plain message inside the shell instead of a blank screen, with a way back home', async () => {
    const router = createMemoryRouter(
      withErrorScreens([
        {
          path: '/',
          element: (
            <div>
              <nav>Lifeplate shell</nav>
              <Outlet />
            </div>
          ),
          children: [
            { index: true, element: <p>Home page</p> },
            { path: 'broken', element: <Boom /> },
          ],
        },
      ]),
      { initialEntries: ['/broken'] },
    );
    render(<RouterProvider router={router} />);

    expect(await screen.findByRole('heading', { name: 'This screen could not be shown' })).toBeTruthy();
    expect(screen.getByText('Lifeplate shell')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
    // React reports the caught render error on the console; that is this test's expected error, not a stray one.
    const consoleError = vi.mocked(console.error);
    expect(consoleError.mock.calls.flat().some((a) => a instanceof Error && a.message === 'a screen that cannot draw')).toBe(true);
    consoleError.mockClear();

    await act(async () => screen.getByRole('link', { name: 'Go to your home page' }).click());
    expect(await screen.findByText('Home page')).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'This screen could not be shown' })).toBeNull();
  });
});
