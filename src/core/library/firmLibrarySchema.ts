/**
 * The firm library format (`loadwright-library/1`), as a zod schema: one file
 * holding the rulesets a firm has approved, so that many workbooks can be held
 * to one list. Strict like the ruleset format: a field we do not know is an
 * error. Each entry of `rulesets` is a whole ruleset file with its approval;
 * it is checked by the ruleset loader, not here, so that its problems carry
 * the same paths and words as a ruleset file's own.
 */
import { z } from "zod";

export const FIRM_LIBRARY_FORMAT = "loadwright-library/1";

/**
 * The most characters a library file may hold. A library of a hundred rulesets
 * is about 2 MB; the limit keeps a wrong file (an export, a binary) from being
 * parsed whole.
 */
export const MAX_FIRM_LIBRARY_CHARACTERS = 5_000_000;

const text = z.string().trim().min(1, "must not be empty");

/** A day of the calendar written YYYY-MM-DD (2026-02-30 is refused). */
export const calendarDay = z.iso.date("must be a date written YYYY-MM-DD (a day of the calendar)");

export const firmLibrarySchema = z.strictObject({
  format: z.literal(FIRM_LIBRARY_FORMAT),
  /** What the library is, as the firm names it. */
  title: text,
  /** Who publishes it and answers for it: a person or an office of the firm. */
  owner: text,
  /** The day this edition of the library was published. */
  date: calendarDay,
  notes: z.array(z.string()).optional(),
  /** Ruleset files (`loadwright-ruleset/1`), each approved; older approved versions of an id may stay listed. */
  rulesets: z.array(z.unknown()).min(1, "must list at least one approved ruleset"),
});

export type FirmLibraryFile = z.infer<typeof firmLibrarySchema>;
