/**
 * Row labels by row: a streamed envelope meets the same few governing rows on
 * millions of result rows, and writing a label out is the costliest part of
 * naming a row, so each row's label is made once.
 */
import { rowLabel, type Plan, type RowRef } from "../../core/index.js";

export function labelCache(plan: Plan): (row: RowRef) => string {
  const labels = new Map<string, string>();
  return (row) => {
    const key = `${row.combination}/${row.branch}/${row.choices.join(",")}`;
    let label = labels.get(key);
    if (label === undefined) {
      label = rowLabel(plan, row);
      if (labels.size < 100_000) labels.set(key, label);
    }
    return label;
  };
}
