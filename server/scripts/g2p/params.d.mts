export const PARAMS: Record<string, unknown>;
