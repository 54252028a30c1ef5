-- Buffer settings for kiln mechanism files.
if vim.b.did_ftplugin then
  return
end
vim.b.did_ftplugin = 1

local bo = vim.bo
bo.commentstring = '# %s'
bo.comments = ':#'
bo.expandtab = true
bo.shiftwidth = 2
bo.softtabstop = 2
-- Species and group names contain '-', '(', ')' and digits.
bo.iskeyword = '@,48-57,_,-,192-255'
bo.formatoptions = bo.formatoptions:gsub('t', '') .. 'cq'

vim.b.undo_ftplugin = 'setlocal commentstring< comments< expandtab< shiftwidth< softtabstop< iskeyword< formatoptions<'
