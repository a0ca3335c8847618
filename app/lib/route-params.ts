/**
 * A row id from a URL segment, or NaN when the segment is not a plain positive integer that fits
 * MariaDB's INT UNSIGNED ids. Callers look the row up in the user's team and answer 404 on NaN, so a
 * malformed id and another team's id look the same.
 */
export function idParam(raw: string | undefined): number {
  return raw !== undefined && /^[1-9]\d{0,9}$/.test(raw) && Number(raw) <= 2 ** 31 - 1 ? Number(raw) : NaN;
}
