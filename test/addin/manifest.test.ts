/**
 * manifest.xml and the built dist/manifest.xml held to the platform's manifest
 * reference (the rules and the page each is written from are in
 * manifestRules.ts). The manifest is read with a real, namespace-aware XML
 * parser (@xmldom/xmldom, a W3C DOM Level 2 parser), so a prefix bound to the
 * wrong namespace or an element out of place is seen as the platform sees it.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { DOMParser, type Document, type Element } from "@xmldom/xmldom";
import { beforeAll, describe, expect, test } from "vitest";
import { builtAddin, ROOT } from "./builtAddin.js";
import { BASIC_TYPES, ELEMENT_REQUIREMENTS, LIMITS, NS, page, RESID_TARGETS, RULES, type ElementRule } from "./manifestRules.js";

/** The manifest as a DOM; a document that is not well-formed XML fails here with the parser's words. */
function parseManifest(text: string): Document {
  const errors: string[] = [];
  const doc = new DOMParser({ onError: (level, message) => void (level !== "warning" && errors.push(message)) }).parseFromString(text, "text/xml");
  if (errors.length > 0) throw new Error(`manifest is not well-formed XML: ${errors.join("; ")}`);
  return doc;
}

const childElements = (e: Element): Element[] => Array.from(e.childNodes).filter((n): n is Element => n.nodeType === 1);

function ancestry(e: Element): string[] {
  const names: string[] = [];
  for (let n: Element | null = e; n; n = n.parentNode?.nodeType === 1 ? (n.parentNode as Element) : null) names.unshift(n.localName as string);
  return names;
}

/** The rule of the longest matching suffix of the element's ancestry. */
function ruleOf(e: Element): { key: string; rule: ElementRule } | null {
  const names = ancestry(e);
  for (let k = names.length; k >= 1; k--) {
    const key = names.slice(names.length - k).join(">");
    if (RULES[key]) return { key, rule: RULES[key] };
  }
  return null;
}

function placeOf(e: Element): string {
  return ancestry(e).join(">");
}

function attribute(e: Element, name: string): string | null {
  if (name === "xsi:type") return e.getAttributeNS(NS.xsi, "type");
  return e.hasAttribute(name) ? e.getAttribute(name) : null;
}

/** Every departure from the rules, one sentence each naming the element's place and the page. */
function departures(doc: Document): string[] {
  const out: string[] = [];
  const walk = (e: Element, inOverrides: boolean) => {
    const here = placeOf(e);
    const overrides = inOverrides || e.localName === "VersionOverrides";
    // Namespaces: the base manifest in appforoffice/1.1 (OfficeApp page); inside VersionOverrides its own
    // namespace (VersionOverrides page, "Namespace values"), resources in the basic-types one (Resources page).
    const expected = !overrides ? NS.app : BASIC_TYPES.has(e.localName as string) ? NS.basicTypes : NS.overrides;
    if (e.namespaceURI !== expected) out.push(`${here}: in namespace ${e.namespaceURI}, expected ${expected} (${page(overrides ? "versionoverrides" : "officeapp")})`);
    const found = ruleOf(e);
    if (!found) {
      out.push(`${here}: no documented rule for this element here (read its page and add one)`);
      return;
    }
    const { rule } = found;
    const cite = rule.source.join(", ");
    const children = childElements(e);
    const slot = (name: string) => rule.children.findIndex((c) => (Array.isArray(c) ? c.includes(name) : c === name));
    let last = -1;
    for (const child of children) {
      const at = slot(child.localName as string);
      if (at < 0) out.push(`${here}: <${child.localName}> is not a child it may have (${cite})`);
      else if (at < last) out.push(`${here}: <${child.localName}> is out of order (${cite})`);
      else last = at;
    }
    for (const name of rule.required ?? []) {
      if (!children.some((c) => c.localName === name)) out.push(`${here}: must contain <${name}> (${cite})`);
    }
    for (const [name, most] of Object.entries(rule.most ?? {})) {
      const n = children.filter((c) => c.localName === name).length;
      if (n > most) out.push(`${here}: has ${n} <${name}>, at most ${most} (${cite})`);
    }
    for (const [name, allowed] of Object.entries(rule.attributes ?? {})) {
      const value = attribute(e, name);
      if (value === null) out.push(`${here}: attribute ${name} is required (${cite})`);
      else if (allowed && !allowed.includes(value)) out.push(`${here}: ${name}="${value}" is not one of ${allowed.join(", ")} (${cite})`);
    }
    if (rule.text) {
      const text = (e.textContent ?? "").trim();
      if (text === "") out.push(`${here}: must hold a value (${cite})`);
      else if (rule.text !== "any" && !rule.text.includes(text)) out.push(`${here}: "${text}" is not one of ${rule.text.join(", ")} (${cite})`);
    }
    for (const child of children) walk(child, overrides);
  };
  walk(doc.documentElement as Element, false);
  return out;
}

const all = (doc: Document, local: string) => Array.from(doc.getElementsByTagName("*")).filter((e) => e.localName === local);

function resources(doc: Document): Map<string, Map<string, string>> {
  const byCollection = new Map<string, Map<string, string>>();
  for (const name of ["Images", "Urls", "ShortStrings", "LongStrings"]) {
    const entries = new Map<string, string>();
    for (const collection of all(doc, name)) for (const r of childElements(collection)) entries.set(r.getAttribute("id") ?? "", r.getAttribute("DefaultValue") ?? "");
    byCollection.set(name, entries);
  }
  return byCollection;
}

/** The requirement sets the base manifest declares, with the version in force (Set MinVersion, else Sets DefaultMinVersion). */
function declaredSets(doc: Document): Map<string, string> {
  const out = new Map<string, string>();
  const base = childElements(doc.documentElement as Element).find((e) => e.localName === "Requirements");
  for (const sets of base ? childElements(base).filter((e) => e.localName === "Sets") : []) {
    for (const set of childElements(sets)) out.set(set.getAttribute("Name") ?? "", set.getAttribute("MinVersion") || sets.getAttribute("DefaultMinVersion") || "1.1");
  }
  return out;
}

const versionAtLeast = (have: string, need: string) => {
  const [a, b] = [have, need].map((v) => v.split(".").map(Number));
  for (let i = 0; i < Math.max(a.length, b.length); i++) if ((a[i] ?? 0) !== (b[i] ?? 0)) return (a[i] ?? 0) > (b[i] ?? 0);
  return true;
};

const manifests: { name: string; doc: () => Document }[] = [];
let source: Document;
let built: Document;
beforeAll(async () => {
  source = parseManifest(readFileSync(path.join(ROOT, "manifest.xml"), "utf8"));
  built = parseManifest(readFileSync(path.join(await builtAddin(), "manifest.xml"), "utf8"));
});
manifests.push({ name: "manifest.xml", doc: () => source }, { name: "dist/manifest.xml (production build)", doc: () => built });

describe.each(manifests)("$name against the manifest reference", ({ doc }) => {
  test("places every element under a parent that may hold it, in the documented order, with what it must contain", () => {
    expect(departures(doc())).toEqual([]);
  });

  test("points every resid at a resource of the kind its page names, of at most 32 characters", () => {
    const res = resources(doc());
    for (const { place, collection, source: cite } of RESID_TARGETS) {
      const elements = all(doc(), place.split(">").at(-1) as string).filter((e) => placeOf(e).endsWith(place));
      for (const e of elements) {
        const resid = e.getAttribute("resid") ?? "";
        expect(resid.length, `${place} resid "${resid}" (${cite})`).toBeLessThanOrEqual(LIMITS.resid);
        expect(res.get(collection)?.has(resid), `${place} resid "${resid}" in <${collection}> (${cite})`).toBe(true);
      }
    }
  });

  test("keeps resources unique, within their lengths, and every URL and image on HTTPS", () => {
    // Resources page: ids unique, at most 32 characters; URLs at most 2048 characters, over SSL; short strings 125, long strings 250.
    const res = resources(doc());
    const ids = [...res.values()].flatMap((m) => [...m.keys()]);
    expect(new Set(ids).size, page("resources")).toBe(ids.length);
    for (const id of ids) expect(id.length, `${id} (${page("resources")})`).toBeLessThanOrEqual(LIMITS.resid);
    for (const name of ["Urls", "Images"]) {
      for (const url of res.get(name)?.values() ?? []) {
        expect(url.length, page("resources")).toBeLessThanOrEqual(LIMITS.url);
        expect(new URL(url).protocol, `${url} (${page("resources")})`).toBe("https:");
      }
    }
    for (const text of res.get("ShortStrings")?.values() ?? []) expect(text.length, text).toBeLessThanOrEqual(LIMITS.shortString);
    for (const text of res.get("LongStrings")?.values() ?? []) expect(text.length, text).toBeLessThanOrEqual(LIMITS.longString);
    const displayName = all(doc(), "DisplayName")[0]?.getAttribute("DefaultValue") ?? "";
    expect(displayName.length, page("displayname")).toBeLessThanOrEqual(LIMITS.displayName);
    for (const g of all(doc(), "Group")) expect((g.getAttribute("id") ?? "").length, page("group")).toBeLessThanOrEqual(LIMITS.groupId);
  });

  test("gives every icon the three required image sizes, 16, 32 and 80 pixels", () => {
    // Icon page: "Three image sizes are required (16, 32, and 80 pixels)".
    for (const icon of all(doc(), "Icon")) {
      const sizes = childElements(icon).map((i) => i.getAttribute("size"));
      expect(sizes, page("icon")).toEqual(expect.arrayContaining(["16", "32", "80"]));
    }
  });

  test("runs formulas, ribbon and task pane in one shared runtime: Runtime, FunctionFile and the functions Page name the same page", () => {
    // Runtime page: resid "must match the id attribute of a Url element"; lifetime "long" for a shared runtime.
    // Configure your add-in to use a shared runtime (learn.microsoft.com/office/dev/add-ins/develop/configure-your-add-in-to-use-a-shared-runtime):
    // the Page of the CustomFunctions extension point and the FunctionFile use the Runtime's resid.
    const runtime = all(doc(), "Runtime")[0]?.getAttribute("resid");
    expect(runtime).toBeTruthy();
    expect(all(doc(), "FunctionFile").map((e) => e.getAttribute("resid"))).toEqual([runtime]);
    const pageLocation = all(doc(), "SourceLocation").filter((e) => placeOf(e).endsWith("Page>SourceLocation"));
    expect(pageLocation.map((e) => e.getAttribute("resid"))).toEqual([runtime]);
    // Runtimes first among the Host's children ([MS-OWEMXML] 2.2 Host, sequence Runtimes, AllFormFactors).
    const host = all(doc(), "Host").find((h) => placeOf(h).includes("VersionOverrides")) as Element;
    expect(childElements(host)[0].localName).toBe("Runtimes");
  });

  test("declares in its base <Requirements> every requirement set its elements are associated with", () => {
    const declared = declaredSets(doc());
    for (const { place, set, version, source: cite } of ELEMENT_REQUIREMENTS) {
      const used = Array.from(doc().getElementsByTagName("*")).some((e) => placeOf(e).endsWith(place));
      if (!used) continue;
      const have = declared.get(set);
      expect(have, `<${place}> needs ${set} ${version} (${cite})`).toBeDefined();
      expect(versionAtLeast(have as string, version), `<${place}> needs ${set} ${version}, declared ${have} (${cite})`).toBe(true);
    }
  });
});

describe("the rule checker", () => {
  const minimal = readFileSync(path.join(ROOT, "manifest.xml"), "utf8");

  test("sees an element out of order", () => {
    const swapped = minimal.replace(/(<Version>[^<]*<\/Version>)\s*(<ProviderName>[^<]*<\/ProviderName>)/, "$2$1");
    expect(departures(parseManifest(swapped))).toEqual(expect.arrayContaining([expect.stringMatching(/^OfficeApp: <Version> is out of order/)]));
  });

  test("sees Runtimes placed after the form factors", () => {
    const moved = minimal.replace(/(<Runtimes>[\s\S]*?<\/Runtimes>)([\s\S]*?)(<\/Host>\s*<\/Hosts>\s*<Resources>)/, "$2$1$3");
    expect(departures(parseManifest(moved))).toEqual(expect.arrayContaining([expect.stringMatching(/Host: <Runtimes> is out of order/)]));
  });

  test("sees a resource element outside the basic-types namespace and an unknown element", () => {
    const wrong = minimal.replace("<bt:ShortStrings>", "<ShortStrings>").replace("</bt:ShortStrings>", "</ShortStrings>").replace("<Permissions>", "<Frobnicate/><Permissions>");
    const found = departures(parseManifest(wrong));
    expect(found).toEqual(expect.arrayContaining([expect.stringMatching(/Resources>ShortStrings: in namespace/), expect.stringMatching(/OfficeApp: <Frobnicate> is not a child/)]));
  });

  test("sees a missing required attribute and a value outside the documented list", () => {
    const wrong = minimal.replace('lifetime="long"', 'lifetime="short"').replace('<Set Name="SharedRuntime"', "<Set");
    const found = departures(parseManifest(wrong));
    expect(found).toEqual(expect.arrayContaining([expect.stringMatching(/Runtime: lifetime="short" is not one of long/), expect.stringMatching(/Set: attribute Name is required/)]));
  });
});
