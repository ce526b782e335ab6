/// <reference types="office-js" />
/// <reference types="custom-functions-runtime" />
/**
 * The add-in's one entry, loaded by taskpane.html in Excel's shared runtime (so
 * formulas and task pane see the same stored rulesets) and in a plain browser
 * for trying the pane out. Inside Excel the formulas are registered and stored
 * rulesets live in the workbook's settings; in a browser they live in local
 * storage, and a demo ruleset is put there on first use.
 */
import { startTaskPane } from "../taskpane/taskpane.js";
import { browserStorageBackend } from "./browserStorageBackend.js";
import { seedDemoRuleset } from "./demoRuleset.js";
import { officeSettingsBackend } from "./officeSettingsBackend.js";
import { useRulesetStore } from "./rulesetLibrary.js";
import { RulesetStore } from "./rulesetStore.js";

const hasOffice = typeof Office !== "undefined";

// Formulas first: Excel may call them as soon as they are associated.
if (hasOffice) useRulesetStore(new RulesetStore(officeSettingsBackend()));
if (typeof CustomFunctions !== "undefined") {
  void import(/* webpackMode: "eager" */ "../functions/functions.js");
}

async function officeHost(): Promise<Office.HostType | null> {
  if (!hasOffice) return null;
  const info = await Office.onReady();
  return info.host ?? null;
}

void officeHost().then(async (host) => {
  const inExcel = hasOffice && host === Office.HostType.Excel;
  if (!inExcel) {
    const store = new RulesetStore(browserStorageBackend(window.localStorage));
    useRulesetStore(store);
    await seedDemoRuleset(store);
  }
  startTaskPane(document, { inExcel });
});
