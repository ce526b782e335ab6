/**
 * One test per robustness class: `inputsFor(share)` generated inputs, seeded,
 * each checked by RobustnessClass; the counts are saved for the summary whether
 * the test passes or not, and a failure lists the first failing inputs.
 */
import fc from "fast-check";
import { expect, test } from "vitest";
import { inputsFor, RobustnessClass, timeoutFor, type RobustnessOptions, type Verdict } from "./robustness.js";

/** A fixed seed per class (a run can be varied with LOADWRIGHT_FUZZ_SEED). */
function seedOf(name: string): number {
  let h = Number(process.env.LOADWRIGHT_FUZZ_SEED ?? 0) | 0;
  for (const ch of name) h = (Math.imul(h, 31) + ch.charCodeAt(0)) | 0;
  return h;
}

export function fuzzClass<T>(name: string, share: number, inputs: fc.Arbitrary<T>, target: (input: T) => Verdict, describe?: (input: T) => string): void {
  const runs = inputsFor(share);
  test(
    `${name}: ${runs.toLocaleString("en-US")} inputs without a crash, a hang, an unlocated problem or a changed prototype`,
    () => {
      const tally = new RobustnessClass(name);
      try {
        fc.assert(
          fc.property(inputs, (input) => tally.check(input, target, describe)),
          { numRuns: runs, seed: seedOf(name), endOnFailure: true },
        );
      } catch (e) {
        // A failing input is in tally.failures, reported below with what went wrong; anything else
        // (a generator that throws) is a defect of the test itself.
        if (tally.failures.length === 0) throw e;
      } finally {
        tally.save();
      }
      expect(tally.failures).toEqual([]);
      expect(tally.counts.inputs).toBeGreaterThanOrEqual(runs);
    },
    timeoutFor(runs),
  );
}

/** As fuzzClass, for a target that reads files or streams (the command line's readers, run in this process). */
export function fuzzClassAsync<T>(
  name: string,
  share: number,
  inputs: fc.Arbitrary<T>,
  target: (input: T) => Promise<Verdict>,
  describe?: (input: T) => string,
  options: RobustnessOptions = {},
): void {
  const runs = inputsFor(share);
  test(
    `${name}: ${runs.toLocaleString("en-US")} inputs without a crash, a hang, an unlocated problem or a changed prototype`,
    async () => {
      const tally = new RobustnessClass(name, options);
      try {
        await fc.assert(
          fc.asyncProperty(inputs, (input) => tally.checkAsync(input, target, describe)),
          { numRuns: runs, seed: seedOf(name), endOnFailure: true },
        );
      } catch (e) {
        if (tally.failures.length === 0) throw e;
      } finally {
        tally.save();
      }
      expect(tally.failures).toEqual([]);
      expect(tally.counts.inputs).toBeGreaterThanOrEqual(runs);
    },
    timeoutFor(runs),
  );
}
