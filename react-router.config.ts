import type { Config } from "@react-router/dev/config";

export default {
  ssr: true,
  // The whole route manifest is one fingerprinted build file the browser loads once, instead of
  // each document carrying the routes it matched (worked out per view by matching every ancestor
  // path: about a millisecond of server time a page, issue 9 item 8) and the browser asking
  // /__manifest for the rest as links come into view. Fifty-odd routes make a small file.
  routeDiscovery: { mode: "initial" },
} satisfies Config;
