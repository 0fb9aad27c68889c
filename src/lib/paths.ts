/**
 * Every path the client knows, in one place: the pages (`paths`, for links, navigations and the router's
 * patterns) and the server's endpoints (`apiPaths`, for the API client). Ids may be numbers or, for the
 * router's patterns, `:param` strings.
 */
type Id = number | string;

const query = (q: URLSearchParams) => (q.size ? `?${q}` : '');

/** Client routes. */
export const paths = {
  home: () => '/',
  signIn: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  setup: () => '/setup',
  resetRequest: () => '/reset',
  resetConfirm: (token: string) => `/reset/${token}`,
  invitation: (token: string) => `/invitation/${token}`,
  outbox: () => '/admin/outbox',
  /** the signed-in user's own account: password and sessions */
  account: () => '/account',
  production: (pid: Id) => {
    const base = `/p/${pid}`;
    return {
      root: () => base,
      team: () => `${base}/team`,
      looks: () => `${base}/looks`,
      compare: (ids?: readonly number[]) => `${base}/looks/compare${ids ? `?ids=${ids.join(',')}` : ''}`,
      sheet: (lookId: Id) => `${base}/looks/${lookId}/sheet`,
      /** the bench; `'new'` opens an empty look, no id lets the page pick the first look */
      bench: (lookId?: Id) => (lookId === undefined ? `${base}/bench` : `${base}/bench/${lookId}`),
      library: () => `${base}/library`,
      /** the swatches page; `swatchId` opens that swatch */
      swatches: (swatchId?: Id) => (swatchId === undefined ? `${base}/swatches` : `${base}/swatches?swatch=${swatchId}`),
      boards: () => `${base}/boards`,
      board: (id: Id) => `${base}/boards/${id}`,
      photos: () => `${base}/photos`,
      /** the gaffer's lamp plan; `lookId` starts it from that look's EI, camera and shadow threshold */
      lampPlan: (lookId?: Id) => (lookId === undefined ? `${base}/lamp-plan` : `${base}/lamp-plan?look=${lookId}`),
      /** the production's activity log (owners) */
      activity: () => `${base}/activity`,
    };
  },
};

/** A production's pages, as `paths.production(pid)` answers them. */
export type ProductionPaths = ReturnType<typeof paths.production>;

/** Server endpoints. */
export const apiPaths = {
  auth: {
    csrf: () => '/api/auth/csrf',
    me: () => '/api/auth/me',
    signIn: () => '/api/auth/sign-in',
    signOut: () => '/api/auth/sign-out',
    setup: () => '/api/auth/setup',
    resetRequest: () => '/api/auth/reset/request',
    resetConfirm: () => '/api/auth/reset/confirm',
    /** POST { currentPassword, newPassword }: change the signed-in user's password */
    password: () => '/api/auth/password',
    /** GET: the signed-in user's sessions */
    sessions: () => '/api/auth/sessions',
    /** DELETE: end one of them (by its opaque id) */
    session: (id: string) => `/api/auth/sessions/${encodeURIComponent(id)}`,
    /** POST: end every session but this one */
    endOtherSessions: () => '/api/auth/sessions/end-others',
  },
  invitation: (token: string) => {
    const base = `/api/invitations/${encodeURIComponent(token)}`;
    return { root: () => base, accept: () => `${base}/accept` };
  },
  library: () => '/api/library',
  /** POST: a light path and swatches → tones (stops before key placement) */
  simulate: () => '/api/simulate',
  /** POST: the colour nearest a given one that lands on a zone (or stops) through a light path */
  shade: () => '/api/shade',
  /** POST: lamps by intensity and distance against the level an EI and T-stop need, key-to-fill against the shadow threshold */
  lightPlan: () => '/api/light-plan',
  upsampleTable: () => '/api/library/upsample-table',
  outbox: () => '/api/admin/outbox',
  productions: () => '/api/productions',
  production: (pid: number) => {
    const base = `/api/productions/${pid}`;
    return {
      root: () => base,
      members: () => `${base}/members`,
      member: (id: number) => `${base}/members/${id}`,
      invitations: () => `${base}/invitations`,
      invitation: (id: number) => `${base}/invitations/${id}`,
      looks: () => `${base}/looks`,
      analyseLook: () => `${base}/looks/analyse`,
      look: (id: number) => ({
        root: () => `${base}/looks/${id}`,
        duplicate: () => `${base}/looks/${id}/duplicate`,
        analysis: () => `${base}/looks/${id}/analysis`,
        sheet: () => `${base}/looks/${id}/sheet`,
        sheetPdf: () => `${base}/looks/${id}/sheet.pdf`,
        /** GET: the look as a monitoring table for download (`format` cube | clf, `size` 17..65) */
        lut: (q: { format: 'cube' | 'clf'; size: number }) => `${base}/looks/${id}/lut${query(new URLSearchParams({ format: q.format, size: String(q.size) }))}`,
      }),
      curves: () => `${base}/curves`,
      curve: (id: number) => `${base}/curves/${id}`,
      boards: () => `${base}/boards`,
      board: (id: number) => ({
        root: () => `${base}/boards/${id}`,
        tones: (q: URLSearchParams = new URLSearchParams()) => `${base}/boards/${id}/tones${query(q)}`,
      }),
      swatches: () => `${base}/swatches`,
      /** POST multipart (`file`, `department`, `boardId`): one measured swatch per sample of a CGATS.17 file */
      swatchImport: () => `${base}/swatches/import`,
      /** the same upload, answered with what would be added; writes nothing */
      swatchImportPreview: () => `${base}/swatches/import/preview`,
      swatch: (id: number) => ({
        root: () => `${base}/swatches/${id}`,
        tones: () => `${base}/swatches/${id}/tones`,
        duplicate: () => `${base}/swatches/${id}/duplicate`,
      }),
      photos: () => `${base}/photos`,
      photo: (id: number) => ({
        root: () => `${base}/photos/${id}`,
        renders: () => `${base}/photos/${id}/renders`,
        render: (key: string) => `${base}/photos/${id}/renders/${key}`,
      }),
      photoLooks: () => `${base}/photo-looks`,
      /** POST: start (or find) a look's uncertainty table for the photos overlay; GET …/:key polls it */
      photoUncertainty: () => `${base}/photo-uncertainty`,
      photoUncertaintyStatus: (key: string) => `${base}/photo-uncertainty/${encodeURIComponent(key)}`,
      /** GET (owners): the activity log, newest first; `before` an entry id, `limit` 1..200, filters `kind` and `actor` (a user id) */
      activity: (q: { before?: number; limit?: number; kind?: string; actor?: number } = {}) =>
        `${base}/activity${query(new URLSearchParams(Object.entries(q).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)])))}`,
    };
  },
};
