/** Every client route, with a builder for its links. */
export const paths = {
  signIn: {
    path: '/sign-in',
    getHref: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  home: { path: '/', getHref: () => '/' },
  conversions: { path: '/conversions', getHref: () => '/conversions' },
  conversion: {
    path: '/conversions/:conversionId',
    getHref: (id: number | string) => `/conversions/${id}`,
  },
  conversionPins: {
    path: '/conversions/:conversionId/pins',
    getHref: (id: number | string) => `/conversions/${id}/pins`,
  },
  conversionFeeds: {
    path: '/conversions/:conversionId/feeds',
    getHref: (id: number | string) => `/conversions/${id}/feeds`,
  },
  conversionWires: {
    path: '/conversions/:conversionId/wires',
    getHref: (id: number | string, wireId?: number) =>
      `/conversions/${id}/wires${wireId ? `?wire=${wireId}` : ''}`,
  },
  conversionBox: {
    path: '/conversions/:conversionId/box',
    getHref: (id: number | string) => `/conversions/${id}/box`,
  },
  conversionCircuit: {
    path: '/conversions/:conversionId/circuits/:kind/:refId',
    getHref: (id: number | string, kind: 'feed' | 'pin', refId: number | string) =>
      `/conversions/${id}/circuits/${kind}/${refId}`,
  },
  conversionChecks: {
    path: '/conversions/:conversionId/checks',
    getHref: (id: number | string, focus?: string) =>
      `/conversions/${id}/checks${focus ? `#${encodeURIComponent(focus)}` : ''}`,
  },
  conversionFiles: {
    path: '/conversions/:conversionId/files',
    getHref: (id: number | string) => `/conversions/${id}/files`,
  },
  conversionRevisions: {
    path: '/conversions/:conversionId/revisions',
    getHref: (id: number | string) => `/conversions/${id}/revisions`,
  },
  conversionRevision: {
    path: '/conversions/:conversionId/revisions/:number',
    getHref: (id: number | string, number: number | string) =>
      `/conversions/${id}/revisions/${number}`,
  },
  conversionBench: {
    path: '/conversions/:conversionId/bench',
    getHref: (id: number | string) => `/conversions/${id}/bench`,
  },
  conversionHistory: {
    path: '/conversions/:conversionId/history',
    getHref: (id: number | string) => `/conversions/${id}/history`,
  },
  calculator: { path: '/calculator', getHref: () => '/calculator' },
  library: { path: '/library', getHref: () => '/library' },
  outbox: { path: '/admin/mail', getHref: () => '/admin/mail' },
  setPassword: { path: '/set-password', getHref: () => '/set-password' },
  users: { path: '/admin/users', getHref: () => '/admin/users' },
  settings: { path: '/admin/settings', getHref: () => '/admin/settings' },
  account: { path: '/account', getHref: () => '/account' },
  help: { path: '/help', getHref: (section?: string) => (section ? `/help#${section}` : '/help') },
} as const;
