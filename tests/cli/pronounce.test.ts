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

  it('exits 2 without words, and says when no estimate exists', async () => {
    const none = await run(['pronounce']);
    expect(none.code).toBe(2);
    expect((await run(['pronounce', '--estimate', 'ωμέγα'])).out).toBe('ωμέγα\t(no estimate: no letter-to-sound rule applies)\n');
  });
});
