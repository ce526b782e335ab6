/**
 * Every shipped ruleset can be audited in minutes: each confirmed source says
 * where a checker finds it (title, issuing body, web address or document
 * number, the clause it quotes), every combination is vouched for by some
 * provenance entry, and the verification word follows from the entries alone.
 */
import { describe, expect, test } from "vitest";
import { loadRuleset, shippedRulesets } from "../../src/core/index.js";

const shipped = shippedRulesets().map((s) => [s.id, s] as const);

describe.each(shipped)("%s provenance", (_id, s) => {
  const file = s.ruleset.file;

  test("every confirmed source names a locator with an address or document number", () => {
    for (const entry of file.provenance.filter((p) => p.status === "confirmed")) {
      expect(entry.locator, entry.source).toBeDefined();
      // An address a browser opens, or a document number a library finds.
      expect(entry.locator, entry.source).toMatch(/https?:\/\/\S+|\bISBN\b|\bdoc(ument)?\.? ?(no\.?|number)\b|\bNo\. ?\S+/i);
    }
  });

  test("every confirmed source gives an address to open or a document number to look up, the address also in its locator", () => {
    for (const entry of file.provenance.filter((p) => p.status === "confirmed")) {
      expect(entry.address ?? entry.document, entry.source).toBeDefined();
      if (entry.address) expect(entry.locator, entry.source).toContain(entry.address);
    }
  });

  test("every combination is named by some provenance entry", () => {
    const named = new Set(file.provenance.flatMap((p) => p.combinations ?? []));
    expect(file.combinations.map((c) => c.id).filter((id) => !named.has(id))).toEqual([]);
  });

  test("is checked exactly when no source is from memory, and counts what is confirmed", () => {
    const fromMemory = file.provenance.filter((p) => p.status === "from-memory");
    expect(s.status.verification).toBe(fromMemory.length === 0 ? "checked" : "unverified");
    if (fromMemory.length === 0) expect(s.status.combinations.confirmed).toBe(file.combinations.length);
  });

  test("says plainly what each from-memory source leaves open", () => {
    for (const entry of file.provenance.filter((p) => p.status === "from-memory")) {
      // Not "all" or "various": the parts an engineer must check, in words.
      expect(entry.covers.length, entry.source).toBeGreaterThan(20);
    }
  });
});

describe("a source's address", () => {
  const withAddress = (address: string) => {
    const file = structuredClone(shippedRulesets()[0].ruleset.file);
    file.provenance[0] = { ...file.provenance[0], address };
    return loadRuleset(file);
  };

  test("is taken as a web address", () => {
    expect(withAddress("https://example.org/code/1605.2").ok).toBe(true);
  });

  test("is refused at its place where it is not one", () => {
    for (const address of ["example.org/code", "https://example.org/a b", "ftp://example.org/x", "https://example.org/<x>"]) {
      const loaded = withAddress(address);
      expect(loaded.ok, address).toBe(false);
      if (!loaded.ok) expect(loaded.problems.map((p) => p.message).join("; "), address).toContain("must be a web address");
    }
  });
});
