# Sourced by the load scripts: publishes the app in Release into a temporary folder ($work) and starts it on
# loopback with the environment the caller exported; the app and the folder go when the script ends.
work="$(mktemp -d)"
trap 'kill "${app:-0}" 2>/dev/null || true; rm -rf "$work"' EXIT
dotnet publish src/CapReview.Web -c Release -r linux-x64 --self-contained false -o "$work/app" --nologo -v quiet

# start_app PORT: runs the published app there and waits until it is ready.
start_app() {
  ( cd "$work/app" && exec dotnet CapReview.Web.dll --urls "http://127.0.0.1:$1" >"$work/app.log" 2>&1 ) & app=$!
  for _ in $(seq 1 60); do curl -fs "http://127.0.0.1:$1/health/ready" >/dev/null && return 0; sleep 1; done
  echo "the app did not become ready; its log:"; cat "$work/app.log"; return 1
}
