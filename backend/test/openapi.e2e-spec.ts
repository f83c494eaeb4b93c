import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app.js';

interface Operation {
  parameters?: { in: string; name: string }[];
  requestBody?: unknown;
  responses: Record<string, { content?: Record<string, { schema?: unknown }> }>;
  security?: unknown[];
}
type Document = { paths: Record<string, Record<string, Operation>>; components?: { schemas?: Record<string, unknown> } };

const METHODS = ['get', 'post', 'put', 'patch', 'delete'];

function operations(document: Document): { route: string; operation: Operation }[] {
  return Object.entries(document.paths).flatMap(([path, item]) =>
    METHODS.filter((method) => item[method]).map((method) => ({ route: `${method.toUpperCase()} ${path}`, operation: item[method] })),
  );
}

function refsIn(value: unknown, found = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((item) => refsIn(item, found));
  else if (value && typeof value === 'object') {
    for (const [key, inner] of Object.entries(value)) {
      if (key === '$ref' && typeof inner === 'string') found.add(inner);
      else refsIn(inner, found);
    }
  }
  return found;
}

/** The routes that serve without a session (`@Public()`); every other route must say it needs one. */
const PUBLIC_ROUTES = [
  'GET /api/health',
  'POST /api/auth/login',
  'POST /api/auth/accept-invitation',
  'POST /api/auth/password-reset',
  'POST /api/auth/password-reset/confirm',
  'POST /api/auth/unlock/confirm',
  'POST /api/reports/verify',
];

/** Every file sent to the report check gets a verdict; only a missing or oversized file is refused. */
const NO_FIELD_REFUSALS = new Set(['POST /api/reports/verify']);

const missing = (routes: { route: string; operation: Operation }[], test: (operation: Operation) => boolean) =>
  routes.filter(({ operation }) => !test(operation)).map(({ route }) => route);

describe('OpenAPI description', () => {
  let t: TestApp;
  let routes: { route: string; operation: Operation }[];
  let document: Document;

  beforeAll(async () => {
    t = await createTestApp();
    document = (await t.http().get('/api/docs-json').expect(200)).body as Document;
    routes = operations(document);
  });
  afterAll(() => t.close());

  it('describes the routes of every controller', () => {
    expect(routes.length).toBeGreaterThan(80);
    expect(document.paths['/api/runs/{id}'].get.responses['200'].content?.['application/json'].schema).toEqual({
      $ref: '#/components/schemas/RunResponseDto',
    });
  });

  it('declares 429 on every throttled route (all but the health check)', () => {
    const throttled = routes.filter(({ route }) => route !== 'GET /api/health');
    expect(missing(throttled, ({ responses }) => '429' in responses)).toEqual([]);
  });

  it('gives every route a success answer with a body schema or a media type (204 has no body)', () => {
    expect(
      missing(routes, ({ responses }) =>
        Object.entries(responses).some(
          ([status, response]) =>
            status.startsWith('2') &&
            (status === '204' || Object.values(response.content ?? {}).some((media) => media.schema !== undefined)),
        ),
      ),
    ).toEqual([]);
  });

  it('declares 401 and 403 on every route that needs a signed-in user', () => {
    const signedIn = routes.filter(({ operation }) => (operation.security ?? []).length > 0);
    expect(routes.filter((route) => !signedIn.includes(route)).map(({ route }) => route)).toEqual(expect.arrayContaining(PUBLIC_ROUTES));
    expect(routes.length - signedIn.length).toBe(PUBLIC_ROUTES.length);
    expect(missing(signedIn, ({ responses }) => '401' in responses && '403' in responses)).toEqual([]);
  });

  it('declares 422 on every route that takes a body or a query, and 404 on every route addressed by a path parameter', () => {
    const withInput = routes.filter(
      ({ operation }) => operation.requestBody !== undefined || (operation.parameters ?? []).some((p) => p.in === 'query'),
    );
    expect(missing(withInput, ({ responses }) => '422' in responses).filter((route) => !NO_FIELD_REFUSALS.has(route))).toEqual([]);
    expect(
      missing(
        routes.filter(({ route }) => NO_FIELD_REFUSALS.has(route)),
        ({ responses }) => '400' in responses,
      ),
    ).toEqual([]);
    const withPath = routes.filter(({ operation }) => (operation.parameters ?? []).some((p) => p.in === 'path'));
    expect(missing(withPath, ({ responses }) => '404' in responses)).toEqual([]);
  });

  it('describes every error with the one error body', () => {
    const errors = routes.flatMap(({ route, operation }) =>
      Object.entries(operation.responses)
        .filter(([status]) => status.startsWith('4'))
        .map(([status, response]) => ({ route: `${route} ${status}`, schema: response.content?.['application/json']?.schema })),
    );
    expect(errors.filter(({ schema }) => (schema as { $ref?: string } | undefined)?.$ref !== '#/components/schemas/ApiErrorDto')).toEqual(
      [],
    );
  });

  it('references no schema it does not define', () => {
    const defined = new Set(Object.keys(document.components?.schemas ?? {}).map((name) => `#/components/schemas/${name}`));
    expect([...refsIn(document)].filter((ref) => !defined.has(ref))).toEqual([]);
  });
});
