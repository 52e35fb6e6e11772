// The production server (npm start): static files and the React Router app, as react-router-serve
// serves them, plus what that server cannot do: the security header table on every response (static
// files and anything React Router answers before our middleware), and the client's address in the
// router context for the throttles — from the socket, or from X-Forwarded-For when TRUST_PROXY=true.
//   node scripts/serve.mjs build/server/index.js
import os from "node:os";
import path from "node:path";
import url from "node:url";
import { createRequestHandler } from "@react-router/express";
import compression from "compression";
import express from "express";
import morgan from "morgan";
import { RouterContextProvider } from "react-router";

process.env.NODE_ENV = process.env.NODE_ENV ?? "production";
const production = process.env.NODE_ENV === "production";

const buildPath = path.resolve(process.argv[2] ?? "build/server/index.js");
const build = await import(url.pathToFileURL(buildPath).href);
const { clientAddressContext, documentRequestContext, fillHeaderValues, kindOf } = build.entry.module;
const clientDir = path.resolve(path.dirname(buildPath), "..", "client");

const app = express();
app.disable("x-powered-by");
app.set("trust proxy", process.env.TRUST_PROXY === "true");

// The header table on every response, whatever writes it: fills only what the response lacks.
app.use((req, res, next) => {
  const writeHead = res.writeHead;
  res.writeHead = function (...args) {
    if (!res.headersSent) {
      const type = res.getHeader("Content-Type");
      fillHeaderValues(
        (name) => res.hasHeader(name),
        (name, value) => res.setHeader(name, value),
        kindOf(req.path, type ? String(type) : null),
        production,
      );
    }
    return writeHead.apply(this, args);
  };
  next();
});
app.use(compression());
app.use("/assets", express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "1y" }));
app.use(express.static(clientDir, { maxAge: "1h" }));
app.use(morgan("tiny"));
app.all(
  "*",
  createRequestHandler({
    build,
    mode: process.env.NODE_ENV,
    getLoadContext(req) {
      const context = new RouterContextProvider();
      context.set(clientAddressContext, req.ip ?? req.socket.remoteAddress ?? "unknown");
      // a rendered page, not a client navigation's .data request (the page cache keeps pages only)
      context.set(documentRequestContext, req.method === "GET" && !req.path.endsWith(".data"));
      return context;
    },
  }),
);

const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST;
const onListen = () => {
  const lan = Object.values(os.networkInterfaces())
    .flat()
    .find((ip) => String(ip?.family).includes("4") && !ip?.internal)?.address;
  console.log(`[sealwright] http://${host ?? "localhost"}:${port}${!host && lan ? ` (http://${lan}:${port})` : ""}`);
};
const server = host ? app.listen(port, host, onListen) : app.listen(port, onListen);
for (const signal of ["SIGTERM", "SIGINT"]) process.once(signal, () => server.close());
