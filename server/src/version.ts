// The one version string of Rungs (CLI `--version`, JSON/SARIF output, the server's serverInfo).
// A test checks it equals package.json's version.
export const VERSION = '0.1.0';
