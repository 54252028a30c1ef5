-- Headless test of the kiln Neovim plugin; run through test/run.sh.
-- Environment: KILN_PLUGIN_DIR (editors/nvim), KILN_BINARY (server binary),
-- KILN_WORKDIR (scratch directory holding fixture.kiln and syntax.kiln).
local plugin_dir = assert(os.getenv('KILN_PLUGIN_DIR'), 'KILN_PLUGIN_DIR not set')
local binary = assert(os.getenv('KILN_BINARY'), 'KILN_BINARY not set')
local workdir = assert(os.getenv('KILN_WORKDIR'), 'KILN_WORKDIR not set')

vim.opt.runtimepath:prepend(plugin_dir)
vim.cmd('filetype plugin indent on')
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
-- Indentation (indent/kiln.lua), typed as a user types it.
------------------------------------------------------------------------
local function keys(s)
  vim.api.nvim_feedkeys(vim.api.nvim_replace_termcodes(s, true, false, true), 'xt', false)
end

check('indent: a statement typed under an indented line goes to column 0', function()
  vim.cmd('enew!')
  vim.bo.filetype = 'kiln'
  expect(vim.bo.indentexpr ~= '', 'indentexpr not set')
  vim.api.nvim_buf_set_lines(0, 0, -1, false, { 'species ethanol CCO', '  multiplicity 1' })
  vim.cmd('normal! G')
  keys('ospecies ethane CC<Esc>')
  keys('oreaction ethanol => ethane<Esc>')
  local lines = vim.api.nvim_buf_get_lines(0, 0, -1, false)
  expect(lines[3] == 'species ethane CC', 'species line: ' .. vim.inspect(lines[3]))
  expect(lines[4] == 'reaction ethanol => ethane', 'reaction line: ' .. vim.inspect(lines[4]))
end)

check('indent: attributes by 2, block lines by 4, back to 2 after a block', function()
  vim.cmd('enew!')
  vim.bo.filetype = 'kiln'
  keys('ispecies ethanol CCO<CR>nasa7 300 1000 5000<CR>low 1 2 3 4 5 6 7<CR>high 1 2 3 4 5 6 7<CR>symmetry 3<CR>group C-(C)(H)3<CR>hf298 -10.2<Esc>')
  local got = vim.api.nvim_buf_get_lines(0, 0, -1, false)
  local want = {
    'species ethanol CCO',
    '  nasa7 300 1000 5000',
    '    low 1 2 3 4 5 6 7',
    '    high 1 2 3 4 5 6 7',
    '  symmetry 3',
    'group C-(C)(H)3',
    '  hf298 -10.2',
  }
  expect(vim.deep_equal(got, want), 'got ' .. vim.inspect(got))
  -- = over the whole buffer leaves it as it is.
  vim.cmd('normal! gg=G')
  got = vim.api.nvim_buf_get_lines(0, 0, -1, false)
  expect(vim.deep_equal(got, want), 'after gg=G: ' .. vim.inspect(got))
end)

------------------------------------------------------------------------
-- Live checks against the language server.
------------------------------------------------------------------------
local TIMEOUT = 20000 -- ms; generous for a cold start on a loaded CI machine

-- Messages the server shows (window/showMessage).
local notes = {}
local show_message = vim.lsp.handlers['window/showMessage']
vim.lsp.handlers['window/showMessage'] = function(err, result, ctx, config)
  table.insert(notes, result and result.message or '')
  return show_message(err, result, ctx, config)
end

-- No settings: the plugin must still send a settings object, not an array.
require('kiln').setup({ cmd = { binary, 'serve' } })
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

-- The live kiln client attached to buffer b, or nil.
local function kiln_client_for_test(b)
  for _, c in pairs(vim.lsp.buf_get_clients(b)) do
    if c.name == 'kiln' and c.initialized and not c.is_stopped() then
      return c
    end
  end
  return nil
end

local function line_of_buf(b, pattern)
  for i, l in ipairs(vim.api.nvim_buf_get_lines(b, 0, -1, false)) do
    if l:find(pattern) then
      return i - 1
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

  check('K on a species name opens the hover (Neovim before 0.10 has no default hover key)', function()
    local l = line_of('^species ethanol')
    vim.api.nvim_win_set_cursor(0, { l + 1, 10 })
    local before = #vim.api.nvim_list_wins()
    keys('K')
    local float
    local ok = vim.wait(TIMEOUT, function()
      for _, w in ipairs(vim.api.nvim_list_wins()) do
        if vim.api.nvim_win_get_config(w).relative ~= '' then
          float = w
          return true
        end
      end
      return false
    end, 50)
    expect(ok, 'no hover window after K (windows before: ' .. before .. ', K maps to ' .. vim.inspect(vim.fn.maparg('K', 'n')) .. ')')
    local text = table.concat(vim.api.nvim_buf_get_lines(vim.api.nvim_win_get_buf(float), 0, -1, false), '\n')
    vim.api.nvim_win_close(float, true)
    expect(text:find('ΔHf', 1, true), 'hover window lacks ΔHf: ' .. text)
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
  check('settings: an empty settings table is sent as an object', function()
    vim.wait(300, function() return false end)
    for _, m in ipairs(notes) do
      expect(not m:find('settings', 1, true), 'server complained: ' .. m)
    end
  end)

  check('completion: omnifunc set by the README setup, <C-x><C-o> lists species', function()
    expect(vim.bo[bufnr].omnifunc == 'v:lua.vim.lsp.omnifunc', 'omnifunc is ' .. vim.inspect(vim.bo[bufnr].omnifunc))
    vim.cmd('normal! G')
    local items
    local au = vim.api.nvim_create_autocmd('CompleteChanged', {
      callback = function()
        items = vim.fn.complete_info({ 'items' }).items
      end,
    })
    -- Typed keys run until insert mode ends; a timer ends it once the menu
    -- shows (or after TIMEOUT).
    local deadline = vim.loop.now() + TIMEOUT
    local timer = vim.loop.new_timer()
    local ended = false
    timer:start(20, 20, vim.schedule_wrap(function()
      if not ended and (items or vim.loop.now() > deadline) then
        ended = true
        timer:stop()
        timer:close()
        vim.api.nvim_feedkeys(vim.api.nvim_replace_termcodes('<C-e><Esc>', true, false, true), 'n', false)
      end
    end))
    vim.v.errmsg = ''
    vim.api.nvim_feedkeys(vim.api.nvim_replace_termcodes('oreaction eth<C-x><C-o>', true, false, true), 'tx!', false)
    vim.api.nvim_del_autocmd(au)
    local errmsg = vim.v.errmsg
    vim.cmd('silent! undo')
    expect(not errmsg:find('E764'), errmsg)
    expect(items, 'no completion menu within ' .. TIMEOUT .. ' ms; errmsg ' .. errmsg)
    local words = {}
    for _, it in ipairs(items) do
      words[it.word] = true
    end
    expect(words.ethanol and words.ethane, 'completion items: ' .. vim.inspect(vim.tbl_keys(words)))
  end)

  check('inlay hints: capability advertised, estimates shown at line ends', function()
    local client = kiln_client()
    if require('kiln').native_inlay_hints() then
      return -- Neovim shows them itself
    end
    local caps = client.config.capabilities
    expect(caps.textDocument and caps.textDocument.inlayHint, 'textDocument.inlayHint not advertised')
    local l = line_of('^species ethane ')
    local text
    local ok = vim.wait(TIMEOUT, function()
      for _, m in ipairs(vim.api.nvim_buf_get_extmarks(bufnr, require('kiln').hint_namespace, { l, 0 }, { l, -1 }, { details = true })) do
        text = m[4].virt_text[1][1]
        return text:find('ΔHf', 1, true) ~= nil
      end
      return false
    end, 50)
    expect(ok, 'no inlay hint on line ' .. l .. ': ' .. tostring(text))
  end)

  check('severity: an error on a line with a warning is the one shown', function()
    vim.cmd('edit ' .. vim.fn.fnameescape(workdir .. '/severity.kiln'))
    local b = vim.api.nvim_get_current_buf()
    local l = line_of_buf(b, '^reaction')
    local ok = vim.wait(TIMEOUT, function()
      local sev = {}
      for _, d in ipairs(vim.diagnostic.get(b, { lnum = l })) do
        sev[d.severity] = true
      end
      return sev[vim.diagnostic.severity.ERROR] and sev[vim.diagnostic.severity.WARN]
    end, 50)
    expect(ok, 'want an error and a warning on line ' .. l .. ': ' .. vim.inspect(vim.diagnostic.get(b, { lnum = l })))
    local ns = vim.lsp.diagnostic.get_namespace(client_id)
    local vt_ns = vim.diagnostic.get_namespace(ns).user_data.virt_text_ns
    local marks = vim.api.nvim_buf_get_extmarks(b, vt_ns, { l, 0 }, { l, -1 }, { details = true })
    expect(#marks == 1, 'virtual text marks on the line: ' .. #marks)
    local chunks = marks[1][4].virt_text
    local last = chunks[#chunks]
    expect(last[2] == 'DiagnosticVirtualTextError', 'message shown with ' .. last[2] .. ': ' .. last[1])
    expect(last[1]:find('unbalanced', 1, true), 'message shown: ' .. last[1])
    local float_b = vim.diagnostic.open_float(b, { scope = 'line', pos = l })
    if float_b then
      local fl = vim.api.nvim_buf_get_lines(float_b, 0, -1, false)
      vim.cmd('silent! fclose') -- 0.7 has no :fclose; the float closes on the next move
      local first_msg = fl[2] or ''
      expect(first_msg:find('unbalanced', 1, true), 'float lists first: ' .. first_msg)
    end
    vim.cmd('buffer ' .. bufnr)
  end)

  check('unnamed buffer with ft=kiln is analysed', function()
    vim.cmd('enew!')
    local b = vim.api.nvim_get_current_buf()
    vim.api.nvim_buf_set_lines(b, 0, -1, false, {
      'species ethanol CCO',
      'reaction ethanol => HO2   A=1e13 n=0 Ea=80',
    })
    vim.bo[b].filetype = 'kiln'
    local ok = vim.wait(TIMEOUT, function()
      for _, d in ipairs(vim.diagnostic.get(b)) do
        if d.code == 'undeclared-species' then
          return true
        end
      end
      return false
    end, 50)
    expect(ok, 'no undeclared-species diagnostic in the unnamed buffer: ' .. vim.inspect(vim.diagnostic.get(b)))
    -- Nothing landed in a stray buffer named after the URI.
    for _, o in ipairs(vim.api.nvim_list_bufs()) do
      expect(not vim.api.nvim_buf_get_name(o):find('untitled:', 1, true), 'stray buffer ' .. vim.api.nvim_buf_get_name(o))
    end
    vim.cmd('buffer ' .. bufnr)
  end)

  -- Equilibrium: :KilnEquilibrium, the code lens, errors.
  local flame_buf
  local function result_lines(first)
    for _, o in ipairs(vim.api.nvim_list_bufs()) do
      if vim.api.nvim_buf_get_name(o):find('[kiln equilibrium]', 1, true) then
        local ls = vim.api.nvim_buf_get_lines(o, 0, -1, false)
        if ls[1] == first and #ls > 3 then
          return ls, o
        end
      end
    end
    return nil
  end
  local function final_T(lines)
    return tonumber(table.concat(lines, '\n'):match('final%s+T = ([%d.]+) K'))
  end

  check('equilibrium: :KilnEquilibrium MIX shows what kiln equilibrium prints', function()
    vim.cmd('edit ' .. vim.fn.fnameescape(workdir .. '/flame.kiln'))
    flame_buf = vim.api.nvim_get_current_buf()
    expect(vim.wait(TIMEOUT, function() return vim.lsp.buf_is_attached(flame_buf, client_id) end, 50), 'flame.kiln not attached')
    local mix = 'CH4:1, O2:2, N2:7.52'
    vim.cmd('KilnEquilibrium ' .. mix)
    local got, rb
    expect(vim.wait(TIMEOUT, function()
      got, rb = result_lines('mix: ' .. mix)
      return got ~= nil
    end, 50), 'no [kiln equilibrium] buffer with the result')
    expect(vim.fn.bufwinid(rb) ~= -1, 'the result buffer is not shown')
    expect(vim.api.nvim_get_current_buf() == flame_buf, 'the cursor left the kiln file')
    local cli = vim.fn.systemlist('cd ' .. vim.fn.shellescape(workdir) .. ' && ' .. vim.fn.shellescape(binary)
      .. ' equilibrium flame.kiln --adiabatic --mix ' .. vim.fn.shellescape(mix))
    expect(vim.v.shell_error == 0, 'kiln equilibrium failed: ' .. table.concat(cli, '\n'))
    local shown = { unpack(got, 2) }
    expect(vim.deep_equal(shown, cli), 'buffer:\n' .. table.concat(shown, '\n') .. '\nCLI:\n' .. table.concat(cli, '\n'))
    local T = final_T(got)
    -- Stoichiometric methane-air from 298.15 K at 1 atm: about 2225 K (common practice).
    expect(T and math.abs(T - 2225) < 10, 'flame temperature ' .. tostring(T))
  end)

  check('equilibrium: the code lens asks for the mixture and shows the result', function()
    vim.cmd('buffer ' .. flame_buf)
    local lens
    expect(vim.wait(TIMEOUT, function()
      vim.lsp.codelens.refresh()
      for _, l in ipairs(vim.lsp.codelens.get(flame_buf) or {}) do
        if l.command and l.command.command == 'kiln.showEquilibrium' then
          lens = l
          return true
        end
      end
      return false
    end, 200), 'no equilibrium code lens: ' .. vim.inspect(vim.lsp.codelens.get(flame_buf)))
    expect(lens.range.start.line == line_of_buf(flame_buf, '^species CH4'), 'lens on line ' .. lens.range.start.line)
    expect(lens.command.title == 'Equilibrium / flame temperature…', 'lens title ' .. lens.command.title)
    local asked
    local input = vim.ui.input
    vim.ui.input = function(o, cb)
      asked = o
      cb('H2:2, O2:1')
    end
    vim.api.nvim_win_set_cursor(0, { lens.range.start.line + 1, 0 })
    local ok, err = pcall(vim.lsp.codelens.run)
    vim.ui.input = input
    expect(ok, 'codelens.run: ' .. tostring(err))
    expect(asked and asked.prompt:find('Mixture', 1, true), 'no mixture prompt: ' .. vim.inspect(asked))
    local got
    expect(vim.wait(TIMEOUT, function()
      got = result_lines('mix: H2:2, O2:1')
      return got ~= nil
    end, 50), 'no result for the mixture typed at the prompt')
    -- Hydrogen-oxygen from 298.15 K at 1 atm burns above 3000 K (README: 3075 K).
    local T = final_T(got)
    expect(T and T > 3000 and T < 3150, 'hydrogen-oxygen flame temperature ' .. tostring(T))
  end)

  check('equilibrium: an undeclared species is reported with the server message', function()
    vim.cmd('buffer ' .. flame_buf)
    local msgs = {}
    local notify = vim.notify
    vim.notify = function(m)
      table.insert(msgs, m)
    end
    vim.cmd('KilnEquilibrium CH4:1, XY:2')
    local ok = vim.wait(TIMEOUT, function() return #msgs > 0 end, 50)
    vim.notify = notify
    expect(ok, 'no message')
    expect(msgs[1]:find('mix species XY is not declared in flame.kiln', 1, true), 'message: ' .. msgs[1])
    vim.cmd('buffer ' .. bufnr)
  end)

  -- Code lenses shown in bufnr: { client_id = n, title = s } per extmark
  -- in the code-lens namespaces of vim.lsp.
  local function shown_lenses(b)
    local out = {}
    for name, ns in pairs(vim.api.nvim_get_namespaces()) do
      local id = tonumber(name:match('^vim_lsp_codelens:(%d+)$'))
      if id then
        for _, m in ipairs(vim.api.nvim_buf_get_extmarks(b, ns, 0, -1, { details = true })) do
          for _, chunk in ipairs(m[4].virt_text or {}) do
            if chunk[2] == 'LspCodeLens' then
              table.insert(out, { client_id = id, title = chunk[1], line = m[2] })
            end
          end
        end
      end
    end
    return out
  end
  local function hint_marks(b)
    return vim.api.nvim_buf_get_extmarks(b, require('kiln').hint_namespace, 0, -1, {})
  end
  local function lens_clients(b)
    local ids = {}
    for _, l in ipairs(vim.lsp.codelens.get(b) or {}) do
      ids[#ids + 1] = l.command and l.command.title or '?'
    end
    return ids
  end

  check('restart after a crash: lenses, hints and diagnostics of the dead server go, new ones come', function()
    vim.cmd('buffer ' .. bufnr)
    local old = kiln_client()
    local own_hints = not require('kiln').native_inlay_hints()
    local function lenses_of(id)
      local n = 0
      for _, l in ipairs(shown_lenses(bufnr)) do
        if l.client_id == id then
          n = n + 1
        end
      end
      return n
    end
    expect(vim.wait(TIMEOUT, function()
      vim.lsp.codelens.refresh()
      return lenses_of(old.id) == 1 and (not own_hints or #hint_marks(bufnr) > 0)
        and #vim.diagnostic.get(bufnr) > 0
    end, 200), 'before the crash: lenses ' .. vim.inspect(shown_lenses(bufnr)) .. ', hints ' .. #hint_marks(bufnr))
    -- The server dies while a code-lens request is in flight.
    vim.lsp.codelens.refresh()
    vim.loop.kill(old.rpc.pid, 9)
    expect(vim.wait(TIMEOUT, function() return vim.lsp.get_client_by_id(old.id) == nil end, 50), 'client did not notice the crash')
    -- A refresh asked while no server runs (as the autocmd suggested by
    -- :help vim.lsp.codelens.refresh() does) gets no answer.
    vim.lsp.codelens.refresh()
    -- Nothing the dead server computed stays on screen.
    expect(vim.wait(2000, function()
      return #shown_lenses(bufnr) == 0 and #hint_marks(bufnr) == 0 and #vim.diagnostic.get(bufnr) == 0
        and #(vim.lsp.codelens.get(bufnr) or {}) == 0
    end, 50), string.format('after the crash: lenses shown %s, lenses kept %s, hints %d, diagnostics %d',
      vim.inspect(shown_lenses(bufnr)), vim.inspect(lens_clients(bufnr)), #hint_marks(bufnr), #vim.diagnostic.get(bufnr)))
    vim.cmd('KilnRestart')
    local new
    expect(vim.wait(TIMEOUT, function()
      new = kiln_client_for_test(bufnr)
      return new ~= nil and new.id ~= old.id
    end, 50), 'no kiln client after :KilnRestart')
    client_id = new.id
    -- The new server's lens (once), hints and diagnostics are shown without
    -- any action of the user.
    local ok = vim.wait(TIMEOUT, function()
      local shown = shown_lenses(bufnr)
      return #shown == 1 and shown[1].client_id == new.id and #(vim.lsp.codelens.get(bufnr) or {}) == 1
        and (not own_hints or #hint_marks(bufnr) > 0) and #vim.diagnostic.get(bufnr) > 0
    end, 50)
    expect(ok, string.format('after :KilnRestart: lenses shown %s, lenses kept %s, hints %d, diagnostics %d',
      vim.inspect(shown_lenses(bufnr)), vim.inspect(lens_clients(bufnr)), #hint_marks(bufnr), #vim.diagnostic.get(bufnr)))
    -- Running the lens reaches the new server (the dead one would raise).
    local asked
    local input = vim.ui.input
    vim.ui.input = function(o, cb)
      asked = o
    end
    vim.api.nvim_win_set_cursor(0, { shown_lenses(bufnr)[1].line + 1, 0 })
    local rok, rerr = pcall(vim.lsp.codelens.run)
    vim.ui.input = input
    expect(rok and asked, 'codelens.run after restart: ' .. tostring(rerr))
  end)

  check(':KilnRestart of a running server: one lens, from the new server', function()
    vim.cmd('buffer ' .. bufnr)
    local old = kiln_client_for_test(bufnr)
    expect(old, 'no running kiln client')
    vim.cmd('KilnRestart')
    local new
    local ok = vim.wait(TIMEOUT, function()
      new = kiln_client_for_test(bufnr)
      local shown = shown_lenses(bufnr)
      return new ~= nil and new.id ~= old.id and #shown == 1 and shown[1].client_id == new.id
        and #(vim.lsp.codelens.get(bufnr) or {}) == 1 and #vim.diagnostic.get(bufnr) > 0
    end, 50)
    expect(ok, string.format('after :KilnRestart: lenses shown %s, lenses kept %s, diagnostics %d',
      vim.inspect(shown_lenses(bufnr)), vim.inspect(lens_clients(bufnr)), #vim.diagnostic.get(bufnr)))
    client_id = new.id
    -- The old server's exit, which comes later, takes nothing of the new one's.
    expect(vim.wait(TIMEOUT, function() return vim.lsp.get_client_by_id(old.id) == nil end, 50), 'old server still runs')
    vim.wait(300, function() return false end)
    local shown = shown_lenses(bufnr)
    expect(#shown == 1 and shown[1].client_id == new.id, 'after the old exit: ' .. vim.inspect(shown))
    expect(not require('kiln').native_inlay_hints() and #hint_marks(bufnr) > 0 or require('kiln').native_inlay_hints(),
      'inlay hints gone after the old server exited')
  end)

  check('restart after a crash: the buffer is in sync, later edits are sent', function()
    local has_code = function(code)
      for _, d in ipairs(vim.diagnostic.get(bufnr)) do
        if d.code == code then
          return true
        end
      end
      return false
    end
    expect(vim.wait(TIMEOUT, function() return has_code('undeclared-species') end, 50), 'no undeclared-species before the crash')
    local old = kiln_client()
    vim.loop.kill(old.rpc.pid, 9)
    expect(vim.wait(TIMEOUT, function() return vim.lsp.get_client_by_id(old.id) == nil end, 50), 'client did not notice the crash')
    -- Typed while no server runs: declares HO2.
    vim.api.nvim_buf_set_lines(bufnr, -1, -1, false, { 'species HO2 O[O]' })
    vim.cmd('KilnRestart')
    local new_id
    expect(vim.wait(TIMEOUT, function()
      for _, c in pairs(vim.lsp.buf_get_clients(bufnr)) do
        if c.name == 'kiln' and c.initialized then
          new_id = c.id
          return true
        end
      end
      return false
    end, 50), 'no kiln client after :KilnRestart')
    client_id = new_id
    -- The new server has the text typed during the crash ...
    expect(vim.wait(TIMEOUT, function()
      return not has_code('undeclared-species') and #vim.diagnostic.get(bufnr) > 0
    end, 50), 'HO2 declared during the crash is unknown to the new server: ' .. vim.inspect(vim.diagnostic.get(bufnr)))
    -- ... and an edit after the restart reaches it.
    vim.api.nvim_buf_set_lines(bufnr, -2, -1, false, {})
    expect(vim.wait(TIMEOUT, function() return has_code('undeclared-species') end, 50),
      'edit after restart not sent: ' .. vim.inspect(vim.diagnostic.get(bufnr)))
  end)

  check('server stderr: no [ERROR] lines in the LSP log', function()
    local path = vim.lsp.get_log_path()
    local f = io.open(path, 'r')
    local bad = {}
    if f then
      for line in f:lines() do
        if line:find('[ERROR]', 1, true) and line:find('stderr', 1, true) then
          table.insert(bad, line)
        end
      end
      f:close()
    end
    expect(#bad == 0, #bad .. ' stderr lines logged as errors, e.g. ' .. tostring(bad[1]))
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
