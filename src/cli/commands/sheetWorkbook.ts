/**
 * The reviewer's copy written as an .xlsx file with the spreadsheet library:
 * one loop over the sheet's cells. Formulas are written without a cached
 * result, and the file asks for a full recalculation on opening, so every
 * number a reader sees is the spreadsheet program's own.
 */
import ExcelJS from "exceljs";
import type { ReviewerSheet, SheetStyle } from "../../sheet/reviewerSheet.js";

const FONTS: Record<SheetStyle, Partial<ExcelJS.Font>> = {
  title: { bold: true, size: 13 },
  stamp: { bold: true },
  caution: { color: { argb: "FFC00000" } },
  heading: { bold: true },
  header: { bold: true },
};

export async function sheetWorkbook(sheet: ReviewerSheet): Promise<Uint8Array> {
  const book = new ExcelJS.Workbook();
  book.creator = "Loadwright";
  book.calcProperties.fullCalcOnLoad = true;
  const ws = book.addWorksheet(sheet.name);
  for (const cell of sheet.cells) {
    const target = ws.getCell(cell.address);
    if (cell.kind === "formula") target.value = { formula: cell.formula };
    else target.value = cell.value;
    if (cell.style) target.font = FONTS[cell.style];
  }
  ws.getColumn(1).width = 48;
  return new Uint8Array(await book.xlsx.writeBuffer());
}
