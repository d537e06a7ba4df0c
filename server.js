// The production server: `node server.js build/server/index.js`, from the
// folder that holds build/. The built app behind Express, as React Router's
// own server runs it, with less work per request: files are looked for on
// disk only under the names the build holds (not with a disk lookup before
// every API call), and the shutdown ends the process. Measured with
// `npm run bench` (GET /healthz, 20 clients).
import { createRequestHandler } from "@react-router/express";
import compression from "compression";
import express from "express";
import helmet from "helmet";
import morgan from "morgan";
import { AsyncLocalStorage } from "node:async_hooks";
import { readdirSync } from "node:fs";
import { isIP } from "node:net";
import path from "node:path";
import { pathToFileURL } from "node:url";

const buildArg = process.argv[2];
if (!buildArg) {
  console.error("Usage: node server.js <server build>, e.g. node server.js build/server/index.js");
  process.exit(1);
}
const buildPath = path.resolve(buildArg);
const build = await import(pathToFileURL(buildPath).href);
const clientDir = path.resolve(path.dirname(buildPath), "..", "client");

const app = express();
app.disable("x-powered-by");
// An answer given before the request's body was all read (a 413 at the limit,
// a refusal before the form is read) leaves the rest of the body between this
// request and the next on a keep-alive connection, which Node would then wait
// for: such an answer says `Connection: close`. Node would close the
// connection as soon as the answer is out, and the client, still sending,
// would meet a reset and often lose the answer; so the connection lingers
// half-closed for a moment first, as web servers do ("lingering close").
const LINGER_MS = 2000;
app.use((req, res, next) => {
  const writeHead = res.writeHead;
  res.writeHead = function (...args) {
    if (!req.complete && !res.headersSent) {
      res.setHeader("Connection", "close");
      req.socket.destroySoon = function lingeringClose() {
        if (this.writable) this.end();
        const timer = setTimeout(() => this.destroy(), LINGER_MS);
        this.once("close", () => clearTimeout(timer));
      };
    }
    return writeHead.apply(this, args);
  };
  next();
});
// The headers every answer carries, files and the refusals below included
// (docs/decisions/010-headers.md): helmet's, with X-Frame-Options DENY, as the
// pages' frame-ancestors 'none' says, and Referrer-Policy
// strict-origin-when-cross-origin, since with helmet's no-referrer Chromium
// sends `Origin: null` on our own form posts, which the origin guard refuses.
// Permissions-Policy by hand (helmet has none): no powerful feature but Web
// Serial, for the firmware kit's bench link. A page's Content-Security-Policy
// is the app's, with the nonce it made (app/entry.server.tsx); any other answer
// loads nothing. That one is set as the answer goes out, if the app set none:
// the adapter adds the app's headers to those already set, and a browser
// would enforce both policies.
const PERMISSIONS_POLICY =
  "accelerometer=(), camera=(), display-capture=(), geolocation=(), gyroscope=(), hid=(), magnetometer=(), microphone=(), midi=(), payment=(), usb=(), serial=(self)";
const NOTHING_POLICY = "default-src 'none'; frame-ancestors 'none'";
app.use(helmet({ contentSecurityPolicy: false, xFrameOptions: { action: "deny" }, referrerPolicy: { policy: "strict-origin-when-cross-origin" } }));
app.use((req, res, next) => {
  res.setHeader("Permissions-Policy", PERMISSIONS_POLICY);
  const writeHead = res.writeHead;
  res.writeHead = function (...args) {
    if (!res.hasHeader("Content-Security-Policy")) res.setHeader("Content-Security-Policy", NOTHING_POLICY);
    return writeHead.apply(this, args);
  };
  next();
});
// Compressed only when the client asks (Accept-Encoding), as usual.
app.use(compression());
// Hashed build assets never change under their name.
app.use("/assets", express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "1y" }));
const topLevel = new Set(readdirSync(clientDir).filter((name) => name !== "assets"));
const files = express.static(clientDir, { index: false, maxAge: "1h" });
app.use((req, res, next) => (topLevel.has(req.path.split("/")[1]) ? files(req, res, next) : next()));
app.use(morgan("tiny"));

// What the framework cannot make a Fetch Request of would fail inside it as a
// 500: a Host header that names no host, and TRACE, a method Fetch forbids
// (Node's parser itself refuses the others, CONNECT and TRACK); under /api/v1
// TRACE is one of the methods answered 405 below.
app.use((req, res, next) => {
  const api = /^\/api\/v1(\/|$)/.test(req.path);
  if (!URL.canParse(`http://${req.get("host") ?? ""}/`)) {
    const message = "The Host header does not name a host.";
    return api ? res.status(400).json({ error: { code: "bad_request", message } }) : res.status(400).type("text/plain").send(message);
  }
  if (req.method === "TRACE" && !api) return res.status(405).set("Allow", "GET, HEAD, POST").type("text/plain").send("TRACE is not a method Gaitloom answers.");
  next();
});

// Where each request came from, for the rate limits and the test-only
// switches: the app's Request carries no socket address, so it is kept for
// each request's async work (app/platform/loopback.server.ts reads it). The
// client's address is the socket's; behind a reverse proxy,
// GAITLOOM_TRUST_PROXY names the proxy's addresses (comma-separated addresses
// or subnets), and for a request from one of them the right-most
// X-Forwarded-For entry that is not the proxy's counts instead, as Express's
// `trust proxy` reads it (which also takes X-Forwarded-Proto and -Host from
// that proxy). A client can add entries of its own on the left, never on
// the right, which its proxy writes.
const trustProxy = process.env.GAITLOOM_TRUST_PROXY?.trim();
if (trustProxy) {
  const proxies = trustProxy.split(",").map((entry) => entry.trim());
  // Express would also take a hop count or `true` (anyone may forward), and reads "1" as the address 0.0.0.1.
  const namesAddress = (entry) => ["loopback", "linklocal", "uniquelocal"].includes(entry) || isIP(entry.replace(/\/\d+$/, "")) !== 0;
  try {
    const wrong = proxies.find((entry) => !namesAddress(entry));
    if (wrong !== undefined) throw new Error(`${JSON.stringify(wrong)} is not an address`);
    app.set("trust proxy", proxies);
  } catch (error) {
    console.error(`GAITLOOM_TRUST_PROXY must name the proxy's addresses, e.g. 10.0.0.5 or 10.0.0.0/24: ${error.message}.`);
    process.exit(1);
  }
}
const isLoopback = (address = "") => address === "::1" || /^(::ffff:)?127\./.test(address);
const peers = new AsyncLocalStorage();
globalThis[Symbol.for("gaitloom.requestPeer")] = peers;
// Test-only, for npm run probe (scripts/probe), and only for requests from
// this machine: with GAITLOOM_PROBE_COUNTS=1, every loader and action a
// loopback request enters is counted per route, method and handler (the
// framework's route instrumentation), named in the answer's
// X-Gaitloom-Probe-Reached header, and the counts are served to loopback at
// GET /local/probe-counts.
const probeCounts = process.env.GAITLOOM_PROBE_COUNTS === "1";
app.use((req, res, next) => {
  const peer = { loopback: isLoopback(req.socket.remoteAddress), address: req.ip ?? "", reached: [] };
  if (probeCounts && peer.loopback) {
    const writeHead = res.writeHead;
    res.writeHead = function (...args) {
      if (peer.reached.length && !res.headersSent) res.setHeader("X-Gaitloom-Probe-Reached", peer.reached.join(", "));
      return writeHead.apply(this, args);
    };
  }
  peers.run(peer, next);
});
let served = build;
if (probeCounts) {
  const counts = new Map();
  const counting = {
    route(route) {
      const count =
        (handler) =>
        async (call, { request }) => {
          const peer = peers.getStore();
          if (peer?.loopback) {
            const key = `${route.id} ${request.method} ${handler}`;
            counts.set(key, (counts.get(key) ?? 0) + 1);
            peer.reached.push(`${route.id} ${handler}`);
          }
          await call();
        };
      route.instrument({ loader: count("loader"), action: count("action") });
    },
  };
  const instrumentations = [...(build.entry.module.instrumentations ?? []), counting];
  served = { ...build, entry: { ...build.entry, module: { ...build.entry.module, instrumentations } } };
  app.get("/local/probe-counts", (req, res) => {
    if (!isLoopback(req.socket.remoteAddress)) return res.status(404).end();
    res.set("Cache-Control", "no-store").json(Object.fromEntries(counts));
  });
}

// The framework routes these methods; for any other it answers 405 in a shape
// of its own before the app's middleware runs. Under /api/v1 the answer is
// made here, in the API's error shape: 405 with the methods the API uses, a
// refusal of the client's request rather than a fault of the server (OPTIONS
// on an address names the ones it answers).
const ROUTED_METHODS = ["GET", "HEAD", "OPTIONS", "POST", "PUT", "PATCH", "DELETE"];
app.use("/api/v1", (req, res, next) => {
  if (ROUTED_METHODS.includes(req.method)) return next();
  const message = `${req.method} is not a method this API answers; OPTIONS on an address lists the methods it takes.`;
  res
    .status(405)
    .set("Allow", ROUTED_METHODS.join(", "))
    .json({ error: { code: "method_not_allowed", message, details: { method: req.method } } });
});

// app.use, not app.all("*"): Express decodes a route's parameters and answers
// a malformed percent-encoding (/api/v1/robots/%E0%A4%A) with its own HTML 400
// before the app sees it; the app reads such addresses itself (the API
// refuses them in its own shape).
app.use(createRequestHandler({ build: served, mode: process.env.NODE_ENV }));

// Whatever still reaches Express as an error (the handler passes on what it
// could not answer) is answered under /api/v1 in the API's error shape, its
// own text logged rather than sent; elsewhere Express answers as usual.
app.use((error, req, res, next) => {
  if (!/^\/api\/v1(\/|$)/.test(req.path) || res.headersSent) return next(error);
  console.error(error);
  const status = Number(error?.status ?? error?.statusCode);
  if (status >= 400 && status < 500) return res.status(status).json({ error: { code: "bad_request", message: "The request could not be read." } });
  const message = "Something went wrong on our side and the request was not completed; the error has been logged.";
  res.status(500).json({ error: { code: "internal_error", message } });
});

const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? "127.0.0.1";
const server = app.listen(port, host, () => console.log(`[gaitloom] http://${host}:${port}`));

// Stop taking requests, let those in flight finish, then exit (the database
// pool would otherwise keep the process alive).
for (const signal of ["SIGTERM", "SIGINT"]) {
  process.once(signal, () => {
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    setTimeout(() => process.exit(0), 5000).unref();
  });
}
