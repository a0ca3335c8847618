// The option page's and the record's problem panel (BriefSummary) says which catalogues the
// brief searched beside the plate families, so a reader knows where a rolled answer could come from.
import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { BriefSummary } from "~/components/BriefSummary";
import { parseCatalogueCsv } from "~/lib/catalogue-csv";
import { CONTRACT_EXAMPLE_PROBLEM, searchProblemSchema, type CatalogueSection } from "~/optimizer";

const parsed = parseCatalogueCsv(readFileSync("db/seeds/starter-catalogue.csv", "utf8"));
if (!parsed.ok) throw new Error("starter catalogue must parse");
const STARTER: CatalogueSection[] = parsed.sections.map((s) => ({ designation: s.designation, shape: s.shape, dims: s.dims }));
const channels = STARTER.filter((s) => s.shape === "channel");

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const row = (html: string) => /Catalogues searched (.*?) (Density|Slenderness|Objective)/.exec(text(html))?.[1] ?? "";

describe("BriefSummary: the catalogues searched", () => {
  test("lists each catalogue with its section count and the shapes it was cut to", () => {
    const problem = searchProblemSchema.parse({
      ...CONTRACT_EXAMPLE_PROBLEM,
      catalogues: [
        { name: "Starter rolled sections", sections: STARTER },
        { name: "Yard channels", shapes: ["channel"], sections: channels },
      ],
    });
    const cell = row(renderToString(createElement(BriefSummary, { problem, units: "si" })));
    expect(cell).toContain(`Starter rolled sections: ${STARTER.length} sections`);
    expect(cell).toContain(`Yard channels: ${channels.length} sections (only channel, parallel flanges)`);
  });

  test("says none when the brief searched plates only", () => {
    const problem = searchProblemSchema.parse(CONTRACT_EXAMPLE_PROBLEM);
    expect(row(renderToString(createElement(BriefSummary, { problem, units: "si" })))).toBe("none (plate families only)");
  });
});
