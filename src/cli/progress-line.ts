// The progress line of a long command: one line on stderr, redrawn in place
// with the terminal's own line control (carriage return, then CSI K "erase in
// line" after the text), so nothing but text and those two controls is
// written. No colours, no cursor movement between lines: a terminal that can
// return the carriage and erase a line shows it right. job.ts decides whether
// a line is drawn at all (stderr a terminal, TERM not "dumb", output not data).

/** Where the line goes: a terminal stream (process.stderr). */
export interface LineStream {
  write(text: string): unknown;
  /** Width of the terminal in characters; the line is cut to fit (a wrapped line cannot be redrawn). */
  readonly columns?: number | undefined;
}

/** No line before the job has run this long, ms: a quick job shows none. */
export const SHOW_AFTER_MS = 1000;
/** Least time between two redraws, ms. */
export const REDRAW_MS = 200;
/** The estimate of the rest needs this much time between the first report and now, ms. */
const ESTIMATE_AFTER_MS = 500;

/** Carriage return; CSI K (erase from the cursor to the end of the line). */
const CR = "\r";
const ERASE_TO_END = "\x1b[K";

/** "7 s", "2 min 05 s", "1 h 03 min": whole seconds, rounded down. */
export function durationText(ms: number): string {
  const s = Math.max(0, Math.floor(ms / 1000));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, "0")} s`;
  return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, "0")} min`;
}

/**
 * The line's text: "tolerance  37 %  12 s elapsed, about 20 s left"; without
 * a fraction yet "tolerance  3 s elapsed". The percentage is rounded down, so
 * 100 % shows only once the work is done; `restMs` is left out when unknown.
 */
export function progressText(label: string, fraction: number | undefined, elapsedMs: number, restMs?: number): string {
  const parts = [label];
  if (fraction !== undefined) parts.push(`${Math.floor(Math.min(1, Math.max(0, fraction)) * 100)} %`);
  parts.push(`${durationText(elapsedMs)} elapsed${restMs !== undefined ? `, about ${durationText(restMs + 999)} left` : ""}`);
  return parts.join("  ");
}

/** One long command's progress line. */
export class ProgressLine {
  private readonly start: number;
  private fraction: number | undefined;
  /** The first report (time, fraction): the estimate leaves out the time before it (thread start, reading input). */
  private first: { t: number; f: number } | undefined;
  private lastDraw = -Infinity;
  private lastText = "";
  private shown = false;
  private ended = false;

  constructor(
    private readonly label: string,
    private readonly stream: LineStream,
    private readonly clock: () => number = () => performance.now(),
  ) {
    this.start = clock();
  }

  /** Records the job's fraction done (drawn at the next draw()). */
  report(fraction: number): void {
    if (!(fraction >= 0 && fraction <= 1)) return;
    const t = this.clock();
    if (this.first === undefined) this.first = { t, f: fraction };
    this.fraction = this.fraction === undefined ? fraction : Math.max(this.fraction, fraction);
  }

  /** Redraws the line, once the job has run SHOW_AFTER_MS, at most every REDRAW_MS and only when its text changed. */
  draw(): void {
    if (this.ended) return;
    const t = this.clock();
    if (t - this.start < SHOW_AFTER_MS || t - this.lastDraw < REDRAW_MS) return;
    const width = this.stream.columns;
    let text = progressText(this.label, this.fraction, t - this.start, this.rest(t));
    // One column short of the width: writing the last column wraps on some terminals.
    if (width !== undefined && width > 1 && text.length > width - 1) text = text.slice(0, width - 1);
    if (this.shown && text === this.lastText) return;
    this.lastDraw = t;
    this.lastText = text;
    this.stream.write(`${CR}${text}${ERASE_TO_END}`);
    this.shown = true;
  }

  /** Erases the line (if one was drawn) and draws no more: before the result, an error or the cancel message. */
  end(): void {
    if (this.shown) this.stream.write(`${CR}${ERASE_TO_END}`);
    this.shown = false;
    this.ended = true;
  }

  /** Time left at the rate seen since the first report, ms; undefined before there is a rate. */
  private rest(t: number): number | undefined {
    const f = this.fraction;
    const first = this.first;
    if (f === undefined || first === undefined || f >= 1 || f <= first.f || t - first.t < ESTIMATE_AFTER_MS) return undefined;
    return ((1 - f) * (t - first.t)) / (f - first.f);
  }
}
