// The activity log's actions in words, for the project page (no server code: the component imports it).
export const ACTIVITY_WORDS: Record<string, string> = {
  project_created: "created the project",
  project_edited: "edited the project",
  project_archived: "archived the project",
  project_restored: "restored the project",
  member_added: "added a member",
  member_removed: "removed a member",
  brief_created: "created a brief",
  brief_edited: "edited a brief",
  sweep_started: "started a sweep",
  recheck_started: "started a recheck",
  option_saved: "saved an option",
  review_requested: "requested a review",
  option_approved: "approved an option",
  option_returned: "returned an option",
  option_revised: "made a new record revision of an option",
  attachment_added: "attached a file to an option",
  attachment_deleted: "deleted an option's attachment",
  stock_list_saved: "saved a stock list",
  stock_list_deleted: "deleted a stock list",
  material_added: "added a material",
  material_changed: "changed a material",
  material_deleted: "deleted a material",
  section_saved: "saved a section from the bench",
};

/** What an activity entry is about, in words ("saved section 3", never "saved_section 3"). */
export const SUBJECT_WORDS: Record<string, string> = {
  api_token: "API token",
  attachment: "attachment",
  brief: "brief",
  catalogue: "catalogue",
  invitation: "invitation",
  material: "material",
  option: "option",
  project: "project",
  saved_section: "saved section",
  stock_list: "stock list",
  sweep: "sweep",
  team: "team",
  user: "member",
};

/** Where an activity subject can be opened, when it has a page of its own. */
export function subjectHref(type: string, id: number): string | null {
  return type === "brief" ? `/briefs/${id}` : type === "sweep" ? `/sweeps/${id}` : type === "option" ? `/options/${id}` : null;
}
