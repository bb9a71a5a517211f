#!/usr/bin/env bash
# Sweepline rig loop in bash + curl.
#
#   export SWEEPLINE_BASE_URL=http://127.0.0.1:4620     # your Sweepline server
#   export SWEEPLINE_API_KEY=swl_test_...                # a key with captures:write, analyses:write/read
#   ./rig-loop.sh run path/to/capture.wav                # the whole loop
#   ./rig-loop.sh verify-webhook --body-file body.json   # check one received webhook (see below)
#
# Needs: bash, coreutils, sed, grep (all in a Debian base system) and curl; verify-webhook also needs openssl
# (Debian: apt-get install curl openssl). JSON is read with jq when installed, else python3; without either the
# script still runs the loop and prints the analysis as raw JSON.
#
# The loop: create a sweep stimulus -> download its WAV -> (the rig plays it and records the DUT) -> upload the
# capture -> ask for an analysis and wait for it -> print the headline figures and the verdict.
#
# Every POST that creates something carries an Idempotency-Key. If the line drops and the script retries, it
# sends the *same* key, so the server replays its first answer instead of creating a second stimulus, capture or
# analysis. A new key is made only for a genuinely new request.
set -euo pipefail
set -f # no globbing: signature lists and JSON pass through unquoted word splitting below
export LC_NUMERIC=C # printf '%.2f' with a decimal point whatever the locale

# --- What this rig measures. Edit for your set-up. ------------------------------------------------------------
# The capture you upload must be a recording of exactly this stimulus (same rate, length and sweep): the server
# regenerates the sweep from these parameters to deconvolve the capture.
STIMULUS_JSON='{"type":"sweep","name":"KB-65 woofer sweep 20 Hz - 20 kHz","parameters":{"startHz":20,"stopHz":20000,"approximateDurationSeconds":2,"sampleRateHz":48000,"levelDbfs":-12}}'
CHANNELS_JSON='{"measurement":0,"reference":1}' # capture channel roles: microphone, loopback (null if none)
CONDITIONS_JSON='{"distanceM":1.0,"driveVoltageVrms":2.83,"nominalImpedanceOhm":8,"temperatureC":20}'
DUT_MODEL=${SWEEPLINE_DUT_MODEL:-KB-65 woofer}
DUT_SERIAL=${SWEEPLINE_DUT_SERIAL:-KB65-24-000123}
DUT_LOT=${SWEEPLINE_DUT_LOT:-KB65-L24-07}
TAGS_JSON='["line-1"]'
# response_and_distortion takes {"response":{...},"distortion":{...}}; {} = engine defaults (see the API reference).
OPTIONS_JSON='{}'
# Where the downloaded stimulus WAV is saved for the rig's player.
STIMULUS_DIR=${SWEEPLINE_STIMULUS_DIR:-.}
# How long the analysis POST may wait for the result (Prefer: wait=N, at most 60 s); 0 = answer 202 at once and poll.
WAIT_SECONDS=${SWEEPLINE_WAIT_SECONDS:-10}

POLL_DEADLINE_SECONDS=300
MAX_TRIES=5 # per request, for dropped connections, 409 (still running), 429 and 5xx
TOLERANCE_SECONDS=300

WORK=$(mktemp -d)
trap 'rm -rf "$WORK"' EXIT

have() { command -v "$1" >/dev/null 2>&1; }
die() { echo "$*" >&2; exit 2; }

new_idempotency_key() {
  if [ -r /proc/sys/kernel/random/uuid ]; then cat /proc/sys/kernel/random/uuid
  elif have uuidgen; then uuidgen
  else od -An -N16 -tx1 /dev/urandom | tr -d ' \n' | sed 's/^\(.\{8\}\)\(.\{4\}\).\(.\{3\}\)\(.\{4\}\)/\1-\2-4\3-\4-/'
  fi
}

# json_get FILE PATH: one value at a dotted PATH (e.g. .id, .error.title); empty when absent. Arrays print one
# item per line.
json_get() {
  if have jq; then jq -r "$2 // empty | if type==\"array\" then .[] else . end" "$1"
  elif have python3; then
    python3 -c 'import json,sys
v=json.load(open(sys.argv[1]))
for k in [p for p in sys.argv[2].split(".") if p]:
    v=v.get(k) if isinstance(v,dict) else None
for x in (v if isinstance(v,list) else [] if v is None else [v]):
    print(json.dumps(x) if isinstance(x,(dict,list)) else x)' "$1" "$2"
  else # last resort: the first "key":"text" pair anywhere in the document
    local key=${2##*.}
    sed -n 's/.*"'"$key"'"[[:space:]]*:[[:space:]]*"\([^"]*\)".*/\1/p' "$1" | head -n 1
  fi
}

# headline_records FILE: the headline figures of a finished analysis as tab-separated records, one per line:
#   R levelDb description | L dropDb lowerStatus lowerValue upperStatus upperValue | M magnitudeReference |
#   T name summary valuePercent frequencyHz isUpperBound | D delayMs polarity | V verdict | W code message
# A band edge's value is frequencyHz (found), measuredEdgeHz (beyond_measured_range) or atHz (outside_at_reference_band).
headline_records() {
  if have jq; then
    jq -r '
      def edge: [.status, (.frequencyHz // .measuredEdgeHz // .atHz)];
      (.result.figures // {}) as $f | (.result.conventions // {}) as $c |
      (if $f.bandLimits then
         ["R", $f.bandLimits.reference.levelDb, $f.bandLimits.reference.description],
         ($f.bandLimits.limits[] | ["L", .dropDb] + (.lower | edge) + (.upper | edge))
       else empty end),
      (if $c.magnitudeReference then ["M", $c.magnitudeReference] else empty end),
      (if $f.distortion then
         ($f.distortion.thdHeadline == "thd_r") as $r | (if $r then "THD_R" else "THD_F" end) as $name |
         (if $r then $f.distortion.thdR else $f.distortion.thdF end) as $s |
         (["atReference", "maximum"][] as $k | ["T", $name, $k, $s[$k].valuePercent, $s[$k].frequencyHz, $s[$k].isUpperBound])
       else empty end),
      ["D", $f.delayMs, $f.polarity],
      ["V", .verdict],
      (.warnings // [] | .[] | ["W", .code, .message])
      | map(if . == null then "null" else tostring end) | join("\t")' "$1"
  elif have python3; then
    python3 -c 'import json,sys
a=json.load(open(sys.argv[1])); r=a.get("result") or {}; f=r.get("figures") or {}; c=r.get("conventions") or {}
out=lambda *xs: print("\t".join("null" if x is None else str(x).lower() if isinstance(x,bool) else str(x) for x in xs))
edge=lambda p: [p.get("status"), p.get("frequencyHz", p.get("measuredEdgeHz", p.get("atHz")))]
b=f.get("bandLimits")
if b:
    out("R", b["reference"]["levelDb"], b["reference"]["description"])
    for l in b["limits"]: out("L", l["dropDb"], *(edge(l["lower"]) + edge(l["upper"])))
if c.get("magnitudeReference"): out("M", c["magnitudeReference"])
d=f.get("distortion")
if d:
    use_r=d.get("thdHeadline")=="thd_r"; s=(d.get("thdR") if use_r else d.get("thdF")) or {}
    for k in ("atReference","maximum"):
        v=s.get(k) or {}; out("T", "THD_R" if use_r else "THD_F", k, v.get("valuePercent"), v.get("frequencyHz"), v.get("isUpperBound"))
out("D", f.get("delayMs"), f.get("polarity"))
out("V", a.get("verdict"))
for w in a.get("warnings") or []: out("W", w.get("code"), w.get("message"))' "$1"
  else
    return 1
  fi
}

header_value() { # header_value NAME: last value of a response header of the last exchange
  grep -i "^$1:" "$WORK/headers" | tail -n 1 | cut -d: -f2- | tr -d '\r' | sed 's/^[[:space:]]*//' || true
}

# api METHOD PATH_OR_URL OUTFILE [curl args...]: one exchange, retried with the same arguments (and so the same
# Idempotency-Key) after network errors, 409, 429 and 5xx. Sets STATUS; exits on any other error.
api() {
  local method=$1 target=$2 out=$3 attempt=1 wait backoff
  shift 3
  case $target in http://*|https://*) ;; *) target="$SWEEPLINE_BASE_URL$target" ;; esac
  while :; do
    backoff=$((2 ** (attempt - 1))) # 1, 2, 4, 8 s
    : > "$WORK/headers"
    if STATUS=$(curl -sS -X "$method" -o "$out" -D "$WORK/headers" -w '%{http_code}' --max-time 60 \
      -H @"$WORK/auth-header" -H 'Accept: application/json' "$@" "$target"); then
      case $STATUS in
        2??) return 0 ;;
        # 409: the first try with this key is still being processed; 429: rate limit or quota; 5xx: server trouble.
        409|429|5??) [ "$attempt" -lt "$MAX_TRIES" ] || { print_problem "$out"; exit 1; }
                     wait=$(header_value retry-after); [[ $wait =~ ^[0-9]+$ ]] || wait=$backoff
                     echo "  HTTP $STATUS, retrying in ${wait}s (same Idempotency-Key)" >&2 ;;
        *) print_problem "$out"; exit 1 ;;
      esac
    else
      [ "$attempt" -lt "$MAX_TRIES" ] || { echo "cannot reach $SWEEPLINE_BASE_URL" >&2; exit 1; }
      wait=$backoff; echo "  network error, retrying in ${wait}s (same Idempotency-Key)" >&2
    fi
    attempt=$((attempt + 1)); sleep "$wait"
  done
}

print_problem() { # the problem+json body of a refused request: title, detail and per-field errors
  echo "API error: $(json_get "$1" .title 2>/dev/null || true) ($STATUS) $(json_get "$1" .detail 2>/dev/null || true)" >&2
  if have jq; then jq -r '.errors // [] | .[] | "  \(.pointer): \(.detail)"' "$1" >&2 2>/dev/null || true
  elif have python3; then
    python3 -c 'import json,sys
[print("  %s: %s" % (e.get("pointer"), e.get("detail"))) for e in json.load(open(sys.argv[1])).get("errors") or []]' "$1" >&2 2>/dev/null || true
  fi
}

require_id() { [[ $1 =~ ^[A-Za-z0-9_-]+$ ]] || die "unexpected id from the server: '$1'"; printf '%s' "$1"; }

json_text() { # json_text TEXT: TEXT as a JSON string (quotes and backslashes escaped)
  printf '"%s"' "$(printf '%s' "$1" | sed 's/\\/\\\\/g; s/"/\\"/g')"
}

run() {
  local capture=$1
  [ -r "$capture" ] || die "cannot read capture file $capture"
  [ -n "${SWEEPLINE_BASE_URL:-}" ] && [ -n "${SWEEPLINE_API_KEY:-}" ] || die "Set SWEEPLINE_BASE_URL and SWEEPLINE_API_KEY in the environment."
  have curl || die "curl is required (Debian: apt-get install curl)"
  SWEEPLINE_BASE_URL=${SWEEPLINE_BASE_URL%/}
  # The key goes to curl in a private file, not on its command line where other users could read it.
  (umask 077; printf 'Authorization: Bearer %s\n' "$SWEEPLINE_API_KEY" > "$WORK/auth-header")

  # 1. The stimulus, defined by parameters; the server renders the same WAV every time.
  api POST /v1/stimuli "$WORK/stimulus.json" -H 'Content-Type: application/json' \
    -H "Idempotency-Key: $(new_idempotency_key)" --data-binary "$STIMULUS_JSON"
  local stimulus_id; stimulus_id=$(require_id "$(json_get "$WORK/stimulus.json" .id)")
  echo "stimulus $stimulus_id: $(json_get "$WORK/stimulus.json" .parameters.startHz)-$(json_get "$WORK/stimulus.json" .parameters.stopHz) Hz sweep, $(fixed "$(json_get "$WORK/stimulus.json" .totalDurationSeconds)" 3) s at $(json_get "$WORK/stimulus.json" .sampleRateHz) Hz"
  local stimulus_wav="$STIMULUS_DIR/stimulus-$stimulus_id.wav"
  api GET "/v1/stimuli/$stimulus_id/audio?encoding=float32" "$stimulus_wav" -H 'Accept: audio/wav'
  echo "saved $stimulus_wav ($(wc -c < "$stimulus_wav") bytes)"

  # 2. Playback and recording happen on the rig, outside this script. Show the server's cautions first.
  echo "SAFETY before playing the stimulus:"
  json_get "$WORK/stimulus.json" .cautions | sed 's/^/  * /'
  echo "-> the rig would now play $stimulus_wav through the DUT and record it; this script uses $capture instead."

  # 3. Upload the capture. One key for this upload, reused by every retry of it.
  api POST /v1/captures "$WORK/capture.json" -H "Idempotency-Key: $(new_idempotency_key)" \
    -F "file=@$capture;type=audio/wav"
  local capture_id; capture_id=$(require_id "$(json_get "$WORK/capture.json" .id)")
  echo "capture $capture_id uploaded ($(json_get "$WORK/capture.json" .channelCount) ch, $(fixed "$(json_get "$WORK/capture.json" .durationSeconds)" 3) s)"

  # 4. Ask for the analysis; Prefer: wait=N (RFC 7240) returns the finished result at once (200) when it is
  #    done within N seconds, else 202 with Location. Ids were checked above; the DUT strings are JSON-escaped.
  local dut_json analysis_json
  dut_json="{\"model\":$(json_text "$DUT_MODEL"),\"serial\":$(json_text "$DUT_SERIAL"),\"lot\":$(json_text "$DUT_LOT")}"
  analysis_json=$(printf '{"kind":"response_and_distortion","captureId":"%s","stimulusId":"%s","channels":%s,"conditions":%s,"options":%s,"dut":%s,"tags":%s}' \
    "$capture_id" "$stimulus_id" "$CHANNELS_JSON" "$CONDITIONS_JSON" "$OPTIONS_JSON" "$dut_json" "$TAGS_JSON")
  api POST /v1/analyses "$WORK/analysis.json" -H 'Content-Type: application/json' -H "Prefer: wait=$WAIT_SECONDS" \
    -H "Idempotency-Key: $(new_idempotency_key)" --data-binary "$analysis_json"
  local analysis_id; analysis_id=$(require_id "$(json_get "$WORK/analysis.json" .id)")
  local monitor; monitor=$(header_value location)
  [ -n "$monitor" ] || monitor="/v1/analyses/$analysis_id"
  case $monitor in http://*|https://*) ;; *) monitor="$SWEEPLINE_BASE_URL$monitor" ;; esac

  # 5. Not finished yet (202): poll the status monitor, as often as Retry-After says.
  local status deadline=$((SECONDS + POLL_DEADLINE_SECONDS)) wait
  status=$(json_get "$WORK/analysis.json" .status)
  while [[ ! $status =~ ^(succeeded|failed|canceled)$ ]]; do
    [ "$SECONDS" -lt "$deadline" ] || die "analysis $analysis_id still $status after ${POLL_DEADLINE_SECONDS}s"
    wait=$(header_value retry-after); [[ $wait =~ ^[0-9]+$ ]] || wait=2
    sleep "$wait"
    api GET "$monitor" "$WORK/analysis.json"
    status=$(json_get "$WORK/analysis.json" .status)
    echo "  analysis $analysis_id: $status"
  done
  print_headline "$WORK/analysis.json" "$analysis_id" "$status"
}

# --- The headline: the figures a production line usually logs, from result.figures ----------------------------

fixed() { # fixed VALUE DIGITS: a number with DIGITS decimals, or n/a
  if [[ $1 =~ ^-?[0-9.]+([eE][-+]?[0-9]+)?$ ]]; then printf "%.${2}f" "$1"; else printf 'n/a'; fi
}

edge() { # edge STATUS VALUE: a band edge; not found inside the measured range means the edge examined is not the limit
  case $1 in
    found) printf '%s Hz' "$(fixed "$2" 1)" ;;
    beyond_measured_range) printf 'beyond %s Hz' "$(fixed "$2" 1)" ;;
    outside_at_reference_band) printf 'none (already outside at %s Hz)' "$(fixed "$2" 1)" ;;
    *) printf 'n/a' ;;
  esac
}

line() { printf '  %-28s %s\n' "$1" "$2"; }

print_headline() {
  local file=$1 id=$2 status=$3 records kind a b c d e
  echo "analysis $id $status"
  if [ "$status" != succeeded ]; then
    echo "  $(json_get "$file" .error.title): $(json_get "$file" .error.detail)"
    return 1
  fi
  if ! records=$(headline_records "$file"); then # neither jq nor python3: show the analysis as it came
    cat "$file"; echo
    return 0
  fi
  while IFS=$'\t' read -r kind a b c d e; do
    case $kind in
      R) line 'reference level' "$(fixed "$a" 2) dB ($b)" ;;
      L) line "-$a dB points" "$(edge "$b" "$c") .. $(edge "$d" "$e")" ;;
      M) line 'magnitude reference' "$a" ;;
      T) # thdHeadline says which THD definition the lab reports (THD_F re the fundamental, THD_R re the total).
         local label='at reference'; [ "$b" = maximum ] && label=maximum
         if [ "$c" = null ]; then line "$a $label" 'n/a'
         else line "$a $label" "$([ "$e" = true ] && printf '<= ')$(fixed "$c" 4) % at $(fixed "$d" 1) Hz"; fi ;;
      D) line delay "$(fixed "$a" 3) ms, polarity $b" ;;
      V) line verdict "$([ "$a" = null ] && echo 'none (no tolerance mask)' || echo "$a")" ;;
      W) echo "  warning $a: $b" ;;
    esac
  done <<<"$records"
}

# --- Webhooks (Standard Webhooks v1.0.0) -------------------------------------------------------------------------
# Instead of polling, an organisation can register an endpoint; Sweepline then POSTs events such as
# analysis.succeeded. Verify each one on the raw body bytes before parsing it, and use webhook-id to ignore a
# delivery you already processed (retries reuse the id).

# same_text A B: equality without an early exit on the first differing character. The two signatures are
# hashed first, so how long the comparison takes says nothing about the expected signature.
same_text() {
  [ "$(printf '%s' "$1" | openssl dgst -sha256 -r)" = "$(printf '%s' "$2" | openssl dgst -sha256 -r)" ]
}

# verify_webhook ID TIMESTAMP SIGNATURES BODY_FILE SECRET...: prints the 1-based index of the matching secret,
# or returns 1 with the reason on stderr. Note: the key is briefly on openssl's command line (as hex); on a
# shared host prefer the Python or Node verifier.
verify_webhook() {
  local id=$1 timestamp=$2 signatures=$3 body=$4 index=0 secret key_hex expected entry
  shift 4
  if [ -z "$id" ] || [ -z "$timestamp" ] || [ -z "$signatures" ]; then
    echo "missing webhook-id, webhook-timestamp or webhook-signature" >&2; return 1
  fi
  [[ $timestamp =~ ^[0-9]{1,12}$ ]] || { echo "webhook-timestamp is not Unix seconds" >&2; return 1; }
  local age=$(( $(date +%s) - 10#$timestamp ))
  if [ "${age#-}" -gt "$TOLERANCE_SECONDS" ]; then
    echo "timestamp outside the 5-minute tolerance (replayed or clock skew)" >&2; return 1
  fi
  for secret in "$@"; do
    index=$((index + 1))
    key_hex=$(printf '%s' "${secret#whsec_}" | base64 -d 2>/dev/null | od -An -v -tx1 | tr -d ' \n')
    [ -n "$key_hex" ] || continue
    expected=$({ printf '%s.%s.' "$id" "$timestamp"; cat "$body"; } |
      openssl dgst -sha256 -mac HMAC -macopt "hexkey:$key_hex" -binary | base64 | tr -d '\n')
    for entry in $signatures; do
      [ "${entry#v1,}" != "$entry" ] || continue
      if same_text "${entry#v1,}" "$expected"; then echo "$index"; return 0; fi
    done
  done
  echo "no signature matches" >&2
  return 1
}

verify_webhook_command() {
  local id=${SWEEPLINE_WEBHOOK_ID:-} timestamp=${SWEEPLINE_WEBHOOK_TIMESTAMP:-} signature=${SWEEPLINE_WEBHOOK_SIGNATURE:-}
  local secrets=${SWEEPLINE_WEBHOOK_SECRET:-} body_file=""
  local usage='verify-webhook [--id ID] [--timestamp TS] [--signature SIG] [--secret SECRET] [--body-file PATH]
  Flags default to SWEEPLINE_WEBHOOK_ID/_TIMESTAMP/_SIGNATURE/_SECRET; the body is read from stdin without
  --body-file. SWEEPLINE_WEBHOOK_SECRET may hold several secrets separated by spaces (rotation).'
  while [ $# -gt 0 ]; do
    [ $# -ge 2 ] || { echo "$usage" >&2; return 2; }
    case $1 in
      --id) id=$2 ;; --timestamp) timestamp=$2 ;; --signature) signature=$2 ;;
      --secret) secrets=$2 ;; --body-file) body_file=$2 ;;
      *) echo "$usage" >&2; return 2 ;;
    esac
    shift 2
  done
  have openssl || { echo "openssl is required (Debian: apt-get install openssl)" >&2; return 2; }
  [ -n "$secrets" ] || { echo "no secret: set SWEEPLINE_WEBHOOK_SECRET or pass --secret" >&2; return 2; }
  if [ -z "$body_file" ]; then body_file="$WORK/body"; cat > "$body_file"; fi
  local index reason
  # shellcheck disable=SC2086 # one argument per secret
  if index=$(verify_webhook "$id" "$timestamp" "$signature" "$body_file" $secrets 2>"$WORK/reason"); then
    echo "valid (secret #$index)"
  else
    reason=$(cat "$WORK/reason"); echo "invalid: $reason" >&2; return 1
  fi
}

case ${1:-} in
  run) [ $# -eq 2 ] || die "usage: $0 run <capture.wav>"; run "$2" ;;
  verify-webhook) shift; verify_webhook_command "$@" ;;
  *) die "usage: $0 run <capture.wav> | verify-webhook [flags]" ;;
esac
