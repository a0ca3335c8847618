// What server.ts hands every loader and action besides the request. Optional, because the Vite
// dev server and the integration tests call routes without it.
export interface ServerLoadContext {
  /** The client's address: the socket's peer, or the trusted X-Forwarded-For hop (TRUST_PROXY_HOPS). */
  clientAddress?: string;
  /** This response's Content-Security-Policy nonce for the framework's inline scripts. */
  cspNonce?: string;
}

declare module "react-router" {
  interface AppLoadContext extends ServerLoadContext {}
}
