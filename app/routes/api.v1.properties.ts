// POST /api/v1/properties: a SectionInput in, every section property out (engine contract).
// `units: "us"` means the lengths sent are inches and the properties come back in in-based
// units; the response's `units` block says which unit each field is in (api-properties.ts).
import { requireApiUser } from "~/lib/auth.server";
import { API_ENGINE_COST } from "~/lib/api-rate-limit.server";
import { DEFAULT_JSON_LIMIT, readJson } from "~/lib/forms.server";
import { describeFieldError, type FieldError } from "~/lib/bench-state";
import type { UnitSystem } from "~/optimizer/units";
import { propertiesAnswer } from "~/lib/api-properties";
import { runOnEngineThread } from "~/workers/engine-thread.server";

/** 400 with every issue (path, field, message) and a one-line summary that names the field. */
function invalid(issues: FieldError[]): Response {
  return Response.json({ error: `invalid section: ${issues.map(describeFieldError).join("; ")}`, issues }, { status: 400 });
}

const METHOD_NOT_ALLOWED = () =>
  Response.json({ error: "use POST with a JSON SectionInput" }, { status: 405, headers: { Allow: "POST" } });

export async function loader() {
  return METHOD_NOT_ALLOWED();
}

export async function action({ request }: { request: Request }) {
  if (request.method !== "POST") return METHOD_NOT_ALLOWED();
  await requireApiUser(request, "read", API_ENGINE_COST);
  const body = await readJson(request, DEFAULT_JSON_LIMIT);
  if (typeof body !== "object" || body === null || Array.isArray(body)) {
    return Response.json({ error: "body must be a JSON object (a SectionInput)", issues: [] }, { status: 400 });
  }
  const { units: rawUnits, ...input } = body as Record<string, unknown>;
  if (rawUnits !== undefined && rawUnits !== "si" && rawUnits !== "us") {
    return invalid([{ path: ["units"], field: "units", message: 'units must be "si" or "us"' }]);
  }
  const units: UnitSystem = rawUnits ?? "si";
  // Checking and integrating a polygon section can take tens of milliseconds: off the event loop.
  const answer = await runOnEngineThread("sectionProperties", input, units);
  if (!answer.ok) return invalid(answer.errors);
  return propertiesAnswer(answer.properties, units);
}
