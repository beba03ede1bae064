// Writes a file so that a reader (or a crash) sees either the old or the new content, never half:
// the bytes go to a temporary file beside it, which then replaces it by rename. The file keeps its
// permission bits; a link is followed, so the link stays and its target is replaced.
import { chmodSync, closeSync, fsyncSync, openSync, realpathSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

export function writeFileAtomic(path: string, bytes: Uint8Array): void {
  const target = realpathSync(path);
  const mode = statSync(target).mode & 0o7777;
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
    chmodSync(temp, mode);
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
