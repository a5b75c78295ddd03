import { cleanup, render } from '@testing-library/react';
import type { ReactElement } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { afterEach, vi } from 'vitest';
import { AppProviders } from '../app/providers';
import { resetCsrfToken } from '../lib/api-client';
import { createQueryClient } from '../lib/query-client';

afterEach(() => {
  cleanup();
  resetCsrfToken();
  vi.unstubAllGlobals();
});

/** Renders routes inside the app's providers with a fresh query client, starting at `path`. */
export function renderRoutes(routes: RouteObject[], path: string) {
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const queryClient = createQueryClient();
  const utils = render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { ...utils, router, queryClient };
}

/** Renders one element at `/` with the providers and a router around it. */
export function renderWithApp(element: ReactElement, path = '/') {
  return renderRoutes([{ path: '*', element }], path);
}
