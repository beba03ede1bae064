// A generated script for the incremental and performance tests.
export const SENTENCES = [
  'Good morning.', 'Pass the bread, please. | @set trained', 'I kept a record(2) of it.', 'Where is my cup? #cup',
  'We met Dr. Okafor at 3:30.', 'The orthodontist recommended periodontal treatment.', 'Teodric plays the clarinet.',
  'My granddaughter visits every Sunday afternoon.', 'Hi.', 'read(7) this',
];

export function bigScript(items: number, perRung = 500): string {
  const lines = ['// generated', '@title Big', '@paces 1, 1.5, 2 wps', '@baseline 0.8 wps', '@say Okafor = OW0 K AA1 F AO0 R'];
  for (let i = 0; i < items; i++) {
    if (i % perRung === 0) lines.push('', `== Level ${i / perRung + 1}${i % 1000 === 0 ? ' @pace 1.2 wps' : ''}`);
    lines.push(`${SENTENCES[(i * 7) % SENTENCES.length]} item ${i % 97}`);
  }
  return `${lines.join('\n')}\n`;
}


/** The benchmark's own generated script (tests/bench/generate.mjs), so timings compare with it. */
export async function benchScript(items: number): Promise<string> {
  const path = new URL('../bench/generate.mjs', import.meta.url).href;
  const mod = (await import(path)) as { generateScript(n: number): string };
  return mod.generateScript(items);
}
