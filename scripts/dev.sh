#!/usr/bin/env bash
# The API from `npm start`'s services (without building the client) plus Vite's dev server with hot reload.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/bootstrap.sh
KERF_SKIP_BUILD=1 node --import tsx dev-services/start.ts &
api=$!
trap 'kill $api 2>/dev/null; wait $api 2>/dev/null' EXIT INT TERM
npx vite
