import sys, random, json, subprocess, time
sys.path.insert(0,__import__('os').path.dirname(__file__))
from lsp import Client
random.seed(int(sys.argv[2]) if len(sys.argv)>2 else 1)
path=sys.argv[1]; uri='file://'+path
text=open(path, newline='').read()
c=Client(caps={'textDocument':{'publishDiagnostics':{}}})
c.notify('textDocument/didOpen',{'textDocument':{'uri':uri,'languageId':'kiln','version':1,'text':text}})
c.diags(uri)
def utf16_pos(s, off):
    pre=s[:off]; line=pre.count('\n'); ls=pre.rfind('\n')+1
    col=len(pre[ls:].encode('utf-16-le'))//2
    return {'line':line,'character':col}
snips=['Ω','😀','C','(','\r\n','\n','# 😀 note\n',' ','[CH2]','species Zz CC\n','=','x']
ver=1
for k in range(200):
    a=random.randrange(len(text)+1); b=min(len(text), a+random.randrange(4))
    # don't split surrogate-pair chars: python str indexes code points; fine. avoid splitting \r\n
    if a>0 and a<len(text) and text[a-1]=='\r' and text[a]=='\n': a-=1
    if b>0 and b<len(text) and text[b-1]=='\r' and text[b]=='\n': b+=1
    new=random.choice(snips) if random.random()<0.8 else ''
    rng={'start':utf16_pos(text,a),'end':utf16_pos(text,b)}
    text=text[:a]+new+text[b:]
    ver+=1
    c.notify('textDocument/didChange',{'textDocument':{'uri':uri,'version':ver},'contentChanges':[{'range':rng,'text':new}]})
n0=len(c.notes)
time.sleep(3)
ds=[x for x in c.notes if x.get('method')=='textDocument/publishDiagnostics' and x['params']['uri']==uri]
last=ds[-1]['params']
open('/tmp/kiln_sync_final.kiln','w',newline='').write(text)
cli=json.loads(subprocess.run([__import__('os').environ.get('KILN','kiln'),'check','--format','json','/tmp/kiln_sync_final.kiln'],capture_output=True,text=True).stdout)
def key_l(d): return (d['range']['start']['line']+1, d.get('code'), d['message'].replace('sync_final.kiln',''))
srv=sorted(key_l(d) for d in last['diagnostics'])
clis=sorted((d['line'],d['code'],d['message']) for d in cli)
print('server version',last.get('version'),'final',ver,'server diags',len(srv),'cli',len(clis))
ss=set(srv); cs=set(clis)
print('only server:',sorted(ss-cs)[:8]); print('only cli:',sorted(cs-ss)[:8])
