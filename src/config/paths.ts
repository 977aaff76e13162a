// Every URL the SPA links to or routes on. Routes use `path`; links use `getHref`.

function withSearch(pathname: string, search?: URLSearchParams): string {
  const query = search?.toString();
  return query ? `${pathname}?${query}` : pathname;
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  lots: { path: '/lots', getHref: (search?: URLSearchParams) => withSearch('/lots', search) },
  lot: { path: '/lots/:code', getHref: (code: string) => `/lots/${encodeURIComponent(code)}` },
  roastingBasics: { path: '/roasting-basics', getHref: () => '/roasting-basics' },
  subscribe: { path: '/subscribe', getHref: () => '/subscribe' },
  cart: { path: '/cart', getHref: () => '/cart' },
  checkout: { path: '/checkout', getHref: () => '/checkout' },
  order: {
    path: '/orders/:id',
    /** `checkoutComplete`: the page the payment page returns to, which waits for the payment to be confirmed. */
    getHref: (id: string, { checkoutComplete = false }: { checkoutComplete?: boolean } = {}) =>
      withSearch(`/orders/${encodeURIComponent(id)}`, checkoutComplete ? new URLSearchParams({ checkout: 'complete' }) : undefined),
  },
  signIn: {
    path: '/sign-in',
    /** `redirectTo`: the page to return to once signed in. */
    getHref: (redirectTo?: string) => withSearch('/sign-in', redirectTo ? new URLSearchParams({ redirectTo }) : undefined),
  },
  createAccount: {
    path: '/create-account',
    getHref: (redirectTo?: string) => withSearch('/create-account', redirectTo ? new URLSearchParams({ redirectTo }) : undefined),
  },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  // The two pages e-mailed links open (the server builds them from `@shared/schemas/auth`; a test
  // keeps both in step). The token rides in the fragment (`#token=…`), which no server ever sees.
  resetPassword: { path: '/reset-password', getHref: () => '/reset-password' },
  join: { path: '/join', getHref: () => '/join' },
  account: {
    overview: { path: '/account', getHref: () => '/account' },
    profile: { path: '/account/profile', getHref: () => '/account/profile' },
    addresses: { path: '/account/addresses', getHref: () => '/account/addresses' },
    orders: { path: '/account/orders', getHref: () => '/account/orders' },
  },
  roastery: {
    overview: { path: '/roastery', getHref: () => '/roastery' },
    greenStock: { path: '/roastery/green-stock', getHref: () => '/roastery/green-stock' },
    newLot: { path: '/roastery/green-stock/new', getHref: () => '/roastery/green-stock/new' },
    lot: { path: '/roastery/green-stock/:code', getHref: (code: string) => `/roastery/green-stock/${encodeURIComponent(code)}` },
    orders: { path: '/roastery/orders', getHref: (search?: URLSearchParams) => withSearch('/roastery/orders', search) },
    order: { path: '/roastery/orders/:id', getHref: (id: string) => `/roastery/orders/${encodeURIComponent(id)}` },
    team: { path: '/roastery/team', getHref: () => '/roastery/team' },
  },
} as const;
