/** A test that writes to the console is hiding something: fail it. */
import { afterEach, beforeEach, expect, vi } from "vitest";

const methods = ["log", "info", "warn", "error", "debug"] as const;
let calls: string[] = [];

beforeEach(() => {
  calls = [];
  for (const m of methods) {
    vi.spyOn(console, m).mockImplementation((...args: unknown[]) => {
      calls.push(`console.${m}: ${args.map(String).join(" ")}`);
    });
  }
});

afterEach(() => {
  vi.restoreAllMocks();
  expect(calls, "unexpected console output").toEqual([]);
});
