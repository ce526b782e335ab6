/**
 * An unknown field is answered with the fields the format allows at that place
 * (docs/rulesets.md, "Rulesets", the field table), found by walking the schema
 * through zod's public API — into records, lists, optional fields and the
 * parameter kinds by their "type".
 */
import { describe, expect, test } from "vitest";
import { rulesetSchema } from "../../../src/core/index.js";
import { allowedKeys } from "../../../src/core/ruleset/schemaWalk.js";

const input = {
  symbols: { D: { description: "dead load", permanence: "permanent" } },
  parameters: { rho: { type: "number", description: "redundancy factor" }, cat: { type: "choice", description: "category", default: "A", choices: {} } },
  combinations: [{ id: "1", expression: "1.4D", clause: "§2.3.1 (1)" }],
  provenance: [{ source: "s", status: "confirmed", covers: "all" }],
};

describe("allowedKeys", () => {
  test("gives a symbol's fields (docs/rulesets.md: description, permanence, reversible, cases, orthogonalShare, canBeAbsent, attributes)", () => {
    expect(allowedKeys(rulesetSchema, input, ["symbols", "D"])?.sort()).toEqual(["attributes", "canBeAbsent", "cases", "description", "orthogonalShare", "permanence", "reversible"]);
  });

  test("gives each parameter kind its own fields, by its type", () => {
    expect(allowedKeys(rulesetSchema, input, ["parameters", "rho"])?.sort()).toEqual(["allowed", "default", "description", "max", "min", "type", "unit"]);
    expect(allowedKeys(rulesetSchema, input, ["parameters", "cat"])?.sort()).toEqual(["choices", "default", "description", "type"]);
  });

  test("gives the fields of an entry of a list and of the file itself", () => {
    expect(allowedKeys(rulesetSchema, input, ["combinations", 0])?.sort()).toEqual(["clause", "description", "expression", "id"]);
    expect(allowedKeys(rulesetSchema, input, ["provenance", 0])?.sort()).toEqual(["address", "combinations", "covers", "document", "locator", "note", "source", "status"]);
    expect(allowedKeys(rulesetSchema, input, [])).toContain("approval");
  });

  test("gives nothing where the schema has no strict object", () => {
    expect(allowedKeys(rulesetSchema, input, ["combinations"])).toBeUndefined();
    expect(allowedKeys(rulesetSchema, input, ["parameters", "nothing-here", "x"])).toBeUndefined();
  });
});
