/**
 * Every route of the planner in one place. Screens link with `paths.x.getHref(...)`, the router
 * registers `paths.x.path`; no route string is written anywhere else.
 */
export const paths = {
  signIn: {
    path: '/sign-in',
    getHref: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  /** Pages of the e-mailed links and the reset request (outside the app shell, no sign-in). */
  welcome: { path: '/welcome', getHref: (token: string) => `/welcome?token=${encodeURIComponent(token)}` },
  resetPassword: { path: '/reset-password', getHref: (token: string) => `/reset-password?token=${encodeURIComponent(token)}` },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  home: { path: '/', getHref: () => '/' },
  changePassword: { path: '/account/password', getHref: () => '/account/password' },
  caughtMail: { path: '/dev/mail', getHref: (id?: string) => (id ? `/dev/mail?message=${encodeURIComponent(id)}` : '/dev/mail') },
  products: { path: '/products', getHref: () => '/products' },
  productNew: { path: '/products/new', getHref: () => '/products/new' },
  product: { path: '/products/:productId', getHref: (id: number | string) => `/products/${id}` },
  workCenters: { path: '/work-centers', getHref: () => '/work-centers' },
  workCenterNew: { path: '/work-centers/new', getHref: () => '/work-centers/new' },
  workCenter: { path: '/work-centers/:workCenterId', getHref: (id: number | string) => `/work-centers/${id}` },
  materials: { path: '/materials', getHref: () => '/materials' },
  materialNew: { path: '/materials/new', getHref: () => '/materials/new' },
  material: { path: '/materials/:materialId', getHref: (id: number | string) => `/materials/${id}` },
  demand: { path: '/demand', getHref: () => '/demand' },
  settings: { path: '/settings', getHref: () => '/settings' },
  people: { path: '/people', getHref: () => '/people' },
  mail: { path: '/mail', getHref: () => '/mail' },
  imports: { path: '/imports', getHref: () => '/imports' },
  plans: { path: '/plans', getHref: () => '/plans' },
  planNew: { path: '/plans/new', getHref: () => '/plans/new' },
  planCompare: {
    path: '/plans/compare',
    getHref: (a?: number, b?: number) => (a && b ? `/plans/compare?a=${a}&b=${b}` : a ? `/plans/compare?a=${a}` : '/plans/compare'),
  },
  plan: { path: '/plans/:planId', getHref: (id: number | string) => `/plans/${id}` },
  planResults: { path: '/plans/:planId/results', getHref: (id: number | string) => `/plans/${id}/results` },
  planReview: { path: '/plans/:planId/review', getHref: (id: number | string) => `/plans/${id}/review` },
  scenarios: { path: '/scenarios', getHref: () => '/scenarios' },
  scenarioNew: { path: '/scenarios/new', getHref: () => '/scenarios/new' },
  scenario: { path: '/scenarios/:scenarioId', getHref: (id: number | string) => `/scenarios/${id}` },
  shiftSheets: {
    path: '/shift-sheets',
    getHref: (plan?: number, week?: string, workCenter?: string) => withQuery('/shift-sheets', { plan, week, workCenter }),
  },
  /** The sheets laid out for paper (outside the app shell); also what the API prints to PDF. */
  printShiftSheets: {
    path: '/print/shift-sheets/:planId',
    getHref: (planId: number, week: string, workCenter?: string, paper?: 'a4' | 'letter') => withQuery(`/print/shift-sheets/${planId}`, { week, workCenter, paper }),
  },
} as const;

function withQuery(path: string, params: Record<string, string | number | undefined>): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== '') q.set(k, String(v));
  const text = q.toString();
  return text ? `${path}?${text}` : path;
}

export type PathId = keyof typeof paths;
