/**
 * Every Office.js call the add-in makes, and the requirement set it belongs
 * to, held to the sets manifest.xml declares. The sources are read with the
 * TypeScript compiler's parser (every property access and qualified type name
 * rooted at Office, Excel, OfficeRuntime or CustomFunctions, and the members
 * of an invocation), the files that use the Excel JavaScript API also with its
 * type checker (every member of an Excel object reached through a request
 * context, proxies included: "Excel.Workbook.getSelectedRange"), and the built
 * bundle is searched for the calls the metadata plugin injects; a call missing
 * from the table below fails, so a new API is looked up before it ships. The
 * table's set for an Excel member is also held to the one its declaration in
 * @types/office-js (generated from the same reference pages) names.
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
const EXCEL = "https://learn.microsoft.com/javascript/api/excel";
const EXCEL_SETS = "https://learn.microsoft.com/javascript/api/requirement-sets/excel/excel-api-requirement-sets";
const OFFICE_EXTENSION = "https://learn.microsoft.com/javascript/api/office/officeextension";

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
  // The Excel JavaScript API (src/addin/excelSheetHost.ts, recalculateWorkbook.ts). Each page gives
  // "[ API set: ExcelApi n ]" for the member; the requirement sets page lists what each version adds.
  "Excel.run": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}#excel-excel-run-function(1); ${EXCEL_SETS}` },
  "Excel.RequestContext": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.requestcontext` },
  "Excel.RequestContext.workbook": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.requestcontext` },
  "Excel.CalculationType": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.calculationtype` },
  "Excel.ClearApplyTo": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.clearapplyto` },
  "Excel.NamedItemType": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.nameditemtype` },
  "Excel.Workbook.application": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.workbook#excel-excel-workbook-application-member` },
  "Excel.Workbook.worksheets": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.workbook#excel-excel-workbook-worksheets-member` },
  "Excel.Workbook.names": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.workbook#excel-excel-workbook-names-member` },
  "Excel.Workbook.getSelectedRange": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.workbook#excel-excel-workbook-getselectedrange-member(1)` },
  // "Recalculate all currently opened workbooks in Excel"; CalculationType.full: "mark all cells as dirty and then recalculate them".
  "Excel.Application.calculate": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.application#excel-excel-application-calculate-member(1)` },
  "Excel.WorksheetCollection.load": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheetcollection#excel-excel-worksheetcollection-load-member(1)` },
  "Excel.WorksheetCollection.items": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheetcollection#excel-excel-worksheetcollection-items-member` },
  "Excel.WorksheetCollection.add": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheetcollection#excel-excel-worksheetcollection-add-member(1)` },
  "Excel.WorksheetCollection.getActiveWorksheet": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheetcollection#excel-excel-worksheetcollection-getactiveworksheet-member(1)` },
  // The *OrNullObject methods come with ExcelApi 1.4.
  "Excel.WorksheetCollection.getItemOrNullObject": { set: { name: "ExcelApi", version: "1.4" }, source: `${EXCEL}/excel.worksheetcollection#excel-excel-worksheetcollection-getitemornullobject-member(1)` },
  "Excel.Worksheet": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheet` },
  "Excel.Worksheet.load": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheet#excel-excel-worksheet-load-member(1)` },
  "Excel.Worksheet.name": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheet#excel-excel-worksheet-name-member` },
  "Excel.Worksheet.getRange": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheet#excel-excel-worksheet-getrange-member(1)` },
  "Excel.Worksheet.activate": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.worksheet#excel-excel-worksheet-activate-member(1)` },
  "Excel.NamedItemCollection.getItemOrNullObject": { set: { name: "ExcelApi", version: "1.4" }, source: `${EXCEL}/excel.nameditemcollection#excel-excel-nameditemcollection-getitemornullobject-member(1)` },
  "Excel.NamedItem.load": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.nameditem#excel-excel-nameditem-load-member(1)` },
  "Excel.NamedItem.name": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.nameditem#excel-excel-nameditem-name-member` },
  "Excel.NamedItem.type": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.nameditem#excel-excel-nameditem-type-member` },
  "Excel.NamedItem.getRange": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.nameditem#excel-excel-nameditem-getrange-member(1)` },
  "Excel.Range": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range` },
  "Excel.Range.load": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-load-member(1)` },
  "Excel.Range.address": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-address-member` },
  "Excel.Range.rowIndex": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-rowindex-member` },
  "Excel.Range.columnIndex": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-columnindex-member` },
  "Excel.Range.rowCount": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-rowcount-member` },
  "Excel.Range.columnCount": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-columncount-member` },
  "Excel.Range.values": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-values-member` },
  "Excel.Range.formulas": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-formulas-member` },
  "Excel.Range.worksheet": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-worksheet-member` },
  "Excel.Range.clear": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-clear-member(1)` },
  "Excel.Range.format": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.range#excel-excel-range-format-member` },
  "Excel.RangeFormat.font": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.rangeformat#excel-excel-rangeformat-font-member` },
  "Excel.RangeFont.bold": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.rangefont#excel-excel-rangefont-bold-member` },
  "Excel.RangeFont.color": { set: { name: "ExcelApi", version: "1.1" }, source: `${EXCEL}/excel.rangefont#excel-excel-rangefont-color-member` },
  // The proxy runtime every Office host shares: no requirement set names these (the pages give none).
  "OfficeExtension.ClientRequestContext.sync": { set: null, source: `${OFFICE_EXTENSION}.clientrequestcontext#office-officeextension-clientrequestcontext-sync-member(1)` },
  "OfficeExtension.ClientObject.isNullObject": { set: null, source: `${OFFICE_EXTENSION}.clientobject#office-officeextension-clientobject-isnullobject-member` },
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

const OFFICE_TYPES = path.join(ROOT, "node_modules/@types/office-js/index.d.ts");

interface TypedMember {
  where: string;
  /** The version the member's declaration gives in "[Api set: ExcelApi n]", or null where it gives none. */
  declared: string | null;
}

/**
 * Every member of an Excel (or OfficeExtension) object the sources reach, named
 * by where @types/office-js declares it ("Excel.Workbook.getSelectedRange"): the
 * type checker follows proxies through variables, which a name scan cannot.
 */
function excelMembersInSources(): Map<string, TypedMember> {
  const files = sourceFiles(path.join(ROOT, "src")).filter((f) => /\bExcel\.run\b/.test(readFileSync(f, "utf8")));
  const program = ts.createProgram(files, {
    target: ts.ScriptTarget.ES2022,
    module: ts.ModuleKind.NodeNext,
    moduleResolution: ts.ModuleResolutionKind.NodeNext,
    types: ["office-js"],
    noEmit: true,
    skipLibCheck: true,
  });
  const checker = program.getTypeChecker();
  const found = new Map<string, TypedMember>();
  const containerName = (node: ts.Node): string | null => {
    const names: string[] = [];
    for (let n: ts.Node | undefined = node; n; n = n.parent) {
      if ((ts.isClassDeclaration(n) || ts.isInterfaceDeclaration(n) || ts.isEnumDeclaration(n) || ts.isModuleDeclaration(n)) && n.name) names.unshift(n.name.getText());
    }
    return names.length > 0 ? names.join(".") : null;
  };
  for (const file of files) {
    const sf = program.getSourceFile(file) as ts.SourceFile;
    const visit = (node: ts.Node): void => {
      if (ts.isPropertyAccessExpression(node)) {
        const symbol = checker.getSymbolAtLocation(node.name);
        const declaration = symbol?.declarations?.[0];
        if (declaration && path.resolve(declaration.getSourceFile().fileName) === OFFICE_TYPES) {
          const owner = containerName(declaration.parent);
          if (owner && /^(Excel|OfficeExtension)\./.test(`${owner}.`)) {
            // An enumeration counts as one API: its members come with it.
            const api = ts.isEnumMember(declaration) ? owner : `${owner}.${node.name.text}`;
            if (!found.has(api)) {
              const remarks = ts.getJSDocTags(declaration).map((t) => (typeof t.comment === "string" ? t.comment : ts.getTextOfJSDocComment(t.comment) ?? "")).join(" ");
              const docs = ts.getJSDocCommentsAndTags(declaration).map((d) => d.getText()).join(" ");
              const declared = /\[Api set: ExcelApi (\d+\.\d+)/.exec(`${remarks} ${docs}`)?.[1] ?? null;
              const { line } = sf.getLineAndCharacterOfPosition(node.getStart(sf));
              found.set(api, { where: `${path.relative(ROOT, file)}:${line + 1}`, declared });
            }
          }
        }
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
let excelMembers: Map<string, TypedMember>;
let bundle: string;
beforeAll(async () => {
  used = apisInSources();
  excelMembers = excelMembersInSources();
  for (const [api, { where }] of excelMembers) if (!used.has(api)) used.set(api, where);
  bundle = readFileSync(path.join(await builtAddin(), "taskpane.js"), "utf8");
});

describe("Office.js calls against the requirement sets manifest.xml declares", () => {
  test("finds the calls the add-in is known to make (the scan works)", () => {
    expect([...used.keys()]).toEqual(expect.arrayContaining(["Office.onReady", "Office.context.document.settings", "CustomFunctions.Error", "invocation.parameterAddresses"]));
    // Reached through a request context and proxies held in variables, found by the type checker.
    expect([...excelMembers.keys()]).toEqual(expect.arrayContaining(["Excel.Workbook.getSelectedRange", "Excel.Range.formulas", "Excel.Application.calculate", "OfficeExtension.ClientRequestContext.sync"]));
    // The versions are read off the declarations: the null-object lookups came with ExcelApi 1.4.
    expect(excelMembers.get("Excel.WorksheetCollection.getItemOrNullObject")?.declared).toBe("1.4");
  });

  test("gives each Excel member the requirement set its declaration names, or a later one", () => {
    for (const [api, { where, declared }] of excelMembers) {
      const entry = API_SETS[api];
      if (!entry || declared === null) continue;
      expect(entry.set?.name, `${api} (${where})`).toBe("ExcelApi");
      expect(atLeast(entry.set?.version ?? "0", declared), `${api} (${where}) is declared in ExcelApi ${declared}; the table says ${entry.set?.version}`).toBe(true);
    }
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

  test("declares an ExcelApi set exactly when it uses the Excel JavaScript API (Excel.run)", () => {
    const declared = declaredSets(readFileSync(path.join(ROOT, "manifest.xml"), "utf8"));
    const usesExcel = [...used.keys()].some((api) => api.startsWith("Excel.") || api.includes("context.workbook"));
    expect(declared.has("ExcelApi")).toBe(usesExcel);
  });
});
