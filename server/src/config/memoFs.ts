// A file-system view for one run over many scripts (`rungs lint` of a folder): config lookup asks
// the same questions for every script of a folder (is there a config file here, and in each folder
// above?), so each answer is fetched once. Files are not expected to change during one run; the
// language server never uses this view, since its files change while it runs.
import type { ConfigFs } from './resolve';

type Answer<T> = { value: T } | { error: unknown };

function remember<T>(cache: Map<string, Answer<T>>, path: string, get: (p: string) => T): T {
  let hit = cache.get(path);
  if (hit === undefined) {
    try {
      hit = { value: get(path) };
    } catch (error) {
      // A failed read fails the same way for every script that asks, as it would have uncached.
      hit = { error };
    }
    cache.set(path, hit);
  }
  if ('error' in hit) throw hit.error;
  return hit.value;
}

export function memoFs(fs: ConfigFs): ConfigFs {
  const files = new Map<string, Answer<string>>();
  const exists = new Map<string, Answer<boolean>>();
  const isFile = new Map<string, Answer<boolean>>();
  const real = new Map<string, Answer<string>>();
  return {
    readFile: (p) => remember(files, p, (q) => fs.readFile(q)),
    exists: (p) => remember(exists, p, (q) => fs.exists(q)),
    ...(fs.isFile && { isFile: (p: string) => remember(isFile, p, (q) => fs.isFile!(q)) }),
    ...(fs.realpath && { realpath: (p: string) => remember(real, p, (q) => fs.realpath!(q)) }),
  };
}
