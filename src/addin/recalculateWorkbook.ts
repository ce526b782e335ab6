/// <reference types="office-js" />
/**
 * What follows every store inside Excel: a full recalculation, so that the
 * formulas naming a ruleset compute with what is stored now. Excel does not
 * recalculate a custom function when something outside its arguments changes,
 * and a ruleset stored in the document settings is outside them; a full
 * calculation marks every cell dirty and recalculates it, as Ctrl+Alt+F9 does
 * (Excel.CalculationType.full, ExcelApi 1.1).
 */
import type { AfterWrite } from "../workbook/rulesetStore.js";

export const recalculateWorkbook: AfterWrite = async (ids) => {
  const named = ids.join(", ");
  try {
    await Excel.run(async (context) => {
      context.workbook.application.calculate(Excel.CalculationType.full);
      await context.sync();
    });
    return `Excel recalculated the workbook: formulas naming ${named} now use what is stored.`;
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e);
    return `Excel did not recalculate (${reason}): press Ctrl+Alt+F9 so that formulas naming ${named} use what is stored.`;
  }
};
