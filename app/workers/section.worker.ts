// The section bench's engine, off the main thread: typing stays responsive while a polygon
// with many vertices is integrated. Same engine code as the server (app/optimizer), wrapped
// with comlink. Also usable by any page that wants a live preview of one section.
import * as Comlink from "comlink";
import { isEngineInputError } from "~/optimizer/errors";
import { sectionStresses, type StressResult } from "~/optimizer/stress";
import type { ParsedSectionInput } from "~/optimizer/schema";
import type { UnitSystem } from "~/optimizer/units";
import { parseSectionInput, type FieldError } from "~/lib/bench-state";

export interface SectionRequest {
  /** a SectionInput in `units` (lengths mm or in) */
  input: unknown;
  units: UnitSystem;
  /** SI: kN·m sagging positive, kN */
  Mz: number;
  V: number;
}

export type SectionResponse =
  | { ok: true; section: ParsedSectionInput; stress: StressResult; ms: number }
  | { ok: false; errors: FieldError[] };

export function analyseSection(req: SectionRequest): SectionResponse {
  const t0 = performance.now();
  const parsed = parseSectionInput(req.input, req.units);
  if (!parsed.ok) return parsed;
  try {
    const stress = sectionStresses(parsed.input, { Mz: req.Mz, V: req.V });
    return { ok: true, section: parsed.input, stress, ms: performance.now() - t0 };
  } catch (e) {
    if (isEngineInputError(e)) return { ok: false, errors: [{ path: [e.field], field: e.field, message: e.message }] };
    throw e;
  }
}

const api = { analyseSection };
export type SectionWorkerApi = typeof api;

// Only inside a worker: importing this module elsewhere (tests) must not try to listen.
const scope = globalThis as unknown as { WorkerGlobalScope?: abstract new () => unknown };
if (typeof scope.WorkerGlobalScope === "function" && globalThis instanceof scope.WorkerGlobalScope) {
  Comlink.expose(api);
}
