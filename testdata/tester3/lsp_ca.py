import sys, json
sys.path.insert(0,__import__('os').path.dirname(__file__))
from lsp import Client
path=sys.argv[1]; uri='file://'+path
text=open(path, newline='').read()
c=Client()
c.notify('textDocument/didOpen',{'textDocument':{'uri':uri,'languageId':'kiln','version':1,'text':text}})
d=c.diags(uri)
ln,col=map(int,sys.argv[2].split(':'))
ctx=[x for x in d if x['range']['start']['line']==ln-1]
r=c.req('textDocument/codeAction',{'textDocument':{'uri':uri},'range':{'start':{'line':ln-1,'character':col-1},'end':{'line':ln-1,'character':col-1}},'context':{'diagnostics':ctx}})
for a in r.get('result') or []:
    print('ACTION:',a['title'])
    if len(sys.argv)>3 and a['title'].startswith(sys.argv[3]):
        print(json.dumps(a.get('edit') or a.get('command'),ensure_ascii=False)[:1500])
if 'error' in r: print(r['error'])
