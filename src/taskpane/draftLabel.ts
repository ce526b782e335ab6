/** How a draft is named in lists and headings: its id as typed so far, and what it was opened from. */
import { shortFingerprint } from "../core/index.js";
import { parseJson, topField } from "./dataPath.js";
import type { Draft } from "./draftStore.js";

export function draftId(d: Draft): string {
  if (!parseJson(d.text).ok) return "(not JSON yet)";
  const id = topField(d.text, "id");
  return typeof id === "string" && id !== "" ? id : "(no id)";
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

