/**
 * How the job runner fails: a bad job file (exit 2) or a computation with no solution
 * (exit 3). Anything else that escapes is a bug in the runner (exit 1).
 *
 * @module cli
 */

/** The runner's exit codes. */
export const EXIT = {
  /** The job ran; the report was written (checks may still have failed: see the report). */
  OK: 0,
  /** An unexpected failure inside the runner (a bug: please report it). */
  INTERNAL: 1,
  /** The command line, the job file or the CSV file is not valid (not JSON, breaks the schema, a reading that cannot be read). */
  INVALID: 2,
  /** A computation has no solution (inconsistent readings, a degenerate figure, …). */
  UNSOLVABLE: 3,
  /** With `--fail-on-check`: the job ran and its report was written, but a check failed. */
  CHECK_FAILED: 4,
} as const;

/** Longest run of digits a message shows whole; longer ones (exact values of absurd inputs) are cut. */
const MAX_DIGITS_SHOWN = 40;

/** Cuts runs of more than {@link MAX_DIGITS_SHOWN} digits to their first digits and their count, so a message stays readable. */
export function shortenDigits(text: string): string {
  return text.replace(
    new RegExp(`\\d{${MAX_DIGITS_SHOWN + 1},}`, 'g'),
    (d) => `${d.slice(0, 12)}…(${d.length} digits)`,
  );
}

/** A job (or CSV, or command line) that cannot be read: exit 2. `path` names the place. */
export class JobInvalid extends Error {
  readonly exitCode = EXIT.INVALID;
  constructor(
    /** Where, as `tasks[2].readings[1].vertical` or `line 7, column "vertical"`. */
    readonly path: string,
    /** What is wrong with the value there. */
    readonly reason: string,
  ) {
    super(shortenDigits(path === '' ? reason : `${path}: ${reason}`));
    this.name = 'JobInvalid';
  }
}

/** A computation that has no solution: exit 3. `path` names the task. */
export class JobUnsolvable extends Error {
  readonly exitCode = EXIT.UNSOLVABLE;
  constructor(
    /** The task, as `tasks[3] (traverse "Reed Flat loop")`. */
    readonly path: string,
    /** Why there is no solution. */
    readonly reason: string,
  ) {
    super(shortenDigits(`${path}: no solution: ${reason}`));
    this.name = 'JobUnsolvable';
  }
}

/** Several problems at once (the schema check reports them all). */
export class JobInvalidMany extends JobInvalid {
  constructor(readonly problems: { path: string; message: string }[]) {
    super(problems[0]?.path ?? '', problems[0]?.message ?? 'invalid job');
    this.message = problems
      .map((p) => (p.path === '' ? p.message : `${p.path}: ${p.message}`))
      .join('\n');
  }
}
