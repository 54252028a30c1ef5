"""Drive `kiln serve` over stdio on one file: hover, completion, code actions
(declare species, insert NASA-7 block), inlay hints, formatting.
Usage: KILN=/tmp/kiln-t4 python3 lsp_tour.py FILE.kiln
Prints what it sees; compares inlay hints with `kiln check --format json`."""
import sys, os, json, re, subprocess
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from lsp import Client

KILN = os.environ.get('KILN', '/tmp/kiln-t4')
path = os.path.abspath(sys.argv[1]); uri = 'file://' + path
text = open(path, newline='').read()
lines = text.split('\n')
caps = {'textDocument': {'hover': {'contentFormat': ['markdown', 'plaintext']}, 'publishDiagnostics': {},
                         'inlayHint': {}, 'completion': {'completionItem': {'snippetSupport': False}},
                         'codeAction': {'codeActionLiteralSupport': {'codeActionKind': {'valueSet': ['quickfix', 'refactor', 'source']}}}},
        'workspace': {'applyEdit': True, 'workspaceEdit': {'documentChanges': True}}}
c = Client(caps=caps)
c.notify('textDocument/didOpen', {'textDocument': {'uri': uri, 'languageId': 'kiln', 'version': 1, 'text': text}})
diags = c.diags(uri, timeout=20)
print('diagnostics from server:', len(diags))
cli = json.loads(subprocess.run([KILN, 'check', '--format', 'json', path], capture_output=True, text=True).stdout)
print('diagnostics from check:', len(cli))
srv = sorted((d['range']['start']['line'] + 1, d['range']['start']['character'] + 1, d.get('code'), d['message']) for d in diags)
clis = sorted((d['line'], d['column'], d['code'], d['message']) for d in cli)
print('only server:', [x for x in srv if x not in clis][:6])
print('only check :', [x for x in clis if x not in srv][:6])

def pos_of(word, nth=0, line_prefix=None):
    k = 0
    for i, l in enumerate(lines):
        if line_prefix and not l.startswith(line_prefix):
            continue
        for m in re.finditer(r'(?<![\w\-])' + re.escape(word) + r'(?![\w\-])', l):
            if k == nth:
                return i, m.start()
            k += 1
    raise KeyError(word)

def hover(l, ch):
    r = c.req('textDocument/hover', {'textDocument': {'uri': uri}, 'position': {'line': l, 'character': ch}})
    res = r.get('result')
    if not res:
        return r.get('error') or None
    v = res['contents']
    return v['value'] if isinstance(v, dict) else json.dumps(v)

print('\n== hover')
for w, pre in (('toluene', 'species'), ('CH2NH2', 'reaction'), ('tar', 'species'), ('CH3S', 'reaction'), ('Zq', 'reaction'), ('SO3', 'reaction'), ('methanol-hand', 'species')):
    l, ch = pos_of(w, 0, pre)
    h = hover(l, ch + 1)
    print('--- hover %s (line %d):' % (w, l + 1))
    print(str(h)[:900])
# hover on a reaction arrow and on a rate number
l, ch = pos_of('<=>', 0, 'reaction CH3 + CH3')
print('--- hover arrow CH3+CH3 falloff:'); print(str(hover(l, ch + 1))[:1500])
l, ch = pos_of('Ea=56.6', 0, 'reaction')
print('--- hover Ea=56.6:'); print(str(hover(l, ch + 3))[:600])

print('\n== completion')
for (l, ch, what) in ((pos_of('H2S', 0, 'reaction')[0], len('reaction '), 'start of reaction eq'),):
    r = c.req('textDocument/completion', {'textDocument': {'uri': uri}, 'position': {'line': l, 'character': ch}})
    items = r.get('result') or []
    if isinstance(items, dict): items = items.get('items', [])
    print(what, len(items), [i['label'] for i in items[:12]])

print('\n== inlay hints vs check')
r = c.req('textDocument/inlayHint', {'textDocument': {'uri': uri}, 'range': {'start': {'line': 0, 'character': 0}, 'end': {'line': len(lines), 'character': 0}}})
hints = r.get('result') or []
print('hints:', len(hints))
for h in hints[:3] + hints[-3:]:
    lab = h['label'] if isinstance(h['label'], str) else ''.join(p['value'] for p in h['label'])
    print('  line %d: %s' % (h['position']['line'] + 1, lab))
info = {d['line']: d['message'] for d in cli if d['code'] == 'missing-thermo' and d['severity'] == 'information'}
nmis = 0
for h in hints:
    lab = h['label'] if isinstance(h['label'], str) else ''.join(p['value'] for p in h['label'])
    ln = h['position']['line'] + 1
    if ln in info:
        nums_h = re.findall(r'-?\d+\.\d+', lab.replace('−', '-'))
        nums_c = re.findall(r'-?\d+\.\d+', info[ln])
        if nums_h[:2] != nums_c[:2]:
            nmis += 1
            if nmis <= 5: print('  MISMATCH line', ln, lab, '|', info[ln])
print('hint/check mismatches:', nmis)

print('\n== code actions')
def actions_at(l, ch, only_diag_line=True):
    ctx = [d for d in diags if d['range']['start']['line'] == l]
    r = c.req('textDocument/codeAction', {'textDocument': {'uri': uri}, 'range': {'start': {'line': l, 'character': ch}, 'end': {'line': l, 'character': ch}}, 'context': {'diagnostics': ctx}})
    return r.get('result') or [], r.get('error')
for w, pre in (('HNO', 'reaction'), ('Zq', 'reaction'), ('CH2CN', 'reaction'), ('phenyl', 'reaction')):
    l, ch = pos_of(w, 0, pre)
    acts, err = actions_at(l, ch + 1)
    print('--- at %s: %s' % (w, err or ''))
    for a in acts:
        e = a.get('edit') or {}
        ch_ = e.get('changes') or {}
        dc = e.get('documentChanges') or []
        edits = [x for v in ch_.values() for x in v] + [x for d in dc for x in d.get('edits', [])]
        print('   ', a['title'], '|', [(x['range']['start']['line'] + 1, x['newText'][:80]) for x in edits][:3])
l, ch = pos_of('benzyl', 0, 'species')
acts, err = actions_at(l, ch + 1)
print('--- at species benzyl:', err or '')
block = None
for a in acts:
    print('   ', a['title'])
    if a['title'].startswith('Insert'):
        e = a.get('edit') or {}
        edits = [x for v in (e.get('changes') or {}).values() for x in v] + [x for d in (e.get('documentChanges') or []) for x in d.get('edits', [])]
        block = edits[0]['newText'] if edits else None
        print('    edit at line', edits[0]['range']['start']['line'] + 1 if edits else None)
print('inserted block:\n' + (block or 'NONE'))
json.dump({'benzyl_block': block}, open('/tmp/t4/lsp_block.json', 'w'))

print('\n== formatting')
r = c.req('textDocument/formatting', {'textDocument': {'uri': uri}, 'options': {'tabSize': 2, 'insertSpaces': True}})
edits = r.get('result') or []
print('format edits:', len(edits), r.get('error') or '')
json.dump(edits, open('/tmp/t4/lsp_fmt_edits.json', 'w'))
