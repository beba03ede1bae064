// Letter-to-sound rules for words the CMU Pronouncing Dictionary does not list.
//
// Source: H. S. Elovitz, R. W. Johnson, A. McHugh and J. E. Shore, "Letter-to-sound rules for
// automatic translation of English text to phonetics", IEEE Trans. Acoustics, Speech, and Signal
// Processing 24(6), 446-459, December 1976; also NRL Report 7948, "Automatic translation of
// English text to phonetics by means of letter-to-sound rules", Naval Research Laboratory,
// Washington DC, 21 January 1976 (approved for public release; NTIS AD/A021 929).
//
// Each rule is written as published, `A[B]C=D`: the letters B, seen with left context A and right
// context C, sound as D. Rules are grouped by the first letter of B and tried in order; the first
// whose contexts match wins, and translation resumes after B. The phones D are written in the
// report's own phone set and translated to CMU ARPAbet once, by `NRL_TO_CMU` below, when this
// module loads, so every exported output is a CMU phone.
//
// Context symbols (as defined in the report):
//   ' '  word boundary              #  one or more vowels            *  one or more consonants
//   .    a voiced consonant (B D V G J L M N R W Z)                  ^  exactly one consonant
//   $    one consonant followed by E or I                            +  a front vowel (E I Y)
//   :    zero or more consonants    %  a suffix: ER E ES ED ING ELY (right context only)
//   &    a sibilant (S C G Z X J CH SH)
//   @    a consonant after which long U loses its glide (T S R D L Z N J TH CH SH)
// Vowels are A E I O U; Y counts as a consonant in contexts.
//
// The table below has 312 rules: the report's rules written with its @ and & classes. The report
// counts 329; the difference has not been reconciled rule by rule against the scanned report.
//
// Departures from the report are kept apart, in `AMENDMENTS`, each with its reason; they are tried
// before the published rules of the same letter. None of them names a particular word. The rule
// engine (letterToSound.ts) departs in four documented ways too: the % suffix must end the word,
// Y after a consonant counts as a vowel in contexts, a doubled consonant sounds once, and a
// spelling with no vowel letter is read as letter names. Each was kept because it raised the
// syllable-count agreement with the CMU dictionary over all its plain words.

/** One parsed rule. Letters are upper case; `phones` are CMU ARPAbet (see `NRL_TO_CMU`). */
export interface LtsRule {
  left: string;
  match: string;
  right: string;
  phones: string[];
  /** The rule as written in this file, for explanations and tests. */
  source: string;
}

/**
 * The report's phone symbols that differ from CMU ARPAbet, and what they become. The report's
 * reduced vowel AX (schwa) becomes AH with stress 0 already set, so the stress heuristic never
 * puts primary stress on it; J is the report's affricate of "jar" (CMU JH); WH is the voiceless
 * labial-velar of "where", which CMU transcribes as plain W. Every other symbol is shared. The
 * report writes r-coloured schwa as ER, as CMU does, so no AX R -> ER rewrite is needed.
 */
export const NRL_TO_CMU: Readonly<Record<string, string>> = {
  AX: 'AH0',
  J: 'JH',
  WH: 'W',
};

/** The published rules, grouped by the first letter of the bracketed part. */
export const NRL_RULES: Readonly<Record<string, readonly string[]>> = {
  "'": [".['S]=Z", "#:.E['S]=Z", "#['S]=Z", "[']="],
  A: [
    '[A] =AX', ' [ARE] =AA R', ' [AR]O=AX R', '[AR]#=EH R', '^[AS]#=EY S', '[A]WA=AX', '[AW]=AO',
    ' :[ANY]=EH N IY', '[A]^+#=EY', '#:[ALLY]=AX L IY', ' [AL]#=AX L', '[AGAIN]=AX G EH N',
    '#:[AG]E=IH J', '[A]^+:#=AE', ' :[A]^+ =EY', '[A]^%=EY', ' [ARR]=AX R', '[ARR]=AE R',
    ' :[AR] =AA R', '[AR] =ER', '[AR]=AA R', '[AIR]=EH R', '[AI]=EY', '[AY]=EY', '[AU]=AO',
    '#:[AL] =AX L', '#:[ALS] =AX L Z', '[ALK]=AO K', '[AL]^=AO L', ' :[ABLE]=EY B AX L',
    '[ABLE]=AX B AX L', '[ANG]+=EY N J', '[A]=AE',
  ],
  B: [' [BE]^#=B IH', '[BEING]=B IY IH NG', ' [BOTH] =B OW TH', ' [BUS]#=B IH Z', '[BUIL]=B IH L', '[B]=B'],
  C: [
    ' [CH]^=K', '^E[CH]=K', '[CH]=CH', ' S[CI]#=S AY', '[CI]A=SH', '[CI]O=SH', '[CI]EN=SH',
    '[C]+=S', '[CK]=K', '[COM]%=K AH M', '[C]=K',
  ],
  D: [
    '#:[DED] =D IH D', '.E[D] =D', '#:^E[D] =T', ' [DE]^#=D IH', ' [DO] =D UW', ' [DOES]=D AH Z',
    ' [DOING]=D UW IH NG', ' [DOW]=D AW', '[DU]A=J UW', '[D]=D',
  ],
  E: [
    '#:[E] =', "':^[E] =", ' :[E] =IY', '#[ED] =D', '#:[E]D =', '[EV]ER=EH V', '[E]^%=IY',
    '[ERI]#=IY R IY', '[ERI]=EH R IH', '#:[ER]#=ER', '[ER]#=EH R', '[ER]=ER', ' [EVEN]=IY V EH N',
    '#:[E]W=', '@[EW]=UW', '[EW]=Y UW', '[E]O=IY', '#:&[ES] =IH Z', '#:[E]S =', '#:[ELY] =L IY',
    '#:[EMENT]=M EH N T', '[EFUL]=F UH L', '[EE]=IY', '[EARN]=ER N', ' [EAR]^=ER', '[EAD]=EH D',
    '#:[EA] =IY AX', '[EA]SU=EH', '[EA]=IY', '[EIGH]=EY', '[EI]=IY', ' [EYE]=AY', '[EY]=IY',
    '[EU]=Y UW', '[E]=EH',
  ],
  F: ['[FUL]=F UH L', '[F]=F'],
  G: [
    '[GIV]=G IH V', ' [G]I^=G', '[GE]T=G EH', 'SU[GGES]=G J EH S', '[GG]=G', ' B#[G]=G', '[G]+=J',
    '[GREAT]=G R EY T', '#[GH]=', '[G]=G',
  ],
  H: [' [HAV]=HH AE V', ' [HERE]=HH IY R', ' [HOUR]=AW ER', '[HOW]=HH AW', '[H]#=HH', '[H]='],
  I: [
    ' [IN]=IH N', ' [I] =AY', '[IN]D=AY N', '[IER]=IY ER', '#:R[IED]=IY D', '[IED] =AY D',
    '[IEN]=IY EH N', '[IE]T=AY EH', ' :[I]%=AY', '[I]%=IY', '[IE]=IY', '[I]^+:#=IH', '[IR]#=AY R',
    '[IZ]%=AY Z', '[IS]%=AY Z', '[I]D%=AY', '+^[I]^+=IH', '[I]T%=AY', '#:^[I]^+=IH', '[I]^+=AY',
    '[IR]=ER', '[IGH]=AY', '[ILD]=AY L D', '[IGN] =AY N', '[IGN]^=AY N', '[IGN]%=AY N',
    '[IQUE]=IY K', '[I]=IH',
  ],
  J: ['[J]=J'],
  K: [' [K]N=', '[K]=K'],
  L: ['[LO]C#=L OW', 'L[L]=', '#:^[L]%=AX L', '[LEAD]=L IY D', '[L]=L'],
  M: ['[MOV]=M UW V', '[M]=M'],
  N: [
    'E[NG]+=N J', '[NG]R=NG G', '[NG]#=NG G', '[NGL]%=NG G AX L', '[NG]=NG', '[NK]=NG K',
    ' [NOW] =N AW', '[N]=N',
  ],
  O: [
    '[OF] =AX V', '[OROUGH]=ER OW', '#:[OR] =ER', '#:[ORS] =ER Z', '[OR]=AO R', ' [ONE]=W AH N',
    '[OW]=OW', ' [OVER]=OW V ER', '[OV]=AH V', '[O]^%=OW', '[O]^EN=OW', '[O]^I#=OW', '[OL]D=OW L',
    '[OUGHT]=AO T', '[OUGH]=AH F', ' [OU]=AW', 'H[OU]S#=AW', '[OUS]=AX S', '[OUR]=AO R',
    '[OULD]=UH D', '^[OU]^L=AH', '[OUP]=UW P', '[OU]=AW', '[OY]=OY', '[OING]=OW IH NG', '[OI]=OY',
    '[OOR]=AO R', '[OOK]=UH K', '[OOD]=UH D', '[OO]=UW', '[O]E=OW', '[O] =OW', '[OA]=OW',
    ' [ONLY]=OW N L IY', ' [ONCE]=W AH N S', "[ON'T]=OW N T", 'C[O]N=AA', '[O]NG=AO',
    ' :^[O]N=AH', 'I[ON]=AX N', '#:[ON] =AX N', '#^[ON]=AX N', '[O]ST =OW', '[OF]^=AO F',
    '[OTHER]=AH DH ER', '[OSS] =AO S', '#:^[OM]=AH M', '[O]=AA',
  ],
  P: ['[PH]=F', '[PEOP]=P IY P', '[POW]=P AW', '[PUT] =P UH T', '[P]=P'],
  Q: ['[QUAR]=K W AO R', '[QU]=K W', '[Q]=K'],
  R: [' [RE]^#=R IY', '[R]=R'],
  S: [
    '[SH]=SH', '#[SION]=ZH AX N', '[SOME]=S AH M', '#[SUR]#=ZH ER', '[SUR]#=SH ER', '#[SU]#=ZH UW',
    '#[SSU]#=SH UW', '#[SED] =Z D', '#[S]#=Z', '[SAID]=S EH D', '^[SION]=SH AX N', '[S]S=',
    '.[S] =Z', '#:.E[S] =Z', '#:^##[S] =Z', '#:^#[S] =S', 'U[S] =S', ' :#[S] =Z', ' [SCH]=S K',
    '[S]C+=', '#[SM]=Z M', "#[SN]'=Z AX N", '[S]=S',
  ],
  T: [
    ' [THE] =DH AX', '[TO] =T UW', '[THAT] =DH AE T', ' [THIS] =DH IH S', ' [THEY]=DH EY',
    ' [THERE]=DH EH R', '[THER]=DH ER', '[THEIR]=DH EH R', ' [THAN] =DH AE N', ' [THEM] =DH EH M',
    '[THESE] =DH IY Z', ' [THEN]=DH EH N', '[THROUGH]=TH R UW', '[THOSE]=DH OW Z',
    '[THOUGH] =DH OW', ' [THUS]=DH AH S', '[TH]=TH', '#:[TED] =T IH D', 'S[TI]#N=CH', '[TI]O=SH',
    '[TI]A=SH', '[TIEN]=SH AX N', '[TUR]#=CH ER', '[TU]A=CH UW', ' [TWO]=T UW', '[T]=T',
  ],
  U: [
    ' [UN]I=Y UW N', ' [UN]=AH N', ' [UPON]=AX P AO N', '@[UR]#=UH R', '[UR]#=Y UH R', '[UR]=ER',
    '[U]^ =AH', '[U]^^=AH', '[UY]=AY', ' G[U]#=', 'G[U]%=', 'G[U]#=W', '#N[U]=Y UW', '@[U]=UW',
    '[U]=Y UW',
  ],
  V: ['[VIEW]=V Y UW', '[V]=V'],
  W: [
    ' [WERE]=W ER', '[WA]S=W AA', '[WA]T=W AA', '[WHERE]=WH EH R', '[WHAT]=WH AA T',
    '[WHOL]=HH OW L', '[WHO]=HH UW', '[WH]=WH', '[WAR]=W AO R', '[WOR]^=W ER', '[WR]=R', '[W]=W',
  ],
  X: ['[X]=K S'],
  Y: [
    '[YOUNG]=Y AH NG', ' [YOU]=Y UW', ' [YES]=Y EH S', ' [Y]=Y', '#:^[Y] =IY', '#:^[Y]I=IY',
    ' :[Y] =AY', ' :[Y]#=AY', ' :[Y]^+:#=IH', ' :[Y]^#=AY', '[Y]=IH',
  ],
  Z: ['[Z]=Z'],
};

/**
 * Rules added by Rungs, tried before the published rules of their letter. Each fixes a whole class
 * of spellings the report's rules miss, found by measuring against the CMU dictionary.
 */
export const AMENDMENTS: Readonly<Record<string, readonly string[]>> = {
  A: [
    // Doubled A is one vowel ("bazaar", "aardvark", and many Dutch and Afrikaans names).
    '[AA]=AA',
    // A before -sion is long (invasion, occasion); the report's AS rule takes the s from -sion.
    '^[A]SION=EY',
    // AE spells one vowel (aerial, caesar, graeme).
    '[AE]=EH',
    // AY is a vowel digraph before any context rule can read the Y as a consonant (bayer, layer).
    '[AY]=EY',
    // -ically keeps no syllable for its -al- (basically = B EY1 S IH0 K L IY0).
    'IC[ALLY] =L IY',
  ],
  C: [
    // -ceous is one syllable (herbaceous, cretaceous).
    '[CEOUS]=SH AX S',
  ],
  D: [
    // D before a soft G is silent: the DG of judge, edge, budget is one affricate.
    '[D]G+=',
  ],
  E: [
    // EAU(X) is one vowel (plateau, bureau, and many French names).
    '[EAUX]=OW', '[EAU]=OW',
    // EY is a vowel digraph before any context rule can read the Y as a consonant (meyer).
    ' [EYE]=AY', '[EY]=IY',
    // An e between a consonant and final -man is silent (foreman, sideman, lindeman).
    '#:^[E]MAN =',
  ],
  G: [
    // -geous is one syllable (gorgeous, courageous).
    '[GEOUS]=JH AX S',
    // -geon after a vowel and consonants is JH + schwa (pigeon, dungeon, surgeon).
    '#:[GEON]=JH AX N',
  ],
  I: [
    // After a double L, -ion is a glide and a schwa (million, billion, stallion).
    'LL[I]ON=Y',
  ],
  O: [
    // OE before two consonants or an H is one vowel (mostly German names: roessner, koehn).
    '[OE]^^=OW', '[OE]H=OW',
    // OY is a vowel digraph before any context rule can read the Y as a consonant (boyer).
    '[OY]=OY',
  ],
  U: [
    // UI after consonants before T, CE or SE is one vowel (fruit, suit, juice, cruise).
    ' :[UI]T=UW', ' :[UI]CE=UW S', ' :[UI]SE=UW Z',
  ],
  M: [
    // The Gaelic name prefix Mc- is a syllable of its own, "mac" (mcbride = M AH0 K B R AY1 D).
    ' [MCG]=M AX G', ' [MC]=M AX K',
  ],
  L: [
    // A consonant + -ler, -ling or -ley reads without a schwa before the l (butler, darling,
    // parsley); the report's L-suffix rule gives these an extra syllable.
    '#:^[L]ER=L', '#:^[L]ING=L', '#:^[L]EY=L',
  ],
  Y: [
    // Y between a consonant and a vowel, after the first syllable, is the glide /j/ (canyon).
    '#:^[Y]A=Y', '#:^[Y]O=Y',
  ],
  S: [
    // Final -ism and -asm end in a syllable of their own (racism = R EY1 S IH0 Z AH0 M).
    '#[SM] =Z AX M',
  ],
};

/** Names of the letters in CMU phones, for spellings read letter by letter (abbreviations). */
export const LETTER_NAMES: Readonly<Record<string, readonly string[]>> = {
  A: ['EY1'], B: ['B', 'IY1'], C: ['S', 'IY1'], D: ['D', 'IY1'], E: ['IY1'], F: ['EH1', 'F'],
  G: ['JH', 'IY1'], H: ['EY1', 'CH'], I: ['AY1'], J: ['JH', 'EY1'], K: ['K', 'EY1'], L: ['EH1', 'L'],
  M: ['EH1', 'M'], N: ['EH1', 'N'], O: ['OW1'], P: ['P', 'IY1'], Q: ['K', 'Y', 'UW1'], R: ['AA1', 'R'],
  S: ['EH1', 'S'], T: ['T', 'IY1'], U: ['Y', 'UW1'], V: ['V', 'IY1'],
  W: ['D', 'AH1', 'B', 'AH0', 'L', 'Y', 'UW0'], X: ['EH1', 'K', 'S'], Y: ['W', 'AY1'], Z: ['Z', 'IY1'],
};

function parseRule(source: string): LtsRule {
  const open = source.indexOf('[');
  const close = source.indexOf(']', open);
  const equals = source.indexOf('=', close);
  if (open < 0 || close < 0 || equals < 0) throw new Error(`Malformed letter-to-sound rule: ${source}`);
  const phones = source
    .slice(equals + 1)
    .split(/\s+/)
    .filter((p) => p !== '')
    .map((p) => NRL_TO_CMU[p] ?? p);
  return {
    left: source.slice(0, open),
    match: source.slice(open + 1, close),
    right: source.slice(close + 1, equals),
    phones,
    source,
  };
}

function buildTable(): ReadonlyMap<string, readonly LtsRule[]> {
  const table = new Map<string, LtsRule[]>();
  for (const group of [AMENDMENTS, NRL_RULES]) {
    for (const [letter, rules] of Object.entries(group)) {
      const list = table.get(letter) ?? [];
      list.push(...rules.map(parseRule));
      table.set(letter, list);
    }
  }
  return table;
}

/** All rules, amendments first, keyed by the first letter of the bracketed part (upper case). */
export const LTS_RULES: ReadonlyMap<string, readonly LtsRule[]> = buildTable();
