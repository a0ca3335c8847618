// The SVG file export: a well-formed XML document, drawn full size in mm, carrying the overall
// dimensions as text, and escaping what the title brings in.
import { describe, expect, test } from "vitest";
import { sectionSvg, xmlEscape } from "~/lib/section-svg";
import { sectionOutline } from "~/lib/section-outline";
import type { SectionInput } from "~/optimizer";

/** A minimal well-formedness check (XML 1.0 §2.1: one root, properly nested tags, quoted attributes, no bare '&' or '<'). */
function wellFormed(xml: string): { ok: boolean; why?: string; root?: string } {
  const body = xml.replace(/^<\?xml[^?]*\?>\s*/, "");
  const tag = /<(\/?)([A-Za-z_][\w.-]*)((?:\s+[A-Za-z_:][\w:.-]*="[^"<]*")*)\s*(\/?)>/y;
  const stack: string[] = [];
  let root: string | undefined;
  let i = 0;
  while (i < body.length) {
    const lt = body.indexOf("<", i);
    const textPart = body.slice(i, lt === -1 ? body.length : lt);
    if (/&(?!(amp|lt|gt|quot|apos);)/.test(textPart)) return { ok: false, why: `bare & in "${textPart}"` };
    if (lt === -1) break;
    if (stack.length === 0 && root && body.slice(lt).trim()) return { ok: false, why: "content after the root element" };
    tag.lastIndex = lt;
    const m = tag.exec(body);
    if (!m) return { ok: false, why: `bad tag at ${body.slice(lt, lt + 40)}` };
    const [, close, name, attrs, selfClose] = m;
    if (/&(?!(amp|lt|gt|quot|apos);)/.test(attrs)) return { ok: false, why: `bare & in attributes of ${name}` };
    if (close) {
      if (stack.pop() !== name) return { ok: false, why: `</${name}> closes the wrong element` };
    } else {
      if (!root) root = name;
      else if (stack.length === 0) return { ok: false, why: "two root elements" };
      if (!selfClose) stack.push(name);
    }
    i = tag.lastIndex;
  }
  return stack.length ? { ok: false, why: `unclosed ${stack.join(",")}` } : { ok: true, root };
}

const I400: SectionInput = { family: "i", d: 400, b: 200, tf: 16, tw: 10 };

describe("sectionSvg", () => {
  test("the checker itself refuses broken documents", () => {
    expect(wellFormed("<svg><g></svg>").ok).toBe(false);
    expect(wellFormed("<svg><text>a & b</text></svg>").ok).toBe(false);
    expect(wellFormed("<svg><rect x=1/></svg>").ok).toBe(false);
    expect(wellFormed('<svg><rect x="1"/></svg>').ok).toBe(true);
  });

  test("an I section: well-formed, one svg root, 400 mm deep and 200 mm wide written as dimension text", () => {
    const svg = sectionSvg(I400, { title: "Option 7 — R&D <lab>" });
    const wf = wellFormed(svg);
    expect(wf.why).toBeUndefined();
    expect(wf.root).toBe("svg");
    expect(svg).toContain('xmlns="http://www.w3.org/2000/svg"');
    expect(svg).toMatch(/<text id="dim-width"[^>]*>200 mm<\/text>/);
    expect(svg).toMatch(/<text id="dim-depth"[^>]*>400 mm<\/text>/);
    // the title is escaped, never raw markup
    expect(svg).toContain("R&amp;D &lt;lab&gt;");
    expect(svg).not.toContain("<lab>");
  });

  test("full size: the viewBox is in mm, and the plates drawn are the engine's three, summing to its area", () => {
    const svg = sectionSvg(I400);
    const vb = svg.match(/viewBox="0 0 ([\d.]+) ([\d.]+)"/)!;
    expect(Number(vb[1])).toBeGreaterThan(200);
    expect(Number(vb[2])).toBeGreaterThan(400);
    expect(svg).toMatch(new RegExp(`width="${vb[1]}mm"`));
    const rects = [...svg.matchAll(/<rect x="[\d.]+" y="[\d.]+" width="([\d.]+)" height="([\d.]+)"\/>/g)].map((m) => Number(m[1]) * Number(m[2]));
    expect(rects).toHaveLength(sectionOutline(I400).plates.length);
    // A = 2·b·tf + (d − 2tf)·tw = 2·200·16 + 368·10 = 10 080 mm² (composite areas, hand calculation)
    expect(rects.reduce((a, b) => a + b, 0)).toBeCloseTo(10080, 6);
  });

  test("US units write the dimension text in inches", () => {
    const svg = sectionSvg(I400, { units: "us" });
    expect(wellFormed(svg).ok).toBe(true);
    // 400 mm / 25.4 = 15.75 in (exact definition of the inch)
    expect(svg).toMatch(/<text id="dim-depth"[^>]*>15\.75 in<\/text>/);
  });

  test("a hollow section and an invalid one", () => {
    const rhs = sectionSvg({ family: "rhs", d: 200, b: 100, t: 8 } as SectionInput);
    expect(wellFormed(rhs).ok).toBe(true);
    expect(rhs).toContain('fill-rule="evenodd"');
    expect(() => sectionSvg({ family: "i", d: 10, b: 200, tf: 16, tw: 10 })).toThrow();
  });

  test("xmlEscape", () => {
    expect(xmlEscape(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&apos;&amp;&apos;&lt;/a&gt;");
  });
});
