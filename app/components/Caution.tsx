// The one caution every results page and calculation record carries (product.md, "Safety").
// Keep the wording here only, so the screen and the printed record can never disagree.
export const CAUTION_TEXT =
  "Sparwise is a sizing aid. Its checks cover only the elastic bending stress, shear stress and plate slenderness " +
  "rules listed (and deflection, when a limit is given); they do not cover lateral-torsional buckling, web crippling, " +
  "connections, fatigue, fire or load combinations. Verify every result against the governing local design code and " +
  "have it approved by a licensed engineer before fabrication.";

export function Caution({ className = "" }: { className?: string }) {
  return (
    <aside
      role="note"
      aria-label="Caution"
      className={`rounded-md border-l-4 border-caution bg-amber-50 px-4 py-3 text-sm text-ink print:bg-white ${className}`}
    >
      <strong className="font-bold text-caution">Caution. </strong>
      {CAUTION_TEXT}
    </aside>
  );
}

export default Caution;
