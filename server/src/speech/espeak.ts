// eSpeak NG, called as a program found on PATH (never bundled): one short recording per word, read
// back with wavefile. Everything stays on this machine. The recordings are trimmed here once and
// kept per word and rate, so a word said on many items is synthesised once.
import { spawnSync } from 'node:child_process';
import { accessSync, constants, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { delimiter, join } from 'node:path';
import { WaveFile } from 'wavefile';
import { trimSilence } from '../core/audio/modelSpeech';

export const ESPEAK = 'espeak-ng';

/** The exact message when eSpeak NG is missing (the command then exits 2). */
export const ESPEAK_MISSING =
  'espeak-ng was not found on PATH. Install it with "sudo apt-get install espeak-ng" (Debian, Ubuntu), then run the command again.';

/** The first executable called `name` on PATH, or null. */
export function findOnPath(name: string, env: Record<string, string | undefined> = process.env): string | null {
  for (const dir of (env.PATH ?? '').split(delimiter)) {
    if (!dir) continue;
    const candidate = join(dir, name);
    try {
      accessSync(candidate, constants.X_OK);
      return candidate;
    } catch {
      // not here
    }
  }
  return null;
}

/** eSpeak voice names are letters, digits and - + _ (e.g. en-us, en-gb+f3). */
export function validVoice(voice: string): boolean {
  return /^[A-Za-z0-9][A-Za-z0-9+_-]{0,40}$/.test(voice);
}

/**
 * The `-s` rate (words per minute) to ask for a given word rate. eSpeak speaks 22-34 % faster than
 * asked on short items (measured), so it is asked for less; 80 is its floor. Rounded to tens so
 * recordings are shared between nearby paces; the time-stretch does the rest.
 */
export function espeakRate(wordsPerSecond: number): number {
  const s = Math.round((60 * wordsPerSecond) / 1.28 / 10) * 10;
  return Math.min(450, Math.max(80, s));
}

export class Synthesiser {
  private readonly cache = new Map<string, Float32Array>();
  private readonly dir = mkdtempSync(join(tmpdir(), 'rungs-speech-'));
  sampleRate = 22050;
  calls = 0;

  constructor(
    private readonly program: string,
    private readonly voice = 'en-us',
  ) {}

  /** The trimmed recording of one written word at a rate; throws when eSpeak fails. */
  word(text: string, wordsPerSecond: number): Float32Array {
    const spoken = text.replace(/\(\d+\)$/, '');
    const rate = espeakRate(wordsPerSecond);
    const key = `${rate}|${spoken}`;
    const hit = this.cache.get(key);
    if (hit) return hit;
    const file = join(this.dir, `w${this.calls++}.wav`);
    // Text goes on standard input, so a word can never be read as an option.
    const r = spawnSync(this.program, ['-v', this.voice, '-s', String(rate), '-z', '-w', file], { input: spoken, encoding: 'utf8' });
    if (r.error || r.status !== 0) {
      throw new Error(`espeak-ng failed on "${spoken}": ${r.error?.message ?? r.stderr.trim() ?? `exit ${r.status}`}`);
    }
    const { samples, sampleRate } = decodeWav(readFileSync(file));
    this.sampleRate = sampleRate;
    const clip = trimSilence(samples, sampleRate);
    this.cache.set(key, clip);
    return clip;
  }

  dispose(): void {
    rmSync(this.dir, { recursive: true, force: true });
  }
}

/** Mono 16-bit WAV bytes of samples in -1..1. */
export function encodeWav(samples: Float32Array, sampleRate: number): Uint8Array {
  const pcm = Int16Array.from(samples, (x) => Math.round(Math.max(-1, Math.min(1, x)) * 32767));
  const wav = new WaveFile();
  wav.fromScratch(1, sampleRate, '16', pcm);
  return wav.toBuffer();
}

/** Samples in -1..1 and the rate of a mono 16-bit WAV. */
export function decodeWav(bytes: Uint8Array): { samples: Float32Array; sampleRate: number } {
  const wav = new WaveFile(bytes);
  const raw = wav.getSamples(false, Float64Array) as unknown as Float64Array;
  return { samples: Float32Array.from(raw, (x) => x / 32768), sampleRate: (wav.fmt as { sampleRate: number }).sampleRate };
}
