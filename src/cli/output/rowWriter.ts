/**
 * Rows of cells written as an aligned text table, a Markdown table or CSV,
 * one row at a time. The text table sets its column widths from the first
 * rows and keeps them, so a long streamed output is written as it comes.
 */
import { csvLine, mdCell } from "./cells.js";
import type { Format } from "./format.js";
import type { Sink } from "./sink.js";

export type Align = "left" | "right";

export interface Column {
  title: string;
  align?: Align;
}

export interface RowWriter {
  row(cells: string[]): Promise<void>;
  end(): Promise<void>;
}

/** Rows used to set the text table's widths before anything is written. */
const WIDTH_SAMPLE = 500;

export function rowWriter(format: Exclude<Format, "json">, sink: Sink, columns: Column[]): RowWriter {
  switch (format) {
    case "csv":
      sink.line(csvLine(columns.map((c) => c.title)));
      return {
        row: async (cells) => {
          sink.line(csvLine(cells));
          await sink.maybeFlush();
        },
        end: () => sink.flush(),
      };
    case "md":
      sink.line(`| ${columns.map((c) => mdCell(c.title)).join(" | ")} |`);
      sink.line(`|${columns.map((c) => (c.align === "right" ? "---:" : ":---")).join("|")}|`);
      return {
        row: async (cells) => {
          sink.line(`| ${cells.map(mdCell).join(" | ")} |`);
          await sink.maybeFlush();
        },
        end: () => sink.flush(),
      };
    case "table":
      return new TextTable(sink, columns);
  }
}

class TextTable implements RowWriter {
  private sample: string[][] = [];
  private widths: number[] | null = null;

  constructor(
    private readonly sink: Sink,
    private readonly columns: Column[],
  ) {}

  async row(cells: string[]): Promise<void> {
    if (this.widths) {
      this.sink.line(this.render(cells));
      await this.sink.maybeFlush();
      return;
    }
    this.sample.push(cells);
    if (this.sample.length >= WIDTH_SAMPLE) this.start();
  }

  async end(): Promise<void> {
    if (!this.widths) this.start();
    await this.sink.flush();
  }

  private start(): void {
    const widths = this.columns.map((c) => c.title.length);
    for (const cells of this.sample) cells.forEach((cell, i) => (widths[i] = Math.max(widths[i] ?? 0, cell.length)));
    this.widths = widths;
    this.sink.line(this.render(this.columns.map((c) => c.title)));
    this.sink.line(this.render(widths.map((w) => "-".repeat(w))));
    for (const cells of this.sample) this.sink.line(this.render(cells));
    this.sample = [];
  }

  private render(cells: string[]): string {
    const widths = this.widths as number[];
    return cells
      .map((cell, i) => (this.columns[i]?.align === "right" ? cell.padStart(widths[i] ?? 0) : cell.padEnd(widths[i] ?? 0)))
      .join("  ")
      .trimEnd();
  }
}
