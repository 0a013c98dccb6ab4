#!/bin/sh
# `npm run -s solve -- FILE [options]`: runs the command line (scripts/solve.ts) from its startup
# snapshot, rebuilding it first when it is missing or older than a source file or the installed packages.
root=$(cd "$(dirname "$0")/.." && pwd)
blob="$root/node_modules/.cache/portfold/solve.blob"
if [ ! -f "$blob" ] || [ -n "$(find "$root/shared" "$root/scripts/solve.ts" "$root/scripts/solve-remote.ts" "$root/node_modules/.package-lock.json" -newer "$blob" -print 2>/dev/null | head -n 1)" ]; then
  node "$root/scripts/build-solve.mjs" || exit 1
fi
exec node --snapshot-blob "$blob" -- "$@"
