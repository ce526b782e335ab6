/**
 * A ruleset's fingerprint: SHA-256 of its canonical JSON (RFC 8785 JSON
 * Canonicalization Scheme) without the approval block, so that filling in an
 * approval does not change what was approved, while any other edit does.
 */
import { sha256 } from "@noble/hashes/sha2.js";
import { bytesToHex, utf8ToBytes } from "@noble/hashes/utils.js";
import canonicalize from "canonicalize";
import type { RulesetFile } from "./schema.js";

export function fingerprintOf(file: RulesetFile): string {
  const { approval: _approval, ...content } = file;
  const canonical = canonicalize(content);
  if (canonical === undefined) throw new Error("ruleset content cannot be canonicalized");
  return bytesToHex(sha256(utf8ToBytes(canonical)));
}

/** The first 12 hex digits: enough to tell rulesets apart on a printed calculation. */
export function shortFingerprint(fingerprint: string): string {
  return fingerprint.slice(0, 12);
}
