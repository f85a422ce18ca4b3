-- wrk script for tools/load.sh: POST /v1/messages with a mix of the demo's
-- questions and follow-ups, spread over READERS readers (env, default
-- 5000), each message with its own message_id as a platform would send.
local questions = {
  "who won the men's 100m?",
  "and silver?",
  "how many medals has Brellmoor won",
  "how about Sordavia?",
  "what's on tomorrow?",
  "how did Zoe do?",
  "who is leading the men's marathon",
  "did Galkase win the 100 metres",
  "tell me about Zoë Quillon",
  "where is she from?",
  "who got bronze in the women's 200 m freestyle",
  "when is the women's one hundred meters final",
  "medal table",
  "how did kovendahl do in the single sculls",
  "best long jupm so far",
  "hello",
}
local readers = tonumber(os.getenv("READERS") or "5000")
local threads = {}
local counter = 0

function setup(thread)
  thread:set("tid", #threads + 1)
  table.insert(threads, thread)
end

function init(args)
  math.randomseed(tid * 7919)
  wrk.method = "POST"
  wrk.headers["content-type"] = "application/json"
end

function request()
  counter = counter + 1
  local reader = math.random(1, readers)
  local q = questions[math.random(1, #questions)]
  local body = string.format(
    '{"user":"load-%d","text":"%s","message_id":"m-%d-%d"}',
    reader, q, tid, counter)
  return wrk.format(nil, "/v1/messages", nil, body)
end

function done(summary, latency, requests)
  local secs = summary.duration / 1e6
  local bad = summary.errors.status + summary.errors.connect + summary.errors.read
    + summary.errors.write + summary.errors.timeout
  io.write(string.format("RESULT rps=%.0f p50_us=%d p99_us=%d requests=%d errors=%d\n",
    summary.requests / secs, latency:percentile(50), latency:percentile(99),
    summary.requests, bad))
end
