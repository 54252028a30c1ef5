-- Init file for an interactive nvim driven by editors/interactive/run.sh.
-- Environment: KILN_PLUGIN_DIR, KILN_BINARY, KILN_PROBE_LOG. Logs, at each
-- DiagnosticChanged, the seconds since the last change of the buffer and
-- whether the cursor line has an error.
vim.opt.runtimepath:prepend(os.getenv('KILN_PLUGIN_DIR'))
vim.cmd('filetype plugin indent on')
vim.cmd('syntax on')
require('kiln').setup({ cmd = { os.getenv('KILN_BINARY'), 'serve' } })
local t0
local log = io.open(os.getenv('KILN_PROBE_LOG'), 'a')
vim.api.nvim_create_autocmd('BufEnter', { pattern = '*.kiln', callback = function(a)
  vim.api.nvim_buf_attach(a.buf, false, { on_lines = function() t0 = vim.loop.hrtime() end })
end })
vim.api.nvim_create_autocmd('DiagnosticChanged', { callback = function(a)
  if not t0 then return end
  local l = vim.api.nvim_win_get_cursor(0)[1] - 1
  local err = false
  for _, d in ipairs(vim.diagnostic.get(a.buf, { lnum = l })) do
    if d.severity == vim.diagnostic.severity.ERROR then err = true end
  end
  log:write(string.format('%.3f %s %d\n', (vim.loop.hrtime() - t0) / 1e9, err and 'err' or 'ok', l + 1))
  log:flush()
end })
