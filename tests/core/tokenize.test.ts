// Tokenising real text into spoken words. Every case also checks that offsets map back to the
// original text. Number-wording rows name their source: the output of number-to-words@1.2.4 (the
// library the tokenizer calls) or common English reading usage, from memory.
import { describe, expect, it } from 'vitest';
import { ABBREVIATIONS } from '../../server/src/core/abbreviations';
import { spokenWordCount, tokenize, type Token } from '../../server/src/core/tokenize';

const OFFSET = 7;
const LIB = 'number-to-words@1.2.4 output';
const USAGE = 'common English usage, from memory';

function checkOffsets(text: string, tokens: Token[], offset: number): void {
  let previousEnd = offset;
  for (const t of tokens) {
    expect(text.slice(t.start - offset, t.end - offset)).toBe(t.surface);
    expect(t.start).toBeGreaterThanOrEqual(previousEnd);
    expect(t.end).toBeGreaterThan(t.start);
    previousEnd = t.end;
  }
}

/** Tokenises at a non-zero offset and compares the spoken words and the surfaces followed by a break. */
function check(input: string, expectedWords: string[], expectedBreaks?: string[]): Token[] {
  const tokens = tokenize(input, OFFSET);
  checkOffsets(input, tokens, OFFSET);
  expect(tokens.flatMap((t) => t.words)).toEqual(expectedWords);
  expect(spokenWordCount(tokens)).toBe(expectedWords.length);
  if (expectedBreaks !== undefined) {
    expect(tokens.filter((t) => t.breakAfter).map((t) => t.surface)).toEqual(expectedBreaks);
  }
  return tokens;
}

type Case = [input: string, words: string[], breaks?: string[]];

const words = (s: string) => s.split(' ');

/** mulberry32: a tiny seeded PRNG, so random inputs reproduce. */
function mulberry32(seed: number): () => number {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Script-like sentences: mostly plain words, with contractions, compounds, numbers and abbreviations. */
function generatedSentences(count: number, random: () => number): string[] {
  const common = ("the a cat dog sat on mat and then ran home to see her mother-in-law who was well-known in town " +
    "for baking bread I don't think we'll go there today because it's raining John's car is red she said yes " +
    "please pass the salt Dr. Smith St. Paul caf\u00e9 record(2) rock 'n' roll o'clock").split(' ');
  const special = ['3:30', '$2.50', '50%', '21st', '1990', '12', 'etc.', '7 p.m.', '1,250', '\u2014', '-', '&'];
  const pick = (list: string[]) => list[Math.floor(random() * list.length)];
  const lines: string[] = [];
  for (let k = 0; k < count; k++) {
    const parts: string[] = [];
    const length = 4 + Math.floor(random() * 12);
    for (let w = 0; w < length; w++) parts.push(pick(random() < 0.06 ? special : common) + (random() < 0.1 ? ',' : ''));
    parts[0] = parts[0][0].toUpperCase() + parts[0].slice(1);
    lines.push(`${parts.join(' ')}${random() < 0.2 ? '?' : '.'}`);
  }
  return lines;
}

describe('tokenize', () => {
  const plain: Case[] = [
    ['The cat sat.', words('the cat sat'), ['sat']],
    ['', []],
    ['   ', []],
    ['Hello, world; yes: no! Why? Well… maybe', words('hello world yes no why well maybe'), ['Hello', 'world', 'yes', 'no', 'Why', 'Well']],
    ['Wait... what', words('wait what'), ['Wait']],
    ['the dog (a big one) ran', words('the dog a big one ran'), ['dog', 'one']],
    ['CAPITALS Stay Words', words('capitals stay words')],
  ];
  it.each(plain)('words and breaks: %j', (input, w, b) => void check(input, w, b));

  const unicode: Case[] = [
    ['I don\u2019t know', ['i', "don't", 'know']],
    ['\u2018Hello,\u2019 she said', words('hello she said'), ['Hello']],
    ['\u201cQuoted\u201d words', words('quoted words')],
    ['we\u02bcll go', ["we'll", 'go']],
    ['it\u2032s fine', ["it's", 'fine']],
    // A diaeresis between two vowels stays (core/hiatus.ts); other Latin accents go, and so does
    // a diaeresis after a consonant (Bront\u00eb, M\u00fcller).
    ['caf\u00e9 na\u00efve', ['cafe', 'na\u00efve']],
    ['Zoe\u0308 Bront\u00eb M\u00fcller co\u00f6perate', ['zo\u00eb', 'bronte', 'muller', 'co\u00f6perate']],
    ['cafe\u0301 (decomposed)', words('cafe decomposed'), ['cafe\u0301', 'decomposed']],
    ['Cr\u00e8me Br\u00fbl\u00e9e', words('creme brulee')],
    ['wait\u2014then go', words('wait then go'), ['wait']],
    ['wait \u2013 then go', words('wait then go'), ['wait']],
    ['wait\u2015then', words('wait then'), ['wait']],
    ['\u041f\u0440\u0438\u0432\u0435\u0442 \u043c\u0438\u0440', ['\u043f\u0440\u0438\u0432\u0435\u0442', '\u043c\u0438\u0440']],
    ['\u4f60\u597d\u3002\u4e16\u754c', ['\u4f60\u597d', '\u4e16\u754c'], ['\u4f60\u597d']],
    ['\u0928\u092e\u0938\u094d\u0924\u0947 friend', ['\u0928\u092e\u0938\u094d\u0924\u0947', 'friend']],
    ['\u{1d400}bc math letters', ['\u{1d400}bc', 'math', 'letters']],
  ];
  it.each(unicode)('unicode: %j', (input, w, b) => void check(input, w, b));

  const apostrophes: Case[] = [
    ["don't we'll I'm she's", ["don't", "we'll", "i'm", "she's"]],
    ["John's hat and James' coat", ["john's", 'hat', 'and', "james'", 'coat']],
    ["the dogs' bowls", ['the', "dogs'", 'bowls']],
    ["five o'clock", ['five', "o'clock"]],
    ["rock 'n' roll", ['rock', "'n", 'roll']],
    ["rock 'n roll", ['rock', "'n", 'roll']],
    ["rock'n'roll", ["rock'n'roll"]],
    ["'til we're done 'cause", ["'til", "we're", 'done', "'cause"]],
    ["'Hello' and 'goodbye'", words('hello and goodbye')],
    ["'The boys'", words('the boys')],
    ["we're goin' home", ["we're", "goin'", 'home']],
    ["'Come in,' he said", words('come in he said'), ['in']],
    ["back in the '90s", words('back in the nineties')],
    ["the \u201900s", words('the two thousands')],
  ];
  it.each(apostrophes)('contractions and quotes: %j', (input, w, b) => void check(input, w, b));

  const hyphens: Case[] = [
    ['a well-known fact', words('a well known fact')],
    ['my mother-in-law', words('my mother in law')],
    ['a T\u2011shirt', words('a t shirt')],
    ['wait -- then', words('wait then'), ['wait']],
    ['wait--then', words('wait then'), ['wait']],
    ['wait - then', words('wait then'), ['wait']],
    ['pre- and post-war', words('pre and post war'), ['pre']],
    ['a 5-year-old', words('a five year old')],
    ['COVID-19 cases', words('covid nineteen cases')],
  ];
  it.each(hyphens)('hyphens: %j', (input, w, b) => void check(input, w, b));

  // [input, words, source]
  const numbers: [string, string[], string][] = [
    ['12', words('twelve'), LIB],
    ['0', words('zero'), LIB],
    ['21', words('twenty one'), LIB],
    ['105', words('one hundred five'), LIB],
    ['1,250', words('one thousand two hundred fifty'), LIB],
    ['1,000,000', words('one million'), LIB],
    ['12345', words('twelve thousand three hundred forty five'), LIB],
    ['3.5', words('three point five'), USAGE],
    ['3.14', words('three point one four'), USAGE],
    ['.5', words('point five'), USAGE],
    ['007', words('zero zero seven'), USAGE],
    ['12345678901234567890', words('one two three four five six seven eight nine zero one two three four five six seven eight nine zero'), USAGE],
    ['-5', words('minus five'), USAGE],
    ['\u22123.5', words('minus three point five'), USAGE],
    ['1990', words('nineteen ninety'), USAGE],
    ['2005', words('two thousand five'), LIB],
    ['1900', words('nineteen hundred'), USAGE],
    ['1905', words('nineteen oh five'), USAGE],
    ['2024', words('twenty twenty four'), USAGE],
    ['1099', words('one thousand ninety nine'), LIB],
    ['2100', words('two thousand one hundred'), LIB],
    ['the 1990s', words('the nineteen nineties'), USAGE],
    ['the 80s', words('the eighties'), USAGE],
    ['2nd', words('second'), LIB],
    ['21st', words('twenty first'), LIB],
    ['3rd 11th', words('third eleventh'), LIB],
    ['100th', words('one hundredth'), LIB],
    ['1,000th', words('one thousandth'), LIB],
    ['3:30', words('three thirty'), USAGE],
    ['7:05', words('seven oh five'), USAGE],
    ['10:00', ['ten', "o'clock"], USAGE],
    ['3:30pm', words('three thirty p m'), USAGE],
    ['3:30 p.m.', words('three thirty p m'), USAGE],
    ['10:00 am', words('ten a m'), USAGE],
    ['12:00 a.m.', words('twelve a m'), USAGE],
    ['13:45', words('thirteen forty five'), LIB],
    ['7 a.m.', words('seven a m'), USAGE],
    ['5pm', words('five p m'), USAGE],
    ['$5', words('five dollars'), USAGE],
    ['$1', words('one dollar'), USAGE],
    ['$2.50', words('two dollars fifty cents'), USAGE],
    ['$1.01', words('one dollar one cent'), USAGE],
    ['$0.50', words('fifty cents'), USAGE],
    ['$1,000', words('one thousand dollars'), LIB],
    ['$5 million', words('five million dollars'), USAGE],
    ['$1.5 million', words('one point five million dollars'), USAGE],
    ['$.99', words('ninety nine cents'), USAGE],
    ['$5,000.00', words('five thousand dollars'), LIB],
    ['-$5', words('minus five dollars'), USAGE],
    ['\u00a32.50', words('two pounds fifty pence'), USAGE],
    ['50%', words('fifty percent'), USAGE],
    ['50 %', words('fifty percent'), USAGE],
    ['2.5%', words('two point five percent'), USAGE],
    ['salt & pepper', words('salt and pepper'), USAGE],
  ];
  it.each(numbers)('numbers: %j -> %j (%s)', (input, w) => void check(input, w));

  it('gives numbers their kinds', () => {
    const kinds = (s: string) => tokenize(s).map((t) => t.kind);
    expect(kinds('12 2nd 3:30 $5 50% Dr. & cat')).toEqual(
      ['number', 'ordinal', 'time', 'money', 'percent', 'abbreviation', 'symbol', 'word'],
    );
  });

  it('keeps a number and its period apart', () => void check('It cost $5.', words('it cost five dollars'), ['$5']));
  it('does not read a bad time as a time', () => void check('25:61', words('twenty five sixty one'), ['25']));
  it('keeps a list of numbers apart', () => void check('1,2,3', words('one two three'), ['1', '2']));

  const abbreviations: Case[] = [
    ['Dr. Smith is in.', words('doctor smith is in'), ['in']],
    ['Mr. and Mrs. Jones', words('mister and missus jones'), []],
    ['Ms. Lee', words('ms lee'), []],
    ['Mr Smith', words('mister smith')],
    ['St. Paul', words('saint paul'), []],
    ['Main St. is busy', words('main street is busy'), []],
    ['on Main St.', words('on main street'), ['St.']],
    ['Fifth Ave. and Elm Rd.', words('fifth avenue and elm road'), ['Rd.']],
    ['John Jr. and Prof. Sr.', words('john junior and professor senior')],
    ['Mt. Fuji', words('mount fuji')],
    ['Ave Maria', words('ave maria')],
    ['cats vs. dogs, cats vs dogs', words('cats versus dogs cats versus dogs'), ['dogs']],
    ['apples, pears, etc.', words('apples pears et cetera'), ['apples', 'pears', 'etc.']],
    ['fruit, e.g. apples, i.e. food', words('fruit for example apples that is food'), ['fruit', 'apples']],
    ['the U.S. and the U.K. team', words('the u s and the u k team'), []],
    ['watch TV and T.V.', words('watch tv and tv')],
    ['John F. Kennedy', words('john f kennedy'), []],
    ['a Ph.D. student', words('a p h d student')],
    ['lower dr and st stay words', words('lower dr and st stay words')],
  ];
  it.each(abbreviations)('abbreviations: %j', (input, w, b) => void check(input, w, b));

  it('every abbreviation row reads as its table words', () => {
    for (const [written, entry] of ABBREVIATIONS) {
      const tokens = tokenize(`the ${written} word`);
      expect(tokens[1].words, written).toEqual([...entry.words]);
      expect(tokens[1].kind).toBe('abbreviation');
    }
  });

  const variants: [string, string[], number | null][] = [
    ['record(2)', ['record'], 2],
    ['read(1)', ['read'], 1],
    ['record (2)', ['record', 'two'], null],
    ['record(0)', ['record', 'zero'], null],
    ['record(10)', ['record', 'ten'], null],
  ];
  it.each(variants)('variant marks: %j', (input, w, variant) => {
    const tokens = check(input, w);
    expect(tokens[0].variant).toBe(variant);
    if (variant !== null) expect(tokens[0].surface).toBe(input);
  });

  it('a variant mark is not a phrase break', () => {
    check('I record(2) songs (often)', words('i record songs often'), ['songs', 'often']);
  });

  const skipped: Case[] = [
    ['hello \u{1f600} world', words('hello world')],
    ['* bullet # tag and/or', words('bullet tag and or')],
    ['\u{1f44d}\u{1f3fd}!', []],
  ];
  it.each(skipped)('skips unspoken symbols: %j', (input, w, b) => void check(input, w, b));

  it('reports exact offsets, shifted by the offset argument', () => {
    const text = '\u{1f600} Dr. Lee\u2019s 3:30 caf\u00e9';
    const tokens = tokenize(text, 100);
    expect(tokens.map((t) => [t.surface, t.start, t.end])).toEqual([
      ['Dr.', 103, 106],
      ['Lee\u2019s', 107, 112],
      ['3:30', 113, 117],
      ['caf\u00e9', 118, 122],
    ]);
  });

  it('counts spoken words for pacing: each hyphen part, no symbols', () => {
    expect(spokenWordCount(tokenize('My mother-in-law arrives at 3:30 p.m. \u{1f600} *'))).toBe(10);
    expect(spokenWordCount([])).toBe(0);
  });

  it('never throws on random Unicode and keeps offsets exact (seeded)', () => {
    const random = mulberry32(0x5eed);
    const pieces = ["'", '\u2019', '-', '--', '.', ',', ':', '$', '%', '(', ')', '(2)', ' ', '3', '12', 'a', 'St', 'e.g.', 'pm', '\u0301', '\ud800', '\udc00'];
    for (let round = 0; round < 2000; round++) {
      let text = '';
      const length = Math.floor(random() * 24);
      for (let k = 0; k < length; k++) {
        const r = random();
        if (r < 0.4) text += pieces[Math.floor(random() * pieces.length)];
        else if (r < 0.7) text += String.fromCharCode(Math.floor(random() * 0x80));
        else text += String.fromCodePoint(Math.floor(random() * 0x110000));
      }
      const tokens = tokenize(text, 3);
      checkOffsets(text, tokens, 3);
      for (const t of tokens) for (const w of t.words) expect(w.length).toBeGreaterThan(0);
    }
  });

  // Speed is measured by `npm run bench`, not here; this checks the generated corpus tokenises whole.
  it('tokenises 10,000 generated sentences into spoken words', () => {
    const lines = generatedSentences(10_000, mulberry32(42));
    let spoken = 0;
    for (const line of lines) spoken += spokenWordCount(tokenize(line));
    expect(spoken).toBeGreaterThan(10_000 * 4);
  });
});
