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
  account: {
    overview: { path: '/account', getHref: () => '/account' },
  },
  roastery: {
    overview: { path: '/roastery', getHref: () => '/roastery' },
    greenStock: { path: '/roastery/green-stock', getHref: () => '/roastery/green-stock' },
  },
} as const;
