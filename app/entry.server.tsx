// The server's entry: React Router's own for Node (a streamed render, the
// whole page at once for bots), with each page answer's headers
// (app/platform/page-headers.server.ts). The nonce is made here, one per
// answer, and given to the router, which puts it on the hydration data it
// streams, to the root (<Scripts>, <ScrollRestoration> and its own script),
// and to React, which puts it on the scripts of its streamed render.
import { PassThrough } from "node:stream";
import { createReadableStreamFromReadable } from "@react-router/node";
import { isbot } from "isbot";
import { renderToPipeableStream, type RenderToPipeableStreamOptions } from "react-dom/server";
import { ServerRouter, type EntryContext, type HandleDataRequestFunction } from "react-router";
import { NonceContext } from "./platform/nonce";
import { markPersonal, newNonce, pagePolicy } from "./platform/page-headers.server";

export const streamTimeout = 5_000;

export default async function handleRequest(request: Request, responseStatusCode: number, responseHeaders: Headers, routerContext: EntryContext) {
  const nonce = newNonce();
  responseHeaders.set("Content-Security-Policy", pagePolicy(nonce));
  await markPersonal(request, responseHeaders);

  // RFC 9110 §9.3.2: HEAD answers as GET would, without the body.
  if (request.method.toUpperCase() === "HEAD") return new Response(null, { status: responseStatusCode, headers: responseHeaders });

  return new Promise<Response>((resolve, reject) => {
    let shellRendered = false;
    const userAgent = request.headers.get("user-agent");
    // Bots and the SPA fallback get the whole page at once.
    const readyOption: keyof RenderToPipeableStreamOptions = (userAgent && isbot(userAgent)) || routerContext.isSpaMode ? "onAllReady" : "onShellReady";

    // Aborted after streamTimeout, with time left to send the rejected boundaries.
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);

    const page = (
      <NonceContext.Provider value={nonce}>
        <ServerRouter context={routerContext} url={request.url} nonce={nonce} />
      </NonceContext.Provider>
    );
    const { pipe, abort } = renderToPipeableStream(page, {
      nonce,
      [readyOption]() {
        shellRendered = true;
        const body = new PassThrough({
          final(callback) {
            clearTimeout(timeoutId);
            timeoutId = undefined;
            callback();
          },
        });
        responseHeaders.set("Content-Type", "text/html");
        pipe(body);
        resolve(new Response(createReadableStreamFromReadable(body), { headers: responseHeaders, status: responseStatusCode }));
      },
      onShellError(error: unknown) {
        reject(error);
      },
      onError(error: unknown) {
        responseStatusCode = 500;
        // Errors in the shell reject above and are logged by the framework.
        if (shellRendered) console.error(error);
      },
    });
  });
}

/** The data of a client-side navigation is the page's, and as personal. */
export const handleDataRequest: HandleDataRequestFunction = async (response, { request }) => {
  await markPersonal(request, response.headers);
  return response;
};
