// The answer of POST /api/v1/properties: the engine's SectionProperties in the asked unit system,
// with a `units` block naming the unit of every field, and plain numbers (plain-numbers.ts).
//
// Field names that carry a unit say so truthfully in both systems (issue 11, item 13): the engine's
// `massPerMetre` is answered as `massPerLength`, because under "us" it is in lb/ft, not per metre;
// the `units` block gives kg/m or lb/ft. Every other field name is unit-free (area, Iz, …).
import type { SectionProperties } from "~/optimizer";
import { PROPERTY_QUANTITIES, STABILITY_QUANTITIES, UNITS, type Quantity, type UnitSystem } from "~/optimizer/units";
import { plainJson } from "~/lib/plain-numbers";

/** Engine field → the API's name for it, where they differ. */
export const API_FIELD_NAMES: Record<string, string> = { massPerMetre: "massPerLength" };

const apiName = (field: string) => API_FIELD_NAMES[field] ?? field;

/** Which unit each quantity and each field of the answer is in, so an API client never guesses. */
export function unitsBlock(system: UnitSystem) {
  const all = { ...PROPERTY_QUANTITIES, ...STABILITY_QUANTITIES };
  const used = new Set<Quantity>([...Object.values(all), "density"]);
  const quantities = Object.fromEntries([...used].map((q) => [q, UNITS[q][system]]));
  const fields = Object.fromEntries(Object.entries(all).map(([k, q]) => [apiName(k), UNITS[q][system]]));
  return { system, quantities, fields };
}

/** The properties under the API's field names, in the engine's order. */
export function apiProperties(p: SectionProperties): Record<string, unknown> {
  return Object.fromEntries(Object.entries(p).map(([k, v]) => [apiName(k), v]));
}

export function propertiesAnswer(p: SectionProperties, system: UnitSystem): Response {
  return plainJson({ units: unitsBlock(system), properties: apiProperties(p) });
}
