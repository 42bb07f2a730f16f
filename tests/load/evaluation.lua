-- wrk script: POST the forklift model of docs/api.md to the evaluation API with the token in CAPREVIEW_TOKEN,
-- and count every answer that is not 200 (wrk's own "Non-2xx" line counts 4xx and 5xx too).
wrk.method = "POST"
wrk.headers["Content-Type"] = "application/json"
wrk.headers["Authorization"] = "Bearer " .. os.getenv("CAPREVIEW_TOKEN")
-- As the TLS proxy in front would say (run.sh lists loopback as the known proxy); production answers plain HTTP with a redirect.
wrk.headers["X-Forwarded-Proto"] = "https"
wrk.body = [[{
  "horizon": 10,
  "rate": { "value": 0.1 },
  "elements": [
    { "type": "single", "label": "Forklift", "category": "capital", "period": 0, "amount": -48000 },
    { "type": "uniform", "label": "Hire charges avoided", "category": "revenue", "first": 1, "last": 10, "amount": 11500 },
    { "type": "arithmetic", "label": "Maintenance", "category": "operating", "first": 1, "last": 10, "amount": -900, "step": -120 },
    { "type": "single", "label": "Resale", "category": "salvage", "period": 10, "amount": 6000 }
  ]
}]]

local failures = 0
response = function(status, headers, body)
  if status ~= 200 then failures = failures + 1 end
end

done = function(summary, latency, requests)
  io.write(string.format("requests %d, errors %d (socket) + %d (status), p50 %.2f ms, p99 %.2f ms, max %.2f ms\n",
    summary.requests, summary.errors.connect + summary.errors.read + summary.errors.write + summary.errors.timeout,
    failures, latency:percentile(50) / 1000, latency:percentile(99) / 1000, latency.max / 1000))
end
