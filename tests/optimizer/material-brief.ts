// A small I-beam brief built from what a material preset fills, shared by the preset tests:
// they check the filled values always make a brief the search schema accepts.
import type { SearchProblemInput } from "~/optimizer/search-schema";
import type { presetFill } from "~/optimizer/materials";

export function briefFromFill(f: ReturnType<typeof presetFill>): SearchProblemInput {
  return {
    moment: { sagging: 100 },
    shear: 50,
    allowable: f.allowable,
    slenderness: f.slenderness,
    density: f.density,
    depth: { min: 200, max: 400, step: 10 },
    width: { min: 100, max: 200, step: 10 },
    thicknesses: [8, 10],
    families: ["i"],
    deflection: { span: 6, serviceLoad: 10, limitRatio: 360, E: f.E },
  };
}
