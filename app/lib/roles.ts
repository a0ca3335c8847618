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
] as const;
export type Permission = (typeof PERMISSIONS)[number];

// A reviewer runs sweeps only as rechecks, so it holds "recheck" but not "runSweep".
const GRANTS: Record<Role, ReadonlySet<Permission>> = {
  admin: new Set(PERMISSIONS),
  engineer: new Set<Permission>(["read", "createProject", "editBrief", "runSweep", "saveOption", "requestReview", "recheck"]),
  reviewer: new Set<Permission>(["read", "recheck", "review"]),
  viewer: new Set<Permission>(["read"]),
};

export function can(role: Role, permission: Permission): boolean {
  return GRANTS[role]?.has(permission) ?? false;
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
