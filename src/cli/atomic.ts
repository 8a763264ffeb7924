/**
 * Atomic output files: everything is written to a temporary file beside the target and
 * renamed over it only when complete, so a failure never leaves a partial file.
 *
 * @module cli
 */
import {
  closeSync,
  fsyncSync,
  lstatSync,
  openSync,
  realpathSync,
  renameSync,
  rmSync,
  statSync,
  writeSync,
} from 'node:fs';
import type { Stats } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
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

function refuse(target: string, why: string): JobInvalid {
  return new JobInvalid('', `cannot write ${JSON.stringify(target)}: ${why}`);
}

/** What kind of file system object a non-regular file is, in words. */
function kindOf(st: Stats): string {
  return st.isDirectory()
    ? 'it is a folder'
    : st.isFIFO()
      ? 'it is a named pipe (FIFO), not a regular file'
      : st.isCharacterDevice() || st.isBlockDevice()
        ? 'it is a device, not a regular file'
        : st.isSocket()
          ? 'it is a socket, not a regular file'
          : 'it is not a regular file';
}

/**
 * Where writing to `target` really goes: a symbolic link is followed to its target (the link
 * stays a link), and the result must be a regular file or not exist yet. Anything else (a
 * folder, a device such as /dev/null, a FIFO, a socket, a dangling link) is refused with exit 2
 * naming the path, since renaming a temporary file over it would replace it.
 */
export function outputPath(target: string): string {
  let st: Stats;
  try {
    st = lstatSync(target);
  } catch {
    return target; // No such file yet: the usual case.
  }
  let real = target;
  if (st.isSymbolicLink()) {
    try {
      real = realpathSync(target);
      st = statSync(real);
    } catch {
      throw refuse(target, 'it is a symbolic link to nothing (a dangling link)');
    }
  }
  if (!st.isFile()) throw refuse(target, kindOf(st));
  return real;
}

/**
 * Whether two paths name the same file: the same device and inode when both exist (so hard
 * links, symbolic links and `..` are seen through), else the same real path of the folder and
 * the same name.
 */
export function sameFile(a: string, b: string): boolean {
  try {
    const x = statSync(a);
    const y = statSync(b);
    return x.dev === y.dev && x.ino === y.ino;
  } catch {
    const real = (p: string): string => {
      try {
        return realpathSync(p);
      } catch {
        try {
          return join(realpathSync(dirname(p)), basename(p));
        } catch {
          return resolve(p);
        }
      }
    };
    return real(a) === real(b);
  }
}

// Temporary files being written. While there are any, an interrupt (Ctrl-C, SIGINT), a
// termination request (SIGTERM) or a closed terminal (SIGHUP) removes them and ends the
// process with the usual 128 + signal number. The handlers are installed only meanwhile, so
// the default action (ending at once) holds whenever no temporary file exists.
const live = new Set<string>();
const SIGNALS = { SIGINT: 2, SIGTERM: 15, SIGHUP: 1 } as const;
const onSignal = (signal: NodeJS.Signals): void => {
  removeTemporaryFiles();
  process.exit(128 + SIGNALS[signal as keyof typeof SIGNALS]);
};

function track(temp: string, on: boolean): void {
  const before = live.size;
  if (on) live.add(temp);
  else live.delete(temp);
  if (before === 0 && live.size > 0)
    for (const s of Object.keys(SIGNALS)) process.on(s as NodeJS.Signals, onSignal);
  else if (before > 0 && live.size === 0)
    for (const s of Object.keys(SIGNALS)) process.off(s as NodeJS.Signals, onSignal);
}

/** Removes every temporary file still being written (as on an interrupt). */
export function removeTemporaryFiles(): void {
  for (const t of [...live]) {
    rmSync(t, { force: true });
    track(t, false);
  }
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
  write(text: string | Uint8Array): void;
  commit(): void;
  abort(): void;
}

/**
 * Opens a pending file for `target` (the temporary file is created at once). A target that
 * cannot be written (a missing folder, a folder, no permission) is a bad command line:
 * {@link JobInvalid}, exit 2, and nothing is left behind.
 */
export function openPending(target: string): PendingFile {
  const real = outputPath(target);
  const temp = tempNameFor(real);
  let fd: number;
  try {
    fd = openSync(temp, 'wx', 0o644);
  } catch (e) {
    throw cannotWrite(target, e);
  }
  track(temp, true);
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
        if (typeof text === 'string') writeSync(fd, text);
        else for (let at = 0; at < text.length;) at += writeSync(fd, text, at);
      } catch (e) {
        throw cannotWrite(target, e);
      }
    },
    commit() {
      try {
        fsyncSync(fd);
        close();
        // Checked again just before the rename: a file that became a FIFO or a device since
        // is refused rather than replaced.
        renameSync(temp, outputPath(real));
        track(temp, false);
      } catch (e) {
        close();
        rmSync(temp, { force: true });
        track(temp, false);
        throw e instanceof JobInvalid ? e : cannotWrite(target, e);
      }
    },
    abort() {
      close();
      rmSync(temp, { force: true });
      track(temp, false);
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
