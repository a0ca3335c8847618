// The default React Router node entry, plus the in-process sweep runner that starts with the
// server (app/workers/in-process.server.ts; SPARWISE_INPROCESS_WORKERS=0 turns it off) and the
// Content-Security-Policy nonce from the load context (server.ts).
import "./workers/in-process.server";
import { Writable } from "node:stream";

import type { AppLoadContext, EntryContext } from "react-router";
import { ServerRouter } from "react-router";
import { renderToPipeableStream } from "react-dom/server";
import { NonceContext } from "./lib/nonce";

export const streamTimeout = 5_000;

export default function handleRequest(
  request: Request,
  responseStatusCode: number,
  responseHeaders: Headers,
  routerContext: EntryContext,
  loadContext: AppLoadContext,
  // If you have middleware enabled:
  // loadContext: RouterContextProvider
) {
  // https://httpwg.org/specs/rfc9110.html#HEAD
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, {
      status: responseStatusCode,
      headers: responseHeaders,
    });
  }

  // The document is rendered whole, then sent as one buffer. No route streams deferred data (no
  // loader returns a promise to <Await>), so waiting for all of it delays nothing; and one buffer
  // costs the server far less than React's 4 kB chunks did, each passing through a web stream,
  // the compression middleware's zlib (a thread-pool round trip per chunk) and a socket write: a
  // sweep page was about 30 of them (issue 9, item 8: about a tenth of its server time). A route that
  // comes to defer data would want onShellReady and the stream back for browsers.
  return new Promise((resolve, reject) => {
    let shellRendered = false;
    const chunks: Buffer[] = [];
    const body = new Writable({
      write(chunk: Buffer | Uint8Array, _encoding, callback) {
        chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength));
        callback();
      },
      final(callback) {
        // Clear the timeout to prevent retaining the closure and memory leak
        clearTimeout(timeoutId);
        timeoutId = undefined;
        responseHeaders.set("Content-Type", "text/html");
        resolve(new Response(Buffer.concat(chunks), { headers: responseHeaders, status: responseStatusCode }));
        callback();
      },
    });

    // Abort the rendering stream after the `streamTimeout` so it has time to
    // flush down the rejected boundaries
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(
      () => abort(),
      streamTimeout + 1000,
    );

    // server.ts's per-request nonce: React's and the router's inline scripts carry it, so the
    // Content-Security-Policy needs no 'unsafe-inline' for scripts.
    const nonce = loadContext?.cspNonce;
    const { pipe, abort } = renderToPipeableStream(
      <NonceContext.Provider value={nonce}>
        <ServerRouter context={routerContext} url={request.url} nonce={nonce} />
      </NonceContext.Provider>,
      {
        nonce,
        onShellReady() {
          shellRendered = true;
        },
        onAllReady() {
          pipe(body);
        },
        onShellError(error: unknown) {
          reject(error);
        },
        onError(error: unknown) {
          responseStatusCode = 500;
          // Log rendering errors from inside the shell.  Don't log errors encountered during
          // initial shell rendering since they'll reject and get logged in handleDocumentRequest.
          if (shellRendered) {
            console.error(error);
          }
        },
      },
    );
  });
}
