// Which items repeat an earlier item, worked out from what changed. duplicate-item runs on every
// keystroke over the whole script; grouping 10,000 key numbers each time cost more than the rest
// of the rules together. So each rung's numbers are grouped once (kept with its analysis), and
// the script's index of which rungs hold which number is kept from one check to the next and
// moved by the rungs that came and went: a keystroke inside one rung regroups that rung only.
// Only numbers held twice are looked at closely, and there items are compared by their keys, so
// two keys that share a number are still told apart.
import type { ItemAnalysis, RungAnalysis } from '../core/types';
import { rungKeyHashes, spokenKey } from './itemKey';

/** One rung's items by key number. */
interface RungKeys {
  /** Each number in the rung, with the index of its first item. */
  first: Map<number, number>;
  /** Numbers held by two or more items of the rung, with all their item indices in order. */
  more: Map<number, number[]>;
}

const keysByRung = new WeakMap<RungAnalysis, RungKeys>();

function rungKeys(r: RungAnalysis): RungKeys {
  let out = keysByRung.get(r);
  if (out) return out;
  const hashes = rungKeyHashes(r);
  const first = new Map<number, number>();
  const more = new Map<number, number[]>();
  for (let k = 0; k < hashes.length; k++) {
    const h = hashes[k];
    if (h < 0) continue; // An item with nothing to say (only punctuation) repeats nothing.
    const at = first.get(h);
    if (at === undefined) first.set(h, k);
    else {
      const list = more.get(h);
      if (list) list.push(k);
      else more.set(h, [at, k]);
    }
  }
  keysByRung.set(r, (out = { first, more }));
  return out;
}

/** A repeated item and the first item of the script with the same key. */
export interface Repeat {
  item: ItemAnalysis;
  first: ItemAnalysis;
}

/**
 * The repeats among the items with one key number, kept in the index while the rungs holding the
 * number are the same: an edit elsewhere does not regroup them.
 */
interface Group {
  holders: readonly RungAnalysis[];
  repeats: Repeat[];
  /** The last check that looked at it. */
  check: number;
}

/**
 * Which rungs (by place in the script) hold each key number, for one list of rungs. Moved to the
 * next list rung by rung: a rung that changed in place is compared with the one it replaces, so
 * only numbers that came or went touch the index, and a different number of rungs builds it anew.
 */
class KeyIndex {
  rungs: readonly RungAnalysis[] = [];
  /** The places of the rungs holding each number: one, or a list in script order once two or more do. */
  readonly where = new Map<number, number | number[]>();
  /** Numbers held by more than one rung. */
  readonly shared = new Set<number>();
  /** The repeats found among each number's items, with the rungs they were found in. */
  readonly groups = new Map<number, Group>();
  /** Checks made with this index so far. */
  checks = 0;

  moveTo(next: readonly RungAnalysis[]): void {
    const before = this.rungs;
    this.rungs = next;
    if (next.length !== before.length) {
      this.where.clear();
      this.shared.clear();
      this.groups.clear();
      next.forEach((r, at) => {
        for (const h of rungKeys(r).first.keys()) this.hold(h, at);
      });
      return;
    }
    for (let at = 0; at < next.length; at++) {
      if (next[at] === before[at]) continue;
      const was = rungKeys(before[at]).first;
      const now = rungKeys(next[at]).first;
      for (const h of was.keys()) if (!now.has(h)) this.release(h, at);
      for (const h of now.keys()) if (!was.has(h)) this.hold(h, at);
    }
  }

  private hold(h: number, at: number): void {
    const w = this.where.get(h);
    if (w === undefined) this.where.set(h, at);
    else if (typeof w === 'number') {
      this.where.set(h, w < at ? [w, at] : [at, w]);
      this.shared.add(h);
    } else {
      let i = w.length;
      while (i > 0 && w[i - 1] > at) i--;
      w.splice(i, 0, at);
    }
  }

  private release(h: number, at: number): void {
    const w = this.where.get(h);
    if (typeof w === 'number') this.where.delete(h);
    else if (w) {
      w.splice(w.indexOf(at), 1);
      if (w.length === 1) {
        this.where.set(h, w[0]);
        this.shared.delete(h);
      }
    }
  }
}

/**
 * The index each rung's list was last moved to. An analysis after an edit shares its untouched
 * rungs with the one before, so it finds that analysis's index through any of them; a new script
 * (or a full analysis) shares none and starts a new index. The index is moved to exactly the list
 * asked about, so which one is found only decides how much moving it takes, never the answer.
 */
const indexByRung = new WeakMap<RungAnalysis, KeyIndex>();

function indexFor(rungs: readonly RungAnalysis[]): KeyIndex {
  let index: KeyIndex | undefined;
  for (const r of rungs) if ((index = indexByRung.get(r))) break;
  index ??= new KeyIndex();
  if (index.rungs !== rungs) {
    index.moveTo(rungs);
    for (const r of rungs) indexByRung.set(r, index);
  }
  return index;
}

function sameRungs(a: readonly RungAnalysis[], b: readonly RungAnalysis[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** The repeats among the items numbered `h` in `holders` (in script order), compared by key. */
function groupRepeats(h: number, holders: readonly RungAnalysis[]): Repeat[] {
  const out: Repeat[] = [];
  const firsts = new Map<string, ItemAnalysis>();
  for (const r of holders) {
    const keys = rungKeys(r);
    for (const k of keys.more.get(h) ?? [keys.first.get(h)!]) {
      const item = r.items[k];
      const key = spokenKey(item.node.text);
      const first = firsts.get(key);
      if (first) out.push({ item, first });
      else firsts.set(key, item);
    }
  }
  return out;
}

/** Every item that repeats an earlier item of the rungs (compared by spokenKey), in script order. */
export function repeatsOf(rungs: readonly RungAnalysis[]): Repeat[] {
  const index = indexFor(rungs);
  const groups = index.groups;
  const check = ++index.checks;
  const out: Repeat[] = [];
  let looked = 0;
  const look = (h: number, holders: readonly RungAnalysis[]): void => {
    looked++;
    let g = groups.get(h);
    if (!g || !sameRungs(g.holders, holders)) groups.set(h, (g = { holders, repeats: groupRepeats(h, holders), check }));
    g.check = check;
    for (const x of g.repeats) out.push(x);
  };
  // Numbers held by two or more rungs, then numbers held twice within one rung only.
  for (const h of index.shared) look(h, (index.where.get(h) as number[]).map((at) => rungs[at]));
  for (const r of rungs) for (const h of rungKeys(r).more.keys()) if (!index.shared.has(h)) look(h, [r]);
  // Groups of numbers no longer held twice go at once: they would keep the rungs they were found
  // in, each with all its items, alive.
  if (groups.size > looked) for (const [h, g] of groups) if (g.check !== index.checks) groups.delete(h);
  return out.sort((a, b) => a.item.node.line - b.item.node.line);
}
