export type TraceCsvProblemCode =
  | "not-a-number"
  | "time-not-increasing"
  | "duplicate-time"
  | "negative-volume"
  | "missing-column"
  | "duplicate-column"
  | "unknown-unit"
  | "missing-bore-area"
  | "no-data"
  | "unreadable";

export interface TraceCsvProblem {
  /** 1-based line in the file; the header is line 1. */
  line: number;
  code: TraceCsvProblemCode;
  message: string;
}

/** Problems listed in a failed import; the rest are only counted. */
export const MAX_LISTED_PROBLEMS = 20;

/** Keeps the first problems found and counts all of them. */
export class TraceProblemList {
  private readonly kept: TraceCsvProblem[] = [];
  total = 0;

  /** Records a problem found on a line. */
  add(line: number, code: TraceCsvProblemCode, message: string): void {
    this.total++;
    if (this.kept.length < MAX_LISTED_PROBLEMS) this.kept.push({ line, code, message: `Line ${line}: ${message}` });
  }

  /** The first problems found, in file order. */
  listed(): TraceCsvProblem[] {
    return this.kept.slice();
  }
}
