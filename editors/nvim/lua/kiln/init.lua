-- kiln: Neovim client for the kiln language server (`kiln serve`).
--
-- Works on Neovim 0.7 and later using only vim.lsp.start_client and
-- vim.lsp.buf_attach_client. One server process runs per root directory;
-- the root is the nearest ancestor holding a .git entry, else the file's
-- directory.
--
--   require('kiln').setup({
--     cmd = { 'kiln', 'serve' },              -- server command line
--     settings = { units = 'kJ/mol', tMid = 1000, tHigh = 5000,
--                  mismatchHf298 = 3, mismatchS298 = 3, collisionFactor = 1 },
--     root_markers = { '.git' },              -- optional
--     on_attach = function(client, bufnr) end, -- optional
--   })
--
-- settings are sent as initializationOptions {kiln = settings} and as
-- workspace/didChangeConfiguration {settings = {kiln = settings}}; the keys
-- are the server's own (see the kiln README).
local M = {}

local defaults = {
  cmd = { 'kiln', 'serve' },
  settings = {},
  root_markers = { '.git' },
  on_attach = nil,
}

-- Per-Neovim-session state: the active configuration and client ids by root.
local state = {
  config = nil,
  clients = {},
  augroup = nil,
}

local function merged(opts)
  local cfg = vim.tbl_deep_extend('force', {}, defaults, opts or {})
  if type(cfg.cmd) == 'string' then
    cfg.cmd = { cfg.cmd, 'serve' }
  end
  return cfg
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

local function start(root, cfg)
  if vim.fn.executable(cfg.cmd[1]) ~= 1 then
    vim.notify(
      string.format('kiln: server command %q not found; set cmd in require("kiln").setup{}', cfg.cmd[1]),
      vim.log.levels.ERROR
    )
    return nil
  end
  local settings = { kiln = cfg.settings }
  return vim.lsp.start_client({
    name = 'kiln',
    cmd = cfg.cmd,
    root_dir = root,
    workspace_folders = { { uri = vim.uri_from_fname(root), name = root } },
    init_options = settings,
    settings = settings,
    capabilities = vim.lsp.protocol.make_client_capabilities(),
    on_init = function(client)
      client.notify('workspace/didChangeConfiguration', { settings = settings })
      return true
    end,
    on_attach = cfg.on_attach,
    on_exit = function()
      vim.schedule(function()
        if state.clients[root] and not client_alive(state.clients[root]) then
          state.clients[root] = nil
        end
      end)
    end,
  })
end

--- Starts (or reuses) the server for the buffer's root and attaches it.
---@param bufnr number|nil buffer, default current
---@return number|nil client id
function M.attach(bufnr)
  bufnr = (bufnr == nil or bufnr == 0) and vim.api.nvim_get_current_buf() or bufnr
  local cfg = state.config or merged(nil)
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
    vim.lsp.buf_attach_client(bufnr, id)
  end
  return id
end

--- Sends new settings to every running kiln server.
---@param settings table server settings (server key names)
function M.update_settings(settings)
  local cfg = state.config or merged(nil)
  cfg.settings = vim.tbl_deep_extend('force', cfg.settings, settings or {})
  state.config = cfg
  for _, id in pairs(state.clients) do
    local c = vim.lsp.get_client_by_id(id)
    if c and not c.is_stopped() then
      c.config.settings = { kiln = cfg.settings }
      c.notify('workspace/didChangeConfiguration', { settings = { kiln = cfg.settings } })
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
function M.restart()
  for root, id in pairs(state.clients) do
    local c = vim.lsp.get_client_by_id(id)
    if c then
      c.stop()
    end
    state.clients[root] = nil
  end
  local bufs = kiln_buffers()
  -- Give the old processes a moment to exit before starting new ones.
  vim.defer_fn(function()
    for _, b in ipairs(bufs) do
      M.attach(b)
    end
  end, 200)
end

--- Configures the plugin and attaches kiln buffers, now and when opened.
---@param opts table|nil see the module header
function M.setup(opts)
  state.config = merged(opts)
  state.augroup = vim.api.nvim_create_augroup('kiln_lsp', { clear = true })
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
  for _, b in ipairs(kiln_buffers()) do
    M.attach(b)
  end
end

return M
