// A seeded, generated stimulus script for the benchmark: rungs of sentences made from common and
// less common words, with settings, notes and the odd number, like a large real library.
export function mulberry32(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SUBJECTS = [
  'I', 'We', 'My sister', 'The nurse', 'Our neighbour', 'Grandpa', 'The children', 'You', 'My brother',
  'The driver', 'Aunt Rosa', 'The therapist', 'Our son', 'The baker', 'My friend', 'The twins',
];
const VERBS = [
  'want', 'need', 'like', 'bought', 'found', 'carried', 'remember', 'cooked', 'painted', 'washed',
  'ordered', 'forgot', 'borrowed', 'packed', 'fixed', 'dropped', 'wrapped', 'picked up', 'chose', 'counted',
];
const OBJECTS = [
  'the bread', 'a cup of tea', 'the blue umbrella', 'some oranges', 'the newspaper', 'my glasses',
  'a warm blanket', 'the telephone', 'two tickets', 'the vegetables', 'a birthday cake', 'the keys',
  'the heavy suitcase', 'a jar of honey', 'the photographs', 'some fresh flowers', 'the red scarf',
  'a pair of gloves', 'the grocery list', 'three envelopes', 'the old radio', 'a loaf of bread',
  'the garden hose', 'my medicine', 'the crossword', 'a basket of apples', 'the television remote',
  'a new toothbrush', 'the library books', 'the spare batteries',
];
const TAILS = [
  '', 'today', 'this morning', 'at 3:30', 'after lunch', 'before the appointment', 'with Dr. Patel',
  'for the grandchildren', 'on Saturday afternoon', 'near the library', 'in the garden', 'again',
  'yesterday', 'last week', 'at the market', 'for the picnic', 'before dinner', 'by the front door',
  'on the way home', 'at 10:15', 'for Mrs. Okafor', 'in the kitchen', 'after the rain', 'quickly',
  'on Tuesday',
];

export function generateScript(items, seed = 20261201) {
  const rand = mulberry32(seed);
  const pick = (xs) => xs[Math.floor(rand() * xs.length)];
  const lines = ['// generated benchmark script', '@title Benchmark library', '@paces 1, 1.5, 2 wps', '@baseline 0.8 wps', ''];
  const perRung = 500;
  for (let i = 0; i < items; i++) {
    if (i % perRung === 0) lines.push('', `== Level ${i / perRung + 1}`);
    const words = [pick(SUBJECTS), pick(VERBS), pick(OBJECTS)];
    const tail = pick(TAILS);
    if (tail) words.push(tail);
    const note = rand() < 0.2 ? ` | practise twice #b${i}` : '';
    lines.push(`${words.join(' ')}.${note}`);
  }
  return `${lines.join('\n')}\n`;
}

/**
 * The benchmark's edits of a generated script, seeded: `pickLine()` draws an item line, and
 * `items` is how many item lines there are, and `edit(i)` makes the i-th edit (alternately typing a letter into an item and deleting one, so the
 * script stays like the original) and returns it as an LSP content change.
 */
export function scriptEdits(text, seed = 7) {
  const lines = text.split('\n');
  const itemLines = lines.map((l, i) => (/^[A-Z]/.test(l) ? i : -1)).filter((i) => i >= 0);
  const rand = mulberry32(seed);
  const pickLine = () => itemLines[Math.floor(rand() * itemLines.length)];
  const edit = (i) => {
    const line = pickLine();
    const bar = lines[line].indexOf('|');
    const end = bar >= 0 ? bar - 1 : lines[line].length - 1;
    const ch = 1 + Math.floor(rand() * Math.max(1, end - 1));
    const insert = i % 2 === 0;
    lines[line] = insert ? lines[line].slice(0, ch) + 'e' + lines[line].slice(ch) : lines[line].slice(0, ch) + lines[line].slice(ch + 1);
    return insert
      ? { range: { start: { line, character: ch }, end: { line, character: ch } }, text: 'e' }
      : { range: { start: { line, character: ch }, end: { line, character: ch + 1 } }, text: '' };
  };
  return { items: itemLines.length, pickLine, edit };
}
