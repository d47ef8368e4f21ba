#!/usr/bin/env bash
# `npm run test:pg`: the API test suite once more, against a throw-away PostgreSQL cluster
# (Debian's postgresql package) on 127.0.0.1. Each test file gets a database of its own.
set -euo pipefail
cd "$(dirname "$0")/.."
dir=$(mktemp -d /tmp/binwright-pg.XXXXXX)
trap 'scripts/pg-cluster.sh stop "$dir"' EXIT
url=$(scripts/pg-cluster.sh start "$dir")
echo "PostgreSQL test cluster at $url"
TEST_PG_URL="$url" npx vitest run --project api "$@"
