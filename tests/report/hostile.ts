// Text a script, a note, a set label, a client code or a file name might hold that would run or
// inject markup if it were not escaped (payloads after the OWASP XSS filter evasion examples;
// from memory). Each one sets window.pwned if it ever runs.
export const HOSTILE = {
  script: '</script><script>window.pwned=1</script>',
  img: '<img src=x onerror="window.pwned=1">',
  quotes: `"' onmouseover='window.pwned=1`,
  amp: 'Tom & Jerry &amp; &lt;b&gt;',
};

/** A script with hostile text in its title, items, notes and set labels. */
export const HOSTILE_SCRIPT = [
  `@title ${HOSTILE.script} ${HOSTILE.amp}`,
  '@paces 1 wps',
  `== Rung ${HOSTILE.img}`,
  `Pass the bread ${HOSTILE.img} please. | note ${HOSTILE.script} @set <b>&"x"`,
  `Tom & Jerry say ${HOSTILE.quotes} hello. | ${HOSTILE.amp} @set ${HOSTILE.script}`,
  'Good morning to you.',
  '',
].join('\n');

/** A file name holding markup (no slash, so it is a valid name on every system). */
export const HOSTILE_FILE = `&'<img src=x onerror=window.pwned=1>".rungs`;

/** A client code holding markup, quotes and an ampersand. */
export const HOSTILE_CLIENT = `C-<img src=x onerror=window.pwned=1>&"'`;

const cell = (s: string) => `"${s.replace(/"/g, '""')}"`;

/** Rate records of that client on the hostile script's first rung (invented demo data). */
export const HOSTILE_RECORDS = [
  'date,client,script,rung,condition,words,seconds,correct,note',
  `2026-01-05,${cell(HOSTILE_CLIENT)},,,unassisted,20,30,,`,
  `2026-01-05,${cell(HOSTILE_CLIENT)},${cell(HOSTILE_FILE)},1,paced,26,30,24,${cell(HOSTILE.script)}`,
  `2026-01-08,${cell(HOSTILE_CLIENT)},${cell(HOSTILE_FILE)},1,paced,27,30,25,`,
  '',
].join('\n');
