-- wrk script for scripts/load.sh: a mix of what people do with raytable, over a few revisions.
-- RT_IDS names the revisions (space separated); RT_FORMS is the folder with each one's edit form
-- (ID.form, as loadtool form prints it). Weights per 100 requests: pages 30, presentation 10,
-- drawings 30, report 10, previews 12, edits 8.

local ids, forms = {}, {}
for id in string.gmatch(os.getenv("RT_IDS") or "", "%S+") do
  table.insert(ids, id)
  local f = assert(io.open(os.getenv("RT_FORMS") .. "/" .. id .. ".form", "r"))
  forms[id] = f:read("*a")
  f:close()
end
local formHeaders = {["Content-Type"] = "application/x-www-form-urlencoded"}
local drawings = {"side.svg", "table.svg", "plan.svg", "side.svg?paraxial=1"}

request = function()
  local id = ids[math.random(#ids)]
  local r = math.random(100)
  if r <= 30 then
    return wrk.format("GET", "/r/" .. id .. "/")
  elseif r <= 40 then
    return wrk.format("GET", "/r/" .. id .. "/view")
  elseif r <= 70 then
    return wrk.format("GET", "/r/" .. id .. "/" .. drawings[math.random(#drawings)])
  elseif r <= 80 then
    return wrk.format("GET", "/r/" .. id .. "/report.json")
  elseif r <= 92 then
    return wrk.format("POST", "/r/" .. id .. "/preview", formHeaders, forms[id])
  end
  return wrk.format("POST", "/r/" .. id .. "/edit", formHeaders, forms[id])
end

done = function(summary, latency, requests)
  local e = summary.errors
  local seconds = summary.duration / 1e6
  io.write(string.format("requests        %d in %.1f s\n", summary.requests, seconds))
  io.write(string.format("requests/s      %.1f\n", summary.requests / seconds))
  io.write(string.format("latency p50     %.2f ms\n", latency:percentile(50) / 1000))
  io.write(string.format("latency p99     %.2f ms\n", latency:percentile(99) / 1000))
  io.write(string.format("latency max     %.2f ms\n", latency.max / 1000))
  io.write(string.format("errors          %d (connect %d, read %d, write %d, timeout %d, status >= 400: %d)\n",
    e.connect + e.read + e.write + e.timeout + e.status, e.connect, e.read, e.write, e.timeout, e.status))
end
