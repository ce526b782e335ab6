/**
 * Each command end to end: the real command line in a child process on real
 * files, in every output format. Expected values are hand calculations with
 * the factors of ASCE/SEI 7-16 §2.3.1 (the list as ASCE/SEI 7-10 §2.3.2 (public copy: https://www.scribd.com/document/611469328)
 * prints it, which 7-16 keeps [memory]; numbering [memory]) on the fixture files
 * described in fixtures/README.md.
 */
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { csvRows, loadwright, ROOT } from "./harness.js";

const RULES = ["--ruleset", "strength-fixture.json"];

describe("loadwright envelope", () => {
  test("gives 1.2D + 1.6L = 840 as the largest P for PD = 140 and PL = 420", async () => {
    const run = await loadwright(["envelope", "reactions-rows.csv", ...RULES, "--format", "csv"]);
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["result", "max", "max row", "min", "min row"]);
    const p = rows.find((r) => r[0] === "P") as string[];
    // AISC Design Examples, Example E.1A (American Institute of Steel Construction): 1.2·140 + 1.6·420 = 840; ASCE/SEI 7-16 §2.3.1 (2).
    expect(Number(p[1])).toBeCloseTo(840, 9);
    expect(p[2]).toBe("2: 1.2D + 1.6L");
    // ASCE/SEI 7-16 §2.3.1 (5) 0.9D + 1.0W, wind reversible (common practice (no source)): 0.9·140 − 50 = 76.
    expect(Number(p[3])).toBeCloseTo(76, 9);
    expect(p[4]).toBe("5: 0.9D + W:N");
  });

  test("takes wind both ways and L in combination 4 for the shear and the moment", async () => {
    const run = await loadwright(["envelope", "reactions-rows.csv", ...RULES, "--format", "json"]);
    expect(run.status).toBe(0);
    const body = JSON.parse(run.stdout);
    const byResult = Object.fromEntries(body.envelope.map((e: { result: string }) => [e.result, e]));
    // ASCE/SEI 7-16 §2.3.1 (4) 1.2D + 1.0W + L: V = 1.2·2 + 10 + 5 = 17.4; M = 1.2·10 + 48 + 22 = 82.
    expect(byResult.V.max.value).toBeCloseTo(17.4, 9);
    expect(byResult.V.max.row).toBe("4: 1.2D + L + W:N");
    expect(byResult.M.max.value).toBeCloseTo(82, 9);
    // §2.3.1 (5) with W:N reversed: V = 0.9·2 − 10 = −8.2; M = 0.9·10 − 48 = −39.
    expect(byResult.V.min.value).toBeCloseTo(-8.2, 9);
    expect(byResult.V.min.row).toBe("5: 0.9D - W:N");
    expect(byResult.M.min.value).toBeCloseTo(-39, 9);
  });

  test("streams a cases-as-columns export to the same hand values", async () => {
    const run = await loadwright(["envelope", "export-columns.csv", ...RULES, "--format", "json"]);
    expect(run.status).toBe(0);
    const body = JSON.parse(run.stdout);
    expect(body.envelope.map((e: { result: string }) => e.result)).toEqual(["C1 top", "C1 bottom"]);
    const bottom = body.envelope[1];
    // §2.3.1 (2): 1.2·152 + 1.6·420 = 854.4; §2.3.1 (5): 0.9·152 − 61 = 75.8.
    expect(bottom.max.value).toBeCloseTo(854.4, 9);
    expect(bottom.max.row).toBe("2: 1.2D + 1.6L");
    expect(bottom.min.value).toBeCloseTo(75.8, 9);
  });

  test("writes a text table with the ruleset, UNVERIFIED and the cautions above it", async () => {
    const run = await loadwright(["envelope", "reactions-rows.csv", ...RULES, "--format", "table"]);
    expect(run.status).toBe(0);
    const lines = run.stdout.split("\n");
    expect(lines[0]).toMatch(/UNVERIFIED RULESET/);
    expect(run.stdout).toMatch(/Ruleset: test-fixture-strength 0\.0\.1/);
    expect(run.stdout).toMatch(/qualified, licensed engineer/);
    expect(run.stdout).toMatch(/code edition and its local amendments govern/);
    expect(run.stdout).toMatch(/verified against the standard/);
    const header = lines.findIndex((l) => /^result\s+max\s+max row\s+min\s+min row$/.test(l));
    expect(header).toBeGreaterThan(0);
    expect(lines[header + 1]).toMatch(/^-+\s+-+/);
    expect(lines[header + 2]).toMatch(/^P\s+840\s+2: 1\.2D \+ 1\.6L\s+76\s+5: 0\.9D \+ W:N$/);
    expect(run.stderr).toBe("");
  });

  test("writes a Markdown table with the cautions quoted above it", async () => {
    const run = await loadwright(["envelope", "reactions-rows.csv", ...RULES, "--format", "md"]);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^> \*\*\* UNVERIFIED RULESET/);
    expect(run.stdout).toMatch(/> Caution: Results must be reviewed by a qualified, licensed engineer/);
    expect(run.stdout).toContain("| result | max | max row | min | min row |");
    expect(run.stdout).toContain("|:---|---:|:---|---:|:---|");
    expect(run.stdout).toContain("| P | 840 | 2: 1.2D + 1.6L | 76 | 5: 0.9D + W:N |");
  });

  test("keeps csv and json on standard output parseable and says the cautions on standard error", async () => {
    for (const format of ["csv", "json"]) {
      const run = await loadwright(["envelope", "reactions-rows.csv", ...RULES, "--format", format]);
      expect(run.status).toBe(0);
      expect(run.stdout).not.toMatch(/Caution|UNVERIFIED RULESET/);
      expect(run.stderr).toMatch(/loadwright: \*\*\* UNVERIFIED RULESET/);
      expect(run.stderr).toMatch(/loadwright: Caution: Results must be reviewed by a qualified, licensed engineer/);
    }
  });

  test("defaults to CSV when standard output is not a terminal", async () => {
    const run = await loadwright(["envelope", "reactions-rows.csv", ...RULES]);
    expect(run.status).toBe(0);
    expect(csvRows(run.stdout)[0]).toEqual(["result", "max", "max row", "min", "min row"]);
  });

  test("reads a JSON case file like the CSV one", async () => {
    const run = await loadwright(["envelope", "reactions-rows.json", ...RULES, "--format", "json"]);
    expect(run.status).toBe(0);
    const p = JSON.parse(run.stdout).envelope[0];
    // AISC Design Examples, Example E.1A (American Institute of Steel Construction): 840 under 1.2D + 1.6L.
    expect(p).toEqual({ result: "P", max: { value: 840, row: "2: 1.2D + 1.6L" }, min: { value: 76, row: "5: 0.9D + W:N" } });
  });
});

describe("the JSON contract", () => {
  test("names the ruleset by id, version, fingerprint and status in every output", async () => {
    const commands = [
      ["envelope", "reactions-rows.csv"],
      ["factored", "reactions-rows.csv"],
      ["governing", "reactions-rows.csv"],
      ["combos"],
      ["explain", "reactions-rows.csv", "--row", "1: 1.4D", "--component", "P"],
    ];
    for (const args of commands) {
      const run = await loadwright([...args, ...RULES, "--format", "json"]);
      expect(run.status, args.join(" ")).toBe(0);
      const body = JSON.parse(run.stdout);
      expect(body.ruleset).toMatchObject({ id: "test-fixture-strength", version: "0.0.1", status: "unverified" });
      // The fingerprint is SHA-256 (docs/rulesets.md, "Rulesets"): 64 hex digits.
      expect(body.ruleset.fingerprint).toMatch(/^[0-9a-f]{64}$/);
      expect(body.cautions).toHaveLength(3);
    }
  });

  test("gives factored rows as label, combination and values in component order", async () => {
    const run = await loadwright(["factored", "reactions-rows.csv", ...RULES, "--format", "json"]);
    const body = JSON.parse(run.stdout);
    expect(body.components).toEqual(["P", "V", "M"]);
    const row = body.rows.find((r: { label: string }) => r.label === "2: 1.2D + 1.6L");
    expect(row.combination).toBe("2");
    // ASCE/SEI 7-16 §2.3.1 (2): P = 1.2·140 + 1.6·420 = 840; V = 1.2·2 + 1.6·5 = 10.4; M = 1.2·10 + 1.6·22 = 47.2.
    expect(row.values[0]).toBeCloseTo(840, 9);
    expect(row.values[1]).toBeCloseTo(10.4, 9);
    expect(row.values[2]).toBeCloseTo(47.2, 9);
  });

  test("gives governing rows with their criteria and the concurrent value of every component", async () => {
    const run = await loadwright(["governing", "reactions-rows.csv", ...RULES, "--criterion", "max V", "--criterion", "min P", "--format", "json"]);
    expect(run.status).toBe(0);
    const rows = JSON.parse(run.stdout).rows;
    expect(rows).toHaveLength(2);
    // §2.3.1 (4) with W:N: V = 17.4 with P = 1.2·140 + 420 − 50 = 538 and M = 12 + 22 + 48 = 82.
    expect(rows[0].criteria).toEqual(["max V"]);
    expect(rows[0].label).toBe("4: 1.2D + L + W:N");
    expect(rows[0].values.P).toBeCloseTo(538, 9);
    expect(rows[0].values.V).toBeCloseTo(17.4, 9);
    expect(rows[0].values.M).toBeCloseTo(82, 9);
    // §2.3.1 (5): P = 0.9·140 − 50 = 76 with V = 1.8 + 10 = 11.8 and M = 9 + 48 = 57.
    expect(rows[1].criteria).toEqual(["min P"]);
    expect(rows[1].values.V).toBeCloseTo(11.8, 9);
    expect(rows[1].values.M).toBeCloseTo(57, 9);
  });

  test("gives combination rows with clause and a factor on every symbol", async () => {
    const run = await loadwright(["combos", ...RULES, "--format", "json"]);
    const body = JSON.parse(run.stdout);
    // Hand count under "effects of loads not acting must be investigated" (ASCE/SEI 7-16 §2.3.1 [confirmed]) and
    // W both ways: (1) 1 row; (2) L or not × (Lr, S or neither) = 6; (4) ±W × L or not × 3 = 12; (5) ±W = 2.
    expect(body.rows).toHaveLength(21);
    expect(body.rows[0]).toEqual({ label: "1: 1.4D", combination: "1", clause: "§2.3.1 (1)", factors: { D: 1.4, L: 0, Lr: 0, S: 0, W: 0 } });
    const four = body.rows.filter((r: { combination: string }) => r.combination === "4");
    expect(four.every((r: { factors: { W: number } }) => Math.abs(r.factors.W) === 1)).toBe(true);
  });
});

describe("loadwright governing", () => {
  test("takes max and min of every component when no criterion is given", async () => {
    const run = await loadwright(["governing", "reactions-rows.csv", ...RULES, "--format", "csv"]);
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["criteria", "label", "P", "V", "M"]);
    // max V and max M share the row 4: 1.2D + L + W:N (hand values above), so it is listed once with both criteria.
    const shared = rows.find((r) => r[1] === "4: 1.2D + L + W:N") as string[];
    expect(shared[0]).toBe("max V; max M");
  });

  test("streams a cases-as-columns export for a criterion on one result row", async () => {
    const run = await loadwright(["governing", "export-columns.csv", ...RULES, "--criterion", "max [C1 bottom]", "--format", "json"]);
    expect(run.status).toBe(0);
    const rows = JSON.parse(run.stdout).rows;
    expect(rows).toHaveLength(1);
    expect(rows[0].label).toBe("2: 1.2D + 1.6L");
    // §2.3.1 (2): C1 bottom 1.2·152 + 1.6·420 = 854.4, concurrent C1 top 1.2·140 + 1.6·420 = 840.
    expect(rows[0].values["C1 bottom"]).toBeCloseTo(854.4, 9);
    expect(rows[0].values["C1 top"]).toBeCloseTo(840, 9);
  });

  test("writes a streamed export's governing rows as one column each, named in a legend", async () => {
    const run = await loadwright(["governing", "export-columns.csv", ...RULES, "-c", "max [C1 bottom]", "-c", "min [C1 top]", "--format", "table"]);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("G1: max [C1 bottom] → 2: 1.2D + 1.6L");
    // §2.3.1 (5): min C1 top = 0.9·140 − 50 = 76 with C1 bottom 0.9·152 − 61 = 75.8.
    expect(run.stdout).toContain("G2: min [C1 top] → 5: 0.9D + W:N");
    expect(run.stdout).toMatch(/\nC1 bottom\s+854\.4\s+75\.8\n/);
  });

  test("refuses a cases-as-columns export without a criterion, pointing to envelope", async () => {
    const run = await loadwright(["governing", "export-columns.csv", ...RULES]);
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/^loadwright: error: export-columns\.csv: .*--criterion.*loadwright envelope/m);
  });
});

describe("loadwright combos", () => {
  test("puts the factors on the cases of a case file", async () => {
    const run = await loadwright(["combos", ...RULES, "--cases", "reactions-rows.csv", "--format", "csv"]);
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["label", "combination", "clause", "D", "L", "W:N", "W:E"]);
    // §2.3.1 (5) 0.9D + 1.0W, each wind case in turn, both ways (common practice (no source)): 4 rows.
    expect(rows.filter((r) => r[1] === "5").map((r) => r[0])).toEqual(["5: 0.9D + W:N", "5: 0.9D - W:N", "5: 0.9D + W:E", "5: 0.9D - W:E"]);
  });

  test("applies a parameter: fL = 0.5 halves L in combination 4", async () => {
    const run = await loadwright(["combos", ...RULES, "--param", "fL=0.5", "--format", "json"]);
    expect(run.status).toBe(0);
    // ASCE/SEI 7-16 §2.3.1 exception [confirmed in the 7-10 text]: L may take 0.5 in combination 4 where Lo ≤ 100 psf.
    const four = JSON.parse(run.stdout).rows.filter((r: { combination: string; factors: { L: number } }) => r.combination === "4" && r.factors.L !== 0);
    expect(four.length).toBeGreaterThan(0);
    expect(four.every((r: { factors: { L: number } }) => r.factors.L === 0.5)).toBe(true);
    expect(JSON.parse(run.stdout).parameters).toEqual([{ name: "fL", value: 0.5, given: true }]);
  });
});

describe("the row limit", () => {
  test("refuses to list more rows than --row-limit and says how to raise it", async () => {
    // 21 rows by the hand count above ("gives combination rows with clause and a factor on every symbol").
    const refused = await loadwright(["combos", ...RULES, "--row-limit", "20", "--format", "csv"]);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/^loadwright: error: ruleset test-fixture-strength: .*21 concrete rows.*more than the limit of 20.*\(raise the limit with --row-limit N\)$/m);
    const listed = await loadwright(["combos", ...RULES, "--row-limit", "21", "--format", "csv"]);
    expect(listed.status).toBe(0);
    expect(csvRows(listed.stdout)).toHaveLength(22);
  });
});

describe("loadwright explain", () => {
  test("writes out 1.2 × 140 + 1.6 × 420 = 840 for a row named by its label", async () => {
    const run = await loadwright(["explain", "reactions-rows.csv", ...RULES, "--row", "2: 1.2D + 1.6L", "--component", "P", "--format", "table"]);
    expect(run.status).toBe(0);
    // AISC Design Examples, Example E.1A (American Institute of Steel Construction): 1.2·140 + 1.6·420 = 168 + 672 = 840.
    expect(run.stdout).toContain("P = 1.2 × 140 [D] + 1.6 × 420 [L]");
    expect(run.stdout).toContain("= 168 + 672");
    expect(run.stdout).toContain("= 840");
  });

  test("finds one result row of a streamed export and gives the lines as JSON", async () => {
    const run = await loadwright(["explain", "export-columns.csv", ...RULES, "--row", "5: 0.9D + W:N", "--component", "C1 bottom", "--format", "json"]);
    expect(run.status).toBe(0);
    const x = JSON.parse(run.stdout).explanation;
    // §2.3.1 (5): 0.9·152 + 1.0·(−61) = 136.8 − 61 = 75.8.
    expect(x.lines.map((l: { case: string; factor: number }) => [l.case, l.factor])).toEqual([["D", 0.9], ["W:N", 1]]);
    expect(x.total).toBeCloseTo(75.8, 9);
    expect(x.clause).toBe("§2.3.1 (5)");
  });

  test("gives the lines as CSV with the total last", async () => {
    const run = await loadwright(["explain", "reactions-rows.csv", ...RULES, "--row", "1: 1.4D", "--component", "M", "--format", "csv"]);
    const rows = csvRows(run.stdout);
    // ASCE/SEI 7-16 §2.3.1 (1): 1.4·10 = 14.
    expect(rows[1].slice(0, 2)).toEqual(["D", "1.4"]);
    expect(rows.at(-1)).toEqual(["total", "", "1: 1.4D", "", "14"]);
  });
});

describe("loadwright rulesets", () => {
  test("lists every shipped ruleset file, UNVERIFIED where any source is from memory", async () => {
    const run = await loadwright(["rulesets", "--format", "json"]);
    expect(run.status).toBe(0);
    const listed = JSON.parse(run.stdout).rulesets as { id: string; status: string; fingerprint: string }[];
    // docs/rulesets.md, "Rulesets": any provenance entry marked from-memory makes a ruleset UNVERIFIED.
    const files = readdirSync(join(ROOT, "rulesets"))
      .filter((f) => f.endsWith(".json"))
      .map((f) => JSON.parse(readFileSync(join(ROOT, "rulesets", f), "utf8")) as { id: string; provenance: { status: string }[] });
    expect(listed.map((r) => r.id).sort()).toEqual(files.map((f) => f.id).sort());
    for (const file of files) {
      const entry = listed.find((r) => r.id === file.id);
      expect(entry?.status, file.id).toBe(file.provenance.some((p) => p.status === "from-memory") ? "unverified" : "checked");
      expect(entry?.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    }
  });

  test("shows UNVERIFIED in the status column of the table, with the cautions above it", async () => {
    const unverified = (JSON.parse((await loadwright(["rulesets", "--format", "json"])).stdout).rulesets as { id: string; status: string }[]).filter(
      (r) => r.status === "unverified",
    );
    expect(unverified.length).toBeGreaterThan(0);
    const run = await loadwright(["rulesets", "--format", "table"]);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Caution: Results must be reviewed by a qualified, licensed engineer/);
    for (const r of unverified) expect(run.stdout).toMatch(new RegExp(`^${r.id.replace(/\./g, "\\.")}\\s+\\S+\\s+UNVERIFIED\\s`, "m"));
  });
});

describe("loadwright rulesets: what public sources confirm", () => {
  interface Entry {
    source: string;
    locator?: string;
    status: string;
    covers: string;
    combinations?: string[];
  }
  interface RulesetText {
    id: string;
    combinations: { id: string; clause: string }[];
    provenance: Entry[];
  }
  // Read from the files themselves, by the rule of docs/rulesets.md: a combination counts as confirmed
  // where a confirmed entry lists it and no from-memory entry does.
  const files = readdirSync(join(ROOT, "rulesets"))
    .filter((f) => f.endsWith(".json"))
    .map((f) => JSON.parse(readFileSync(join(ROOT, "rulesets", f), "utf8")) as RulesetText);
  const naming = (file: RulesetText, status: string, id: string) =>
    file.provenance.flatMap((p, i) => (p.status === status && (p.combinations ?? []).includes(id) ? [i + 1] : []));
  const confirmedIds = (file: RulesetText) => file.combinations.map((c) => c.id).filter((id) => naming(file, "confirmed", id).length > 0 && naming(file, "from-memory", id).length === 0);
  const fromMemory = (file: RulesetText) => file.provenance.filter((p) => p.status === "from-memory");

  test("counts in JSON the combinations confirmed and lists what is from memory, keeping the ruleset fields", async () => {
    const run = await loadwright(["rulesets", "--format", "json"]);
    expect(run.status).toBe(0);
    const listed = JSON.parse(run.stdout).rulesets as { id: string; status: string; fingerprint: string; confirmed: number; combinations: number; fromMemory: { source: string; covers: string; combinations: string[] }[] }[];
    for (const file of files) {
      const entry = listed.find((r) => r.id === file.id);
      expect(entry?.confirmed, file.id).toBe(confirmedIds(file).length);
      expect(entry?.combinations, file.id).toBe(file.combinations.length);
      expect(entry?.fromMemory, file.id).toEqual(fromMemory(file).map((p) => ({ source: p.source, covers: p.covers, combinations: p.combinations ?? [] })));
      expect(Object.keys(entry ?? {}).slice(0, 9)).toEqual(["id", "title", "standard", "version", "fingerprint", "status", "approval", "summary", "source"]);
    }
  });

  test("shows the count in the table and lists what is from memory below it", async () => {
    const run = await loadwright(["rulesets", "--format", "table"]);
    expect(run.status).toBe(0);
    for (const file of files) {
      expect(run.stdout).toMatch(new RegExp(`^${file.id.replace(/\./g, "\\.")}\\s.*\\s${confirmedIds(file).length} of ${file.combinations.length} confirmed$`, "m"));
      for (const p of fromMemory(file)) expect(run.stdout).toContain(`- ${file.id}: ${p.covers}`);
    }
  });

  test("gives the count and what is from memory as CSV columns", async () => {
    const run = await loadwright(["rulesets", "--format", "csv"]);
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["id", "version", "status", "standard", "title", "approval", "fingerprint", "combinations", "from memory"]);
    for (const file of files) {
      const row = rows.find((r) => r[0] === file.id) as string[];
      expect(row[7]).toBe(`${confirmedIds(file).length} of ${file.combinations.length} confirmed`);
      expect(row[8]).toBe(fromMemory(file).map((p) => p.covers).join(" | "));
    }
  });

  test("--verification names per combination the sources that confirm it and those that leave it open", async () => {
    const run = await loadwright(["rulesets", "--verification", "--format", "json"]);
    expect(run.status).toBe(0);
    const listed = JSON.parse(run.stdout).rulesets as {
      id: string;
      provenance: { ref: number; status: string; source: string; locator?: string }[];
      verification: { combination: string; clause: string; confirmed: boolean; confirmedBy: number[]; openBy: number[] }[];
    }[];
    expect(listed.map((r) => r.id).sort()).toEqual(files.map((f) => f.id).sort());
    for (const file of files) {
      const entry = listed.find((r) => r.id === file.id);
      expect(entry?.provenance.map((p) => [p.ref, p.status, p.source, p.locator])).toEqual(file.provenance.map((p, i) => [i + 1, p.status, p.source, p.locator]));
      expect(entry?.verification).toEqual(
        file.combinations.map((c) => ({
          combination: c.id,
          clause: c.clause,
          confirmed: confirmedIds(file).includes(c.id),
          confirmedBy: naming(file, "confirmed", c.id),
          openBy: naming(file, "from-memory", c.id),
        })),
      );
    }
    expect(run.stderr).toMatch(/loadwright: Caution: Results must be reviewed by a qualified, licensed engineer/);
  });

  test("--verification as CSV has one row per combination of every ruleset", async () => {
    const run = await loadwright(["rulesets", "--verification", "--format", "csv"]);
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["ruleset", "status", "combination", "clause", "confirmed", "confirmed by", "left open from memory"]);
    expect(rows.slice(1).map((r) => `${r[0]} ${r[2]}`).sort()).toEqual(files.flatMap((f) => f.combinations.map((c) => `${f.id} ${c.id}`)).sort());
    for (const file of files) {
      for (const c of file.combinations) {
        const row = rows.find((r) => r[0] === file.id && r[2] === c.id) as string[];
        expect(row[4]).toBe(confirmedIds(file).includes(c.id) ? "yes" : "no");
        expect(row[6]).toBe(naming(file, "from-memory", c.id).map((i) => file.provenance[i - 1].covers).join(" | "));
      }
    }
  });

  test("--verification as a table gives each ruleset its combinations, sources and locators", async () => {
    const run = await loadwright(["rulesets", "--verification", "--format", "table"]);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^Caution: Results must be reviewed by a qualified, licensed engineer/);
    for (const file of files) {
      expect(run.stdout).toContain(`\n${file.id}: `);
      file.provenance.forEach((p, i) => {
        if (p.status === "confirmed") expect(run.stdout).toContain(`  [${i + 1}] confirmed: ${p.source} — ${p.locator ?? "no locator given"}`);
        else expect(run.stdout).toContain(`  [${i + 1}] FROM MEMORY: ${p.source}`);
      });
    }
  });

  test("docs/verification.md is the --verification report in Markdown, word for word", async () => {
    // After a change to a ruleset: loadwright rulesets --verification --format md > docs/verification.md
    const run = await loadwright(["rulesets", "--verification", "--format", "md"]);
    expect(run.status).toBe(0);
    expect(run.stdout).toBe(readFileSync(join(ROOT, "docs/verification.md"), "utf8"));
  });
});

describe("help", () => {
  test.each(["rulesets", "combos", "factored", "envelope", "governing", "explain"])("loadwright %s --help shows examples and the cautions", async (command) => {
    const run = await loadwright([command, "--help"]);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain(`Usage: loadwright ${command}`);
    expect(run.stdout).toContain("Examples:");
    expect(run.stdout).toContain("qualified, licensed engineer");
  });

  test("loadwright --help lists every command", async () => {
    const run = await loadwright(["--help"]);
    expect(run.status).toBe(0);
    for (const command of ["rulesets", "combos", "factored", "envelope", "governing", "explain"]) expect(run.stdout).toContain(command);
  });
});
