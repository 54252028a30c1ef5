-- Edit -> diagnostics shown, in a real (headless) Neovim on a large generated
-- mechanism, through the kiln plugin and the real server. Used by the test
-- suite (run.sh, generous limit) and by editors/bench.sh (real figures).
-- Environment: KILN_PLUGIN_DIR, KILN_BINARY, KILN_BIG_FILE; KILN_EDITS
-- (edit/revert pairs, default 2); KILN_LIMIT_MS (fail above it, default
-- none); prints one line per measure.
local plugin_dir = assert(os.getenv('KILN_PLUGIN_DIR'), 'KILN_PLUGIN_DIR not set')
local binary = assert(os.getenv('KILN_BINARY'), 'KILN_BINARY not set')
local big = assert(os.getenv('KILN_BIG_FILE'), 'KILN_BIG_FILE not set')
local edits = tonumber(os.getenv('KILN_EDITS') or '2')
local limit = tonumber(os.getenv('KILN_LIMIT_MS') or '0')

vim.opt.runtimepath:prepend(plugin_dir)
vim.cmd('filetype plugin indent on')

local function out(s)
  io.stdout:write(s .. '\n')
end

local now = function()
  return vim.loop.hrtime() / 1e6
end

-- Time spent in the diagnostics handler: the editor is blocked meanwhile.
local stalls, counts = {}, {}
local publish = vim.lsp.handlers['textDocument/publishDiagnostics']
vim.lsp.handlers['textDocument/publishDiagnostics'] = function(err, result, ctx, config)
  local t0 = now()
  publish(err, result, ctx, config)
  table.insert(stalls, now() - t0)
  table.insert(counts, result and #result.diagnostics or 0)
end

require('kiln').setup({ cmd = { binary, 'serve' } })
local failures = {}
local t_open = now()
vim.cmd('edit ' .. vim.fn.fnameescape(big))
local b = vim.api.nvim_get_current_buf()
local function errors_on(l)
  for _, d in ipairs(vim.diagnostic.get(b, { lnum = l })) do
    if d.severity == vim.diagnostic.severity.ERROR then
      return true
    end
  end
  return false
end

local WAIT = math.max(limit, 60000)
local ok = vim.wait(WAIT, function()
  return #vim.diagnostic.get(b) > 0
end, 1)
local open_ms = now() - t_open
if not ok then
  table.insert(failures, 'no diagnostics after opening within ' .. WAIT .. ' ms')
end
out(string.format('nvim: %s, %d lines; open -> first diagnostics %.0f ms (%d diagnostics)',
  vim.fn.fnamemodify(big, ':t'), vim.api.nvim_buf_line_count(b), open_ms, #vim.diagnostic.get(b)))

-- Edit one species' SMILES in the middle of the file (make it unreadable),
-- wait for the error to show, then undo the edit and wait for it to go.
local lines = vim.api.nvim_buf_get_lines(b, 0, -1, false)
local targets = {}
for i, l in ipairs(lines) do
  if l:match('^species M%d+ ') and i > #lines / 4 then
    table.insert(targets, i - 1)
    if #targets >= edits then
      break
    end
  end
end
local times = {}
for _, l in ipairs(targets) do
  local text = vim.api.nvim_buf_get_lines(b, l, l + 1, false)[1]
  local col = #text
  vim.wait(200, function() return false end) -- let the previous publication settle
  local t0 = now()
  vim.api.nvim_buf_set_text(b, l, col, l, col, { '((' })
  local shown = vim.wait(WAIT, function() return errors_on(l) end, 1)
  local dt = now() - t0
  if not shown then
    table.insert(failures, string.format('edit on line %d: no error within %d ms', l + 1, WAIT))
  end
  table.insert(times, dt)
  vim.wait(200, function() return false end)
  t0 = now()
  vim.api.nvim_buf_set_text(b, l, col, l, col + 2, { '' })
  local gone = vim.wait(WAIT, function() return not errors_on(l) end, 1)
  dt = now() - t0
  if not gone then
    table.insert(failures, string.format('revert on line %d: error still shown after %d ms', l + 1, WAIT))
  end
  table.insert(times, dt)
end

local function pct(t, p)
  local s = vim.deepcopy(t)
  table.sort(s)
  if #s == 0 then
    return 0
  end
  return s[math.max(1, math.ceil(#s * p))]
end
out(string.format('nvim: edit -> diagnostics shown: p50 %.0f ms, p95 %.0f ms, max %.0f ms (%d edits)',
  pct(times, 0.5), pct(times, 0.95), pct(times, 1), #times))
out(string.format('nvim: diagnostics handler (editor blocked): p50 %.1f ms, p95 %.1f ms, max %.1f ms; %d publications, up to %d diagnostics each',
  pct(stalls, 0.5), pct(stalls, 0.95), pct(stalls, 1), #stalls, pct(counts, 1)))
if limit > 0 then
  for i, t in ipairs(times) do
    if t > limit then
      table.insert(failures, string.format('edit %d took %.0f ms > limit %d ms', i, t, limit))
    end
  end
end

for _, c in pairs(vim.lsp.get_active_clients()) do
  c.stop()
end
vim.wait(3000, function() return #vim.lsp.get_active_clients() == 0 end, 20)
if #failures > 0 then
  for _, f in ipairs(failures) do
    out('FAIL ' .. f)
  end
  vim.cmd('cquit 1')
end
vim.cmd('qall!')
