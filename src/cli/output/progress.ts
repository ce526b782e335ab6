/**
 * A progress bar on standard error for long streamed runs, only when standard
 * error is a terminal; silent otherwise (pipes, files, CI logs). It appears
 * once a run has lasted a moment, or at once for a file of a few megabytes or
 * more (read fast enough, such a run may end before the moment has passed), so
 * runs on small files print nothing extra.
 */
import { SingleBar } from "cli-progress";

const SHOW_AFTER_MS = 700;
const SHOW_AT_ONCE_FROM_BYTES = 2e6;

export interface Progress {
  update(done: number): void;
  stop(): void;
}

export function progressBar(total: number, label: string, stream: NodeJS.WriteStream = process.stderr): Progress {
  if (!stream.isTTY || total <= 0) return { update: () => {}, stop: () => {} };
  const started = Date.now();
  const atOnce = total >= SHOW_AT_ONCE_FROM_BYTES;
  let bar: SingleBar | null = null;
  return {
    update(done) {
      if (!bar) {
        if (!atOnce && Date.now() - started < SHOW_AFTER_MS) return;
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
