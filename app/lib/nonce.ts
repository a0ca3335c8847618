import { createContext, useContext } from "react";

// The Content-Security-Policy nonce of the response being rendered (server.ts makes one per
// request; entry.server.tsx provides it). Undefined in the browser, where the page's scripts are
// already running and React adds no inline ones.
export const NonceContext = createContext<string | undefined>(undefined);

export function useNonce(): string | undefined {
  return useContext(NonceContext);
}
