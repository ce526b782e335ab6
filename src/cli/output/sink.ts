/**
 * Buffered writing to a stream that respects back-pressure, so a streamed
 * envelope of a million rows is written as it is computed without piling up
 * in memory. A closed pipe (`loadwright … | head`) ends the output quietly.
 */
import type { Writable } from "node:stream";

const CHUNK = 64 * 1024;

export class Sink {
  private buffer = "";
  private closed = false;

  constructor(private readonly stream: Writable) {
    // EPIPE: the reader went away. Any other write error also ends the output; the exit status is unaffected.
    stream.on("error", () => {
      this.closed = true;
    });
  }

  /** True once the reader has gone away; producers may stop early. */
  get isClosed(): boolean {
    return this.closed;
  }

  line(text: string): void {
    this.buffer += text + "\n";
  }

  /** Write out the buffer when it is large; await this in loops that produce many lines. */
  async maybeFlush(): Promise<void> {
    if (this.buffer.length >= CHUNK) await this.flush();
  }

  async flush(): Promise<void> {
    if (this.buffer === "" || this.closed) {
      this.buffer = "";
      return;
    }
    const text = this.buffer;
    this.buffer = "";
    if (!this.stream.write(text)) {
      await new Promise<void>((resolve) => {
        const done = () => {
          this.stream.off("drain", done);
          this.stream.off("close", done);
          this.stream.off("error", done);
          resolve();
        };
        this.stream.on("drain", done);
        this.stream.on("close", done);
        this.stream.on("error", done);
      });
    }
  }
}
