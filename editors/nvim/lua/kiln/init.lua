-- kiln: Neovim client for the kiln language server (`kiln serve`).
--
-- Works on Neovim 0.7 and later using only vim.lsp.start_client and
-- vim.lsp.buf_attach_client. One server process runs per root directory;
-- the root is the nearest ancestor holding a .git entry, else the file's
-- directory (for an unnamed buffer: the current directory).
--
--   require('kiln').setup({
--     cmd = { 'kiln', 'serve' },              -- server command line
--     settings = { units = 'kJ/mol', tMid = 1000, tHigh = 5000,
--                  mismatchHf298 = 3, mismatchS298 = 3, collisionFactor = 1,
--                  estimateNotes = false },
--     root_markers = { '.git' },              -- optional
--     inlay_hints = true,                     -- optional: show estimates at line ends
--     omnifunc = true,                        -- optional: set 'omnifunc' for <C-x><C-o>
--     hover_key = 'K',                        -- optional: buffer-local hover key on Neovim
--                                             --   before 0.10 (false: none); 0.10+ maps K itself
--     debounce_ms = 50,                       -- optional: delay before sending changes
--     diagnostics = { severity_sort = true }, -- optional: vim.diagnostic options for kiln
--     on_attach = function(client, bufnr) end, -- optional
--     code_lens = true,                       -- optional: show the equilibrium code lens
--     equilibrium = {                         -- optional: :KilnEquilibrium defaults
--       mix = 'CH4:1, O2:2, N2:7.52',         --   offered in the prompt (default none)
--       temperature = 298.15, pressure = '1atm',
--       adiabatic = true,                     --   flame temperature (false: T held)
--       volume = false,                       --   constant volume instead of pressure
--     },
--   })
--
-- :KilnEquilibrium [MIX] computes the equilibrium (by default the adiabatic
-- flame temperature at constant pressure) of the mixture over the current
-- file's species from the file's own thermo, with the server's
-- kiln.equilibrium command (the code of `kiln equilibrium`), and shows it in
-- the scratch buffer [kiln equilibrium]. Without MIX it asks with
-- vim.ui.input. The code lens "Equilibrium / flame temperature…" on the first
-- species line runs the same command (vim.lsp.codelens.run()).
--
-- settings are sent as initializationOptions {kiln = settings} and as
-- workspace/didChangeConfiguration {settings = {kiln = settings}}; the keys
-- are the server's own (see the kiln README).
--
-- Inlay hints (estimated ΔHf°298 and S°298 of species without thermo data,
-- ΔH°r of reactions) use Neovim's own inlay hints where it has them (0.10+).
-- Older versions have none: there this plugin asks the server for the hints
-- of the visible lines and shows them as end-of-line virtual text
-- (highlight group KilnInlayHint), and tells the server so through the
-- client capability textDocument.inlayHint.
local M = {}

local defaults = {
  cmd = { 'kiln', 'serve' },
  settings = {},
  root_markers = { '.git' },
  inlay_hints = true,
  omnifunc = true,
  hover_key = 'K',
  debounce_ms = 50,
  diagnostics = { severity_sort = true },
  on_attach = nil,
  code_lens = true,
  equilibrium = { mix = nil, temperature = 298.15, pressure = '1atm', adiabatic = true, volume = false },
}

-- Per-Neovim-session state.
local state = {
  config = nil,
  clients = {}, -- client id by root
  augroup = nil,
  watched = {}, -- buffers whose changes this plugin follows (see watch)
  orphaned = {}, -- buffers changed while no language client was attached
  hint_timers = {}, -- pending inlay-hint refresh per buffer
  attached = {}, -- buffers (set) per client id, for clean-up when it exits
  set_up = {}, -- per buffer: { hints = true, lens = true } once autocmds exist
}

local hint_ns = vim.api.nvim_create_namespace('kiln_inlay_hints')
M.hint_namespace = hint_ns

local function merged(opts)
  local cfg = vim.tbl_deep_extend('force', {}, defaults, opts or {})
  if type(cfg.cmd) == 'string' then
    cfg.cmd = { cfg.cmd, 'serve' }
  end
  return cfg
end

-- The settings object as sent to the server. An empty Lua table would be
-- encoded as a JSON array, which the server rejects.
local function settings_payload(settings)
  local s = settings
  if s == nil or next(s) == nil then
    s = vim.empty_dict()
  end
  return { kiln = s }
end

--- True if this Neovim shows inlay hints itself (0.10 and later).
function M.native_inlay_hints()
  local ih = vim.lsp.inlay_hint
  return type(ih) == 'table' and type(ih.enable) == 'function'
end

--- Returns the directory used as the workspace root for a file: the nearest
--- ancestor (starting at the file's own directory) that contains one of
--- `markers`, else the file's directory.
---@param fname string absolute file name
---@param markers string[]|nil marker names, default { '.git' }
---@return string
function M.root_dir(fname, markers)
  markers = markers or { '.git' }
  local start = vim.fn.fnamemodify(fname, ':p:h')
  local dir = start
  while true do
    for _, m in ipairs(markers) do
      if vim.loop.fs_stat(dir .. '/' .. m) then
        return dir
      end
    end
    local parent = vim.fn.fnamemodify(dir, ':h')
    if parent == dir then
      return start
    end
    dir = parent
  end
end

local function client_alive(id)
  local c = id and vim.lsp.get_client_by_id(id)
  return c ~= nil and not c.is_stopped()
end

------------------------------------------------------------------------
-- Unnamed buffers. vim.lsp names a buffer by its file name; an unnamed
-- buffer would be sent as "file://", which names no file, and the server's
-- answers for it would never find the buffer again. Unnamed buffers are
-- given the URI "untitled:kiln-N" (N the buffer number) instead; the server
-- keeps such documents in memory like the untitled documents of other
-- editors.
------------------------------------------------------------------------
local untitled_prefix = 'untitled:kiln-'

-- The buffer an untitled:kiln-N URI names, or nil.
local function untitled_buffer(uri)
  local n = type(uri) == 'string' and uri:match('^untitled:kiln%-(%d+)$')
  local b = n and tonumber(n)
  if b and vim.api.nvim_buf_is_valid(b) and vim.api.nvim_buf_get_name(b) == '' then
    return b
  end
  return nil
end

-- Neovim 0.7 finds the buffer of published diagnostics by file name, which
-- an untitled URI is not: such diagnostics are converted and set here.
local function set_untitled_diagnostics(bufnr, result, ctx, config)
  local client = vim.lsp.get_client_by_id(ctx.client_id)
  local enc = client and client.offset_encoding or 'utf-16'
  local ns = vim.lsp.diagnostic.get_namespace(ctx.client_id)
  local function col(pos)
    local ok, c = pcall(vim.lsp.util._get_line_byte_from_position, bufnr, pos, enc)
    return ok and c or pos.character
  end
  local out = {}
  for _, d in ipairs(result.diagnostics or {}) do
    table.insert(out, {
      lnum = d.range.start.line,
      col = col(d.range.start),
      end_lnum = d.range['end'].line,
      end_col = col(d.range['end']),
      severity = d.severity or vim.diagnostic.severity.ERROR,
      message = d.message,
      source = d.source,
      code = d.code,
      user_data = { lsp = d },
    })
  end
  if config then
    vim.diagnostic.config(config, ns)
  end
  vim.diagnostic.set(ns, bufnr, out)
end

local function install_untitled_uris()
  if vim.uri_from_bufnr == nil or M._untitled_installed then
    return
  end
  M._untitled_installed = true
  local from_bufnr, to_bufnr = vim.uri_from_bufnr, vim.uri_to_bufnr
  vim.uri_from_bufnr = function(bufnr)
    local b = (bufnr == nil or bufnr == 0) and vim.api.nvim_get_current_buf() or bufnr
    if vim.api.nvim_buf_is_valid(b) and vim.api.nvim_buf_get_name(b) == '' and vim.bo[b].filetype == 'kiln' then
      return untitled_prefix .. b
    end
    return from_bufnr(bufnr)
  end
  vim.uri_to_bufnr = function(uri)
    return untitled_buffer(uri) or to_bufnr(uri)
  end
end

------------------------------------------------------------------------
-- Re-synchronisation after a server crash. On Neovim 0.7-0.9, a change
-- made while no client is attached makes vim.lsp stop following the
-- buffer (its on_lines callback detaches) while it still records the
-- buffer as attached, so a client attached later receives the didOpen but
-- none of the later changes. This plugin notes such changes and, before
-- attaching the new client, clears vim.lsp's record so that attaching
-- follows the buffer again and opens it with its full current text.
------------------------------------------------------------------------
local function lsp_buffer_clients()
  local f = vim.lsp.buf_attach_client
  for i = 1, 200 do
    local name, val = debug.getupvalue(f, i)
    if name == nil then
      return nil
    end
    if name == 'all_buffer_active_clients' and type(val) == 'table' then
      return val
    end
  end
  return nil
end

local function watch(bufnr)
  if state.watched[bufnr] then
    return
  end
  local tracked = lsp_buffer_clients()
  if not tracked then
    return -- a Neovim whose change tracking this plugin does not know
  end
  state.watched[bufnr] = true
  vim.api.nvim_buf_attach(bufnr, false, {
    on_lines = function()
      local ids = tracked[bufnr]
      if ids ~= nil and next(ids) == nil then
        state.orphaned[bufnr] = true
      end
    end,
    on_reload = function() end,
    on_detach = function()
      state.watched[bufnr] = nil
      state.orphaned[bufnr] = nil
    end,
  })
end

local function repair_tracking(bufnr)
  if not state.orphaned[bufnr] then
    return
  end
  state.orphaned[bufnr] = nil
  local tracked = lsp_buffer_clients()
  local ids = tracked and tracked[bufnr]
  if ids ~= nil and next(ids) == nil then
    tracked[bufnr] = nil
  end
end

------------------------------------------------------------------------
-- Inlay hints rendered by the plugin (Neovim < 0.10).
------------------------------------------------------------------------
local function kiln_client_for(bufnr)
  -- get_clients from 0.10 on (buf_get_clients is deprecated there).
  local clients = vim.lsp.get_clients and vim.lsp.get_clients({ bufnr = bufnr }) or vim.lsp.buf_get_clients(bufnr)
  for _, c in pairs(clients) do
    if c.name == 'kiln' and not c.is_stopped() then
      return c
    end
  end
  return nil
end

local function label_text(label)
  if type(label) == 'string' then
    return label
  end
  local parts = {}
  for _, p in ipairs(label or {}) do
    table.insert(parts, p.value or '')
  end
  return table.concat(parts)
end

-- Lines (0-based, end exclusive) shown in the windows displaying bufnr,
-- or nil when no window shows it.
local function visible_range(bufnr)
  local first, last
  for _, win in ipairs(vim.api.nvim_list_wins()) do
    if vim.api.nvim_win_get_buf(win) == bufnr then
      local r = vim.api.nvim_win_call(win, function()
        return { vim.fn.line('w0'), vim.fn.line('w$') }
      end)
      local top, bot = r[1], r[2]
      first = math.min(first or top, top)
      last = math.max(last or bot, bot)
    end
  end
  if not first then
    return nil
  end
  return first - 1, last
end

--- Shows the inlay hints of bufnr at the ends of their lines.
--- hints are LSP InlayHint objects.
function M.render_hints(bufnr, hints, first, last)
  vim.api.nvim_buf_clear_namespace(bufnr, hint_ns, 0, -1)
  local by_line = {}
  local nlines = vim.api.nvim_buf_line_count(bufnr)
  for _, h in ipairs(hints or {}) do
    local l = h.position and h.position.line
    if l and l >= first and l < last and l < nlines then
      by_line[l] = by_line[l] or {}
      table.insert(by_line[l], label_text(h.label))
    end
  end
  for l, labels in pairs(by_line) do
    vim.api.nvim_buf_set_extmark(bufnr, hint_ns, l, 0, {
      virt_text = { { '  ' .. table.concat(labels, '  '), 'KilnInlayHint' } },
      virt_text_pos = 'eol',
      hl_mode = 'combine',
      priority = 5, -- before diagnostics' virtual text
    })
  end
end

--- Asks the server for the hints of the visible lines of bufnr and shows them.
function M.refresh_hints(bufnr)
  bufnr = (bufnr == nil or bufnr == 0) and vim.api.nvim_get_current_buf() or bufnr
  if not vim.api.nvim_buf_is_valid(bufnr) then
    return
  end
  local client = kiln_client_for(bufnr)
  local first, last = visible_range(bufnr)
  if not client or not first then
    return
  end
  local tick = vim.api.nvim_buf_get_changedtick(bufnr)
  local params = {
    textDocument = { uri = vim.uri_from_bufnr(bufnr) },
    range = { start = { line = first, character = 0 }, ['end'] = { line = last, character = 0 } },
  }
  client.request('textDocument/inlayHint', params, function(err, result)
    if err or not vim.api.nvim_buf_is_valid(bufnr) then
      return
    end
    if vim.api.nvim_buf_get_changedtick(bufnr) ~= tick then
      return -- the text moved on; the next publication asks again
    end
    M.render_hints(bufnr, result, first, last)
  end, bufnr)
end

local function schedule_hints(bufnr, delay)
  if state.hint_timers[bufnr] then
    state.hint_timers[bufnr]:stop()
    state.hint_timers[bufnr]:close()
  end
  local t = vim.loop.new_timer()
  state.hint_timers[bufnr] = t
  t:start(delay or 50, 0, vim.schedule_wrap(function()
    if state.hint_timers[bufnr] == t then
      state.hint_timers[bufnr] = nil
      t:close()
    end
    M.refresh_hints(bufnr)
  end))
end

local function own_hints(cfg)
  return cfg.inlay_hints and not M.native_inlay_hints()
end

local function buffer_set_up(bufnr, what)
  state.set_up[bufnr] = state.set_up[bufnr] or {}
  local done = state.set_up[bufnr][what]
  state.set_up[bufnr][what] = true
  return done
end

local function enable_hints(bufnr, cfg)
  if not cfg.inlay_hints then
    return
  end
  if M.native_inlay_hints() then
    -- 0.10: enable(true, {bufnr = n}); nightlies before it: enable(bufnr, true).
    if not pcall(vim.lsp.inlay_hint.enable, true, { bufnr = bufnr }) then
      pcall(vim.lsp.inlay_hint.enable, bufnr, true)
    end
    return
  end
  -- A client attached after a restart reuses the autocmds of the first.
  if buffer_set_up(bufnr, 'hints') then
    schedule_hints(bufnr, 0)
    return
  end
  vim.api.nvim_create_autocmd({ 'WinScrolled', 'BufWinEnter' }, {
    group = state.augroup,
    buffer = bufnr,
    callback = function()
      schedule_hints(bufnr, 100)
    end,
  })
  schedule_hints(bufnr, 0)
end

------------------------------------------------------------------------
-- Code lens and the equilibrium command.
------------------------------------------------------------------------
-- vim.lsp.codelens (0.7-0.9) runs one refresh per buffer at a time and
-- marks it in a private table until the answer comes. A request whose
-- server died, or a refresh asked while no client was attached, never
-- answers, and that buffer's lenses would never be refreshed again.
local function codelens_refreshes()
  local f = vim.lsp.codelens and vim.lsp.codelens.refresh
  for i = 1, 50 do
    local name, val = debug.getupvalue(f, i)
    if name == nil then
      return nil
    end
    if name == 'active_refreshes' and type(val) == 'table' then
      return val
    end
  end
  return nil
end

local function refresh_code_lens(bufnr, fresh)
  -- 0.7-0.9 refresh the current buffer; 0.10+ take { bufnr = n }.
  if not vim.api.nvim_buf_is_valid(bufnr) or vim.api.nvim_get_current_buf() ~= bufnr then
    return
  end
  if kiln_client_for(bufnr) then
    if fresh then
      local pending = codelens_refreshes()
      if pending then
        pending[bufnr] = nil
      end
    end
    pcall(vim.lsp.codelens.refresh, { bufnr = bufnr })
  end
end

-- Removes from bufnr what client_id showed: its code lenses (vim.lsp
-- keeps and shows those of a client that has exited), its diagnostics and,
-- unless another kiln client now serves the buffer, the inlay hints.
local function forget_client(client_id, bufnr)
  if not vim.api.nvim_buf_is_valid(bufnr) then
    return
  end
  local cl = vim.lsp.codelens
  if cl then
    if type(cl.clear) == 'function' then
      pcall(cl.clear, client_id, bufnr) -- 0.10+
    else
      if cl.__namespaces then
        vim.api.nvim_buf_clear_namespace(bufnr, cl.__namespaces[client_id], 0, -1)
      end
      if next(cl.get(bufnr) or {}) ~= nil then
        cl.save(nil, bufnr, client_id)
      end
    end
    local pending = codelens_refreshes()
    if pending then
      pending[bufnr] = nil
    end
  end
  pcall(vim.diagnostic.reset, vim.lsp.diagnostic.get_namespace(client_id), bufnr)
  local other = kiln_client_for(bufnr)
  if other == nil or other.id == client_id then
    if state.hint_timers[bufnr] then
      state.hint_timers[bufnr]:stop()
      state.hint_timers[bufnr]:close()
      state.hint_timers[bufnr] = nil
    end
    vim.api.nvim_buf_clear_namespace(bufnr, hint_ns, 0, -1)
  end
end

-- keep: the client still runs (a restart stops it); its on_exit cleans up
-- again, removing what it may still answer meanwhile.
local function forget_client_everywhere(client_id, keep)
  local bufs = state.attached[client_id] or {}
  if not keep then
    state.attached[client_id] = nil
  end
  for b in pairs(bufs) do
    forget_client(client_id, b)
  end
end

local function enable_code_lens(bufnr, cfg)
  if not cfg.code_lens or not vim.lsp.codelens then
    return
  end
  if buffer_set_up(bufnr, 'lens') then
    vim.defer_fn(function()
      refresh_code_lens(bufnr, true)
    end, 100)
    return
  end
  vim.api.nvim_create_autocmd({ 'BufEnter', 'InsertLeave', 'BufWritePost' }, {
    group = state.augroup,
    buffer = bufnr,
    callback = function()
      refresh_code_lens(bufnr)
    end,
  })
  vim.defer_fn(function()
    refresh_code_lens(bufnr, true)
  end, 100)
end

local result_name = '[kiln equilibrium]'

-- The scratch buffer showing equilibrium results, shown in a window.
local function result_buffer()
  local b
  for _, o in ipairs(vim.api.nvim_list_bufs()) do
    if vim.api.nvim_buf_is_valid(o) and vim.fn.fnamemodify(vim.api.nvim_buf_get_name(o), ':t') == result_name then
      b = o
    end
  end
  if not b then
    b = vim.api.nvim_create_buf(true, true) -- listed scratch buffer
    vim.api.nvim_buf_set_name(b, result_name)
    vim.bo[b].buftype = 'nofile'
    vim.bo[b].bufhidden = 'hide'
    vim.bo[b].swapfile = false
  end
  if vim.fn.bufwinid(b) == -1 then
    local cur = vim.api.nvim_get_current_win()
    vim.cmd('botright split')
    vim.api.nvim_win_set_buf(0, b)
    vim.api.nvim_set_current_win(cur)
  end
  return b
end

--- Shows an answer of kiln.equilibrium in the [kiln equilibrium] buffer:
--- the mixture, the text `kiln equilibrium` prints, and the warnings.
---@return number the buffer
function M.show_equilibrium(mix, answer)
  local lines = { 'mix: ' .. mix }
  for _, l in ipairs(vim.split((answer.text or ''):gsub('\n$', ''), '\n', { plain = true })) do
    table.insert(lines, l)
  end
  for _, w in ipairs(answer.warnings or {}) do
    table.insert(lines, 'note: ' .. w)
  end
  local b = result_buffer()
  vim.bo[b].modifiable = true
  vim.api.nvim_buf_set_lines(b, 0, -1, false, lines)
  vim.bo[b].modifiable = false
  return b
end

--- Computes the equilibrium of `mix` over the species of kiln buffer
--- `bufnr` (default current) with the server's kiln.equilibrium command and
--- shows it; without `mix` asks for it (vim.ui.input). `opts` overrides the
--- setup's `equilibrium` defaults (temperature, pressure, adiabatic, volume).
--- `on_done(err, answer)`, when given, is called with the outcome.
function M.equilibrium(mix, bufnr, opts, on_done)
  bufnr = (bufnr == nil or bufnr == 0) and vim.api.nvim_get_current_buf() or bufnr
  local cfg = state.config or merged(nil)
  local eq = vim.tbl_extend('force', defaults.equilibrium, cfg.equilibrium or {}, opts or {})
  local function fail(msg)
    vim.notify('kiln: ' .. msg, vim.log.levels.ERROR)
    if on_done then
      on_done(msg, nil)
    end
  end
  local client = kiln_client_for(bufnr)
  if not client then
    return fail('no kiln language server runs for this buffer')
  end
  if mix == nil or vim.trim(mix) == '' then
    vim.ui.input({ prompt = 'Mixture (NAME:AMOUNT, …): ', default = eq.mix or '' }, function(input)
      if input and vim.trim(input) ~= '' then
        M.equilibrium(input, bufnr, opts, on_done)
      end
    end)
    return
  end
  local args = {
    uri = vim.uri_from_bufnr(bufnr),
    mix = mix,
    temperature = eq.temperature,
    pressure = eq.pressure,
    adiabatic = eq.adiabatic and true or false,
    volume = eq.volume and true or false,
  }
  client.request('workspace/executeCommand', { command = 'kiln.equilibrium', arguments = { args } }, function(err, result)
    if err then
      return fail(err.message or vim.inspect(err))
    end
    M.show_equilibrium(mix, result)
    if on_done then
      on_done(nil, result)
    end
  end, bufnr)
end

------------------------------------------------------------------------
-- Client.
------------------------------------------------------------------------
local function capabilities(cfg)
  local caps = vim.lsp.protocol.make_client_capabilities()
  if own_hints(cfg) then
    caps.textDocument = caps.textDocument or {}
    caps.textDocument.inlayHint = { dynamicRegistration = false }
    caps.workspace = caps.workspace or {}
    caps.workspace.inlayHint = { refreshSupport = true }
  end
  return caps
end

local function handlers(cfg)
  local publish = vim.lsp.handlers['textDocument/publishDiagnostics']
  local h = {
    -- An error and a warning on one line: show the error.
    -- The kiln display options (cfg.diagnostics) are set on the client's
    -- namespace once, in on_init: passing them here would make Neovim 0.7
    -- draw every publication twice (vim.diagnostic.config redraws).
    ['textDocument/publishDiagnostics'] = function(err, result, ctx, config)
      local untitled = result and untitled_buffer(result.uri)
      if untitled then
        set_untitled_diagnostics(untitled, result, ctx, config)
      else
        publish(err, result, ctx, config)
      end
      if own_hints(cfg) and result and result.uri then
        local b = vim.uri_to_bufnr(result.uri)
        if vim.api.nvim_buf_is_loaded(b) then
          schedule_hints(b, 0)
        end
      end
    end,
  }
  if own_hints(cfg) then
    h['workspace/inlayHint/refresh'] = function()
      for _, b in ipairs(vim.api.nvim_list_bufs()) do
        if vim.api.nvim_buf_is_loaded(b) and vim.bo[b].filetype == 'kiln' then
          schedule_hints(b, 0)
        end
      end
      return vim.NIL
    end
  end
  return h
end

local function start(root, cfg)
  if vim.fn.executable(cfg.cmd[1]) ~= 1 then
    vim.notify(
      string.format('kiln: server command %q not found; set cmd in require("kiln").setup{}', cfg.cmd[1]),
      vim.log.levels.ERROR
    )
    return nil
  end
  local settings = settings_payload(cfg.settings)
  return vim.lsp.start_client({
    name = 'kiln',
    cmd = cfg.cmd,
    root_dir = root,
    workspace_folders = { { uri = vim.uri_from_fname(root), name = root } },
    init_options = settings,
    settings = settings,
    capabilities = capabilities(cfg),
    handlers = handlers(cfg),
    commands = {
      -- The command of the server's code lens: ask for the mixture, then run.
      ['kiln.showEquilibrium'] = function(command, ctx)
        local arg = command.arguments and command.arguments[1] or {}
        local b = ctx and ctx.bufnr or 0
        if arg.uri then
          b = vim.uri_to_bufnr(arg.uri)
        end
        M.equilibrium(nil, b)
      end,
    },
    flags = { debounce_text_changes = cfg.debounce_ms },
    on_init = function(client)
      if cfg.diagnostics and next(cfg.diagnostics) then
        vim.diagnostic.config(cfg.diagnostics, vim.lsp.diagnostic.get_namespace(client.id))
      end
      client.notify('workspace/didChangeConfiguration', { settings = settings })
      return true
    end,
    on_attach = function(client, bufnr)
      state.attached[client.id] = state.attached[client.id] or {}
      state.attached[client.id][bufnr] = true
      enable_hints(bufnr, cfg)
      enable_code_lens(bufnr, cfg)
      if cfg.on_attach then
        cfg.on_attach(client, bufnr)
      end
    end,
    on_exit = function(_, _, client_id)
      vim.schedule(function()
        if state.clients[root] and not client_alive(state.clients[root]) then
          state.clients[root] = nil
        end
        forget_client_everywhere(client_id)
      end)
    end,
  })
end

-- map_hover maps key (normal mode, buffer-local) to vim.lsp.buf.hover on
-- Neovim before 0.10, which has no default LSP hover key (there K runs
-- 'keywordprg', man); 0.10 and later map K themselves. A mapping of key the
-- user already made, global or for the buffer, is left alone.
local function map_hover(bufnr, key)
  if not key or vim.fn.has('nvim-0.10') == 1 then
    return
  end
  local taken = vim.api.nvim_buf_call(bufnr, function()
    return vim.fn.maparg(key, 'n') ~= ''
  end)
  if taken then
    return
  end
  vim.api.nvim_buf_set_keymap(bufnr, 'n', key, '<Cmd>lua vim.lsp.buf.hover()<CR>',
    { noremap = true, silent = true, desc = 'kiln: hover' })
end

--- Starts (or reuses) the server for the buffer's root and attaches it.
---@param bufnr number|nil buffer, default current
---@return number|nil client id
function M.attach(bufnr)
  bufnr = (bufnr == nil or bufnr == 0) and vim.api.nvim_get_current_buf() or bufnr
  local cfg = state.config or merged(nil)
  install_untitled_uris()
  local fname = vim.api.nvim_buf_get_name(bufnr)
  if fname == '' then
    fname = vim.fn.getcwd() .. '/untitled.kiln'
  end
  local root = M.root_dir(fname, cfg.root_markers)
  local id = state.clients[root]
  if not client_alive(id) then
    id = start(root, cfg)
    state.clients[root] = id
  end
  if id then
    repair_tracking(bufnr)
    vim.lsp.buf_attach_client(bufnr, id)
    watch(bufnr)
    if cfg.omnifunc and vim.bo[bufnr].omnifunc == '' then
      vim.bo[bufnr].omnifunc = 'v:lua.vim.lsp.omnifunc'
    end
    map_hover(bufnr, cfg.hover_key)
  end
  return id
end

--- Sends new settings to every running kiln server.
---@param settings table server settings (server key names)
function M.update_settings(settings)
  local cfg = state.config or merged(nil)
  cfg.settings = vim.tbl_deep_extend('force', cfg.settings, settings or {})
  state.config = cfg
  local payload = settings_payload(cfg.settings)
  for _, id in pairs(state.clients) do
    local c = vim.lsp.get_client_by_id(id)
    if c and not c.is_stopped() then
      c.config.settings = payload
      c.notify('workspace/didChangeConfiguration', { settings = payload })
    end
  end
end

local function kiln_buffers()
  local out = {}
  for _, b in ipairs(vim.api.nvim_list_bufs()) do
    if vim.api.nvim_buf_is_loaded(b) and vim.bo[b].filetype == 'kiln' then
      table.insert(out, b)
    end
  end
  return out
end

--- Stops all kiln servers and starts them again for the open kiln buffers.
--- Each buffer is opened in the new server with its full current text.
--- What the old servers showed (code lenses, inlay hints, diagnostics) is
--- removed at once; the new server's are shown once it has analysed.
function M.restart()
  for root, id in pairs(state.clients) do
    local c = vim.lsp.get_client_by_id(id)
    if c then
      c.stop()
    end
    state.clients[root] = nil
    forget_client_everywhere(id, c ~= nil)
  end
  -- Clients that have exited already were cleaned up by their on_exit.
  local bufs = kiln_buffers()
  -- Give the old processes a moment to exit before starting new ones.
  vim.defer_fn(function()
    for _, b in ipairs(bufs) do
      if vim.api.nvim_buf_is_valid(b) then
        M.attach(b)
      end
    end
  end, 200)
end

--- Configures the plugin and attaches kiln buffers, now and when opened.
---@param opts table|nil see the module header
function M.setup(opts)
  state.config = merged(opts)
  state.augroup = vim.api.nvim_create_augroup('kiln_lsp', { clear = true })
  vim.api.nvim_set_hl(0, 'KilnInlayHint', { link = 'Comment', default = true })
  vim.api.nvim_create_autocmd('FileType', {
    group = state.augroup,
    pattern = 'kiln',
    callback = function(args)
      M.attach(args.buf)
    end,
  })
  vim.api.nvim_create_user_command('KilnRestart', function()
    M.restart()
  end, { desc = 'Restart the kiln language server' })
  vim.api.nvim_create_user_command('KilnEquilibrium', function(a)
    M.equilibrium(a.args)
  end, { nargs = '?', desc = 'Equilibrium / flame temperature of a mixture over this file\'s species' })
  for _, b in ipairs(kiln_buffers()) do
    M.attach(b)
  end
end

return M
