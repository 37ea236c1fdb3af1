/** API paths, shared so that SWR keys on the client and routes on the server agree. */
export const api = {
  health: '/api/health',
  login: '/api/auth/login',
  me: '/api/auth/me',
  logout: '/api/auth/logout',
  ownPassword: '/api/auth/password',
  users: '/api/users',
  user: (id: number | string) => `/api/users/${encodeURIComponent(String(id))}`,
  userPassword: (id: number | string) => `/api/users/${encodeURIComponent(String(id))}/password`,
  audit: '/api/audit',
  summary: '/api/network/summary',
  importNetwork: '/api/network/import',
  importProgress: (id: string) => `/api/network/import/progress/${encodeURIComponent(id)}`,
  exportNetwork: '/api/network/export',
  /** the diagram's columns (shared/schemas/drawing.ts) */
  networkDrawing: '/api/network/drawing',
  list: (kind: string) => `/api/${kind}`,
  entity: (kind: string, code: string) => `/api/${kind}/${encodeURIComponent(code)}`,
  deleteImpact: (kind: string, code: string) => `/api/${kind}/${encodeURIComponent(code)}/impact`,
  history: (kind: string, code: string, page = 1) => `/api/${kind}/${encodeURIComponent(code)}/history?page=${page}`,
  sources: (carriage: string, q = '') => `/api/carriages/${encodeURIComponent(carriage)}/sources${q ? `?q=${encodeURIComponent(q)}` : ''}`,
  chain: (code: string, direction: 'up' | 'down') => `/api/carriages/${encodeURIComponent(code)}/chain?direction=${direction}`,
  reach: '/api/analysis/reach',
  /** a page of the sites a failure set touches (POST, body: the set) */
  reachSites: '/api/analysis/reach/sites',
  /** a page of the carriages a failure set takes off air or onto a reserve (POST, body: the set) */
  reachCarriages: (state: 'lost' | 'fallback') => `/api/analysis/reach/carriages?state=${state}`,
  spof: '/api/analysis/spof',
  exposure: (limit?: number) => `/api/analysis/exposure${limit ? `?limit=${limit}` : ''}`,
  /** kinds: comma-separated element kinds; format csv for the file */
  exposureGroups: (q: { limit?: number; kinds?: string; format?: 'csv' } = {}) =>
    `/api/analysis/exposure-groups?${[q.limit ? `limit=${q.limit}` : '', q.kinds ? `kinds=${q.kinds}` : '', q.format ? `format=${q.format}` : ''].filter(Boolean).join('&')}`,
  carriageSearch: (q: string, pageSize: number) => `/api/analysis/carriage-search?q=${encodeURIComponent(q)}&pageSize=${pageSize}`,
  /** the same lists as spreadsheet files */
  csv: {
    diversity: '/api/analysis/diversity?format=csv',
    unfed: '/api/analysis/unfed?format=csv',
    checks: '/api/checks?format=csv',
  },
  diversity: '/api/analysis/diversity',
  unfed: '/api/analysis/unfed',
  proposals: (q: { carriage?: string; limit?: number } = {}) =>
    `/api/analysis/proposals${q.carriage || q.limit ? '?' : ''}${[q.carriage ? `carriage=${encodeURIComponent(q.carriage)}` : '', q.limit ? `limit=${q.limit}` : ''].filter(Boolean).join('&')}`,
  pairs: (limit: number, kinds: string, sample?: number) => `/api/analysis/pairs?limit=${limit}&kinds=${kinds}${sample === undefined ? '' : `&sample=${sample}`}`,
  plans: '/api/analysis/plans',
  plan: (id: string) => `/api/analysis/plans/${encodeURIComponent(id)}`,
  planAnswer: (id: string, answer: 'exposure' | 'diversity' | 'unfed') => `/api/analysis/plans/${encodeURIComponent(id)}/${answer}`,
  applyPlan: (id: string) => `/api/analysis/plans/${encodeURIComponent(id)}/apply`,
  feedChecks: (code: string) => `/api/feeds/${encodeURIComponent(code)}/checks`,
  checks: (severity?: string) => `/api/checks${severity ? `?severity=${severity}` : ''}`,
  works: '/api/works',
  work: (code: string) => `/api/works/${encodeURIComponent(code)}`,
  workApprove: (code: string) => `/api/works/${encodeURIComponent(code)}/approve`,
  workTransition: (code: string) => `/api/works/${encodeURIComponent(code)}/transition`,
  incidents: '/api/incidents',
  incident: (code: string) => `/api/incidents/${encodeURIComponent(code)}`,
  incidentUpdates: (code: string) => `/api/incidents/${encodeURIComponent(code)}/updates`,
  availability: '/api/reports/availability',
  documents: (kind: string, code: string) => `/api/${kind}/${encodeURIComponent(code)}/documents`,
  document: (kind: string, code: string, id: number) => `/api/${kind}/${encodeURIComponent(code)}/documents/${id}`,
  documentPreview: (kind: string, code: string, id: number) => `/api/${kind}/${encodeURIComponent(code)}/documents/${id}/preview`,
  subscriptions: '/api/subscriptions',
  contacts: '/api/contacts',
  contact: (id: number) => `/api/contacts/${id}`,
  notices: '/api/notices',
  mailbox: '/api/mailbox',
  unsubscribe: '/api/unsubscribe',
} as const;

export const ROLES = ['admin', 'engineer', 'operator', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** Who may do what (docs/architecture.md, Auth). The server declares these on every route. */
export const can = {
  read: ['admin', 'engineer', 'operator', 'viewer'] as Role[],
  analyse: ['admin', 'engineer', 'operator', 'viewer'] as Role[],
  editNetwork: ['admin', 'engineer'] as Role[],
  manageUsers: ['admin'] as Role[],
  /** draft planned work, open and update incidents */
  operate: ['admin', 'engineer', 'operator'] as Role[],
  /** approve planned work (never one's own request, unless admin) */
  approveWork: ['admin', 'engineer'] as Role[],
  /** documents on sites, feeds, incidents and works: the desk photographs a site during a fault */
  editDocuments: ['admin', 'engineer', 'operator'] as Role[],
  /** one's own notice subscription: every signed-in person */
  subscribe: ['admin', 'engineer', 'operator', 'viewer'] as Role[],
  /** outside contacts, the notices sent, the local mailbox */
  manageNotices: ['admin'] as Role[],
};

export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown };
}
