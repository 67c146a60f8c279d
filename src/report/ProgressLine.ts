/** When a progress line first shows and how often it changes, declared once. */
export const PROGRESS_DEFAULTS = {
  /** a run shorter than this shows no progress at all [s] */
  firstAfterS: 1,
  /** least time between two updates [s] */
  everyS: 0.25,
} as const;

/**
 * A one-line progress report for long runs on an interactive terminal: it stays silent for the
 * first second (short runs print nothing), then rewrites one line at most four times a second,
 * and `done()` erases it so the report that follows starts on a clean line; `finish(text)` does
 * the same and, when the run lasted at least the first second, leaves a closing line (how long
 * it took) in its place. Clock and writer are injected so the throttling can be tested without
 * waiting.
 * Cost O(1) per update.
 */
export class ProgressLine {
  private readonly write: (text: string) => void;
  private readonly now: () => number;
  private readonly startS: number;
  private lastS = Number.NEGATIVE_INFINITY;
  private shown = false;

  /**
   * @param write writes raw text to the terminal (stderr); nothing else is written between updates
   * @param now a clock in seconds (default: the process's monotonic clock)
   */
  constructor(write: (text: string) => void, now: () => number = () => performance.now() / 1000) {
    this.write = write;
    this.now = now;
    this.startS = now();
  }

  /** Offer a new line of text; it is shown only when due (see the class comment). */
  update(text: () => string): void {
    const t = this.now();
    if (t - this.startS < PROGRESS_DEFAULTS.firstAfterS || t - this.lastS < PROGRESS_DEFAULTS.everyS) return;
    this.lastS = t;
    this.shown = true;
    // carriage return, the text, then erase to the end of the line (ECMA-48 EL, CSI K)
    this.write(`\r${text()}\u001b[K`);
  }

  /** Seconds since the line was made. */
  elapsedS(): number {
    return this.now() - this.startS;
  }

  /** Erase the line if anything was shown. */
  done(): void {
    if (this.shown) this.write("\r\u001b[K");
    this.shown = false;
  }

  /**
   * Erase the line, and when the run lasted at least PROGRESS_DEFAULTS.firstAfterS (whether or not
   * an update was due), write the closing line `text(elapsed seconds)` and a newline.
   */
  finish(text: (elapsedS: number) => string): void {
    const elapsedS = this.elapsedS();
    if (elapsedS < PROGRESS_DEFAULTS.firstAfterS) {
      this.done();
      return;
    }
    this.write(`\r${text(elapsedS)}\u001b[K\n`);
    this.shown = false;
  }
}
