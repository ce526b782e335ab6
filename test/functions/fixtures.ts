/**
 * Test fixtures: rulesets written for these tests from published factors, with
 * the source beside each combination. They are not
 * shipped rulesets and not code lists; they only give the formulas something
 * to compute that a reader can check by hand.
 */
import type { Cell, RulesetFile } from "../../src/core/index.js";
import { rulesetFile } from "../support/rulesetFile.js";

/** ASCE/SEI 7-16 §2.3.1 strength combinations (1)–(5) [confirmed for the 7-10 list, which 7-16 keeps; numbering memory]. */
export const STRENGTH_FIXTURE: RulesetFile = rulesetFile({
  id: "test-strength",
  title: "Test fixture: strength combinations after ASCE/SEI 7-16 §2.3.1 (not a shipped ruleset)",
  standard: { name: "ASCE/SEI 7", edition: "2016", clauses: "§2.3.1" },
  basis: "strength design",
  version: "0.0.1-test",
  symbols: {
    D: { description: "dead load", permanence: "permanent" },
    L: { description: "live load", permanence: "transient" },
    Lr: { description: "roof live load", permanence: "transient" },
    S: { description: "snow load", permanence: "transient" },
    R: { description: "rain load", permanence: "transient" },
    W: { description: "wind load", permanence: "transient", reversible: true },
  },
  combinations: [
    { id: "1", expression: "1.4D", clause: "§2.3.1 (1)" },
    { id: "2", expression: "1.2D + 1.6L + 0.5(Lr or S or R)", clause: "§2.3.1 (2)" },
    { id: "3", expression: "1.2D + 1.6(Lr or S or R) + (L or 0.5W)", clause: "§2.3.1 (3)" },
    { id: "4", expression: "1.2D + 1.0W! + L + 0.5(Lr or S or R)", clause: "§2.3.1 (4)" },
    { id: "5", expression: "0.9D + 1.0W!", clause: "§2.3.1 (5)" },
  ],
  provenance: [{ source: "ASCE/SEI 7-16 §2.3.1 (list confirmed for the 7-10 text, which 7-16 keeps)", status: "confirmed", covers: "combinations 1 to 5" }],
});

/**
 * ASCE/SEI 7-16 §2.3.6 seismic combinations (6) and (7) with Ev = 0.2·SDS·D
 * [confirmed] and Eh = ρ·QE [memory]; ρ is 1.0 or 1.3 (§12.3.4) [memory].
 * From memory in part, so it must show as UNVERIFIED.
 */
export const SEISMIC_FIXTURE: RulesetFile = rulesetFile({
  id: "test-seismic",
  title: "Test fixture: seismic combinations after ASCE/SEI 7-16 §2.3.6 (not a shipped ruleset)",
  standard: { name: "ASCE/SEI 7", edition: "2016", clauses: "§2.3.6" },
  version: "0.0.1-test",
  symbols: {
    D: { description: "dead load", permanence: "permanent" },
    L: { description: "live load", permanence: "transient" },
    S: { description: "snow load", permanence: "transient" },
    E: { description: "horizontal seismic load effect QE", permanence: "transient", reversible: true },
  },
  parameters: {
    SDS: { type: "number", description: "design spectral response acceleration parameter at short periods", min: 0 },
    rho: { type: "number", description: "redundancy factor", allowed: [1.0, 1.3] },
  },
  combinations: [
    { id: "6", expression: "(1.2 + 0.2*SDS)D + rho*E! + L + 0.2S", clause: "§2.3.6 (6)" },
    { id: "7", expression: "(0.9 - 0.2*SDS)D + rho*E!", clause: "§2.3.6 (7)" },
  ],
  provenance: [
    { source: "ASCE/SEI 7-16 §2.3.6", status: "from-memory", covers: "numbering, Eh = rho*QE, the allowed values of rho" },
    { source: "a practitioner document citing ASCE/SEI 7-16", status: "confirmed", covers: "Ev = 0.2*SDS*D" },
  ],
});

/** The same strength list typed in cells, as a user would: [id, expression, clause]. */
export const STRENGTH_ROWS: Cell[][] = [
  ["id", "expression", "clause"],
  ...STRENGTH_FIXTURE.combinations.map((c) => [c.id, c.expression, c.clause]),
];

/**
 * A column with PD = 140 kips and PL = 420 kips (AISC Design Examples (companion to the AISC Steel Construction Manual, American Institute of Steel Construction), Example E.1A), with a shear V and a
 * wind case added for these tests (V and W values invented for the tests).
 */
export const COLUMN_TABLE: Cell[][] = [
  ["", "P", "V"],
  ["D", 140, 2],
  ["L", 420, 5],
  ["W", -50, 10],
];

/** Excel's parameter addresses for a formula whose arguments sit at these ranges. */
export const addresses = (...ranges: string[]) => ranges;
