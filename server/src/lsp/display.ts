// How numbers and text are shown in hovers, inlay hints, code lenses and symbols, so every view
// shows the same digits.
import { formatNumber } from '../core/pace';
import { ESTIMATED_MARK } from './contract';

export { ESTIMATED_MARK };

/** Seconds: "2 s", "1.33 s". */
export const secs = (n: number): string => `${formatNumber(n, 2)} s`;
/** Difficulty, one decimal as the score table shows it. */
export const diff = (n: number): string => formatNumber(n, 1);
/** Zipf and Lg10WF, two decimals always ("5.28"). */
export const two = (n: number): string => n.toFixed(2);
export const rate = (n: number): string => formatNumber(n, 2);
/** A difficulty, marked "≈" when it rests on `estimated` estimated pronunciations (0: unmarked). */
export const diffMarked = (n: number, estimated: number): string => `${estimated > 0 ? ESTIMATED_MARK : ''}${diff(n)}`;
/** "1 word with an estimated pronunciation", "3 words with an estimated pronunciation". */
export const estimatedWords = (n: number): string => `${n} word${n === 1 ? '' : 's'} with an estimated pronunciation`;
/** Signed difference: "+12.3", "-4". */
export const signed = (n: number): string => `${n >= 0 ? '+' : ''}${formatNumber(n, 1)}`;
/** Minutes and seconds for long totals: "95 s (1 min 35 s)". */
export function total(n: number): string {
  if (n < 60) return secs(n);
  const m = Math.floor(n / 60);
  const s = Math.round(n - m * 60);
  return `${secs(n)} (${m} min ${s} s)`;
}
/** Escapes text for a Markdown table cell or inline use. */
export function md(text: string): string {
  return text.replace(/([\\`*_{}[\]<>|#])/g, '\\$1');
}
