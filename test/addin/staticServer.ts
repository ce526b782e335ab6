/** A plain HTTP server for a built add-in directory, on a free port of 127.0.0.1, for the browser tests. */
import { readFile } from "node:fs/promises";
import { createServer, type Server } from "node:http";
import path from "node:path";

const TYPES: Record<string, string> = {
  ".html": "text/html; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".xml": "application/xml; charset=utf-8",
  ".png": "image/png",
  ".map": "application/json; charset=utf-8",
};

export interface StaticServer {
  origin: string;
  close(): Promise<void>;
}

export async function serveDirectory(root: string): Promise<StaticServer> {
  const server: Server = createServer((request, response) => {
    const pathname = decodeURIComponent(new URL(request.url ?? "/", "http://localhost").pathname);
    const file = path.join(root, path.normalize(pathname));
    if (!file.startsWith(root)) {
      response.writeHead(403).end();
      return;
    }
    readFile(file).then(
      (body) => response.writeHead(200, { "content-type": TYPES[path.extname(file)] ?? "application/octet-stream" }).end(body),
      () => response.writeHead(404).end(),
    );
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const address = server.address();
  if (address === null || typeof address === "string") throw new Error("the test server has no port");
  return {
    origin: `http://127.0.0.1:${address.port}`,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
