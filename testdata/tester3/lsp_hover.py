import sys; sys.path.insert(0,__import__('os').path.dirname(__file__))
from lsp import Client
import json
path=sys.argv[1]; uri='file://'+path
text=open(path).read()
c=Client()
c.notify('textDocument/didOpen',{'textDocument':{'uri':uri,'languageId':'kiln','version':1,'text':text}})
d=c.diags(uri)
print("diagnostics:",len(d))
for spec in sys.argv[2:]:
    ln,col=map(int,spec.split(':'))
    r=c.req('textDocument/hover',{'textDocument':{'uri':uri},'position':{'line':ln-1,'character':col-1}})
    res=r.get('result')
    print('==== hover',spec); print(res['contents']['value'] if res else res)
