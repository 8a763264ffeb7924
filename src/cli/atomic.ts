/**
 * Atomic output files: everything is written to a temporary file beside the target and
 * renamed over it only when complete, so a failure never leaves a partial file.
 *
 * @module cli
 */
import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/** The temporary name used while `target` is being written (same folder, so rename is atomic). */
export function tempNameFor(target: string): string {
  return join(dirname(target), `.${basename(target)}.${process.pid}.${Date.now().toString(36)}.tmp`);
}

/**
 * A file being written: `write` appends, `commit` renames it into place, `abort` removes
 * the temporary file. Nothing appears under the target name before `commit`.
 */
export interface PendingFile {
  readonly target: string;
  write(text: string): void;
  commit(): void;
  abort(): void;
}

/** Opens a pending file for `target` (the temporary file is created at once). */
export function openPending(target: string): PendingFile {
  const temp = tempNameFor(target);
  const fd = openSync(temp, 'wx', 0o644);
  let open = true;
  const close = (): void => {
    if (open) {
      open = false;
      closeSync(fd);
    }
  };
  return {
    target,
    write(text) {
      writeSync(fd, text);
    },
    commit() {
      fsyncSync(fd);
      close();
      renameSync(temp, target);
    },
    abort() {
      close();
      rmSync(temp, { force: true });
    },
  };
}

/** Writes `text` to `target` atomically (temporary file, then rename). */
export function writeFileAtomic(target: string, text: string): void {
  const f = openPending(target);
  try {
    f.write(text);
    f.commit();
  } catch (e) {
    f.abort();
    throw e;
  }
}

/**
 * Writes several files so that either all appear or none: each goes to its temporary
 * file first, and the renames happen only when every temporary file is complete.
 */
export function writeFilesAtomic(files: { target: string; text: string }[]): void {
  const pending: PendingFile[] = [];
  try {
    for (const { target, text } of files) {
      const f = openPending(target);
      pending.push(f);
      f.write(text);
    }
  } catch (e) {
    for (const f of pending) f.abort();
    throw e;
  }
  for (const f of pending) f.commit();
}
