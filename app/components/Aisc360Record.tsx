// The calculation record's AISC 360-16 part (issue 14): every check worked through with its
// section and equation number, from the engine's own record lines (basis/aisc360.ts recordLines),
// so the numbers printed are those that decided the search. Worked in SI (the engine's units);
// the checks table beside it shows demand and capacity in the record's units.
import type { CandidateVerdict } from "~/optimizer/checks";
import { recordLines, type SearchProblem } from "~/optimizer/index";

export function Aisc360Checks({ problem, verdict }: { problem: SearchProblem; verdict: CandidateVerdict }) {
  const lines = recordLines(problem, verdict);
  return (
    <table className="w-full border-collapse text-sm" data-testid="record-aisc360">
      <thead>
        <tr className="text-left">
          <th scope="col" className="border-b border-ink/30 py-1 pr-2">
            Section and equation
          </th>
          <th scope="col" className="border-b border-ink/30 py-1">
            Worked through
          </th>
        </tr>
      </thead>
      <tbody>
        {lines.map((l, i) => (
          <tr key={i} className="align-top">
            <td className="py-1 pr-2 whitespace-nowrap text-ink/80">{l.clause}</td>
            <td className="py-1 tabular-nums">{l.text}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
