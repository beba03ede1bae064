// Writes a file so that a reader (or a crash) sees either the old or the new content, never half:
// the bytes go to a temporary file beside it, which then replaces it by rename. The file keeps its
// permission bits; a link is followed, so the link stays and its target is replaced. A file that
// does not exist yet is written the same way and gets the permissions new files get (the umask).
import { chmodSync, closeSync, fsyncSync, lstatSync, openSync, realpathSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/** True when nothing at all (not even a link) stands at `path`. */
function missing(path: string): boolean {
  try {
    lstatSync(path);
    return false;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'ENOENT';
  }
}

export function writeFileAtomic(path: string, bytes: Uint8Array): void {
  const fresh = missing(path);
  const target = fresh ? path : realpathSync(path);
  const mode = fresh ? 0o666 : statSync(target).mode & 0o7777;
  const temp = join(dirname(target), `.${basename(target)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  // 'wx' refuses to follow or reuse anything already at the temporary name.
  const fd = openSync(temp, 'wx', mode);
  try {
    try {
      let at = 0;
      while (at < bytes.length) at += writeSync(fd, bytes, at, bytes.length - at);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    // A new file keeps the mode it was created with (the umask applied); an old one gets its own back.
    if (!fresh) chmodSync(temp, mode);
    renameSync(temp, target);
  } catch (err) {
    try {
      unlinkSync(temp);
    } catch {
      // Already gone.
    }
    throw err;
  }
}
