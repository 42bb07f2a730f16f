#!/usr/bin/env bash
# A bounded load test on loopback: the app (Release, production settings, a fresh SQLite database, or PostgreSQL
# when CAPREVIEW_LOAD_POSTGRES gives a connection string) and wrk from Debian (apt-get install wrk), 50 connections
# for 60 s against POST /api/v1/evaluations. Target: no errors, p99 under 100 ms. Figures go to docs/benchmarks.md.
#   tests/load/run.sh [connections] [seconds]
set -euo pipefail
cd "$(dirname "$0")/../.."
connections="${1:-50}" seconds="${2:-60}" port=5099
source tests/load/app.sh
# Loopback stands for the TLS proxy in front (evaluation.lua sends its X-Forwarded-Proto); it is believed only when listed.
export ASPNETCORE_ENVIRONMENT=Production Demo__Enabled=false AllowedHosts='*' RateLimits__ApiPerMinute=10000000 ReverseProxy__KnownProxies__0=127.0.0.1
if [ -n "${CAPREVIEW_LOAD_POSTGRES:-}" ]; then
  export Storage__Provider=PostgreSql ConnectionStrings__CapReview="$CAPREVIEW_LOAD_POSTGRES"
else
  export ConnectionStrings__CapReview="Data Source=$work/load.db"
fi
( cd "$work/app" && dotnet CapReview.Web.dll create-admin --email load@example.test --name "Load Test" --password steady-lantern-2027 >/dev/null )
token="$(cd "$work/app" && dotnet CapReview.Web.dll issue-token --email load@example.test --token-name load | grep -o 'crv_[A-Za-z0-9_-]*' | head -n 1)"
start_app "$port"

# Warm-up (JIT, connection pools), then the measured run.
CAPREVIEW_TOKEN="$token" wrk -t2 -c"$connections" -d10s -s tests/load/evaluation.lua "http://127.0.0.1:$port/api/v1/evaluations" >/dev/null
CAPREVIEW_TOKEN="$token" wrk -t2 -c"$connections" -d"${seconds}s" --latency -s tests/load/evaluation.lua "http://127.0.0.1:$port/api/v1/evaluations"
echo "app resident memory: $(ps -o rss= -p "$(pgrep -P "$app" -f CapReview.Web.dll || echo "$app")" | awk '{printf "%.0f MB", $1/1024}')"
