/// <reference types="office-js" />
/// <reference types="custom-functions-runtime" />
/**
 * The add-in's one entry, loaded by taskpane.html in Excel's shared runtime (so
 * formulas and task pane see the same stored rulesets) and in a plain browser
 * for trying the pane out. It is the one place that wires the parts together:
 * it makes the ruleset library, hands it to the formulas and to the pane.
 * Inside Excel stored rulesets live in the workbook's settings, every store is
 * followed by a recalculation of the workbook (the store's one hook), and the
 * pane's Sheet view works on the workbook; in a browser rulesets live in local
 * storage, a demo ruleset is put there on first use, and the Sheet view works
 * on an invented demo table kept in the page. It also hands the pane the
 * host's theme and where the cautions' acknowledgement is kept.
 */
import "./withoutEval.js";
import { connectSheet } from "../taskpane/sheetConnection.js";
import { startTaskPane } from "../taskpane/taskpane.js";
import { CautionAcknowledgement } from "../workbook/cautionAcknowledgement.js";
import { RulesetLibrary } from "../workbook/rulesetLibrary.js";
import { RulesetStore } from "../workbook/rulesetStore.js";
import { browserStorageBackend } from "./browserStorageBackend.js";
import { seedDemoRuleset } from "./demoRuleset.js";
import { demoSheetHost } from "./demoSheetHost.js";
import { excelSheetHost } from "./excelSheetHost.js";
import { officeSettingsBackend } from "./officeSettingsBackend.js";
import { officeTheme } from "./officeTheme.js";
import { recalculateWorkbook } from "./recalculateWorkbook.js";

const hasOffice = typeof Office !== "undefined";
const browserBackend = () => browserStorageBackend(window.localStorage);
const browserStore = () => new RulesetStore(browserBackend());
const library = new RulesetLibrary(hasOffice ? new RulesetStore(officeSettingsBackend(), { afterWrite: recalculateWorkbook }) : browserStore());

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
  connectSheet(inExcel ? excelSheetHost() : demoSheetHost());
  // The cautions' acknowledgement is kept where the stored rulesets are: with the workbook, or in the browser.
  const cautions = new CautionAcknowledgement(inExcel ? officeSettingsBackend() : browserBackend());
  startTaskPane(document, { inExcel, library, cautions, theme: officeTheme() });
});
