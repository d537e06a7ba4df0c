// Where the request being handled came from. The app's Request does not carry
// the socket's address: server.js keeps, for each request's async work, an
// AsyncLocalStorage under the global symbol below with whether the socket is
// loopback and the client's address. Anywhere else (another server, tests
// calling a loader) there is no such store: no address, and not loopback.
// Test-only switches (GAITLOOM_RATE_LIMITS=off, for npm run probe) hold only
// for requests from this machine to an app served on this machine.
import { config } from "./config.server";

/** What server.js keeps for the request being handled. */
export type RequestPeer = {
  /** The socket's peer is 127.0.0.0/8 or ::1 (a proxy on this host counts as loopback). */
  loopback: boolean;
  /** The client's address: the socket's, or the one the proxy GAITLOOM_TRUST_PROXY names forwarded. */
  address: string;
};

export const REQUEST_PEER = Symbol.for("gaitloom.requestPeer");

type PeerStorage = { getStore(): RequestPeer | undefined };

const currentPeer = () => (globalThis as { [REQUEST_PEER]?: PeerStorage })[REQUEST_PEER]?.getStore();

/** Whether the request being handled came in on a loopback socket (127.0.0.0/8 or ::1). */
export function requestFromLoopback(): boolean {
  return currentPeer()?.loopback === true;
}

/** The client address of the request being handled, or null where no server recorded it. */
export function clientAddress(): string | null {
  return currentPeer()?.address || null;
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
