#!/bin/sh
# A shop's script against the JSON API (docs/api.md): list engines, read a plan with its estimate,
# sweep its torque, log a dyno run, read the run log, then show a refusal and a conditional read.
# Usage: SW_TOKEN=swt_… SW_URL=http://localhost:3000 sh scripts/api-example.sh   (needs curl and jq)
set -eu
: "${SW_TOKEN:?make a token in Settings → API tokens}"
URL="${SW_URL:-http://localhost:3000}"
auth="Authorization: Bearer $SW_TOKEN"

echo "== engines (2 of them)"
curl -sf -H "$auth" "$URL/api/v1/engines?limit=2" | jq -c '{total, nextPage, items: [.items[] | {id, name, boreMm, targetManifoldKpa, chosenPlanName}]}'
engine=$(curl -sf -H "$auth" "$URL/api/v1/engines?q=four" | jq '.items[0].id')

echo "== plans of engine $engine"
curl -sf -H "$auth" "$URL/api/v1/engines/$engine/plans" | jq -c '.items[] | {id, name, torqueNm, chosen}'
plan=$(curl -sf -H "$auth" "$URL/api/v1/engines/$engine/plans" | jq '.items[0].id')

echo "== plan $plan with its estimate"
curl -sf -H "$auth" "$URL/api/v1/engines/$engine/plans/$plan" > /tmp/sw-plan.json
jq -c '{torqueNm: .estimate.torqueNm, verdict: .estimate.estimate.verdict.status, weakestMargin: .estimate.estimate.weakestMargin, ceilingNm: .estimate.ceiling.torqueNm}' /tmp/sw-plan.json

echo "== sweep 60 to 140 N·m"
jq '{input: .input, fromNm: 60, toNm: 140, points: 5}' /tmp/sw-plan.json |
  curl -sf -H "$auth" -H 'Content-Type: application/json' --data @- "$URL/api/v1/sweep" |
  jq -c '.points[] | {torqueNm, preloadKn: (.preloadN / 1000 | . * 10 | round / 10), weakestMargin: (.weakestMargin * 100 | round / 100)}'

echo "== log a dyno run"
curl -s -H "$auth" -H 'Content-Type: application/json' -w ' → %{http_code}\n' \
  --data "{\"engineId\":$engine,\"ranOn\":\"2026-12-01\",\"kind\":\"dyno\",\"manifoldPressureKpa\":250,\"fuel\":\"E85\",\"outcome\":\"held\",\"notes\":\"demo pull\"}" \
  "$URL/api/v1/runs"

echo "== run log of engine $engine"
curl -s -H "$auth" "$URL/api/v1/runs?engineId=$engine&limit=5" | jq -c '.'

echo "== a refusal: an unknown field"
curl -s -H "$auth" -H 'Content-Type: application/json' -w ' → %{http_code}\n' \
  --data "{\"engineId\":$engine,\"ranOn\":\"2026-12-01\",\"kind\":\"dyno\",\"outcome\":\"held\",\"colour\":\"red\"}" "$URL/api/v1/runs"

echo "== read again with the ETag"
etag=$(curl -sI -H "$auth" "$URL/api/v1/engines/$engine" | tr -d '\r' | sed -n 's/^[Ee][Tt]ag: //p')
curl -s -o /dev/null -H "$auth" -H "If-None-Match: $etag" -w "If-None-Match $etag → %{http_code}\n" "$URL/api/v1/engines/$engine"
