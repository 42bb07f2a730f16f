#!/usr/bin/env bash
# A bounded load test of the ranking page on loopback: the app (Release, production settings, demo data in a fresh
# SQLite database), a board member signed in through the real form, then wrk (Debian) with that cookie, 50
# connections for 60 s against GET /cycles/{id}/ranking (the server-rendered page, every measure computed).
#   tests/load/ranking.sh [connections] [seconds]
set -euo pipefail
cd "$(dirname "$0")/../.."
connections="${1:-50}" seconds="${2:-60}" port=5098
source tests/load/app.sh
export ASPNETCORE_ENVIRONMENT=Production Demo__Enabled=true AllowedHosts='*' ConnectionStrings__CapReview="Data Source=$work/load.db"
start_app "$port"

jar="$work/cookies"
token="$(curl -fs -c "$jar" "http://127.0.0.1:$port/signin" | grep -o 'name="__RequestVerificationToken" value="[^"]*"' | head -n 1 | sed 's/.*value="//; s/"$//')"
curl -fs -b "$jar" -c "$jar" -o /dev/null --data-urlencode "__RequestVerificationToken=$token" --data-urlencode "_handler=signin" \
  --data-urlencode "Input.Email=tove.berg@tarnby.example" --data-urlencode "Input.Password=tarnby-demo-2027" "http://127.0.0.1:$port/signin"
cookie="capreview=$(awk '$6 == "capreview" { print $7 }' "$jar")"
cycle="$(curl -fs -b "$jar" "http://127.0.0.1:$port/cycles" | grep -o 'href="cycles/[0-9]*"' | head -n 1 | grep -o '[0-9]*')"
status="$(curl -s -o /dev/null -w '%{http_code}' -H "Cookie: $cookie" "http://127.0.0.1:$port/cycles/$cycle/ranking")"
[ "$status" = 200 ] || { echo "the ranking page answered $status"; exit 1; }

wrk -t2 -c"$connections" -d10s -H "Cookie: $cookie" "http://127.0.0.1:$port/cycles/$cycle/ranking" >/dev/null
wrk -t2 -c"$connections" -d"${seconds}s" --latency -H "Cookie: $cookie" "http://127.0.0.1:$port/cycles/$cycle/ranking"
