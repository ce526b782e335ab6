import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { beforeAll, describe, expect, test } from "vitest";
import { FORMULAS_BY_ID } from "../../src/functions/functions.js";
import { builtAddin, ROOT } from "./builtAddin.js";

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

/**
 * functions.json held to the rules the platform documents for custom-function
 * metadata, and to the TypeScript signatures it is generated from:
 *   JSON     learn.microsoft.com/office/dev/add-ins/excel/custom-functions-json (metadata reference)
 *   AUTOGEN  learn.microsoft.com/office/dev/add-ins/excel/custom-functions-json-autogeneration (JSDoc tags, types)
 *   NAMING   learn.microsoft.com/office/dev/add-ins/excel/custom-functions-naming
 */
const JSON_REF = "https://learn.microsoft.com/office/dev/add-ins/excel/custom-functions-json";
const AUTOGEN = "https://learn.microsoft.com/office/dev/add-ins/excel/custom-functions-json-autogeneration";
const NAMING = "https://learn.microsoft.com/office/dev/add-ins/excel/custom-functions-naming";

interface Signature {
  name: string;
  id: string;
  parameters: { name: string; type: string; optional: boolean }[];
  tags: string[];
}

/** The @customfunction declarations of functions.ts, read with the TypeScript parser. */
function signatures(): Signature[] {
  const file = path.join(ROOT, "src/functions/functions.ts");
  const sf = ts.createSourceFile(file, readFileSync(file, "utf8"), ts.ScriptTarget.Latest, true);
  const out: Signature[] = [];
  for (const statement of sf.statements) {
    if (!ts.isFunctionDeclaration(statement) || !statement.name) continue;
    const tags = ts.getJSDocTags(statement).map((t) => `${t.tagName.text} ${typeof t.comment === "string" ? t.comment : ""}`.trim());
    const custom = tags.find((t) => t.startsWith("customfunction"));
    if (!custom) continue;
    out.push({
      name: statement.name.text,
      id: custom.split(/\s+/)[1],
      parameters: statement.parameters.map((p) => ({ name: p.name.getText(sf), type: p.type?.getText(sf) ?? "any", optional: p.questionToken !== undefined || p.initializer !== undefined })),
      tags,
    });
  }
  return out;
}

describe("functions.json against the platform's custom-function metadata rules", () => {
  test("gives every function a unique id of upper-case letters, digits, periods and underscores", () => {
    // NAMING: "Function ids may only use characters A through Z, numbers zero through nine, underscores, and periods."
    // JSON: each id "unique … should not be changed after it is set".
    for (const f of functions) expect(f.id, NAMING).toMatch(/^[A-Z0-9_.]+$/);
    expect(new Set(functions.map((f) => f.id)).size, JSON_REF).toBe(functions.length);
  });

  test("gives every function a name that starts with a letter, has 3 to 128 allowed characters and is no cell reference", () => {
    // NAMING: names "must start with a letter and have a minimum limit of three characters", letters, digits,
    // underscore and period; not the same as any cell A1 to XFD1048576 or R1C1 to R1048576C16384.
    // AUTOGEN: "Maximum length is 128 characters".
    const columnNumber = (letters: string) => [...letters].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0);
    for (const f of functions) {
      expect(f.name, NAMING).toMatch(/^\p{L}[\p{L}\p{N}_.]{2,127}$/u);
      const a1 = /^([A-Z]{1,3})(\d+)$/.exec(f.name);
      expect(a1 !== null && columnNumber(a1[1]) <= 16384 && Number(a1[2]) >= 1 && Number(a1[2]) <= 1048576, `${f.name} reads as a cell (${NAMING})`).toBe(false);
      expect(/^R\d+C\d+$/.test(f.name), `${f.name} reads as an R1C1 cell (${NAMING})`).toBe(false);
    }
  });

  test("uses only the documented parameter and result types and dimensionalities, and only documented options", () => {
    // JSON, "parameters": type boolean, number, string or any; dimensionality scalar or matrix. "result": the same. "options": the listed properties.
    const options = ["cancelable", "capturesCallingObject", "excludeFromAutoComplete", "linkedEntityLoadService", "requiresAddress", "requiresParameterAddresses", "requiresStreamAddress", "requiresStreamParameterAddresses", "stream", "volatile"];
    for (const f of functions) {
      for (const p of f.parameters) {
        expect(["boolean", "number", "string", "any"], `${f.id}.${p.name} (${JSON_REF})`).toContain(p.type ?? "any");
        expect(["scalar", "matrix"], `${f.id}.${p.name} (${JSON_REF})`).toContain(p.dimensionality ?? "scalar");
      }
      expect(["scalar", "matrix"], `${f.id} result (${JSON_REF})`).toContain(f.result.dimensionality ?? "scalar");
      for (const key of Object.keys(f.options ?? {})) expect(options, `${f.id} option ${key} (${JSON_REF})`).toContain(key);
    }
  });

  test("asks for parameter addresses only with a matrix result and a trailing invocation parameter", () => {
    // JSON, options.requiresParameterAddresses: "must be used in combination with the dimensionality property of the
    // result object, and dimensionality must be set to matrix". AUTOGEN, @requiresAddress: "The last function parameter
    // must be of type CustomFunctions.Invocation"; that parameter is Excel's, not the user's, so it is not listed.
    const byId = new Map(signatures().map((s) => [s.id, s]));
    for (const f of functions) {
      if (!f.options?.requiresParameterAddresses) continue;
      expect(f.result.dimensionality, `${f.id} (${JSON_REF})`).toBe("matrix");
      const signature = byId.get(f.id);
      expect(signature, `${f.id}: no @customfunction declaration in functions.ts`).toBeDefined();
      expect(signature?.parameters.at(-1)?.type, `${f.id} (${AUTOGEN})`).toBe("CustomFunctions.Invocation");
      expect(signature?.tags, f.id).toContain("requiresParameterAddresses");
      expect(f.parameters.map((p) => p.name)).not.toContain(signature?.parameters.at(-1)?.name);
    }
    // And the other way: a declaration tagged @requiresParameterAddresses has the option in the metadata.
    for (const s of byId.values()) {
      if (s.tags.includes("requiresParameterAddresses")) expect(functions.find((f) => f.id === s.id)?.options?.requiresParameterAddresses, s.id).toBe(true);
    }
  });

  test("matches each declared TypeScript signature: a 2-D array is a matrix, anything else a scalar, '?' optional, ids as written", () => {
    // AUTOGEN, "Matrix type": "Use a two-dimensional array type to have the parameter or return value be a matrix";
    // optional parameters: "Use an optional parameter. For example: function f(text?: string)"; @customfunction id.
    const declared = signatures();
    expect(declared.map((s) => s.id).sort(), AUTOGEN).toEqual(functions.map((f) => f.id).sort());
    for (const s of declared) {
      const f = functions.find((x) => x.id === s.id) as MetadataFunction;
      const userParameters = s.parameters.filter((p) => p.type !== "CustomFunctions.Invocation");
      expect(f.parameters.map((p) => p.name), s.id).toEqual(userParameters.map((p) => p.name));
      userParameters.forEach((p, i) => {
        const matrix = /\[\]\[\]$/.test(p.type);
        expect(f.parameters[i].dimensionality ?? "scalar", `${s.id}.${p.name}: ${p.type} (${AUTOGEN})`).toBe(matrix ? "matrix" : "scalar");
        expect(f.parameters[i].optional === true, `${s.id}.${p.name} (${AUTOGEN})`).toBe(p.optional);
        // unknown and unknown[][] carry no coercion: the metadata type is any (AUTOGEN, "If the type is any, no conversion will be performed").
        if (/^unknown(\[\]\[\])?$/.test(p.type)) expect(f.parameters[i].type ?? "any", `${s.id}.${p.name}`).toBe("any");
      });
    }
  });
});
