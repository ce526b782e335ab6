/**
 * A value the engine would give that is not a finite number: a factored sum
 * past the largest double (about ±1.8 × 10^308), or +∞ and −∞ meeting in one
 * row. It is refused with what it belongs to (a component, a result row, a
 * criterion) and the concrete row, never shown or skipped.
 */
import { problem, type Place, type Problem } from "../problems.js";

/** Where a component was read, for the problem's place (its header cell in the case table), if known. */
export type ComponentPlace = { row: number; column: number } | undefined;

/** `what`: "C1 top" (quoted), or criterion "max V"; `rowLabel`: the concrete row's label. The message names both. */
export function notFiniteProblem(what: string, rowLabel: string, place: ComponentPlace = undefined): Problem {
  const at: Place = place ? { row: place.row, column: place.column } : {};
  return problem(
    "result-not-finite",
    `${what} has no finite value in row "${rowLabel}": the factored sum passes the largest number Loadwright can hold (about ±1.8 × 10^308); check the case values`,
    at,
  );
}
