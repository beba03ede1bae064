// Rule documentation: the one place that says where a rule's docs live, and the README rule list
// generated from rule metadata (a test checks the README holds exactly this text).
import type { Rule } from './types';

/** Base of every rule's docs link (LSP codeDescription, SARIF helpUri); change it here only. */
export const RULE_DOCS_BASE = 'https://github.com/rungs-project/rungs/blob/main/README.md';

/** The HTML anchor of a rule's section in the README. */
export const ruleAnchor = (id: string): string => `rule-${id}`;

export function ruleDocsUrl(id: string): string {
  return `${RULE_DOCS_BASE}#${ruleAnchor(id)}`;
}

const CATEGORY_TITLES: Record<Rule['category'], string> = {
  ladder: 'Ladder shape',
  item: 'Items',
  pace: 'Paces',
  format: 'The format itself',
  records: 'Rate records',
};

/** The Markdown between `<!-- rules:start -->` and `<!-- rules:end -->` in the README. */
export function rulesMarkdown(rules: Rule[]): string {
  const out: string[] = [
    '<!-- Generated from rule metadata (server/src/rules/*.ts); `RUNGS_UPDATE_README=1 npx vitest run',
    '     --config tests/vitest.config.ts tests/rules/docs.test.ts` rewrites it. Do not edit by hand. -->',
    '',
    '| rule | category | default | summary |',
    '|---|---|---|---|',
  ];
  for (const r of rules) out.push(`| [\`${r.id}\`](#${ruleAnchor(r.id)}) | ${r.category} | ${r.defaultSeverity} | ${r.summary.replace(/\|/g, '\\|')} |`);
  for (const cat of Object.keys(CATEGORY_TITLES) as Rule['category'][]) {
    const inCat = rules.filter((r) => r.category === cat);
    if (!inCat.length) continue;
    out.push('', `### ${CATEGORY_TITLES[cat]}`);
    for (const r of inCat) {
      out.push('', `<a id="${ruleAnchor(r.id)}"></a>`, `#### \`${r.id}\` (${r.defaultSeverity})`, '', r.summary, '', r.docs);
    }
  }
  return out.join('\n');
}
