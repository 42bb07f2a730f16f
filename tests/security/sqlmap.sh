#!/usr/bin/env bash
# SQL injection probe on loopback: the app (Release, production settings, a fresh SQLite database with the demo data,
# or PostgreSQL when CAPREVIEW_LOAD_POSTGRES gives a connection string) and sqlmap from Debian (apt-get install
# sqlmap) against every API parameter (route values, query strings, JSON members) and the sign-in form. Fails when
# sqlmap reports any injectable parameter. Run by hand; the last results are in docs/security.md.
#   tests/security/sqlmap.sh [level] [risk]
set -euo pipefail
cd "$(dirname "$0")/../.."
level="${1:-3}" risk="${2:-2}" port=5098
source tests/load/app.sh
export ASPNETCORE_ENVIRONMENT=Production Demo__Enabled=true AllowedHosts='*' RateLimits__ApiPerMinute=10000000 RateLimits__SignInPerMinute=10000000 \
  ReverseProxy__KnownProxies__0=127.0.0.1
if [ -n "${CAPREVIEW_LOAD_POSTGRES:-}" ]; then
  export Storage__Provider=PostgreSql ConnectionStrings__CapReview="$CAPREVIEW_LOAD_POSTGRES"
else
  export ConnectionStrings__CapReview="Data Source=$work/sqlmap.db"
fi
start_app "$port"
token() { (cd "$work/app" && dotnet CapReview.Web.dll issue-token --email "$1" --token-name sqlmap | grep -o 'crv_[A-Za-z0-9_-]*' | head -n 1); }
admin="$(token ines.varga@tarnby.example)" lead="$(token oskar.lind@tarnby.example)" finance="$(token rui.costa@tarnby.example)"
base="http://127.0.0.1:$port"
# As the TLS proxy in front would say (loopback is listed as the known proxy above); production answers plain HTTP with a redirect.
proxied=(-H "X-Forwarded-Proto: https")
cycle="$(curl -fs "${proxied[@]}" -H "Authorization: Bearer $finance" "$base/api/v1/cycles" | grep -o '"id":[0-9]*' | tail -n 1 | cut -d: -f2)"
proposal="$(curl -fs "${proxied[@]}" -H "Authorization: Bearer $lead" "$base/api/v1/proposals" | grep -o '"id":[0-9]*' | head -n 1 | cut -d: -f2)"
echo "probing cycle $cycle and proposal $proposal at level $level, risk $risk"

report="$work/sqlmap"
probe() { # probe NAME TOKEN sqlmap-arguments…
  local name="$1" bearer="$2"; shift 2
  echo "== $name"
  sqlmap --batch --level="$level" --risk="$risk" --output-dir="$report/$name" --disable-coloring --ignore-code=400,404,409,415,422 \
    "${proxied[@]}" -H "Authorization: Bearer $bearer" "$@" 2>&1 | tee "$report-$name.log" | grep -E "all tested|injection point|[0-9]{3} \(.*\) - [0-9]+ times|CRITICAL" || true
}
mkdir -p "$report"
# A route value marked with * is probed alone, so the query string has a probe of its own.
# The administrator's token: finance sees a cycle's ranking only once it is decided.
probe ranking-query "$admin" -u "$base/api/v1/cycles/$cycle/ranking?shift=1&limit=1500000&objective=annualWorth&basis=afterTax"
probe ranking-route "$admin" -u "$base/api/v1/cycles/$cycle*/ranking"
probe proposal "$lead" -u "$base/api/v1/proposals/$proposal*"
probe version "$lead" -u "$base/api/v1/proposals/$proposal*/versions/1*"
probe document "$admin" -u "$base/api/v1/cycles/$cycle*/document"
probe packets "$finance" -u "$base/api/v1/cycles/$cycle*/packets"
probe evaluation "$lead" -u "$base/api/v1/evaluations" -H "Content-Type: application/json" \
  --data '{"horizon":6,"rate":{"value":0.08,"basis":"effective"},"elements":[{"type":"single","label":"Forklift","category":"capital","period":0,"amount":-42000},{"type":"uniform","label":"Hire avoided","category":"revenue","first":1,"last":6,"amount":11500}]}'
probe draft "$lead" -u "$base/api/v1/proposals" -H "Content-Type: application/json" \
  --data '{"title":"Probe","description":"Probe","category":"costReduction","riskClass":"low","assumptions":{"model":{"horizon":5,"elements":[{"type":"single","label":"Survey","category":"capital","period":0,"amount":-14000},{"type":"uniform","label":"Saved","category":"operating","first":1,"last":5,"amount":4200}]}}}'
probe signin "$lead" -u "$base/signin" --data "_handler=signin&Input.Email=probe%40tarnby.example&Input.Password=wrong-password&__RequestVerificationToken=x" \
  --csrf-token=__RequestVerificationToken --csrf-url="$base/signin" -p "Input.Email,Input.Password"

if grep -lE "is vulnerable|identified the following injection point" "$report"-*.log; then
  echo "sqlmap found an injectable parameter (logs above)"; exit 1
fi
if grep -lE "^5[0-9]{2} \(.*\) - [0-9]+ times" "$report"-*.log; then
  echo "the app answered a probe with a 5xx (logs above)"; exit 1
fi
echo "sqlmap: no injectable parameter in $(ls "$report"-*.log | wc -l) probes"
