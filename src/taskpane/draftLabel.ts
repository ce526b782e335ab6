/** How a draft is named in lists and headings: its id as typed so far, and what it was opened from. */
import { shortFingerprint } from "../core/index.js";
import type { Draft } from "./draftStore.js";

export function draftId(d: Draft): string {
  try {
    const id = (JSON.parse(d.text) as { id?: unknown } | null)?.id;
    return typeof id === "string" && id !== "" ? id : "(no id)";
  } catch {
    return "(not JSON yet)";
  }
}

export function baseText(d: Draft): string {
  const b = d.base;
  const print = b.fingerprint ? `, fingerprint ${shortFingerprint(b.fingerprint)}` : "";
  switch (b.kind) {
    case "shipped":
      return `copy of the shipped ${b.id}${print}`;
    case "stored":
      return draftId(d) === b.id ? `stored ${b.id}, being edited${print}` : `from the stored ${b.id}${print}`;
    case "imported":
      return "imported";
    case "new":
      return "new";
  }
}

