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
  stock_list_saved: "saved a stock list",
};
