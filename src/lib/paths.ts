/** Every client URL, typed once. Use `paths.x.path` in the router and `paths.x.href(...)` in links. */
export const paths = {
  home: { path: '/', href: () => '/' },
  signIn: {
    path: '/signin',
    href: (returnTo?: string) => (returnTo ? `/signin?returnTo=${encodeURIComponent(returnTo)}` : '/signin'),
  },
  signedOut: { path: '/signed-out', href: () => '/signed-out' },
  scan: { path: '/scan', href: () => '/scan' },
  motors: { path: '/motors', href: () => '/motors' },
  motorRecord: { path: '/motors/:serial', href: (serial: string) => `/motors/${encodeURIComponent(serial)}` },
  lots: { path: '/lots', href: () => '/lots' },
  lot: { path: '/lots/:code', href: (code: string) => `/lots/${encodeURIComponent(code)}` },
  controlCharts: { path: '/control-charts', href: () => '/control-charts' },
  signals: { path: '/signals', href: () => '/signals' },
  signal: { path: '/signals/:id', href: (id: string) => `/signals/${encodeURIComponent(id)}` },
  evidencePacks: { path: '/evidence-packs', href: () => '/evidence-packs' },
  auditTrail: { path: '/audit', href: () => '/audit' },
  yieldBoard: { path: '/yield', href: () => '/yield' },
  setup: { path: '/setup', href: () => '/setup' },
} as const;

/** Server-side auth endpoints: reached by full-page navigation, never by fetch. */
export const authPaths = {
  login: (returnTo: string) => `/auth/login?returnTo=${encodeURIComponent(returnTo)}`,
  logout: () => '/auth/logout',
} as const;

/** Accept only same-origin paths as a return target, so a crafted link cannot send users elsewhere. */
export function safeReturnTo(candidate: string | null | undefined): string {
  if (!candidate || !candidate.startsWith('/') || candidate.startsWith('//')) return paths.home.href();
  if (candidate.startsWith(paths.signIn.path) || candidate.startsWith(paths.signedOut.path)) return paths.home.href();
  return candidate;
}
