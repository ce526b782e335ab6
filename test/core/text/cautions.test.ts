/**
 * The cautions (README "Cautions", docs/design.md "Cautions"): a qualified,
 * licensed engineer reviews every result; the adopted code edition and its
 * local amendments govern; shipped rulesets are checked against the standard,
 * and one known only from memory is UNVERIFIED. Both forms say all three.
 */
import { describe, expect, test } from "vitest";
import { CAUTIONS, cautionLine, fullCautions, shortCautions } from "../../../src/core/index.js";

const POINTS = [/qualified, licensed engineer/, /adopted code edition and its local amendments govern/, /(checked|verified) against the standard/];

describe("the cautions", () => {
  test("say each point once, in full and in short, in the same order", () => {
    expect(CAUTIONS).toHaveLength(POINTS.length);
    POINTS.forEach((point, i) => {
      expect(fullCautions()[i]).toMatch(point);
      expect(shortCautions()[i]).toMatch(point);
    });
  });

  test("name UNVERIFIED in both forms", () => {
    expect(fullCautions().join(" ")).toContain("UNVERIFIED");
    expect(shortCautions().join(" ")).toContain("UNVERIFIED");
  });

  test("fit one line for a single cell", () => {
    expect(cautionLine()).not.toMatch(/\n/);
    for (const point of POINTS) expect(cautionLine()).toMatch(point);
  });

  test("keep the short form shorter than the full one", () => {
    for (const c of CAUTIONS) expect(c.short.length).toBeLessThan(c.full.length);
  });
});
