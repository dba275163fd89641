// The production web server: Next's own request handler behind a plain Node HTTP server, so the
// app can know the socket's peer address. `next start` hands route handlers no peer address, and
// X-Forwarded-For is whatever a client writes; without a trusted proxy the per-client limits of
// sign-in and sign-up need the real one (lib/auth/client-ip.ts reads the header set here).
//   node scripts/serve.mjs --port 3000 [--hostname 127.0.0.1]
import { createServer } from "node:http";
import { parseArgs } from "node:util";
import next from "next";

const { values } = parseArgs({ options: { port: { type: "string", default: "3000" }, hostname: { type: "string" } } });
const port = Number(values.port);
if (!Number.isInteger(port) || port < 1 || port > 65535) {
  console.error(`serve: --port must be a TCP port, got ${values.port}`);
  process.exit(2);
}

// Must match lib/auth/client-ip.ts: the app believes the header only in a process that raised this mark.
const PEER_HEADER = "x-gyrolux-peer";
globalThis[Symbol.for("gyrolux.socket-peer-header")] = true;

const app = next({ dev: false, hostname: values.hostname ?? "localhost", port });
const handle = app.getRequestHandler();
await app.prepare();

const server = createServer((request, response) => {
  // Whatever the client sent under this name is replaced by the socket's own peer.
  request.headers[PEER_HEADER] = request.socket.remoteAddress ?? "";
  handle(request, response);
});
server.listen(port, values.hostname, () => {
  console.log(`Gyrolux serving on http://${values.hostname ?? "localhost"}:${port}`);
});
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => server.close(() => process.exit(0)));
