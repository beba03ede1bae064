// The parts of webvtt-parser 2.2.0 (plain JavaScript, no typings) that the tests use.
declare module 'webvtt-parser' {
  export interface VttNode {
    type: string;
    value?: unknown;
    name?: string;
    children?: VttNode[];
  }
  export interface VttCue {
    id: string;
    startTime: number;
    endTime: number;
    text: string;
    tree: { children: VttNode[] };
  }
  export interface VttTree {
    cues: VttCue[];
    errors: { message: string; line: number; col: number }[];
  }
  export class WebVTTParser {
    constructor(entities?: Record<string, string>);
    parse(input: string, mode?: string): VttTree;
  }
}
