// The brief's catalogues: which of the team's section catalogues a sweep searches beside the plate
// families, and which shapes it takes from them. Plain form fields (the server copies the chosen
// catalogues' sections into the brief: brief-catalogues.server.ts).
import { CATALOGUE_SHAPES, SHAPE_WORDS, type CatalogueShape } from "~/optimizer/catalogue";

export interface CatalogueChoiceOption {
  id: number;
  name: string;
  sections: number;
}

/** A catalogue as a sweep searched it (a recheck offers the original's copies). */
export interface KeptCatalogueOption {
  name: string;
  sections: number;
}

export function CatalogueChoice({ catalogues, chosen, shapes, kept = [] }: { catalogues: CatalogueChoiceOption[]; chosen: string[]; shapes?: CatalogueShape[]; kept?: KeptCatalogueOption[] }) {
  const allShapes = !shapes || shapes.length === 0;
  // a team catalogue named like a kept copy is not offered again (the kept copy is what the original searched)
  const others = catalogues.filter((c) => !kept.some((k) => k.name === c.name));
  return (
    <fieldset className="rounded-lg border border-ink/15 bg-white p-4" data-testid="catalogue-choice">
      <legend className="px-1 text-base font-bold">Catalogues (rolled sections)</legend>
      <input type="hidden" name="catalogueChoice" value="1" />
      {catalogues.length === 0 && kept.length === 0 ? (
        <p className="text-sm text-ink/70">Your team keeps no section catalogues yet (an admin uploads them on the Catalogues page).</p>
      ) : (
        <>
          <p className="mb-2 text-xs text-ink/70">
            Every section of a chosen catalogue is checked beside the plate families under the brief's basis; the results show rolled and welded apart. The brief keeps a copy of
            the sections, so later changes to a catalogue do not change it.
          </p>
          <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
            {kept.map((c, i) => (
              <label key={`kept-${i}`} className="flex items-center gap-2 text-sm">
                <input type="checkbox" name="catalogueKeep" value={i} defaultChecked />
                {c.name} <span className="text-xs text-ink/70">({c.sections} sections, as the original sweep searched them)</span>
              </label>
            ))}
            {others.map((c) => (
              <label key={c.id} className="flex items-center gap-2 text-sm">
                <input type="checkbox" name="catalogueIds" value={c.id} defaultChecked={chosen.includes(c.name)} />
                {c.name} <span className="text-xs text-ink/70">({c.sections} sections)</span>
              </label>
            ))}
          </div>
          <p className="mt-3 text-sm font-semibold">Shapes to take from them</p>
          <div className="grid grid-cols-2 gap-2 sm:grid-cols-3">
            {CATALOGUE_SHAPES.map((s) => (
              <label key={s} className="flex items-center gap-2 text-sm">
                <input type="checkbox" name="catalogueShapes" value={s} defaultChecked={allShapes || shapes!.includes(s)} />
                {SHAPE_WORDS[s]}
              </label>
            ))}
          </div>
        </>
      )}
    </fieldset>
  );
}
