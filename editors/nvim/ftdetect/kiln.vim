" Filetype detection for kiln mechanism files.
autocmd BufRead,BufNewFile *.kiln setfiletype kiln
