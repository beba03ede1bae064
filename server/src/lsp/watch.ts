// Which files the server asks the client to watch, and how URIs from the client become paths.
// Pure functions: the server registers the watchers and filters the changes it is sent.
import { basename, dirname } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { FileSystemWatcher } from 'vscode-languageserver/node';
import { CONFIG_FILE_NAMES } from '../config/resolve';
import { uriToPath } from '../node/nodeFs';

/**
 * Config files are watched by name everywhere (a new one in any folder may apply to a script);
 * lexicons are watched by the paths the open scripts' configs resolved them to (fileWatchers).
 */
export const CONFIG_GLOB = `**/{${CONFIG_FILE_NAMES.join(',')}}`;

/**
 * Records files and scripts are watched too: rung hovers show the latest ratios from the records
 * on disk (and the scripts they name), kept in memory until a change is reported.
 */
export const RECORDS_AND_SCRIPTS_GLOB = '**/*.{rungs,rates.csv,rates.tsv}';

export const isConfigFile = (path: string): boolean => CONFIG_FILE_NAMES.includes(basename(path));

/** Glob metacharacters in a file name matched literally. */
const globLiteral = (name: string): string => name.replace(/[*?[\]{}]/g, (c) => `[${c}]`);

/**
 * The watchers to register: config files by name, and each lexicon file the open scripts use.
 * Without relative-pattern support a lexicon is watched by its name anywhere in the workspace;
 * the server then checks the full path of every change (AnalysisStore.dependsOn).
 */
export function fileWatchers(lexiconPaths: string[], relativePatterns: boolean): FileSystemWatcher[] {
  const lexicons = lexiconPaths.map((p): FileSystemWatcher =>
    relativePatterns
      ? { globPattern: { baseUri: pathToFileURL(dirname(p)).href, pattern: globLiteral(basename(p)) } }
      : { globPattern: `**/${globLiteral(basename(p))}` },
  );
  return [{ globPattern: CONFIG_GLOB }, { globPattern: RECORDS_AND_SCRIPTS_GLOB }, ...lexicons];
}

/** File-system paths of file: URIs (others have none). */
export function uriPaths(uris: string[]): string[] {
  return uris.flatMap((u) => {
    const p = uriToPath(u);
    return p ? [p] : [];
  });
}
