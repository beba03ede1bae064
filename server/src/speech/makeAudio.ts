// `rungs audio` and the editor's "Make model audio" share this: for each rung of a plan, one WAV of
// the whole rung (items, gaps and any echo windows) with its WebVTT, and one WAV per item with its
// WebVTT; then the word onsets of every rung file are detected and compared with the plan.
import { join } from 'node:path';
import { combineMeasurements, detectSegments, measureAgainstPlan, type PlanMeasurement } from '../core/audio/onsets';
import { renderItems } from '../core/audio/modelSpeech';
import { renderVtt } from '../core/cues';
import { planSession, type DeliveryMode, type PlannedItem, type SessionPlan } from '../core/timing';
import type { Analysis, Pace } from '../core/types';
import { encodeWav, Synthesiser } from './espeak';

export interface AudioRequest {
  analysis: Analysis;
  /** Rungs to render (indices); each is planned on its own from time 0. */
  rungs: number[];
  pace: Pace | null;
  mode: DeliveryMode;
  outDir: string;
  program: string;
  voice: string;
  writeBytes(path: string, bytes: Uint8Array | string): void;
}

export interface AudioFile {
  path: string;
  kind: 'rung' | 'item';
  seconds: number;
  /** For item files: the item's rung index and 0-based line. */
  item?: { rung: number; line: number };
}

export interface AudioResult {
  files: AudioFile[];
  /** Every rung file measured against its plan. */
  measurement: PlanMeasurement;
  /** Per rung: its name, pace and measurement. */
  rungs: { name: string; pace: string; measurement: PlanMeasurement }[];
  espeakCalls: number;
}

/** "greetings", "plans-for-the-day": a safe file name part. */
export function slug(text: string): string {
  const s = text.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40);
  return s || 'rung';
}

/** An item as a plan of its own, starting at 0. */
function alone(item: PlannedItem, plan: SessionPlan): SessionPlan {
  const by = item.start;
  const shifted: PlannedItem = {
    ...item,
    start: 0,
    end: item.end - by,
    response: item.response && { start: item.response.start - by, end: item.response.end - by },
    words: item.words.map((w) => ({ ...w, onset: w.onset - by, offset: w.offset - by })),
  };
  const end = shifted.response?.end ?? shifted.end;
  return { ...plan, rungs: [], items: [shifted], seconds: end };
}

/** A little silence after the last word, so players do not cut the end. */
const TAIL = 0.5;

export function makeModelAudio(req: AudioRequest): AudioResult {
  const synth = new Synthesiser(req.program, req.voice);
  const files: AudioFile[] = [];
  const rungs: AudioResult['rungs'] = [];
  try {
    for (const index of req.rungs) {
      const plan = planSession(req.analysis, { rung: index, pace: req.pace ?? undefined, mode: req.mode });
      if (!plan.items.length) continue;
      const rung = plan.rungs[0];
      const clipFor = (w: PlannedItem['words'][number], item: PlannedItem) => {
        const spokenSeconds = item.words.reduce((s, x) => s + (x.offset - x.onset), 0);
        const wordRate = item.words.reduce((s, x) => s + x.words, 0) / spokenSeconds;
        return synth.word(w.text, wordRate);
      };
      // The first word fixes the sample rate of every file.
      clipFor(plan.items[0].words[0], plan.items[0]);
      const sr = synth.sampleRate;
      const base = `rung-${index + 1}-${slug(rung.name)}`;
      const samples = renderItems(plan.items, clipFor, sr, 0, plan.seconds + TAIL);
      const rungWav = join(req.outDir, `${base}.wav`);
      req.writeBytes(rungWav, encodeWav(samples, sr));
      req.writeBytes(join(req.outDir, `${base}.vtt`), renderVtt(plan, `Rungs model audio: rung ${index + 1} "${rung.name}" at ${rung.pace.label}, ${req.mode}`));
      files.push({ path: rungWav, kind: 'rung', seconds: samples.length / sr });
      const measurement = measureAgainstPlan(plan, detectSegments(samples, sr));
      rungs.push({ name: rung.name, pace: rung.pace.label, measurement });
      plan.items.forEach((item, k) => {
        const one = alone(item, plan);
        const name = `${base}-${String(k + 1).padStart(2, '0')}-${item.id ? slug(item.id) : `line-${item.line + 1}`}`;
        const itemSamples = renderItems(one.items, clipFor, sr, 0, one.seconds + TAIL);
        const path = join(req.outDir, `${name}.wav`);
        req.writeBytes(path, encodeWav(itemSamples, sr));
        req.writeBytes(join(req.outDir, `${name}.vtt`), renderVtt(one));
        files.push({ path, kind: 'item', seconds: itemSamples.length / sr, item: { rung: index, line: item.line } });
      });
    }
  } finally {
    synth.dispose();
  }
  return { files, measurement: combineMeasurements(rungs.map((r) => r.measurement)), rungs, espeakCalls: synth.calls };
}

/**
 * The model audio of every item of `plan` as WAV bytes, made in memory (no files), in plan order:
 * what the practice page embeds.
 */
export function audioPerItem(req: Omit<AudioRequest, 'outDir' | 'writeBytes' | 'rungs'>, plan: SessionPlan): (Uint8Array | null)[] {
  const bytes = new Map<string, Uint8Array>();
  const result = makeModelAudio({
    ...req,
    rungs: plan.rungs.map((r) => r.index),
    outDir: '/',
    writeBytes: (path, b) => {
      if (typeof b !== 'string') bytes.set(path, b);
    },
  });
  const byItem = new Map(result.files.filter((f) => f.item).map((f) => [`${f.item!.rung}:${f.item!.line}`, bytes.get(f.path) ?? null]));
  return plan.items.map((it) => byItem.get(`${it.rung}:${it.line}`) ?? null);
}
