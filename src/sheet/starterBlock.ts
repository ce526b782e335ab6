/**
 * The starter formulas for one case table, as a list of cells with A1
 * addresses (host-neutral, like the reviewer's copy): the inputs a checker
 * edits — the ruleset id, a parameter block with the ruleset's parameters and
 * their defaults, a criteria block — and the formulas over them, each naming
 * those cells and the case table, never a typed value:
 *
 *   A                      B         C   D … (LW.RULESET)   (LW.ENVELOPE)   (LW.GOVERNING)   (LW.COMBOS)
 *   title                            label              label          label            label
 *   ruleset                asce7-…       =LW.RULESET(…)     =LW.ENVELOPE(…) =LW.GOVERNING(…) =LW.COMBOS(…)
 *   parameter              value         ↓ spills           ↓ spills        ↓ spills         ↓ spills
 *   SDS                    1
 *   (a blank row for one more)
 *   criteria
 *   max P …
 *
 * Each result spills down a band of columns of its own, as wide as the core
 * says it will be, with an empty column between bands, so that a result
 * growing longer (a ruleset changed, notes added) never runs into another.
 * The block's rows are the longest spill's; a writer checks the whole block
 * is empty (or confirmed) before writing.
 */
import { problem, type Result, type ResultSize, type ResultSizes } from "../core/index.js";
import type { SheetCell, SheetStyle } from "./reviewerSheet.js";
import { areaAddress, areaName, areaReference, cellAddress, onGrid, type SheetArea } from "./sheetArea.js";

export interface StarterParameter {
  name: string;
  /** The value written (given, else the default); null where there is neither, and the row is left out. */
  value: number | string | null;
}

export interface StarterBlockInput {
  /** The top-left cell of the block. */
  anchor: { sheet: string; top: number; left: number };
  /** The case table: its area, and the name it was given by, which the formulas then use. */
  cases: { area: SheetArea; name: string | null };
  rulesetId: string;
  parameters: readonly StarterParameter[];
  /** Criteria as text ("max P", "max |M|"); at least one. */
  criteria: readonly string[];
  sizes: ResultSizes;
}

export type StarterFormulaName = "LW.RULESET" | "LW.ENVELOPE" | "LW.GOVERNING" | "LW.COMBOS";

export interface StarterFormula {
  name: StarterFormulaName;
  /** The cell holding the formula, e.g. "E2". */
  address: string;
  /** As typed after "=". */
  formula: string;
  /** Where its result spills (the formula's own cell first). */
  spill: SheetArea;
}

export interface StarterBlock {
  /** Everything the block covers, spills included: what must be empty, or confirmed, before writing. */
  area: SheetArea;
  cells: SheetCell[];
  rulesetCell: string;
  params: SheetArea;
  criteria: SheetArea;
  formulas: StarterFormula[];
  /** Parameters with no default and no value given: not written; the blank row of the block takes them. */
  notGiven: string[];
}

const TITLE_ROW = 0;
const RULESET_ROW = 1;
const PARAMS_HEADER_ROW = 3;
/** Inputs take two columns, then one empty column before the first result. */
const INPUT_COLUMNS = 2;

const LABELS: Record<StarterFormulaName, string> = {
  "LW.RULESET": "Ruleset stamp (LW.RULESET)",
  "LW.ENVELOPE": "Envelope (LW.ENVELOPE)",
  "LW.GOVERNING": "Governing rows (LW.GOVERNING)",
  "LW.COMBOS": "Combination rows (LW.COMBOS)",
};

export function starterBlock(input: StarterBlockInput): Result<StarterBlock> {
  const { anchor } = input;
  if (input.criteria.length === 0) throw new Error("starterBlock needs at least one criterion (the default criteria, where none are typed)");
  const written = input.parameters.filter((p) => p.value !== null);
  const notGiven = input.parameters.filter((p) => p.value === null).map((p) => p.name);
  const cells: SheetCell[] = [];
  const at = (row: number, column: number) => ({ row: anchor.top + row, column: anchor.left + column });
  const put = (row: number, column: number, value: string | number, style?: SheetStyle) => {
    const p = at(row, column);
    const base = { address: cellAddress(p.row, p.column), row: p.row + 1, column: p.column, ...(style ? { style } : {}) };
    cells.push(typeof value === "number" ? { ...base, kind: "number", value } : { ...base, kind: "text", value });
  };
  const region = (row: number, column: number, rows: number, columns: number): SheetArea => {
    const p = at(row, column);
    return { sheet: anchor.sheet, top: p.row, left: p.column, rows, columns };
  };

  // Inputs, down the first two columns.
  const casesName = input.cases.name ?? areaName(input.cases.area);
  put(TITLE_ROW, 0, `Loadwright formulas over ${casesName}: change the ruleset id, parameters and criteria in these cells, not the formulas.`, "title");
  put(RULESET_ROW, 0, "ruleset", "header");
  put(RULESET_ROW, 1, input.rulesetId);
  put(PARAMS_HEADER_ROW, 0, "parameter", "header");
  put(PARAMS_HEADER_ROW, 1, "value", "header");
  const firstParam = PARAMS_HEADER_ROW + 1;
  written.forEach((p, i) => {
    put(firstParam + i, 0, p.name);
    put(firstParam + i, 1, p.value as number | string);
  });
  // One blank row more inside the range, so that a parameter can be added without editing a formula.
  const params = region(firstParam, 0, written.length + 1, 2);
  const hintRow = firstParam + written.length + 1;
  put(
    hintRow,
    0,
    notGiven.length > 0
      ? `No default and not given: ${notGiven.join(", ")}. Where a combination reads one, type its name and value in the blank row above.`
      : "The blank row above takes one more parameter: its name, then its value.",
  );
  const criteriaHeader = hintRow + 2;
  put(criteriaHeader, 0, "criteria", "header");
  input.criteria.forEach((c, i) => put(criteriaHeader + 1 + i, 0, c));
  const criteria = region(criteriaHeader + 1, 0, input.criteria.length, 1);
  const inputRows = criteriaHeader + 1 + input.criteria.length;

  // The formulas, each in a band of its own to the right.
  const from = anchor.sheet;
  const casesRef = input.cases.name ?? areaReference(input.cases.area, from);
  const id = cellAddress(anchor.top + RULESET_ROW, anchor.left + 1, true);
  const paramsRef = areaAddress(params, true);
  const criteriaRef = areaAddress(criteria, true);
  const bands: { name: StarterFormulaName; formula: string; size: ResultSize }[] = [
    { name: "LW.RULESET", formula: `LW.RULESET(${id})`, size: input.sizes.ruleset },
    { name: "LW.ENVELOPE", formula: `LW.ENVELOPE(${casesRef},${id},${paramsRef})`, size: input.sizes.envelope },
    { name: "LW.GOVERNING", formula: `LW.GOVERNING(${casesRef},${id},${criteriaRef},${paramsRef})`, size: input.sizes.governing },
    { name: "LW.COMBOS", formula: `LW.COMBOS(${id},${paramsRef},${casesRef})`, size: input.sizes.combos },
  ];
  const formulas: StarterFormula[] = [];
  let column = INPUT_COLUMNS + 1;
  for (const band of bands) {
    put(TITLE_ROW, column, LABELS[band.name], "heading");
    const spill = region(RULESET_ROW, column, band.size.rows, band.size.columns);
    const p = at(RULESET_ROW, column);
    const address = cellAddress(p.row, p.column);
    cells.push({ address, row: p.row + 1, column: p.column, kind: "formula", formula: band.formula });
    formulas.push({ name: band.name, address, formula: band.formula, spill });
    column += band.size.columns + 1;
  }
  const rows = Math.max(inputRows, ...formulas.map((f) => RULESET_ROW + f.spill.rows));
  const whole = region(0, 0, rows, column - 1);
  if (!onGrid(whole)) {
    const message = `the formulas need ${rows.toLocaleString("en-US")} rows and ${(column - 1).toLocaleString("en-US")} columns from ${cellAddress(anchor.top, anchor.left)}, beyond the worksheet's last row or column; choose a cell further up or to the left`;
    return { ok: false, problems: [problem("sheet-range", message)] };
  }
  cells.sort((a, b) => a.row - b.row || a.column - b.column);
  return { ok: true, value: { area: whole, cells, rulesetCell: cellAddress(anchor.top + RULESET_ROW, anchor.left + 1), params, criteria, formulas, notGiven } };
}
