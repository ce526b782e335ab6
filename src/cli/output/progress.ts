/**
 * A progress bar on standard error for long streamed runs, only when standard
 * error is a terminal; silent otherwise (pipes, files, CI logs). It appears
 * only once a run has lasted a moment, so short runs print nothing extra.
 */
import { SingleBar } from "cli-progress";

const SHOW_AFTER_MS = 700;

export interface Progress {
  update(done: number): void;
  stop(): void;
}

export function progressBar(total: number, label: string, stream: NodeJS.WriteStream = process.stderr): Progress {
  if (!stream.isTTY || total <= 0) return { update: () => {}, stop: () => {} };
  const started = Date.now();
  let bar: SingleBar | null = null;
  return {
    update(done) {
      if (!bar) {
        if (Date.now() - started < SHOW_AFTER_MS) return;
        bar = new SingleBar({
          stream,
          format: `${label} [{bar}] {percentage}% | {value}/{total} MB | {duration_formatted}`,
          hideCursor: true,
          clearOnComplete: true,
          barsize: 30,
        });
        bar.start(mb(total), mb(done));
      }
      bar.update(mb(done));
    },
    stop() {
      bar?.stop();
    },
  };
}

function mb(bytes: number): number {
  return Math.round(bytes / 1e5) / 10;
}
