// Numbers as the API and the CSV files give them (issue 11, item 13): without binary float noise
// such as 13.624999999999998 (a sum of steps, a unit conversion). Each non-integer is rounded to
// PLAIN_DIGITS significant digits: the noise sits in the 16th–17th digit, and no dimension,
// property or utilisation the engine reports carries meaning past the 12th, so the rounding
// changes nothing a reader could use. Integers, NaN-free by the engine's contract, pass as they are.
export const PLAIN_DIGITS = 12;

export function plainNumber(x: number): number {
  if (!Number.isFinite(x) || Number.isInteger(x)) return x;
  return Number(x.toPrecision(PLAIN_DIGITS));
}

/** A copy of a JSON-shaped value with every number made plain (strings, booleans, nulls kept). */
export function plainNumbers<T>(value: T): T {
  if (typeof value === "number") return plainNumber(value) as T;
  if (Array.isArray(value)) return value.map(plainNumbers) as T;
  if (value !== null && typeof value === "object" && !(value instanceof Date)) {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = plainNumbers(v);
    return out as T;
  }
  return value;
}

/** Response.json with plain numbers: what every API answer that carries figures goes through. */
export function plainJson(body: unknown, init?: ResponseInit): Response {
  return Response.json(plainNumbers(body), init);
}
