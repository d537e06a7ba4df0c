// Test-only switches (GAITLOOM_RATE_LIMITS=off, for npm run probe) hold only
// for requests from this machine to an app served on this machine. The app's
// Request does not carry the socket's address: server.js keeps it, while such
// a switch is on, for each request's async work in an AsyncLocalStorage under
// the global symbol below. Anywhere else (another server, tests calling a
// loader) there is no such store, and the answer is no.
import { config } from "./config.server";

/** What server.js keeps for the request being handled. */
export type RequestPeer = { loopback: boolean };

export const REQUEST_PEER = Symbol.for("gaitloom.requestPeer");

type PeerStorage = { getStore(): RequestPeer | undefined };

/** Whether the request being handled came in on a loopback socket (127.0.0.0/8 or ::1). */
export function requestFromLoopback(): boolean {
  const storage = (globalThis as { [REQUEST_PEER]?: PeerStorage })[REQUEST_PEER];
  return storage?.getStore()?.loopback === true;
}

/**
 * Whether the app's public address is this machine. Behind a reverse proxy on
 * the same host every request arrives from loopback, so the socket alone does
 * not tell a local client from the world; PUBLIC_URL does.
 */
export function servedOnLoopback(): boolean {
  const host = new URL(config().publicUrl).hostname;
  return host === "localhost" || host === "[::1]" || /^127\.\d+\.\d+\.\d+$/.test(host);
}
