/**
 * Runs the real command line as a child process, from a fresh build of the
 * current sources: the build is keyed by a hash of everything it compiles, so
 * tests never run a stale build, and test files running at once share one.
 * The build is laid out like the package (bin/ beside build/cli/), so the
 * package's own bin/loadwright.js is what runs.
 */
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { promisify } from "node:util";
import { parse } from "csv-parse/sync";

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
export const FIXTURES = join(ROOT, "test/cli/fixtures");
const BUILDS = join(ROOT, "build/cli-test");

const run = promisify(execFile);

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) out.push(...sourceFiles(path));
    else if (/\.(ts|json)$/.test(entry.name)) out.push(path);
  }
  return out.sort();
}

function sourceHash(): string {
  const hash = createHash("sha256");
  const files = [...sourceFiles(join(ROOT, "src")), ...sourceFiles(join(ROOT, "rulesets")), join(ROOT, "tsconfig.json"), join(ROOT, "tsconfig.cli.json"), join(ROOT, "bin/loadwright.js"), join(ROOT, "package.json")];
  for (const f of files) hash.update(relative(ROOT, f)).update("\0").update(readFileSync(f)).update("\0");
  return hash.digest("hex").slice(0, 16);
}

async function sleep(ms: number): Promise<void> {
  await new Promise((r) => setTimeout(r, ms));
}

/** The directory of a build of the current sources, building it once if needed. */
export async function builtPackage(): Promise<string> {
  const hash = sourceHash();
  const dir = join(BUILDS, hash);
  const lock = `${dir}.lock`;
  mkdirSync(BUILDS, { recursive: true });
  for (let waited = 0; !existsSync(join(dir, "bin/loadwright.js")); waited += 250) {
    try {
      mkdirSync(lock);
    } catch {
      // Another test file is building the same sources; a lock older than two minutes is left over from a crash.
      if (waited > 120_000 || Date.now() - statSync(lock).mtimeMs > 120_000) rmSync(lock, { recursive: true, force: true });
      await sleep(250);
      continue;
    }
    try {
      const staging = `${dir}.staging-${process.pid}`;
      rmSync(staging, { recursive: true, force: true });
      // Type errors are the typecheck's business (npm run typecheck); this build only needs the JavaScript.
      await run(process.execPath, [join(ROOT, "node_modules/typescript/bin/tsc"), "-p", join(ROOT, "tsconfig.cli.json"), "--noCheck", "--outDir", join(staging, "build/cli")], { cwd: ROOT });
      mkdirSync(join(staging, "bin"));
      copyFileSync(join(ROOT, "bin/loadwright.js"), join(staging, "bin/loadwright.js"));
      writeFileSync(join(staging, "package.json"), readFileSync(join(ROOT, "package.json")));
      // Builds of other sources an hour old are left over (another run in this checkout may still use a newer one).
      for (const old of readdirSync(BUILDS)) {
        const path = join(BUILDS, old);
        if (!old.startsWith(hash) && Date.now() - statSync(path).mtimeMs > 3_600_000) rmSync(path, { recursive: true, force: true });
      }
      renameSync(staging, dir);
    } finally {
      rmSync(lock, { recursive: true, force: true });
    }
  }
  return dir;
}

export interface CliRun {
  status: number;
  stdout: string;
  stderr: string;
}

/** `loadwright ARGS…` in a child process, in `cwd` (the fixtures by default). */
export async function loadwright(args: string[], options: { cwd?: string; env?: NodeJS.ProcessEnv } = {}): Promise<CliRun> {
  const bin = join(await builtPackage(), "bin/loadwright.js");
  try {
    const { stdout, stderr } = await run(process.execPath, [bin, ...args], {
      cwd: options.cwd ?? FIXTURES,
      env: { ...process.env, NO_COLOR: "1", ...options.env },
      maxBuffer: 256 * 1024 * 1024,
    });
    return { status: 0, stdout, stderr };
  } catch (e) {
    const failed = e as { code?: number; stdout?: string; stderr?: string };
    if (typeof failed.code !== "number") throw e;
    return { status: failed.code, stdout: failed.stdout ?? "", stderr: failed.stderr ?? "" };
  }
}

/** A CSV output of the command line, parsed by csv-parse. */
/** The error lines of a run, without their "loadwright: error: " prefix. */
export function errorLines(stderr: string): string[] {
  return stderr
    .split("\n")
    .filter((l) => l.startsWith("loadwright: error: "))
    .map((l) => l.slice("loadwright: error: ".length));
}

export function csvRows(text: string): string[][] {
  return parse(text, { relax_column_count: false }) as string[][];
}
