/**
 * The rulesets a workbook stores for its formulas, read from the file without
 * Excel. The add-in keeps them in the workbook's document settings
 * (Office.context.document.settings, under one key), which Office saves with
 * the document, per add-in ("Persist add-in state and settings",
 * https://learn.microsoft.com/office/dev/add-ins/develop/persisting-add-in-state-and-settings:
 * the settings are a property bag stored as serialized JSON; "Office.Settings
 * interface", https://learn.microsoft.com/javascript/api/office/office.settings).
 *
 * In the file that bag is an Office Add-in part: xl/webextensions/webextensionN.xml,
 * content type application/vnd.ms-office.webextension+xml, root we:webextension
 * with we:reference (the add-in) and we:properties, one we:property name="…"
 * value="…" per setting ([MS-OWEXML] Office Web Extensibility Extensions to
 * Office Open XML, §2.2.1 CT_OsfWebExtensionProperty, §2.2.7 CT_OsfWebExtension
 * and §5.1 its schema, https://learn.microsoft.com/openspecs/office_standards/ms-owexml/;
 * the part is shown in "Automatically open a task pane with a document",
 * https://learn.microsoft.com/office/dev/add-ins/develop/automatically-open-a-task-pane-with-a-document).
 *
 * The specification gives the value only as a string. Each value is the
 * setting's JSON: `value="true"` for a boolean in the page above, and a text
 * setting as a quoted JSON string (`value="&quot;…&quot;"`) in workbooks and
 * tools seen in public. The add-in stores one text (the store's JSON), so the
 * value is read as JSON and, where that gives a string, its text is read as
 * the store; a value that is the store object itself is read too.
 */
import { describeProblem, jsonSyntaxError, loadRuleset, STORE_FORMAT, STORE_KEY, type Problem, type Result, type Ruleset } from "../../core/index.js";
import type { WorkbookPackage } from "./workbookPackage.js";
import { attributeOf, type XmlElement } from "./xmlPart.js";

export const WEB_EXTENSION_CONTENT_TYPE = "application/vnd.ms-office.webextension+xml";
export const WEB_EXTENSION_NAMESPACE = "http://schemas.microsoft.com/office/webextensions/webextension/2010/11";

export interface StoredRuleset {
  /** The add-in part that holds it. */
  part: string;
  /** Its place in the store's list (0-based). */
  entry: number;
  id: string;
  loaded: Result<Ruleset>;
}

export interface AddInPart {
  part: string;
  /** The add-in the part belongs to (we:reference id), and its catalogue type. */
  addIn: string;
  storeType: string;
  /** Whether the part holds Loadwright's stored rulesets. */
  holdsRulesets: boolean;
}

export interface WorkbookSettings {
  parts: AddInPart[];
  rulesets: StoredRuleset[];
}

export async function readStoredRulesets(pkg: WorkbookPackage): Promise<WorkbookSettings> {
  const named = pkg.parts().filter((p) => /^xl\/webextensions\/webextension[^/]*\.xml$/i.test(p));
  const candidates = [...new Set([...pkg.partsOfType(WEB_EXTENSION_CONTENT_TYPE), ...named])].sort(byNumber);
  const parts: AddInPart[] = [];
  const rulesets: StoredRuleset[] = [];
  for (const part of candidates) {
    const root = await pkg.xml(part);
    if (root.local !== "webextension" || root.uri !== WEB_EXTENSION_NAMESPACE) {
      throw pkg.partError(part, root, `is not an Office Add-in part (its root element is <${root.local}>, not we:webextension)`);
    }
    const reference = child(root, "reference");
    const properties = child(root, "properties")?.children.filter((c) => c.local === "property" && c.uri === WEB_EXTENSION_NAMESPACE) ?? [];
    const setting = properties.filter((p) => attributeOf(p, "name") === STORE_KEY);
    if (setting.length > 1) throw pkg.partError(part, setting[1], `the setting "${STORE_KEY}" is written twice in one add-in part; which one the add-in reads is not defined`);
    parts.push({ part, addIn: reference ? (attributeOf(reference, "id") ?? "") : "", storeType: reference ? (attributeOf(reference, "storeType") ?? "") : "", holdsRulesets: setting.length === 1 });
    if (setting.length === 1) rulesets.push(...storeEntries(pkg, part, setting[0]));
  }
  return { parts, rulesets };
}

/** The stored rulesets of one setting's value, each loaded; a value that is not a store is refused where it is. */
function storeEntries(pkg: WorkbookPackage, part: string, property: XmlElement): StoredRuleset[] {
  const raw = attributeOf(property, "value");
  const refuse = (message: string) => pkg.partError(part, property, `the setting "${STORE_KEY}" ${message}; the stored rulesets cannot be read (the add-in leaves such a value untouched)`);
  if (raw === undefined) throw refuse("has no value attribute");
  let value = parseJson(raw);
  if (!value.ok) throw refuse(`is not JSON: ${value.message} of its value`);
  if (typeof value.value === "string") {
    const inner = parseJson(value.value);
    if (!inner.ok) throw refuse(`holds text that is not JSON: ${inner.message} of the text`);
    value = inner;
  }
  const store = value.value as { format?: unknown; rulesets?: unknown } | null;
  if (store === null || typeof store !== "object" || store.format !== STORE_FORMAT || !Array.isArray(store.rulesets)) {
    throw refuse(`is not in the ${STORE_FORMAT} format (an object with "format": "${STORE_FORMAT}" and a list "rulesets")`);
  }
  return store.rulesets.map((file, entry) => {
    const id = typeof (file as { id?: unknown } | null)?.id === "string" ? (file as { id: string }).id : `(entry ${entry + 1} without an id)`;
    return { part, entry, id, loaded: loadRuleset(file) };
  });
}

/** One line for a problem of a stored ruleset: the part, the entry and the place inside it. */
export function storedProblemLine(file: string, stored: StoredRuleset, p: Problem): string {
  return `${file}: ${stored.part}, stored ruleset ${stored.entry + 1} "${stored.id}" (${describeProblem({ ...p, message: "" }).replace(/: $/, "") || "the ruleset"}): ${p.message}`;
}

function parseJson(text: string): { ok: true; value: unknown } | { ok: false; message: string } {
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (e) {
    return { ok: false, message: jsonSyntaxError(text, e instanceof Error ? e.message : String(e)) };
  }
}

function child(element: XmlElement, local: string): XmlElement | undefined {
  return element.children.find((c) => c.local === local && c.uri === WEB_EXTENSION_NAMESPACE);
}

/** webextension2.xml before webextension10.xml. */
function byNumber(a: string, b: string): number {
  return a.localeCompare(b, "en", { numeric: true });
}
