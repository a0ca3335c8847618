// The section drawing as a stand-alone SVG file (SVG 1.1, an open W3C format any drawing
// program reads), with its overall dimensions. Pure: the pieces come from sectionOutline (the
// engine's buildShape), the same ones the on-screen SectionDrawing draws.
//
// Choice (spec silent): the file is drawn at full size, one user unit = 1 mm with width/height
// given in mm, so a drawing program imports it to scale; dimension text is sized from the
// section (a fixed fraction of its larger side) rather than in screen pixels.
import type { SectionInput } from "~/optimizer/schema";
import type { UnitSystem } from "~/optimizer/units";
import { formatQuantity } from "~/lib/format";
import { outlinePieces, sectionOutline } from "~/lib/section-outline";

export interface SectionSvgOptions {
  units?: UnitSystem;
  /** written into <title> and under the drawing */
  title?: string;
}

/** XML text escaping for element content and attribute values. */
export function xmlEscape(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&apos;");
}

const n = (v: number) => (Math.round(v * 100) / 100).toString();

/** The SVG document text. Throws (the engine's message) when the section is not valid. */
export function sectionSvg(section: SectionInput, opts: SectionSvgOptions = {}): string {
  const units = opts.units ?? "si";
  const title = opts.title ?? "Cross-section";
  const o = sectionOutline(section);
  const { width: bw, depth: bh } = o;
  const size = Math.max(bw, bh);
  const font = size * 0.045;
  const gap = font * 0.6;
  const off = font * 2.2;
  // margins carry the dimension lines and their text: below for the width, right for the depth
  const ml = font * 2,
    mr = off + font * 2.5,
    mt = font * 2,
    mb = off + font * 4.5;
  const W = bw + ml + mr,
    H = bh + mt + mb;
  const X = (z: number) => ml + z;
  const Y = (y: number) => mt + (bh - y);
  const pieces = outlinePieces(o, X, Y);
  const fmtL = (v: number) => formatQuantity("length", v, units);
  const stroke = size * 0.003;
  const tick = font * 0.35;
  // dimension line with oblique ticks at both ends (drawing practice for architectural and structural dimensions, common practice)
  const tickAt = (x: number, y: number) => `<line x1="${n(x - tick)}" y1="${n(y + tick)}" x2="${n(x + tick)}" y2="${n(y - tick)}"/>`;
  const yDim = Y(0) + off;
  const xDim = X(bw) + off;
  const parts: string[] = [];
  parts.push(`<?xml version="1.0" encoding="UTF-8"?>`);
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${n(W)}mm" height="${n(H)}mm" viewBox="0 0 ${n(W)} ${n(H)}">`,
  );
  parts.push(`<title>${xmlEscape(`${title}: ${fmtL(bw)} wide, ${fmtL(bh)} deep`)}</title>`);
  parts.push(`<desc>Drawn full size: one unit is one millimetre.</desc>`);
  parts.push(`<g id="section" fill="#0f6e6e" fill-opacity="0.22" stroke="#1d2733" stroke-width="${n(stroke)}">`);
  for (const r of pieces.rects) parts.push(`<rect x="${n(r.x)}" y="${n(r.y)}" width="${n(r.width)}" height="${n(r.height)}"/>`);
  if (pieces.evenOdd) parts.push(`<path d="${pieces.evenOdd}" fill-rule="evenodd"/>`);
  parts.push(`</g>`);
  if (pieces.loose.length) {
    parts.push(`<g id="fillets" fill="#0f6e6e" fill-opacity="0.22" stroke="none">`);
    for (const d of pieces.loose) parts.push(`<path d="${d}"/>`);
    parts.push(`</g>`);
  }
  parts.push(`<g id="dimensions" stroke="#1d2733" stroke-width="${n(stroke * 0.7)}" fill="#1d2733" font-family="sans-serif" font-size="${n(font)}">`);
  // overall width, below
  parts.push(`<line x1="${n(X(0))}" y1="${n(Y(0) + gap)}" x2="${n(X(0))}" y2="${n(yDim + gap)}"/>`);
  parts.push(`<line x1="${n(X(bw))}" y1="${n(Y(0) + gap)}" x2="${n(X(bw))}" y2="${n(yDim + gap)}"/>`);
  parts.push(`<line x1="${n(X(0))}" y1="${n(yDim)}" x2="${n(X(bw))}" y2="${n(yDim)}"/>`);
  parts.push(tickAt(X(0), yDim), tickAt(X(bw), yDim));
  parts.push(`<text id="dim-width" x="${n((X(0) + X(bw)) / 2)}" y="${n(yDim + font * 1.4)}" text-anchor="middle" stroke="none">${xmlEscape(fmtL(bw))}</text>`);
  // overall depth, right
  parts.push(`<line x1="${n(X(bw) + gap)}" y1="${n(Y(0))}" x2="${n(xDim + gap)}" y2="${n(Y(0))}"/>`);
  parts.push(`<line x1="${n(X(bw) + gap)}" y1="${n(Y(bh))}" x2="${n(xDim + gap)}" y2="${n(Y(bh))}"/>`);
  parts.push(`<line x1="${n(xDim)}" y1="${n(Y(0))}" x2="${n(xDim)}" y2="${n(Y(bh))}"/>`);
  parts.push(tickAt(xDim, Y(0)), tickAt(xDim, Y(bh)));
  const ty = (Y(0) + Y(bh)) / 2,
    tx = xDim + font * 1.2;
  parts.push(`<text id="dim-depth" x="${n(tx)}" y="${n(ty)}" text-anchor="middle" stroke="none" transform="rotate(-90 ${n(tx)} ${n(ty)})">${xmlEscape(fmtL(bh))}</text>`);
  parts.push(`</g>`);
  parts.push(`<text x="${n(ml)}" y="${n(H - font * 0.8)}" font-family="sans-serif" font-size="${n(font)}" fill="#1d2733">${xmlEscape(title)}</text>`);
  parts.push(`</svg>`);
  return parts.join("\n") + "\n";
}
