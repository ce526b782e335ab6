import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { FORMULAS_BY_ID } from "../../src/functions/functions.js";
import { builtAddin } from "./builtAddin.js";

interface MetadataParameter {
  name: string;
  description?: string;
  type?: string;
  dimensionality?: string;
  optional?: boolean;
}
interface MetadataFunction {
  id: string;
  name: string;
  description?: string;
  options?: { requiresParameterAddresses?: boolean };
  parameters: MetadataParameter[];
  result: { dimensionality?: string };
}

let dist: string;
let functions: MetadataFunction[];
let manifest: string;

beforeAll(async () => {
  dist = await builtAddin();
  functions = (JSON.parse(readFileSync(path.join(dist, "functions.json"), "utf8")) as { functions: MetadataFunction[] }).functions;
  manifest = readFileSync(path.join(dist, "manifest.xml"), "utf8");
});

describe("functions.json from the build", () => {
  test("lists exactly the formulas the code declares, with the same ids and names", () => {
    expect(functions.map((f) => f.id).sort()).toEqual(Object.keys(FORMULAS_BY_ID).sort());
    for (const f of functions) {
      // Excel shows NAMESPACE.NAME; the formula's own name is LW.<id>.
      expect(`LW.${f.name}`).toBe(FORMULAS_BY_ID[f.id as keyof typeof FORMULAS_BY_ID].name);
    }
  });

  test("gives every formula and every parameter a description Excel can show while typing", () => {
    for (const f of functions) {
      expect(f.description?.length ?? 0, f.id).toBeGreaterThan(20);
      for (const p of f.parameters) {
        // Microsoft 365 app manifest schema, custom function parameter "description": at most 128 characters.
        expect(p.description?.length ?? 0, `${f.id}.${p.name}`).toBeGreaterThan(10);
        expect(p.description?.length ?? 0, `${f.id}.${p.name}`).toBeLessThanOrEqual(128);
      }
    }
  });

  test("declares each formula's arguments in the order, names and optionality its code reads them", () => {
    for (const f of functions) {
      const formula = FORMULAS_BY_ID[f.id as keyof typeof FORMULAS_BY_ID];
      expect(
        f.parameters.map((p) => ({ name: p.name, optional: p.optional === true })),
        f.id,
      ).toEqual(formula.parameters.map((s) => ({ name: s.name, optional: s.optional === true })));
    }
  });

  test("takes ranges without coercion, returns spilling arrays, and asks Excel for argument addresses", () => {
    for (const f of functions) {
      expect(f.result.dimensionality, f.id).toBe("matrix");
      expect(f.options?.requiresParameterAddresses, f.id).toBe(true);
      for (const p of f.parameters) {
        // A declared number or string type would make Excel coerce; "any" leaves validation to us (OFFICE-NOTES.md, "Values").
        expect(p.type ?? "any", `${f.id}.${p.name}`).toBe("any");
        const oneCell = (f.id === "EXPLAIN" && (p.name === "row" || p.name === "component"));
        expect(p.dimensionality ?? "scalar", `${f.id}.${p.name}`).toBe(oneCell ? "scalar" : "matrix");
      }
    }
  });
});

describe("manifest.xml from the build", () => {
  const urls = () => [...manifest.matchAll(/DefaultValue="(https:\/\/[^"]+)"/g)].map((m) => m[1]);
  const resid = (element: string) => new RegExp(`<${element}[^>]*resid="([^"]+)"`).exec(manifest)?.[1];

  test("points every URL at files the build produced", () => {
    expect(urls().length).toBeGreaterThan(5);
    for (const url of urls()) {
      const { origin, pathname } = new URL(url);
      expect(origin).toBe("https://localhost:3000");
      expect(existsSync(path.join(dist, pathname)), pathname).toBe(true);
    }
  });

  test("runs formulas, ribbon and task pane in one shared runtime with the LW namespace", () => {
    // Office shared runtime docs: Runtime, custom functions Page and FunctionFile use the same resid, at most 32 characters.
    expect(manifest).toContain('<Set Name="SharedRuntime" MinVersion="1.1"/>');
    expect(manifest).toMatch(/<Runtime resid="LW\.Pane\.Url" lifetime="long"\/>/);
    expect(resid("FunctionFile")).toBe("LW.Pane.Url");
    expect(manifest).toMatch(/<Page>\s*<SourceLocation resid="LW\.Pane\.Url"\/>/);
    for (const m of manifest.matchAll(/(?:resid|id)="(LW\.[^"]+)"/g)) expect(m[1].length, m[1]).toBeLessThanOrEqual(32);
    expect(manifest).toMatch(/<bt:String id="LW\.Namespace" DefaultValue="LW"\/>/);
    expect(manifest).toMatch(/<Action xsi:type="ShowTaskpane">/);
  });
});
