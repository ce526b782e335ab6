/**
 * The reviewer's copy: one worksheet that any spreadsheet program recomputes
 * without Loadwright. It holds the case table as given, the factor table (one
 * row per concrete combination row, one column per case, with label and
 * clause), every factored value as SUMPRODUCT(factors, case values), and the
 * envelope and governing rows as MAX/MIN/INDEX/MATCH over those values, under
 * the ruleset stamp and the cautions as text.
 *
 *   A                      B            C        D …        (gap)  values …   criteria …
 *   title, stamp, cautions, parameters, notes
 *   result                                       D   L  W:N
 *   P                                            140 420 -50
 *   envelope: result | max | row giving max | min | row giving min
 *   governing: criterion | value | row | every component's concurrent value
 *   combination row | combination | clause | factors… |  | P  V  M | max |M| …
 *   2: 1.2D + 1.6L  | 2           | §2.3.1  | 1.2 1.6 0 |  | =SUMPRODUCT(…) …
 *
 * Host-neutral: the content is a list of cells (text, number or formula with
 * its A1 address), so the command line writes it with a spreadsheet library
 * and the task pane can write it with one loop over cells. Nothing here is a
 * cached result: every number below the case and factor tables is a formula.
 */
import { columnLetters, comboRows, defaultCriteria, type Arith, type CaseTable, type Criterion, type Plan, type Problem, type Result } from "../core/index.js";

export type SheetCell =
  | { address: string; row: number; column: number; kind: "text"; value: string; style?: SheetStyle }
  | { address: string; row: number; column: number; kind: "number"; value: number; style?: SheetStyle }
  /** `formula` as typed after "=", in the spreadsheet's English function names and A1 references. */
  | { address: string; row: number; column: number; kind: "formula"; formula: string; style?: SheetStyle };

/** How a cell is meant to look; a writer may ignore it. */
export type SheetStyle = "title" | "stamp" | "caution" | "heading" | "header";

export interface ReviewerSheet {
  /** A worksheet name every spreadsheet program accepts (at most 31 characters, no []:*?/\). */
  name: string;
  /** 0-based row and column of every cell, in writing order (rows top to bottom). */
  cells: SheetCell[];
  rowCount: number;
  columnCount: number;
  /** Where each block is, for a reader or a test: 1-based rows, 0-based columns. */
  layout: SheetLayout;
}

export interface SheetLayout {
  caseHeaderRow: number;
  envelopeHeaderRow: number;
  governingHeaderRow: number | null;
  factorHeaderRow: number;
  firstFactorColumn: number;
  firstValueColumn: number;
  firstCriterionColumn: number;
  rowCount: number;
}

export interface ReviewerSheetOptions {
  /** Lines that name the ruleset and its status (the stamp), first the status. */
  stamp: readonly string[];
  cautions: readonly string[];
  /** Further lines a reviewer must read: parameters in force, symbols not supplied, skipped combinations. */
  notes?: readonly string[];
  /** Governing criteria; omitted: the max and min of every component of a cases-as-rows table, none for cases as columns. */
  criteria?: readonly Criterion[];
  rowLimit?: number;
  name?: string;
}

/** Spreadsheet limits (the Office Open XML grid Excel uses; LibreOffice's is at least as large). */
export const SHEET_MAX_ROWS = 1_048_576;
export const SHEET_MAX_COLUMNS = 16_384;

const TITLE = "Loadwright reviewer's copy: plain spreadsheet formulas, recomputable without the add-in";
const HOW =
  "Each factored value is SUMPRODUCT(the row's factors, the result's case values); the envelope and governing rows are MAX, MIN, INDEX and MATCH over them. Recalculate to check every number.";

export function reviewerSheet(plan: Plan, table: CaseTable, options: ReviewerSheetOptions): Result<ReviewerSheet> {
  const listed = comboRows(plan, options.rowLimit);
  if (!listed.ok) return listed;
  const rows = listed.value;
  if (rows.length === 0) return refused("unknown-row", "no combination of this ruleset applies to this case table, so there is no row to copy");
  const criteria = options.criteria ?? (table.orientation === "rows" ? defaultCriteria(table) : []);
  const K = plan.cases.length;
  const C = table.components.length;
  const G = criteria.length;

  // Columns: A label, B combination, C clause, D… factors (K), a gap, values (C), criterion values (G).
  const firstFactorColumn = 3;
  const firstValueColumn = firstFactorColumn + K + 1;
  const firstCriterionColumn = firstValueColumn + C;
  const columnCount = firstCriterionColumn + G;

  const headLines = [TITLE, ...options.stamp, ...options.cautions.map((c) => `Caution: ${c}`), ...(options.notes ?? []), HOW];
  const caseHeaderRow = headLines.length + 2;
  const envelopeHeaderRow = caseHeaderRow + C + 2;
  const governingHeaderRow = G > 0 ? envelopeHeaderRow + C + 2 : null;
  const factorHeaderRow = (governingHeaderRow ?? envelopeHeaderRow + C) + (governingHeaderRow === null ? 2 : G + 2);
  const firstRow = factorHeaderRow + 1;
  const lastRow = factorHeaderRow + rows.length;
  if (lastRow > SHEET_MAX_ROWS || columnCount > SHEET_MAX_COLUMNS) {
    return refused(
      "too-many-rows",
      `the reviewer's copy would need ${lastRow.toLocaleString("en-US")} rows and ${columnCount.toLocaleString("en-US")} columns, more than a worksheet holds (${SHEET_MAX_ROWS.toLocaleString("en-US")} rows, ${SHEET_MAX_COLUMNS.toLocaleString("en-US")} columns); copy fewer results or cases`,
    );
  }

  const cells: SheetCell[] = [];
  const put = (row: number, column: number, value: string | number, style?: SheetStyle) => {
    const address = `${columnLetters(column)}${row}`;
    const base = { address, row, column, ...(style ? { style } : {}) };
    cells.push(typeof value === "number" ? { ...base, kind: "number", value } : { ...base, kind: "text", value });
  };
  const formula = (row: number, column: number, text: string) => cells.push({ address: `${columnLetters(column)}${row}`, row, column, kind: "formula", formula: text });
  const abs = (column: number, row: number) => `$${columnLetters(column)}$${row}`;
  const columnRange = (column: number) => `${abs(column, firstRow)}:${abs(column, lastRow)}`;
  const labels = columnRange(0);

  headLines.forEach((line, i) => put(i + 1, 0, line, i === 0 ? "title" : i <= options.stamp.length ? "stamp" : line.startsWith("Caution:") ? "caution" : undefined));

  // The case table as given, one result per row, cases across in the factor table's columns.
  put(caseHeaderRow - 1, 0, "Case table: the analysis results of each load case, as given", "heading");
  put(caseHeaderRow, 0, table.orientation === "rows" ? "component" : "result", "header");
  plan.cases.forEach((c, k) => put(caseHeaderRow, firstFactorColumn + k, c.header, "header"));
  table.components.forEach((name, c) => {
    const row = caseHeaderRow + 1 + c;
    put(row, 0, name);
    for (let k = 0; k < K; k++) put(row, firstFactorColumn + k, table.values[c][k]);
  });

  // Envelope: per result the largest and smallest factored value and the first row giving each.
  put(envelopeHeaderRow - 1, 0, "Envelope: per result, the largest and smallest factored value over every combination row", "heading");
  ["result", "max", "row giving max", "min", "row giving min"].forEach((t, i) => put(envelopeHeaderRow, i, t, "header"));
  table.components.forEach((name, c) => {
    const row = envelopeHeaderRow + 1 + c;
    const values = columnRange(firstValueColumn + c);
    put(row, 0, name);
    formula(row, 1, `MAX(${values})`);
    formula(row, 2, `INDEX(${labels},MATCH(${abs(1, row)},${values},0))`);
    formula(row, 3, `MIN(${values})`);
    formula(row, 4, `INDEX(${labels},MATCH(${abs(3, row)},${values},0))`);
  });

  // Governing rows: each criterion's row, with the concurrent value of every result in it.
  if (governingHeaderRow !== null) {
    put(governingHeaderRow - 1, 0, "Governing rows: the row each criterion selects, with every concurrent value", "heading");
    ["criterion", "value", "combination row"].forEach((t, i) => put(governingHeaderRow, i, t, "header"));
    table.components.forEach((name, c) => put(governingHeaderRow, firstFactorColumn + c, name, "header"));
    criteria.forEach((criterion, g) => {
      const row = governingHeaderRow + 1 + g;
      const values = columnRange(firstCriterionColumn + g);
      const match = `MATCH(${abs(1, row)},${values},0)`;
      put(row, 0, criterion.text);
      formula(row, 1, `${criterion.sense === "max" ? "MAX" : "MIN"}(${values})`);
      formula(row, 2, `INDEX(${labels},${match})`);
      for (let c = 0; c < C; c++) formula(row, firstFactorColumn + c, `INDEX(${columnRange(firstValueColumn + c)},${match})`);
    });
  }

  // The factor table, each row's factored values and its criterion values.
  put(factorHeaderRow - 1, 0, "Combination rows: the factor on every case, and each result's factored value", "heading");
  ["combination row", "combination", "clause"].forEach((t, i) => put(factorHeaderRow, i, t, "header"));
  plan.cases.forEach((c, k) => put(factorHeaderRow, firstFactorColumn + k, c.header, "header"));
  table.components.forEach((name, c) => put(factorHeaderRow, firstValueColumn + c, name, "header"));
  criteria.forEach((criterion, g) => put(factorHeaderRow, firstCriterionColumn + g, criterion.text, "header"));
  const factorsFrom = columnLetters(firstFactorColumn);
  const factorsTo = columnLetters(firstFactorColumn + K - 1);
  rows.forEach((r, i) => {
    const row = firstRow + i;
    put(row, 0, r.label);
    put(row, 1, r.combination);
    put(row, 2, r.clause);
    for (let k = 0; k < K; k++) put(row, firstFactorColumn + k, r.factors[k]);
    for (let c = 0; c < C; c++) {
      const caseRow = caseHeaderRow + 1 + c;
      formula(row, firstValueColumn + c, `SUMPRODUCT($${factorsFrom}${row}:$${factorsTo}${row},$${factorsFrom}$${caseRow}:$${factorsTo}$${caseRow})`);
    }
    criteria.forEach((criterion, g) => formula(row, firstCriterionColumn + g, criterionFormula(criterion.expr, (c) => `${columnLetters(firstValueColumn + c)}${row}`)));
  });

  const layout = { caseHeaderRow, envelopeHeaderRow, governingHeaderRow, factorHeaderRow, firstFactorColumn, firstValueColumn, firstCriterionColumn, rowCount: rows.length };
  return { ok: true, value: { name: options.name ?? "Reviewer copy", cells, rowCount: lastRow, columnCount, layout } };
}

function refused(kind: Problem["kind"], message: string): Result<never> {
  return { ok: false, problems: [{ kind, message, place: {} }] };
}

/**
 * A criterion written as a spreadsheet formula over one row's value cells.
 * Every operation is bracketed: a spreadsheet reads -2^2 as 4, the criterion as -4.
 */
export function criterionFormula(e: Criterion["expr"], cell: (component: number) => string): string {
  const write = (a: Arith): string => {
    switch (a.kind) {
      case "number":
        return numberLiteral(a.value);
      case "name": {
        const index = e.components.get(a.name);
        if (index === undefined) throw new Error(`criterion name "${a.name}" is not a component`);
        return cell(index);
      }
      case "negate":
        return `(-${write(a.operand)})`;
      case "binary":
        return `(${write(a.left)}${a.op}${write(a.right)})`;
      case "call":
        return `${a.fn.toUpperCase()}(${a.args.map(write).join(",")})`;
      case "choice":
        throw new Error("a criterion has no choices");
    }
  };
  return write(e.tree);
}

/** A number as a formula literal: plain decimals, never exponent notation. */
function numberLiteral(value: number): string {
  const text = String(value);
  if (!/e/i.test(text)) return text;
  return value.toFixed(20).replace(/\.?0+$/, "");
}
