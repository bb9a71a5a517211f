#!/usr/bin/env python3
"""Sweepline rig loop in Python, standard library only (Python 3.8+).

    export SWEEPLINE_BASE_URL=http://127.0.0.1:4620     # your Sweepline server
    export SWEEPLINE_API_KEY=swl_test_...                # a key with captures:write, analyses:write/read
    python3 rig_loop.py run path/to/capture.wav          # the whole loop
    python3 rig_loop.py verify-webhook --body-file body.json   # check one received webhook (see below)

The loop: create a sweep stimulus -> download its WAV -> (the rig plays it and records the DUT) -> upload the
capture -> ask for an analysis and wait for it -> print the headline figures and the verdict.

Every POST that creates something carries an Idempotency-Key. If the line drops and the script retries, it
sends the *same* key, so the server replays its first answer instead of creating a second stimulus, capture or
analysis. A new key is made only for a genuinely new request.
"""

import base64
import hashlib
import hmac
import http.client
import json
import os
import sys
import time
import urllib.error
import urllib.parse
import urllib.request
import uuid

# --- What this rig measures. Edit for your set-up. ----------------------------------------------------------
# The capture you upload must be a recording of exactly this stimulus (same rate, length and sweep): the server
# regenerates the sweep from these parameters to deconvolve the capture.
STIMULUS = {
    "type": "sweep",
    "name": "KB-65 woofer sweep 20 Hz - 20 kHz",
    "parameters": {"startHz": 20, "stopHz": 20000, "approximateDurationSeconds": 2, "sampleRateHz": 48000, "levelDbfs": -12},
}
CHANNELS = {"measurement": 0, "reference": 1}  # capture channel roles: microphone, loopback (None if none)
CONDITIONS = {"distanceM": 1.0, "driveVoltageVrms": 2.83, "nominalImpedanceOhm": 8, "temperatureC": 20}
DUT = {
    "model": os.environ.get("SWEEPLINE_DUT_MODEL", "KB-65 woofer"),
    "serial": os.environ.get("SWEEPLINE_DUT_SERIAL", "KB65-24-000123"),
    "lot": os.environ.get("SWEEPLINE_DUT_LOT", "KB65-L24-07"),
}
TAGS = ["line-1"]
# response_and_distortion takes {"response": {...}, "distortion": {...}}; {} = engine defaults (see the API reference).
OPTIONS = {}
# Where the downloaded stimulus WAV is saved for the rig's player.
STIMULUS_DIR = os.environ.get("SWEEPLINE_STIMULUS_DIR", ".")
# How long the analysis POST may wait for the result (Prefer: wait=N, at most 60 s); 0 = answer 202 at once and poll.
WAIT_SECONDS = os.environ.get("SWEEPLINE_WAIT_SECONDS", "10")

TERMINAL_STATES = ("succeeded", "failed", "canceled")
POLL_DEADLINE_SECONDS = 300
MAX_TRIES = 5  # per request, for dropped connections, 409 (still running), 429 and 5xx
NETWORK_ERRORS = (urllib.error.URLError, http.client.HTTPException, ConnectionError, TimeoutError)


class ApiError(Exception):
    def __init__(self, status, problem):
        self.status = status
        self.problem = problem
        title = problem.get("title") or "HTTP %d" % status
        detail = problem.get("detail") or ""
        super().__init__("%s (%d) %s" % (title, status, detail))


def config():
    base_url = os.environ.get("SWEEPLINE_BASE_URL", "").rstrip("/")
    api_key = os.environ.get("SWEEPLINE_API_KEY", "")
    if not base_url or not api_key:
        sys.exit("Set SWEEPLINE_BASE_URL and SWEEPLINE_API_KEY in the environment.")
    return base_url, api_key


def request(method, url, api_key, body=None, headers=None):
    """One HTTP exchange, retried with the same headers (and so the same Idempotency-Key) when it is safe to."""
    all_headers = {"Authorization": "Bearer " + api_key, "Accept": "application/json"}
    all_headers.update(headers or {})
    for attempt in range(1, MAX_TRIES + 1):
        backoff = 2 ** (attempt - 1)  # 1, 2, 4, 8 s
        req = urllib.request.Request(url, data=body, method=method, headers=all_headers)
        try:
            with urllib.request.urlopen(req, timeout=60) as resp:
                return resp.status, dict(resp.headers.items()), resp.read()
        except urllib.error.HTTPError as err:
            status, resp_headers, payload = err.code, dict(err.headers.items()), err.read()
            # 409: the first try with this key is still being processed; 429: rate limit or quota; 5xx: server trouble.
            retryable = status in (409, 429) or status >= 500
            if not retryable or attempt == MAX_TRIES:
                raise ApiError(status, parse_problem(payload))
            wait = retry_after_seconds(resp_headers, default=backoff)
            print("  HTTP %d, retrying in %ss (same Idempotency-Key)" % (status, wait), file=sys.stderr)
        except NETWORK_ERRORS as err:
            if attempt == MAX_TRIES:
                raise
            wait = backoff
            print("  network error (%s), retrying in %ss (same Idempotency-Key)" % (err, wait), file=sys.stderr)
        time.sleep(wait)
    raise RuntimeError("unreachable")


def parse_problem(payload):
    try:
        problem = json.loads(payload.decode("utf-8"))
        return problem if isinstance(problem, dict) else {}
    except ValueError:
        return {"detail": payload[:200].decode("utf-8", "replace")}


def header(headers, name):
    return {k.lower(): v for k, v in headers.items()}.get(name.lower(), "")


def retry_after_seconds(headers, default):
    value = header(headers, "retry-after")
    return int(value) if value.isdigit() else default


def post_json(base_url, api_key, path, document, extra_headers=None):
    """POST a JSON document with a fresh Idempotency-Key; request() reuses that key for every retry of it."""
    headers = {"Content-Type": "application/json", "Idempotency-Key": str(uuid.uuid4())}
    headers.update(extra_headers or {})
    return request("POST", base_url + path, api_key, json.dumps(document).encode("utf-8"), headers)


def multipart_file(field, filename, content, content_type="audio/wav"):
    """A multipart/form-data body with one file part, built by hand (the standard library has no encoder)."""
    boundary = "sweepline-" + uuid.uuid4().hex
    safe_name = filename.replace('"', "_").replace("\r", "_").replace("\n", "_")
    head = (
        "--%s\r\n"
        'Content-Disposition: form-data; name="%s"; filename="%s"\r\n'
        "Content-Type: %s\r\n\r\n" % (boundary, field, safe_name, content_type)
    ).encode("utf-8")
    tail = ("\r\n--%s--\r\n" % boundary).encode("ascii")
    return "multipart/form-data; boundary=" + boundary, head + content + tail


def run(capture_path):
    base_url, api_key = config()
    with open(capture_path, "rb") as handle:
        capture_bytes = handle.read()

    # 1. The stimulus, defined by parameters; the server renders the same WAV every time.
    _, _, body = post_json(base_url, api_key, "/v1/stimuli", STIMULUS)
    stimulus = json.loads(body)
    parameters = stimulus["parameters"]
    print("stimulus %s: %s-%s Hz sweep, %.3f s at %s Hz" % (
        stimulus["id"], parameters["startHz"], parameters["stopHz"], stimulus["totalDurationSeconds"], parameters["sampleRateHz"]))
    _, _, wav = request("GET", "%s/v1/stimuli/%s/audio?encoding=float32" % (base_url, urllib.parse.quote(stimulus["id"])),
                        api_key, headers={"Accept": "audio/wav"})
    stimulus_path = os.path.join(STIMULUS_DIR, "stimulus-%s.wav" % stimulus["id"])
    with open(stimulus_path, "wb") as handle:
        handle.write(wav)
    print("saved %s (%d bytes)" % (stimulus_path, len(wav)))

    # 2. Playback and recording happen on the rig, outside this script. Show the server's cautions first.
    print("SAFETY before playing the stimulus:")
    for caution in stimulus.get("cautions") or []:
        print("  * " + caution)
    print("-> the rig would now play %s through the DUT and record it; this script uses %s instead."
          % (stimulus_path, capture_path))

    # 3. Upload the capture. One key for this upload, reused by every retry of it.
    content_type, form = multipart_file("file", os.path.basename(capture_path), capture_bytes)
    _, _, body = request("POST", base_url + "/v1/captures", api_key, form,
                         {"Content-Type": content_type, "Idempotency-Key": str(uuid.uuid4())})
    capture = json.loads(body)
    print("capture %s uploaded (%s ch, %.3f s)" % (capture["id"], capture["channelCount"], capture["durationSeconds"]))
    for warning in capture.get("warnings") or []:
        print("  capture warning %s: %s" % (warning.get("code"), warning.get("message")))

    # 4. Ask for the analysis; Prefer: wait=N (RFC 7240) returns the finished result at once (200) when it is
    #    done within N seconds, else 202 with Location.
    analysis_request = {
        "kind": "response_and_distortion",
        "captureId": capture["id"],
        "stimulusId": stimulus["id"],
        "channels": CHANNELS,
        "conditions": CONDITIONS,
        "options": OPTIONS,
        "dut": DUT,
        "tags": TAGS,
    }
    status, headers, body = post_json(base_url, api_key, "/v1/analyses", analysis_request, {"Prefer": "wait=" + WAIT_SECONDS})
    analysis = json.loads(body)
    monitor_url = urllib.parse.urljoin(base_url + "/", header(headers, "location") or "/v1/analyses/" + analysis["id"])

    # 5. Not finished yet (202): poll the status monitor, as often as Retry-After says.
    deadline = time.monotonic() + POLL_DEADLINE_SECONDS
    while analysis.get("status") not in TERMINAL_STATES:
        if time.monotonic() > deadline:
            sys.exit("analysis %s still %s after %d s" % (analysis["id"], analysis.get("status"), POLL_DEADLINE_SECONDS))
        time.sleep(retry_after_seconds(headers, default=2))
        _, headers, body = request("GET", monitor_url, api_key)
        analysis = json.loads(body)
        print("  analysis %s: %s (%d %%)" % (analysis["id"], analysis.get("status"), round(100 * analysis.get("progress", 0))))

    return print_headline(analysis)


# --- The headline: the figures a production line usually logs, from result.figures --------------------------

def fixed(value, digits):
    return ("%." + str(digits) + "f") % value if isinstance(value, (int, float)) else "n/a"


def line(label, text):
    print("  %-28s %s" % (label, text))


def limit_point(point):
    """A band edge: found at a frequency, or not inside the measured range (then the edge examined is not the limit)."""
    status = (point or {}).get("status")
    if status == "found":
        return "%s Hz" % fixed(point["frequencyHz"], 1)
    if status == "beyond_measured_range":
        return "beyond %s Hz" % fixed(point["measuredEdgeHz"], 1)
    if status == "outside_at_reference_band":
        return "none (already outside at %s Hz)" % fixed(point["atHz"], 1)
    return "n/a"


def distortion_value(value):
    """A distortion summary value: percent at a frequency, "<=" when it is only an upper bound (noise floor)."""
    if not value or not isinstance(value.get("valuePercent"), (int, float)):
        return "n/a"
    bound = "<= " if value.get("isUpperBound") else ""
    return "%s%s %% at %s Hz" % (bound, fixed(value["valuePercent"], 4), fixed(value["frequencyHz"], 1))


def print_headline(analysis):
    print("analysis %s %s" % (analysis["id"], analysis["status"]))
    if analysis["status"] != "succeeded":
        error = analysis.get("error") or {}
        print("  %s: %s" % (error.get("title", "no result"), error.get("detail", "")))
        return 1
    result = analysis.get("result") or {}
    figures = result.get("figures") or {}
    conventions = result.get("conventions") or {}
    band_limits = figures.get("bandLimits")
    if band_limits:
        reference = band_limits["reference"]
        line("reference level", "%s dB (%s)" % (fixed(reference["levelDb"], 2), reference["description"]))
        for limit in band_limits["limits"]:
            line("-%s dB points" % limit["dropDb"], "%s .. %s" % (limit_point(limit["lower"]), limit_point(limit["upper"])))
    if conventions.get("magnitudeReference"):
        line("magnitude reference", conventions["magnitudeReference"])
    distortion = figures.get("distortion")
    if distortion:
        # thdHeadline says which THD definition the lab reports (thd_f re the fundamental, or thd_r re the total).
        use_r = distortion.get("thdHeadline") == "thd_r"
        name, summary = ("THD_R", distortion.get("thdR")) if use_r else ("THD_F", distortion.get("thdF"))
        line("%s at reference" % name, distortion_value((summary or {}).get("atReference")))
        line("%s maximum" % name, distortion_value((summary or {}).get("maximum")))
    line("delay", "%s ms, polarity %s" % (fixed(figures.get("delayMs"), 3), figures.get("polarity", "n/a")))
    line("verdict", analysis.get("verdict") or "none (no tolerance mask)")
    for warning in analysis.get("warnings") or []:
        print("  warning %s: %s" % (warning.get("code"), warning.get("message")))
    return 0


# --- Webhooks (Standard Webhooks v1.0.0) ---------------------------------------------------------------------
# Instead of polling, an organisation can register an endpoint; Sweepline then POSTs events such as
# analysis.succeeded. Verify each one on the raw body bytes BEFORE parsing the JSON, and use webhook-id to
# ignore a delivery you already processed (retries reuse the id).

TOLERANCE_SECONDS = 5 * 60


class WebhookInvalid(Exception):
    pass


def verify_webhook(body, webhook_id, webhook_timestamp, webhook_signature, secrets, now=None):
    """Raises WebhookInvalid unless one v1 signature matches one of `secrets` (whsec_...) and the timestamp is
    within 5 minutes of now. `body` is the raw request body (bytes). Returns the index of the matching secret."""
    if not webhook_id or not webhook_timestamp or not webhook_signature:
        raise WebhookInvalid("missing webhook-id, webhook-timestamp or webhook-signature")
    if not webhook_timestamp.isdigit():
        raise WebhookInvalid("webhook-timestamp is not Unix seconds")
    now = int(time.time()) if now is None else now
    if abs(now - int(webhook_timestamp)) > TOLERANCE_SECONDS:
        raise WebhookInvalid("timestamp outside the 5-minute tolerance (replayed or clock skew)")
    signed = webhook_id.encode("utf-8") + b"." + webhook_timestamp.encode("ascii") + b"." + body
    received = [entry[3:] for entry in webhook_signature.split(" ") if entry.startswith("v1,")]
    for index, secret in enumerate(secrets):
        key = base64.b64decode(secret[len("whsec_"):] if secret.startswith("whsec_") else secret, validate=True)
        expected = base64.b64encode(hmac.new(key, signed, hashlib.sha256).digest()).decode("ascii")
        # compare_digest takes the same time wherever the strings differ.
        if any(hmac.compare_digest(expected, candidate) for candidate in received):
            return index
    raise WebhookInvalid("no signature matches")


def verify_webhook_command(args):
    """verify-webhook [--id ID] [--timestamp TS] [--signature SIG] [--secret SECRET] [--body-file PATH]
    Flags default to SWEEPLINE_WEBHOOK_ID/_TIMESTAMP/_SIGNATURE/_SECRET; the body is read from stdin without
    --body-file. SWEEPLINE_WEBHOOK_SECRET may hold several secrets separated by spaces (rotation)."""
    values = {
        "id": os.environ.get("SWEEPLINE_WEBHOOK_ID", ""),
        "timestamp": os.environ.get("SWEEPLINE_WEBHOOK_TIMESTAMP", ""),
        "signature": os.environ.get("SWEEPLINE_WEBHOOK_SIGNATURE", ""),
        "secret": os.environ.get("SWEEPLINE_WEBHOOK_SECRET", ""),
        "body-file": "",
    }
    while args:
        flag = args.pop(0)
        if not flag.startswith("--") or flag[2:] not in values or not args:
            print(verify_webhook_command.__doc__, file=sys.stderr)
            return 2
        values[flag[2:]] = args.pop(0)
    if not values["secret"]:
        print("no secret: set SWEEPLINE_WEBHOOK_SECRET or pass --secret", file=sys.stderr)
        return 2
    if values["body-file"]:
        with open(values["body-file"], "rb") as handle:
            body = handle.read()
    else:
        body = sys.stdin.buffer.read()
    try:
        index = verify_webhook(body, values["id"], values["timestamp"], values["signature"], values["secret"].split())
    except (WebhookInvalid, ValueError) as err:
        print("invalid: %s" % err, file=sys.stderr)
        return 1
    print("valid (secret #%d)" % (index + 1))
    return 0


def main(argv):
    if len(argv) >= 1 and argv[0] == "verify-webhook":
        return verify_webhook_command(argv[1:])
    if len(argv) == 2 and argv[0] == "run":
        try:
            return run(argv[1])
        except ApiError as err:
            print("API error: %s" % err, file=sys.stderr)
            for item in err.problem.get("errors") or []:
                print("  %s: %s" % (item.get("pointer"), item.get("detail")), file=sys.stderr)
            return 1
        except NETWORK_ERRORS as err:
            print("cannot reach %s: %s" % (os.environ.get("SWEEPLINE_BASE_URL"), getattr(err, "reason", err)), file=sys.stderr)
            return 1
    print(__doc__, file=sys.stderr)
    return 2


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
