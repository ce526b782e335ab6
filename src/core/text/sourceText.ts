/**
 * Where a ruleset comes from, in words: shipped, stored (and whether a stored
 * copy of a shipped id is the same content), or typed in cells. A cell wants
 * the qualification in brackets; a line of the pane leads with it in capitals
 * where it is a warning.
 */

export type RulesetOrigin =
  | { kind: "shipped" }
  | { kind: "cells" }
  /** `where`: "this workbook", "this browser"; `shipped`: how it compares with a shipped ruleset of the same id. */
  | { kind: "stored"; where: string; shipped: "none" | "same" | "differs" };

/** How a stored copy compares with a shipped ruleset of the same id, from the two fingerprints. */
export function shippedTwin(shippedFingerprint: string | null, fingerprint: string | null): "none" | "same" | "differs" {
  if (shippedFingerprint === null) return "none";
  return shippedFingerprint === fingerprint ? "same" : "differs";
}

export function sourceText(origin: RulesetOrigin, form: "cell" | "line"): string {
  switch (origin.kind) {
    case "shipped":
      return "shipped with Loadwright";
    case "cells":
      return "typed in cells";
    case "stored": {
      const stored = `stored in ${origin.where}`;
      switch (origin.shipped) {
        case "none":
          return stored;
        case "same":
          return form === "cell" ? `${stored} (a copy of the shipped ruleset, same content)` : `${stored}: a copy of the shipped ruleset, same content`;
        case "differs":
          return form === "cell" ? `${stored} (differs from the shipped ruleset of the same id)` : `${stored}: DIFFERS from the shipped ruleset of the same id`;
      }
    }
  }
}
