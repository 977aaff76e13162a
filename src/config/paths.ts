// Every URL the SPA links to or routes on. Routes use `path`; links use `getHref`.

function withSearch(pathname: string, search?: URLSearchParams): string {
  const query = search?.toString();
  return query ? `${pathname}?${query}` : pathname;
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  lots: { path: '/lots', getHref: (search?: URLSearchParams) => withSearch('/lots', search) },
  lot: {
    path: '/lots/:code',
    /** `priceUnit` 'lb' carries the Green Lots price unit to the lot page. */
    getHref: (code: string, priceUnit: 'kg' | 'lb' = 'kg') => `/lots/${encodeURIComponent(code)}${priceUnit === 'lb' ? '?priceUnit=lb' : ''}`,
  },
  roastingBasics: { path: '/roasting-basics', getHref: () => '/roasting-basics' },
  /** The Roasted to Order builder; its choices ride in the search (`lot`, `level`, `size`, …). */
  subscribe: { path: '/subscribe', getHref: (search?: URLSearchParams) => withSearch('/subscribe', search) },
  /** The builder's second step, where it ships; the same search carries the choices. */
  subscribeShipping: { path: '/subscribe/shipping', getHref: (search?: URLSearchParams) => withSearch('/subscribe/shipping', search) },
  subscription: {
    path: '/subscriptions/:id',
    /** `checkoutComplete`: the page the payment page returns to, which waits for the subscription to start. */
    getHref: (id: string, { checkoutComplete = false }: { checkoutComplete?: boolean } = {}) =>
      withSearch(`/subscriptions/${encodeURIComponent(id)}`, checkoutComplete ? new URLSearchParams({ checkout: 'complete' }) : undefined),
  },
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
    deliveries: { path: '/account/deliveries', getHref: () => '/account/deliveries' },
    journal: {
      path: '/account/journal',
      /** `lot`: show that lot's roasts; `log`: open the form to log a roast (of `lot`, when given). */
      getHref: ({ lot, log = false }: { lot?: string; log?: boolean } = {}) =>
        withSearch('/account/journal', lot || log ? new URLSearchParams({ ...(lot ? { lot } : {}), ...(log ? { log: '1' } : {}) }) : undefined),
    },
  },
  roastery: {
    overview: { path: '/roastery', getHref: () => '/roastery' },
    greenStock: { path: '/roastery/green-stock', getHref: () => '/roastery/green-stock' },
    newLot: { path: '/roastery/green-stock/new', getHref: () => '/roastery/green-stock/new' },
    lot: { path: '/roastery/green-stock/:code', getHref: (code: string) => `/roastery/green-stock/${encodeURIComponent(code)}` },
    orders: { path: '/roastery/orders', getHref: (search?: URLSearchParams) => withSearch('/roastery/orders', search) },
    order: { path: '/roastery/orders/:id', getHref: (id: string) => `/roastery/orders/${encodeURIComponent(id)}` },
    team: { path: '/roastery/team', getHref: () => '/roastery/team' },
    subscribers: { path: '/roastery/subscribers', getHref: (search?: URLSearchParams) => withSearch('/roastery/subscribers', search) },
    subscriber: { path: '/roastery/subscribers/:id', getHref: (id: string) => `/roastery/subscribers/${encodeURIComponent(id)}` },
    rotation: { path: '/roastery/rotation', getHref: () => '/roastery/rotation' },
    calendar: {
      path: '/roastery/calendar',
      /** `month`: YYYY-MM; the current month when left out. */
      getHref: (month?: string) => withSearch('/roastery/calendar', month ? new URLSearchParams({ month }) : undefined),
    },
    /** The Day Sheet of the shop's today: it forwards to the dated address. */
    daySheetToday: { path: '/roastery/days', getHref: () => '/roastery/days' },
    daySheet: {
      path: '/roastery/days/:date',
      /** `tab`: the Roast List unless `pack`. */
      getHref: (date: string, tab: 'roast' | 'pack' = 'roast') =>
        withSearch(`/roastery/days/${encodeURIComponent(date)}`, tab === 'pack' ? new URLSearchParams({ tab }) : undefined),
    },
    batch: { path: '/roastery/batches/:id', getHref: (id: string) => `/roastery/batches/${encodeURIComponent(id)}` },
    orderTrace: { path: '/roastery/orders/:id/trace', getHref: (id: string) => `/roastery/orders/${encodeURIComponent(id)}/trace` },
    settings: { path: '/roastery/settings', getHref: () => '/roastery/settings' },
    ledger: { path: '/roastery/ledger', getHref: () => '/roastery/ledger' },
  },
} as const;
