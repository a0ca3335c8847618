import { type RouteConfig, index, layout, route } from "@react-router/dev/routes";

// Every route listed here must also appear in tests/integration/role-matrix.test.ts.
export default [
  // Public pages: sign-in and the links sent by e-mail (sign-in and team).
  route("sign-in", "routes/sign-in.tsx"),
  route("sign-out", "routes/sign-out.tsx"),
  route("invite/:token", "routes/invite.$token.tsx"),
  route("forgot-password", "routes/forgot-password.tsx"),
  route("reset-password/:token", "routes/reset-password.$token.tsx"),
  route("healthz", "routes/healthz.ts"),

  // Signed-in pages share the header and navigation of app-layout.tsx.
  layout("routes/app-layout.tsx", [
    index("routes/dashboard.tsx"),
    route("account", "routes/account.tsx"),
    route("messages", "routes/messages.tsx"),
    route("admin", "routes/admin.tsx"),
    route("admin/outbox", "routes/admin.outbox.tsx"),
    route("admin/materials", "routes/admin.materials.tsx"),
    route("admin/catalogues", "routes/admin.catalogues.tsx"),
    route("admin/costs", "routes/admin.costs.tsx"),
    // Section bench
    route("bench", "routes/bench.tsx"),
    // Sweep notices
    route("notices", "routes/notices.tsx"),
    // Projects, briefs, sweeps, options, records
    route("projects", "routes/projects.tsx"),
    route("projects/new", "routes/projects.new.tsx"),
    route("projects/:projectId", "routes/projects.$projectId.tsx"),
    route("projects/:projectId/schedule", "routes/projects.$projectId.schedule.tsx"),
    route("projects/:projectId/briefs/new", "routes/projects.$projectId.briefs.new.tsx"),
    route("briefs/:briefId", "routes/briefs.$briefId.tsx"),
    route("sweeps/:sweepId", "routes/sweeps.$sweepId.tsx"),
    route("sweeps/:sweepId/recheck", "routes/sweeps.$sweepId.recheck.tsx"),
    route("sweeps/:sweepId/comparison", "routes/sweeps.$sweepId.comparison.tsx"),
    route("options/:optionId", "routes/options.$optionId.tsx"),
    route("options/:optionId/record", "routes/options.$optionId.record.tsx"),
    route("options/:optionId/attachments", "routes/options.$optionId.attachments.ts"),
    route("projects/:projectId/cutting-list", "routes/projects.$projectId.cutting-list.tsx"),
    route("stock-lists", "routes/stock-lists.tsx"),
    // Any other address: a 404 inside the frame (the layout's error boundary draws it).
    route("*", "routes/not-found.tsx"),
  ]),

  // JSON API (session cookie or Authorization: Bearer <token>; guards answer 401/403 JSON).
  // Section properties
  route("api/v1/properties", "routes/api.v1.properties.ts"),
  // Sweep queue
  route("api/v1/sweeps", "routes/api.v1.sweeps.ts"),
  route("api/v1/sweeps/:id", "routes/api.v1.sweeps.$id.ts"),
  route("api/v1/sweeps/:id/candidates", "routes/api.v1.sweeps.$id.candidates.ts"),
  route("api/v1/sweeps/:id/cancel", "routes/api.v1.sweeps.$id.cancel.ts"),
  // Any other /api/ address: a JSON 404; a missing build file: a plain 404
  route("api/*", "routes/api.not-found.ts"),
  route("assets/*", "routes/file-not-found.ts"),
  // Candidate downloads
  route("sweeps/:sweepId/candidates.csv", "routes/sweeps.$sweepId.candidates[.]csv.ts"),
  route("projects/:projectId/schedule.csv", "routes/projects.$projectId.schedule[.]csv.ts"),
  route("projects/:projectId/cutting-list.csv", "routes/projects.$projectId.cutting-list[.]csv.ts"),
  route("options/:optionId/section.svg", "routes/options.$optionId.section[.]svg.ts"),
  route("attachments/:attachmentId", "routes/attachments.$attachmentId.ts"),
] satisfies RouteConfig;
