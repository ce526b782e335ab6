/**
 * A ruleset's fingerprint computed apart from the engine: SHA-256 (Node's
 * crypto) of the RFC 8785 canonical JSON (the canonicalize reference library)
 * without the approval block, as docs/rulesets.md, "Rulesets" defines it.
 */
import { createHash } from "node:crypto";
import canonicalize from "canonicalize";

export function independentFingerprint(file: Record<string, unknown>): string {
  const { approval: _approval, ...content } = file;
  return createHash("sha256").update(canonicalize(content) ?? "", "utf8").digest("hex");
}
