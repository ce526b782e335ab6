/**
 * Robustness classes: a named class of bad or hostile input (mutated rulesets,
 * random bytes, deep nesting…), run against one engine entry point with the
 * guarantees of docs/reliability.md checked for every input:
 *
 * - no exception: the engine answers bad input with its own located problems;
 * - no hang: no input takes longer than HANG_MS of processor time (a hang
 *   detector, not a speed test: processor time, not the clock, so that a busy
 *   machine is not a hang; and an input over the threshold is run twice more
 *   and counts only if it is over every time);
 * - every problem located (the target says what located means for it);
 * - Object.prototype, Array.prototype and Function.prototype unchanged.
 *
 * Each class writes its counts to build/robustness/<class>.json when its file's
 * tests end; test/setup/robustnessReporter.ts prints them all after the run.
 * Another test file adds a class with `robustnessClass(name)` and `tally.check`
 * (see DEVELOPERS.md).
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
export const ROBUSTNESS_DIR = join(ROOT, "build/robustness");
export const HANG_MS = 50;

export interface RobustnessCounts {
  /** The class, as the summary names it: "expression parser: deep nesting". */
  name: string;
  inputs: number;
  /** Exceptions thrown by the engine. */
  crashes: number;
  /** Inputs slower than HANG_MS on three tries. */
  hangs: number;
  /** Problems without the place the target requires. */
  unlocated: number;
  /** Inputs after which a built-in prototype had changed. */
  prototypeChanges: number;
  /** Inputs whose output broke a guarantee: NaN or Infinity written, a result id changed, two runs that differ. */
  wrongOutputs?: number;
}

/**
 * What an engine call gave: whether every problem it returned has the place the
 * target requires; and, where the target checks its output, what is wrong with
 * it (null or absent: nothing).
 */
export type Verdict = { located: boolean; wrongOutput?: string | null };

export interface Failure {
  what: "crash" | "hang" | "unlocated" | "prototype" | "wrong output";
  input: string;
  detail: string;
}

type Snapshot = Map<PropertyKey, PropertyDescriptor>;

/** Processor time used by this process so far, in milliseconds (user and system). */
function processorMs(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

const GUARDED: [string, object][] = [
  ["Object.prototype", Object.prototype],
  ["Array.prototype", Array.prototype],
  ["Function.prototype", Function.prototype],
];

function snapshot(o: object): Snapshot {
  return new Map(Reflect.ownKeys(o).map((k) => [k, Object.getOwnPropertyDescriptor(o, k) as PropertyDescriptor]));
}

const BEFORE = GUARDED.map(([name, o]) => ({ name, o, keys: snapshot(o), proto: Object.getPrototypeOf(o) as unknown, extensible: Object.isExtensible(o) }));

/** The name of the first built-in prototype that differs from its state when this module loaded, or null. */
export function changedPrototype(): string | null {
  for (const b of BEFORE) {
    if (Object.getPrototypeOf(b.o) !== b.proto || Object.isExtensible(b.o) !== b.extensible) return b.name;
    const now = Reflect.ownKeys(b.o);
    if (now.length !== b.keys.size) return `${b.name} (${now.length} own properties, was ${b.keys.size})`;
    for (const k of now) {
      const was = b.keys.get(k);
      const is = Object.getOwnPropertyDescriptor(b.o, k) as PropertyDescriptor;
      if (!was || was.value !== is.value || was.get !== is.get || was.set !== is.set || was.writable !== is.writable) return `${b.name}.${String(k)}`;
    }
  }
  return null;
}

/** Input shown in a failure: long inputs cut, with their length. */
export function shown(input: string): string {
  return input.length <= 300 ? JSON.stringify(input) : `${JSON.stringify(input.slice(0, 300))}… (${input.length} characters)`;
}

export interface RobustnessOptions {
  /**
   * Processor time above which an input counts as a hang (HANG_MS unless said):
   * a class of deliberately large inputs (10,000 components, 100,000 cases)
   * states its own bound, in docs/reliability.md.
   */
  hangMs?: number;
}

export class RobustnessClass {
  readonly counts: RobustnessCounts;
  readonly failures: Failure[] = [];
  readonly hangMs: number;

  constructor(name: string, options: RobustnessOptions = {}) {
    this.counts = { name, inputs: 0, crashes: 0, hangs: 0, unlocated: 0, prototypeChanges: 0, wrongOutputs: 0 };
    this.hangMs = options.hangMs ?? HANG_MS;
  }

  /**
   * As `check`, for a target that reads files or streams: awaited, and timed in
   * processor time too (the process's, so run a file's async classes one after
   * another, as vitest runs a file's tests).
   */
  async checkAsync<T>(input: T, target: (input: T) => Promise<Verdict>, describe: (input: T) => string = (x) => String(x)): Promise<boolean> {
    this.counts.inputs++;
    let verdict: Verdict;
    let elapsed: number;
    try {
      const t0 = processorMs();
      verdict = await target(input);
      elapsed = processorMs() - t0;
      for (let retry = 0; retry < 2 && elapsed > this.hangMs; retry++) {
        const t1 = processorMs();
        await target(input);
        elapsed = Math.min(elapsed, processorMs() - t1);
      }
    } catch (e) {
      this.counts.crashes++;
      return this.fail("crash", describe(input), e instanceof Error ? `${e.name}: ${e.message}` : String(e));
    }
    return this.judge(input, verdict, elapsed, describe);
  }

  /**
   * Runs `target` on one input and checks every guarantee; true when all hold.
   * `describe` turns the input into text for a failure report.
   */
  check<T>(input: T, target: (input: T) => Verdict, describe: (input: T) => string = (x) => String(x)): boolean {
    this.counts.inputs++;
    let verdict: Verdict;
    let elapsed: number;
    try {
      const t0 = processorMs();
      verdict = target(input);
      elapsed = processorMs() - t0;
      for (let retry = 0; retry < 2 && elapsed > this.hangMs; retry++) {
        const t1 = processorMs();
        target(input);
        elapsed = Math.min(elapsed, processorMs() - t1);
      }
    } catch (e) {
      this.counts.crashes++;
      return this.fail("crash", describe(input), e instanceof Error ? `${e.name}: ${e.message}` : String(e));
    }
    return this.judge(input, verdict, elapsed, describe);
  }

  private judge<T>(input: T, verdict: Verdict, elapsed: number, describe: (input: T) => string): boolean {
    const changed = changedPrototype();
    if (changed) {
      this.counts.prototypeChanges++;
      return this.fail("prototype", describe(input), `${changed} changed`);
    }
    if (elapsed > this.hangMs) {
      this.counts.hangs++;
      return this.fail("hang", describe(input), `${elapsed.toFixed(1)} ms of processor time on each of three tries`);
    }
    if (!verdict.located) {
      this.counts.unlocated++;
      return this.fail("unlocated", describe(input), "a problem without its place");
    }
    if (verdict.wrongOutput) {
      this.counts.wrongOutputs = (this.counts.wrongOutputs ?? 0) + 1;
      return this.fail("wrong output", describe(input), verdict.wrongOutput);
    }
    return true;
  }

  private fail(what: Failure["what"], input: string, detail: string): false {
    if (this.failures.length < 5) this.failures.push({ what, input: shown(input), detail });
    return false;
  }

  /** Writes the counts for the run's summary (test/setup/robustnessReporter.ts). */
  save(): void {
    mkdirSync(ROBUSTNESS_DIR, { recursive: true });
    const file = `${this.counts.name.toLowerCase().replace(/[^a-z0-9]+/g, "-")}.json`;
    writeFileSync(join(ROBUSTNESS_DIR, file), JSON.stringify(this.counts));
  }
}

/**
 * How many inputs a class runs: its share of the run's total. The normal run
 * tries about 10,000 inputs in all; `npm run fuzz` sets LOADWRIGHT_FUZZ_INPUTS
 * to 1,000,000.
 */
export function inputsFor(share: number): number {
  const total = Number(process.env.LOADWRIGHT_FUZZ_INPUTS ?? "") || DEFAULT_TOTAL;
  return Math.max(1, Math.ceil(total * share - 1e-9));
}

export const DEFAULT_TOTAL = 10_000;

/** A timeout for a test that runs `inputs` inputs: a safety cap, generous for a busy machine (20 ms an input). */
export function timeoutFor(inputs: number): number {
  return 60_000 + inputs * 20;
}
