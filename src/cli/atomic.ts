/**
 * Atomic output files: everything is written to a temporary file beside the target and
 * renamed over it only when complete, so a failure never leaves a partial file.
 *
 * @module cli
 */
import { closeSync, fsyncSync, openSync, renameSync, rmSync, statSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { JobInvalid } from './failure.js';

/** Why `target` cannot be written, in plain words, from a file-system error. */
function cannotWrite(target: string, e: unknown): JobInvalid {
  const code = (e as NodeJS.ErrnoException).code;
  const why =
    code === 'ENOENT'
      ? `the folder ${JSON.stringify(dirname(target))} does not exist`
      : code === 'EISDIR'
        ? 'it is a folder'
        : code === 'EACCES' || code === 'EPERM'
          ? 'permission denied'
          : (code ?? (e as Error).message);
  return new JobInvalid('', `cannot write ${JSON.stringify(target)}: ${why}`);
}

/** The temporary name used while `target` is being written (same folder, so rename is atomic). */
export function tempNameFor(target: string): string {
  return join(
    dirname(target),
    `.${basename(target)}.${process.pid}.${Date.now().toString(36)}.tmp`,
  );
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

/**
 * Opens a pending file for `target` (the temporary file is created at once). A target that
 * cannot be written (a missing folder, a folder, no permission) is a bad command line:
 * {@link JobInvalid}, exit 2, and nothing is left behind.
 */
export function openPending(target: string): PendingFile {
  let isFolder = false;
  try {
    isFolder = statSync(target).isDirectory();
  } catch {
    // No such file yet: the usual case.
  }
  if (isFolder) throw cannotWrite(target, Object.assign(new Error('EISDIR'), { code: 'EISDIR' }));
  const temp = tempNameFor(target);
  let fd: number;
  try {
    fd = openSync(temp, 'wx', 0o644);
  } catch (e) {
    throw cannotWrite(target, e);
  }
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
      try {
        writeSync(fd, text);
      } catch (e) {
        throw cannotWrite(target, e);
      }
    },
    commit() {
      try {
        fsyncSync(fd);
        close();
        renameSync(temp, target);
      } catch (e) {
        close();
        rmSync(temp, { force: true });
        throw cannotWrite(target, e);
      }
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
  // Every target was checked when its temporary file was opened, so a rename failing here
  // is unusual; the files not yet renamed are still removed.
  for (let i = 0; i < pending.length; i++) {
    try {
      pending[i]!.commit();
    } catch (e) {
      for (const f of pending.slice(i + 1)) f.abort();
      throw e;
    }
  }
}
