// The option's section drawing as an SVG file download (see app/lib/section-svg.ts).
import type { Route } from "./+types/options.$optionId.section[.]svg";
import { requirePermission } from "~/lib/auth.server";
import { getOption } from "~/lib/options.server";
import { idParam } from "~/lib/route-params";
import { sectionSvg } from "~/lib/section-svg";
import { familyLabel } from "~/lib/labels";
import type { SectionInput } from "~/optimizer/schema";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const option = await getOption(user.teamId, idParam(params.optionId));
  const c = option.candidate;
  const section = { family: c.family, ...c.dimensions, density: option.problem.density } as SectionInput;
  let svg: string;
  try {
    svg = sectionSvg(section, { units: option.units, title: `Option ${option.id}, ${familyLabel(c.family)} — ${option.projectName}` });
  } catch (e) {
    return new Response(`No drawing: ${e instanceof Error ? e.message : "the saved section is not valid"}\n`, { status: 422, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  }
  return new Response(svg, {
    headers: { "Content-Type": "image/svg+xml; charset=utf-8", "Content-Disposition": `attachment; filename="option-${option.id}-section.svg"`, "Cache-Control": "no-store" },
  });
}
