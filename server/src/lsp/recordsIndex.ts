// What a script's rung hover shows of the rate records, kept in memory. The records files of the
// workspace are found once, each file's text is read once, and each file's progress (with the
// scripts it names) is worked out once; the hover answers from that. A watched-file event for a
// path forgets its disk copy (and, for a records file, the list of records files), and every
// progress remembers the texts it was read from, so an open document's edit or a changed file is
// seen at the next hover without reading anything that did not change.
import { pathKey } from '../node/nodeFs';
import { isRecordsPath, latestRatios, recordsProgress, rungRecordsNote, type EditorLayer, type LatestRatios, type OpenText } from './records';

/** The file system as the index reads it (tests count the reads). */
export interface RecordsFiles {
  /** A file's text, or null when it is missing or cannot be read. */
  read(path: string): string | null;
  /** The records files below these folders. */
  find(folders: string[]): string[];
}

interface Progress {
  /** The records file's text it was read from. */
  text: string;
  /** The editor settings and the day it was read with. */
  key: string;
  /** Every script it named, with the text read (null: missing). */
  scripts: Map<string, string | null>;
  latest: LatestRatios;
}

export class RecordsIndex {
  private files: string[] | null = null;
  private filesFor = '';
  /** Disk copies by pathKey, until a watched-file event says the file changed. */
  private readonly disk = new Map<string, string | null>();
  private readonly progress = new Map<string, Progress>();

  constructor(
    private readonly io: RecordsFiles,
    /** Text of an open document by path: it wins over the disk copy. */
    private readonly open: OpenText,
    private readonly today: () => string,
  ) {}

  /** A file's text: the open document's, else the disk copy (read once). */
  text(path: string): string | null {
    const t = this.open(path);
    if (t !== undefined) return t;
    const k = pathKey(path);
    let d = this.disk.get(k);
    if (d === undefined) {
      d = this.io.read(path);
      this.disk.set(k, d);
    }
    return d;
  }

  /** Files changed, were created or deleted on disk (workspace/didChangeWatchedFiles). */
  changed(paths: string[]): void {
    for (const p of paths) {
      this.disk.delete(pathKey(p));
      if (isRecordsPath(p)) this.files = null;
    }
  }

  /** Forgets everything (settings, config files or workspace folders changed). */
  reset(): void {
    this.files = null;
    this.disk.clear();
    this.progress.clear();
  }

  /** Markdown lines for a rung's hover: each client's latest ratio on it (rungRecordsNote). */
  note(scriptPath: string, rungIndex: number, folders: string[], editor: EditorLayer): string[] {
    const key = folders.join('\n');
    if (!this.files || this.filesFor !== key) {
      this.files = this.io.find(folders);
      this.filesFor = key;
      // Progress of files no longer found is not kept.
      const found = new Set(this.files.map(pathKey));
      for (const k of this.progress.keys()) if (!found.has(k)) this.progress.delete(k);
    }
    const latest: LatestRatios[] = [];
    const settings = `${this.today()}|${JSON.stringify(editor ?? null)}`;
    for (const file of this.files) {
      const p = this.progressOf(file, editor, settings);
      if (p) latest.push(p.latest);
    }
    return rungRecordsNote(scriptPath, rungIndex, latest);
  }

  /** A records file's progress; `key` names the editor settings and the day it is read with. */
  private progressOf(file: string, editor: EditorLayer, key: string): Progress | null {
    const text = this.text(file);
    if (text === null) return null;
    const k = pathKey(file);
    const hit = this.progress.get(k);
    if (hit && hit.text === text && hit.key === key && [...hit.scripts].every(([p, t]) => this.text(p) === t)) return hit;
    const scripts = new Map<string, string | null>();
    const read = (p: string) => {
      const t = this.text(p);
      scripts.set(p, t);
      return t;
    };
    const { result, mark } = recordsProgress(file, text, this.open, undefined, editor, read);
    const fresh: Progress = { text, key, scripts, latest: latestRatios(file, result, mark) };
    this.progress.set(k, fresh);
    return fresh;
  }
}
