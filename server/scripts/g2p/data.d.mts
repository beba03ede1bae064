export function fnv1a(text: string): number;
export function part(word: string): 'test' | 'dev' | 'train';
export const SPELLING: RegExp;
export function entries(dictionary: Record<string, string>): Map<string, string[][]>;
