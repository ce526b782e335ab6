/**
 * Real HTTPS on 127.0.0.1 for the firm library tests: a self-signed
 * certificate made for each run by the machine's `openssl` (no package to add,
 * and the tool every TLS setup guide uses), served by Node's `https` module,
 * and the SHA-256 of its public key (SPKI, base64) for Chromium's
 * --ignore-certificate-errors-spki-list: the browser trusts exactly this
 * certificate and no other. Each route is a handler; every request is
 * recorded with whether its answer was sent whole or cut off.
 */
import { execFileSync } from "node:child_process";
import { createHash, X509Certificate } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createServer as createHttpServer, type IncomingMessage, type ServerResponse } from "node:http";
import { createServer as createHttpsServer } from "node:https";
import type { AddressInfo, Server } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";

export interface Certificate {
  key: string;
  cert: string;
  /** base64 of the SHA-256 of the certificate's SubjectPublicKeyInfo (DER), as Chromium's SPKI list takes it. */
  spki: string;
}

/** A certificate for 127.0.0.1 and localhost, valid for two days, with a fresh P-256 key. */
export function selfSignedCertificate(): Certificate {
  const dir = mkdtempSync(path.join(tmpdir(), "loadwright-tls-"));
  try {
    const key = path.join(dir, "key.pem");
    const cert = path.join(dir, "cert.pem");
    execFileSync(
      "openssl",
      ["req", "-x509", "-newkey", "ec", "-pkeyopt", "ec_paramgen_curve:prime256v1", "-nodes", "-keyout", key, "-out", cert, "-days", "2", "-subj", "/CN=127.0.0.1", "-addext", "subjectAltName=IP:127.0.0.1,DNS:localhost"],
      { stdio: "pipe" },
    );
    const pem = readFileSync(cert, "utf8");
    const spkiDer = new X509Certificate(pem).publicKey.export({ type: "spki", format: "der" });
    return { key: readFileSync(key, "utf8"), cert: pem, spki: createHash("sha256").update(spkiDer).digest("base64") };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export type Handler = (request: IncomingMessage, response: ServerResponse) => void;

export interface ServedRequest {
  path: string;
  /** Whether the whole answer was sent (false: the connection closed before its end). */
  finished: boolean | null;
  /** Bytes of body written before the end or the close. */
  written: number;
}

export interface LibraryServer {
  origin: string;
  requests: ServedRequest[];
  /** Resolves once the answer to the n-th request (0-based) has ended or been cut off. */
  settled(index: number): Promise<ServedRequest>;
  close(): Promise<void>;
}

/** An HTTPS server (or, without a certificate, plain HTTP) answering `routes`; anything else is 404. */
export async function serveRoutes(routes: Record<string, Handler>, certificate: Certificate | null): Promise<LibraryServer> {
  const requests: ServedRequest[] = [];
  const waiting = new Map<number, (r: ServedRequest) => void>();
  const done = new Set<number>();
  const handle = (request: IncomingMessage, response: ServerResponse) => {
    const record: ServedRequest = { path: new URL(request.url ?? "/", "https://127.0.0.1").pathname, finished: null, written: 0 };
    const index = requests.push(record) - 1;
    const write = response.write.bind(response) as (chunk: string | Uint8Array) => boolean;
    response.write = ((chunk: string | Uint8Array, ...rest: never[]) => {
      record.written += typeof chunk === "string" ? Buffer.byteLength(chunk) : chunk.byteLength;
      return (write as (...a: unknown[]) => boolean)(chunk, ...rest);
    }) as typeof response.write;
    response.on("close", () => {
      record.finished = response.writableFinished;
      done.add(index);
      waiting.get(index)?.(record);
    });
    // The pane is served from another origin: the library's server must allow it to read the answer (CORS).
    response.setHeader("access-control-allow-origin", "*");
    const route = routes[record.path];
    if (route) route(request, response);
    else response.writeHead(404, { "content-type": "text/plain" }).end("not found");
  };
  const server: Server = certificate ? createHttpsServer({ key: certificate.key, cert: certificate.cert }, handle) : createHttpServer(handle);
  const sockets = new Set<import("node:net").Socket>();
  server.on("connection", (s) => {
    sockets.add(s);
    s.on("close", () => sockets.delete(s));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    origin: `${certificate ? "https" : "http"}://127.0.0.1:${port}`,
    requests,
    settled: (index) =>
      new Promise((resolve) => {
        if (done.has(index)) resolve(requests[index]);
        else waiting.set(index, resolve);
      }),
    close: () =>
      new Promise((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
