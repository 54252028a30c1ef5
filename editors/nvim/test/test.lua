-- Headless test of the kiln Neovim plugin; run through test/run.sh.
-- Environment: KILN_PLUGIN_DIR (editors/nvim), KILN_BINARY (server binary),
-- KILN_WORKDIR (scratch directory holding fixture.kiln and syntax.kiln).
local plugin_dir = assert(os.getenv('KILN_PLUGIN_DIR'), 'KILN_PLUGIN_DIR not set')
local binary = assert(os.getenv('KILN_BINARY'), 'KILN_BINARY not set')
local workdir = assert(os.getenv('KILN_WORKDIR'), 'KILN_WORKDIR not set')

vim.opt.runtimepath:prepend(plugin_dir)
vim.cmd('filetype plugin on')
vim.cmd('syntax on')

local passed, failed = 0, 0

local function check(name, fn)
  local ok, err = pcall(fn)
  if ok then
    passed = passed + 1
    io.stdout:write('ok   ' .. name .. '\n')
  else
    failed = failed + 1
    io.stdout:write('FAIL ' .. name .. ': ' .. tostring(err) .. '\n')
  end
end

local function expect(cond, msg)
  if not cond then
    error(msg, 2)
  end
end

-- Name of the syntax group at 1-based line and column of the current buffer.
local function syn_at(line, col)
  return vim.fn.synIDattr(vim.fn.synID(line, col, 1), 'name')
end

-- Column (1-based) of the n-th occurrence of plain text `s` on `line`.
local function col_of(line, s, n)
  local text = vim.fn.getline(line)
  local from = 1
  local start
  for _ = 1, (n or 1) do
    start = text:find(s, from, true)
    assert(start, string.format('%q not on line %d', s, line))
    from = start + 1
  end
  return start
end

local function expect_syn(line, s, n, offset, want)
  local col = col_of(line, s, n) + (offset or 0)
  local got = syn_at(line, col)
  expect(got == want, string.format('line %d col %d (%q): want %s, got %q', line, col, s, want, got))
end

------------------------------------------------------------------------
-- Static checks: filetype, ftplugin, syntax.
------------------------------------------------------------------------
vim.cmd('edit ' .. vim.fn.fnameescape(workdir .. '/syntax.kiln'))

check('filetype detected for *.kiln', function()
  expect(vim.bo.filetype == 'kiln', 'filetype is ' .. vim.bo.filetype)
end)

check('ftplugin sets commentstring', function()
  expect(vim.bo.commentstring == '# %s', 'commentstring is ' .. vim.bo.commentstring)
end)

check('syntax: species line, SMILES with # is not a comment', function()
  expect_syn(1, 'species', 1, 0, 'kilnStatement')
  expect_syn(1, 'ethyne', 1, 0, 'kilnSpeciesName')
  expect_syn(1, 'C#C', 1, 0, 'kilnSmiles')
  expect_syn(1, 'C#C', 1, 1, 'kilnSmiles')
  expect_syn(1, 'C#C', 1, 2, 'kilnSmiles')
  expect_syn(1, '# a comment', 1, 0, 'kilnComment')
end)

check('syntax: reaction line', function()
  expect_syn(2, 'reaction', 1, 0, 'kilnStatement')
  expect_syn(2, 'CH3', 1, 0, 'kilnSpeciesRef')
  expect_syn(2, '+', 1, 0, 'kilnOperator')
  expect_syn(2, '(+M)', 1, 0, 'kilnFalloff')
  expect_syn(2, '(+M)', 1, 2, 'kilnFalloffM')
  expect_syn(2, '<=>', 1, 0, 'kilnOperator')
  expect_syn(2, 'A=', 1, 0, 'kilnParameter')
  expect_syn(2, '2.1e16', 1, 0, 'kilnNumber')
  expect_syn(2, '-0.97', 1, 0, 'kilnNumber')
  expect_syn(2, '69.5', 1, 0, 'kilnNumber')
  expect_syn(2, 'kJ/mol', 1, 0, 'kilnUnit')
end)

check('syntax: attributes, block lines, free text', function()
  expect_syn(3, 'nasa7', 1, 0, 'kilnAttribute')
  expect_syn(3, '1000', 1, 0, 'kilnNumber')
  expect_syn(4, 'high', 1, 0, 'kilnAttribute')
  expect_syn(4, '1.5d13', 1, 0, 'kilnBadNumber')
  expect_syn(5, 'note', 1, 0, 'kilnTextKeyword')
  expect_syn(5, 'C#C', 1, 1, 'kilnText')
  expect_syn(5, '#7', 1, 0, 'kilnComment')
  expect_syn(9, 'efficiencies', 1, 0, 'kilnAttribute')
  expect_syn(9, 'H2O', 1, 0, 'kilnSpeciesRef')
  expect_syn(9, '6', 1, 0, 'kilnNumber')
end)

check('syntax: group, units, include, bad arrow, coefficient', function()
  expect_syn(6, 'C-(C)(H)3', 1, 0, 'kilnGroupName')
  expect_syn(7, 'kJ/mol', 1, 0, 'kilnUnitName')
  expect_syn(8, 'shared/core.kiln', 1, 0, 'kilnPath')
  expect_syn(10, '2', 1, 0, 'kilnCoefficient')
  expect_syn(10, '=', 1, 0, 'kilnBadArrow')
end)

check('root_dir: nearest .git ancestor, else the file directory', function()
  local kiln = require('kiln')
  local base = workdir .. '/roots'
  vim.fn.mkdir(base .. '/proj/.git', 'p')
  vim.fn.mkdir(base .. '/proj/sub/deeper', 'p')
  vim.fn.mkdir(base .. '/loose', 'p')
  local got = kiln.root_dir(base .. '/proj/sub/deeper/a.kiln')
  expect(got == base .. '/proj', 'with .git: ' .. got)
  -- The scratch directory lives under /tmp, which has no .git above it.
  got = kiln.root_dir(base .. '/loose/b.kiln', { '.kiln-test-marker-absent' })
  expect(got == base .. '/loose', 'without marker: ' .. got)
end)

------------------------------------------------------------------------
-- Live checks against the language server.
------------------------------------------------------------------------
local TIMEOUT = 20000 -- ms; generous for a cold start on a loaded CI machine

require('kiln').setup({ cmd = { binary, 'serve' }, settings = { units = 'kJ/mol' } })
vim.cmd('edit ' .. vim.fn.fnameescape(workdir .. '/fixture.kiln'))
local bufnr = vim.api.nvim_get_current_buf()

-- On 0.7 a client joins the buffer's client list only once initialized,
-- so follow it by id; attach() returns the id of the running client.
local client_id = require('kiln').attach(bufnr)

local function kiln_client()
  return client_id and vim.lsp.get_client_by_id(client_id) or nil
end

local live_ok = true
check('server starts and attaches', function()
  expect(client_id ~= nil, 'no client was started')
  local exited = false
  local ok = vim.wait(TIMEOUT, function()
    local c = kiln_client()
    -- get_client_by_id forgets a client whose server process has exited.
    exited = c == nil
    return exited or (c.initialized == true and vim.lsp.buf_is_attached(bufnr, client_id))
  end, 50)
  ok = ok and not exited
  if not ok then
    live_ok = false
  end
  expect(ok, exited and 'the server exited during start-up (see `kiln serve` on a terminal)'
    or ('no initialized kiln client within ' .. TIMEOUT .. ' ms'))
end)

local function line_of(pattern)
  for i, l in ipairs(vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)) do
    if l:find(pattern) then
      return i - 1 -- 0-based
    end
  end
  error('no line matches ' .. pattern)
end

if live_ok then
  check('diagnostic undeclared-species on the reaction line', function()
    local want_line = line_of('^reaction')
    local found
    local ok = vim.wait(TIMEOUT, function()
      for _, d in ipairs(vim.diagnostic.get(bufnr)) do
        if d.code == 'undeclared-species' then
          found = d
          return true
        end
      end
      return false
    end, 50)
    expect(ok, 'no undeclared-species diagnostic within ' .. TIMEOUT .. ' ms; got: ' .. vim.inspect(vim.diagnostic.get(bufnr)))
    expect(found.lnum == want_line, string.format('on line %d, want %d', found.lnum, want_line))
    local text = vim.api.nvim_buf_get_lines(bufnr, found.lnum, found.lnum + 1, false)[1]
    local word = text:sub(found.col + 1, found.end_col)
    expect(word == 'HO2', 'diagnostic range covers ' .. vim.inspect(word) .. ', want HO2')
  end)

  check('hover on a species name shows thermochemistry', function()
    local l = line_of('^species ethanol')
    local params = {
      textDocument = vim.lsp.util.make_text_document_params(),
      position = { line = l, character = 10 }, -- inside "ethanol"
    }
    local res = vim.lsp.buf_request_sync(bufnr, 'textDocument/hover', params, TIMEOUT)
    expect(res ~= nil, 'hover request timed out')
    local text = ''
    for _, r in pairs(res) do
      if r.error then
        error('hover error: ' .. vim.inspect(r.error))
      end
      if r.result and r.result.contents then
        local lines = vim.lsp.util.convert_input_to_markdown_lines(r.result.contents)
        text = text .. table.concat(lines, '\n')
      end
    end
    expect(text:find('ΔHf', 1, true) or text:find('kJ/mol', 1, true), 'hover text lacks ΔHf and kJ/mol: ' .. text)
  end)

  check('code action inserts a nasa7 block', function()
    local client = kiln_client()
    local l = line_of('^species ethanol')
    local diags = {}
    for _, d in ipairs(vim.diagnostic.get(bufnr, { lnum = l })) do
      if d.user_data and d.user_data.lsp then
        table.insert(diags, d.user_data.lsp)
      end
    end
    local params = {
      textDocument = vim.lsp.util.make_text_document_params(),
      range = { start = { line = l, character = 0 }, ['end'] = { line = l, character = 0 } },
      context = { diagnostics = diags },
    }
    local res = vim.lsp.buf_request_sync(bufnr, 'textDocument/codeAction', params, TIMEOUT)
    expect(res ~= nil, 'codeAction request timed out')
    local action, titles = nil, {}
    for _, r in pairs(res) do
      for _, a in ipairs(r.result or {}) do
        table.insert(titles, a.title)
        if not action and a.title and a.title:find('NASA-7', 1, true) then
          action = a
        end
      end
    end
    expect(action, 'no code action titled NASA-7; got ' .. vim.inspect(titles))
    if not action.edit and action.data and client.supports_method('codeAction/resolve') then
      local rr = client.request_sync('codeAction/resolve', action, TIMEOUT, bufnr)
      expect(rr and rr.result, 'codeAction/resolve failed')
      action = rr.result
    end
    local enc = client.offset_encoding or 'utf-16'
    if action.edit then
      vim.lsp.util.apply_workspace_edit(action.edit, enc)
    end
    local cmd = action.command
    if type(cmd) == 'table' then
      local rr = client.request_sync('workspace/executeCommand', cmd, TIMEOUT, bufnr)
      expect(rr and not rr.err, 'executeCommand failed')
    end
    local lines = vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)
    local n7, low, high = false, false, false
    for _, t in ipairs(lines) do
      n7 = n7 or t:match('^%s+nasa7%s') ~= nil
      low = low or t:match('^%s+low%s') ~= nil
      high = high or t:match('^%s+high%s') ~= nil
    end
    expect(n7 and low and high, 'buffer lacks nasa7/low/high lines:\n' .. table.concat(lines, '\n'))
    -- The block must follow the ethanol declaration.
    expect(lines[l + 2]:match('^%s+nasa7%s'), 'nasa7 is not right under the species line:\n' .. table.concat(lines, '\n'))
  end)
end

io.stdout:write(string.format('%d passed, %d failed\n', passed, failed))
-- Graceful shutdown (shutdown + exit), then wait for the process to go.
for _, c in pairs(vim.lsp.get_active_clients()) do
  c.stop()
end
vim.wait(5000, function()
  return #vim.lsp.get_active_clients() == 0
end, 50)
if failed > 0 then
  vim.cmd('cquit 1')
else
  vim.cmd('qall!')
end
