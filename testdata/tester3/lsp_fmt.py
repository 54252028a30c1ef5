import sys, re
sys.path.insert(0,__import__('os').path.dirname(__file__))
from lsp import Client
path=sys.argv[1]; uri='file://'+path
text=open(path, newline='').read()
c=Client()
c.notify('textDocument/didOpen',{'textDocument':{'uri':uri,'languageId':'kiln','version':1,'text':text}})
c.diags(uri)
def apply(text, edits):
    lines=text.split('\n')
    # compute offsets by utf16 positions
    def off(p):
        o=0
        ls=text.split('\n')
        for i in range(p['line']): o+=len(ls[i])+1
        l=ls[p['line']] if p['line']<len(ls) else ''
        u=0; j=0
        while u<p['character'] and j<len(l):
            u+= 2 if ord(l[j])>0xFFFF else 1; j+=1
        return o+j
    es=sorted(edits,key=lambda e:(e['range']['start']['line'],e['range']['start']['character']),reverse=True)
    for e in es:
        a=off(e['range']['start']); b=off(e['range']['end'])
        text=text[:a]+e['newText']+text[b:]
    return text
r=c.req('textDocument/formatting',{'textDocument':{'uri':uri},'options':{'tabSize':2,'insertSpaces':True}})
edits=r.get('result') or []
out=apply(text,edits)
print('edits',len(edits), 'error' if 'error' in r else '')
strip=lambda s: re.sub(r'[ \t]+','',s)
print('non-blank content equal:', strip(out)==strip(text))
print('CRLF count before/after', text.count('\r\n'), out.count('\r\n'))
open(sys.argv[2],'w',newline='').write(out)
