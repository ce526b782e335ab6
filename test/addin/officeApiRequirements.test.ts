/**
 * Every Office.js call the add-in makes, and the requirement set it belongs
 * to, held to the sets manifest.xml declares. The sources are read with the
 * TypeScript compiler's parser (every property access and qualified type name
 * rooted at Office, Excel, OfficeRuntime or CustomFunctions, and the members
 * of an invocation), and the built bundle is searched for the calls the
 * metadata plugin injects; a call missing from the table below fails, so a
 * new API is looked up before it ships.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { DOMParser } from "@xmldom/xmldom";
import ts from "typescript";
import { beforeAll, describe, expect, test } from "vitest";
import { builtAddin, ROOT } from "./builtAddin.js";

const COMMON_SETS = "https://learn.microsoft.com/javascript/api/requirement-sets/common/office-add-in-requirement-sets";
const CUSTOM_FUNCTION_SETS = "https://learn.microsoft.com/javascript/api/requirement-sets/excel/custom-functions-requirement-sets";
const INVOCATION = "https://learn.microsoft.com/javascript/api/custom-functions-runtime/customfunctions.invocation";
const OFFICE = "https://learn.microsoft.com/javascript/api/office";

interface ApiEntry {
  /** The requirement set and the version that brings the API, or null where the API belongs to none (Office.js itself). */
  set: { name: string; version: string } | null;
  source: string;
}

/** API → requirement set, from the pages cited. */
const API_SETS: Record<string, ApiEntry> = {
  // Office namespace: onReady, the HostType and AsyncResultStatus enumerations are Office.js itself; no
  // requirement set on the Office Common API requirement sets page lists them.
  "Office.onReady": { set: null, source: `${OFFICE}; ${COMMON_SETS}` },
  "Office.HostType": { set: null, source: `${OFFICE}.hosttype; ${COMMON_SETS}` },
  "Office.AsyncResultStatus": { set: null, source: `${OFFICE}.asyncresultstatus; ${COMMON_SETS}` },
  // "Settings: Settings.get, Settings.remove, Settings.saveAsync, Settings.set" (all common sets are version 1.1 unless said).
  "Office.context.document.settings": { set: { name: "Settings", version: "1.1" }, source: `${COMMON_SETS}#settings` },
  "Office.Settings": { set: { name: "Settings", version: "1.1" }, source: `${COMMON_SETS}#settings; ${OFFICE}.settings` },
  // Office.context.officeTheme (bodyBackgroundColor, isDarkTheme): the OfficeTheme page lists Excel on the web, Windows, Mac
  // and iOS as supported and names a requirement set for Outlook only (Mailbox 1.14); the Context page gives none for Excel.
  "Office.context.officeTheme": { set: null, source: `${OFFICE}.officetheme; ${OFFICE}.context#office-office-context-officetheme-member` },
  "Office.OfficeTheme": { set: null, source: `${OFFICE}.officetheme` },
  // "Requirement set 1.1 is the first version of the API"; associate registers a function (injected by the metadata plugin).
  "CustomFunctions.associate": { set: { name: "CustomFunctionsRuntime", version: "1.1" }, source: CUSTOM_FUNCTION_SETS },
  "CustomFunctions.Invocation": { set: { name: "CustomFunctionsRuntime", version: "1.1" }, source: `${INVOCATION} (address: CustomFunctionsRuntime 1.1)` },
  // "Requirement set 1.2 adds the CustomFunctions.Error object to support error handling."
  "CustomFunctions.Error": { set: { name: "CustomFunctionsRuntime", version: "1.2" }, source: CUSTOM_FUNCTION_SETS },
  "CustomFunctions.ErrorCode": { set: { name: "CustomFunctionsRuntime", version: "1.2" }, source: `${CUSTOM_FUNCTION_SETS}; https://learn.microsoft.com/javascript/api/custom-functions-runtime/customfunctions.errorcode` },
  // Invocation.parameterAddresses: [API set: CustomFunctionsRuntime 1.3].
  "invocation.parameterAddresses": { set: { name: "CustomFunctionsRuntime", version: "1.3" }, source: INVOCATION },
};

const ROOTS = new Set(["Office", "Excel", "OfficeRuntime", "CustomFunctions"]);
/** Members of a custom function's invocation argument, named after the Invocation interface. */
const INVOCATION_MEMBERS = new Set(["address", "parameterAddresses", "functionName", "isInValuePreview", "setResult", "onCanceled"]);

function sourceFiles(dir: string): string[] {
  return readdirSync(dir)
    .sort()
    .flatMap((name) => {
      const p = path.join(dir, name);
      return statSync(p).isDirectory() ? sourceFiles(p) : p.endsWith(".ts") ? [p] : [];
    });
}

/** The API a chain names: the longest table key it starts with, else the chain up to its third name. */
function apiOf(chain: string): string {
  const keys = Object.keys(API_SETS).filter((k) => chain === k || chain.startsWith(`${k}.`));
  return keys.sort((a, b) => b.length - a.length)[0] ?? chain.split(".").slice(0, 3).join(".");
}

/** Each API used in the sources, with the first place it is used. */
function apisInSources(): Map<string, string> {
  const found = new Map<string, string>();
  const note = (api: string, file: string, node: ts.Node, sf: ts.SourceFile) => {
    if (found.has(api)) return;
    const { line } = sf.getLineAndCharacterOfPosition(node.getStart(sf));
    found.set(api, `${path.relative(ROOT, file)}:${line + 1}`);
  };
  for (const file of sourceFiles(path.join(ROOT, "src"))) {
    const sf = ts.createSourceFile(file, readFileSync(file, "utf8"), ts.ScriptTarget.Latest, true);
    const visit = (node: ts.Node): void => {
      if ((ts.isPropertyAccessExpression(node) || ts.isQualifiedName(node)) && !(ts.isPropertyAccessExpression(node.parent) || ts.isQualifiedName(node.parent))) {
        const chain = node.getText(sf).replace(/\?\./g, ".").replace(/\s+/g, "");
        const root = chain.split(".")[0];
        if (ROOTS.has(root)) note(apiOf(chain), file, node, sf);
      }
      if (ts.isPropertyAccessExpression(node) && INVOCATION_MEMBERS.has(node.name.text) && /invocation/i.test(node.expression.getText(sf))) {
        note(`invocation.${node.name.text}`, file, node, sf);
      }
      ts.forEachChild(node, visit);
    };
    visit(sf);
  }
  return found;
}

function declaredSets(manifest: string): Map<string, string> {
  const doc = new DOMParser().parseFromString(manifest, "text/xml");
  const out = new Map<string, string>();
  for (const set of Array.from(doc.getElementsByTagNameNS("http://schemas.microsoft.com/office/appforoffice/1.1", "Set"))) {
    const sets = set.parentNode as unknown as { getAttribute(n: string): string | null };
    out.set(set.getAttribute("Name") ?? "", set.getAttribute("MinVersion") || sets.getAttribute("DefaultMinVersion") || "1.1");
  }
  return out;
}

const atLeast = (have: string, need: string) => {
  const [a, b] = [have, need].map((v) => v.split(".").map(Number));
  for (let i = 0; i < Math.max(a.length, b.length); i++) if ((a[i] ?? 0) !== (b[i] ?? 0)) return (a[i] ?? 0) > (b[i] ?? 0);
  return true;
};

let used: Map<string, string>;
let bundle: string;
beforeAll(async () => {
  used = apisInSources();
  bundle = readFileSync(path.join(await builtAddin(), "taskpane.js"), "utf8");
});

describe("Office.js calls against the requirement sets manifest.xml declares", () => {
  test("finds the calls the add-in is known to make (the scan works)", () => {
    expect([...used.keys()]).toEqual(expect.arrayContaining(["Office.onReady", "Office.context.document.settings", "CustomFunctions.Error", "invocation.parameterAddresses"]));
  });

  test("knows the requirement set of every Office.js API the sources use", () => {
    const unknown = [...used].filter(([api]) => !API_SETS[api]).map(([api, where]) => `${api} at ${where}: look up its requirement set and add it to API_SETS`);
    expect(unknown).toEqual([]);
  });

  test("knows the requirement set of every CustomFunctions member in the built bundle (calls the metadata plugin injects)", () => {
    const members = new Set([...bundle.matchAll(/\bCustomFunctions\.([A-Za-z_$][\w$]*)/g)].map((m) => `CustomFunctions.${m[1]}`));
    expect(members.has("CustomFunctions.associate")).toBe(true);
    for (const api of members) expect(API_SETS[api], api).toBeDefined();
    for (const api of members) used.set(api, used.get(api) ?? "the built bundle");
  });

  test("declares each of those sets in manifest.xml at the version the API needs", () => {
    const declared = declaredSets(readFileSync(path.join(ROOT, "manifest.xml"), "utf8"));
    for (const [api, where] of used) {
      const entry = API_SETS[api];
      if (!entry?.set) continue;
      const have = declared.get(entry.set.name);
      expect(have, `${api} (${where}) needs ${entry.set.name} ${entry.set.version}: ${entry.source}`).toBeDefined();
      expect(atLeast(have as string, entry.set.version), `${api} needs ${entry.set.name} ${entry.set.version}, manifest declares ${have}: ${entry.source}`).toBe(true);
    }
  });

  test("uses no Excel JavaScript API (Excel.run) yet, so declares no ExcelApi set it does not need", () => {
    const declared = declaredSets(readFileSync(path.join(ROOT, "manifest.xml"), "utf8"));
    const usesExcel = [...used.keys()].some((api) => api.startsWith("Excel.") || api.includes("context.workbook"));
    expect(declared.has("ExcelApi")).toBe(usesExcel);
  });
});
