import { QueryClient } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactElement } from 'react';
import { vi } from 'vitest';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router';
import { AppProvider } from '@/app/provider';

export function createTestQueryClient() {
  return new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
}

/** Renders routes in memory with the app's providers and a fresh query cache. */
export function renderRoutes(routes: RouteObject[], initialPath = '/') {
  const queryClient = createTestQueryClient();
  const router = createMemoryRouter(routes, { initialEntries: [initialPath] });
  const user = userEvent.setup();
  const view = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { ...view, user, router, queryClient };
}

export function renderWithProviders(ui: ReactElement, initialPath = '/') {
  return renderRoutes([{ path: '*', element: ui }], initialPath);
}

export interface FakeResponse {
  status?: number;
  body?: unknown;
}

/** Replaces fetch with a table of answers keyed by "METHOD /api/path". */
export function stubApi(answers: Record<string, FakeResponse | ((body: unknown) => FakeResponse)>) {
  const calls: { key: string; body: unknown; headers: Record<string, string> }[] = [];
  const fetchStub = async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.pathname : input.url;
    const key = `${init.method ?? 'GET'} ${url}`;
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push({ key, body, headers: (init.headers ?? {}) as Record<string, string> });
    const answer = answers[key];
    if (!answer) return new Response(JSON.stringify({ statusCode: 404, message: `No stub for ${key}` }), { status: 404 });
    const { status = 200, body: responseBody } = typeof answer === 'function' ? answer(body) : answer;
    return new Response(status === 204 ? null : JSON.stringify(responseBody), {
      status,
      headers: { 'Content-Type': 'application/json' },
    });
  };
  vi.stubGlobal('fetch', fetchStub);
  return calls;
}
