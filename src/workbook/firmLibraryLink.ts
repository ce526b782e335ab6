/**
 * Which firm library a workbook follows: the HTTPS address it is published at
 * and the last time it was read (from that address or from a file), kept with
 * the workbook beside its stored rulesets — the workbook's document settings in
 * Excel, the browser's storage outside it — so that every engineer opening the
 * workbook follows the same library. Only what the user asked for is written:
 * a reading that succeeded. A kept value that cannot be read is reported, and
 * is replaced only by the next successful reading.
 */
import { z } from "zod";
import { problem, type Result } from "../core/index.js";
import { SettingsWriteError, type SettingsBackend } from "./settingsBackend.js";

export const FIRM_LIBRARY_LINK_KEY = "loadwright.firmLibrary";
export const FIRM_LIBRARY_LINK_FORMAT = "loadwright-library-link/1";

const lastReadSchema = z.strictObject({
  /** An HTTPS address, or a file the user chose (a pane cannot open a file again by itself). */
  from: z.enum(["address", "file"]),
  /** The address, or the file's name. */
  name: z.string().min(1),
  /** When it was read, as an ISO 8601 instant. */
  at: z.iso.datetime(),
  /** The library's own title and edition date, as read then. */
  title: z.string(),
  date: z.string(),
});

const linkSchema = z.strictObject({
  format: z.literal(FIRM_LIBRARY_LINK_FORMAT),
  /** The HTTPS address the pane checks on opening; null where the library was only ever opened from a file. */
  address: z.string().nullable(),
  lastRead: lastReadSchema.nullable(),
});

export type LastLibraryRead = z.infer<typeof lastReadSchema>;

export interface FirmLibraryLink {
  address: string | null;
  lastRead: LastLibraryRead | null;
}

export const NO_LINK: FirmLibraryLink = { address: null, lastRead: null };

export class FirmLibraryLinkStore {
  constructor(readonly backend: SettingsBackend) {}

  /** What the workbook keeps; no link at all where nothing was ever read. */
  read(): Result<FirmLibraryLink> {
    if (!this.backend.available()) return { ok: true, value: NO_LINK };
    const text = this.backend.read(FIRM_LIBRARY_LINK_KEY);
    if (text === null) return { ok: true, value: NO_LINK };
    let data: unknown;
    try {
      data = JSON.parse(text);
    } catch {
      return this.unreadable("is not readable JSON");
    }
    const parsed = linkSchema.safeParse(data);
    if (!parsed.success) return this.unreadable(`is not in the ${FIRM_LIBRARY_LINK_FORMAT} format`);
    return { ok: true, value: { address: parsed.data.address, lastRead: parsed.data.lastRead } };
  }

  /** Records a successful reading; an address reading also becomes the address checked on opening. */
  async recordReading(read: LastLibraryRead): Promise<Result<FirmLibraryLink>> {
    const kept = this.read();
    const address = read.from === "address" ? read.name : kept.ok ? kept.value.address : null;
    const link: FirmLibraryLink = { address, lastRead: read };
    const value: z.infer<typeof linkSchema> = { format: FIRM_LIBRARY_LINK_FORMAT, ...link };
    try {
      await this.backend.write(FIRM_LIBRARY_LINK_KEY, JSON.stringify(value));
      return { ok: true, value: link };
    } catch (e) {
      const reason = e instanceof Error ? e.message : String(e);
      // One value under one key: what is kept is the whole earlier value, or the whole new one unsaved (settingsBackend.ts).
      const held = e instanceof SettingsWriteError && e.holds === "new-unsaved" ? "; this session keeps the new address and reading, unsaved" : "; what was kept before is unchanged";
      return { ok: false, problems: [problem("library-link", `the firm library's address and reading time were not kept in ${this.backend.where}: ${reason}${held}`)] };
    }
  }

  private unreadable(what: string): Result<FirmLibraryLink> {
    return {
      ok: false,
      problems: [problem("library-link", `the firm library's address kept in ${this.backend.where} (setting "${FIRM_LIBRARY_LINK_KEY}") ${what}; it is left as it is until a library is read again`)],
    };
  }
}
