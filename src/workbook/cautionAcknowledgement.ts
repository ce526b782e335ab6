/**
 * Whether the cautions were acknowledged for this workbook. The task pane shows
 * them in full on first use until someone says they have read them, and the
 * acknowledgement is kept with the workbook: its document settings inside
 * Excel (it travels with the file), the browser's storage outside it. What is
 * kept is the text acknowledged and the date, so a checker can read what was
 * acknowledged, and new wording of the cautions is shown in full again.
 */
import { fullCautions, problem, type Result } from "../core/index.js";
import type { SettingsBackend } from "./settingsBackend.js";

/** The settings key, beside the stored rulesets' own. */
export const CAUTIONS_KEY = "loadwright.cautions";
export const ACKNOWLEDGEMENT_FORMAT = "loadwright-cautions/1";

export interface AcknowledgementValue {
  format: typeof ACKNOWLEDGEMENT_FORMAT;
  /** The cautions as they read when acknowledged, in full. */
  cautions: string[];
  /** The local date of the acknowledgement, YYYY-MM-DD. */
  date: string;
}

export class CautionAcknowledgement {
  constructor(
    readonly backend: SettingsBackend,
    private readonly cautions: readonly string[] = fullCautions(),
  ) {}

  /** The acknowledgement of the cautions as they read now, or null: none, another wording, or a value that cannot be read. */
  current(): AcknowledgementValue | null {
    if (!this.backend.available()) return null;
    const text = this.backend.read(CAUTIONS_KEY);
    if (text === null) return null;
    let value: unknown;
    try {
      value = JSON.parse(text);
    } catch {
      return null;
    }
    if (!isAcknowledgement(value)) return null;
    const same = value.cautions.length === this.cautions.length && value.cautions.every((c, i) => c === this.cautions[i]);
    return same ? value : null;
  }

  /** Records that the cautions were read on `date`; where the workbook (or browser) refuses, says so and records nothing. */
  async acknowledge(date: string): Promise<Result<AcknowledgementValue>> {
    const value: AcknowledgementValue = { format: ACKNOWLEDGEMENT_FORMAT, cautions: [...this.cautions], date };
    try {
      await this.backend.write(CAUTIONS_KEY, JSON.stringify(value));
      return { ok: true, value };
    } catch (e) {
      const reason = e instanceof Error ? e.message : String(e);
      return { ok: false, problems: [problem("settings-write", `the acknowledgement of the cautions was not saved to ${this.backend.where}: ${reason}; they will be shown in full again next time`)] };
    }
  }
}

function isAcknowledgement(value: unknown): value is AcknowledgementValue {
  if (typeof value !== "object" || value === null) return false;
  const v = value as Partial<Record<keyof AcknowledgementValue, unknown>>;
  return v.format === ACKNOWLEDGEMENT_FORMAT && typeof v.date === "string" && Array.isArray(v.cautions) && v.cautions.every((c) => typeof c === "string");
}
