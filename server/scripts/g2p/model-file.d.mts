export const ROOT: string;
export const MODEL_PATH: string;
export const FORMAT: number;
export const INPUT_FILES: string[];
export function inputsChecksum(params: unknown): string;
export function modelText(header: Record<string, unknown>, entries: unknown[]): string;
