/** Opening the user's files, with every failure said in one line that names the file. */
import { readFileSync, statSync } from "node:fs";
import { CliError } from "../cliError.js";

/** The file's size in bytes, or a CliError saying why it cannot be read. */
export function checkReadable(path: string, what: string): number {
  try {
    const stat = statSync(path);
    if (stat.isDirectory()) throw new CliError(`${path}: is a directory, not a ${what}`);
    return stat.size;
  } catch (e) {
    if (e instanceof CliError) throw e;
    throw new CliError(`${path}: ${fileErrorText(e)}`);
  }
}

export function readText(path: string, what: string): string {
  checkReadable(path, what);
  try {
    return readFileSync(path, "utf8").replace(/^\uFEFF/, "");
  } catch (e) {
    throw new CliError(`${path}: ${fileErrorText(e)}`);
  }
}

export function fileErrorText(e: unknown): string {
  const code = (e as { code?: unknown }).code;
  if (code === "ENOENT") return "no such file";
  if (code === "EACCES" || code === "EPERM") return "cannot be read (permission denied)";
  if (code === "EISDIR") return "is a directory";
  return `cannot be read (${e instanceof Error ? e.message : String(e)})`;
}
