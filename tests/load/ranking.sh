#!/usr/bin/env bash
# A bounded load test of the ranking page on loopback: the app (Release, production settings, demo data in a fresh
# SQLite database), a board member signed in through the real form, then wrk (Debian) with that cookie, 50
# connections for 60 s against GET /cycles/{id}/ranking (the server-rendered page, every measure computed).
#   tests/load/ranking.sh [connections] [seconds]
set -euo pipefail
cd "$(dirname "$0")/../.."
connections="${1:-50}" seconds="${2:-60}" port=5098
source tests/load/app.sh
# The demo's accounts have no authenticator app; the page's speed, not the sign-in, is measured.
export ASPNETCORE_ENVIRONMENT=Production Demo__Enabled=true AllowedHosts='*' Security__RequireTwoFactor=false ConnectionStrings__CapReview="Data Source=$work/load.db" \
  ReverseProxy__KnownProxies__0=127.0.0.1
start_app "$port"

# As the TLS proxy would (loopback is listed as the known proxy above): the request came over HTTPS, so production's __Host- cookies
# are set; they are passed on by hand since curl keeps secure cookies for HTTPS addresses.
base="http://127.0.0.1:$port" proxied=(-H "X-Forwarded-Proto: https")
token="$(curl -fs -D "$work/form-headers" "${proxied[@]}" "$base/signin" | grep -o 'name="__RequestVerificationToken" value="[^"]*"' | head -n 1 | sed 's/.*value="//; s/"$//')"
form_cookie="$(grep -io '^set-cookie: __Host-capreview-form=[^;]*' "$work/form-headers" | cut -d' ' -f2)"
curl -fs -D "$work/signin-headers" -o /dev/null "${proxied[@]}" -H "Cookie: $form_cookie" --data-urlencode "__RequestVerificationToken=$token" --data-urlencode "_handler=signin" \
  --data-urlencode "Input.Email=tove.berg@tarnby.example" --data-urlencode "Input.Password=tarnby-demo-2027" "$base/signin"
cookie="$(grep -io '^set-cookie: __Host-capreview=[^;]*' "$work/signin-headers" | cut -d' ' -f2)"
cycle="$(curl -fs "${proxied[@]}" -H "Cookie: $cookie" "$base/cycles" | grep -o 'href="cycles/[0-9]*"' | head -n 1 | grep -o '[0-9]*')"
status="$(curl -s -o /dev/null -w '%{http_code}' "${proxied[@]}" -H "Cookie: $cookie" "$base/cycles/$cycle/ranking")"
[ "$status" = 200 ] || { echo "the ranking page answered $status"; exit 1; }

wrk -t2 -c"$connections" -d10s "${proxied[@]}" -H "Cookie: $cookie" "$base/cycles/$cycle/ranking" >/dev/null
wrk -t2 -c"$connections" -d"${seconds}s" --latency "${proxied[@]}" -H "Cookie: $cookie" "$base/cycles/$cycle/ranking"
