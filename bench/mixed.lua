-- Mixed signed-in load for wrk: page views, searches, record reads (JSON) and writes (comments).
local pages = { "/", "/records/demo-rec-2526-two-propellers", "/subsystems/propulsion", "/records", "/calculations/demo-calc-prop-endurance-2526" }
local searches = { "/api/search?q=propeller", "/api/search?q=coolant%20loop", "/api/search?q=venti", "/api/search?q=batery" }
local reads = { "/api/records/demo-rec-2526-two-propellers", "/api/records/demo-rec-2425-single-propeller", "/api/calculations/demo-calc-prop-sprint-2526", "/api/records?limit=25" }
local n = 0

request = function()
  n = n + 1
  local r = math.random(100)
  local headers = { ["Cookie"] = wrk.headers["cookie"] or wrk.headers["Cookie"] }
  if r <= 35 then
    return wrk.format("GET", pages[math.random(#pages)], headers)
  elseif r <= 55 then
    return wrk.format("GET", searches[math.random(#searches)], headers)
  elseif r <= 90 then
    return wrk.format("GET", reads[math.random(#reads)], headers)
  else
    headers["Content-Type"] = "application/json"
    return wrk.format("POST", "/api/records/demo-rec-2526-parts-lead-time/comments", headers, '{"body":"bench: load test comment ' .. n .. '"}')
  end
end
