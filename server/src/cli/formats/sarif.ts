// SARIF 2.1.0 (OASIS) for code-scanning dashboards: every rule once under tool.driver.rules with
// its docs link, every problem a result pointing at its rule by id and index. Columns are UTF-16
// code units, as the core counts them; regions are 1-based with an exclusive end column.
import type { Problem, Range, Severity } from '../../core/types';
import { ruleDocsUrl } from '../../rules/docs';
import type { Rule } from '../../rules/types';
import type { LintRun } from './types';

export const SARIF_SCHEMA = 'https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json';
const LEVEL: Record<Severity, 'error' | 'warning' | 'note'> = { error: 'error', warning: 'warning', info: 'note', hint: 'note' };

/** The one place 0-based ranges become SARIF regions. */
export function toSarifRegion(r: Range) {
  return { startLine: r.line + 1, startColumn: r.character + 1, endLine: r.endLine + 1, endColumn: r.endCharacter + 1 };
}

const camel = (id: string) => id.replace(/(^|-)([a-z])/g, (_m, _d, c: string) => c.toUpperCase());

function location(uri: string, r: Range, message?: string) {
  return {
    physicalLocation: { artifactLocation: { uri, uriBaseId: '%SRCROOT%' }, region: toSarifRegion(r) },
    ...(message ? { message: { text: message } } : {}),
  };
}

function result(p: Problem, uri: string, index: Map<string, number>) {
  return {
    ruleId: p.rule,
    ...(index.has(p.rule) ? { ruleIndex: index.get(p.rule) } : {}),
    level: LEVEL[p.severity],
    message: { text: p.message },
    locations: [location(uri, p)],
    ...(p.related?.length ? { relatedLocations: p.related.map((r, i) => ({ id: i + 1, ...location(uri, r, r.message) })) } : {}),
    ...(p.fix
      ? {
          fixes: [
            {
              description: { text: p.fix.title },
              artifactChanges: [
                {
                  artifactLocation: { uri, uriBaseId: '%SRCROOT%' },
                  replacements: p.fix.edits.map((e) => ({ deletedRegion: toSarifRegion(e), insertedContent: { text: e.newText } })),
                },
              ],
            },
          ],
        }
      : {}),
  };
}

/** A file shown as `sample-scripts/a b.rungs` becomes the URI reference `sample-scripts/a%20b.rungs`. */
export const toUri = (file: string) => (file === '<stdin>' ? 'stdin' : encodeURI(file));

export function formatSarif(run: LintRun, rules: Rule[]): string {
  const index = new Map(rules.map((r, i) => [r.id, i]));
  const log = {
    $schema: SARIF_SCHEMA,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: 'rungs',
            version: run.version,
            informationUri: ruleDocsUrl('').replace(/#rule-$/, ''),
            rules: rules.map((r) => ({
              id: r.id,
              name: camel(r.id),
              shortDescription: { text: r.summary },
              fullDescription: { text: r.docs },
              helpUri: ruleDocsUrl(r.id),
              help: { text: r.docs },
              defaultConfiguration: { level: LEVEL[r.defaultSeverity] },
              properties: { category: r.category },
            })),
          },
        },
        columnKind: 'utf16CodeUnits',
        originalUriBaseIds: { '%SRCROOT%': { description: { text: 'The folder rungs lint ran in.' } } },
        results: run.results.flatMap((f) => f.problems.map((p) => result(p, toUri(f.file), index))),
      },
    ],
  };
  return `${JSON.stringify(log, null, 2)}\n`;
}
