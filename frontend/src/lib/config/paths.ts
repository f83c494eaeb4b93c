const withQuery = (path: string, query: Record<string, string | undefined>) => {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  const search = params.toString();
  return search ? `${path}?${search}` : path;
};

export const paths = {
  home: { path: '/', getHref: () => '/' },

  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string) => withQuery('/sign-in', { redirectTo: redirectTo === '/' ? undefined : redirectTo }),
  },
  acceptInvitation: {
    path: '/accept-invitation',
    getHref: (token: string) => withQuery('/accept-invitation', { token }),
  },
  changePassword: { path: '/account/password', getHref: () => '/account/password' },

  studies: { path: '/studies', getHref: () => '/studies' },
  studyNew: { path: '/studies/new', getHref: () => '/studies/new' },
  studyEdit: {
    path: '/studies/:studyId/edit',
    getHref: (studyId: string, step?: number) =>
      withQuery(`/studies/${encodeURIComponent(studyId)}/edit`, { step: step ? String(step) : undefined }),
  },
  runs: { path: '/runs', getHref: () => '/runs' },
  runNew: { path: '/runs/new', getHref: (query: { versionId?: string; from?: string } = {}) => withQuery('/runs/new', query) },
  runControlChart: { path: '/runs/control-chart', getHref: (versionId?: string) => withQuery('/runs/control-chart', { versionId }) },
  runDetail: { path: '/runs/:runId', getHref: (runId: string) => `/runs/${encodeURIComponent(runId)}` },
  reviews: { path: '/reviews', getHref: () => '/reviews' },
  studyView: { path: '/studies/:studyId', getHref: (studyId: string) => `/studies/${encodeURIComponent(studyId)}` },
  methods: { path: '/methods', getHref: () => '/methods' },
  methodDetail: { path: '/methods/:methodId', getHref: (methodId: string) => `/methods/${encodeURIComponent(methodId)}` },
  methodComparison: { path: '/methods/compare', getHref: () => '/methods/compare' },
  verify: { path: '/verify', getHref: () => '/verify' },
  referenceMaterials: { path: '/standards', getHref: () => '/standards' },
  preparations: { path: '/standards/preparations', getHref: () => '/standards/preparations' },
  preparationNew: { path: '/standards/preparations/new', getHref: () => '/standards/preparations/new' },
  auditTrail: {
    path: '/audit-trail',
    /** `record` is kind:id, e.g. study:<id>; the trail screen then shows that record's trail only. */
    getHref: (query: { record?: string } = {}) => withQuery('/audit-trail', query),
  },
  qualification: { path: '/qualification', getHref: () => '/qualification' },

  users: { path: '/admin/users', getHref: () => '/admin/users' },
  outbox: { path: '/admin/outbox', getHref: () => '/admin/outbox' },
  outboxMessage: {
    path: '/admin/outbox/:messageId',
    getHref: (messageId: string) => `/admin/outbox/${encodeURIComponent(messageId)}`,
  },
} as const;

/** Only same-site paths may be used after sign-in, never another origin. */
export function safeRedirectTarget(redirectTo: string | null): string {
  if (!redirectTo || !redirectTo.startsWith('/') || redirectTo.startsWith('//') || redirectTo.startsWith('/\\')) {
    return paths.home.getHref();
  }
  return redirectTo;
}
