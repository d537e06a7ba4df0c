// Where a request came from, as server.js records it for each request's async
// work (app/platform/loopback.server.ts reads it): for tests that call a
// loader in-process, where no server saw a socket.
import { AsyncLocalStorage } from "node:async_hooks";
import { REQUEST_PEER, type RequestPeer } from "~/platform/loopback.server";

type Peer = RequestPeer & { address: string };

const peers = new AsyncLocalStorage<Peer>();
const slot = globalThis as { [REQUEST_PEER]?: unknown };

/** Makes the app read peers from `fromPeer` (as server.js installs its store); `forgetPeers` undoes it. */
export function recordPeers(): void {
  slot[REQUEST_PEER] = peers;
}

export function forgetPeers(): void {
  delete slot[REQUEST_PEER];
}

/** Runs `run` as the handling of a request from `address` (loopback when it is 127.x or ::1). */
export function fromPeer<T>(address: string, run: () => T): T {
  return peers.run({ loopback: address === "::1" || address.startsWith("127."), address }, run);
}
