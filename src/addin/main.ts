/// <reference types="office-js" />
/// <reference types="custom-functions-runtime" />
/**
 * The add-in's one entry, loaded by taskpane.html in Excel's shared runtime (so
 * formulas and task pane see the same stored rulesets) and in a plain browser
 * for trying the pane out. It is the one place that wires the parts together:
 * it makes the ruleset library, hands it to the formulas and to the pane.
 * Inside Excel stored rulesets live in the workbook's settings; in a browser
 * they live in local storage, and a demo ruleset is put there on first use.
 */
import { startTaskPane } from "../taskpane/taskpane.js";
import { RulesetLibrary } from "../workbook/rulesetLibrary.js";
import { RulesetStore } from "../workbook/rulesetStore.js";
import { browserStorageBackend } from "./browserStorageBackend.js";
import { seedDemoRuleset } from "./demoRuleset.js";
import { officeSettingsBackend } from "./officeSettingsBackend.js";

const hasOffice = typeof Office !== "undefined";
const browserStore = () => new RulesetStore(browserStorageBackend(window.localStorage));
const library = new RulesetLibrary(hasOffice ? new RulesetStore(officeSettingsBackend()) : browserStore());

// Formulas first: Excel may call them as soon as they are associated.
if (typeof CustomFunctions !== "undefined") {
  void import(/* webpackMode: "eager" */ "../functions/functions.js").then((formulas) => formulas.connectWorkbook({ library }));
}

async function officeHost(): Promise<Office.HostType | null> {
  if (!hasOffice) return null;
  const info = await Office.onReady();
  return info.host ?? null;
}

void officeHost().then(async (host) => {
  const inExcel = hasOffice && host === Office.HostType.Excel;
  if (!inExcel) {
    if (hasOffice) library.useStore(browserStore());
    await seedDemoRuleset(library.store);
  }
  startTaskPane(document, { inExcel, library });
});
