// Everything the printed calculation record shows besides the engine's numbers: the option at
// the revision asked for, the title block's facts and its signatures, the revision history and
// the attachments. The option is looked up in the caller's team first, so an id or a revision
// letter of another team's option reaches nothing (404).
import { getOption, listReviews } from "~/lib/options.server";
import { getProject } from "~/lib/projects.server";
import { optionAtRevision } from "~/lib/revisions.server";
import { listAttachments } from "~/lib/attachments.server";
import { memberMark } from "~/lib/record-document";
import { projectNumbers } from "~/lib/numbering.server";

export async function recordDocument(teamId: number, optionId: number, revision: number | undefined) {
  const current = await getOption(teamId, optionId);
  const { option, revision: shown, revisions } = await optionAtRevision(current, revision);
  const project = await getProject(teamId, option.projectId);
  const reviews = (await listReviews(option.id)).filter((r) => r.revision === shown.number);
  // Sparwise's review is one four-eyes step: the reviewer who approves a revision has checked it,
  // so both boxes carry that decision (a choice; the issue names three boxes, the product one review).
  const signatures = { prepared: shown.prepared, checked: shown.approved, approved: shown.approved };
  return {
    option,
    jobNumber: project.job_number ?? null,
    mark: memberMark(option.briefName, option.id),
    revision: shown,
    revisions,
    reviews,
    signatures,
    attachments: await listAttachments(teamId, option.id),
    numbers: await projectNumbers({ sweeps: [option.sweepId, option.recheckOf], options: [option.id] }),
  };
}
