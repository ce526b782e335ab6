// npm run fuzz: the robustness classes of test/fuzz with 1,000,000 generated
// inputs in all (the normal test run tries 10,000), then the summary with the
// count of inputs, crashes and hangs. `npm run fuzz -- 200000` tries another
// total; LOADWRIGHT_FUZZ_SEED=n varies the seeds.
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const total = process.argv[2] ?? "1000000";
if (!/^[1-9][0-9]*$/.test(total)) {
  process.stderr.write(`npm run fuzz: "${total}" is not a whole number of inputs\n`);
  process.exit(2);
}
const run = spawnSync(process.execPath, [path.join(ROOT, "node_modules/vitest/vitest.mjs"), "run", "test/fuzz"], {
  cwd: ROOT,
  stdio: "inherit",
  env: { ...process.env, LOADWRIGHT_FUZZ_INPUTS: total },
});
process.exit(run.status ?? 1);
