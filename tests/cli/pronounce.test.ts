// `rungs pronounce`: pronunciation and source per word, and --estimate skipping the dictionary.
// Dictionary phones are from the CMU Pronouncing Dictionary 0.7b via npm
// cmu-pronouncing-dictionary@3.0.0.
import { describe, expect, it } from 'vitest';
import { main } from '../../server/src/cli/main';
import { estimatePronunciation } from '../../server/src/core/lts/estimate';
import { words } from '../helpers/data';
import { MemFs } from './memfs';

async function run(argv: string[]) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: '/clinic', fs: new MemFs({}), stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} });
  return { code, out, err };
}

describe('rungs pronounce', () => {
  it('prints a listed word from the dictionary, with IPA and syllables', async () => {
    const r = await run(['pronounce', 'Breakfast']);
    expect(r.code).toBe(0);
    expect(r.out).toBe('breakfast\tB R EH1 K F AH0 S T\t/ˈbɹɛkfəst/\t2 syllables\tCMU Pronouncing Dictionary\n');
  });

  it('marks an unlisted name as estimated and lists the ranked alternatives', async () => {
    const r = await run(['pronounce', 'teodric']);
    const [first, ...alternatives] = r.out.trimEnd().split('\n');
    const est = estimatePronunciation('teodric', words);
    expect(first).toContain(`teodric\t${est.phones.join(' ')}\t`);
    expect(first).toContain('≈ estimated: estimate (joint-sequence model)');
    expect(alternatives).toHaveLength(5);
    expect(alternatives[0]).toMatch(new RegExp(`^  1\\. ${est.phones.join(' ')} +\\d+ %   log10 p -\\d+\\.\\d\\d$`));
  });

  it('says why an alternative with a higher share ranks lower (not one main stress)', async () => {
    const est = estimatePronunciation('wintermoss', words);
    const r = await run(['pronounce', 'wintermoss']);
    const rows = r.out.trimEnd().split('\n').slice(1);
    expect(rows).toHaveLength(est.alternatives.length);
    est.alternatives.forEach((c, i) => {
      const n = c.phones.filter((p) => p.endsWith('1')).length;
      if (n === 1) expect(rows[i]).toMatch(/log10 p -\d+\.\d\d$/);
      else expect(rows[i]).toContain(n === 0 ? '(no main stress: ranked after readings with one)' : `(${n} main stresses: ranked after readings with one)`);
    });
    // The case that needs the note: a two-stress reading holds most of the share yet ranks last.
    expect(rows.some((row) => row.includes('2 main stresses'))).toBe(true);
  });

  it('with --estimate skips the dictionary even for a listed word', async () => {
    const r = await run(['pronounce', '--estimate', 'cat']);
    expect(r.out.split('\n')[0]).toMatch(/^cat\t[A-Z0-9 ]+\t.*≈ estimated: estimate \(joint-sequence model\)$/);
    // A short regular word the model reads as the dictionary lists it.
    expect(r.out.split('\n')[0]).toContain('\tK AE1 T\t');
  });

  it('looks a word up as a script does: accents folded (the dictionary spells "cafe")', async () => {
    // CMU: cafe K AH0 F EY1 (and K AE0 F EY1), jose HH OW0 Z EY1, naive N AY2 IY1 V.
    for (const [raw, plain] of [['Café', 'cafe'], ['José', 'jose']]) {
      const accented = (await run(['pronounce', raw])).out;
      const bare = (await run(['pronounce', plain])).out;
      expect(accented).toBe(bare.replace(`${plain}\t`, `${raw} (as ${plain})\t`));
      expect(accented).toContain('CMU Pronouncing Dictionary');
    }
    expect((await run(['pronounce', 'café'])).out).toMatch(/\t2 syllables\t/);
    // A diaeresis between two vowels is kept (core/hiatus.ts); "naive" is listed with them apart.
    const naive = (await run(['pronounce', 'naïve'])).out;
    expect(naive).toBe((await run(['pronounce', 'naive'])).out.replace('naive\t', 'naïve\t'));
    expect(naive).toContain('CMU Pronouncing Dictionary');
    // The estimator reads it with the vowels apart: two syllables for "zoë".
    expect((await run(['pronounce', '--estimate', 'Zoë'])).out.split('\n')[0]).toMatch(/^zoë\t.*\t2 syllables\t.*said apart\)$/);
  });

  it('reads a word as a script item does: abbreviations, numbers, hyphens, variant marks', async () => {
    // Dictionary phones: doctor D AA1 K T ER0; three TH R IY1; thirty TH ER1 D IY2; mother
    // M AH1 DH ER0; law L AO1; read(2) R IY1 D (the second listed).
    const lines = (await run(['pronounce', 'Dr.', '3:30', 'mother-in-law', 'read(2)'])).out.split('\n').filter((l) => l && !l.startsWith(' '));
    expect(lines.map((l) => l.split('\t').slice(0, 2).join('\t'))).toEqual([
      'Dr. (as doctor)\tD AA1 K T ER0',
      '3:30 (as three)\tTH R IY1',
      '3:30 (as thirty)\tTH ER1 D IY2',
      'mother-in-law (as mother)\tM AH1 DH ER0',
      'mother-in-law (as in)\tIH0 N',
      'mother-in-law (as law)\tL AO1',
      'read(2) (as read)\tR IY1 D',
    ]);
  });

  it('estimates nothing for a word with no letter', async () => {
    for (const flags of [[], ['--estimate']]) {
      expect((await run(['pronounce', ...flags, "'"])).out).toBe("'\t(no words to say)\n");
    }
    expect(estimatePronunciation("''", words).phones).toEqual([]);
  });

  it('exits 2 without words, and says when no estimate exists', async () => {
    const none = await run(['pronounce']);
    expect(none.code).toBe(2);
    expect((await run(['pronounce', '--estimate', 'ωμέγα'])).out).toBe('ωμέγα\t(no estimate: no letter-to-sound rule applies)\n');
  });
});
