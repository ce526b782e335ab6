/**
 * One production build of the add-in shared by every test that needs it: built
 * once per content of its inputs, into build/test-addin-<hash>, with a lock so
 * that test files running in parallel wait for the one build instead of each
 * starting their own. A later run with unchanged inputs reuses it.
 */
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

/** Everything the bundle, functions.json and manifest are made from. */
const INPUTS = ["src", "rulesets", "assets", "webpack.config.js", "manifest.xml", "tsconfig.json", "package-lock.json"];
const STALE_LOCK_MS = 10 * 60_000;

function filesUnder(p: string): string[] {
  if (!existsSync(p)) return [];
  if (!statSync(p).isDirectory()) return [p];
  return readdirSync(p)
    .sort()
    .flatMap((name) => filesUnder(path.join(p, name)));
}

function inputHash(): string {
  const hash = createHash("sha256");
  for (const file of INPUTS.flatMap((i) => filesUnder(path.join(ROOT, i)))) {
    hash.update(path.relative(ROOT, file)).update("\0").update(readFileSync(file)).update("\0");
  }
  return hash.digest("hex").slice(0, 16);
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function webpack(outputPath: string): Promise<void> {
  const cli = path.join(ROOT, "node_modules/webpack-cli/bin/cli.js");
  return new Promise((resolve, reject) => {
    execFile(
      process.execPath,
      [cli, "--mode", "production", "--env", `outputPath=${outputPath}`],
      { cwd: ROOT, timeout: 300_000, maxBuffer: 16 * 1024 * 1024 },
      (error, stdout, stderr) => (error ? reject(new Error(`webpack build failed:\n${stdout}\n${stderr}`)) : resolve()),
    );
  });
}

/** The directory of a complete production build of the current sources. */
export async function builtAddin(): Promise<string> {
  const buildDir = path.join(ROOT, "build");
  mkdirSync(buildDir, { recursive: true });
  const dir = path.join(buildDir, `test-addin-${inputHash()}`);
  const complete = path.join(dir, ".complete");
  const lock = `${dir}.lock`;
  for (;;) {
    if (existsSync(complete)) return dir;
    try {
      mkdirSync(lock);
      break;
    } catch {
      if (existsSync(lock) && Date.now() - statSync(lock).mtimeMs > STALE_LOCK_MS) rmSync(lock, { recursive: true, force: true });
      await sleep(500);
    }
  }
  try {
    if (!existsSync(complete)) {
      rmSync(dir, { recursive: true, force: true });
      await webpack(dir);
      writeFileSync(complete, new Date().toISOString());
      // Earlier builds of other sources are no longer needed.
      for (const name of readdirSync(buildDir)) {
        const other = path.join(buildDir, name);
        if (name.startsWith("test-addin-") && other !== dir && !name.endsWith(".lock") && !existsSync(`${other}.lock`)) {
          rmSync(other, { recursive: true, force: true });
        }
      }
    }
  } finally {
    rmSync(lock, { recursive: true, force: true });
  }
  return dir;
}
