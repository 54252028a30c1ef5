-- Indentation of kiln files, shared by indent/kiln.lua and the tests.
--
-- Statements (species, reaction, units, include, group) start in column 0;
-- attribute lines are indented by 2 under their statement; the lines of a
-- nasa7 or thermo-table block by 4. An attribute keyword typed inside a
-- block that does not belong to the block goes back to 2. The same rules
-- are implemented by the Emacs mode (kiln-indent-line) and the VS Code
-- extension.
local M = {}

M.attribute_indent = 2
M.block_indent = 4

local statements = { species = true, reaction = true, units = true, include = true, group = true }

local attributes = {}
for _, k in ipairs({
  'multiplicity', 'symmetry', 'optical-isomers', 'composition', 'note',
  'nasa7', 'thermo-table', 'low-pressure', 'troe', 'efficiencies', 'pressure',
  'duplicate', 'reverse', 'hf298', 's298', 'cp', 'source',
}) do
  attributes[k] = true
end

local blocks = {
  nasa7 = { low = true, high = true, source = true },
  ['thermo-table'] = { hf298 = true, s298 = true, cp = true, source = true },
}

--- Keywords that re-indent a line when typed as its first word
--- (for 'indentkeys').
M.keywords = {}
for k in pairs(statements) do
  table.insert(M.keywords, k)
end
for k in pairs(attributes) do
  table.insert(M.keywords, k)
end
table.sort(M.keywords)

-- First token of a line, or nil for a blank or comment-only line.
local function keyword(text)
  return text:match('^%s*([^%s#]%S*)')
end

local function previous_code(lines, l)
  l = l - 1
  while l >= 1 do
    if keyword(lines.get(l)) then
      return l
    end
    l = l - 1
  end
  return nil
end

-- What line l continues: 'top', 'statement', or a block header keyword.
local function context(lines, l)
  local p = previous_code(lines, l)
  if not p then
    return 'top'
  end
  local kw = keyword(lines.get(p))
  local ind = lines.indent(p)
  if blocks[kw] then
    return kw
  end
  if ind == 0 then
    return statements[kw] and 'statement' or 'top'
  end
  -- A block line or an attribute line: find what encloses it.
  local q = p
  while true do
    q = previous_code(lines, q)
    if not q then
      return 'statement'
    end
    if lines.indent(q) < ind then
      local k = keyword(lines.get(q))
      return blocks[k] and k or 'statement'
    end
  end
end

--- The indentation of line l (1-based). lines provides get(l) -> text and
--- indent(l) -> columns; by default those of the current buffer.
function M.indent(l, lines)
  lines = lines or {
    get = function(n)
      return vim.fn.getline(n)
    end,
    indent = function(n)
      return vim.fn.indent(n)
    end,
  }
  local text = lines.get(l)
  if text:match('^#') then
    return 0 -- a comment in column 0 stays there
  end
  local kw = keyword(text)
  if kw and statements[kw] then
    return 0
  end
  local ctx = context(lines, l)
  if ctx == 'top' then
    return 0
  end
  if ctx == 'statement' then
    return M.attribute_indent
  end
  if kw and attributes[kw] and not blocks[ctx][kw] then
    return M.attribute_indent
  end
  return M.block_indent
end

--- 'indentexpr' entry point.
function M.indentexpr()
  return M.indent(vim.v.lnum)
end

return M
