/**
 * The command line run in this process (`run(argv, io)` from src/cli/run.ts,
 * the function the bin calls) with its output collected: the same reading
 * modules, commands and messages as the child process, at a fraction of the
 * cost, for the robustness classes' volume. A few inputs per class still go
 * through the real child process (cliRepresentative.test.ts).
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Writable } from "node:stream";
import { run } from "../../src/cli/run.js";
import { Sink } from "../../src/cli/output/sink.js";

export interface CliOutcome {
  status: number;
  stdout: string;
  stderr: string;
}

function collector(): { stream: Writable; text: () => string } {
  const chunks: string[] = [];
  const stream = new Writable({
    write(chunk: Buffer | string, _encoding, done) {
      chunks.push(typeof chunk === "string" ? chunk : chunk.toString("utf8"));
      done();
    },
  });
  return { stream, text: () => chunks.join("") };
}

export async function cliInProcess(args: string[]): Promise<CliOutcome> {
  const out = collector();
  const err = collector();
  const status = await run(args, { out: new Sink(out.stream), err: new Sink(err.stream), stdoutIsTerminal: false });
  return { status, stdout: out.text(), stderr: err.text() };
}

export { errorLines } from "../cli/harness.js";

/** A folder of one's own for generated files, and a writer of numbered files in it. */
export function scratch(prefix: string): { dir: string; file(extension: string, content: string | Buffer): string } {
  const dir = mkdtempSync(join(tmpdir(), `loadwright-${prefix}-`));
  let count = 0;
  return {
    dir,
    file(extension, content) {
      const path = join(dir, `t${count++}.${extension}`);
      writeFileSync(path, content);
      return path;
    },
  };
}
