import { type RouteConfig, index, route } from "@react-router/dev/routes";

// Every route listed here must also appear in tests/integration/role-matrix.test.ts.
export default [
  index("routes/home.tsx"),
  route("healthz", "routes/healthz.ts"),
] satisfies RouteConfig;
