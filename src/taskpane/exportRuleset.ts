/**
 * Export: the ruleset file exactly as stored (or shipped), pretty-printed, as a
 * .json download named after its id. Where a host blocks downloads, the same
 * text can be shown to copy.
 */
import type { RulesetFile } from "../core/index.js";
import { button } from "./dom.js";
import { rulesetText } from "./openDraft.js";
import type { PaneContext } from "./paneContext.js";

export function exportFileName(file: RulesetFile): string {
  return `${file.id}.json`;
}

export function downloadRuleset(doc: Document, file: RulesetFile): void {
  const view = doc.defaultView;
  if (!view) return;
  const blob = new view.Blob([rulesetText(file)], { type: "application/json" });
  const url = view.URL.createObjectURL(blob);
  const a = doc.createElement("a");
  a.href = url;
  a.download = exportFileName(file);
  a.hidden = true;
  doc.body.append(a);
  a.click();
  a.remove();
  view.setTimeout(() => view.URL.revokeObjectURL(url), 10_000);
}

export function exportButtons(ctx: PaneContext, file: RulesetFile): HTMLElement[] {
  return [
    button(ctx.doc, `Export ${exportFileName(file)}`, () => {
      downloadRuleset(ctx.doc, file);
      ctx.notice(`Exported ${exportFileName(file)} (a download). If nothing was saved, use Import / export › Show the JSON and copy it.`, "done");
    }),
  ];
}
