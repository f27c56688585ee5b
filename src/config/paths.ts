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
  users: { path: '/admin/users', getHref: () => '/admin/users' },
  settings: { path: '/admin/settings', getHref: () => '/admin/settings' },
  account: { path: '/account', getHref: () => '/account' },
} as const;
