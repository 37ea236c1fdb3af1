/**
 * Where the offline copy lives in the browser: IndexedDB database, object
 * store and key (also read by the browser tests, which inspect and corrupt
 * it). The key names the stored layout: a change to the layout changes the
 * key, so an old entry is simply not found.
 */
export const COPY_LOCATION = { database: 'headwater-offline', store: 'copies', key: 'network-copy/1' } as const;
