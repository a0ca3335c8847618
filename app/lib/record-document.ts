// The calculation record as a printed document: the member mark, and the page furniture printed
// in the @page margin boxes (running header, "page x of y"), which CSS can only take as strings.

/** How a drawing calls the member: the brief's name, else "Option N" (the member schedule's rule). */
export function memberMark(briefName: string | null, optionId: number): string {
  return briefName?.trim() || `Option ${optionId}`;
}

/**
 * A CSS string literal holding any text: every character outside a small safe set becomes a hex
 * escape, so a project name can close neither the string nor the <style> element it is printed in.
 */
export function cssString(text: string): string {
  let out = '"';
  for (const ch of text.slice(0, 300)) out += /[A-Za-z0-9 .,:;_()/-]/.test(ch) ? ch : `\\${ch.codePointAt(0)!.toString(16)} `;
  return out + '"';
}

export interface RunningHeader {
  project: string;
  jobNumber: string | null;
  mark: string;
  revision: string;
  /** the bottom-left line: what the document is */
  title: string;
}

/**
 * The print page: margins that keep the sheet off the paper's edge on A4 and US Letter alike (no
 * `size`, so the paper chosen in the print dialog is used), the running header in the top margin
 * boxes and "page x of y" at the foot, as chromium's paged media draws them.
 */
export function recordPageCss(h: RunningHeader): string {
  const left = [h.project, h.jobNumber ? `Job ${h.jobNumber}` : null].filter(Boolean).join(" · ");
  const right = `Member ${h.mark} · Revision ${h.revision}`;
  const box = "font-family: ui-sans-serif, system-ui, sans-serif; font-size: 8.5pt; color: #333;";
  return [
    "@page {",
    "  margin: 20mm 15mm 18mm 18mm;",
    `  @top-left { content: ${cssString(left)}; ${box} }`,
    `  @top-right { content: ${cssString(right)}; ${box} }`,
    `  @bottom-left { content: ${cssString(h.title)}; ${box} }`,
    `  @bottom-right { content: "Page " counter(page) " of " counter(pages); ${box} }`,
    "}",
    "@media print { body { font-size: 10pt; } main { padding: 0 !important; max-width: none !important; } .record-keep { break-inside: avoid; } h2 { break-after: avoid; } }",
  ].join("\n");
}
