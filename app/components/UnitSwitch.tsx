// SI / US customary switch: a pair of radio buttons (arrow keys move between them, as for
// any radio group), styled as one segmented control. Pure props.
import type { UnitSystem } from "~/optimizer/units";

export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = { si: "SI (mm, kN·m, MPa)", us: "US customary (in, kip·ft, ksi)" };

export function UnitSwitch({
  value,
  onChange,
  name = "units",
  legend = "Units",
  className = "",
}: {
  value: UnitSystem;
  onChange: (next: UnitSystem) => void;
  name?: string;
  legend?: string;
  className?: string;
}) {
  return (
    <fieldset className={`inline-flex flex-wrap items-center gap-2 ${className}`}>
      <legend className="sr-only">{legend}</legend>
      <span aria-hidden="true" className="text-sm font-semibold">
        {legend}
      </span>
      <span className="inline-flex max-w-full overflow-hidden rounded-md border border-ink/30">
        {(["si", "us"] as const).map((u) => (
          <label
            key={u}
            className={`cursor-pointer px-3 py-1 text-sm has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent ${
              value === u ? "bg-accent text-white" : "bg-white text-ink hover:bg-paper"
            }`}
          >
            <input
              type="radio"
              className="sr-only"
              name={name}
              value={u}
              checked={value === u}
              onChange={() => onChange(u)}
            />
            {UNIT_SYSTEM_LABELS[u]}
          </label>
        ))}
      </span>
    </fieldset>
  );
}

export default UnitSwitch;
