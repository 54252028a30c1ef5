" Vim syntax file for kiln mechanism files (*.kiln).
"
" A '#' starts a comment only at the start of a token (line start or after a
" blank); inside a token, as in the SMILES C#C, it is part of the token.
" Statements start in column 0; indented lines are attributes or block lines.
" When several items match at one position the one defined last wins, so the
" general items come first.

if exists('b:current_syntax')
  finish
endif

let s:cpo_save = &cpo
set cpo&vim

syn case match

" Species names in equations and efficiencies (lowest priority).
syn match kilnSpeciesRef /\%(^\|\s\)\@<=[^ \t#]\%(\%((+\)\@!\S\)*/ contained
syn match kilnSpeciesRef /\%(^\|\s\)\@<=[^ \t#=]\+\ze=/ contained
syn match kilnThirdBody /\%(^\|\s\)\@<=M\ze\%(\s\|$\)/ contained
syn match kilnOperator /\%(^\|\s\)\@<=\%(<=>\|=>\|+\)\ze\%(\s\|$\)/ contained
syn match kilnBadArrow /\%(^\|\s\)\@<=\%(=\|<=\|->\|<->\)\ze\%(\s\|$\)/ contained
syn match kilnFalloff /(+[^ \t()]\+)/ contained contains=kilnFalloffM
syn match kilnFalloffM /\%((+\)\@<=M\ze)/ contained
syn match kilnParameter /\%(^\|\s\)\@<=\%(A\|n\|Ea\|alpha\|T1\|T2\|T3\)\ze=/ contained

" Numbers with an optional attached unit; Fortran 'd' exponents are errors.
syn match kilnNumber /\%(^\|[ \t=]\)\@<=[-+]\=\%(\d\+\%(\.\d*\)\=\|\.\d\+\)\%([eE][-+]\=\d\+\)\=\%(kJ\/mol\/K\|kcal\/mol\/K\|J\/mol\/K\|cal\/mol\/K\|kJ\/mol\|kcal\/mol\|J\/mol\|cal\/mol\|kPa\|Pa\|atm\|bar\|Torr\|K\)\=\ze\%(\s\|$\|=\)/ contained contains=kilnUnit
syn match kilnUnit /\%(\d\|\.\)\@<=\a[A-Za-z\/]*/ contained
syn match kilnBadNumber /\%(^\|[ \t=]\)\@<=[-+]\=\%(\d\+\%(\.\d*\)\=\|\.\d\+\)[dD][-+]\=\d\+\ze\%(\s\|$\)/ contained

" A number followed by a name in an equation is a stoichiometric coefficient.
syn match kilnCoefficient /\%(^\|\s\)\@<=\%(\d\+\%(\.\d*\)\=\|\.\d\+\)\ze\s\+[^ \t#]/ contained

syn cluster kilnValues contains=kilnNumber,kilnBadNumber,kilnParameter,kilnSpeciesRef,kilnComment
syn cluster kilnEquation contains=kilnSpeciesRef,kilnCoefficient,kilnThirdBody,kilnOperator,kilnBadArrow,kilnFalloff,kilnParameter,kilnNumber,kilnBadNumber,kilnComment

" Statements (column 0).
syn match kilnStatement /^\%(species\|reaction\|units\|include\|group\)\ze\%(\s\|$\)/ contained
syn region kilnSpeciesLine start=/^species\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnStatement,kilnSpeciesName,kilnComment
syn match kilnSpeciesName /\%(^species\s\+\)\@<=[^ \t#]\S*/ contained nextgroup=kilnSmiles skipwhite
syn match kilnSmiles /[^ \t#]\S*/ contained
syn region kilnReactionLine start=/^reaction\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnStatement,@kilnEquation
syn region kilnUnitsLine start=/^units\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnStatement,kilnUnitName,kilnComment
syn match kilnUnitName /\%(^units\s\+\)\@<=\%(kcal\/mol\|kJ\/mol\|cal\/mol\|J\/mol\)\ze\%(\s\|$\)/ contained
syn region kilnIncludeLine start=/^include\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnStatement,kilnPath,kilnComment
syn match kilnPath /\%(^include\s\+\)\@<=[^ \t#]\S*/ contained
syn region kilnGroupLine start=/^group\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnStatement,kilnGroupName,kilnComment
syn match kilnGroupName /\%(^group\s\+\)\@<=[^ \t#]\S*/ contained

" Attribute and block lines (indented).
syn match kilnAttribute /\%(^\s\+\)\@<=\%(multiplicity\|symmetry\|optical-isomers\|composition\|nasa7\|thermo-table\|low\|high\|hf298\|s298\|cp\|low-pressure\|troe\|efficiencies\|pressure\|duplicate\|reverse\)\ze\%(\s\|$\)/ contained
syn region kilnAttributeLine start=/^\s\+\%(multiplicity\|symmetry\|optical-isomers\|nasa7\|thermo-table\|low\|high\|hf298\|s298\|cp\|low-pressure\|troe\|efficiencies\|pressure\|duplicate\|reverse\)\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnAttribute,@kilnValues
syn region kilnCompositionLine start=/^\s\+composition\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnAttribute,kilnFormula,kilnComment
syn match kilnFormula /\%(composition\s\+\)\@<=[^ \t#]\S*/ contained
syn match kilnTextKeyword /\%(^\s\+\)\@<=\%(note\|source\)\ze\%(\s\|$\)/ contained
syn region kilnTextLine start=/^\s\+\%(note\|source\)\%(\s\|$\)\@=/ end=/$/ oneline keepend contains=kilnTextKeyword,kilnText,kilnComment
syn match kilnText /\%(\%(note\|source\)\s\+\)\@<=.\{-}\ze\%(\s\+#.*\)\=$/ contained

" Comments last: a token-initial '#' wins over everything else.
syn keyword kilnTodo TODO FIXME XXX NOTE contained
syn match kilnComment /\%(^\|\s\)\@<=#.*$/ contains=kilnTodo

hi def link kilnComment Comment
hi def link kilnTodo Todo
hi def link kilnStatement Statement
hi def link kilnAttribute Keyword
hi def link kilnTextKeyword Keyword
hi def link kilnSpeciesName Identifier
hi def link kilnSpeciesRef Identifier
hi def link kilnSmiles String
hi def link kilnText String
hi def link kilnPath String
hi def link kilnGroupName Function
hi def link kilnUnitName Type
hi def link kilnUnit Type
hi def link kilnFormula Constant
hi def link kilnNumber Number
hi def link kilnCoefficient Number
hi def link kilnThirdBody Constant
hi def link kilnFalloff Special
hi def link kilnFalloffM Constant
hi def link kilnOperator Operator
hi def link kilnParameter Special
hi def link kilnBadArrow Error
hi def link kilnBadNumber Error

let b:current_syntax = 'kiln'

let &cpo = s:cpo_save
unlet s:cpo_save
