-- Indentation for kiln mechanism files: statements in column 0, attribute
-- lines by 2, nasa7/thermo-table block lines by 4. Typing a statement
-- keyword at the start of an indented line moves it back to column 0.
if vim.b.did_indent then
  return
end
vim.b.did_indent = 1

_G.kiln_indentexpr = function()
  return require('kiln.indent').indentexpr()
end

local keys = { '!^F', 'o', 'O' }
for _, k in ipairs(require('kiln.indent').keywords) do
  table.insert(keys, '=' .. k)
end
vim.bo.indentexpr = 'v:lua.kiln_indentexpr()'
vim.bo.indentkeys = table.concat(keys, ',')
vim.bo.autoindent = true
vim.b.undo_indent = 'setlocal indentexpr< indentkeys< autoindent<'
