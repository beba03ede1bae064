#!/usr/bin/env bash
# Installs code-server 4.100.3 (a VS Code 1.100 workbench served to a browser) from npm into
# .cache/code-server, for the real-workbench test (tests/editors/workbench.test.ts). It is a test
# tool, not a project dependency. Idempotent: a finished install is left alone.
# Usage: tests/editors/install-code-server.sh [DEST]   (default: <repo>/.cache/code-server)
#
# Four workarounds make it install on Debian 12 + Node 20 as root with only the npm registry and
# Debian's packages reachable:
#   1. kerberos (a native dependency) needs the gssapi headers: libkrb5-dev and pkg-config.
#   2. @vscode/ripgrep's postinstall downloads a binary; it looks in a local cache first, which we
#      seed with Debian's ripgrep (13.0.0, the same version it wants).
#   3. code-server's postinstall refuses root unless npm_config_unsafe_perm=true.
#   4. node-pty's postinstall runs `npx node-gyp`, which needs npm_config_yes=true.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
DEST=${1:-$ROOT/.cache/code-server}
VERSION=4.100.3
BIN=$DEST/node_modules/.bin/code-server

if [ -x "$BIN" ] && [ -f "$DEST/.installed-$VERSION" ]; then
  echo "code-server $VERSION already installed in $DEST"
  exit 0
fi

if command -v apt-get >/dev/null 2>&1; then
  missing=()
  for p in build-essential python3 pkg-config libkrb5-dev ripgrep; do
    dpkg -s "$p" >/dev/null 2>&1 || missing+=("$p")
  done
  if [ ${#missing[@]} -gt 0 ]; then
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null
  fi
fi
command -v rg >/dev/null 2>&1 || { echo "ripgrep (rg) is needed to seed @vscode/ripgrep's cache" >&2; exit 1; }

mkdir -p "$DEST"
export TMPDIR=$DEST/tmp
RG_CACHE=$TMPDIR/vscode-ripgrep-cache-1.15.11
mkdir -p "$RG_CACHE" "$TMPDIR/rgstage"
cp "$(command -v rg)" "$TMPDIR/rgstage/rg"
tar czf "$RG_CACHE/ripgrep-v13.0.0-10-x86_64-unknown-linux-musl.tar.gz" -C "$TMPDIR/rgstage" rg

cd "$DEST"
[ -f package.json ] || npm init -y >/dev/null
export npm_config_unsafe_perm=true npm_config_yes=true
echo "installing code-server $VERSION into $DEST (about 1.5 minutes)"
if ! npm install --no-audit --no-fund "code-server@$VERSION" --foreground-scripts >"$DEST/install.log" 2>&1; then
  tail -40 "$DEST/install.log" >&2
  exit 1
fi
# Keep --version from writing ~/.config/code-server/config.yaml.
XDG_CONFIG_HOME=$DEST/xdg XDG_DATA_HOME=$DEST/xdg "$BIN" --config "$DEST/xdg/config.yaml" --version
touch "$DEST/.installed-$VERSION"
