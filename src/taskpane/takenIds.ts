/** Ids a new copy may not take: every shipped and stored ruleset's, and every open draft's. */
import { shippedRulesets } from "../core/index.js";
import { topField } from "./dataPath.js";
import type { PaneContext } from "./paneContext.js";

export function takenIds(ctx: PaneContext): Set<string> {
  const ids = new Set<string>(shippedRulesets().map((s) => s.id));
  for (const e of ctx.library().entries) ids.add(e.id);
  for (const d of ctx.drafts.list()) {
    // A draft that is not JSON yet claims no id.
    const id = topField(d.text, "id");
    if (typeof id === "string") ids.add(id);
  }
  return ids;
}
