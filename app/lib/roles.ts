// Roles and what each may do (product.md, "People and roles"). Pure: safe to import in components,
// but hiding a button is never the check — the server guards in auth.server.ts call `can` too.

export const ROLES = ["admin", "engineer", "reviewer", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = [
  "read",
  "createProject",
  "editBrief",
  "runSweep",
  "saveOption",
  "requestReview",
  "recheck",
  "review",
  "cancelAnySweep",
  "manageTeam",
  // upload, replace and delete the team's section catalogues (product.md, "Catalogue")
  "manageCatalogues",
  // attach files (a sketch, a photo of a site measurement) to an option; reviewers too, since a
  // check on site is theirs as often as the engineer's
  "attach",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

// A reviewer runs sweeps only as rechecks, so it holds "recheck" but not "runSweep".
const GRANTS: Record<Role, ReadonlySet<Permission>> = {
  admin: new Set(PERMISSIONS),
  engineer: new Set<Permission>(["read", "createProject", "editBrief", "runSweep", "saveOption", "requestReview", "recheck", "attach"]),
  reviewer: new Set<Permission>(["read", "recheck", "review", "attach"]),
  viewer: new Set<Permission>(["read"]),
};

export function can(role: Role, permission: Permission): boolean {
  return GRANTS[role]?.has(permission) ?? false;
}

/**
 * A stock list is the team's shared supply: an engineer may upload one, but only an admin or the
 * person who uploaded it may delete it (issue 11, item 8). A list whose uploader left (created_by
 * cleared) is then the admins' alone.
 */
export function mayDeleteStockList(role: Role, userId: number, uploadedBy: number | null): boolean {
  if (role === "admin") return true;
  return can(role, "editBrief") && uploadedBy !== null && uploadedBy === userId;
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin",
  engineer: "Engineer",
  reviewer: "Reviewer",
  viewer: "Viewer",
};

/** How a person is tied to an option under review, for the four-eyes rule. */
export interface ReviewTies {
  /** They saved the option. */
  saved: boolean;
  /** They asked for a review of it (in any round). */
  requested: boolean;
}

/**
 * Four-eyes rule, the one place it is decided: nobody approves or returns an option they saved or
 * whose review they asked for, admins included. Null when the person may decide, else why not (the
 * page shows it in place of the buttons; the server refuses with it, 403).
 * Any earlier request counts, not only the current round's: whoever once asked is an author of the
 * decision's question (a choice; the issue is silent on later rounds).
 */
export function reviewRefusal(role: Role, ties: ReviewTies): string | null {
  if (!can(role, "review")) return `Your role (${role}) may not review options.`;
  if (ties.saved) return "You saved this option, so someone else must approve or return it (four-eyes review).";
  if (ties.requested) return "You asked for this option's review, so someone else must approve or return it (four-eyes review).";
  return null;
}
