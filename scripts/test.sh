#!/usr/bin/env bash
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/bootstrap.sh --browser
exec node --import tsx dev-services/test-run.ts "$@"
