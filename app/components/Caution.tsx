// The one caution every results page and calculation record carries (product.md, "Safety").
// The wording lives in lib/caution.ts (the API answers with the same text); it follows the
// brief's design basis, so pass the problem the results belong to.
import { cautionText, type CautionBasis } from "~/lib/caution";

export function Caution({ problem, scope = "bench", className = "" }: { problem?: CautionBasis | null; scope?: "bench" | "project"; className?: string }) {
  return (
    <aside
      role="note"
      aria-label="Caution"
      data-basis={problem ? (problem.basis ?? "allowable") : scope}
      className={`rounded-md border-l-4 border-caution bg-amber-50 px-4 py-3 text-sm text-ink print:bg-white ${className}`}
    >
      <strong className="font-bold text-caution">Caution. </strong>
      {cautionText(problem, scope)}
    </aside>
  );
}

export default Caution;
