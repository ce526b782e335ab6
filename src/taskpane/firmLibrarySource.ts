/**
 * The text of a firm library, from a file the user chooses or from an HTTPS
 * address. Only https:// is read: a plain HTTP address is refused before any
 * request, because anyone on the way could change the rulesets it carries. A
 * library is at most FIRM_LIBRARY_LIMITS.bytes long — the body is read as a
 * stream and reading stops at the limit — and the whole request (connection,
 * answer and body) must end within FIRM_LIBRARY_LIMITS.seconds, or it is
 * aborted. Every refusal says what went wrong; nothing here changes any state.
 */
import { MAX_FIRM_LIBRARY_CHARACTERS, problem, type Result } from "../core/index.js";

export const FIRM_LIBRARY_LIMITS = {
  /**
   * The loader's limit of 5,000,000 characters, counted in bytes: a UTF-8 byte
   * count is never below the character count, so nothing the loader accepts in
   * ASCII is refused, and nothing it refuses is read whole.
   */
  bytes: MAX_FIRM_LIBRARY_CHARACTERS,
  /** A library of a hundred rulesets is about 2 MB: 30 s leaves room for a slow link, and a hung server is given up. */
  seconds: 30,
};

export type LibraryLimits = typeof FIRM_LIBRARY_LIMITS;

const refuse = (message: string): Result<never> => ({ ok: false, problems: [problem("library-read", message)] });

const bytes = (n: number) => `${n.toLocaleString("en-US")} bytes`;

/** The address a library is read from: https:// only, checked before anything is requested. */
export function libraryAddress(text: string): Result<URL> {
  const written = text.trim();
  if (written === "") return refuse("no address is given: type the https:// address the firm publishes its library at");
  let url: URL;
  try {
    url = new URL(written);
  } catch {
    return refuse(`"${written}" is not an address: write it whole, starting with https://`);
  }
  if (url.protocol === "http:") {
    return refuse(`plain HTTP is refused (${written}): the library would travel unprotected, and anyone on the way could change the rulesets it holds; publish it at an https:// address`);
  }
  if (url.protocol !== "https:") return refuse(`only https:// addresses are read, not ${url.protocol} (${written})`);
  if (url.username !== "" || url.password !== "") {
    return refuse(`an address holding a user name or password is refused (${url.host}): it would be kept in the workbook for everyone who opens it`);
  }
  return { ok: true, value: url };
}

/** The library's text from an HTTPS address, within the limits; `fetcher` is the browser's fetch. */
export async function fetchLibraryText(url: URL, fetcher: typeof fetch, limits: LibraryLimits = FIRM_LIBRARY_LIMITS): Promise<Result<string>> {
  if (url.protocol !== "https:") return refuse(`only https:// addresses are read, not ${url.protocol}`);
  const controller = new AbortController();
  let timedOut = false;
  const timer = setTimeout(() => {
    timedOut = true;
    controller.abort();
  }, limits.seconds * 1000);
  const tooSlow = (received: number) =>
    refuse(`the server did not deliver the library within ${limits.seconds} s (${received > 0 ? `${bytes(received)} had arrived` : "nothing had arrived"}); the request was stopped`);
  try {
    let response: Response;
    try {
      // Redirects are not followed: one could lead to a plain HTTP address.
      response = await fetcher(url.href, { signal: controller.signal, redirect: "error", cache: "no-store" });
    } catch (e) {
      if (timedOut) return tooSlow(0);
      return refuse(
        `no answer could be read (${reasonOf(e)}): the server cannot be reached, its certificate is not trusted, it does not allow the add-in to read the file (CORS), or the address redirects elsewhere (redirects are not followed)`,
      );
    }
    if (!response.ok) return refuse(`the server answered ${`${response.status} ${response.statusText}`.trim()} instead of the library`);
    const announced = Number(response.headers.get("content-length") ?? "");
    if (Number.isFinite(announced) && announced > limits.bytes) {
      controller.abort();
      return refuse(`the server announces ${bytes(announced)}, more than the ${bytes(limits.bytes)} a library may hold; nothing was read. Is this the library file?`);
    }
    const body = await readBody(response, limits.bytes);
    if (body.kind === "too-large") {
      controller.abort();
      return refuse(`the library is larger than the ${bytes(limits.bytes)} it may hold: reading stopped at ${bytes(body.received)}. Is this the library file?`);
    }
    if (body.kind === "broken") {
      if (timedOut) return tooSlow(body.received);
      return refuse(`the connection closed after ${bytes(body.received)}, before the whole library arrived (${body.reason}); try again`);
    }
    return decodeText(body.data, "the server's answer");
  } finally {
    clearTimeout(timer);
  }
}

/** The library's text from a file the user chose, refused unread when it is larger than the limit. */
export async function fileLibraryText(file: Blob & { name: string }, limits: LibraryLimits = FIRM_LIBRARY_LIMITS): Promise<Result<string>> {
  if (file.size > limits.bytes) return refuse(`${file.name} holds ${bytes(file.size)}, more than the ${bytes(limits.bytes)} a library may hold; nothing was read. Is this the library file?`);
  try {
    return decodeText(new Uint8Array(await file.arrayBuffer()), file.name);
  } catch (e) {
    return refuse(`${file.name} could not be read: ${reasonOf(e)}`);
  }
}

type Body = { kind: "whole"; data: Uint8Array } | { kind: "too-large"; received: number } | { kind: "broken"; received: number; reason: string };

/** The body as a stream, stopped as soon as it passes `limit` bytes. */
async function readBody(response: Response, limit: number): Promise<Body> {
  if (!response.body) return { kind: "whole", data: new Uint8Array(0) };
  const reader = response.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    let part: ReadableStreamReadResult<Uint8Array>;
    try {
      part = await reader.read();
    } catch (e) {
      return { kind: "broken", received, reason: reasonOf(e) };
    }
    if (part.done) break;
    received += part.value.byteLength;
    if (received > limit) {
      reader.cancel().catch(() => undefined);
      return { kind: "too-large", received };
    }
    chunks.push(part.value);
  }
  const data = new Uint8Array(received);
  let at = 0;
  for (const c of chunks) {
    data.set(c, at);
    at += c.byteLength;
  }
  return { kind: "whole", data };
}

function decodeText(data: Uint8Array, what: string): Result<string> {
  try {
    // fatal: a byte sequence that is not UTF-8 is refused, never turned into replacement characters.
    return { ok: true, value: new TextDecoder("utf-8", { fatal: true }).decode(data) };
  } catch {
    return refuse(`${what} is not UTF-8 text; a library file is JSON written in UTF-8`);
  }
}

function reasonOf(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
