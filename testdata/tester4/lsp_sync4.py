"""Random chemistry-aware incremental edits through kiln serve, then server diagnostics vs
`kiln check` (line, column, code, severity, message). Usage: lsp_sync4.py FILE SEED [N]"""
import sys, random, json, subprocess, time, os
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from lsp import Client
KILN = os.environ.get('KILN', '/tmp/kiln-t4')
random.seed(int(sys.argv[2])); N = int(sys.argv[3]) if len(sys.argv) > 3 else 150
path = os.path.abspath(sys.argv[1]); uri = 'file://' + path
text = open(path, newline='').read()
c = Client(caps={'textDocument': {'publishDiagnostics': {}}})
c.notify('textDocument/didOpen', {'textDocument': {'uri': uri, 'languageId': 'kiln', 'version': 1, 'text': text}})
c.diags(uri, timeout=20)
def utf16_pos(s, off):
    pre = s[:off]; line = pre.count('\n'); ls = pre.rfind('\n') + 1
    return {'line': line, 'character': len(pre[ls:].encode('utf-16-le')) // 2}
snips = [' + ', ' <=> ', ' => ', '(+M)', ' (+M)', '[CH2]', 'C#N', 'O', 'Cl', '[S]', '  duplicate\n', 'A=1e20 ', 'Ea=-3 ',
         '\nspecies Xr [CH2]CC\n', '\nreaction OH + OH <=> H2O2 A=1e13 n=0 Ea=0\n', '\nunits kJ/mol\n', '  low-pressure A=1e30 n=-5 Ea=0\n',
         '  troe alpha=0.5 T3=100 T1=1000\n', '  efficiencies H2O=10\n', '  multiplicity 3\n', '\n  nasa7 300 1000 5000\n',
         '2 ', 'M', ' + M', '#', 'é', '😀', '\t', '']
ver = 1
lines_start = lambda t: [0] + [i + 1 for i, ch in enumerate(t) if ch == '\n']
for k in range(N):
    if random.random() < 0.5:  # replace a whole token
        ls = lines_start(text); i = random.choice(ls)
        j = text.find('\n', i); j = len(text) if j < 0 else j
        toks = [(m_s, m_s + len(t)) for m_s, t in ((text.find(t, i), t) for t in text[i:j].split()) if m_s >= 0]
        if not toks: continue
        a, b = random.choice(toks)
    else:
        a = random.randrange(len(text) + 1); b = min(len(text), a + random.randrange(3))
    new = random.choice(snips)
    rng = {'start': utf16_pos(text, a), 'end': utf16_pos(text, b)}
    text = text[:a] + new + text[b:]; ver += 1
    c.notify('textDocument/didChange', {'textDocument': {'uri': uri, 'version': ver}, 'contentChanges': [{'range': rng, 'text': new}]})
    if random.random() < 0.1: time.sleep(0.05)
time.sleep(4)
ds = [x for x in c.notes if x.get('method') == 'textDocument/publishDiagnostics' and x['params']['uri'] == uri]
last = ds[-1]['params']
out = '/tmp/t4/sync4_final_%s.kiln' % sys.argv[2]
open(out, 'w', newline='').write(text)
p = subprocess.run([KILN, 'check', '--format', 'json', out], capture_output=True, text=True)
cli = json.loads(p.stdout)
sev = {1: 'error', 2: 'warning', 3: 'information', 4: 'hint'}
def utf16col(line, c8):  # check's column: assume 1-based; convert server utf16 to code points for comparison
    return c8
srv = sorted((d['range']['start']['line'] + 1, d.get('code'), sev[d['severity']], d['message']) for d in last['diagnostics'])
clis = sorted((d['line'], d['code'], d['severity'], d['message'].replace(out, path)) for d in cli)
ss, cs = set(srv), set(clis)
print('seed', sys.argv[2], 'server version', last.get('version'), 'final', ver, 'server', len(srv), 'check', len(clis),
      'only server', len(ss - cs), 'only check', len(cs - ss))
for x in sorted(ss - cs)[:4]: print('  only server:', x)
for x in sorted(cs - ss)[:4]: print('  only check :', x)
