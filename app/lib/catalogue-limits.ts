// Limits the catalogue page shows and the server enforces: one number, importable by the browser
// bundle (catalogues.server.ts never reaches it).
export const CATALOGUE_NAME_MAX = 120;
